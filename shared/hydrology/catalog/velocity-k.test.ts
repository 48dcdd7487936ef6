import { describe, expect, it } from "vitest";
import { M_PER_FT } from "../units";
import { VELOCITY_K, velocityKRow } from "./velocity-k";

/** Decimal places of a number as written in the data (the precision the document prints). */
function decimalsOf(x: number): number {
  const [, frac = ""] = String(x).split(".");
  return frac.length;
}

/** Half a unit in the last printed place, plus float slack. */
function halfUlp(printed: number): number {
  return 0.5 * 10 ** -decimalsOf(printed) + 1e-12;
}

describe("velocity coefficients k (V = k·s^0.5)", () => {
  // NEH Part 630 Ch 15 (2010) Table 15-3 [from memory]: k = (1.486/n)·r^(2/3) with the
  // tabulated n and hydraulic radius r (0.2 ft, 0.4 ft for grassed waterways). Tolerance: half
  // a unit in the last printed digit (the table prints 4 significant figures; the pavement and
  // grassed waterway rows carry the 6-figure TR-55 coefficients 20.3282 and 16.1345).
  const withManning = VELOCITY_K.flatMap((row) =>
    row.manning === undefined ? [] : [{ row, manning: row.manning }],
  );

  it.each(withManning)("$row.id equals (1.486/n)·r^(2/3) as printed", ({ row, manning }) => {
    const k = (1.486 / manning.n) * manning.hydraulicRadiusFt ** (2 / 3);
    expect(Math.abs(k - row.kFtPerS)).toBeLessThanOrEqual(halfUlp(row.kFtPerS));
  });

  it("uses the NEH n and r of each Table 15-3 row [from memory]", () => {
    const table = VELOCITY_K.filter((r) => r.table === "neh-630-15-3").map((r) => [
      r.kFtPerS,
      r.manning?.n,
      r.manning?.hydraulicRadiusFt,
    ]);
    expect(table).toEqual([
      [20.3282, 0.025, 0.2],
      [16.1345, 0.05, 0.4],
      [9.965, 0.051, 0.2],
      [8.762, 0.058, 0.2],
      [6.962, 0.073, 0.2],
      [5.032, 0.101, 0.2],
      [2.516, 0.202, 0.2],
    ]);
  });

  it("TR-55 (1986) Figure 3-1 paved/unpaved equal the NEH pavement/grassed waterway rows", () => {
    // TR-55 Appendix F [from memory]: paved n 0.025, r 0.2 ft; unpaved n 0.05, r 0.4 ft.
    expect(velocityKRow("tr55-paved").kFtPerS).toBe(20.3282);
    expect(velocityKRow("tr55-unpaved").kFtPerS).toBe(16.1345);
    expect(velocityKRow("neh-pavement-upland-gullies").kFtPerS).toBe(20.3282);
    expect(velocityKRow("neh-grassed-waterway").kFtPerS).toBe(16.1345);
  });

  it("SI k is the US k times 0.3048 (k is a velocity; s is dimensionless) [derived]", () => {
    for (const row of VELOCITY_K) {
      expect(row.kMPerS).toBeCloseTo(row.kFtPerS * 0.3048, 12);
    }
    expect(M_PER_FT).toBe(0.3048);
  });

  // METHODS.md lists the NEH 630 Ch 15 (2010) Table 15-3 m/s column [from memory], 3 decimals.
  const printedMPerS: readonly (readonly [string, number])[] = [
    ["neh-pavement-upland-gullies", 6.196],
    ["neh-grassed-waterway", 4.918],
    ["neh-nearly-bare-untilled", 3.037],
    ["neh-cultivated-straight-row", 2.671],
    ["neh-short-grass-pasture", 2.122],
    ["neh-min-tillage-woodland", 1.534],
    ["neh-forest-litter-hay-meadow", 0.767],
  ];

  it.each(printedMPerS)("%s: published m/s k = k_US·0.3048 to 3 decimals", (id, printed) => {
    const row = VELOCITY_K.find((r) => r.id === id);
    expect(row?.printedSi?.k).toBe(printed);
    expect(Math.abs((row?.kMPerS ?? NaN) - printed)).toBeLessThanOrEqual(0.0005 + 1e-12);
  });

  it("HEC-22 printed SI k (slope in percent) = k_US·0.3048/10 to 3 decimals [from memory]", () => {
    // V = Ku·k·Sp^0.5 with Sp = 100·s, so k_percent = kMPerS / √100.
    const hec = VELOCITY_K.filter((r) => r.table === "hec-22");
    expect(hec.map((r) => r.kFtPerS)).toEqual([2.5, 5, 7, 9, 10, 15, 16.1, 20.3]);
    for (const row of hec) {
      expect(row.printedSi?.slopeUnit).toBe("percent");
      const printed = row.printedSi?.k ?? NaN;
      expect(Math.abs(row.kMPerS / 10 - printed)).toBeLessThanOrEqual(0.0005 + 1e-12);
    }
  });

  it("ids are unique and every row names its source", () => {
    expect(new Set(VELOCITY_K.map((r) => r.id)).size).toBe(VELOCITY_K.length);
    for (const row of VELOCITY_K) {
      expect(row.source).toMatch(/\S/);
      expect(row.kFtPerS).toBeGreaterThan(0);
    }
  });
});
