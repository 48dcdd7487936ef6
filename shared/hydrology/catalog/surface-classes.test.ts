import { describe, expect, it } from "vitest";
import { CURVE_NUMBERS } from "./curve-numbers";
import { KERBY_N } from "./kerby-n";
import { RUNOFF_C } from "./runoff-c";
import { SHEET_FLOW_N } from "./sheet-flow-n";
import { SURFACE_CLASSES, surfaceClass } from "./surface-classes";
import { HSGS, type CatalogField, type SurfaceClass } from "./types";
import { VELOCITY_K } from "./velocity-k";

const FIELDS = [
  "sheetFlowN",
  "velocityK",
  "shallowFlowK",
  "kerbyN",
  "curveNumber",
  "runoffC",
] as const satisfies readonly (keyof SurfaceClass)[];

const fieldsOf = (c: SurfaceClass): [string, CatalogField<unknown>][] =>
  FIELDS.map((f) => [f, c[f]]);

describe("default Surface catalog classes", () => {
  it("ids are unique, lower-case kebab, and include the ones the catalog is known by", () => {
    const ids = SURFACE_CLASSES.map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of ids) expect(id).toMatch(/^[a-z]+(-[a-z0-9]+)*$/);
    for (const id of ["pavement", "roof", "lawn-good", "woods-light", "woods-dense"]) {
      expect(surfaceClass(id)?.id).toBe(id);
    }
    for (const id of ["range-natural", "pasture-good", "bare-soil", "cultivated-row"]) {
      expect(surfaceClass(id)?.id).toBe(id);
    }
    expect(surfaceClass("gravel")?.id).toBe("gravel");
    expect(surfaceClass("water")?.id).toBe("water");
    expect(surfaceClass("no-such-class")).toBeUndefined();
  });

  it.each(SURFACE_CLASSES)("$id: every field has a non-empty source and note", (c) => {
    expect(c.name).toMatch(/\S/);
    expect(c.description).toMatch(/\S/);
    for (const [, field] of fieldsOf(c)) {
      expect(field.source.trim()).not.toBe("");
      expect(field.note.trim()).not.toBe("");
      if (field.value === null) expect(field.rowId).toBeNull();
    }
  });

  it.each(SURFACE_CLASSES)("$id: each value is the one printed in the row it names", (c) => {
    const sheet = SHEET_FLOW_N.find((r) => r.id === c.sheetFlowN.rowId);
    if (c.sheetFlowN.value !== null) expect(c.sheetFlowN.value).toBe(sheet?.n);
    for (const k of [c.velocityK, c.shallowFlowK]) {
      if (k.value === null) continue;
      const row = VELOCITY_K.find((r) => r.id === k.rowId);
      expect(k.value).toEqual({ kFtPerS: row?.kFtPerS, kMPerS: row?.kMPerS });
      expect(k.source).toBe(row?.source);
    }
    const kerby = KERBY_N.find((r) => r.id === c.kerbyN.rowId);
    if (c.kerbyN.value !== null) expect(c.kerbyN.value).toBe(kerby?.retardanceN);
    const cn = CURVE_NUMBERS.find((r) => r.id === c.curveNumber.rowId);
    if (c.curveNumber.rowId !== null) expect(c.curveNumber.value).toEqual(cn?.cn);
    const rc = RUNOFF_C.find((r) => r.id === c.runoffC.rowId);
    if (c.runoffC.value !== null) {
      expect(c.runoffC.value).toEqual({ low: rc?.cLow, high: rc?.cHigh, design: rc?.cDesign });
    }
  });

  it.each(SURFACE_CLASSES)(
    "$id: a CN for every soil group and values in their valid ranges",
    (c) => {
      for (const g of HSGS) {
        const v = c.curveNumber.value[g];
        expect(v).not.toBeNull();
        expect(v).toBeGreaterThanOrEqual(30);
        expect(v).toBeLessThanOrEqual(100);
      }
      if (c.sheetFlowN.value !== null) {
        expect(c.sheetFlowN.value).toBeGreaterThan(0);
        expect(c.sheetFlowN.value).toBeLessThan(1);
      }
      if (c.runoffC.value !== null) {
        const { low, high, design } = c.runoffC.value;
        expect(0 < low && low <= design && design <= high && high <= 1).toBe(true);
      }
    },
  );

  it("velocity k comes from NEH Table 15-3 and the shallow k from TR-55 paved/unpaved", () => {
    for (const c of SURFACE_CLASSES) {
      if (c.velocityK.rowId !== null) expect(c.velocityK.rowId).toMatch(/^neh-/);
      if (c.shallowFlowK.rowId !== null) expect(c.shallowFlowK.rowId).toMatch(/^tr55-/);
    }
  });

  it("impervious classes use the smoothest values and CN 98", () => {
    for (const id of ["pavement", "concrete", "roof", "drive-walk"]) {
      const c = surfaceClass(id);
      expect(c?.sheetFlowN.value).toBe(0.011);
      expect(c?.shallowFlowK.rowId).toBe("tr55-paved");
      expect(c?.kerbyN.value).toBe(0.02);
      expect(c?.curveNumber.value).toEqual({ A: 98, B: 98, C: 98, D: 98 });
    }
  });

  it("open water leaves overland parameters empty and says why", () => {
    const water = surfaceClass("water");
    expect(water?.sheetFlowN.value).toBeNull();
    expect(water?.velocityK.value).toBeNull();
    expect(water?.kerbyN.value).toBeNull();
    expect(water?.curveNumber.source).toContain("Common practice");
  });
});
