import { sql } from "drizzle-orm";
import PgBoss from "pg-boss";
import type { Tx } from "../db/client";
import { LayerEvents } from "./layer-events";

export const LAYER_INGEST_QUEUE = "layer-ingest";

export interface IngestJobData {
  layerId: string;
  /** The upload's temp file, used when the worker runs on the same machine (else downloaded). */
  uploadPath?: string;
}

/** The job queue (pg-boss, in PostgreSQL) and the news of layers its jobs change. */
export interface JobQueue {
  readonly boss: PgBoss;
  readonly ingestQueue: string;
  readonly events: LayerEvents;
  /** Queues the reading of an uploaded layer; answers the job id. */
  sendIngest(data: IngestJobData): Promise<string>;
  deleteJob(jobId: string): Promise<void>;
  /** Remembers a worker of this process, so a new job wakes it at once instead of a poll. */
  addIngestWorker(workerId: string): void;
  close(): Promise<void>;
}

export interface JobQueueOptions {
  connectionString: string;
  /** Appended to queue names (tests: one per app sharing a database). */
  queueSuffix: string;
  /** Run maintenance (archiving, expiry); off in tests, which stop within seconds. */
  supervise: boolean;
  /** Drop this app's queues on close (tests, whose queue names are their own). */
  deleteQueuesOnClose?: boolean;
}

export async function startJobQueue(options: JobQueueOptions): Promise<JobQueue> {
  const boss = new PgBoss({
    connectionString: options.connectionString,
    max: 4,
    schedule: false,
    supervise: options.supervise,
  });
  boss.on("error", (err: Error) => console.error("Job queue error:", err.message));
  await boss.start();
  const ingestQueue = `${LAYER_INGEST_QUEUE}${options.queueSuffix}`;
  await boss.createQueue(ingestQueue, {
    name: ingestQueue,
    // A job's failures are recorded on the layer; a retry is only for a crashed process.
    retryLimit: 1,
    expireInSeconds: 30 * 60,
  });
  const ingestWorkers: string[] = [];
  return {
    boss,
    ingestQueue,
    events: new LayerEvents(),
    async sendIngest(data) {
      const id = await boss.send(ingestQueue, data);
      if (!id) throw new Error("the job queue refused the ingest job");
      for (const worker of ingestWorkers) boss.notifyWorker(worker);
      return id;
    },
    addIngestWorker(workerId) {
      ingestWorkers.push(workerId);
    },
    async deleteJob(jobId) {
      await boss.deleteJob(ingestQueue, jobId);
    },
    async close() {
      if (options.deleteQueuesOnClose) {
        await boss.offWork(ingestQueue);
        await boss.deleteQueue(ingestQueue);
      }
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}

/**
 * Deletes a job inside one of our transactions (pg-boss keeps its jobs in the same database,
 * schema "pgboss"), so the job disappears exactly when the work it did is committed.
 */
export async function deleteJobIn(tx: Tx, queue: string, jobId: string): Promise<void> {
  await tx.execute(sql`delete from pgboss.job where name = ${queue} and id = ${jobId}::uuid`);
}
