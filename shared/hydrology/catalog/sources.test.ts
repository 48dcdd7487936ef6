import { describe, expect, it } from "vitest";
import * as catalog from "./index";

// Project rule: every value names its source (document, table, edition) and flags how it is
// known: "from memory", "derived" or "common practice".
const FLAG = /from memory|\[derived\]|common practice/i;
const DOCUMENT =
  /TR-55 \(1986\)|NEH Part 630 Ch 15 \(2010\)|HEC-22 \(3rd ed\., 2009\)|Kerby \(1959\)/;

const rows: { id: string; source: string }[] = [
  ...catalog.SHEET_FLOW_N,
  ...catalog.VELOCITY_K,
  ...catalog.CURVE_NUMBERS,
  ...catalog.RUNOFF_C,
  ...catalog.KERBY_N,
];

describe("sources of the catalog defaults", () => {
  it.each(rows)("$id names a document with edition and a flag", (row) => {
    expect(row.source).toMatch(DOCUMENT);
    expect(row.source).toMatch(FLAG);
  });

  it("nested sources (Manning n and r, printed SI k, design C) are flagged too", () => {
    for (const row of catalog.VELOCITY_K) {
      if (row.manning !== undefined) expect(row.manning.source).toMatch(FLAG);
      if (row.printedSi !== undefined) expect(row.printedSi.source).toMatch(FLAG);
    }
    for (const row of catalog.RUNOFF_C) expect(row.designSource).toMatch(FLAG);
    expect(catalog.CN_BASIS.source).toMatch(/TR-55 \(1986\)/);
  });

  it("ids are unique within each table", () => {
    for (const table of [
      catalog.SHEET_FLOW_N,
      catalog.VELOCITY_K,
      catalog.CURVE_NUMBERS,
      catalog.RUNOFF_C,
      catalog.KERBY_N,
    ]) {
      const ids: string[] = table.map((r) => r.id);
      expect(new Set(ids).size).toBe(ids.length);
    }
  });
});
