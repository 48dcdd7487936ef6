/**
 * Runs in a worker thread (thread.ts): reads one terrain file whole, routes it and sends the
 * grids back, their buffers transferred. Messages: progress, then one result or one error.
 */
import { parentPort, workerData } from "node:worker_threads";
import { ReadError } from "../geodata/readers/types";
import { TerrainFlowError } from "./errors";
import { readElevationGrid } from "./read-terrain";
import { conditionAndRoute } from "./route";
import type { RouteMessage, RouteRequest } from "./thread";

const port = parentPort;
if (!port) throw new Error("the terrain worker must run in a worker thread");

async function route(request: RouteRequest): Promise<RouteMessage> {
  port!.postMessage({ type: "progress", fraction: 0, stage: "reading the terrain" });
  const grid = await readElevationGrid(request.filePath, request.verticalUnit, request.fileLabel);
  let lastSent = 0;
  const routed = conditionAndRoute(grid, {
    conditioning: request.conditioning,
    breach: request.breach,
    onProgress: (fraction, stage) => {
      if (Date.now() - lastSent < 100 && fraction < 1) return;
      lastSent = Date.now();
      port!.postMessage({ type: "progress", fraction: 0.1 + 0.9 * fraction, stage });
    },
  });
  return { type: "result", ...routed };
}

route(workerData as RouteRequest).then(
  (message) => {
    const transfer =
      message.type === "result"
        ? [message.dir.buffer, message.cond.buffer, message.acc.buffer, message.flowLenM.buffer]
        : [];
    port.postMessage(message, transfer as ArrayBuffer[]);
  },
  (err: unknown) =>
    port.postMessage(
      err instanceof TerrainFlowError
        ? { type: "flow-error", status: err.status, code: err.code, message: err.message }
        : err instanceof ReadError
          ? {
              type: "read-error",
              status: err.status,
              code: err.code,
              message: err.message,
              where: err.where,
            }
          : {
              type: "crash",
              message: err instanceof Error ? (err.stack ?? err.message) : String(err),
            },
    ),
);
