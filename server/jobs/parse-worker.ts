/**
 * Runs in a worker thread: reads one vector file with the readers, checks the geometry types
 * for the layer kind and turns the features into insert batches (JSON text), so neither the
 * parse nor the serialising of a large file holds up the HTTP event loop. Messages: progress,
 * then one result or one error.
 */
import { parentPort, workerData } from "node:worker_threads";
import { readVectorFile } from "../geodata/readers";
import { ReadError } from "../geodata/readers/types";
import {
  checkGeometryTypes,
  checkStorableAttributes,
  insertBatches,
} from "../layers/geometry-kinds";
import type { ParseMessage, ParseRequest } from "./parse-thread";

const port = parentPort;
if (!port) throw new Error("parse-worker must run in a worker thread");
const send = (message: ParseMessage) =>
  port.postMessage(
    message,
    message.type === "result" ? message.result.batches.map((b) => b.buffer as ArrayBuffer) : [],
  );

async function parse(request: ParseRequest): Promise<ParseMessage> {
  let lastSentAt = 0;
  const read = await readVectorFile(
    request.filePath,
    request.format,
    request.originalName,
    (done, total) => {
      const now = Date.now();
      if (now - lastSentAt < 100 && done < total) return;
      lastSentAt = now;
      send({ type: "progress", done, total });
    },
  );
  checkGeometryTypes(request.kind, request.originalName, read.features);
  checkStorableAttributes(request.originalName, read.features);
  return {
    type: "result",
    result: {
      batches: insertBatches(read.features),
      count: read.features.length,
      fields: [...read.fields],
      notes: [...read.notes],
      sourceCrs: read.sourceCrs,
    },
  };
}

parse(workerData as ParseRequest).then(send, (err: unknown) =>
  send(
    err instanceof ReadError
      ? {
          type: "read-error",
          status: err.status,
          code: err.code,
          message: err.message,
          where: err.where,
        }
      : { type: "crash", message: err instanceof Error ? (err.stack ?? err.message) : String(err) },
  ),
);
