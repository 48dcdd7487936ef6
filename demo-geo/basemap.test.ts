/**
 * The invented basemap (demo-geo/out/basemap.geojson) read back as plain JSON: every
 * source-layer is there, and each contour lies at its elevation on the committed terrain file
 * as geotiff.js reads it (bilinear between cell centres), not as the generator computed it.
 */
import { readFile } from "node:fs/promises";
import type { FeatureCollection, LineString } from "geojson";
import { fromArrayBuffer } from "geotiff";
import { describe, expect, it } from "vitest";
import { utmFromLonLat } from "./site";

const OUT = new URL("./out/", import.meta.url);

async function basemap(): Promise<FeatureCollection> {
  return JSON.parse(await readFile(new URL("basemap.geojson", OUT), "utf8")) as FeatureCollection;
}

describe("demo basemap", () => {
  it("holds roads, streams, buildings, contours and named places, and says it is invented", async () => {
    const fc = await basemap();
    const count = (layer: string) =>
      fc.features.filter((f) => f.properties?.layer === layer).length;
    expect((fc as unknown as { about: string }).about).toMatch(/invented/i);
    expect(count("roads")).toBeGreaterThanOrEqual(2);
    expect(count("streams")).toBeGreaterThanOrEqual(1);
    expect(count("buildings")).toBe(10);
    expect(count("contours")).toBeGreaterThan(30);
    const places = fc.features.filter((f) => f.properties?.layer === "places");
    expect(places.length).toBeGreaterThanOrEqual(3);
    for (const p of places) expect(String(p.properties?.name)).not.toBe("");
  });

  it("every fifth metre is an index contour", async () => {
    const fc = await basemap();
    for (const f of fc.features.filter((g) => g.properties?.layer === "contours")) {
      const z = Number(f.properties?.elevation);
      expect(Number.isInteger(z)).toBe(true);
      expect(f.properties?.index).toBe(z % 5 === 0);
    }
  });

  it("contour vertices lie at their elevation on the terrain file (within 5 cm)", async () => {
    const bytes = await readFile(new URL("terrain.tif", OUT));
    const tiff = await fromArrayBuffer(
      bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength),
    );
    const image = await tiff.getImage();
    const [originX = 0, originY = 0] = image.getOrigin();
    const [sizeX = 1, sizeY = -1] = image.getResolution();
    const width = image.getWidth();
    const height = image.getHeight();
    const [band] = (await image.readRasters()) as unknown as Float32Array[];
    const nodata = image.getGDALNoData();
    const at = (c: number, r: number) => {
      const v = band?.[r * width + c];
      return v === undefined || v === nodata ? null : v;
    };
    /** Bilinear between cell centres; null near the edge or next to a no-data cell. */
    const sample = ([e = 0, n = 0]: readonly number[]): number | null => {
      const u = (e - originX) / sizeX - 0.5;
      const v = (n - originY) / sizeY - 0.5;
      const c = Math.floor(u);
      const r = Math.floor(v);
      if (c < 0 || r < 0 || c + 1 >= width || r + 1 >= height) return null;
      const q = [at(c, r), at(c + 1, r), at(c, r + 1), at(c + 1, r + 1)];
      if (q.some((x) => x === null)) return null;
      const [a = 0, b = 0, d = 0, g = 0] = q as number[];
      const fu = u - c;
      const fv = v - r;
      return (a * (1 - fu) + b * fu) * (1 - fv) + (d * (1 - fu) + g * fu) * fv;
    };
    const fc = await basemap();
    let checked = 0;
    const off: string[] = [];
    for (const f of fc.features.filter((g) => g.properties?.layer === "contours")) {
      const z = Number(f.properties?.elevation);
      for (const [lon = 0, lat = 0] of (f.geometry as LineString).coordinates) {
        const sampled = sample(utmFromLonLat([lon, lat]));
        if (sampled === null) continue;
        checked += 1;
        // Marching squares interpolates along cell edges, bilinear inside the cell: on this
        // smooth ground they differ by millimetres; 5 cm also covers the 0.25 m thinning.
        if (Math.abs(sampled - z) > 0.05)
          off.push(`${z} m at ${lon},${lat}: ${sampled.toFixed(3)}`);
      }
    }
    expect(checked).toBeGreaterThan(500);
    expect(off).toEqual([]);
  });
});
