/**
 * Route-table rows of the geodata pipeline's routes (catalog, rules, rainfall, subcatchments,
 * compute, exports): the status each role must get. Destructive cases make a fresh target.
 */
import { randomUUID } from "node:crypto";
import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { and, eq, sql } from "drizzle-orm";
import type { Db } from "../../server/db/client";
import { projects } from "../../server/db/schema";
import {
  flowPaths,
  rainfallTables,
  subcatchmentResults,
  subcatchments,
  surfaceClasses,
} from "../../server/db/schema-geodata";
import { ensureTeamCatalog } from "../../server/geodata/catalog-seed";
import { assembleSheet } from "../../shared/sheet/assemble";
import type { Caller, RouteCase, RouteFixture } from "./route-table";

const table = (...s: [number, number, number, number, number, number]): Record<Caller, number> => ({
  owner: s[0],
  admin: s[1],
  engineer: s[2],
  gis: s[3],
  reviewer: s[4],
  viewer: s[5],
  anonymous: 401,
});
const READ = table(200, 200, 200, 200, 200, 200);
const catalogEdit = (ok: number) => table(ok, ok, 403, 403, 403, 403);
const engineerEdit = (ok: number) => table(ok, ok, ok, 403, 403, 403);

// An invented square and a line inside it.
const RING = [
  [-122.4, 37.7],
  [-122.399, 37.7],
  [-122.399, 37.701],
  [-122.4, 37.701],
  [-122.4, 37.7],
];
const LINE = { type: "LineString", coordinates: [RING[3], RING[1]] };
const IDF = { formula: { "10": { a: 1800, b: 12, c: 0.8 } } };

let tmp: string | undefined;
function tmpFile(name: string, text: string): string {
  tmp ??= mkdtempSync(path.join(os.tmpdir(), "rillmark-route-geo-"));
  const file = path.join(tmp, name);
  writeFileSync(file, text);
  return file;
}
const boundaryFile = () =>
  tmpFile(
    "boundary.geojson",
    JSON.stringify({
      type: "FeatureCollection",
      features: [
        { type: "Feature", properties: {}, geometry: { type: "Polygon", coordinates: [RING] } },
      ],
    }),
  );
const pathFile = () =>
  tmpFile(
    "path.geojson",
    JSON.stringify({
      type: "FeatureCollection",
      features: [{ type: "Feature", properties: {}, geometry: LINE }],
    }),
  );
const csvFile = () => tmpFile("idf.csv", "duration_min / intensity,10-yr\n5,150\n10,120\n60,40\n");

async function teamOf(f: RouteFixture) {
  await ensureTeamCatalog(f.db, f.team.id);
  return f.team.id;
}

async function anyClass(f: RouteFixture): Promise<string> {
  const [row] = await f.db
    .select({ id: surfaceClasses.id })
    .from(surfaceClasses)
    .where(and(eq(surfaceClasses.teamId, await teamOf(f)), eq(surfaceClasses.key, "lawn-good")));
  if (!row) throw new Error("no lawn-good class");
  return row.id;
}

async function freshClass(f: RouteFixture): Promise<string> {
  const [row] = await f.db
    .select()
    .from(surfaceClasses)
    .where(eq(surfaceClasses.id, await anyClass(f)));
  if (!row) throw new Error("no class");
  const [made] = await f.db
    .insert(surfaceClasses)
    .values({
      teamId: f.team.id,
      key: `route-${randomUUID().slice(0, 8)}`,
      name: "Route target",
      values: row.values,
    })
    .returning({ id: surfaceClasses.id });
  return made?.id ?? "";
}

async function freshProject(db: Db, teamId: string): Promise<string> {
  const [row] = await db
    .insert(projects)
    .values({ teamId, name: "Route rules", units: "si", designReturnPeriodYears: 10 })
    .returning({ id: projects.id });
  return row?.id ?? "";
}

async function freshRainfall(f: RouteFixture): Promise<string> {
  const [row] = await f.db
    .insert(rainfallTables)
    .values({
      projectId: f.projectId,
      name: "Route IDF",
      units: "si",
      idf: { kind: "formula", ...IDF },
    })
    .returning({ id: rainfallTables.id });
  return row?.id ?? "";
}

async function freshSub(f: RouteFixture, withPath = false): Promise<string> {
  const [row] = await f.db
    .insert(subcatchments)
    .values({ projectId: f.projectId, name: `Route ${randomUUID().slice(0, 8)}` })
    .returning({ id: subcatchments.id });
  const id = row?.id ?? "";
  if (withPath) {
    await f.db.insert(flowPaths).values({
      subcatchmentId: id,
      geom: sql`ST_SetSRID(ST_GeomFromGeoJSON(${JSON.stringify(LINE)}), 4326)` as unknown as string,
    });
  }
  return id;
}

