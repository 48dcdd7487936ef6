import { randomUUID } from "node:crypto";
import { mkdir, rename, rm } from "node:fs/promises";
import path from "node:path";
import { and, eq, inArray, sql } from "drizzle-orm";
import type { LayerError, LayerProgress } from "../../shared/schemas/layers";
import type { Db, Tx } from "../db/client";
import { layers } from "../db/schema-geodata";
import { ReadError, VECTOR_FORMATS, type VectorFormat } from "../geodata/readers/types";
import { inspectTerrain } from "../geodata/terrain";
import type { LayerEvents } from "../jobs/layer-events";
import { INGEST_HEARTBEAT_MS } from "../jobs/ingest-timing";
import { parseVectorInThread } from "../jobs/parse-thread";
import type { ObjectStore } from "../storage";
import type { LayerRow } from "./dto";
import { INSERT_BATCH } from "./geometry-kinds";
import { featureBbox, insertFeatures, repairOrRejectPolygons } from "./feature-store";
import { logError } from "../log";

export interface IngestDeps {
  db: Db;
  store: ObjectStore;
  events: LayerEvents;
  /** Where a copy of the stored original is put when the upload's own file is not at hand. */
  workDir: string;
}

function isVectorFormat(format: string): format is VectorFormat {
  return (VECTOR_FORMATS as readonly string[]).includes(format);
}

/** Throttled progress on the layer row, announced to waiting requests and event streams. */
function progressReporter(deps: IngestDeps, row: LayerRow) {
  let current = row.progress as LayerProgress;
  let lastWrite = 0;
  return async (change: Partial<LayerProgress>, force = false) => {
    current = { ...current, ...change };
    const now = Date.now();
    if (!force && now - lastWrite < 250) return;
    lastWrite = now;
    await deps.db
      .update(layers)
      .set({ progress: current, status: "processing" })
      // Never over a final status: a late report must not revive a failed layer.
      .where(and(eq(layers.id, row.id), inArray(layers.status, ["queued", "processing"])));
    void deps.events.emit({ layerId: row.id, status: "processing" });
  };
}

/** Runs in the transaction that makes the layer ready or failed (the job's own clean-up). */
export type OnFinal = (tx: Tx) => Promise<void>;

async function ingestVector(
  deps: IngestDeps,
  row: LayerRow,
  filePath: string,
  format: string,
  onFinal: OnFinal,
) {
  if (!isVectorFormat(format)) throw new Error(`layer ${row.id} has format ${format}`);
  const progress = progressReporter(deps, row);
  await progress({ stage: "reading" }, true);
  const read = await parseVectorInThread(
    { filePath, format, originalName: row.originalFilename, kind: row.kind },
    (done, total) => void progress({ featuresDone: done, featuresTotal: total }),
  );
  const total = read.count;
  await progress({ stage: "saving", featuresDone: 0, featuresTotal: total }, true);
  await deps.db.transaction(async (tx) => {
    await insertFeatures(tx, row.id, read.batches, (batchesDone) =>
      progress({ featuresDone: Math.min(total, batchesDone * INSERT_BATCH) }),
    );
    const repairs =
      row.kind === "channel" ? [] : await repairOrRejectPolygons(tx, row.id, row.originalFilename);
    await tx
      .update(layers)
      .set({
        status: "ready",
        featureCount: total,
        fields: [...read.fields],
        // The reader already notes a reprojection; WGS84 input needs no note.
        notes: [...read.notes, ...repairs],
        bbox4326: await featureBbox(tx, row.id),
        progress: {
          ...(row.progress as LayerProgress),
          stage: "done",
          featuresDone: total,
          featuresTotal: total,
        },
        error: null,
      })
      .where(eq(layers.id, row.id));
    await onFinal(tx);
  });
}

async function ingestTerrain(deps: IngestDeps, row: LayerRow, filePath: string, onFinal: OnFinal) {
  const stored = (row.terrain ?? {}) as { verticalUnit?: "m" | "ft" };
  const info = await inspectTerrain(filePath, stored.verticalUnit ?? "m", row.originalFilename);
  await deps.db.transaction(async (tx) => {
    await tx
      .update(layers)
      .set({
        status: "ready",
        terrain: { ...info },
        bbox4326: [...info.bbox4326],
        progress: { ...(row.progress as LayerProgress), stage: "done" },
        error: null,
      })
      .where(eq(layers.id, row.id));
    await onFinal(tx);
  });
}

