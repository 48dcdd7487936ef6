/**
 * A terrain computed once into what every click needs: conditioning (depression filling, or
 * least-cost breaching first), flat routing, D8 directions, flow accumulation and downstream
 * flow length with true cell sizes.
 *
 * Memory, bytes a cell: the elevations 4 (conditioned in place), direction and conditioning
 * codes 1 + 1, in-flow counts 1 and the topological order 4 (both dropped at the end),
 * accumulation 4 and flow length 4: 19, plus the flood's queues (a few bytes a cell of the
 * flood front).
 */
import { accumulate, flowLengths } from "./accumulate";
import { breachDepressions, type BreachOptions } from "./breach";
import { cellMetrics } from "./cell-metrics";
import { stepTable } from "./d8";
import { d8Directions } from "./directions";
import { fillDepressions } from "./flood";
import type { ElevationGrid, RoutedGrid } from "./types";

export interface RouteOptions {
  /** "fill" (default) or "breach": least-cost breaching first, then filling what is left. */
  readonly conditioning?: "fill" | "breach";
  readonly breach?: Partial<BreachOptions>;
  /** Called with a fraction done and a stage name (a job's progress). */
  readonly onProgress?: (fraction: number, stage: string) => void;
}

export function conditionAndRoute(grid: ElevationGrid, options: RouteOptions = {}): RoutedGrid {
  const { width, height, z, georef, verticalToM } = grid;
  const progress = options.onProgress ?? (() => {});
  const metrics = cellMetrics(georef, width, height);
  const steps = stepTable(metrics, height);
  const dir = new Uint8Array(width * height);
  const cond = new Uint8Array(width * height);
  const method = options.conditioning ?? "fill";
  let breach = null;
  if (method === "breach") {
    progress(0.05, "breaching depressions");
    breach = breachDepressions(grid, steps, cond, options.breach ?? {});
  }
  progress(0.2, "filling depressions");
  const fill = fillDepressions(z, width, height, dir, cond);
  progress(0.45, "finding flow directions");
  const inflow = new Uint8Array(width * height);
  const flatCells = d8Directions(z, width, height, steps, dir, cond, inflow);
  progress(0.6, "accumulating flow");
  const { acc, order, count } = accumulate(dir, inflow, width);
  if (count !== fill.dataCells) {
    throw new Error(`flow directions form a loop: ${fill.dataCells - count} cells never drain`);
  }
  progress(0.8, "measuring flow lengths");
  const flowLenM = flowLengths(dir, order, count, width, steps);
  progress(1, "done");
  return {
    width,
    height,
    georef,
    metrics,
    dir,
    cond,
    acc,
    flowLenM,
    report: {
      method,
      filledCells: fill.filledCells,
      maxFillDepthM: fill.maxFill * verticalToM,
      flatCells,
      breachedPits: breach?.breachedPits ?? 0,
      breachedCells: breach?.breachedCells ?? 0,
      maxBreachDepthM: (breach?.maxDepth ?? 0) * verticalToM,
      unbreachedPits: breach?.unbreachedPits ?? 0,
    },
  };
}
