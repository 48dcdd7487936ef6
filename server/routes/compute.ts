/**
 * Computing a subcatchment's travel-time sheet, reading the stored one, and exporting it as CSV
 * or XLSX. Computing needs "compute:run"; reading and exporting are for every member.
 */
import { eq } from "drizzle-orm";
import { Router, type Request } from "express";
import type { TravelTimeSheet } from "../../shared/schemas/sheet";
import { currentProject, currentUser, requirePermission, requireUser } from "../auth/guards";
import type { Db } from "../db/client";
import { flowPaths, subcatchmentResults } from "../db/schema-geodata";
import { loadViaProject, paramId } from "../geodata/access";
import { sheetCsv, sheetXlsx } from "../geodata/compute/export";
import { computeSheet, storeSheet } from "../geodata/compute/run";
import { HttpError } from "../http/errors";
import type { RouteDeps } from "./deps";
import { subcatchmentOwner } from "./subcatchments";

async function storedSheet(db: Db, req: Request): Promise<TravelTimeSheet> {
  const id = paramId(req);
  const [row] = await db
    .select()
    .from(subcatchmentResults)
    .where(eq(subcatchmentResults.subcatchmentId, id));
  if (!row) {
    throw new HttpError(404, "not_computed", "This subcatchment has not been computed yet.");
  }
  const [path] = await db
    .select({ version: flowPaths.version })
    .from(flowPaths)
    .where(eq(flowPaths.subcatchmentId, id));
  const sheet = row.sheet as TravelTimeSheet;
  return { ...sheet, stale: (path?.version ?? 0) !== row.flowPathVersion };
}

/** A file name from the subcatchment's name: letters, digits and hyphens only. */
function fileName(sheet: TravelTimeSheet, ext: string): string {
  const base = `${sheet.subcatchment.name}-${sheet.subcatchment.scenario}`
    .normalize("NFKD")
    .replace(/[^A-Za-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 80);
  return `${base || "sheet"}-travel-time.${ext}`;
}

export function computeRouter({ db, store }: RouteDeps): Router {
  const router = Router();
  const one = [requireUser(db), loadViaProject(db, "This subcatchment", subcatchmentOwner(db))];

  router.post(
    "/subcatchments/:id/compute",
    ...one,
    requirePermission("compute:run"),
    async (req, res) => {
      const id = paramId(req);
      const sheet = await computeSheet(db, store, currentProject(req), id);
      await storeSheet(db, id, sheet, currentUser(req).id);
      res.json(sheet);
    },
  );

  router.get(
    "/subcatchments/:id/sheet",
    ...one,
    requirePermission("project:read"),
    async (req, res) => {
      res.json(await storedSheet(db, req));
    },
  );

  router.get(
    "/subcatchments/:id/sheet.csv",
    ...one,
    requirePermission("project:read"),
    async (req, res) => {
      const sheet = await storedSheet(db, req);
      res.attachment(fileName(sheet, "csv"));
      res.type("text/csv; charset=utf-8").send(`\uFEFF${sheetCsv(sheet)}`);
    },
  );

  router.get(
    "/subcatchments/:id/sheet.xlsx",
    ...one,
    requirePermission("project:read"),
    async (req, res) => {
      const sheet = await storedSheet(db, req);
      res.attachment(fileName(sheet, "xlsx"));
      res
        .type("application/vnd.openxmlformats-officedocument.spreadsheetml.sheet")
        .send(await sheetXlsx(sheet));
    },
  );

  return router;
}
