/**
 * Finds layer reads interrupted by a crash (a process killed mid-read, a web process killed
 * between storing the file and queueing its job) and resumes or fails them, so no layer stays
 * "processing" for the 30 minutes pg-boss would take to expire its job. Runs in every worker
 * process at start and then every INGEST_SWEEP_MS; each layer is claimed with a row lock (SKIP
 * LOCKED), so two worker processes never take the same one.
 *
 * A layer is interrupted when it is queued or processing, its heartbeat (or, never started, its
 * creation) is older than INGEST_STALE_MS, and no job is waiting to read it. Then:
 *   - its stored original is there and it has had fewer than INGEST_MAX_ATTEMPTS reads:
 *     queued again (the new job downloads the original: the upload's temp file may be gone);
 *   - otherwise: failed, with a message saying what happened, and its stored file removed.
 * Its old job row, if any, is deleted in the same transaction.
 */
import { eq, sql } from "drizzle-orm";
import type { LayerError } from "../../shared/schemas/layers";
import type { Db } from "../db/client";
import { layers } from "../db/schema-geodata";
import type { ObjectStore } from "../storage";
import { INGEST_MAX_ATTEMPTS, INGEST_STALE_MS } from "./ingest-timing";
import { LAYER_INGEST_QUEUE, type JobQueue } from "./queue";

export interface SweepDeps {
  db: Db;
  store: ObjectStore;
  jobs: JobQueue;
}

export interface SweepOutcome {
  resumed: string[];
  failed: string[];
}

interface StaleRow extends Record<string, unknown> {
  id: string;
  object_key: string | null;
  ingest_attempts: number;
}

const INTERRUPTED: LayerError = {
  status: 500,
  code: "ingest_interrupted",
  message:
    "Reading this file was interrupted twice (the server stopped while reading it). " +
    "Delete the layer and upload the file again; if it happens again, the file may be too " +
    "large to read here.",
};

const NOT_STORED: LayerError = {
  status: 500,
  code: "upload_interrupted",
  message: "The upload was interrupted before the file was stored. Upload the file again.",
};

/** One pass: every interrupted layer resumed or failed. */
export async function sweepInterruptedIngests(
  deps: SweepDeps,
  staleMs = INGEST_STALE_MS,
): Promise<SweepOutcome> {
  const outcome: SweepOutcome = { resumed: [], failed: [] };
  for (;;) {
    const handled = await deps.db.transaction(async (tx) => {
      // One layer per transaction: a slow store check never holds many locks.
      const found = await tx.execute<StaleRow>(sql`
        select l.id, l.object_key, l.ingest_attempts from layers l
        where l.status in ('queued', 'processing')
          and coalesce(l.ingest_heartbeat_at, l.created_at)
              < now() - make_interval(secs => ${staleMs / 1000})
          and not exists (
            select 1 from pgboss.job j
            where j.name like ${`${LAYER_INGEST_QUEUE}%`} and j.state in ('created', 'retry')
              and j.data->>'layerId' = l.id::text)
        order by l.created_at
        limit 1
        for update of l skip locked`);
      const row = found.rows[0];
      if (!row) return undefined;
      await tx.execute(sql`
        delete from pgboss.job
        where name like ${`${LAYER_INGEST_QUEUE}%`} and data->>'layerId' = ${row.id}`);
      const stored = row.object_key ? await deps.store.exists(row.object_key) : false;
      if (stored && row.ingest_attempts < INGEST_MAX_ATTEMPTS) {
        await tx
          .update(layers)
          .set({ status: "queued", ingestHeartbeatAt: sql`now()` })
          .where(eq(layers.id, row.id));
        return { id: row.id, resumed: true, objectKey: row.object_key };
      }
      await tx
        .update(layers)
        .set({ status: "failed", error: stored ? INTERRUPTED : NOT_STORED, objectKey: null })
        .where(eq(layers.id, row.id));
      return { id: row.id, resumed: false, objectKey: row.object_key };
    });
    if (!handled) return outcome;
    if (handled.resumed) {
      // After the commit: the job must find the layer queued. Should this process die right
      // here, the layer is stale again and the next sweep queues it.
      await deps.jobs.sendIngest({ layerId: handled.id });
      outcome.resumed.push(handled.id);
    } else {
      if (handled.objectKey) {
        await deps.store.delete(handled.objectKey).catch((err: unknown) => {
          console.error(`Could not delete the stored file of layer ${handled.id}:`, err);
        });
      }
      await deps.jobs.events.emit({ layerId: handled.id, status: "failed" });
      outcome.failed.push(handled.id);
    }
  }
}
