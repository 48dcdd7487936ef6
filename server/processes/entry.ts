/**
 * The entry of every child process the supervisor starts: `entry.ts <role>`. It starts the
 * role, says "ready" to the supervisor, and stops cleanly when told to, on SIGINT/SIGTERM, or
 * when the supervisor is gone (its IPC channel closes).
 */
import { ConfigError, loadConfig } from "../config";
import { connectDatabase } from "../db/client";
import { startStandIns } from "../standins";
import { ROLES, type FromChild, type ProcessRole, type ToChild } from "./messages";
import { startWeb } from "./web";
import { startWorker } from "./worker";

const role = process.argv[2] as ProcessRole;
if (!ROLES.includes(role)) throw new Error(`unknown process role ${String(role)}`);

const tell = (message: FromChild) => process.send?.(message);

function nextMessage<T extends ToChild["type"]>(type: T): Promise<Extract<ToChild, { type: T }>> {
  return new Promise((resolve) => {
    const onMessage = (message: ToChild) => {
      if (message.type !== type) return;
      process.off("message", onMessage);
      resolve(message as Extract<ToChild, { type: T }>);
    };
    process.on("message", onMessage);
  });
}

async function start(): Promise<{ close(): Promise<void> }> {
  const config = loadConfig();
  if (role === "web") {
    const web = await startWeb(config);
    tell({ type: "ready", port: web.port });
    return web;
  }
  if (role === "worker") {
    const worker = await startWorker(config);
    tell({ type: "ready" });
    return worker;
  }
  const order = await nextMessage("start-standins");
  const database = connectDatabase(config.databaseUrl, 2);
  const standIns = await startStandIns({
    db: database.db,
    s3Dir: config.storage.fakeDir,
    bucket: config.storage.bucket,
    s3Port: order.s3Port,
    smtpPort: order.smtpPort,
    credentials: order.credentials,
  });
  tell({ type: "ready", s3Endpoint: standIns.s3Endpoint, smtpPort: standIns.smtpPort });
  return {
    async close() {
      await standIns.close();
      await database.pool.end();
    },
  };
}

let stopping = false;
function stopWith(running: { close(): Promise<void> }) {
  return () => {
    if (stopping) return;
    stopping = true;
    running.close().then(
      () => process.exit(0),
      (err: unknown) => {
        console.error(`The ${role} process could not stop cleanly:`, err);
        process.exit(1);
      },
    );
  };
}

// The stand-ins serve the others until they have stopped: only the supervisor stops them.
const signals: NodeJS.Signals[] = ["SIGINT", "SIGTERM"];
if (role === "standins") for (const signal of signals) process.on(signal, () => undefined);

start().then(
  (running) => {
    const stop = stopWith(running);
    process.on("message", (message: ToChild) => {
      if (message.type === "stop") stop();
    });
    process.on("disconnect", stop);
    if (role !== "standins") for (const signal of signals) process.on(signal, stop);
  },
  (err: unknown) => {
    const message = err instanceof ConfigError ? err.message : String((err as Error)?.stack ?? err);
    console.error(`The ${role} process could not start: ${message}`);
    tell({ type: "failed", message });
    process.exit(1);
  },
);
