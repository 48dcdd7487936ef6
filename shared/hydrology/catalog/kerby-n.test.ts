import { describe, expect, it } from "vitest";
import { KERBY_N } from "./kerby-n";

describe("Kerby (1959) retardance N [from memory]", () => {
  it("holds the values METHODS.md lists, smoothest to roughest", () => {
    expect(KERBY_N.map((r) => r.retardanceN)).toEqual([0.02, 0.1, 0.2, 0.4, 0.6, 0.8]);
  });

  it("ids are unique and every row names its source", () => {
    expect(new Set(KERBY_N.map((r) => r.id)).size).toBe(KERBY_N.length);
    for (const row of KERBY_N) expect(row.source).toMatch(/^Kerby \(1959\).*\[from memory\]$/);
  });
});
