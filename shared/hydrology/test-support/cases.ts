/**
 * Test support (imported by *.test.ts only): random valid US cases for property tests, and
 * their SI twins built with the literal definitions (0.3048 m/ft, 25.4 mm/in, 0.404 685 642 24
 * ha/ac) rather than through units.ts, so the unit tests check the conversion module instead of
 * reusing it.
 */
import fc from "fast-check";
import exampleSi from "../../../tests/fixtures/calc/example-si.json";
import exampleUs from "../../../tests/fixtures/calc/example-us.json";

const dbl = (min: number, max: number) =>
  fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

export type Json = { [key: string]: unknown };

const sheet = fc.record({
  regime: fc.constant("sheet"),
  length: dbl(5, 300),
  slope: dbl(0.0005, 0.3),
  n: dbl(0.011, 0.8),
  k: dbl(2, 21),
  cn: dbl(40, 98),
  kerbyN: dbl(0.02, 0.8),
});

const shallow = fc.record({
  regime: fc.constant("shallow"),
  length: dbl(10, 3000),
  slope: dbl(0.0005, 0.3),
  k: dbl(2, 21),
  cn: dbl(40, 98),
});

const section = fc.oneof(
  fc.record({ flowArea: dbl(0.5, 200), stretch: dbl(1, 4) }).map(({ flowArea, stretch }) => ({
    flowArea,
    wettedPerimeter: stretch * Math.sqrt(2 * Math.PI * flowArea),
  })),
  fc.record({ bottomWidth: dbl(0, 20), sideSlope: dbl(0.5, 4), depth: dbl(0.2, 6) }),
  // A pipe is full (no flowDepth) or at most 99 % full: within a hair of full, velocity is
  // ill-conditioned in depth (dθ/dy → ∞), so 1e-16 input rounding alone would move it ~1e-9.
  fc.record({ diameter: dbl(0.5, 8) }),
  fc
    .record({ diameter: dbl(0.5, 8), fill: dbl(0.1, 0.99) })
    .map(({ diameter, fill }) => ({ diameter, flowDepth: diameter * fill })),
);

const channel = fc.record({
  regime: fc.constant("channel"),
  length: dbl(10, 5000),
  slope: dbl(0.0005, 0.1),
  manningN: dbl(0.011, 0.15),
  section,
  cn: dbl(40, 98),
});

/** A random valid US input with Sherman IDF formulas (no duration range to refuse). */
export const usCaseArb = fc
  .record({
    returnPeriodYears: fc.constantFrom(2, 10, 25, 100),
    a: dbl(10, 200),
    b: dbl(0, 30),
    shermanC: dbl(0.4, 1),
    p2: dbl(1, 8),
    first: sheet,
    rest: fc.array(fc.oneof(sheet, shallow, channel), { maxLength: 6 }),
    area: dbl(0.5, 3000),
    avgSlopePercent: dbl(0.2, 40),
    cn: dbl(40, 98),
    runoffC: dbl(0.1, 0.95),
    minTcMin: fc.constantFrom(0, 5, 10),
  })
  .map((r): Json => ({
    units: "us",
    returnPeriodYears: r.returnPeriodYears,
    rules: { minTcMin: r.minTcMin },
    rainfall: {
      p2_24h: r.p2,
      idf: { formula: { [String(r.returnPeriodYears)]: { a: r.a, b: r.b, c: r.shermanC } } },
    },
    watershed: { area: r.area, avgSlopePercent: r.avgSlopePercent, cn: r.cn, c: r.runoffC },
    segments: [r.first, ...r.rest],
  }));

const FT = 0.3048;
const MM = 25.4;
const HA_PER_AC = 0.40468564224;

function sectionSi(s: Json): Json {
  const out: Json = {};
  for (const [key, value] of Object.entries(s)) {
    if (typeof value !== "number") out[key] = value;
    else if (key === "flowArea") out[key] = value * FT * FT;
    else if (key === "sideSlope") out[key] = value;
    else out[key] = value * FT;
  }
  return out;
}

/** The same case in SI units. */
export function siTwin(us: Json): Json {
  const rainfall = us.rainfall as { p2_24h?: number; idf: Json };
  const idf = rainfall.idf;
  const formula = idf.formula as Record<string, { a: number; b: number; c: number }> | undefined;
  const siIdf: Json = formula
    ? {
        formula: Object.fromEntries(
          Object.entries(formula).map(([k, f]) => [k, { a: f.a * MM, b: f.b, c: f.c }]),
        ),
      }
    : {
        ...idf,
        intensity: (idf.intensity as number[][]).map((row) => row.map((v) => v * MM)),
      };
  const w = us.watershed as Json | undefined;
  return {
    ...us,
    units: "si",
    rainfall: {
      ...rainfall,
      ...(rainfall.p2_24h === undefined ? {} : { p2_24h: rainfall.p2_24h * MM }),
      idf: siIdf,
    },
    ...(w === undefined
      ? {}
      : {
          watershed: { ...w, ...(typeof w.area === "number" ? { area: w.area * HA_PER_AC } : {}) },
        }),
    segments: (us.segments as Json[]).map((s) => ({
      ...s,
      length: (s.length as number) * FT,
      ...(typeof s.k === "number" ? { k: s.k * FT } : {}),
      ...(s.section === undefined ? {} : { section: sectionSi(s.section as Json) }),
    })),
  };
}

export const relDiff = (a: number, b: number): number =>
  a === b ? 0 : Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b));

export interface SegmentJson {
  regime: "sheet" | "shallow" | "channel";
  length: number;
  slope: number;
  n?: number;
  k?: number;
  cn?: number;
  kerbyN?: number;
  manningN?: number;
  section?: Record<string, number>;
}

export interface CaseJson {
  units: "us" | "si";
  returnPeriodYears: number;
  rules?: Record<string, unknown>;
  rainfall: { p2_24h?: number; idf: Record<string, unknown> };
  watershed?: { area?: number; avgSlopePercent?: number; cn?: number; c?: number };
  segments: SegmentJson[];
}

/** A fixture of tests/fixtures/calc (the example input of the format and its SI twin). */
export function fixture(name: "example-us" | "example-si"): CaseJson {
  return structuredClone(name === "example-us" ? exampleUs : exampleSi) as CaseJson;
}

/** Every number in a result, for the never-NaN/Infinity checks. */
export function numbersIn(value: unknown, out: number[] = []): number[] {
  if (typeof value === "number") out.push(value);
  else if (Array.isArray(value)) for (const v of value) numbersIn(v, out);
  else if (typeof value === "object" && value !== null) {
    for (const v of Object.values(value)) numbersIn(v, out);
  }
  return out;
}
