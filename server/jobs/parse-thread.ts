import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import {
  ReadError,
  type OnProgress,
  type VectorFormat,
  type VectorReadResult,
} from "../geodata/readers/types";

export interface ParseRequest {
  filePath: string;
  format: VectorFormat;
  originalName: string;
}

export type ParseMessage =
  | { type: "progress"; done: number; total: number }
  | { type: "result"; result: VectorReadResult }
  | {
      type: "read-error";
      status: ReadError["status"];
      code: string;
      message: string;
      where: string | undefined;
    }
  | { type: "crash"; message: string };

// The server runs TypeScript through tsx; a worker thread starts without it, so its first
// module registers tsx's loader and then imports the worker's own .ts module.
// tsx's ESM entry is taken from its package's export map (the CommonJS one cannot register
// the ESM loader in a thread).
function tsxEsmApi(): string {
  const manifest = createRequire(import.meta.url).resolve("tsx/package.json");
  const pkg = JSON.parse(readFileSync(manifest, "utf8")) as {
    exports: Record<string, { import: { default: string } }>;
  };
  const entry = pkg.exports["./esm/api"]?.import.default;
  if (!entry) throw new Error("tsx has no ESM API entry");
  return pathToFileURL(path.join(path.dirname(manifest), entry)).href;
}
const tsxApi = tsxEsmApi();
const workerModule = new URL("./parse-worker.ts", import.meta.url).href;
const BOOTSTRAP = `
const api = await import(${JSON.stringify(tsxApi)});
api.register();
await import(${JSON.stringify(workerModule)});
`;

/** Reads a vector file in a worker thread; ReadErrors come back as ReadErrors. */
export function parseVectorInThread(
  request: ParseRequest,
  onProgress?: OnProgress,
): Promise<VectorReadResult> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(BOOTSTRAP, { eval: true, workerData: request });
    let settled = false;
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      fn();
      void worker.terminate();
    };
    worker.on("message", (message: ParseMessage) => {
      switch (message.type) {
        case "progress":
          onProgress?.(message.done, message.total);
          break;
        case "result":
          finish(() => resolve(message.result));
          break;
        case "read-error":
          finish(() =>
            reject(new ReadError(message.status, message.code, message.message, message.where)),
          );
          break;
        case "crash":
          finish(() => reject(new Error(`reading ${request.originalName}: ${message.message}`)));
          break;
      }
    });
    worker.on("error", (err) => finish(() => reject(err)));
    worker.on("exit", (code) =>
      finish(() => reject(new Error(`the reader thread stopped (exit code ${code})`))),
    );
  });
}
