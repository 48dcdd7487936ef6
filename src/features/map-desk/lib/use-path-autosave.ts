/**
 * The flow path being edited: a local draft that the live split shows at once, saved when the
 * engineer pauses (600 ms) under the version it started from, then computed. A 409 (someone
 * saved in between) keeps the draft and asks: keep mine (save over the new version) or take
 * the saved path. Nothing is dropped silently. Each saved edit is reported with the path it
 * replaced (for undo); a path put back by undo or redo is saved without being reported again.
 * A path still being traced is shown, not saved, until the trace is finished.
 */
import { useCallback, useEffect, useRef, useState } from "react";
import type { LonLat } from "../../../../shared/geo";
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";
import { isApiError } from "../../../lib/api";
import { useSaveFlowPath } from "../api/save-flow-path";

export const PAUSE_MS = 600;

export interface PathConflict {
  /** The version now on the server. */
  version: number;
}

export function usePathAutosave(
  subcatchment: Subcatchment,
  afterSave: () => Promise<unknown>,
  refetch: () => Promise<Subcatchment | undefined>,
  onSaved?: (before: readonly LonLat[], after: readonly LonLat[]) => void,
) {
  const [draft, setDraft] = useState<LonLat[] | null>(null);
  const [settled, setSettled] = useState(true);
  const [conflict, setConflict] = useState<PathConflict | null>(null);
  const [error, setError] = useState<string | null>(null);
  const save = useSaveFlowPath(subcatchment.id);
  const versionRef = useRef(subcatchment.flowPath?.version ?? 0);
  versionRef.current = subcatchment.flowPath?.version ?? 0;
  const draftRef = useRef(draft);
  draftRef.current = draft;
  const savedRef = useRef<LonLat[]>([]);
  savedRef.current = (subcatchment.flowPath?.geometry.coordinates ?? []).map(([x, y]): LonLat => [
    x,
    y,
  ]);
  // The saved path when the current draft began, and whether undo or redo made the draft.
  const baseRef = useRef<LonLat[]>([]);
  const quietRef = useRef(false);
  const settledRef = useRef(settled);
  // The draft a trace began over, put back if the trace is left unfinished.
  const beforeTraceRef = useRef<LonLat[] | null>(null);
  const onSavedRef = useRef(onSaved);
  onSavedRef.current = onSaved;

  const send = useCallback(
    async (coords: LonLat[], version: number) => {
      setError(null);
      try {
        await save.mutateAsync({ coordinates: coords, version });
        if (!quietRef.current) onSavedRef.current?.(baseRef.current, coords);
        baseRef.current = coords;
        // A newer edit made while this one was on its way stays as the draft.
        if (draftRef.current === coords) setDraft(null);
        await afterSave();
      } catch (e) {
        if (isApiError(e, 409)) {
          const fresh = await refetch();
          setConflict({ version: fresh?.flowPath?.version ?? version + 1 });
        } else {
          setError(isApiError(e) ? e.message : "The path could not be saved.");
        }
      }
    },
    [save, afterSave, refetch],
  );

  useEffect(() => {
    if (!draft || !settled || conflict || draft.length < 2) return;
    const timer = window.setTimeout(() => void send(draft, versionRef.current), PAUSE_MS);
    return () => window.clearTimeout(timer);
  }, [draft, settled, conflict, send]);

  const edit = useCallback((coords: LonLat[], isSettled: boolean) => {
    if (draftRef.current === null) baseRef.current = savedRef.current;
    // A drawing edit on top of a put-back path is the engineer's own change again.
    quietRef.current = false;
    if (!isSettled && settledRef.current) beforeTraceRef.current = draftRef.current;
    settledRef.current = isSettled;
    setDraft(coords);
    setSettled(isSettled);
  }, []);

  /** A trace left unfinished: the desk goes back to what it showed before the trace began. */
  const cancelTrace = useCallback(() => {
    if (settledRef.current) return;
    settledRef.current = true;
    setDraft(beforeTraceRef.current);
    setSettled(true);
  }, []);

  /** Puts a path back (undo, redo): saved like an edit, not reported as a new one. */
  const restore = useCallback((coords: LonLat[]) => {
    baseRef.current = savedRef.current;
    quietRef.current = true;
    settledRef.current = true;
    setDraft(coords);
    setSettled(true);
  }, []);

  const keepMine = useCallback(() => {
    const coords = draftRef.current;
    const version = conflict?.version;
    setConflict(null);
    if (coords && version !== undefined) void send(coords, version);
  }, [conflict, send]);

  const takeSaved = useCallback(() => {
    setConflict(null);
    setDraft(null);
  }, []);

  return {
    draft,
    /** A path is being traced: the draft is the vertices clicked so far, not yet to be saved. */
    tracing: draft !== null && !settled,
    edit,
    restore,
    cancelTrace,
    conflict,
    keepMine,
    takeSaved,
    saving: save.isPending,
    error,
  };
}
