/**
 * The invented demo scenario: the committed files in demo-geo/out are exactly what the script
 * writes, and they tell the story the demo needs (a path running downhill across the covers,
 * inside its subcatchment, cover tiling the site, a consistent IDF table). The files are read
 * back with general-purpose libraries (geotiff.js, shpjs, togeojson, papaparse), not with the
 * generator's own code.
 */
import { mkdtemp, readdir, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { booleanPointInPolygon, booleanValid, polygon as turfPolygon } from "@turf/turf";
import togeojson from "@mapbox/togeojson";
import { DOMParser } from "@xmldom/xmldom";
import { unzipSync } from "fflate";
import { fromArrayBuffer } from "geotiff";
import type { Geometry, LineString, Point, Polygon, Position } from "geojson";
import Papa from "papaparse";
import { parseDbf, parseShp } from "shpjs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { idfSchema } from "../shared/hydrology/idf-schema";
import { generateDemo } from "./generate";
import { ORIGIN_E, ORIGIN_N, SITE_SIZE_M, utmFromLonLat } from "./site";

const OUT = fileURLToPath(new URL("./out/", import.meta.url));
const read = (name: string) => readFile(join(OUT, name));

async function subcatchment(): Promise<{ path: Position[]; boundary: Polygon; outlet: Point }> {
  const doc = new DOMParser().parseFromString(
    (await read("subcatchment.kml")).toString("utf8"),
    "text/xml",
  );
  const features = togeojson.kml(doc as unknown as Document).features;
  const byType = <G extends Geometry>(type: G["type"]): G => {
    const hit = features.find((f) => f.geometry?.type === type);
    if (!hit?.geometry) throw new Error(`subcatchment.kml has no ${type}`);
    return hit.geometry as G;
  };
  return {
    path: byType<LineString>("LineString").coordinates,
    boundary: byType<Polygon>("Polygon"),
    outlet: byType<Point>("Point"),
  };
}

async function coverInUtm(): Promise<{ landuse: string; geometry: Geometry }[]> {
  const files = unzipSync(new Uint8Array(await read("cover.zip")));
  const shp = files["harrow_hill_cover.shp"];
  const dbf = files["harrow_hill_cover.dbf"];
  if (!shp || !dbf) throw new Error("cover.zip lacks its .shp or .dbf");
  const rows = parseDbf(dbf, "UTF-8");
  return parseShp(shp).map((geometry, k) => {
    if (geometry === null) throw new Error(`cover feature ${k + 1} has no geometry`);
    return { landuse: String(rows[k]?.LANDUSE), geometry };
  });
}

/** Shoelace area of a polygon's rings in the projected CRS, holes subtracted (m²). */
function planarAreaM2(geometry: Geometry): number {
  const polys =
    geometry.type === "Polygon"
      ? [geometry.coordinates]
      : geometry.type === "MultiPolygon"
        ? geometry.coordinates
        : [];
  let total = 0;
  for (const rings of polys) {
    rings.forEach((ring, k) => {
      let twice = 0;
      for (let i = 0; i + 1 < ring.length; i += 1) {
        const [x0 = 0, y0 = 0] = ring[i] ?? [];
        const [x1 = 0, y1 = 0] = ring[i + 1] ?? [];
        twice += x0 * y1 - x1 * y0;
      }
      total += (k === 0 ? 1 : -1) * Math.abs(twice / 2);
    });
  }
  return total;
}

describe("demo scenario generator", () => {
  let tmp = "";
  beforeAll(async () => {
    tmp = await mkdtemp(join(tmpdir(), "rillmark-demo-"));
  });
  afterAll(async () => {
    await rm(tmp, { recursive: true, force: true });
  });

  it("re-running the script writes exactly the committed files, byte for byte", async () => {
    const names = await generateDemo(tmp);
    expect((await readdir(OUT)).sort()).toEqual([...names].sort());
    for (const name of names) {
      const fresh = await readFile(join(tmp, name));
      expect(fresh.equals(await read(name)), `${name} differs from a fresh run`).toBe(true);
    }
  });

  it("the flow path runs downhill on the terrain from every vertex to the next", async () => {
    const bytes = await read("terrain.tif");
    const tiff = await fromArrayBuffer(
      bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength),
    );
    const image = await tiff.getImage();
    const [originX = 0, originY = 0] = image.getOrigin();
    const [sizeX = 1, sizeY = -1] = image.getResolution();
    const width = image.getWidth();
    const [band] = (await image.readRasters()) as unknown as Float32Array[];
    const nodata = image.getGDALNoData();
    // Bilinear between cell centres (cells are areas: the centre is half a cell in).
    const elevationAt = ([e, n]: readonly number[]): number => {
      const u = ((e ?? 0) - originX) / sizeX - 0.5;
      const v = ((n ?? 0) - originY) / sizeY - 0.5;
      const c = Math.floor(u);
      const r = Math.floor(v);
      const cell = (cc: number, rr: number) => {
        const z = band?.[rr * width + cc];
        if (z === undefined || z === nodata) throw new Error(`no elevation at ${e}, ${n}`);
        return z;
      };
      const fu = u - c;
      const fv = v - r;
      const top = cell(c, r) * (1 - fu) + cell(c + 1, r) * fu;
      const bottom = cell(c, r + 1) * (1 - fu) + cell(c + 1, r + 1) * fu;
      return top * (1 - fv) + bottom * fv;
    };
    const { path } = await subcatchment();
    const z = path.map(([lon = 0, lat = 0]) => elevationAt(utmFromLonLat([lon, lat])));
    const rises = z.flatMap((zk, k) => (k > 0 && zk >= (z[k - 1] ?? 0) ? [k] : []));
    expect(rises, "vertices not lower than the one before").toEqual([]);
    expect((z[0] ?? 0) - (z[z.length - 1] ?? 0)).toBeGreaterThan(10);
  });

  it("the flow path lies in its subcatchment and ends at the outlet", async () => {
    const { path, boundary, outlet } = await subcatchment();
    expect(booleanValid(turfPolygon(boundary.coordinates))).toBe(true);
    const outside = path.filter((p) => !booleanPointInPolygon(p, boundary));
    expect(outside).toEqual([]);
    expect(path[path.length - 1]).toEqual(outlet.coordinates);
  });

  it("the cover polygons are valid and tile the site without gap or overlap", async () => {
    const cover = await coverInUtm();
    for (const [k, c] of cover.entries()) {
      expect(booleanValid(c.geometry), `cover feature ${k + 1} (${c.landuse})`).toBe(true);
    }
    const total = cover.reduce((sum, c) => sum + planarAreaM2(c.geometry), 0);
    // Shared edges are the same vertices, so the areas add up to the site to rounding only.
    expect(Math.abs(total - SITE_SIZE_M ** 2)).toBeLessThan(1e-3);
    const misses: string[] = [];
    for (let x = 1.3; x < SITE_SIZE_M; x += 7.1) {
      for (let y = 0.9; y < SITE_SIZE_M; y += 6.7) {
        const p = [ORIGIN_E + x, ORIGIN_N + y];
        const hits = cover.filter((c) =>
          booleanPointInPolygon(p, c.geometry as Polygon, { ignoreBoundary: true }),
        ).length;
        if (hits !== 1) misses.push(`${x.toFixed(1)},${y.toFixed(1)}: ${hits}`);
      }
    }
    expect(misses).toEqual([]);
  });

  it("neighbouring cover polygons share every vertex of their common edges", async () => {
    // A vertex of one polygon inside another's edge would become a sliver once both are
    // reprojected to lon/lat (different chords), and a flow path could fall into it.
    const cover = await coverInUtm();
    const rings = cover.flatMap((c) => (c.geometry as Polygon).coordinates);
    const vertices = rings.flat();
    const unshared: string[] = [];
    for (const ring of rings) {
      for (let k = 0; k + 1 < ring.length; k += 1) {
        const [ax = 0, ay = 0] = ring[k] ?? [];
        const [bx = 0, by = 0] = ring[k + 1] ?? [];
        const len = Math.hypot(bx - ax, by - ay);
        for (const [px = 0, py = 0] of vertices) {
          const t = ((px - ax) * (bx - ax) + (py - ay) * (by - ay)) / (len * len);
          const off = Math.abs((px - ax) * (by - ay) - (py - ay) * (bx - ax)) / len;
          if (t > 1e-9 && t < 1 - 1e-9 && off < 1e-6) unshared.push(`${px},${py}`);
        }
      }
    }
    expect(unshared).toEqual([]);
  });

  it("the flow path crosses woods, meadow, a lot and its drive, the road and the swale", async () => {
    const cover = await coverInUtm();
    const { path } = await subcatchment();
    const utm = path.map(([lon = 0, lat = 0]) => utmFromLonLat([lon, lat]));
    const codes: string[] = [];
    for (let k = 0; k + 1 < utm.length; k += 1) {
      const [a, b] = [utm[k] ?? [0, 0], utm[k + 1] ?? [0, 0]];
      for (let t = 0; t < 1; t += 0.05) {
        const p = [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])];
        const hit = cover.find((c) => booleanPointInPolygon(p, c.geometry as Polygon));
        const code = hit?.landuse ?? "none";
        if (codes[codes.length - 1] !== code) codes.push(code);
      }
    }
    expect(codes).toEqual([
      "WOODS",
      "RANGE",
      "LAWN",
      "GRAVEL",
      "LAWN",
      "PAVED",
      "LAWN",
      "RANGE",
      "SWALE",
    ]);
  });

  it("the invented IDF table passes the engineering core's consistency checks", async () => {
    const parsed = Papa.parse<string[]>((await read("rainfall-idf.csv")).toString("utf8"), {
      skipEmptyLines: true,
      comments: "#",
    });
    const [header = [], ...rows] = parsed.data;
    const table = idfSchema.safeParse({
      kind: "table",
      durationsMin: rows.map((r) => Number(r[0])),
      returnPeriodsYears: header.slice(1).map((h) => Number.parseFloat(h)),
      intensity: rows.map((r) => r.slice(1).map(Number)),
    });
    expect(table.error?.issues ?? []).toEqual([]);
  });
});
