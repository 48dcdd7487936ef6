import type { Config } from "../config";
import type { Db } from "../db/client";
import { ingestLayer } from "../layers/ingest";
import { processUploadDir, removeDeadProcessUploads } from "../layers/upload-storage";
import type { ObjectStore } from "../storage";
import { sweepInterruptedIngests } from "./ingest-sweep";
import { INGEST_SWEEP_MS } from "./ingest-timing";
import { deleteJobIn, type IngestJobData, type JobQueue } from "./queue";

export interface WorkerDeps {
  db: Db;
  store: ObjectStore;
  jobs: JobQueue;
  config: Config;
  /**
   * Resume or fail reads interrupted by a crash (server/jobs/ingest-sweep.ts). Test apps share
   * one database but each has its own store, so they leave other apps' layers alone.
   */
  sweep?: boolean;
}

export interface RunningWorkers {
  /** Stops the sweep (the queue itself is closed with the JobQueue). */
  stop(): Promise<void>;
}

/**
 * Starts this process's job workers. A job leaves nothing behind: its outcome lives on the
 * layer row, and the job row is deleted in the same transaction that makes the layer ready or
 * failed.
 */
export async function startWorkers(deps: WorkerDeps): Promise<RunningWorkers> {
  const ingestDeps = {
    db: deps.db,
    store: deps.store,
    events: deps.jobs.events,
    workDir: processUploadDir(deps.config.uploads.dir),
  };
  const workerId = await deps.jobs.boss.work<IngestJobData>(
    deps.jobs.ingestQueue,
    { pollingIntervalSeconds: 2, batchSize: 1 },
    async ([job]) => {
      if (!job) return;
      await ingestLayer(ingestDeps, job.data.layerId, job.data.uploadPath, (tx) =>
        deleteJobIn(tx, deps.jobs.ingestQueue, job.id),
      );
    },
  );
  await deps.jobs.addIngestWorker(workerId);
  if (deps.sweep === false) return { stop: () => Promise.resolve() };

  let running: Promise<unknown> = Promise.resolve();
  const sweep = () => {
    running = running
      .then(async () => {
        await removeDeadProcessUploads(deps.config.uploads.dir);
        return sweepInterruptedIngests(deps);
      })
      .then(({ resumed, failed }) => {
        if (resumed.length) console.log(`Resumed interrupted layer reads: ${resumed.join(", ")}`);
        if (failed.length) console.log(`Failed interrupted layer reads: ${failed.join(", ")}`);
      })
      .catch((err: unknown) => console.error("Ingest sweep failed:", err));
  };
  sweep();
  const timer = setInterval(sweep, INGEST_SWEEP_MS);
  timer.unref();
  return {
    async stop() {
      clearInterval(timer);
      await running;
    },
  };
}
