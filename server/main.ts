/**
 * `npm start` runs this file: the supervisor (server/supervisor.ts) starts the app processes,
 * the worker process and the local stand-ins. `startRillmark()` runs the same parts in this one
 * process instead, for tests and benches that need the whole server on a free port.
 */
import { existsSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { ConfigError, type AppConfig, type Config } from "./config";
import { cleanupStack } from "./processes/cleanup";
import { baseConfig, prepareDatabase, seedDemoThroughApi } from "./processes/prepare";
import { startWeb } from "./processes/web";
import { startWorker } from "./processes/worker";
import { needsStandIns, newStandInCredentials, startStandIns, withStandIns } from "./standins";
import { runSupervisor } from "./supervisor";

export interface RunningRillmark {
  /** Where the server listens, with the real port (also when started with port 0). */
  url: string;
  config: AppConfig;
  close(): Promise<void>;
}

/**
 * Migrate, seed the demo once, start the stand-ins when no S3 or SMTP server is configured,
 * the job worker and one app process, all in this process.
 */
export async function startRillmark(overrides: Partial<Config> = {}): Promise<RunningRillmark> {
  const base = baseConfig(overrides);
  const database = await prepareDatabase(base);
  const cleanups = cleanupStack();
  cleanups.push(() => database.pool.end());
  try {
    let config = base;
    if (needsStandIns(base)) {
      const credentials = newStandInCredentials();
      const standIns = await startStandIns({
        db: database.db,
        s3Dir: base.storage.fakeDir,
        bucket: base.storage.bucket,
        s3Port: base.storage.fakePort,
        smtpPort: base.fakeSmtpPort,
        credentials,
      });
      cleanups.push(() => standIns.close());
      config = withStandIns(base, standIns, credentials);
    }
    const worker = await startWorker(config);
    cleanups.push(() => worker.close());
    const web = await startWeb(config);
    cleanups.push(() => web.close());
    await seedDemoThroughApi(database, web.url);
    return { url: web.url, config: web.config, close: cleanups.run };
  } catch (err) {
    await cleanups.run();
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
  runSupervisor().catch((err: unknown) => {
    console.error(err instanceof ConfigError ? err.message : err);
    process.exit(1);
  });
}
