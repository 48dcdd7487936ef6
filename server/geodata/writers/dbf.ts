/**
 * Encodes the attribute half of a shapefile: a dBASE III table (.dbf), with text in a chosen
 * code page that the .cpg names. Field types are inferred from the values: numbers → N (integer
 * or with as many decimals as the values need, at most 10), booleans → L, anything else → C.
 * Field names are cut to dBASE's 10 characters and made unique.
 */
import { makeEncoder } from "../readers/codepages";

export type DbfEncoding = "UTF-8" | "windows-1252" | "ISO-8859-1";

/** The .cpg text for each encoding (the code-page names GIS packages write and read). */
export const CPG_TEXT: Record<DbfEncoding, string> = {
  "UTF-8": "UTF-8",
  "windows-1252": "1252",
  "ISO-8859-1": "ISO 88591",
};

interface Field {
  readonly key: string;
  readonly name: string;
  readonly type: "C" | "N" | "L";
  readonly length: number;
  readonly decimals: number;
}

type Row = Readonly<Record<string, unknown>>;

function decimalsOf(value: number): number {
  if (Number.isInteger(value)) return 0;
  const text = String(value);
  const dot = text.indexOf(".");
  return text.includes("e") ? 10 : Math.min(10, dot < 0 ? 0 : text.length - dot - 1);
}

function fieldsOf(rows: readonly Row[], encode: (t: string) => Uint8Array): Field[] {
  const keys: string[] = [];
  for (const row of rows)
    for (const key of Object.keys(row)) if (!keys.includes(key)) keys.push(key);
  const used = new Set<string>();
  return keys.map((key) => {
    const values = rows.map((r) => r[key]).filter((v) => v !== null && v !== undefined);
    let name = key.replace(/[^A-Za-z0-9_]/g, "_").slice(0, 10) || "FIELD";
    for (let n = 1; used.has(name.toUpperCase()); n += 1) name = `${name.slice(0, 8)}_${n}`;
    used.add(name.toUpperCase());
    if (values.length > 0 && values.every((v) => typeof v === "boolean")) {
      return { key, name, type: "L", length: 1, decimals: 0 };
    }
    if (values.length > 0 && values.every((v) => typeof v === "number" && Number.isFinite(v))) {
      const decimals = Math.max(...values.map((v) => decimalsOf(v as number)));
      return { key, name, type: "N", length: 20, decimals };
    }
    const longest = Math.max(1, ...values.map((v) => encode(String(v)).length));
    if (longest > 254) throw new RangeError(`field "${key}": a value is over 254 bytes`);
    return { key, name, type: "C", length: longest, decimals: 0 };
  });
}

function cell(field: Field, value: unknown, encode: (t: string) => Uint8Array): Uint8Array {
  const out = new Uint8Array(field.length).fill(0x20);
  if (value === null || value === undefined) return out;
  if (field.type === "L") {
    out[0] = value ? 0x54 : 0x46; // T / F
    return out;
  }
  if (field.type === "N") {
    const text = (value as number).toFixed(field.decimals);
    if (text.length > field.length) throw new RangeError(`field "${field.key}": ${text} too wide`);
    out.set(encode(text), field.length - text.length); // numbers are right-aligned
    return out;
  }
  out.set(encode(String(value)), 0);
  return out;
}

/** The .dbf bytes for rows of attributes (one per feature, in order). */
export function encodeDbf(
  rows: readonly Row[],
  encoding: DbfEncoding,
  today = new Date(),
): Uint8Array {
  const encode = makeEncoder(encoding);
  const fields = fieldsOf(rows, encode);
  const headerLength = 32 + fields.length * 32 + 1;
  const recordLength = 1 + fields.reduce((n, f) => n + f.length, 0);
  const out = new Uint8Array(headerLength + rows.length * recordLength + 1);
  const view = new DataView(out.buffer);
  view.setUint8(0, 0x03); // dBASE III without memo
  view.setUint8(1, today.getUTCFullYear() - 1900);
  view.setUint8(2, today.getUTCMonth() + 1);
  view.setUint8(3, today.getUTCDate());
  view.setUint32(4, rows.length, true);
  view.setUint16(8, headerLength, true);
  view.setUint16(10, recordLength, true);
  fields.forEach((f, k) => {
    const at = 32 + k * 32;
    for (let c = 0; c < f.name.length; c += 1) out[at + c] = f.name.charCodeAt(c);
    out[at + 11] = f.type.charCodeAt(0);
    out[at + 16] = f.length;
    out[at + 17] = f.decimals;
  });
  out[headerLength - 1] = 0x0d; // end of field descriptors
  rows.forEach((row, r) => {
    let at = headerLength + r * recordLength;
    out[at] = 0x20; // not deleted
    at += 1;
    for (const f of fields) {
      out.set(cell(f, row[f.key], encode), at);
      at += f.length;
    }
  });
  out[out.length - 1] = 0x1a; // end of file
  return out;
}
