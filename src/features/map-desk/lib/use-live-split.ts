/**
 * The live split for the desk: cover and soil features of the ready layers in a box around
 * the path and boundary (fetched once per box), indexed, and the path split at every change,
 * with the subcatchment's surface overrides applied.
 */
import { useMemo } from "react";
import type { LonLat, RegimeBreaks, RegimeSegment, SurfaceOverride } from "../../../../shared/geo";
import { mFromFt } from "../../../../shared/hydrology/units";
import type { Bbox, Layer } from "../../../../shared/schemas/layers";
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";
import { useLayersFeatures } from "../api/get-layer-features";
import { coverIndex, featureBox, liveSegments, soilIndex } from "./live-split";

export interface LiveSplit {
  segments: RegimeSegment[];
  /** The features near the path are still loading (segments may show as unmapped). */
  loading: boolean;
  /** More features than one request returns: the preview may miss some; the server will not. */
  truncated: boolean;
  box: Bbox | null;
}

function boundaryPoints(s: Subcatchment): LonLat[] {
  const b = s.boundary;
  if (!b) return [];
  const rings = b.type === "Polygon" ? b.coordinates : b.coordinates.flat();
  return rings.flat().map((c) => [c[0]!, c[1]!] as const);
}

export function useLiveSplit(
  layers: readonly Layer[],
  path: readonly LonLat[],
  subcatchment: Subcatchment,
  breaks: RegimeBreaks,
): LiveSplit {
  const ready = (kind: Layer["kind"]) =>
    layers.filter((l) => l.kind === kind && l.status === "ready").map((l) => l.id);
  const coverIds = ready("cover");
  const soilIds = ready("soil");
  const box = featureBox([...path, ...boundaryPoints(subcatchment)]);
  const boxKey = box?.join(",");
  const stableBox = useMemo(() => box, [boxKey]); // eslint-disable-line react-hooks/exhaustive-deps
  const cover = useLayersFeatures(coverIds, stableBox);
  const soil = useLayersFeatures(soilIds, stableBox);
  const coverData = cover.map((q) => q.data);
  const soilData = soil.map((q) => q.data);
  const coverIdx = useMemo(
    () => coverIndex(coverData.filter((d) => d !== undefined)),
    // eslint-disable-next-line react-hooks/exhaustive-deps
    coverData,
  );
  const soilIdx = useMemo(
    () => soilIndex(soilData.filter((d) => d !== undefined)),
    // eslint-disable-next-line react-hooks/exhaustive-deps
    soilData,
  );
  const stored = subcatchment.surfaceOverrides;
  const feet = subcatchment.lengthUnit === "ft";
  const overrides = useMemo(
    (): SurfaceOverride[] =>
      stored.map((o) => ({
        stationFromM: feet ? mFromFt(o.stationFrom) : o.stationFrom,
        stationToM: feet ? mFromFt(o.stationTo) : o.stationTo,
        surfaceClassId: o.surfaceClassId,
      })),
    [stored, feet],
  );
  const segments = useMemo(
    () => liveSegments(path, coverIdx, soilIdx, breaks, overrides),
    [path, coverIdx, soilIdx, breaks.sheetEndM, breaks.channelStartM, overrides], // eslint-disable-line react-hooks/exhaustive-deps
  );
  return {
    segments,
    loading: [...cover, ...soil].some((q) => q.isPending && q.fetchStatus !== "idle"),
    truncated: [...coverData, ...soilData].some((d) => d?.truncated),
    box: stableBox,
  };
}
