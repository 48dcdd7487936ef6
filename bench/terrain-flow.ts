/**
 * The terrain engine, side by side with GRASS GIS in one run (in `npm run bench`, or alone with
 * `npx tsx bench/terrain-flow.ts`): the whole routing pipeline on a 2000 × 2000 float32 grid in
 * a fresh process each time (cold, as a job's worker runs it) against r.watershed -s on the same
 * grid, taking turns so a busy machine slows both alike; its peak memory a cell; clicks on
 * basins of a million and of twenty thousand cells; the stored form; the agreement with GRASS;
 * a 10,000 × 10,000 grid (100 million cells) and a larger one refused. Terrains are invented
 * (terrain-grids.ts). The GRASS rows say why when GRASS is not installed.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { writeGeoTiff } from "../server/geodata/writers";
import { writeTemp } from "../server/geodata/readers/test-support";
import { delineate } from "../server/terrain-flow/delineate";
import { MAX_CELLS } from "../server/terrain-flow/errors";
import { gridProjection } from "../server/terrain-flow/georef";
import { readElevationGrid } from "../server/terrain-flow/read-terrain";
import { conditionAndRoute } from "../server/terrain-flow/route";
import { decodeRouted, encodeRouted } from "../server/terrain-flow/store-format";
import { oversizedTiff } from "../server/terrain-flow/test-grids";
import type { RoutedGrid } from "../server/terrain-flow/types";
import { snapOutlet } from "../server/terrain-flow/upstream";
import { grassMissing, grassReference } from "../tests/support/grass";
import {
  compareWithGrass,
  DEMO_TERRAIN,
  outletCells,
  swaleClicks,
  valleysTif,
} from "../tests/support/grass-compare";
import type { BenchRow } from "./table";
import { benchTerrain } from "./terrain-grids";

const ROUNDS = 3;
const median = (values: number[]) => [...values].sort((a, b) => a - b)[values.length >> 1]!;

interface ChildRun {
  ms: number;
  peakBytes: number;
  baselineBytes: number;
  cells: number;
}

/** One routing of a synthetic grid in a fresh Node process (bench/terrain-flow-child.ts). */
function routeInChild(width: number, height: number): ChildRun {
  const run = spawnSync(
    process.execPath,
    [
      "--import",
      "tsx",
      new URL("./terrain-flow-child.ts", import.meta.url).pathname,
      `${width}`,
      `${height}`,
    ],
    { encoding: "utf8", maxBuffer: 1 << 20 },
  );
  if (run.status !== 0) throw new Error(`terrain-flow-child failed: ${run.stderr.slice(-1000)}`);
  return JSON.parse(run.stdout) as ChildRun;
}

/**
 * A click whose basin, after the 3-cell snap, is nearest `cells`: the snap moves a click on a
 * channel a few cells downstream, so the basin is the snapped cell's, not the clicked one's.
 */
function clickNear(routed: RoutedGrid, cells: number): [number, number] {
  const { width, acc } = routed;
  let [best, bestOff] = [0, Infinity];
  for (let c = 0; c < acc.length; c += 1) {
    if (Math.abs(acc[c]! - cells) > 0.1 * cells) continue;
    const snapped = snapOutlet(routed, c % width, Math.floor(c / width), 3);
    const off = Math.abs(acc[snapped]! - cells);
    if (off < bestOff) [best, bestOff] = [c, off];
  }
  const row = Math.floor(best / width);
  return gridProjection(routed.georef).lonLatAt(best - row * width + 0.5, row + 0.5);
}

function clickRow(routed: RoutedGrid, cells: number, targetMs: number): BenchRow {
  const click = clickNear(routed, cells);
  const times: number[] = [];
  let basin = 0;
  for (let k = 0; k < 7; k += 1) {
    const start = performance.now();
    const [proposal] = delineate(routed, [click], { snapCells: 3 });
    if (k >= 2) times.push(performance.now() - start); // the first two warm the code up
    basin = proposal!.cells;
  }
  return {
    name: `click: snap, area, longest path, polygon, GeoJSON; basin of ${basin.toLocaleString("en-US")} cells (median of 5)`,
    value: median(times).toFixed(1),
    unit: "ms",
    target: `≤ ${targetMs}`,
    ok: median(times) <= targetMs,
  };
}

