/**
 * Terrain tiles of the plane DEM fixture (tests/fixtures/geo/scenario.ts: z = Z0 + DZ_DCOL·col +
 * DZ_DROW·row at cell centres, NAD83 / UTM 10N). Each pixel is decoded from terrarium and
 * compared with the plane evaluated at the pixel centre, which is mapped to the raster's cells
 * with proj4 independently of the server: bilinear interpolation of a plane is the plane, so the
 * only difference allowed is the encoding's step of 1/256 m.
 */
import { eq } from "drizzle-orm";
import { PNG } from "pngjs";
import proj4 from "proj4";
import supertest from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { layers } from "../../server/db/schema-geodata";
import { fromTerrarium, terrariumRgb } from "../../server/tiles/terrarium";
import { PLANE, UTM10_NAD83 } from "../fixtures/geo/scenario";
import { createTeam, signIn, startTestApp, type TestApp } from "../support/app";
import { buildGeodataCase, type GeodataCase } from "../support/geodata-case";
import { binary, tileOf } from "../support/tiles";

let t: TestApp;
let c: GeodataCase;
let terrainId = "";
const toUtm = proj4("EPSG:4326", UTM10_NAD83);
// The DEM spans about 500 × 560 m from (569800, 4251000) south-east: a z 16 tile holds part of
// it and part of the land around it.
const AT = tileOf(-122.199, 38.4015, 16);
const url = (layerId: string, at = AT) =>
  `/api/layers/${layerId}/terrain/${at.z}/${at.x}/${at.y}.png`;

beforeAll(async () => {
  t = await startTestApp();
  c = await buildGeodataCase(t, "tiles-terrain");
  const terrain = (await t.db.select().from(layers).where(eq(layers.projectId, c.projectId))).find(
    (l) => l.kind === "terrain",
  );
  expect(terrain).toBeDefined();
  terrainId = terrain?.id ?? "";
});
afterAll(async () => {
  await t.close();
});

/** Continuous cell coordinates (integers at cell centres) of a pixel centre of tile `at`. */
function cellOf(at: typeof AT, col: number, row: number): [number, number] {
  const n = 2 ** at.z * 256;
  const lon = ((at.x * 256 + col + 0.5) / n) * 360 - 180;
  const my = Math.PI * (1 - (2 * (at.y * 256 + row + 0.5)) / n);
  const lat = (Math.atan(Math.sinh(my)) * 180) / Math.PI;
  const [e = 0, north = 0] = toUtm.forward([lon, lat]);
  return [
    (e - PLANE.originX) / PLANE.pixelSizeM - 0.5,
    (PLANE.originY - north) / PLANE.pixelSizeM - 0.5,
  ];
}

describe("terrain raster-dem tiles", () => {
  it("encodes and decodes terrarium to within 1/256 m", () => {
    for (const z of [-12.3, 0, 150.123456, 4321.999]) {
      const [r, g, b] = terrariumRgb(z);
      expect(Math.abs(fromTerrarium(r, g, b) - z)).toBeLessThanOrEqual(1 / 512);
    }
  });

  it("gives every pixel over the DEM the plane's elevation, and none elsewhere", async () => {
    const res = await c.engineer.get(url(terrainId)).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("image/png");
    const png = PNG.sync.read(res.body as Buffer);
    expect([png.width, png.height]).toEqual([256, 256]);
    let inside = 0;
    let outside = 0;
    const wrong: string[] = [];
    for (let row = 0; row < 256; row += 1) {
      for (let col = 0; col < 256; col += 1) {
        const k = 4 * (row * 256 + col);
        const [cc, rr] = cellOf(AT, col, row);
        const alpha = png.data[k + 3];
        // Half a cell beyond the outer centres the sampler holds the edge value; further out
        // there is no elevation. Skip a band of one cell around both lines.
        const well = cc > 0.5 && rr > 0.5 && cc < PLANE.width - 1.5 && rr < PLANE.height - 1.5;
        const off = cc < -1.5 || rr < -1.5 || cc > PLANE.width + 0.5 || rr > PLANE.height + 0.5;
        const nearNodata =
          Math.abs(cc - PLANE.nodataCell[0]) < 2 && Math.abs(rr - PLANE.nodataCell[1]) < 2;
        if (well && !nearNodata) {
          inside += 1;
          const z = fromTerrarium(png.data[k] ?? 0, png.data[k + 1] ?? 0, png.data[k + 2] ?? 0);
          const plane = PLANE.z0 + PLANE.dzDcol * cc + PLANE.dzDrow * rr;
          if (alpha !== 255 || Math.abs(z - plane) > 1 / 256) {
            wrong.push(`${col},${row}: ${z} vs ${plane} (alpha ${alpha})`);
          }
        } else if (off) {
          outside += 1;
          if (alpha !== 0) wrong.push(`${col},${row} off the DEM has alpha ${alpha}`);
        }
      }
    }
    expect(inside).toBeGreaterThan(10_000);
    expect(outside).toBeGreaterThan(1_000);
    expect(wrong.slice(0, 5)).toEqual([]);
  });

  it("fills pixels off the DEM with the nearest elevation, so the hillshade has no cliff", async () => {
    const res = await c.engineer.get(url(terrainId)).buffer(true).parse(binary);
    const png = PNG.sync.read(res.body as Buffer);
    const heights: number[] = [];
    for (let k = 0; k < 256 * 256; k += 1) {
      heights.push(
        fromTerrarium(png.data[4 * k] ?? 0, png.data[4 * k + 1] ?? 0, png.data[4 * k + 2] ?? 0),
      );
    }
    // The plane spans Z0 − 0.125·124 − 0.25·139 ≈ 80 m to 150 m: no filled pixel leaves that range.
    expect(Math.min(...heights)).toBeGreaterThan(80);
    expect(Math.max(...heights)).toBeLessThan(150.5);
  });

  it("answers 204 off the DEM and when too coarse, 304 to a known ETag", async () => {
    expect((await c.engineer.get(url(terrainId, tileOf(10, 50, 16)))).status).toBe(204);
    expect((await c.engineer.get(url(terrainId, tileOf(-122.199, 38.4015, 9)))).status).toBe(204);
    const first = await c.engineer.get(url(terrainId)).buffer(true).parse(binary);
    const again = await c.engineer
      .get(url(terrainId))
      .set("If-None-Match", first.headers.etag as string);
    expect(again.status).toBe(304);
  });

  it("is read by a viewer, 404 for another team, a non-terrain layer, or nobody signed in", async () => {
    const viewer = t.agent();
    await signIn(viewer, c.team.members.viewer);
    expect((await viewer.get(url(terrainId))).status).toBe(200);
    const other = await createTeam(t.db, "terrain-other");
    const outsider = t.agent();
    await signIn(outsider, other.members.owner);
    expect((await outsider.get(url(terrainId))).status).toBe(404);
    expect((await c.engineer.get(url(c.coverLayerId))).status).toBe(404);
    expect((await supertest(t.app).get(url(terrainId))).status).toBe(401);
  });
});
