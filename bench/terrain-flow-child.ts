/**
 * One pipeline run in a fresh process, for the terrain-flow bench: `tsx bench/terrain-flow-child.ts
 * <width> <height>` routes a synthetic grid (terrain-grids.ts) and prints JSON with the time and
 * the peak resident memory above what the process held before the grid was made.
 */
import { conditionAndRoute } from "../server/terrain-flow/route";
import { benchTerrain } from "./terrain-grids";

const [width, height] = process.argv.slice(2).map(Number) as [number, number];
const baselineBytes = process.memoryUsage().rss;
const grid = benchTerrain(width, height);
const start = performance.now();
const routed = conditionAndRoute(grid);
const ms = performance.now() - start;
const peakBytes = process.resourceUsage().maxRSS * 1024;
process.stdout.write(
  `${JSON.stringify({ ms, peakBytes, baselineBytes, cells: width * height, report: routed.report })}\n`,
);
