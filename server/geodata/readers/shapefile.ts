/**
 * Zipped shapefile: one layer per zip. The archive must hold exactly one .shp with its .dbf
 * (attributes) and .prj (coordinate system) under the same base name; a .cpg names the text
 * code page of the .dbf (UTF-8 without one); the .shx is not needed. Several shapefiles in one
 * zip are refused with their names (which of them is meant is not ours to guess).
 * Geometry is parsed by shpjs; attributes by our dbf reader; the .prj reprojected with proj4.
 */
import type { Feature, Geometry } from "geojson";
import { parseShp } from "shpjs";
import { codePageFromCpg } from "./codepages";
import { readDbf } from "./dbf";
import { normalizeFeatures } from "./normalize";
import { crsFromPrj } from "./reproject";
import { ReadError, type OnProgress, type VectorReadResult } from "./types";
import { readZipMembers, type ZipMember } from "./zip";

const PARTS = ["shp", "shx", "dbf", "prj", "cpg"] as const;
type Part = (typeof PARTS)[number];

function extension(name: string): string {
  return name.slice(name.lastIndexOf(".") + 1).toLowerCase();
}

function fail(file: string, code: string, message: string): never {
  throw new ReadError(422, code, `${file}: ${message}`, file);
}

function pickLayer(members: readonly ZipMember[], file: string): Map<Part, ZipMember> {
  const shps = members.filter((m) => extension(m.baseName) === "shp");
  if (shps.length === 0)
    fail(file, "no-shp", "holds no .shp file; zip the .shp with its .dbf, .shx and .prj");
  if (shps.length > 1) {
    fail(
      file,
      "several-shp",
      `holds ${shps.length} shapefiles (${shps.map((m) => m.pathInZip).join(", ")}); upload one per zip`,
    );
  }
  const stem = shps[0]!.baseName.slice(0, -4).toLowerCase();
  const parts = new Map<Part, ZipMember>();
  for (const m of members) {
    const ext = extension(m.baseName) as Part;
    if (m.baseName.slice(0, -(ext.length + 1)).toLowerCase() !== stem) continue;
    if (parts.has(ext))
      fail(file, "duplicate-part", `holds two ${stem}.${ext} files in different folders`);
    parts.set(ext, m);
  }
  const missing = (["dbf", "prj"] as const).filter((p) => !parts.has(p));
  if (missing.length > 0) {
    const what = { dbf: ".dbf (the attribute table)", prj: ".prj (the coordinate system)" };
    fail(
      file,
      `missing-${missing[0]}`,
      `the shapefile ${shps[0]!.baseName} has no ${missing.map((p) => what[p]).join(" and no ")}`,
    );
  }
  return parts;
}

export async function readShapefileZip(
  filePath: string,
  file: string,
  onProgress?: OnProgress,
): Promise<VectorReadResult> {
  const members = await readZipMembers(filePath, file, (name) =>
    (PARTS as readonly string[]).includes(extension(name)),
  );
  const parts = pickLayer(members, file);
  const text = (p: Part) => {
    const m = parts.get(p);
    return m ? new TextDecoder().decode(m.bytes) : undefined;
  };
  const cpg = text("cpg");
  const page = codePageFromCpg(cpg);
  if (page === null)
    fail(file, "bad-cpg", `the .cpg names a code page Rillmark does not know ("${cpg?.trim()}")`);
  const crs = crsFromPrj(text("prj") ?? "", file);
  let geometries: (Geometry | null)[];
  try {
    geometries = parseShp(parts.get("shp")!.bytes);
  } catch (error) {
    fail(file, "bad-shp", `the .shp cannot be read (${(error as Error).message})`);
  }
  const table = readDbf(parts.get("dbf")!.bytes, page, `${file} (${parts.get("dbf")!.baseName})`);
  if (table.rows.length !== geometries.length) {
    fail(
      file,
      "shp-dbf-mismatch",
      `the .shp has ${geometries.length} shapes but the .dbf ${table.rows.length} rows; one of them is damaged`,
    );
  }
  const raw: Feature<Geometry | null, Record<string, unknown>>[] = geometries.map((g, k) => ({
    type: "Feature",
    geometry: g === null ? null : withoutBbox(g),
    properties: table.rows[k] ?? {},
  }));
  const total = raw.length;
  const { features, notes } = normalizeFeatures(
    raw,
    (n) => `${file}, feature ${n}`,
    crs.toWgs84,
    (done) => onProgress?.(done, total),
  );
  const extraNotes = parts.has("shx")
    ? []
    : [{ where: file, message: "no .shx index; read without it" }];
  return {
    format: "shapefile",
    features,
    fields: table.fields,
    notes: [
      ...(crs.toWgs84 ? [{ where: file, message: `reprojected from ${crs.name} to WGS84` }] : []),
      ...extraNotes,
      ...notes,
    ],
    sourceCrs: crs.name,
  };
}

/** shpjs adds a bbox to each geometry; it is recomputed downstream in WGS84, so drop it. */
function withoutBbox(g: Geometry): Geometry {
  const { bbox: _bbox, ...rest } = g;
  return rest as Geometry;
}