/**
 * Puts the file to read at `target`, in this process's work folder (removed with the folder
 * should the process die): the upload's temp file moved there when it is on this machine, else
 * a download of the stored original.
 */
async function takeFile(
  deps: IngestDeps,
  objectKey: string,
  uploadPath: string | undefined,
  target: string,
) {
  await mkdir(deps.workDir, { recursive: true });
  if (uploadPath) {
    try {
      await rename(uploadPath, target);
      return;
    } catch {
      // Gone (its process died and the folder was cleaned) or on another disk: download it.
    }
  }
  await deps.store.getToFile(objectKey, target);
}

/**
 * Counts the attempt and keeps the layer's heartbeat fresh while this process reads it, so the
 * ingest sweep can tell a running read from one whose process died (a pg-boss job alone would
 * look active for its whole expiry, 30 minutes). Answers the function that stops it.
 */
async function startHeartbeat(db: Db, layerId: string): Promise<() => void> {
  const unsettled = and(eq(layers.id, layerId), inArray(layers.status, ["queued", "processing"]));
  await db
    .update(layers)
    .set({ ingestHeartbeatAt: sql`now()`, ingestAttempts: sql`${layers.ingestAttempts} + 1` })
    .where(unsettled);
  const timer = setInterval(() => {
    db.update(layers)
      .set({ ingestHeartbeatAt: sql`now()` })
      .where(unsettled)
      .catch((err: unknown) => console.error(`Heartbeat of layer ${layerId} failed:`, err));
  }, INGEST_HEARTBEAT_MS);
  return () => clearInterval(timer);
}

function toLayerError(err: unknown): LayerError {
  if (err instanceof ReadError) {
    return {
      status: err.status,
      code: err.code,
      message: err.message,
      ...(err.where && { where: err.where }),
    };
  }
  logError("Layer ingest failed:", err);
  return {
    status: 500,
    code: "internal_error",
    message: "The file could not be processed because of a server error. Try again.",
  };
}

/**
 * Reads an uploaded layer's file into its features (vector) or its description (terrain). A
 * refused file leaves the row marked failed with the error, and no feature and no stored
 * object behind; the features go in one transaction, so a failure rolls all of them back.
 * `onFinal` runs in the transaction that sets the final status, so "ready or failed" and "the
 * job is gone" become true together (a crash before it leaves the job to be retried).
 */
export async function ingestLayer(
  deps: IngestDeps,
  layerId: string,
  uploadPath: string | undefined,
  onFinal: OnFinal,
): Promise<void> {
  const [row] = await deps.db.select().from(layers).where(eq(layers.id, layerId));
  if (!row || row.status === "ready" || !row.objectKey) {
    // Deleted meanwhile, or already done: nothing to read.
    await deps.db.transaction(onFinal);
    if (uploadPath) await rm(uploadPath, { force: true });
    return;
  }
  const stopHeartbeat = await startHeartbeat(deps.db, layerId);
  const filePath = path.join(deps.workDir, `ingest-${randomUUID()}`);
  try {
    await takeFile(deps, row.objectKey, uploadPath, filePath);
    if (row.kind === "terrain") await ingestTerrain(deps, row, filePath, onFinal);
    else await ingestVector(deps, row, filePath, row.format, onFinal);
    await deps.events.emit({ layerId, status: "ready" });
  } catch (err) {
    const error = toLayerError(err);
    await deps.store.delete(row.objectKey).catch((e: unknown) => {
      console.error(`Could not delete the stored file of failed layer ${layerId}:`, e);
    });
    await deps.db.transaction(async (tx) => {
      await tx
        .update(layers)
        .set({ status: "failed", error, objectKey: null })
        .where(eq(layers.id, layerId));
      await onFinal(tx);
    });
    await deps.events.emit({ layerId, status: "failed" });
  } finally {
    stopHeartbeat();
    if (uploadPath) await rm(uploadPath, { force: true });
    await rm(filePath, { force: true });
  }
}
