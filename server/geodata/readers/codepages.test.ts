// Code pages named by a shapefile's .cpg.
import { describe, expect, it } from "vitest";
import { codePageFromCpg, makeDecoder, makeEncoder } from "./codepages";

const decode = (cpg: string | undefined, bytes: number[]) =>
  makeDecoder(codePageFromCpg(cpg)!)(new Uint8Array(bytes));

describe("shapefile code pages", () => {
  it("decodes windows-1252's 0x80–0x9F range (WHATWG index-windows-1252)", () => {
    // 0x80 €, 0x84 „, 0x93 “, 0x97 —, 0x9F Ÿ per the WHATWG Encoding Standard's index.
    expect(decode("1252", [0x80, 0x84, 0x93, 0x97, 0x9f])).toBe("€„“—Ÿ");
  });

  it.each(["1252", "ANSI 1252", "windows-1252", "ISO 88591", "8859-1", "latin1"])(
    "reads %s as windows-1252",
    (cpg) => expect(codePageFromCpg(cpg)).toEqual({ kind: "windows-1252" }),
  );

  it("reads UTF-8 when there is no .cpg", () => {
    expect(decode(undefined, [0xc3, 0xa9])).toBe("é");
  });

  it("reads other Windows code pages through the runtime's decoder", () => {
    // 0xC0 is А (Cyrillic capital A) in windows-1251.
    expect(decode("1251", [0xc0])).toBe("А");
  });

  it("knows no code page called OEM", () => {
    expect(codePageFromCpg("OEM")).toBeNull();
  });

  it("round-trips every windows-1252 character through its encoder", () => {
    const all = decode(
      "1252",
      Array.from({ length: 256 }, (_, b) => b),
    );
    expect(decode("1252", [...makeEncoder("windows-1252")(all)])).toBe(all);
  });
});
