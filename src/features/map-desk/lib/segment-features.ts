/** GeoJSON of the path's segments for the map: one line per segment, numbered from the divide. */
import type { FeatureCollection, LineString } from "geojson";
import { pathLengthsM, type FlowRegime, type LonLat } from "../../../../shared/geo";
import { lineBetween } from "./path-geometry";

export interface SegmentSpan {
  index: number;
  stationFromM: number;
  stationToM: number;
  regime: FlowRegime;
}

export function segmentFeatures(
  path: readonly LonLat[],
  spans: readonly SegmentSpan[],
): FeatureCollection<LineString> {
  if (path.length < 2) return { type: "FeatureCollection", features: [] };
  const lengths = pathLengthsM(path);
  return {
    type: "FeatureCollection",
    features: spans.map((s) => ({
      type: "Feature",
      properties: { index: s.index, regime: s.regime, label: String(s.index + 1) },
      geometry: {
        type: "LineString",
        coordinates: lineBetween(path, lengths, s.stationFromM, s.stationToM).map(([x, y]) => [
          x,
          y,
        ]),
      },
    })),
  };
}
