import { Worker } from "node:worker_threads";
import { tsWorkerSource } from "./ts-worker";
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

const BOOTSTRAP = tsWorkerSource(new URL("./parse-worker.ts", import.meta.url));

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
