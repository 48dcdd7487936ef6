import { eq } from "drizzle-orm";
import type { Db } from "../db/client";
import { layers } from "../db/schema-geodata";
import type { LayerEvents } from "../jobs/layer-events";
import type { LayerRow } from "./dto";

const settled = (status: string) => status === "ready" || status === "failed";

/**
 * The layer row once it is ready or failed, or as it stands after `timeoutMs`. Whichever
 * process runs the job announces the end (LISTEN/NOTIFY); the row is read again on that news,
 * never on a timer. The subscription starts before the first read, so an end announced in
 * between is not missed.
 */
export async function waitForLayer(
  db: Db,
  events: LayerEvents,
  layerId: string,
  timeoutMs: number,
): Promise<LayerRow | undefined> {
  const read = async () => (await db.select().from(layers).where(eq(layers.id, layerId)))[0];
  const deadline = Date.now() + timeoutMs;
  let heard = false;
  let wake: () => void = () => undefined;
  const off = events.on(layerId, (news) => {
    if (news.status === "processing" || news.status === "queued") return;
    heard = true;
    wake();
  });
  try {
    let row = await read();
    while (row && !settled(row.status)) {
      const left = deadline - Date.now();
      if (left <= 0) break;
      if (!heard) {
        await new Promise<void>((resolve) => {
          const timer = setTimeout(resolve, left);
          wake = () => {
            clearTimeout(timer);
            resolve();
          };
        });
      }
      heard = false;
      row = await read();
    }
    return row;
  } finally {
    off();
  }
}
