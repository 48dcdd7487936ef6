/**
 * Every edit the desk sends besides the path itself (breaks, surveyed elevations, surfaces,
 * reversing, boundary, outlet, files), each followed by a fresh compute so the sheet never shows
 * numbers for geometry that is no longer there.
 */
import { useCallback, useState } from "react";
import type { LonLat } from "../../../../shared/geo";
import { ftFromM } from "../../../../shared/hydrology/units";
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";
import { isApiError } from "../../../lib/api";
import { useSaveBreaks } from "../api/save-breaks";
import { useSaveElevations, type SurveyEntry } from "../api/save-elevations";
import { useSaveSurfaceOverrides } from "../api/save-surface-overrides";
import { useReversePath } from "../api/reverse-path";
import { useUpdateSubcatchment } from "../api/update-subcatchment";
import { useUploadGeometryFile, type GeometryFileInput } from "../api/upload-geometry-file";
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
  const version = subcatchment.flowPath?.version ?? 0;

  const run = useCallback(
    async (action: () => Promise<unknown>) => {
      setError(null);
      try {
        await action();
        await recompute();
      } catch (e) {
        setError(isApiError(e) ? e.message : "The change could not be saved.");
      }
    },
    [recompute],
  );

  const moveBreaks = (change: BreakChange) => run(() => breaks.mutateAsync({ ...change, version }));

  const setElevation = (station: number, elevation: number) => {
    const kept: SurveyEntry[] = subcatchment.elevations
      .filter((e) => Math.abs(e.station - station) > SAME_STATION)
      .map((e) => ({ station: e.station, elevation: e.elevation, note: e.note }));
    return run(() =>
      elevations.mutateAsync([...kept, { station, elevation, note: "Entered on the Map desk" }]),
    );
  };

  const clearElevation = (station: number) =>
    run(() =>
      elevations.mutateAsync(
        subcatchment.elevations.filter((e) => Math.abs(e.station - station) > SAME_STATION),
      ),
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

  const reversePath = () => run(() => reverse.mutateAsync(version));

  const setArea = (ring: LonLat[]) => {
    if (ring.length < 4) return Promise.resolve();
    const closed = ring.map(([x, y]): [number, number] => [x, y]);
    return run(() => update.mutateAsync({ boundary: { type: "Polygon", coordinates: [closed] } }));
  };

  const setOutlet = (point: LonLat) =>
    run(() => update.mutateAsync({ outlet: { type: "Point", coordinates: [point[0], point[1]] } }));

  const loadFile = (input: Omit<GeometryFileInput, "version">) =>
    run(() => upload.mutateAsync({ ...input, version }));

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
    setArea,
    setOutlet,
    loadFile,
    busy,
    error,
  };
}
