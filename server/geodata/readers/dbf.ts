/**
 * Reads a shapefile's attribute table (dBASE III/IV .dbf) with the code page its .cpg names.
 * Our own reader rather than shpjs's parseDbf: that one decodes through TextDecoder, which
 * loses windows-1252 text on Node 20 (see codepages.ts), and it cannot say which record or
 * field is broken. Layout: dBASE III file structure (32-byte header, 32-byte field
 * descriptors ended by 0x0D, fixed-width records each led by a deletion flag).
 */
import { makeDecoder, type CodePage } from "./codepages";
import { ReadError } from "./types";

export interface DbfTable {
  readonly fields: readonly string[];
  readonly rows: readonly Record<string, string | number | boolean | null>[];
}

interface FieldSpec {
  readonly name: string;
  readonly type: string;
  readonly offset: number;
  readonly length: number;
}

function fail(file: string, message: string): never {
  throw new ReadError(422, "bad-dbf", `${file}: ${message}`, file);
}

function value(type: string, text: string): string | number | boolean | null {
  const trimmed = text.trim();
  switch (type) {
    case "N":
    case "F": {
      if (trimmed === "" || /^\*+$/.test(trimmed)) return null; // blank or overflow marker
      const n = Number(trimmed);
      return Number.isFinite(n) ? n : null;
    }
    case "L":
      return /^[YyTt]$/.test(trimmed) ? true : /^[NnFf]$/.test(trimmed) ? false : null;
    case "D":
      // YYYYMMDD kept as an ISO date string: a date has no time zone to get wrong.
      return /^\d{8}$/.test(trimmed)
        ? `${trimmed.slice(0, 4)}-${trimmed.slice(4, 6)}-${trimmed.slice(6, 8)}`
        : null;
    default:
      return trimmed === "" ? null : trimmed.replace(/\0+$/, "");
  }
}

export function readDbf(bytes: Uint8Array, page: CodePage, file: string): DbfTable {
  if (bytes.length < 33) fail(file, "is too short to be a dBASE table");
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const records = view.getUint32(4, true);
  const headerLength = view.getUint16(8, true);
  const recordLength = view.getUint16(10, true);
  if (headerLength < 33 || headerLength > bytes.length) fail(file, "has a broken header");
  const decode = makeDecoder(page);
  const specs: FieldSpec[] = [];
  let offset = 1; // after the deletion flag
  for (let at = 32; at + 32 <= headerLength && bytes[at] !== 0x0d; at += 32) {
    const raw = bytes.subarray(at, at + 11);
    const end = raw.indexOf(0);
    const name = decode(raw.subarray(0, end < 0 ? 11 : end)).trim();
    const length = bytes[at + 16] ?? 0;
    specs.push({ name, type: String.fromCharCode(bytes[at + 11] ?? 0x43), offset, length });
    offset += length;
  }
  if (offset !== recordLength)
    fail(file, `fields add up to ${offset} bytes, records are ${recordLength}`);
  if (headerLength + records * recordLength > bytes.length) {
    fail(file, `declares ${records} records but ends before the last one (file truncated?)`);
  }
  const rows: Record<string, string | number | boolean | null>[] = [];
  for (let r = 0; r < records; r += 1) {
    const start = headerLength + r * recordLength;
    const row: Record<string, string | number | boolean | null> = {};
    for (const spec of specs) {
      const text = decode(bytes.subarray(start + spec.offset, start + spec.offset + spec.length));
      row[spec.name] = value(spec.type, text);
    }
    rows.push(row);
  }
  return { fields: specs.map((s) => s.name), rows };
}
