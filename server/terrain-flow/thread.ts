/**
 * Routing a terrain file in a worker thread, so reading and computing a large grid never holds
 * up the HTTP event loop: progress comes back as messages, the grids as transferred buffers (no
 * copy), refusals as the same errors as in-process (TerrainFlowError, ReadError).
 */
import { Worker } from "node:worker_threads";
import { ReadError } from "../geodata/readers/types";
import { tsWorkerSource } from "../jobs/ts-worker";
import { TerrainFlowError } from "./errors";
import type { RouteOptions } from "./route";
import type { ConditioningReport, GridGeoref, RoutedGrid } from "./types";

export interface RouteRequest {
  readonly filePath: string;
  readonly verticalUnit: "m" | "ft";
  /** How the file is named in messages (the user's file name). */
  readonly fileLabel: string;
  readonly conditioning?: RouteOptions["conditioning"];
  readonly breach?: RouteOptions["breach"];
}

export type RouteMessage =
  | { type: "progress"; fraction: number; stage: string }
  | {
      type: "result";
      width: number;
      height: number;
      georef: GridGeoref;
      report: ConditioningReport;
      metrics: RoutedGrid["metrics"];
      dir: Uint8Array;
      cond: Uint8Array;
      acc: Uint32Array;
      flowLenM: Float32Array;
    }
  | { type: "flow-error"; status: 413 | 422; code: TerrainFlowError["code"]; message: string }
  | {
      type: "read-error";
      status: ReadError["status"];
      code: string;
      message: string;
      where?: string;
    }
  | { type: "crash"; message: string };

const BOOTSTRAP = tsWorkerSource(new URL("./worker.ts", import.meta.url));

export function routeTerrainInThread(
  request: RouteRequest,
  onProgress?: (fraction: number, stage: string) => void,
): Promise<RoutedGrid> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(BOOTSTRAP, { eval: true, workerData: request });
    let settled = false;
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      fn();
      void worker.terminate();
    };
    worker.on("message", (m: RouteMessage) => {
      if (m.type === "progress") onProgress?.(m.fraction, m.stage);
      else if (m.type === "result") {
        const { type: _type, ...routed } = m;
        finish(() => resolve(routed));
      } else if (m.type === "flow-error") {
        finish(() => reject(new TerrainFlowError(m.status, m.code, m.message)));
      } else if (m.type === "read-error") {
        finish(() => reject(new ReadError(m.status, m.code, m.message, m.where)));
      } else finish(() => reject(new Error(`routing ${request.fileLabel}: ${m.message}`)));
    });
    worker.on("error", (err) => finish(() => reject(err)));
    worker.on("exit", (code) =>
      finish(() => reject(new Error(`the terrain thread stopped (exit code ${code})`))),
    );
  });
}
