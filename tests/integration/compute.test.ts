import { sql } from "drizzle-orm";
import proj4 from "proj4";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  buildPolygonIndex,
  pathLengthsM,
  pointAtStation,
  splitFlowPath,
  type HsgCode,
  type LonLat,
  type PolygonRings,
  type ValuedPolygon,
} from "../../shared/geo";
import { computeFromJson, METHOD_IDS } from "../../shared/hydrology";
import type { TravelTimeSheet } from "../../shared/schemas/sheet";
import { PATH, PLANE, UTM10_NAD83 } from "../fixtures/geo/scenario";
import { startTestApp, type TestApp } from "../support/app";
import { buildGeodataCase, type GeodataCase } from "../support/geodata-case";

let t: TestApp;
let c: GeodataCase;
let sheet: TravelTimeSheet;

beforeAll(async () => {
  t = await startTestApp();
  c = await buildGeodataCase(t, "compute");
  const res = await c.engineer.post(`/api/subcatchments/${c.subcatchmentId}/compute`).send({});
  if (res.status !== 200)
    throw new Error(`compute answered ${res.status}: ${JSON.stringify(res.body)}`);
  sheet = res.body as TravelTimeSheet;
});
afterAll(() => t.close());

const path: LonLat[] = PATH.geometry.coordinates.map(
  (p) => [p[0] ?? Number.NaN, p[1] ?? Number.NaN] as const,
);

/** The plane DEM's analytic elevation at a lon/lat (cell centres at origin + (i + ½)·size). */
function planeElevationM(p: LonLat): number {
  const [x, y] = proj4("EPSG:4326", UTM10_NAD83, [p[0], p[1]]) as [number, number];
  const col = (x - PLANE.originX) / PLANE.pixelSizeM - 0.5;
  const row = (PLANE.originY - y) / PLANE.pixelSizeM - 0.5;
  return PLANE.z0 + PLANE.dzDcol * col + PLANE.dzDrow * row;
}

