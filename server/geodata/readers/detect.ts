/**
 * What kind of file an upload is, from its first bytes (and, for a zip, its member names),
 * checked against its name's extension. A file whose bytes and name disagree is refused with
 * both named: a mislabelled file is more often a mistake than a trick, and either way the
 * message tells the user what to fix.
 */
import { open } from "node:fs/promises";
import { ReadError, type FileFormat } from "./types";
import { listZip } from "./zip";

const BY_EXTENSION: Record<string, FileFormat> = {
  zip: "shapefile",
  kml: "kml",
  kmz: "kmz",
  gpx: "gpx",
  geojson: "geojson",
  json: "geojson",
  tif: "geotiff",
  tiff: "geotiff",
  csv: "csv",
};

const LABEL: Record<FileFormat, string> = {
  shapefile: "a zipped shapefile",
  kml: "KML",
  kmz: "KMZ",
  gpx: "GPX",
  geojson: "GeoJSON",
  geotiff: "a GeoTIFF",
  csv: "a CSV table",
};

async function head(filePath: string, size: number): Promise<Uint8Array> {
  const handle = await open(filePath, "r");
  try {
    const buffer = new Uint8Array(size);
    const { bytesRead } = await handle.read(buffer, 0, size, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

const startsWith = (bytes: Uint8Array, sig: readonly number[]) =>
  sig.every((b, k) => bytes[k] === b);

/** What the bytes say, before a zip is opened: "zip" needs its member names to decide. */
function sniff(bytes: Uint8Array): FileFormat | "zip" | "xml" | "unknown" {
  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04]) || startsWith(bytes, [0x50, 0x4b, 0x05, 0x06]))
    return "zip";
  // Classic TIFF (42) and BigTIFF (43), little- and big-endian (TIFF 6.0 section 2; BigTIFF).
  if (
    [
      [0x49, 0x49, 42, 0],
      [0x4d, 0x4d, 0, 42],
      [0x49, 0x49, 43, 0],
      [0x4d, 0x4d, 0, 43],
    ].some((s) => startsWith(bytes, s))
  ) {
    return "geotiff";
  }
  if (bytes.includes(0)) return "unknown"; // binary, and none of ours
  const text = new TextDecoder()
    .decode(bytes)
    .replace(/^\uFEFF/, "")
    .trimStart();
  if (text.startsWith("<")) return "xml";
  if (text.startsWith("{")) return "geojson";
  if (text.startsWith("[")) return "unknown"; // JSON, but no GeoJSON object is an array
  return text.length > 0 ? "csv" : "unknown";
}

/** The root element of an XML head: skips the declaration, comments and a doctype. */
function xmlRoot(bytes: Uint8Array): string | null {
  const text = new TextDecoder()
    .decode(bytes)
    .replace(/<\?[\s\S]*?\?>|<!--[\s\S]*?-->|<![^>]*>/g, "");
  const name = /<\s*([A-Za-z_][\w.-]*:)?([A-Za-z_][\w.-]*)/.exec(text)?.[2];
  return name?.toLowerCase() ?? null;
}

export async function detectFormat(filePath: string, originalName: string): Promise<FileFormat> {
  const ext = originalName.includes(".")
    ? originalName.slice(originalName.lastIndexOf(".") + 1).toLowerCase()
    : "";
  const named = BY_EXTENSION[ext];
  const refuse = (message: string): never => {
    throw new ReadError(415, "unsupported-file", `${originalName}: ${message}`, originalName);
  };
  if (named === undefined) {
    return refuse(
      ext === "shp"
        ? "a shapefile must be uploaded as a .zip holding its .shp, .dbf, .shx and .prj"
        : "is not a file type Rillmark reads (zipped shapefile, KML, KMZ, GPX, GeoJSON, GeoTIFF, CSV)",
    );
  }
  const bytes = await head(filePath, 4096);
  let found = sniff(bytes);
  if (found === "zip") {
    const names = (await listZip(filePath, originalName)).map((n) => n.toLowerCase());
    found = names.some((n) => n.endsWith(".shp"))
      ? "shapefile"
      : names.some((n) => n.endsWith(".kml"))
        ? "kmz"
        : "unknown";
    if (found === "unknown")
      return refuse("is a zip archive with neither a .shp nor a .kml inside");
  } else if (found === "xml") {
    const root = xmlRoot(bytes);
    found = root === "kml" ? "kml" : root === "gpx" ? "gpx" : "unknown";
    if (found === "unknown")
      return refuse(`is XML with a <${root ?? "?"}> root, neither KML nor GPX`);
  }
  if (found === "unknown") return refuse(`its contents are not ${LABEL[named]}`);
  if (found !== named)
    return refuse(`is named as ${LABEL[named]} (.${ext}) but its contents are ${LABEL[found]}`);
  return found;
}
