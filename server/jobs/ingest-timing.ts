/**
 * How an interrupted layer read is noticed: the reading process refreshes the layer's heartbeat
 * every INGEST_HEARTBEAT_MS; a layer still unsettled whose heartbeat is older than
 * INGEST_STALE_MS is taken as interrupted by the sweep, which runs every INGEST_SWEEP_MS in
 * each worker process (and at its start). A read interrupted by a crash is so resumed or failed
 * at most STALE + SWEEP (30 s) after its last heartbeat: within a minute of the server coming back.
 */
export const INGEST_HEARTBEAT_MS = 5_000;
/** Four missed heartbeats: a busy but living process is never taken for a dead one. */
export const INGEST_STALE_MS = 20_000;
export const INGEST_SWEEP_MS = 10_000;
/** Reads started per layer before an interruption fails it instead of trying again. */
export const INGEST_MAX_ATTEMPTS = 2;
