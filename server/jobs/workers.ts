import path from "node:path";
import type { Config } from "../config";
import type { Db } from "../db/client";
import { ingestLayer } from "../layers/ingest";
import type { ObjectStore } from "../storage";
import { deleteJobIn, type IngestJobData, type JobQueue } from "./queue";

export interface WorkerDeps {
  db: Db;
  store: ObjectStore;
  jobs: JobQueue;
  config: Config;
}

/**
 * Starts this process's job workers (the API process is also the worker process). A job
 * leaves nothing behind: its outcome lives on the layer row, and the job row is deleted in the
 * same transaction that makes the layer ready or failed.
 */
export async function startWorkers(deps: WorkerDeps): Promise<void> {
  const ingestDeps = {
    db: deps.db,
    store: deps.store,
    events: deps.jobs.events,
    workDir: path.join(deps.config.uploads.dir, "work"),
  };
  const workerId = await deps.jobs.boss.work<IngestJobData>(
    deps.jobs.ingestQueue,
    { pollingIntervalSeconds: 0.5, batchSize: 1 },
    async ([job]) => {
      if (!job) return;
      await ingestLayer(ingestDeps, job.data.layerId, job.data.uploadPath, (tx) =>
        deleteJobIn(tx, deps.jobs.ingestQueue, job.id),
      );
    },
  );
  deps.jobs.addIngestWorker(workerId);
}
