import { eq } from "drizzle-orm";
import type { Db } from "../db/client";
import { layers } from "../db/schema-geodata";
import type { LayerEvents } from "../jobs/layer-events";
import type { LayerRow } from "./dto";

const POLL_MS = 500;

/**
 * The layer row once it is ready or failed, or as it stands after `timeoutMs`. News from this
 * process's jobs arrives at once; a job run by another process is seen by polling the row.
 */
export async function waitForLayer(
  db: Db,
  events: LayerEvents,
  layerId: string,
  timeoutMs: number,
): Promise<LayerRow | undefined> {
  const read = async () => (await db.select().from(layers).where(eq(layers.id, layerId)))[0];
  const deadline = Date.now() + timeoutMs;
  let row = await read();
  while (row && (row.status === "queued" || row.status === "processing")) {
    const left = deadline - Date.now();
    if (left <= 0) break;
    await new Promise<void>((resolve) => {
      const timer = setTimeout(done, Math.min(left, POLL_MS));
      const off = events.on(layerId, (change) => {
        if (change.status === "ready" || change.status === "failed") done();
      });
      function done() {
        clearTimeout(timer);
        off();
        resolve();
      }
    });
    row = await read();
  }
  return row;
}
