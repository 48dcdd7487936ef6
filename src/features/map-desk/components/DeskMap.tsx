import { ScaleControl, type Map as MapLibreMap, type MapMouseEvent } from "maplibre-gl";
import { useEffect, useRef, useState } from "react";
import type { BasemapConfig } from "../api/get-map-config";
import { createDeskMap } from "../map/create-map";
import { SEGMENT_LAYER } from "../map/desk-overlays";
import type { TerrainTiling } from "../lib/terrain-tiling";

interface DeskMapProps {
  basemap: BasemapConfig;
  projectId: string;
  terrainLayerId: string | undefined;
  terrainTiling: TerrainTiling;
  bounds: [number, number, number, number] | null;
  lengthUnit: "ft" | "m";
  hovered: number | null;
  onHover: (index: number | null) => void;
  onReady: (map: MapLibreMap | null) => void;
}

/** The map itself: made once per project and terrain layer, handed up when its style loads. */
export function DeskMap(props: DeskMapProps) {
  const { basemap, projectId, terrainLayerId, lengthUnit, onReady, onHover } = props;
  const container = useRef<HTMLDivElement>(null);
  const mapRef = useRef<MapLibreMap | null>(null);
  const boundsRef = useRef(props.bounds);
  // Read when the map is made (with the terrain layer id, which the map depends on).
  const tilingRef = useRef(props.terrainTiling);
  tilingRef.current = props.terrainTiling;
  // The map is made in the project's unit; a later US/SI switch changes only the scale bar.
  const unitRef = useRef(lengthUnit);
  const [ready, setReady] = useState<MapLibreMap | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [pointer, setPointer] = useState<{ lng: number; lat: number } | null>(null);

  useEffect(() => {
    const element = container.current;
    if (!element) return;
    let cancelled = false;
    let made: MapLibreMap | null = null;
    createDeskMap({
      container: element,
      basemap,
      projectId,
      terrainLayerId,
      terrainTiling: tilingRef.current,
      bounds: boundsRef.current,
      lengthUnit: unitRef.current,
    })
      .then((map) => {
        if (cancelled) {
          map.remove();
          return;
        }
        made = map;
        mapRef.current = map;
        map.on("mousemove", (e) => setPointer(e.lngLat));
        map.on("mouseout", () => setPointer(null));
        // Tests and the bench wait for this: the first moment everything asked for is drawn.
        map.once("idle", () => element.setAttribute("data-idle", "true"));
        map.on("mousemove", SEGMENT_LAYER, (e: MapMouseEvent & { features?: unknown[] }) => {
          const f = (e.features as { properties?: { index?: number } }[] | undefined)?.[0];
          onHover(typeof f?.properties?.index === "number" ? f.properties.index : null);
        });
        map.on("mouseleave", SEGMENT_LAYER, () => onHover(null));
        map.once("load", () => {
          if (cancelled) return;
          setReady(map);
          onReady(map);
        });
      })
      .catch((error: unknown) => {
        setFailure(error instanceof Error ? error.message : "The map could not start.");
      });
    return () => {
      cancelled = true;
      onReady(null);
      setReady(null);
      made?.remove();
      mapRef.current = null;
    };
  }, [basemap, projectId, terrainLayerId, onReady, onHover]);

  useEffect(() => {
    if (!ready) return;
    const scale = new ScaleControl({ unit: lengthUnit === "ft" ? "imperial" : "metric" });
    ready.addControl(scale, "bottom-left");
    return () => {
      ready.removeControl(scale);
    };
  }, [ready, lengthUnit]);

  // Highlight the hovered segment (from the sheet or the map) through feature state.
  const hovered = props.hovered;
  useEffect(() => {
    const map = mapRef.current;
    if (!map?.getSource("desk-segments") || hovered === null) return;
    map.setFeatureState({ source: "desk-segments", id: hovered }, { hover: true });
    return () => {
      if (map.getSource("desk-segments")) {
        map.setFeatureState({ source: "desk-segments", id: hovered }, { hover: false });
      }
    };
  }, [hovered]);

  return (
    <div className="relative h-full w-full">
      <div
        ref={container}
        // Inline, because maplibre's own stylesheet sets the map container to position: relative.
        style={{ position: "absolute", inset: 0 }}
        role="region"
        aria-label="Map of the project"
        data-testid="desk-map"
      />
      {failure && (
        <p
          role="alert"
          className="absolute inset-x-4 top-4 rounded-md bg-brick-50 p-3 text-sm text-brick-700"
        >
          {failure}
        </p>
      )}
      <p
        aria-live="off"
        className="pointer-events-none absolute top-2 right-12 rounded bg-white/85 px-2 py-0.5 font-mono text-xs text-ink-700"
      >
        {pointer
          ? `${pointer.lat.toFixed(6)}°, ${pointer.lng.toFixed(6)}°`
          : "Lat, lon under the pointer"}
      </p>
    </div>
  );
}
