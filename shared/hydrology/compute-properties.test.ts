/**
 * Properties of the whole computation over random valid cases (fast-check): US and SI agree,
 * results stay finite, and Tc grows with roughness and length and falls with slope.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { computeFromJson } from "./compute";
import type { ComputeResult, MethodResults } from "./result-types";
import { numbersIn, relDiff, siTwin, usCaseArb, type Json } from "./test-support/cases";

const ALL = [
  "velocity",
  "nrcs-lag",
  "kinematic-wave",
  "nrcs-segmental",
  "kirpich",
  "kerby",
  "faa",
  "kerby-kirpich",
] as const;

function computed(r: ComputeResult, id: keyof MethodResults): number {
  const m = r.methods[id];
  if (m.status !== "ok") throw new Error(`${id}: ${m.reason}`);
  return m.computedMin;
}

type Seg = Record<string, unknown>;
const mapSegments = (c: Json, f: (s: Seg) => Seg): Json => ({
  ...c,
  segments: (c.segments as Seg[]).map(f),
});
const scaled = (s: Seg, key: string, factor: number, cap = Infinity): Seg =>
  typeof s[key] === "number" ? { ...s, [key]: Math.min((s[key] as number) * factor, cap) } : s;

describe("US and SI inputs of the same case agree within 1e-9 relative (property)", () => {
  it("for every method, segment, intensity and the peak flow", () => {
    fc.assert(
      fc.property(usCaseArb, (us) => {
        const a = computeFromJson(us);
        const b = computeFromJson(siTwin(us));
        for (const id of ALL) {
          const ma = a.methods[id];
          const mb = b.methods[id];
          if (ma.status !== mb.status) return false;
          if (ma.status !== "ok" || mb.status !== "ok") continue;
          if (relDiff(ma.totalMin, mb.totalMin) > 1e-9) return false;
          for (const [k, sa] of ma.segments.entries()) {
            const sb = mb.segments[k];
            if (sb === undefined || relDiff(sa.travelTimeMin, sb.travelTimeMin) > 1e-9)
              return false;
            if (sa.velocity !== undefined && relDiff(sa.velocity * 0.3048, sb.velocity ?? 0) > 1e-9)
              return false;
          }
        }
        const ka = a.methods["kinematic-wave"];
        const kb = b.methods["kinematic-wave"];
        if (
          ka.status === "ok" &&
          kb.status === "ok" &&
          relDiff(ka.intensity * 25.4, kb.intensity) > 1e-9
        ) {
          return false;
        }
        const qa = a.peakFlow?.value ?? 0;
        const qb = b.peakFlow?.value ?? 0;
        return relDiff(qa * 0.3048 ** 3, qb) <= 1e-9 && a.governing.method === b.governing.method;
      }),
      { numRuns: 150 },
    );
  });
});

describe("results are finite and complete (property)", () => {
  it("never holds NaN or Infinity, and every Tc method computes", () => {
    fc.assert(
      fc.property(usCaseArb, (us) => {
        const r = computeFromJson(us);
        return (
          numbersIn(r).every(Number.isFinite) &&
          ALL.every((id) => r.methods[id].status === "ok") &&
          r.governing.tcMin > 0
        );
      }),
      { numRuns: 150 },
    );
  });
});

const factor = fc.double({ min: 1.1, max: 3, noNaN: true });

describe("Tc grows with roughness and length and falls with slope (property)", () => {
  it("grows with Manning's n (sheet n and channel n)", () => {
    fc.assert(
      fc.property(usCaseArb, factor, (us, f) => {
        const rough = mapSegments(us, (s) => scaled(scaled(s, "n", f, 0.99), "manningN", f, 0.99));
        const a = computeFromJson(us);
        const b = computeFromJson(rough);
        return (
          (["velocity", "nrcs-segmental", "kinematic-wave"] as const).every(
            (id) => computed(b, id) >= computed(a, id) * (1 - 1e-9),
          ) && computed(b, "nrcs-segmental") > computed(a, "nrcs-segmental")
        );
      }),
    );
  });
  it("grows with length, for every method (sheet flow kept past the cap)", () => {
    fc.assert(
      fc.property(usCaseArb, factor, (raw, f) => {
        // With the excess carried as shallow flow, the overland checks stop at the cap.
        const us = { ...raw, rules: { ...(raw.rules as Json), sheetFlowPastCap: "warn" } };
        const longer = mapSegments(us, (s) => scaled(s, "length", f));
        const a = computeFromJson(us);
        const b = computeFromJson(longer);
        return ALL.every((id) => computed(b, id) > computed(a, id));
      }),
    );
  });
  it("falls with slope (the lag method's whole-path Tc takes the subcatchment slope instead)", () => {
    fc.assert(
      fc.property(usCaseArb, factor, (us, f) => {
        const steeper = mapSegments(us, (s) => scaled(s, "slope", f, 1));
        const a = computeFromJson(us);
        const b = computeFromJson(steeper);
        const lagA = a.methods["nrcs-lag"];
        const lagB = b.methods["nrcs-lag"];
        const lagSum =
          lagA.status === "ok" && lagB.status === "ok" && lagB.segmentSumMin < lagA.segmentSumMin;
        return (
          lagSum &&
          ALL.filter((id) => id !== "nrcs-lag").every((id) => computed(b, id) < computed(a, id))
        );
      }),
    );
  });
  it("the lag method falls with the subcatchment's average slope", () => {
    fc.assert(
      fc.property(usCaseArb, factor, (us, f) => {
        const w = us.watershed as Json;
        const steeper = {
          ...us,
          watershed: { ...w, avgSlopePercent: Math.min((w.avgSlopePercent as number) * f, 100) },
        };
        return (
          computed(computeFromJson(steeper), "nrcs-lag") < computed(computeFromJson(us), "nrcs-lag")
        );
      }),
    );
  });
});

it("the property cases are valid inputs", () => {
  fc.assert(
    fc.property(usCaseArb, (us) => {
      expect(computeFromJson(us).methods.velocity.status).toBe("ok");
    }),
    { numRuns: 20 },
  );
});