async function sideBySide(dir: string, grass: string | null): Promise<BenchRow[]> {
  const grid = benchTerrain(2000, 2000);
  const tif = join(dir, "bench-2000.tif");
  await writeGeoTiff(tif, { width: 2000, height: 2000, georeference: grid.georef, values: grid.z });
  const ours: ChildRun[] = [];
  const theirs: { s: number; kb: number }[] = [];
  for (let k = 0; k < ROUNDS; k += 1) {
    ours.push(routeInChild(2000, 2000));
    if (grass === null) {
      const run = await grassReference(tif, [], 0);
      theirs.push({ s: run.watershedS, kb: run.peakKb });
    }
  }
  const ms = median(ours.map((r) => r.ms));
  const perCell = Math.max(...ours.map((r) => (r.peakBytes - r.baselineBytes) / r.cells));
  const rows: BenchRow[] = [
    {
      name: "routing 2000 × 2000 float32 (fill, flats, D8, accumulation, flow length), fresh process, median of 3",
      value: ms.toFixed(0),
      unit: "ms",
      target: "≤ 1000",
      ok: ms <= 1000,
    },
    {
      name: "routing 2000 × 2000, peak memory above the process's own, worst of 3",
      value: perCell.toFixed(1),
      unit: "bytes/cell",
      target: "≤ 24",
      ok: perCell <= 24,
    },
  ];
  if (grass !== null) {
    rows.push({ name: "GRASS r.watershed -s, same grid", value: `skipped: ${grass}` });
    return rows;
  }
  const grassS = median(theirs.map((t) => t.s));
  rows.push(
    {
      name: "GRASS r.watershed -s, same grid, taking turns, median of 3 (its peak memory)",
      value: `${(grassS * 1000).toFixed(0)} (${(Math.max(...theirs.map((t) => t.kb)) / 1024).toFixed(0)} MB)`,
      unit: "ms",
    },
    {
      name: "routing speed against GRASS r.watershed -s",
      value: (grassS / (ms / 1000)).toFixed(2),
      unit: "× faster",
      target: "≥ 2.5",
      ok: grassS / (ms / 1000) >= 2.5,
    },
  );
  return rows;
}

function storedRows(routed: RoutedGrid): BenchRow[] {
  let start = performance.now();
  const bytes = encodeRouted(routed);
  const encodeMs = performance.now() - start;
  start = performance.now();
  decodeRouted(bytes);
  const decodeMs = performance.now() - start;
  return [
    {
      name: "stored form of the 2000 × 2000 grids (deflate 1): size, write / read",
      value: `${(bytes.length / (routed.width * routed.height)).toFixed(2)} B/cell, ${encodeMs.toFixed(0)} / ${decodeMs.toFixed(0)} ms`,
    },
  ];
}

async function agreementRows(grass: string | null): Promise<BenchRow[]> {
  if (grass !== null) return [{ name: "agreement with GRASS GIS", value: `skipped: ${grass}` }];
  const worst = (rows: { area: number; path: number }[]) =>
    `${(100 * Math.max(...rows.map((r) => Math.abs(r.area)))).toFixed(2)} % / ${(100 * Math.max(...rows.map((r) => Math.abs(r.path)))).toFixed(2)} %`;
  const valleys = await compareWithGrass(valleysTif(), (routed) => outletCells(routed, 12));
  const swale = await compareWithGrass(DEMO_TERRAIN, swaleClicks);
  const ok = (rows: { area: number; path: number }[]) =>
    rows.every((r) => Math.abs(r.area) <= 0.02 && Math.abs(r.path) <= 0.05);
  return [
    {
      name: `GRASS agreement, synthetic valleys (${valleys.length} basins > 100 cells): worst area / longest path`,
      value: worst(valleys),
      target: "≤ 2 % / ≤ 5 %",
      ok: ok(valleys),
    },
    {
      name: `GRASS agreement, demo terrain clicked along its swale (${swale.length}): worst area / longest path`,
      value: worst(swale),
      target: "≤ 2 % / ≤ 5 %",
      ok: ok(swale),
    },
  ];
}

function hundredMillionRow(): BenchRow {
  const run = routeInChild(10_000, 10_000);
  const gb = run.peakBytes / 1e9;
  return {
    name: "routing 10,000 × 10,000 (100 M cells), fresh process: time, peak resident memory",
    value: `${(run.ms / 1000).toFixed(1)} s, ${gb.toFixed(2)} GB`,
    target: "completes, ≤ 2.5 GB",
    ok: gb <= 2.5,
  };
}

async function refusalRow(dir: string): Promise<BenchRow> {
  const bytes = oversizedTiff(10_001, 10_000);
  const file = writeTemp(dir, "too-large.tif", bytes);
  const start = performance.now();
  const message = await readElevationGrid(file, "m", "too-large.tif").then(
    () => "accepted",
    (error: unknown) => (error instanceof Error ? error.message : String(error)),
  );
  const ms = performance.now() - start;
  return {
    name: `a 10,001 × 10,000 terrain: refused in ${ms.toFixed(0)} ms before reading a cell`,
    value: message.slice(0, 90),
    target: `names the ${MAX_CELLS.toLocaleString("en-US")}-cell limit`,
    ok: message.includes(MAX_CELLS.toLocaleString("en-US")),
  };
}

export async function run(): Promise<BenchRow[]> {
  const grass = grassMissing();
  const dir = mkdtempSync(join(tmpdir(), "rillmark-bench-terrain-"));
  try {
    const rows = await sideBySide(dir, grass);
    const routed = conditionAndRoute(benchTerrain(2000, 2000));
    rows.push(clickRow(routed, 1_000_000, 150), clickRow(routed, 20_000, 20));
    rows.push(...storedRows(routed));
    rows.push(...(await agreementRows(grass)));
    rows.push(hundredMillionRow(), await refusalRow(dir));
    return rows;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const { formatTable } = await import("./table");
  console.log(formatTable(await run()));
}
