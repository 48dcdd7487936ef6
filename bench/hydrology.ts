/**
 * Benchmarks of the engineering core (run by `npm run bench`, or alone with
 * `npx tsx bench/hydrology.ts`). Measures only; targets are printed beside the numbers.
 * The flow paths and rainfall are synthetic (invented) data.
 */
import { pathToFileURL } from "node:url";
import {
  compute,
  fitIdfTable,
  parseComputeInput,
  type ComputeInput,
} from "../shared/hydrology/index";

interface Row {
  name: string;
  target?: string;
  value: string;
  unit?: string;
  ok?: boolean;
}

const DURATIONS = [5, 10, 15, 30, 60, 120, 360, 1440];
const PERIODS = [2, 10, 25, 100];
/** Invented, monotone IDF table (in/h). */
const INTENSITY = [
  [4.9, 6.6, 7.6, 9.2],
  [3.9, 5.3, 6.1, 7.4],
  [3.3, 4.5, 5.2, 6.3],
  [2.3, 3.2, 3.7, 4.6],
  [1.5, 2.1, 2.5, 3.1],
  [0.92, 1.3, 1.55, 1.95],
  [0.42, 0.6, 0.72, 0.92],
  [0.13, 0.19, 0.23, 0.29],
];

/** A synthetic path: two sheet segments, then shallow and channel segments in turn. */
function syntheticInput(segmentCount: number, extraRules: object = {}): ComputeInput {
  const segments: unknown[] = [];
  for (let j = 0; j < segmentCount; j += 1) {
    const slope = 0.005 + 0.03 * (((j * 7919) % 100) / 100);
    if (j < 2) {
      segments.push({ regime: "sheet", length: 40, slope, n: 0.15, k: 6.962, cn: 74, kerbyN: 0.4 });
    } else if (j % 3 === 0) {
      segments.push({ regime: "shallow", length: 30, slope, k: 16.1345, cn: 74 });
    } else {
      segments.push({
        regime: "channel",
        length: 60,
        slope,
        manningN: 0.035,
        cn: 74,
        section:
          j % 2 === 0
            ? { bottomWidth: 4, sideSlope: 3, depth: 1.2 }
            : { diameter: 3, flowDepth: 2.1 },
      });
    }
  }
  return parseComputeInput({
    units: "us",
    returnPeriodYears: 25,
    rules: {
      governing: "largest",
      sheetFlowMaxLength: "300ft",
      allowIdfExtrapolation: true,
      ...extraRules,
    },
    rainfall: {
      p2_24h: 3.1,
      idf: { durationsMin: DURATIONS, returnPeriodsYears: PERIODS, intensity: INTENSITY },
    },
    watershed: { area: 40, avgSlopePercent: 6, cn: 74, c: 0.4 },
    segments,
  });
}

/**
 * Time of one call in ms: after `minMs` of warm-up (JIT), the median of 7 batches of at least
 * minMs/7 each, so a busy machine's pauses do not decide the figure.
 */
function timeMs(fn: () => unknown, minMs = 350): number {
  const warmUntil = performance.now() + minMs;
  while (performance.now() < warmUntil) fn();
  const batches: number[] = [];
  for (let b = 0; b < 7; b += 1) {
    let calls = 0;
    const start = performance.now();
    let elapsed = 0;
    while (elapsed < minMs / 7) {
      fn();
      calls += 1;
      elapsed = performance.now() - start;
    }
    batches.push(elapsed / calls);
  }
  batches.sort((x, y) => x - y);
  return batches[3] ?? Number.NaN;
}

export async function run(): Promise<Row[]> {
  const path50 = syntheticInput(50);
  const path5000 = syntheticInput(5000);
  const raw50 = JSON.parse(JSON.stringify(path50)) as unknown;
  const t50 = timeMs(() => compute(path50));
  const t50Parse = timeMs(() => compute(parseComputeInput(raw50)));
  const t5000 = timeMs(() => compute(path5000), 1000);
  // Monte Carlo of every method: one run of 10,000 draws (after one warm-up run).
  const mcInput = syntheticInput(50, { uncertainty: { draws: 10_000 } });
  compute(mcInput, { uncertainty: true });
  const mcStart = performance.now();
  compute(mcInput, { uncertainty: true });
  const tMc = performance.now() - mcStart;
  const tFit = timeMs(() =>
    fitIdfTable({ durationsMin: DURATIONS, returnPeriodsYears: PERIODS, intensity: INTENSITY }),
  );
  return [
    {
      name: "all methods, 50-segment path",
      target: "< 0.2 ms",
      value: t50.toFixed(4),
      unit: "ms/evaluation",
      ok: t50 < 0.2,
    },
    {
      name: "parse + all methods, 50-segment path",
      value: t50Parse.toFixed(4),
      unit: "ms/evaluation",
    },
    { name: "all methods, 5,000-segment path", value: t5000.toFixed(3), unit: "ms/evaluation" },
    {
      name: "Monte Carlo, 10,000 draws of all methods, 50-segment path",
      target: "≤ 1 s",
      value: (tMc / 1000).toFixed(3),
      unit: "s",
      ok: tMc <= 1000,
    },
    {
      name: "IDF Sherman fit, 4 return periods × 8 durations",
      value: tFit.toFixed(3),
      unit: "ms/fit",
    },
  ];
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const rows = await run();
  const { formatTable } = await import("./table");
  console.log(formatTable(rows));
}
