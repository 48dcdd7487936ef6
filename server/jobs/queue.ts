import { sql } from "drizzle-orm";
import PgBoss from "pg-boss";
import type { Tx } from "../db/client";
import { LayerEvents } from "./layer-events";
import { startNotifications, type Notifications } from "./notifications";

export const LAYER_INGEST_QUEUE = "layer-ingest";
/** NOTIFY channel that wakes the ingest workers of every process when a job is queued. */
const INGEST_QUEUED_CHANNEL = "rillmark_ingest_queued";

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
  /** Wakes a worker of this process whenever any process queues an ingest (else it polls). */
  addIngestWorker(workerId: string): Promise<void>;
  close(): Promise<void>;
}

export interface JobQueueOptions {
  connectionString: string;
  /** Appended to queue names (tests: one per app sharing a database). */
  queueSuffix: string;
  /** Run maintenance (archiving, expiry): the worker process does, web processes do not. */
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
    // A job's failures are recorded on the layer, and an interrupted one is resumed by the
    // ingest sweep (server/jobs/ingest-sweep.ts); pg-boss's own retry would only duplicate it.
    retryLimit: 0,
    expireInSeconds: 30 * 60,
  });
  let notifications: Notifications | undefined;
  try {
    notifications = await startNotifications(options.connectionString);
  } catch (err) {
    await boss.stop({ graceful: false, wait: true });
    throw err;
  }
  const send = async (channel: string, payload: string) => {
    await boss.getDb().executeSql("select pg_notify($1, $2)", [channel, payload]);
  };
  const events = await LayerEvents.start(send, notifications);
  const wake = JSON.stringify({ queue: ingestQueue });
  return {
    boss,
    ingestQueue,
    events,
    async sendIngest(data) {
      const id = await boss.send(ingestQueue, data);
      if (!id) throw new Error("the job queue refused the ingest job");
      await send(INGEST_QUEUED_CHANNEL, wake).catch(() => undefined); // workers poll anyway
      return id;
    },
    async addIngestWorker(workerId) {
      await notifications.listen(INGEST_QUEUED_CHANNEL, (payload) => {
        if ((payload as { queue?: unknown } | null)?.queue === ingestQueue) {
          boss.notifyWorker(workerId);
        }
      });
    },
    async deleteJob(jobId) {
      await boss.deleteJob(ingestQueue, jobId);
    },
    async close() {
      await notifications.close();
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
