/**
 * A routed terrain as one compact binary object, to be computed once per terrain version and
 * reused by every click: "RMFLOW", a format version, a JSON header (grid size, georeferencing,
 * the conditioning report, each section's byte length), then the direction and conditioning
 * codes (1 byte a cell each), accumulation (uint32) and flow length (float32), each compressed
 * with raw deflate at level 1 (fast; codes and counts shrink well, lengths little). Cell sizes
 * are not stored: they follow from the georeferencing (cell-metrics.ts). Reading checks the
 * header with zod and every section's length, so a truncated or foreign object is refused.
 */
import { deflateRawSync, inflateRawSync } from "node:zlib";
import { z } from "zod";
import { conditioningReportSchema } from "../../shared/schemas/delineation";
import { cellMetrics } from "./cell-metrics";
import { MAX_CELLS } from "./errors";
import type { RoutedGrid } from "./types";

const MAGIC = "RMFLOW";
const VERSION = 1;

const headerSchema = z.strictObject({
  width: z.number().int().min(1),
  height: z.number().int().min(1),
  georef: z.strictObject({
    epsg: z.number().int(),
    originX: z.number().finite(),
    originY: z.number().finite(),
    pixelSizeX: z.number().positive(),
    pixelSizeY: z.number().positive(),
  }),
  report: conditioningReportSchema,
  sections: z.array(z.number().int().min(0)).length(4),
});

const SECTIONS = ["dir", "cond", "acc", "flowLenM"] as const;

export function encodeRouted(routed: RoutedGrid): Buffer {
  const bodies = SECTIONS.map((name) => {
    const a = routed[name];
    return deflateRawSync(new Uint8Array(a.buffer, a.byteOffset, a.byteLength), { level: 1 });
  });
  const header = Buffer.from(
    JSON.stringify({
      width: routed.width,
      height: routed.height,
      georef: routed.georef,
      report: routed.report,
      sections: bodies.map((b) => b.length),
    }),
  );
  const lead = Buffer.alloc(MAGIC.length + 1 + 4);
  lead.write(MAGIC, 0, "latin1");
  lead.writeUInt8(VERSION, MAGIC.length);
  lead.writeUInt32LE(header.length, MAGIC.length + 1);
  return Buffer.concat([lead, header, ...bodies]);
}

export class StoredGridError extends Error {}

export function decodeRouted(bytes: Uint8Array): RoutedGrid {
  const buf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const fail = (why: string): never => {
    throw new StoredGridError(`stored terrain flow grids are unusable: ${why}`);
  };
  if (buf.length < MAGIC.length + 5 || buf.toString("latin1", 0, MAGIC.length) !== MAGIC) {
    fail("not a Rillmark flow-grid object");
  }
  if (buf.readUInt8(MAGIC.length) !== VERSION)
    fail(`format version ${buf.readUInt8(MAGIC.length)}`);
  const headerLength = buf.readUInt32LE(MAGIC.length + 1);
  let at = MAGIC.length + 5;
  let parsed;
  try {
    parsed = headerSchema.safeParse(JSON.parse(buf.toString("utf8", at, at + headerLength)));
  } catch {
    return fail("its header is not JSON");
  }
  if (!parsed.success) return fail(`its header is wrong (${parsed.error.issues[0]!.message})`);
  const header = parsed.data;
  const cells = header.width * header.height;
  if (cells > MAX_CELLS) fail(`${cells} cells is more than the engine computes`);
  at += headerLength;
  const sizes = [1, 1, 4, 4];
  const raw = header.sections.map((length, k) => {
    if (at + length > buf.length) fail(`section ${SECTIONS[k]} is cut short`);
    const out = inflateRawSync(buf.subarray(at, at + length));
    at += length;
    if (out.length !== cells * sizes[k]!) fail(`section ${SECTIONS[k]} has the wrong size`);
    // A fresh, aligned buffer for the typed array views.
    return new Uint8Array(out).buffer;
  });
  return {
    width: header.width,
    height: header.height,
    georef: header.georef,
    metrics: cellMetrics(header.georef, header.width, header.height),
    dir: new Uint8Array(raw[0]!),
    cond: new Uint8Array(raw[1]!),
    acc: new Uint32Array(raw[2]!),
    flowLenM: new Float32Array(raw[3]!),
    report: header.report,
  };
}
