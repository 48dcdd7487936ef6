import { sql } from "drizzle-orm";
import { Router } from "express";
import { publicConfig } from "../config";
import type { RouteDeps } from "./deps";

export function configRouter({ config, db }: RouteDeps): Router {
  const router = Router();
  // Healthy means the database answers too: the app is useless without it.
  router.get("/health", async (_req, res) => {
    try {
      await db.execute(sql`select 1`);
      res.json({ ok: true });
    } catch {
      res.status(503).json({ ok: false });
    }
  });
  router.get("/config", (_req, res) => {
    res.json(publicConfig(config));
  });
  return router;
}
