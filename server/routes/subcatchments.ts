/**
 * Subcatchments of a project: boundary, outlet, channel fields under the subcatchment's version,
 * the longest flow path with its regime breaks, surveyed elevations and surface overrides under
 * the path's version (409 on a stale one of either: no edit silently replaces another).
 * Stations and elevations in bodies are in the project's length unit; they are stored in metres.
 */
import { asc, eq, sql } from "drizzle-orm";
import { Router, type Request } from "express";
import {
  createSubcatchmentBody,
  putBreaksBody,
  putElevationsBody,
  putFlowPathBody,
  putSurfaceOverridesBody,
  updateSubcatchmentBody,
  versionBody,
} from "../../shared/schemas/subcatchments";
import {
  currentProject,
  currentUser,
  loadProjectAccess,
  requirePermission,
  requireUser,
} from "../auth/guards";
import type { Db } from "../db/client";
import { isUniqueViolation } from "../db/errors";
import { elevationOverrides, flowPaths, regimeBreaks, subcatchments } from "../db/schema-geodata";
import { loadViaProject, paramId } from "../geodata/access";
import {
  nextPathVersion,
  reverseFlowPath,
  touchFlowPath,
  writeFlowPath,
} from "../geodata/flow-path-store";
import { reverseSurfaceOverrides, writeSurfaceOverrides } from "../geodata/surface-override-store";
import { loadResultSummaries } from "../geodata/result-summary-store";
import {
  checkBoundary,
  geomFromJson,
  loadSubcatchment,
  toMetres,
  writeSubcatchmentFields,
  type Units,
} from "../geodata/subcatchment-store";
import { invalidInput, notFound } from "../http/errors";
import { validate } from "../http/validate";
import type { RouteDeps } from "./deps";

const nameTaken = () =>
  invalidInput({ name: "The project already has a subcatchment of this name and scenario." });

export function subcatchmentOwner(db: Db) {
  return async (id: string) => {
    const [row] = await db
      .select({ projectId: subcatchments.projectId })
      .from(subcatchments)
      .where(eq(subcatchments.id, id));
    return row?.projectId;
  };
}

const unitsOf = (req: Request): Units => (currentProject(req).units === "si" ? "si" : "us");

export async function answerSubcatchment(db: Db, req: Request, id = paramId(req)) {
  const found = await loadSubcatchment(db, id, unitsOf(req));
  if (!found) throw notFound("This subcatchment");
  return found;
}

