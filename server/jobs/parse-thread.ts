import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import {
  ReadError,
  type OnProgress,
  type ReadNote,
  type VectorFormat,
} from "../geodata/readers/types";

export interface ParseRequest {
  filePath: string;
  format: VectorFormat;
  originalName: string;
  /** The layer kind, whose geometry types the features must have. */
  kind: string;
}

/** A read file, ready for the database: features as insert batches of JSON text. */
export interface ParsedLayer {
  /** UTF-8 JSON arrays of rows, INSERT_BATCH at most each. */
  batches: Uint8Array[];
  count: number;
  fields: string[];
  notes: ReadNote[];
  sourceCrs: string;
}

export type ParseMessage =
  | { type: "progress"; done: number; total: number }
  | { type: "result"; result: ParsedLayer }
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

const READER_HEAP_MB = 640;

/** Reads a vector file in a worker thread; ReadErrors come back as ReadErrors. */
export function parseVectorInThread(
  request: ParseRequest,
  onProgress?: OnProgress,
): Promise<ParsedLayer> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(BOOTSTRAP, {
      eval: true,
      workerData: request,
      // A bound on one file's reading: a file that needs more is refused, not the server.
      resourceLimits: { maxOldGenerationSizeMb: READER_HEAP_MB },
    });
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
    worker.on("error", (err: Error & { code?: string }) =>
      finish(() =>
        reject(
          err.code === "ERR_WORKER_OUT_OF_MEMORY"
            ? new ReadError(
                413,
                "file-too-complex",
                `${request.originalName}: reading it needs more than ${READER_HEAP_MB} MB of memory; split it into smaller files.`,
                request.originalName,
              )
            : err,
        ),
      ),
    );
    worker.on("exit", (code) =>
      finish(() => reject(new Error(`the reader thread stopped (exit code ${code})`))),
    );
  });
}
