import type { Map as MapLibreMap } from "maplibre-gl";
import { useEffect, useState } from "react";
import { useSurfaceClasses } from "../api/get-surface-classes";
import { basemapLayerIds } from "../map/create-map";
import { ContourInterval } from "./ContourInterval";
import { HSG_COLOURS, MAP_COLOURS, REGIME_COLOURS, REGIME_NAMES } from "../map/palette";
import { TOGGLES, TOGGLE_LAYERS, type ToggleId } from "../map/project-layers";

interface Props {
  map: MapLibreMap | null;
  projectId: string;
  terrainLayerId: string | undefined;
  unit: "ft" | "m";
}

type State = Record<ToggleId, { on: boolean; opacity: number }>;

const initial = Object.fromEntries(
  // Soils and terrain contours start hidden: the cover and the basemap's contours read first.
  TOGGLES.map((t) => [t.id, { on: t.id !== "soil" && t.id !== "contours", opacity: t.opacity }]),
) as State;

function apply(map: MapLibreMap, id: ToggleId, { on, opacity }: State[ToggleId]) {
  const layers: readonly (readonly [string, string | null])[] =
    id === "basemap" ? basemapLayerIds(map).map((l) => [l, null] as const) : TOGGLE_LAYERS[id];
  for (const [layer, paint] of layers) {
    if (!map.getLayer(layer)) continue;
    // Only what changes: maplibre reloads every tile of a layer's source (the terrain's too)
    // when a layout property is set, even to the value it already has in effect.
    const visibility = on ? "visible" : "none";
    if ((map.getLayoutProperty(layer, "visibility") ?? "visible") !== visibility) {
      map.setLayoutProperty(layer, "visibility", visibility);
    }
    const property = paint as Parameters<MapLibreMap["setPaintProperty"]>[1] | null;
    if (property && map.getPaintProperty(layer, property) !== opacity) {
      map.setPaintProperty(layer, property, opacity);
    }
  }
}

const Swatch = ({ colour }: { colour: string }) => (
  <span
    aria-hidden="true"
    className="inline-block size-3 shrink-0 rounded-sm border border-ink-300"
    style={{ background: colour }}
  />
);

/** Layer switches, opacity and the legend, folded over the map's top-left corner. */
export function LayerPanel({ map, projectId, terrainLayerId, unit }: Props) {
  const hasTerrain = terrainLayerId !== undefined;
  const [state, setState] = useState<State>(initial);
  const classes = useSurfaceClasses(projectId);
  useEffect(() => {
    if (!map) return;
    for (const t of TOGGLES) apply(map, t.id, state[t.id]);
  }, [map, state]);

  const toggles = TOGGLES.filter(
    (t) => (t.id !== "hillshade" && t.id !== "contours") || hasTerrain,
  );
  return (
    <details className="absolute top-2 left-2 z-10 max-h-[calc(100%-1rem)] w-60 overflow-auto rounded-md border border-ink-200 bg-white/95 text-sm shadow-sm">
      <summary className="cursor-pointer px-3 py-1.5 font-medium text-ink-800">
        Layers and legend
      </summary>
      <div className="space-y-2 border-t border-ink-100 px-3 py-2">
        {toggles.map((t) => (
          <div key={t.id} className="flex items-center gap-2">
            <label className="flex flex-1 items-center gap-1.5">
              <input
                type="checkbox"
                checked={state[t.id].on}
                onChange={(e) =>
                  setState((s) => ({ ...s, [t.id]: { ...s[t.id], on: e.target.checked } }))
                }
              />
              {t.label}
            </label>
            {t.id !== "basemap" && (
              <input
                type="range"
                min={0}
                max={1}
                step={0.05}
                value={state[t.id].opacity}
                aria-label={`${t.label} opacity`}
                className="w-20"
                onChange={(e) =>
                  setState((s) => ({
                    ...s,
                    [t.id]: { ...s[t.id], opacity: Number(e.target.value) },
                  }))
                }
              />
            )}
          </div>
        ))}
        {map && terrainLayerId && (
          <ContourInterval map={map} terrainLayerId={terrainLayerId} unit={unit} />
        )}
        <h2 className="pt-1 text-xs font-semibold tracking-wide text-ink-600 uppercase">Cover</h2>
        <ul className="space-y-0.5 text-xs">
          {(classes.data ?? []).map((c) => (
            <li key={c.id} className="flex items-center gap-1.5">
              <Swatch
                colour={c.override?.values.colour ?? c.values.colour ?? MAP_COLOURS.unmappedCover}
              />
              {c.name}
            </li>
          ))}
          <li className="flex items-center gap-1.5">
            <Swatch colour={MAP_COLOURS.unmappedCover} /> Not mapped to a class
          </li>
        </ul>
        <h2 className="pt-1 text-xs font-semibold tracking-wide text-ink-600 uppercase">
          Soil group
        </h2>
        <ul className="flex flex-wrap gap-x-3 gap-y-0.5 text-xs">
          {Object.entries(HSG_COLOURS).map(([hsg, colour]) => (
            <li key={hsg} className="flex items-center gap-1">
              <Swatch colour={colour} /> {hsg}
            </li>
          ))}
        </ul>
        <h2 className="pt-1 text-xs font-semibold tracking-wide text-ink-600 uppercase">
          Flow path
        </h2>
        <ul className="space-y-0.5 text-xs">
          {(Object.keys(REGIME_COLOURS) as (keyof typeof REGIME_COLOURS)[]).map((r) => (
            <li key={r} className="flex items-center gap-1.5">
              <Swatch colour={REGIME_COLOURS[r]} /> {REGIME_NAMES[r]}
            </li>
          ))}
        </ul>
      </div>
    </details>
  );
}
