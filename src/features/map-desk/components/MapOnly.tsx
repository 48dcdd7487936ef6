import type { Map as MapLibreMap } from "maplibre-gl";
import { useState } from "react";
import type { Layer } from "../../../../shared/schemas/layers";
import type { Project } from "../../../../shared/schemas/projects";
import { newestReady } from "../api/get-layers";
import type { BasemapConfig } from "../api/get-map-config";
import { initialBounds } from "../lib/initial-bounds";
import { DeskMap } from "./DeskMap";
import { terrainTiling } from "../lib/terrain-tiling";
import { LayerPanel } from "./LayerPanel";

const noHover = () => undefined;

/** The project's map before any subcatchment exists: layers to check, nothing to compute yet. */
export function MapOnly({
  project,
  layers,
  basemap,
}: {
  project: Project;
  layers: readonly Layer[];
  basemap: BasemapConfig;
}) {
  const [map, setMap] = useState<MapLibreMap | null>(null);
  const [bounds] = useState(() => initialBounds(null, layers));
  const terrain = newestReady(layers, "terrain");
  return (
    <div className="grid h-[calc(100vh-12rem)] min-h-[32rem] grid-cols-[minmax(0,1fr)_20rem]">
      <div className="relative">
        <DeskMap
          basemap={basemap}
          projectId={project.id}
          terrainLayerId={terrain?.id}
          terrainTiling={terrainTiling(terrain ?? { bbox4326: null, terrain: null })}
          bounds={bounds}
          lengthUnit={project.units === "si" ? "m" : "ft"}
          hovered={null}
          onHover={noHover}
          onReady={setMap}
        />
        <LayerPanel
          map={map}
          projectId={project.id}
          terrainLayerId={terrain?.id}
          unit={project.units === "si" ? "m" : "ft"}
        />
      </div>
      <p className="border-l border-ink-200 p-4 text-sm text-ink-600">
        This project has no subcatchment yet. Add one on the Overview page; its flow path, boundary
        and travel-time sheet are worked on here.
      </p>
    </div>
  );
}
