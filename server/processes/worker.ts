/**
 * The worker process: runs the layer-reading jobs (pg-boss) and the sweep that resumes or
 * fails reads interrupted by a crash. No HTTP. One is enough for a team's uploads; more can run
 * against the same database (jobs and interrupted layers are claimed with row locks).
 */
import type { Config } from "../config";
import { connectDatabase } from "../db/client";
import { startJobQueue } from "../jobs/queue";
import { startWorkers } from "../jobs/workers";
import { removeDeadProcessUploads } from "../layers/upload-storage";
import { startStorage } from "../storage";
import { cleanupStack } from "./cleanup";

export interface RunningWorker {
  close(): Promise<void>;
}

export async function startWorker(config: Config): Promise<RunningWorker> {
  // Jobs write large batches: the longer statement limit (DATABASE_JOB_STATEMENT_TIMEOUT_SECONDS).
  const { pool, db } = connectDatabase(config.databaseUrl, 4, {
    statementTimeoutMs: config.statementTimeoutMs.job,
  });
  const cleanups = cleanupStack();
  cleanups.push(() => pool.end());
  try {
    const storage = await startStorage(config.storage);
    cleanups.push(() => storage.close());
    const jobs = await startJobQueue({
      connectionString: config.databaseUrl,
      queueSuffix: config.jobQueueSuffix,
      supervise: true,
    });
    cleanups.push(() => jobs.close());
    await removeDeadProcessUploads(config.uploads.dir);
    const workers = await startWorkers({ db, store: storage.store, jobs, config, sweep: true });
    cleanups.push(() => workers.stop());
    return { close: cleanups.run };
  } catch (err) {
    await cleanups.run();
    throw err;
  }
}
