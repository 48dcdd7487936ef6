// Zip defences, on hostile archives made by the fixture script and here.
import { describe, expect, it } from "vitest";
import { zipSync } from "fflate";
import { listZip, readZipMembers, ZIP_LIMITS } from "./zip";
import { fixture, readErrorOf, tempDir, writeTemp } from "./test-support";

const all = () => true;

describe("zip defences", () => {
  it("refuses a truncated archive as not a complete zip", async () => {
    const error = await readErrorOf(() =>
      readZipMembers(fixture("truncated.zip"), "cover.zip", all),
    );
    expect([error.status, error.code]).toEqual([422, "bad-zip"]);
    expect(error.message).toBe("cover.zip: is not a complete zip archive (truncated or damaged)");
  });

  it("refuses an entry that climbs out of the archive with ../, naming it", async () => {
    const error = await readErrorOf(() => listZip(fixture("zip-slip.zip"), "cover.zip"));
    expect([error.status, error.code]).toEqual([422, "zip-unsafe-name"]);
    expect(error.message).toContain('"../evil.shp"');
  });

  it("refuses an absolute entry name", async () => {
    const dir = tempDir();
    const path = writeTemp(dir, "abs.zip", zipSync({ "/etc/cover.shp": new Uint8Array(10) }));
    const error = await readErrorOf(() => listZip(path, "abs.zip"));
    expect(error.code).toBe("zip-unsafe-name");
  });

  it("refuses a member that inflates ~1000:1 before inflating it", async () => {
    const error = await readErrorOf(() =>
      readZipMembers(fixture("zip-bomb.zip"), "cover.zip", all),
    );
    expect([error.status, error.code]).toEqual([422, "zip-bomb"]);
    expect(error.message).toMatch(/"cover\.shp" would inflate \d+ times \(40 MB\)/);
  });

  it("refuses an archive whose declared total is over the limit (413)", async () => {
    const path = writeTemp(
      tempDir(),
      "big.zip",
      zipSync({ a: new Uint8Array(3000), b: new Uint8Array(3000) }),
    );
    const limits = { ...ZIP_LIMITS, maxTotalBytes: 5000 };
    const error = await readErrorOf(() => readZipMembers(path, "big.zip", all, limits));
    expect([error.status, error.code]).toEqual([413, "zip-too-large"]);
  });

  it("refuses an archive with more entries than the limit (413)", async () => {
    const files = Object.fromEntries(
      Array.from({ length: 12 }, (_, k) => [`f${k}.txt`, new Uint8Array(1)]),
    );
    const path = writeTemp(tempDir(), "many.zip", zipSync(files));
    const error = await readErrorOf(() =>
      listZip(path, "many.zip", { ...ZIP_LIMITS, maxEntries: 10 }),
    );
    expect([error.status, error.code]).toEqual([413, "zip-too-many-entries"]);
  });

  it("counts the real bytes: a member whose header under-declares its size is stopped", async () => {
    // Patch the central directory's uncompressed size of the only member down to 10 bytes.
    const bytes = zipSync({ "a.shp": new Uint8Array(5000).fill(7) });
    const view = new DataView(bytes.buffer);
    for (let at = bytes.length - 22; at >= 0; at -= 1) {
      if (view.getUint32(at, true) === 0x02014b50) {
        view.setUint32(at + 24, 10, true);
        break;
      }
    }
    const path = writeTemp(tempDir(), "liar.zip", bytes);
    const error = await readErrorOf(() => readZipMembers(path, "liar.zip", all));
    expect([error.status, error.code]).toEqual([422, "bad-zip"]);
  });

  it("refuses an encrypted member", async () => {
    // Set bit 0 (encrypted) of the general purpose flag in the central directory header.
    const bytes = zipSync({ "a.shp": new Uint8Array(10) });
    const view = new DataView(bytes.buffer);
    for (let at = bytes.length - 22; at >= 0; at -= 1) {
      if (view.getUint32(at, true) === 0x02014b50) {
        view.setUint16(at + 8, view.getUint16(at + 8, true) | 1, true);
        break;
      }
    }
    const error = await readErrorOf(() =>
      listZip(writeTemp(tempDir(), "enc.zip", bytes), "enc.zip"),
    );
    expect([error.code, error.message]).toEqual([
      "zip-encrypted",
      'enc.zip: "a.shp" is encrypted; upload it without a password',
    ]);
  });

  it("keeps members in memory by base name, folders inside the zip ignored", async () => {
    const path = writeTemp(
      tempDir(),
      "nested.zip",
      zipSync({ "data/layer/cover.prj": new TextEncoder().encode("x") }),
    );
    const [member] = await readZipMembers(path, "nested.zip", all);
    expect([member?.baseName, member?.pathInZip]).toEqual(["cover.prj", "data/layer/cover.prj"]);
  });
});
