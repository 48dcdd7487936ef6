/**
 * The flow path being edited: a local draft that the live split shows at once, saved when the
 * engineer pauses (600 ms) under the version it started from, then computed. A 409 (someone
 * saved in between) keeps the draft and asks: keep mine (save over the new version) or take
 * the saved path. Nothing is dropped silently.
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

  const send = useCallback(
    async (coords: LonLat[], version: number) => {
      setError(null);
      try {
        await save.mutateAsync({ coordinates: coords, version });
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
    setDraft(coords);
    setSettled(isSettled);
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

  return { draft, edit, conflict, keepMine, takeSaved, saving: save.isPending, error };
}
