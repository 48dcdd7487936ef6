import { existsSync } from "node:fs";
import path from "node:path";
import express, { Router } from "express";

/**
 * The built React client. Vite puts content-hashed files under assets/, so those are cached
 * for a year as immutable; index.html is revalidated on every load so a new build shows at once.
 * Any other GET outside /api is a client route and gets index.html (React Router takes over).
 */
export function clientRouter(clientDist: string): Router {
  const root = path.resolve(clientDist);
  const indexHtml = path.join(root, "index.html");
  const router = Router();

  router.use(
    "/assets",
    express.static(path.join(root, "assets"), { immutable: true, maxAge: "365d", index: false }),
    (_req, res) => {
      res.status(404).type("text/plain").send("Not found");
    },
  );
  router.use(express.static(root, { index: false, maxAge: 0 }));
  router.use((req, res, next) => {
    if (req.method !== "GET" && req.method !== "HEAD") return next();
    // A missing file (favicon.png, robots.txt) is a 404, not the app; client routes have no
    // file extension.
    if (path.extname(req.path) !== "") {
      res.status(404).type("text/plain").send("Not found");
      return;
    }
    if (!existsSync(indexHtml)) {
      res
        .status(503)
        .type("text/plain")
        .send(
          "The Rillmark client is not built yet. Run `npm start` (it builds it) or `npm run build`.",
        );
      return;
    }
    res.setHeader("Cache-Control", "no-cache");
    res.sendFile(indexHtml);
  });
  return router;
}
