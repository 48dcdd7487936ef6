/** Reading tiles back in tests: MVT through @mapbox/vector-tile + pbf, and XYZ tile addresses. */
import { VectorTile } from "@mapbox/vector-tile";
import { PbfReader } from "pbf";
import type supertest from "supertest";

/** The tile (XYZ, Web Mercator) holding a WGS84 point at zoom z. */
export function tileOf(lon: number, lat: number, z: number): { z: number; x: number; y: number } {
  const n = 2 ** z;
  const x = Math.floor(((lon + 180) / 360) * n);
  const rad = (lat * Math.PI) / 180;
  const y = Math.floor(((1 - Math.log(Math.tan(rad) + 1 / Math.cos(rad)) / Math.PI) / 2) * n);
  return { z, x, y };
}

/** supertest parser that keeps a binary body as one Buffer. */
export function binary(res: supertest.Response, done: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on("data", (c: Buffer) => chunks.push(c));
  res.on("end", () => done(null, Buffer.concat(chunks)));
}

export function decodeTile(body: Buffer): VectorTile {
  return new VectorTile(new PbfReader(body));
}

/** Every feature of a source-layer with its properties and its geometry in lon/lat. */
export function layerFeatures(
  tile: VectorTile,
  name: string,
  at: { z: number; x: number; y: number },
) {
  const layer = tile.layers[name];
  if (!layer) return [];
  return Array.from({ length: layer.length }, (_, k) => {
    const f = layer.feature(k);
    return { id: f.id, properties: f.properties, geojson: f.toGeoJSON(at.x, at.y, at.z) };
  });
}
