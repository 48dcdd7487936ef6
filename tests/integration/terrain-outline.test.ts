/**
 * Outlines and delineations judged by PostGIS (3.3, GEOS): every boundary valid by ST_IsValid,
 * its ST_Area(::geography) equal to the area Rillmark reports (GeographicLib; 1e-6 relative,
 * the two libraries' agreement on the WGS84 spheroid, or 1e-3 m² on basins of a few cells, where
 * their rounding differs by some 1e-5 m²) and within 0.5 % of its cells' ground
 * area (the smoothing's bound), or 2e-5 for an exact cell-edge outline: PostGIS takes every
 * edge as a geodesic, and a cell side along a parallel is not one (over 0.004° at 45° N they part
 * by about 2 mm), and cell areas are measured at the grid's middle column (216 km off the UTM
 * meridian the demo's point scale changes by 1.4e-6 across its 512 m). The longest flow path's
 * ST_Length(::geography) equal to its reported length (1e-5: float32 flow lengths). Random cell
 * sets (test-grids.ts) bring one-cell necks, corner-only links and holes; the demo terrain and
 * a geographic valley bring real basins and nested outlets.
 */
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { delineate } from "../../server/terrain-flow/delineate";
import { gridProjection } from "../../server/terrain-flow/georef";
import { traceOutline } from "../../server/terrain-flow/outline";
import { exactOutline, simplifyOutline } from "../../server/terrain-flow/outline-simplify";
import { readElevationGrid } from "../../server/terrain-flow/read-terrain";
import { conditionAndRoute } from "../../server/terrain-flow/route";
import { cellMetrics } from "../../server/terrain-flow/cell-metrics";
import {
  GEOGRAPHIC,
  makeGrid,
  RANDOM_GRID_WIDTH,
  randomCells,
  UTM,
} from "../../server/terrain-flow/test-grids";
import type { DelineationProposal } from "../../shared/schemas/delineation";

let pool: pg.Pool;
beforeAll(() => {
  pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
});
afterAll(async () => {
  await pool.end();
});

interface Judged {
  valid: boolean;
  reason: string;
  areaM2: number;
  lengthM: number | null;
}

async function judge(boundary: object, path?: object): Promise<Judged> {
  const { rows } = await pool.query<Judged>(
    `SELECT ST_IsValid(g) AS valid, ST_IsValidReason(g) AS reason,
            ST_Area(g::geography) AS "areaM2",
            ST_Length(ST_GeomFromGeoJSON($2)::geography) AS "lengthM"
       FROM (SELECT ST_SetSRID(ST_GeomFromGeoJSON($1), 4326) AS g) AS b`,
    [JSON.stringify(boundary), path ? JSON.stringify(path) : null],
  );
  return rows[0]!;
}

async function checkProposal(p: DelineationProposal) {
  const judged = await judge(p.boundary, p.longestFlowPath);
  expect(judged.reason).toBe("Valid Geometry");
  expect(Math.abs(judged.areaM2 - p.areaM2)).toBeLessThan(Math.max(1e-6 * p.areaM2, 1e-3));
  expect(Math.abs(judged.areaM2 / p.cellsAreaM2 - 1)).toBeLessThan(
    p.boundarySmoothed ? 0.005 : 2e-5,
  );
  expect(Math.abs(judged.lengthM! / p.longestFlowPathM - 1)).toBeLessThan(1e-5);
}

describe("outlines of random cell sets, as PostGIS sees them", () => {
  const georef = UTM.georef(RANDOM_GRID_WIDTH, RANDOM_GRID_WIDTH);
  const projection = gridProjection(georef);
  const metrics = cellMetrics(georef, RANDOM_GRID_WIDTH, RANDOM_GRID_WIDTH);
  const geojson = (polygons: { shell: number[]; holes: number[][] }[]) => ({
    type: "MultiPolygon",
    coordinates: polygons.map((p) =>
      [p.shell, ...p.holes].map((ring) => {
        const out: [number, number][] = [];
        for (let a = 0; a < ring.length; a += 2)
          out.push(projection.lonLatAt(ring[a]!, ring[a + 1]!));
        return [...out, out[0]!];
      }),
    ),
  });

  it.each(Array.from({ length: 16 }, (_, k) => k + 1))(
    "seed %i: smoothed and exact outlines valid, areas kept",
    async (seed) => {
      const cells = randomCells(seed, 70, 100 + 180 * seed);
      let cellsM2 = 0;
      for (const c of cells) cellsM2 += metrics.areaM2[Math.floor(c / RANDOM_GRID_WIDTH)]!;
      const outline = traceOutline(cells, RANDOM_GRID_WIDTH);
      const smooth = simplifyOutline(outline);
      const judged = await judge(geojson(smooth.polygons));
      expect(judged.reason).toBe("Valid Geometry");
      expect(Math.abs(judged.areaM2 / cellsM2 - 1)).toBeLessThan(0.005);
      // The exact cell edges, saddles cut by 1/1000 cell, whatever the smoothing chose.
      const judgedExact = await judge(geojson(exactOutline(outline)));
      expect(judgedExact.reason).toBe("Valid Geometry");
      expect(Math.abs(judgedExact.areaM2 / cellsM2 - 1)).toBeLessThan(1e-5);
    },
  );
});

describe("delineations, as PostGIS sees them", () => {
  it("the demo terrain: outlets over the whole grid, alone and nested", async () => {
    const grid = await readElevationGrid(
      new URL("../../demo-geo/out/terrain.tif", import.meta.url).pathname,
      "m",
    );
    const routed = conditionAndRoute(grid);
    const projection = gridProjection(routed.georef);
    // Every 37th data cell along a diagonal sweep: ridges, slopes, the swale.
    const outlets: [number, number][] = [];
    for (let k = 0; k < routed.width * routed.height; k += 997) {
      if (Number.isNaN(grid.z[k]!)) continue;
      outlets.push(
        projection.lonLatAt((k % routed.width) + 0.5, Math.floor(k / routed.width) + 0.5),
      );
    }
    for (const outlet of outlets) {
      const [alone] = delineate(routed, [outlet], { snapCells: 3 });
      await checkProposal(alone!);
    }
    const nested = delineate(routed, outlets.slice(0, 12), { snapCells: 0 });
    for (const p of nested) await checkProposal(p);
  });

  it("a valley in geographic coordinates", async () => {
    const [w, h, xc] = [41, 60, 20];
    const { east, north } = GEOGRAPHIC.steps(30, h);
    const routed = conditionAndRoute(
      makeGrid(
        GEOGRAPHIC,
        w,
        h,
        (c, r) =>
          50 + 0.3 * Math.abs(c - xc) * east + 0.02 * (h - 1 - r) * north + 0.5 * Math.sin(c * r),
      ),
    );
    const at = (c: number, r: number) => gridProjection(routed.georef).lonLatAt(c + 0.5, r + 0.5);
    for (const p of delineate(routed, [at(xc, 58), at(xc, 30), at(xc - 5, 40)], { snapCells: 2 })) {
      await checkProposal(p);
    }
  });
});
