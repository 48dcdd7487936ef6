/**
 * The demo's cover layer as a zipped shapefile in UTM (EPSG:32614), through the project's own
 * shapefile writer. Dates inside the archive and the .dbf header are fixed so that a re-run
 * writes identical bytes; the zip entry time is built from local-time parts because the zip
 * format stores local time, so the bytes do not depend on the machine's time zone.
 */
import type { Feature, Geometry, Position } from "geojson";
import { zipSync } from "fflate";
import { prjForEpsg, shapefileFiles } from "../server/geodata/writers";
import { encodeDbf } from "../server/geodata/writers/dbf";
import type { CoverPolygon } from "./cover";
import { UTM_EPSG, utmOf } from "./site";

const LAYER_NAME = "harrow_hill_cover";
const DBF_DATE = new Date(Date.UTC(2026, 0, 1));
const ZIP_TIME = new Date(2026, 0, 1, 12, 0, 0);

/** Millimetres are plenty for a site plan. */
const mm = (v: number) => Math.round(v * 1000) / 1000;

function toUtm(geometry: CoverPolygon["geometry"]): Geometry {
  const ring = (r: Position[]) => r.map(([x = 0, y = 0]) => utmOf([x, y]).map(mm));
  return { type: "Polygon", coordinates: geometry.coordinates.map(ring) };
}

export function coverShapefileZip(cover: readonly CoverPolygon[]): Uint8Array {
  const prjWkt = prjForEpsg(UTM_EPSG);
  if (prjWkt === null) throw new Error(`no .prj text for EPSG:${UTM_EPSG}`);
  const features: Feature<Geometry, Record<string, unknown>>[] = cover.map((c, k) => ({
    type: "Feature",
    properties: { COVER_ID: k + 1, LANDUSE: c.landuse, DESCR: c.description },
    geometry: toUtm(c.geometry),
  }));
  const files = shapefileFiles({ name: LAYER_NAME, features, prjWkt });
  files[`${LAYER_NAME}.dbf`] = encodeDbf(
    features.map((f) => f.properties),
    "UTF-8",
    DBF_DATE,
  );
  return zipSync(files, { level: 6, mtime: ZIP_TIME });
}
