/**
 * Split benchmark (run by `npm run bench`, or alone with `DATABASE_URL=… npx tsx bench/split.ts`):
 * a 10,000-vertex flow path against 100,000 cover polygons (and 1,000 soil polygons), split by
 * the flatbush index in shared/geo and by the best of several PostGIS queries on the same data,
 * side by side; both must give the same length per (class, soil group). The data are synthetic
 * (invented), see split-data.ts. Measures only; targets are printed beside the numbers.
 */
import { pathToFileURL } from "node:url";
import {
  buildPolygonIndex,
  pathLengthsM,
  splitFlowPath,
  type PathPiece,
} from "../shared/geo/index";
import { coverPolygons, flowPath, soilPolygons } from "./split-data";
import {
  PATH_SOURCES,
  loadBenchData,
  postgisClassLengths,
  type ClassLength,
  type PathSource,
} from "./split-postgis";
import type { BenchRow } from "./table";

/**
 * Median wall time in ms of each function, called in turn `runs` times after `warmup` rounds
 * (JIT); taking turns spreads a busy machine's pauses over all of them alike.
 */
function medianMs(fns: readonly (() => unknown)[], runs = 41, warmup = 20): number[] {
  for (let k = 0; k < warmup; k += 1) for (const fn of fns) fn();
  const times = fns.map(() => [] as number[]);
  for (let k = 0; k < runs; k += 1) {
    fns.forEach((fn, i) => {
      const start = performance.now();
      fn();
      times[i]!.push(performance.now() - start);
    });
  }
  return times.map((t) => t.sort((a, b) => a - b)[Math.floor(runs / 2)]!);
}

/** The fastest of `runs` calls in ms: what the code costs when nothing else runs. */
function fastestMs(fn: () => unknown, runs = 41): number {
  let best = Infinity;
  for (let k = 0; k < runs; k += 1) {
    const start = performance.now();
    fn();
    best = Math.min(best, performance.now() - start);
  }
  return best;
}

const key = (cls: string | null, hsg: string | null) => `${cls ?? "(none)"} | ${hsg ?? "(none)"}`;

function totals(pieces: readonly PathPiece[]): Map<string, number> {
  const out = new Map<string, number>();
  for (const p of pieces) {
    const k = key(p.surfaceClassId, p.hsg);
    out.set(k, (out.get(k) ?? 0) + p.lengthM);
  }
  return out;
}

/** Largest difference per (class, soil group), relative to that group's length, in %. */
function maxDifferencePercent(ours: Map<string, number>, theirs: readonly ClassLength[]): number {
  const db = new Map(theirs.map((r) => [key(r.cls, r.hsg), r.lengthM]));
  let worst = 0;
  for (const k of new Set([...ours.keys(), ...db.keys()])) {
    const a = ours.get(k) ?? 0;
    const b = db.get(k) ?? 0;
    worst = Math.max(worst, (100 * Math.abs(a - b)) / Math.max(a, b));
  }
  return worst;
}

export async function run(): Promise<BenchRow[]> {
  const cover = coverPolygons();
  const soil = soilPolygons();
  const path = flowPath();
  const buildStart = performance.now();
  const coverIndex = buildPolygonIndex<string | null>(cover);
  const soilIndex = buildPolygonIndex(soil);
  const buildMs = performance.now() - buildStart;
  const lengths = pathLengthsM(path);

  const [splitMs, splitGivenMs, lengthsMs] = medianMs([
    () => splitFlowPath(path, coverIndex, soilIndex),
    () => splitFlowPath(path, coverIndex, soilIndex, lengths),
    () => pathLengthsM(path),
  ]) as [number, number, number];
  const pieces = splitFlowPath(path, coverIndex, soilIndex);
  const rows: BenchRow[] = [
    {
      name: `index build, ${cover.length.toLocaleString("en")} cover + ${soil.length.toLocaleString("en")} soil polygons`,
      value: buildMs.toFixed(0),
      unit: "ms",
    },
    {
      name: `split ${path.length.toLocaleString("en")}-vertex path (${(lengths.totalM / 1000).toFixed(1)} km, ${pieces.length} pieces), geodesic lengths included`,
      target: "≤ 10 ms",
      value: splitMs.toFixed(2),
      unit: "ms (median)",
      ok: splitMs <= 10,
    },
    {
      name: "split, fastest of 41 runs (a busy machine slows the median)",
      value: fastestMs(() => splitFlowPath(path, coverIndex, soilIndex)).toFixed(2),
      unit: "ms",
    },
    { name: "split, path lengths given", value: splitGivenMs.toFixed(2), unit: "ms (median)" },
    { name: "geodesic path lengths alone", value: lengthsMs.toFixed(2), unit: "ms (median)" },
  ];

  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    rows.push({ name: "PostGIS comparison", value: "skipped: no DATABASE_URL" });
    return rows;
  }
  const loadStart = performance.now();
  const client = await loadBenchData(databaseUrl, cover, soil, path);
  rows.push({
    name: "PostGIS: load the same data with GiST indexes",
    value: ((performance.now() - loadStart) / 1000).toFixed(1),
    unit: "s",
  });
  try {
    let best: { source: PathSource; ms: number; result: ClassLength[] } | null = null;
    for (const source of Object.keys(PATH_SOURCES) as PathSource[]) {
      let ms = Infinity;
      let result: ClassLength[] = [];
      for (let k = 0; k < 2; k += 1) {
        const start = performance.now();
        result = await postgisClassLengths(client, source);
        ms = Math.min(ms, performance.now() - start);
      }
      rows.push({ name: `PostGIS split, ${source} (best of 2)`, value: ms.toFixed(0), unit: "ms" });
      if (!best || ms < best.ms) best = { source, ms, result };
    }
    const ratio = best!.ms / splitMs;
    rows.push({
      name: `flatbush split vs the best PostGIS query (${best!.source})`,
      target: "≥ 10×",
      value: ratio.toFixed(0),
      unit: "× faster",
      ok: ratio >= 10,
    });
    const diff = maxDifferencePercent(totals(pieces), best!.result);
    rows.push({
      name: "length per (class, soil group), flatbush vs PostGIS: largest difference",
      target: "≤ 0.01 %",
      value: diff.toExponential(2),
      unit: "%",
      ok: diff <= 0.01,
    });
  } finally {
    await client.end();
  }
  return rows;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const rows = await run();
  const { formatTable } = await import("./table");
  console.log(formatTable(rows));
}
