/**
 * An app process: the HTTP API and the built client. It keeps nothing of its own that another
 * app process would need (sessions, jobs, layer news and rate counters are in PostgreSQL, files
 * in the object store), so any number run side by side; it sends layer-reading jobs but does
 * not run them (the worker process does).
 */
import http from "node:http";
import type { AddressInfo } from "node:net";
import { createApp } from "../app";
import { createSessionStore } from "../auth/session";
import { ConfigError, resolvePublicBaseUrl, type AppConfig, type Config } from "../config";
import { connectDatabase, type Database } from "../db/client";
import { startJobQueue } from "../jobs/queue";
import { removeDeadProcessUploads } from "../layers/upload-storage";
import { createMailer, smtpTarget } from "../mail/mailer";
import { startStorage } from "../storage";
import { cleanupStack } from "./cleanup";

export interface RunningWeb {
  /** Where the server listens, with the real port (also when started with port 0). */
  url: string;
  port: number;
  config: AppConfig;
  database: Database;
  close(): Promise<void>;
}

/** Database connections per app process (requests hold one only while a query runs). */
export const WEB_POOL_SIZE = 10;

function listen(server: http.Server, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (err: NodeJS.ErrnoException) => {
      if (err.code === "EADDRINUSE") {
        reject(
          new ConfigError(`Port ${port} on ${host} is in use. Stop the other program or set PORT.`),
        );
      } else reject(err);
    };
    server.once("error", onError);
    server.listen(port, host, () => {
      server.off("error", onError);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

export async function startWeb(base: Config): Promise<RunningWeb> {
  const database = connectDatabase(base.databaseUrl, WEB_POOL_SIZE, {
    statementTimeoutMs: base.statementTimeoutMs.request,
  });
  const { pool, db } = database;
  const cleanups = cleanupStack();
  cleanups.push(() => pool.end());
  try {
    const storage = await startStorage(base.storage);
    cleanups.push(() => storage.close());
    const jobs = await startJobQueue({
      connectionString: base.databaseUrl,
      queueSuffix: base.jobQueueSuffix,
      supervise: false,
    });
    cleanups.push(() => jobs.close());
    await removeDeadProcessUploads(base.uploads.dir);
    const mailer = createMailer(smtpTarget(base), base.mailFrom);
    cleanups.push(() => mailer.close());
    const sessionStore = createSessionStore(pool);
    cleanups.push(() => sessionStore.close());

    const server = http.createServer();
    const port = await listen(server, base.port, base.host);
    cleanups.push(
      () =>
        new Promise<void>((resolve) => {
          server.close(() => resolve());
          server.closeIdleConnections();
          // Requests still running get a moment to finish; then their connections go.
          setTimeout(() => server.closeAllConnections(), 5_000).unref();
        }),
    );
    const config: AppConfig = { ...base, port, publicBaseUrl: resolvePublicBaseUrl(base, port) };
    server.on(
      "request",
      createApp(config, { db, pool, sessionStore, mailer, store: storage.store, jobs }),
    );
    const url = resolvePublicBaseUrl({ ...base, publicBaseUrl: undefined }, port);
    return { url, port, config, database, close: cleanups.run };
  } catch (err) {
    await cleanups.run();
    throw err;
  }
}
