import type { Map as MapLibreMap } from "maplibre-gl";
import { useEffect, useState } from "react";
import { CONTOUR_INTERVALS, DEFAULT_INTERVAL, setContourInterval } from "../map/contours";

interface Props {
  map: MapLibreMap;
  terrainLayerId: string;
  unit: "ft" | "m";
}

/** The contour interval, in the unit shown; the lines are redrawn in the browser. */
export function ContourInterval({ map, terrainLayerId, unit }: Props) {
  const [choice, setChoice] = useState<{ unit: "ft" | "m"; interval: number }>({
    unit,
    interval: DEFAULT_INTERVAL[unit],
  });
  // A US/SI switch starts again from that unit's usual interval.
  const interval = choice.unit === unit ? choice.interval : DEFAULT_INTERVAL[unit];
  useEffect(() => {
    setContourInterval(map, terrainLayerId, unit, interval);
  }, [map, terrainLayerId, unit, interval]);
  return (
    <label className="flex items-center justify-between gap-2">
      Contour interval
      <select
        value={interval}
        onChange={(e) => setChoice({ unit, interval: Number(e.target.value) })}
        className="rounded border border-ink-300 bg-white px-1 py-0.5 text-sm"
      >
        {CONTOUR_INTERVALS[unit].map((v) => (
          <option key={v} value={v}>
            {v} {unit}
          </option>
        ))}
      </select>
    </label>
  );
}
