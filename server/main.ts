import { existsSync } from "node:fs";
import http from "node:http";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { createApp } from "./app";
import { createSessionStore } from "./auth/session";
import {
  assertSafeForProduction,
  ConfigError,
  loadConfig,
  resolvePublicBaseUrl,
  type AppConfig,
  type Config,
} from "./config";
import { connectDatabase } from "./db/client";
import { runMigrations } from "./db/migrate";
import { startJobQueue } from "./jobs/queue";
import { startWorkers } from "./jobs/workers";
import { removeStaleUploads } from "./layers/upload-storage";
import { startFakeSmtp, type FakeSmtp } from "./mail/fake-smtp";
import { createMailer, smtpTarget } from "./mail/mailer";
import { seedBasemap } from "./seed/basemap";
import { readyLine, seedDemo } from "./seed/demo";
import { seedDemoGeodata } from "./seed/demo-geodata";
import { startStorage } from "./storage";

export interface RunningRillmark {
  /** Where the server listens, with the real port (also when started with port 0). */
  url: string;
  config: AppConfig;
  close(): Promise<void>;
}

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

/**
 * Migrate, seed the demo once, start the local mail server when no SMTP server is configured,
 * and serve API + client. Environment first, then `overrides` (tests pass e.g. `{ port: 0 }`).
 */
export async function startRillmark(overrides: Partial<Config> = {}): Promise<RunningRillmark> {
  const env = { ...process.env };
  if (overrides.databaseUrl) env.DATABASE_URL = overrides.databaseUrl;
  const base: Config = { ...loadConfig(env), ...overrides };
  assertSafeForProduction(base);
  if (base.publicBaseUrl?.startsWith("https:") && !base.trustProxy) {
    // The session cookie is Secure then, and Express only sends it on a request it knows came
    // over HTTPS, which (Rillmark serving plain HTTP) means through a trusted proxy.
    console.warn(
      "PUBLIC_BASE_URL is https but TRUST_PROXY is off: sign-in cookies will not be set.",
    );
  }

  await runMigrations(base.databaseUrl);
  const { pool, db } = connectDatabase(base.databaseUrl);
  const cleanups: (() => Promise<void> | void)[] = [() => pool.end()];
  const closeAll = async () => {
    for (const cleanup of cleanups.reverse()) await cleanup();
  };
  try {
    // Storage and jobs first: the demo seed loads its layers through the upload pipeline.
    const storage = await startStorage(base.storage);
    cleanups.push(() => storage.close());
    const jobs = await startJobQueue({
      connectionString: base.databaseUrl,
      queueSuffix: base.jobQueueSuffix,
      supervise: true,
    });
    cleanups.push(() => jobs.close());
    await removeStaleUploads(base.uploads.dir);
    await startWorkers({ db, store: storage.store, jobs, config: base });
    await seedDemo(db);
    await seedBasemap(db);
    let fakeSmtp: FakeSmtp | undefined;
    if (!base.smtp.host) {
      fakeSmtp = await startFakeSmtp(db, base.fakeSmtpPort);
      cleanups.push(() => fakeSmtp?.close());
    }
    const mailer = createMailer(smtpTarget(base, fakeSmtp?.port), base.mailFrom);
    cleanups.push(() => mailer.close());
    const sessionStore = createSessionStore(pool);
    cleanups.push(() => sessionStore.close());

    const server = http.createServer();
    const port = await listen(server, base.port, base.host);
    cleanups.push(
      () =>
        new Promise<void>((resolve) => {
          server.close(() => resolve());
          server.closeAllConnections();
        }),
    );
    const url = resolvePublicBaseUrl({ ...base, publicBaseUrl: undefined }, port);
    const config: AppConfig = {
      ...base,
      port,
      publicBaseUrl: resolvePublicBaseUrl(base, port),
      fakeSmtpPort: fakeSmtp?.port ?? base.fakeSmtpPort,
    };
    server.on(
      "request",
      createApp(config, { db, sessionStore, mailer, store: storage.store, jobs }),
    );
    // The demo's layers, rules and subcatchment go in through the API a user's browser calls,
    // so they wait for the server; a failure is reported and retried at the next start.
    const demo = await seedDemoGeodata({ db, pool, baseUrl: url });
    if (!demo.ran && demo.reason.startsWith("failed")) {
      console.warn(
        `The demo project's geodata was not loaded (retried at next start): ${demo.reason}`,
      );
    }

    let closing: Promise<void> | undefined;
    return { url, config, close: () => (closing ??= closeAll()) };
  } catch (err) {
    await closeAll();
    throw err;
  }
}

function loadDotEnv(): void {
  // Optional local overrides; real environment variables win over the file.
  if (existsSync(".env")) process.loadEnvFile(".env");
}

const runDirectly =
  process.argv[1] !== undefined && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);

if (runDirectly) {
  loadDotEnv();
  startRillmark().then(
    (running) => {
      console.log(readyLine(running.url));
      let stopping = false;
      const stop = (signal: NodeJS.Signals) => {
        if (stopping) process.exit(1); // a second Ctrl-C: do not wait any longer
        stopping = true;
        running.close().then(
          () => process.exit(0),
          (err: unknown) => {
            console.error(`Error while stopping after ${signal}:`, err);
            process.exit(1);
          },
        );
      };
      process.on("SIGINT", stop);
      process.on("SIGTERM", stop);
    },
    (err: unknown) => {
      console.error(err instanceof ConfigError ? err.message : err);
      process.exit(1);
    },
  );
}
