/**
 * Runs in a worker thread: reads one vector file with the readers, so a large file's parse
 * never holds up the HTTP event loop. Messages: progress, then one result or one error.
 */
import { parentPort, workerData } from "node:worker_threads";
import { readVectorFile } from "../geodata/readers";
import { ReadError } from "../geodata/readers/types";
import type { ParseRequest, ParseMessage } from "./parse-thread";

const port = parentPort;
if (!port) throw new Error("parse-worker must run in a worker thread");
const send = (message: ParseMessage) => port.postMessage(message);

const request = workerData as ParseRequest;
let lastSentAt = 0;
readVectorFile(request.filePath, request.format, request.originalName, (done, total) => {
  const now = Date.now();
  if (now - lastSentAt < 100 && done < total) return;
  lastSentAt = now;
  send({ type: "progress", done, total });
}).then(
  (result) => send({ type: "result", result }),
  (err: unknown) =>
    send(
      err instanceof ReadError
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