async function computedSub(f: RouteFixture): Promise<string> {
  const id = await freshSub(f);
  const sheet = assembleSheet(
    {
      project: { id: f.projectId, name: "Route" },
      subcatchment: { id, name: "Route", scenario: "existing" },
      flowPathVersion: 0,
      computedAt: new Date().toISOString(),
      units: "si",
      unitLabels: { length: "m" },
      returnPeriodYears: 10,
      totalLength: 0,
      reversed: false,
      breaks: {
        sheetEnd: null,
        sheetEndSource: "none",
        channelStart: null,
        channelStartSource: "none",
      },
      figures: { area: null, cn: null, c: null, avgSlopePercent: null, notes: [] },
      profile: [],
      rainfall: null,
      split: { pieces: [], coverFeatureIds: [], soilFeatureIds: [] },
    },
    [],
    null,
    ["No flow path."],
  );
  await f.db.insert(subcatchmentResults).values({ subcatchmentId: id, flowPathVersion: 0, sheet });
  return id;
}

const sub =
  (suffix = "") =>
  async (f: RouteFixture) => ({ path: `/api/subcatchments/${await freshSub(f)}${suffix}` });

export const GEODATA_ROUTE_CASES: RouteCase[] = [
  {
    method: "get",
    route: "/api/teams/:teamId/surface-classes",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/teams/${await teamOf(f)}/surface-classes` }),
    expected: READ,
  },
  {
    method: "post",
    route: "/api/teams/:teamId/surface-classes",
    teamScoped: true,
    prepare: async (f) => {
      const [row] = await f.db
        .select()
        .from(surfaceClasses)
        .where(eq(surfaceClasses.id, await anyClass(f)));
      return {
        path: `/api/teams/${f.team.id}/surface-classes`,
        body: {
          key: `route-${randomUUID().slice(0, 8)}`,
          name: "Route class",
          values: row?.values ?? {},
        },
      };
    },
    expected: catalogEdit(201),
  },
  {
    method: "get",
    route: "/api/surface-classes/:id",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/surface-classes/${await anyClass(f)}` }),
    expected: READ,
  },
  {
    method: "patch",
    route: "/api/surface-classes/:id",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/surface-classes/${await freshClass(f)}`,
      body: { description: "checked" },
    }),
    expected: catalogEdit(200),
  },
  {
    method: "delete",
    route: "/api/surface-classes/:id",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/surface-classes/${await freshClass(f)}` }),
    expected: catalogEdit(204),
  },
  {
    method: "get",
    route: "/api/projects/:projectId/surface-classes",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/projects/${f.projectId}/surface-classes` }),
    expected: READ,
  },
  {
    method: "put",
    route: "/api/projects/:projectId/surface-classes/:classId/override",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/projects/${f.projectId}/surface-classes/${await anyClass(f)}/override`,
      body: {
        values: {
          sheetFlowN: { value: 0.2, source: "Route test criteria", note: "", rowId: null },
        },
      },
    }),
    expected: engineerEdit(200),
  },
  {
    method: "delete",
    route: "/api/projects/:projectId/surface-classes/:classId/override",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/projects/${f.projectId}/surface-classes/${await anyClass(f)}/override`,
    }),
    expected: engineerEdit(204),
  },
  {
    method: "get",
    route: "/api/projects/:projectId/design-rules",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/projects/${f.projectId}/design-rules` }),
    expected: READ,
  },
  {
    method: "put",
    route: "/api/projects/:projectId/design-rules",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/projects/${await freshProject(f.db, f.team.id)}/design-rules`,
      body: {
        rules: {},
        dualHsg: "drained",
        channelSlope: "10-85",
        profileSpacingM: 5,
        version: 0,
      },
    }),
    expected: engineerEdit(200),
  },
  {
    method: "get",
    route: "/api/projects/:projectId/rainfall-tables",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/projects/${f.projectId}/rainfall-tables` }),
    expected: READ,
  },
  {
    method: "post",
    route: "/api/projects/:projectId/rainfall-tables",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/projects/${f.projectId}/rainfall-tables`,
      body: { name: "Route IDF", idf: IDF },
    }),
    expected: engineerEdit(201),
  },
  {
    method: "post",
    route: "/api/projects/:projectId/rainfall-tables/upload",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/projects/${f.projectId}/rainfall-tables/upload`,
      upload: { fields: { name: "Route CSV", kind: "intensity" }, file: csvFile() },
    }),
    expected: engineerEdit(201),
  },
  {
    method: "get",
    route: "/api/rainfall-tables/:id",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/rainfall-tables/${await freshRainfall(f)}` }),
    expected: READ,
  },
  {
    method: "patch",
    route: "/api/rainfall-tables/:id",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/rainfall-tables/${await freshRainfall(f)}`,
      body: { name: "Renamed" },
    }),
    expected: engineerEdit(200),
  },
  {
    method: "delete",
    route: "/api/rainfall-tables/:id",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/rainfall-tables/${await freshRainfall(f)}` }),
    expected: engineerEdit(204),
  },
  {
    method: "get",
    route: "/api/projects/:projectId/subcatchments",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/projects/${f.projectId}/subcatchments` }),
    expected: READ,
  },
  {
    method: "post",
    route: "/api/projects/:projectId/subcatchments",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/projects/${f.projectId}/subcatchments`,
      body: { name: `Route ${randomUUID().slice(0, 8)}` },
    }),
    expected: engineerEdit(201),
  },
  {
    method: "get",
    route: "/api/subcatchments/:id",
    teamScoped: true,
    prepare: sub(),
    expected: READ,
  },
  {
    method: "patch",
    route: "/api/subcatchments/:id",
    teamScoped: true,
    prepare: async (f) => ({ ...(await sub()(f)), body: { note: "checked", version: 1 } }),
    expected: engineerEdit(200),
  },
  {
    method: "delete",
    route: "/api/subcatchments/:id",
    teamScoped: true,
    prepare: sub(),
    expected: engineerEdit(204),
  },
  {
    method: "put",
    route: "/api/subcatchments/:id/flow-path",
    teamScoped: true,
    prepare: async (f) => ({
      ...(await sub("/flow-path")(f)),
      body: { geometry: LINE, version: 0 },
    }),
    expected: engineerEdit(200),
  },
  {
    method: "post",
    route: "/api/subcatchments/:id/flow-path/reverse",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/subcatchments/${await freshSub(f, true)}/flow-path/reverse`,
      body: { version: 1 },
    }),
    expected: engineerEdit(200),
  },
  {
    method: "post",
    route: "/api/subcatchments/:id/flow-path/file",
    teamScoped: true,
    prepare: async (f) => ({
      ...(await sub("/flow-path/file")(f)),
      upload: { fields: { version: "0" }, file: pathFile() },
    }),
    expected: engineerEdit(200),
  },
  {
    method: "post",
    route: "/api/subcatchments/:id/boundary/file",
    teamScoped: true,
    prepare: async (f) => ({
      ...(await sub("/boundary/file")(f)),
      upload: { fields: { version: "1" }, file: boundaryFile() },
    }),
    expected: engineerEdit(200),
  },
  {
    method: "put",
    route: "/api/subcatchments/:id/breaks",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/subcatchments/${await freshSub(f, true)}/breaks`,
      body: { sheetEnd: 10, version: 1 },
    }),
    expected: engineerEdit(200),
  },
  {
    method: "put",
    route: "/api/subcatchments/:id/elevations",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/subcatchments/${await freshSub(f, true)}/elevations`,
      body: { entries: [{ station: 0, elevation: 10 }], version: 1 },
    }),
    expected: engineerEdit(200),
  },
  {
    method: "put",
    route: "/api/subcatchments/:id/surface-overrides",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/subcatchments/${await freshSub(f, true)}/surface-overrides`,
      body: {
        entries: [{ stationFrom: 1, stationTo: 5, surfaceClassId: await anyClass(f) }],
        version: 1,
      },
    }),
    expected: engineerEdit(200),
  },
  {
    method: "post",
    route: "/api/subcatchments/:id/compute",
    teamScoped: true,
    prepare: async (f) => ({ ...(await sub("/compute")(f)), body: {} }),
    expected: engineerEdit(200),
  },
  {
    method: "get",
    route: "/api/subcatchments/:id/sheet",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/subcatchments/${await computedSub(f)}/sheet` }),
    expected: READ,
  },
  {
    method: "get",
    route: "/api/subcatchments/:id/sheet.csv",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/subcatchments/${await computedSub(f)}/sheet.csv` }),
    expected: READ,
  },
  {
    method: "get",
    route: "/api/subcatchments/:id/sheet.xlsx",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/subcatchments/${await computedSub(f)}/sheet.xlsx` }),
    expected: READ,
  },
];
