/**
 * Reads the members of an uploaded zip archive (zipped shapefile, KMZ) into memory, with the
 * defences a server needs against hostile archives:
 * - the central directory is checked before anything is inflated: entry count, the declared
 *   total uncompressed size, a per-entry compression ratio that only a zip bomb reaches, no
 *   encrypted entries, and no name that is absolute or climbs out with `..`;
 * - while inflating, the real bytes are counted against the declared sizes (yauzl) and against
 *   the total budget, and reading stops past it;
 * - a name from inside the archive is never used as a file path: members are kept in memory,
 *   keyed by their base name.
 */
import {
  getFileNameLowLevel,
  openPromise,
  validateFileName,
  type Entry,
  type ZipFile,
} from "yauzl";
import { ReadError } from "./types";

export interface ZipLimits {
  readonly maxEntries: number;
  readonly maxTotalBytes: number;
  /** Entries larger than `ratioAppliesAboveBytes` may not inflate more than this many times. */
  readonly maxRatio: number;
  readonly ratioAppliesAboveBytes: number;
}

// Deflate cannot exceed about 1032:1; real GIS data (even blank-padded .dbf text) stays far
// below 200:1 at this size, so a larger ratio on a large member means a bomb.
export const ZIP_LIMITS: ZipLimits = {
  maxEntries: 1000,
  maxTotalBytes: 1024 ** 3,
  maxRatio: 200,
  ratioAppliesAboveBytes: 32 * 1024 ** 2,
};

/** A member of the archive: its base name and its folder inside the archive (for messages). */
export interface ZipMember {
  readonly baseName: string;
  readonly pathInZip: string;
  readonly bytes: Uint8Array;
}

const MB = (n: number) => `${(n / 1024 ** 2).toFixed(0)} MB`;

function refuse(status: 413 | 422, code: string, file: string, message: string): never {
  throw new ReadError(status, code, `${file}: ${message}`, file);
}

async function openZip(filePath: string, file: string): Promise<ZipFile> {
  try {
    return await openPromise(filePath, {
      lazyEntries: true,
      decodeStrings: false,
      validateEntrySizes: true,
      autoClose: false,
    });
  } catch {
    return refuse(422, "bad-zip", file, "is not a complete zip archive (truncated or damaged)");
  }
}

function entryName(entry: Entry): string {
  const raw = entry.fileName as unknown as Buffer;
  return getFileNameLowLevel(entry.generalPurposeBitFlag, raw, entry.extraFields, false);
}

/** Lists the archive's file names (folders and macOS resource forks left out), checked. */
async function checkedEntries(
  zip: ZipFile,
  file: string,
  limits: ZipLimits,
): Promise<Array<{ entry: Entry; name: string }>> {
  if (zip.entryCount > limits.maxEntries) {
    refuse(
      413,
      "zip-too-many-entries",
      file,
      `holds ${zip.entryCount} files; the limit is ${limits.maxEntries}`,
    );
  }
  const out: Array<{ entry: Entry; name: string }> = [];
  let total = 0;
  try {
    for await (const entry of zip.eachEntry()) {
      const name = entryName(entry);
      const unsafe = validateFileName(name.replace(/\\/g, "/"));
      if (unsafe !== null || name.includes("\0")) {
        refuse(
          422,
          "zip-unsafe-name",
          file,
          `holds "${name}", a name that points outside the archive; refused`,
        );
      }
      if (name.endsWith("/") || name.startsWith("__MACOSX/")) continue;
      if (entry.isEncrypted())
        refuse(422, "zip-encrypted", file, `"${name}" is encrypted; upload it without a password`);
      total += entry.uncompressedSize;
      if (total > limits.maxTotalBytes) {
        refuse(
          413,
          "zip-too-large",
          file,
          `would unpack to more than ${MB(limits.maxTotalBytes)}; the limit`,
        );
      }
      const ratio = entry.uncompressedSize / Math.max(1, entry.compressedSize);
      if (entry.uncompressedSize > limits.ratioAppliesAboveBytes && ratio > limits.maxRatio) {
        refuse(
          422,
          "zip-bomb",
          file,
          `"${name}" would inflate ${Math.round(ratio)} times (${MB(entry.uncompressedSize)}); refused as a zip bomb`,
        );
      }
      out.push({ entry, name });
    }
  } catch (error) {
    if (error instanceof ReadError) throw error;
    refuse(422, "bad-zip", file, "is not a complete zip archive (truncated or damaged)");
  }
  return out;
}

async function inflate(
  zip: ZipFile,
  entry: Entry,
  name: string,
  file: string,
  budget: { left: number },
): Promise<Uint8Array> {
  const chunks: Buffer[] = [];
  try {
    const stream = await zip.openReadStreamPromise(entry);
    for await (const chunk of stream as AsyncIterable<Buffer>) {
      budget.left -= chunk.length;
      if (budget.left < 0) {
        stream.destroy();
        refuse(413, "zip-too-large", file, `"${name}" unpacks past the size limit`);
      }
      chunks.push(chunk);
    }
  } catch (error) {
    if (error instanceof ReadError) throw error;
    refuse(
      422,
      "bad-zip",
      file,
      `"${name}" cannot be unpacked: the archive is truncated or damaged`,
    );
  }
  return new Uint8Array(Buffer.concat(chunks));
}

/** The base names of the archive's files, after the safety checks (no inflating). */
export async function listZip(
  filePath: string,
  file: string,
  limits = ZIP_LIMITS,
): Promise<string[]> {
  const zip = await openZip(filePath, file);
  try {
    return (await checkedEntries(zip, file, limits)).map(({ name }) => name);
  } finally {
    zip.close();
  }
}

/** Inflates the members whose base name `want` accepts (names compared by the caller). */
export async function readZipMembers(
  filePath: string,
  file: string,
  want: (baseName: string) => boolean,
  limits = ZIP_LIMITS,
): Promise<ZipMember[]> {
  const zip = await openZip(filePath, file);
  try {
    const entries = await checkedEntries(zip, file, limits);
    const budget = { left: limits.maxTotalBytes };
    const members: ZipMember[] = [];
    for (const { entry, name } of entries) {
      const baseName = name.slice(name.lastIndexOf("/") + 1);
      if (!want(baseName)) continue;
      members.push({
        baseName,
        pathInZip: name,
        bytes: await inflate(zip, entry, name, file, budget),
      });
    }
    return members;
  } finally {
    zip.close();
  }
}