export function subcatchmentsRouter({ db }: RouteDeps): Router {
  const router = Router();
  const inProject = [requireUser(db), loadProjectAccess(db)];
  const one = [requireUser(db), loadViaProject(db, "This subcatchment", subcatchmentOwner(db))];
  const edit = [...one, requirePermission("geometry:edit")];

  router.get(
    "/projects/:projectId/subcatchments",
    ...inProject,
    requirePermission("project:read"),
    async (req, res) => {
      const rows = await db
        .select({ id: subcatchments.id })
        .from(subcatchments)
        .where(eq(subcatchments.projectId, currentProject(req).id))
        .orderBy(asc(subcatchments.name), asc(subcatchments.scenario));
      const results = await loadResultSummaries(db, currentProject(req).id);
      const list = [];
      for (const r of rows) {
        const item = await answerSubcatchment(db, req, r.id);
        list.push({ ...item, result: results.get(r.id) ?? null });
      }
      res.json(list);
    },
  );

  router.post(
    "/projects/:projectId/subcatchments",
    ...inProject,
    requirePermission("geometry:edit"),
    async (req, res) => {
      const body = validate(createSubcatchmentBody, req.body);
      if (body.boundary) await checkBoundary(db, body.boundary);
      const [row] = await db
        .insert(subcatchments)
        .values({
          projectId: currentProject(req).id,
          name: body.name,
          scenario: body.scenario,
          boundary: (body.boundary ? geomFromJson(body.boundary) : null) as unknown as string,
          outlet: (body.outlet ? geomFromJson(body.outlet) : null) as unknown as string,
          channel: body.channel,
          note: body.note,
          createdBy: currentUser(req).id,
        })
        .returning({ id: subcatchments.id })
        .catch((err: unknown) => {
          throw isUniqueViolation(err) ? nameTaken() : err;
        });
      if (!row) throw new Error("subcatchment insert returned no row");
      res.status(201).json(await answerSubcatchment(db, req, row.id));
    },
  );

  router.get("/subcatchments/:id", ...one, requirePermission("project:read"), async (req, res) => {
    res.json(await answerSubcatchment(db, req));
  });

  router.patch("/subcatchments/:id", ...edit, async (req, res) => {
    const body = validate(updateSubcatchmentBody, req.body);
    if (body.boundary) await checkBoundary(db, body.boundary);
    const { boundary, outlet, version, ...plain } = body;
    const set: Record<string, unknown> = { ...plain };
    if (boundary !== undefined) set.boundary = boundary ? geomFromJson(boundary) : null;
    if (outlet !== undefined) set.outlet = outlet ? geomFromJson(outlet) : null;
    await writeSubcatchmentFields(db, paramId(req), version, set).catch((err: unknown) => {
      throw isUniqueViolation(err) ? nameTaken() : err;
    });
    res.json(await answerSubcatchment(db, req));
  });

  router.delete("/subcatchments/:id", ...edit, async (req, res) => {
    await db.delete(subcatchments).where(eq(subcatchments.id, paramId(req)));
    res.status(204).end();
  });

  router.put("/subcatchments/:id/flow-path", ...edit, async (req, res) => {
    const body = validate(putFlowPathBody, req.body);
    const id = paramId(req);
    await db.transaction((tx) =>
      writeFlowPath(tx, id, body.geometry, body.version, currentUser(req).id),
    );
    res.json(await answerSubcatchment(db, req));
  });

  router.post("/subcatchments/:id/flow-path/reverse", ...edit, async (req, res) => {
    const body = validate(versionBody, req.body);
    const id = paramId(req);
    await db.transaction(async (tx) => {
      await reverseFlowPath(tx, id, body.version, currentUser(req).id);
      // Breaks say where sheet flow ends and channel flow starts, counted from the divide:
      // reversed, they would mean something else, so they go. Surveyed points and surface
      // overrides stay where they are on the ground: their stations count from the new divide.
      await tx.delete(regimeBreaks).where(eq(regimeBreaks.subcatchmentId, id));
      const [len] = await tx
        .select({ m: sql<number>`ST_Length(${flowPaths.geom}::geography)` })
        .from(flowPaths)
        .where(eq(flowPaths.subcatchmentId, id));
      const totalM = Number(len?.m ?? 0);
      const points = await tx
        .select()
        .from(elevationOverrides)
        .where(eq(elevationOverrides.subcatchmentId, id));
      await tx.delete(elevationOverrides).where(eq(elevationOverrides.subcatchmentId, id));
      if (points.length > 0) {
        await tx
          .insert(elevationOverrides)
          .values(points.map((p) => ({ ...p, stationM: Math.max(0, totalM - p.stationM) })));
      }
      await reverseSurfaceOverrides(tx, id, totalM);
    });
    res.json(await answerSubcatchment(db, req));
  });

  router.put("/subcatchments/:id/breaks", ...edit, async (req, res) => {
    const body = validate(putBreaksBody, req.body);
    const id = paramId(req);
    const units = unitsOf(req);
    await db.transaction(async (tx) => {
      const version = await nextPathVersion(tx, id, body.version);
      if (version === 1) throw invalidInput({ version: "Draw the flow path before its breaks." });
      const current = await tx
        .select()
        .from(regimeBreaks)
        .where(eq(regimeBreaks.subcatchmentId, id));
      const stationOf = (kind: "sheet-end" | "channel-start", sent: number | null | undefined) =>
        sent === undefined
          ? (current.find((b) => b.kind === kind)?.stationM ?? null)
          : sent === null
            ? null
            : toMetres(units, sent);
      const sheetEndM = stationOf("sheet-end", body.sheetEnd);
      const channelStartM = stationOf("channel-start", body.channelStart);
      if (sheetEndM !== null && channelStartM !== null && channelStartM < sheetEndM) {
        throw invalidInput({
          channelStart: "Channel flow cannot start above the end of sheet flow.",
        });
      }
      await tx.delete(regimeBreaks).where(eq(regimeBreaks.subcatchmentId, id));
      const rows = [
        ...(sheetEndM === null
          ? []
          : [{ subcatchmentId: id, kind: "sheet-end" as const, stationM: sheetEndM }]),
        ...(channelStartM === null
          ? []
          : [{ subcatchmentId: id, kind: "channel-start" as const, stationM: channelStartM }]),
      ];
      if (rows.length > 0) await tx.insert(regimeBreaks).values(rows);
      await touchFlowPath(tx, id, version, currentUser(req).id);
    });
    res.json(await answerSubcatchment(db, req));
  });

  router.put("/subcatchments/:id/elevations", ...edit, async (req, res) => {
    const body = validate(putElevationsBody, req.body);
    const id = paramId(req);
    const units = unitsOf(req);
    await db.transaction(async (tx) => {
      const version = await nextPathVersion(tx, id, body.version);
      if (version === 1) {
        throw invalidInput({ version: "Draw the flow path before its surveyed elevations." });
      }
      await tx.delete(elevationOverrides).where(eq(elevationOverrides.subcatchmentId, id));
      if (body.entries.length > 0) {
        await tx.insert(elevationOverrides).values(
          body.entries.map((e) => ({
            subcatchmentId: id,
            stationM: toMetres(units, e.station),
            elevationM: toMetres(units, e.elevation),
            note: e.note,
          })),
        );
      }
      await touchFlowPath(tx, id, version, currentUser(req).id);
    });
    res.json(await answerSubcatchment(db, req));
  });

  router.put("/subcatchments/:id/surface-overrides", ...edit, async (req, res) => {
    const body = validate(putSurfaceOverridesBody, req.body);
    await db.transaction((tx) =>
      writeSurfaceOverrides(tx, {
        subcatchmentId: paramId(req),
        teamId: currentProject(req).teamId,
        units: unitsOf(req),
        body,
        userId: currentUser(req).id,
      }),
    );
    res.json(await answerSubcatchment(db, req));
  });

  return router;
}
