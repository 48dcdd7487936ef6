import { EventEmitter } from "node:events";
import { z } from "zod";
import type { Notifications } from "./notifications";

/** The LISTEN/NOTIFY channel of layer changes (shared by every process on the database). */
export const LAYER_EVENTS_CHANNEL = "rillmark_layer_events";

const layerChange = z.object({
  layerId: z.string().uuid(),
  status: z.enum(["queued", "processing", "ready", "failed"]),
});

/** What changed on a layer: its status (the row holds the rest). */
export type LayerChange = z.infer<typeof layerChange>;

/** A change, or "read the row again": news may have been missed while reconnecting. */
export type LayerNews = LayerChange | { layerId: string; status: "recheck" };

/**
 * News of layer changes for every process: the process whose job changed a layer sends a
 * NOTIFY, and each process (its own included) hands it to the requests waiting on that layer.
 */
export class LayerEvents {
  private readonly emitter = new EventEmitter();

  constructor(
    private readonly send: (channel: string, payload: string) => Promise<void>,
    notifications: Notifications,
  ) {
    // One listener per waiting request.
    this.emitter.setMaxListeners(0);
    notifications.onReconnect(() => {
      for (const layerId of this.emitter.eventNames()) {
        this.emitter.emit(layerId, { layerId: String(layerId), status: "recheck" });
      }
    });
  }

  /** Starts hearing other processes' news (before any request waits). */
  static async start(
    send: (channel: string, payload: string) => Promise<void>,
    notifications: Notifications,
  ): Promise<LayerEvents> {
    const events = new LayerEvents(send, notifications);
    await notifications.listen(LAYER_EVENTS_CHANNEL, (payload) => {
      const change = layerChange.safeParse(payload);
      if (change.success) events.emitter.emit(change.data.layerId, change.data);
    });
    return events;
  }

  /** Announces a change to every process; a lost announcement is logged, not thrown. */
  async emit(change: LayerChange): Promise<void> {
    await this.send(LAYER_EVENTS_CHANNEL, JSON.stringify(change)).catch((err: unknown) => {
      console.error(`Could not announce layer ${change.layerId}:`, err);
    });
  }

  /** Calls `listener` on every change of the layer; returns the unsubscribe function. */
  on(layerId: string, listener: (news: LayerNews) => void): () => void {
    this.emitter.on(layerId, listener);
    return () => this.emitter.off(layerId, listener);
  }
}