describe("compute", () => {
  it("answers a full sheet: ordered segments, every method, the governing Tc and the caution", () => {
    expect(sheet.problems).toEqual([]);
    expect(sheet.segments.length).toBeGreaterThanOrEqual(3);
    expect(sheet.segments.map((s) => s.regime)).toEqual(
      [...sheet.segments.map((s) => s.regime)].sort(
        (a, b) =>
          ["sheet", "shallow", "channel"].indexOf(a) - ["sheet", "shallow", "channel"].indexOf(b),
      ),
    );
    for (let i = 1; i < sheet.segments.length; i += 1) {
      expect(sheet.segments[i]?.stationFrom).toBeCloseTo(sheet.segments[i - 1]?.stationTo ?? -1, 9);
    }
    expect(sheet.methods.map((m) => m.id)).toEqual([...METHOD_IDS]);
    for (const id of ["velocity", "nrcs-lag", "kinematic-wave", "nrcs-segmental"]) {
      const m = sheet.methods.find((x) => x.id === id);
      expect(m?.status, `${id}: ${m?.reason}`).toBe("ok");
      expect(m?.totalMin).toBeGreaterThan(0);
    }
    expect(sheet.governing?.tcMin).toBeGreaterThan(0);
    expect(sheet.governing?.tcHr).toBeCloseTo((sheet.governing?.tcMin ?? 0) / 60, 12);
    expect(sheet.caution).toBe(
      "Design aid for qualified engineers: local drainage criteria and the engineer of record govern.",
    );
    expect(sheet.peakFlow?.value).toBeGreaterThan(0);
    expect(sheet.figures.area).toBeGreaterThan(0);
    expect(sheet.profile.length).toBeGreaterThan(10);
    expect(JSON.stringify(sheet)).not.toMatch(/NaN|Infinity/);
  });

  it("carries each Tc's Monte Carlo band and the sensitivity bars, and the core's input", () => {
    const u = sheet.uncertainty;
    if (!u) throw new Error("no uncertainty on the sheet");
    const g = u.monteCarlo.governingTcMin;
    expect(
      g && g.p10 <= (sheet.governing?.tcMin ?? 0) && (sheet.governing?.tcMin ?? 0) <= g.p90,
    ).toBe(true);
    expect(u.sensitivity.bars).toHaveLength(7);
    for (const m of sheet.methods.filter((x) => x.status === "ok"))
      expect(m.band?.draws).toBe(2000);
    // The stored input runs again through the core and gives the sheet's numbers.
    const again = computeFromJson(sheet.calcInput, { uncertainty: true });
    expect(again.governing.tcMin).toBe(sheet.governing?.tcMin);
    expect(again.uncertainty?.monteCarlo.governingTcMin).toEqual(g);
    // The lag method's per-segment figures are not additive: no row carries them.
    expect(sheet.segments.every((s) => s.timesMin["nrcs-lag"] === undefined)).toBe(true);
  });

  it("takes sheet flow to the 100 ft cap and channel flow from the user's break", () => {
    const sheetRows = sheet.segments.filter((s) => s.regime === "sheet");
    // NEH 630 Ch 15 (2010) 100 ft cap, the design rules' default; 1 ft = 0.3048 m exactly.
    expect(sheetRows.at(-1)?.stationToM).toBeCloseTo(30.48, 9);
    expect(sheet.segments.find((s) => s.regime === "channel")?.stationFromM).toBeCloseTo(400, 9);
    expect(sheet.breaks).toMatchObject({
      sheetEndSource: "design-rule",
      channelStartSource: "user",
    });
  });

  it("samples slopes from the plane DEM exactly (to 1e-6) through the whole endpoint", () => {
    // The plane is linear in the raster grid, so bilinear sampling must give it back exactly
    // (up to float arithmetic); slope = Δz / geodesic length of the segment.
    const lengths = pathLengthsM(path);
    for (const s of sheet.segments) {
      const zUp = planeElevationM(pointAtStation(path, lengths, s.stationFromM));
      const zDown = planeElevationM(pointAtStation(path, lengths, s.stationToM));
      expect(s.elevationUp).toBeCloseTo(zUp, 6);
      expect(s.elevationDown).toBeCloseTo(zDown, 6);
      expect(s.elevationSource).toBe("terrain");
      expect(
        Math.abs((s.slope ?? Number.NaN) - (zUp - zDown) / (s.stationToM - s.stationFromM)),
      ).toBeLessThan(1e-6);
    }
  });

  it("splits the path like PostGIS: lengths per cover class within 0.01 %", async () => {
    const result = await t.db.execute<{ surface_class_id: string; length_m: number }>(sql`
      select f.surface_class_id,
             sum(ST_Length(ST_Intersection(p.geom, f.geom)::geography)) as length_m
      from layer_features f, flow_paths p
      where f.layer_id = ${c.coverLayerId} and p.subcatchment_id = ${c.subcatchmentId}
        and ST_Intersects(p.geom, f.geom)
      group by 1`);
    expect(result.rows.length).toBeGreaterThanOrEqual(3);
    for (const row of result.rows) {
      const ours = sheet.split.pieces
        .filter((p) => p.surfaceClassId === row.surface_class_id)
        .reduce((sum, p) => sum + p.lengthM, 0);
      const postgis = Number(row.length_m);
      expect(Math.abs(ours - postgis) / postgis, row.surface_class_id).toBeLessThan(1e-4);
    }
  });

  it("gives the same split in the browser's code as on the server, from the same features", async () => {
    const rows = await t.db.execute<{
      id: string;
      surface_class_id: string | null;
      hsg: string | null;
      g: string;
    }>(sql`
      select id, surface_class_id, hsg, ST_AsGeoJSON(geom, 15) as g from layer_features
      where id = any(${sql.raw(`array[${[...sheet.split.coverFeatureIds, ...sheet.split.soilFeatureIds].join(",") || "0"}]::bigint[]`)})
      order by id`);
    const toPolygons = <V>(pick: (r: (typeof rows.rows)[number]) => V, ids: number[]) =>
      rows.rows
        .filter((r) => ids.includes(Number(r.id)))
        .flatMap((r): ValuedPolygon<V>[] => {
          const g = JSON.parse(r.g) as { type: string; coordinates: number[][][] | number[][][][] };
          const polys = (g.type === "Polygon" ? [g.coordinates] : g.coordinates) as number[][][][];
          return polys.map((p) => ({
            featureId: Number(r.id),
            rings: p.map((ring) => ring.map((q) => [q[0], q[1]] as const)) as PolygonRings,
            value: pick(r),
          }));
        });
    const cover = toPolygons((r) => r.surface_class_id, sheet.split.coverFeatureIds);
    const soil = toPolygons((r) => r.hsg as HsgCode | null, sheet.split.soilFeatureIds);
    const browser = splitFlowPath(path, buildPolygonIndex(cover), buildPolygonIndex(soil));
    expect(browser).toEqual(sheet.split.pieces);
  });

  it("stores the sheet; after a path edit it reads back as stale, naming the version it used", async () => {
    const stored = await c.engineer.get(`/api/subcatchments/${c.subcatchmentId}/sheet`);
    expect(stored.body.flowPathVersion).toBe(sheet.flowPathVersion);
    expect(stored.body.stale).toBe(false);
    const sub = await c.engineer.get(`/api/subcatchments/${c.subcatchmentId}`);
    await c.engineer
      .put(`/api/subcatchments/${c.subcatchmentId}/flow-path`)
      .send({ geometry: PATH.geometry, version: sub.body.flowPath.version });
    const after = await c.engineer.get(`/api/subcatchments/${c.subcatchmentId}/sheet`);
    expect(after.body).toMatchObject({ flowPathVersion: sheet.flowPathVersion, stale: true });
  });

  it("flags a path drawn uphill and makes its slopes errors on the segments, never NaN", async () => {
    const other = await buildGeodataCase(t, "compute-reversed");
    const rev = await other.engineer
      .post(`/api/subcatchments/${other.subcatchmentId}/flow-path/reverse`)
      .send({ version: 2 });
    expect(rev.status, JSON.stringify(rev.body)).toBe(200);
    const res = await other.engineer
      .post(`/api/subcatchments/${other.subcatchmentId}/compute`)
      .send({});
    const s = res.body as TravelTimeSheet;
    expect(s.reversed).toBe(true);
    expect(s.segments.every((x) => x.slope === null && /adverse slope/.test(x.error ?? ""))).toBe(
      true,
    );
    expect(s.methods.every((m) => m.status === "unavailable")).toBe(true);
    expect(s.governing).toBeNull();
    expect(s.problems.join(" ")).toMatch(/drawn the wrong way/);
    expect(JSON.stringify(s)).not.toMatch(/NaN/);
  });

  it("measures the subcatchment's area on the ellipsoid like PostGIS (within 0.01 %)", async () => {
    const result = await t.db.execute<{ m2: number }>(sql`
      select ST_Area(boundary::geography) as m2 from subcatchments where id = ${c.subcatchmentId}`);
    const postgisHa = Number(result.rows[0]?.m2) / 10_000;
    expect(Math.abs((sheet.figures.area ?? 0) - postgisHa) / postgisHa).toBeLessThan(1e-4);
  });

  it("takes channel slopes between 10 % and 85 % of the length when the rules say 10-85", async () => {
    const other = await buildGeodataCase(t, "compute-1085");
    const put = await other.engineer.put(`/api/projects/${other.projectId}/design-rules`).send({
      rules: {},
      dualHsg: "undrained",
      channelSlope: "10-85",
      profileSpacingM: 5,
      version: 0,
    });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    const res = await other.engineer
      .post(`/api/subcatchments/${other.subcatchmentId}/compute`)
      .send({});
    const channel = (res.body as TravelTimeSheet).segments.filter((s) => s.regime === "channel");
    expect(channel.length).toBeGreaterThan(0);
    const lengths = pathLengthsM(path);
    for (const s of channel) {
      const l = s.stationToM - s.stationFromM;
      const z10 = planeElevationM(pointAtStation(path, lengths, s.stationFromM + 0.1 * l));
      const z85 = planeElevationM(pointAtStation(path, lengths, s.stationFromM + 0.85 * l));
      expect(Math.abs((s.slope ?? Number.NaN) - (z10 - z85) / (0.75 * l))).toBeLessThan(1e-6);
    }
  });

  it("lets a surveyed elevation override the terrain at its station", async () => {
    const other = await buildGeodataCase(t, "compute-survey");
    await other.engineer.put(`/api/subcatchments/${other.subcatchmentId}/elevations`).send({
      entries: [{ station: 0, elevation: 190.25, note: "rod shot at the divide" }],
      version: 2,
    });
    const res = await other.engineer
      .post(`/api/subcatchments/${other.subcatchmentId}/compute`)
      .send({});
    const first = (res.body as TravelTimeSheet).segments[0];
    expect(first?.elevationUp).toBe(190.25);
    expect(first?.elevationSource).toBe("mixed");
    expect(first?.slope).toBeCloseTo(
      (190.25 - (first?.elevationDown ?? 0)) / (first?.length ?? 1),
      12,
    );
  });

  it("shows a stretch over an unmapped cover value as unmapped, with what to do", async () => {
    const other = await buildGeodataCase(t, "compute-unmapped");
    await t.db.execute(sql`
      update layer_features set surface_class_id = null
      where layer_id = ${other.coverLayerId} and attributes->>'NAME' = 'lawn'`);
    const res = await other.engineer
      .post(`/api/subcatchments/${other.subcatchmentId}/compute`)
      .send({});
    const s = res.body as TravelTimeSheet;
    const first = s.segments[0];
    expect(first?.surfaceClassName).toBeNull();
    expect(first?.error).toMatch(/No mapped surface class here.*Map the cover layer's values/);
    expect(s.methods.every((m) => m.status === "unavailable")).toBe(true);
    expect(s.split.pieces[0]?.surfaceClassId).toBeNull();
  });

  it("answers 404 for a sheet never computed", async () => {
    const made = await c.engineer
      .post(`/api/projects/${c.projectId}/subcatchments`)
      .send({ name: "Never computed" });
    const res = await c.engineer.get(`/api/subcatchments/${made.body.id}/sheet`);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("not_computed");
  });
});
