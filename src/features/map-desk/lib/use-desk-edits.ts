/**
 * Every edit the desk sends besides the path itself (breaks, surveyed elevations, surfaces,
 * reversing, boundary, outlet, files), each followed by a fresh compute so the sheet never shows
 * numbers for geometry that is no longer there.
 */
import { useQueryClient } from "@tanstack/react-query";
import { useCallback, useState } from "react";
import { ftFromM } from "../../../../shared/hydrology/units";
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";
import { isApiError } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";
import { useSaveBreaks } from "../api/save-breaks";
import { useSaveElevations, type SurveyEntry } from "../api/save-elevations";
import { useSaveSurfaceOverrides } from "../api/save-surface-overrides";
import { useReversePath } from "../api/reverse-path";
import { useUpdateSubcatchment } from "../api/update-subcatchment";
import { useUploadGeometryFile, type GeometryFileInput } from "../api/upload-geometry-file";
import { hasBreaks, type OutlineChange } from "./desk-history";
import type { BreakChange } from "./regime-edit";
import { withSurfaceStretch, withinLength } from "./surface-edit";

/** Two surveyed points closer than this (project length unit) are the same point. */
const SAME_STATION = 0.01;

export function useDeskEdits(
  subcatchment: Subcatchment,
  projectId: string,
  recompute: () => Promise<unknown>,
) {
  const id = subcatchment.id;
  const breaks = useSaveBreaks(id);
  const elevations = useSaveElevations(id);
  const surfaces = useSaveSurfaceOverrides(id);
  const reverse = useReversePath(id);
  const update = useUpdateSubcatchment(id, projectId);
  const upload = useUploadGeometryFile(id);
  const [error, setError] = useState<string | null>(null);
  const queryClient = useQueryClient();
  // Two versions: the path's (path, breaks, surveyed points, surfaces) and the subcatchment's
  // own (boundary, outlet and the other fields).
  const version = subcatchment.flowPath?.version ?? 0;

  // True once the change is saved (the compute after it may still fail, as it says itself).
  const run = useCallback(
    async (action: () => Promise<unknown>): Promise<boolean> => {
      setError(null);
      try {
        await action();
      } catch (e) {
        setError(isApiError(e) ? e.message : "The change could not be saved.");
        // Someone else saved first: fetch their version, so the next try starts from it.
        if (isApiError(e, 409)) {
          await queryClient.invalidateQueries({ queryKey: queryKeys.subcatchment(id) });
        }
        return false;
      }
      try {
        await recompute();
      } catch (e) {
        setError(isApiError(e) ? e.message : "The change could not be saved.");
      }
      return true;
    },
    [recompute, queryClient, id],
  );

  const moveBreaks = (change: BreakChange) => run(() => breaks.mutateAsync({ ...change, version }));

  const setElevation = (station: number, elevation: number) => {
    const kept: SurveyEntry[] = subcatchment.elevations
      .filter((e) => Math.abs(e.station - station) > SAME_STATION)
      .map((e) => ({ station: e.station, elevation: e.elevation, note: e.note }));
    return run(() =>
      elevations.mutateAsync({
        entries: [...kept, { station, elevation, note: "Entered on the Map desk" }],
        version,
      }),
    );
  };

  const clearElevation = (station: number) =>
    run(() =>
      elevations.mutateAsync({
        entries: subcatchment.elevations.filter(
          (e) => Math.abs(e.station - station) > SAME_STATION,
        ),
        version,
      }),
    );

  const lengthM = subcatchment.flowPath?.lengthM ?? 0;
  const pathLength = subcatchment.lengthUnit === "ft" ? ftFromM(lengthM) : lengthM;
  /** A segment's stretch (project length unit) given a class, or back to the cover layer. */
  const setSurface = (
    stretch: { stationFrom: number; stationTo: number },
    surfaceClassId: string | null,
  ) =>
    run(() =>
      surfaces.mutateAsync({
        entries: withSurfaceStretch(
          withinLength(subcatchment.surfaceOverrides, pathLength),
          stretch,
          surfaceClassId,
          "Chosen on the Map desk",
        ),
        version,
      }),
    );

  /** Reverses the saved path; `breaksAfter` (undoing a reversal) are set on the result. */
  const reversePath = (breaksAfter?: BreakChange) =>
    run(async () => {
      const reversed = await reverse.mutateAsync(version);
      if (breaksAfter && hasBreaks(breaksAfter)) {
        await breaks.mutateAsync({ ...breaksAfter, version: reversed.flowPath?.version ?? 0 });
      }
    });

  /** A new boundary or outlet (drawn, or put back by undo or redo). */
  const setOutline = (patch: OutlineChange) =>
    run(() => update.mutateAsync({ ...patch, version: subcatchment.version }));

  const loadFile = (input: Omit<GeometryFileInput, "version">) =>
    run(() =>
      upload.mutateAsync({
        ...input,
        version: input.what === "boundary" ? subcatchment.version : version,
      }),
    );

  const busy =
    breaks.isPending ||
    elevations.isPending ||
    surfaces.isPending ||
    reverse.isPending ||
    update.isPending ||
    upload.isPending;
  return {
    moveBreaks,
    setElevation,
    clearElevation,
    setSurface,
    reversePath,
    setOutline,
    loadFile,
    busy,
    error,
  };
}
