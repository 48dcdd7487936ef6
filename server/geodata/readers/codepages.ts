/**
 * Text code pages of shapefile attribute tables (.dbf), as named by a .cpg file.
 *
 * windows-1252 is decoded and encoded with our own table: Node 20's TextDecoder drops the bytes
 * 0x80–0x9F of windows-1252 (€, “ ”, —, …), which are common in real attribute tables. The table
 * is index-windows-1252 of the WHATWG Encoding Standard; that standard also maps the labels
 * "iso-8859-1", "latin1" and "ascii" to windows-1252, and so do we. Other code pages go through
 * TextDecoder, which decodes them correctly.
 */

/** U+ code points of bytes 0x80–0x9F in windows-1252 (WHATWG index-windows-1252). */
const HIGH_1252 = [
  0x20ac, 0x81, 0x201a, 0x192, 0x201e, 0x2026, 0x2020, 0x2021, 0x2c6, 0x2030, 0x160, 0x2039, 0x152,
  0x8d, 0x17d, 0x8f, 0x90, 0x2018, 0x2019, 0x201c, 0x201d, 0x2022, 0x2013, 0x2014, 0x2dc, 0x2122,
  0x161, 0x203a, 0x153, 0x9d, 0x17e, 0x178,
];

const CHARS_1252 = Array.from({ length: 256 }, (_, b) =>
  String.fromCodePoint(b >= 0x80 && b < 0xa0 ? (HIGH_1252[b - 0x80] ?? b) : b),
);
const BYTES_1252 = new Map(CHARS_1252.map((ch, b) => [ch, b]));

export type CodePage =
  { readonly kind: "windows-1252" } | { readonly kind: "decoder"; readonly label: string };

const LATIN = new Set([
  "1252",
  "windows-1252",
  "cp1252",
  "ansi 1252",
  "8859-1",
  "88591",
  "iso-8859-1",
  "iso 88591",
  "iso8859-1",
  "latin1",
  "ascii",
  "us-ascii",
]);

/**
 * The code page a .cpg names (UTF-8 when there is no .cpg, the usual default of current GIS
 * packages), or null when neither we nor the runtime know it.
 */
export function codePageFromCpg(cpg: string | undefined): CodePage | null {
  const name = (cpg ?? "UTF-8").trim().toLowerCase().replace(/\s+/g, " ");
  if (LATIN.has(name)) return { kind: "windows-1252" };
  if (name === "65001" || name === "cp65001") return { kind: "decoder", label: "utf-8" }; // Windows' UTF-8
  const numeric = /^(?:ansi |cp)?(\d{3,4})$/.exec(name);
  const label = numeric ? `windows-${numeric[1]}` : name.replace(/^iso (\d)/, "iso-$1");
  try {
    new TextDecoder(label);
    return { kind: "decoder", label };
  } catch {
    return null;
  }
}

export function makeDecoder(page: CodePage): (bytes: Uint8Array) => string {
  if (page.kind === "windows-1252") {
    return (bytes) => {
      let out = "";
      for (const b of bytes) out += CHARS_1252[b];
      return out;
    };
  }
  const decoder = new TextDecoder(page.label);
  return (bytes) => decoder.decode(bytes);
}

/** Encoder for writing: UTF-8, windows-1252 or ISO-8859-1 (U+0000–U+00FF as themselves). */
export function makeEncoder(
  encoding: "UTF-8" | "windows-1252" | "ISO-8859-1",
): (text: string) => Uint8Array {
  if (encoding === "UTF-8") {
    const utf8 = new TextEncoder();
    return (text) => utf8.encode(text);
  }
  return (text) =>
    Uint8Array.from([...text], (ch) => {
      const byte = encoding === "windows-1252" ? BYTES_1252.get(ch) : ch.codePointAt(0);
      if (byte === undefined || byte > 0xff) {
        throw new RangeError(`"${ch}" cannot be written in ${encoding}`);
      }
      return byte;
    });
}
