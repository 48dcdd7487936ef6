import { EventEmitter } from "node:events";

/** What changed on a layer: its status and progress (the row holds the rest). */
export interface LayerChange {
  layerId: string;
  status: "queued" | "processing" | "ready" | "failed";
}

/**
 * In-process news of layer changes, so a waiting upload request or an event stream hears of a
 * finished layer at once. Another process's jobs are seen by polling the row (see waitForLayer).
 */
export class LayerEvents {
  private readonly emitter = new EventEmitter();

  constructor() {
    // One listener per waiting request or open event stream.
    this.emitter.setMaxListeners(0);
  }

  emit(change: LayerChange): void {
    this.emitter.emit(change.layerId, change);
  }

  /** Calls `listener` on every change of the layer; returns the unsubscribe function. */
  on(layerId: string, listener: (change: LayerChange) => void): () => void {
    this.emitter.on(layerId, listener);
    return () => this.emitter.off(layerId, listener);
  }
}
