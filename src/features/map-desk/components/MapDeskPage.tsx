import { useSearchParams } from "react-router-dom";
import { DocumentTitle } from "../../../components/DocumentTitle";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { useProjectOutlet } from "../../../lib/project-outlet";
import { useLayers } from "../api/get-layers";
import { useMapConfig } from "../api/get-map-config";
import { useSubcatchment } from "../api/get-subcatchment";
import { useSubcatchments } from "../api/get-subcatchments";
import { DeskWorkspace } from "./DeskWorkspace";
import { MapOnly } from "./MapOnly";
import { SubcatchmentPicker } from "./SubcatchmentPicker";

/** /projects/:projectId/map — the map, the drawing tools and the travel-time sheet together. */
export function MapDeskPage() {
  const { project, role } = useProjectOutlet();
  const [params, setParams] = useSearchParams();
  const list = useSubcatchments(project.id);
  const layers = useLayers(project.id);
  const config = useMapConfig();
  const chosen = params.get("subcatchment") ?? list.data?.[0]?.id;
  const subcatchment = useSubcatchment(chosen);

  const failed = [list, layers, config, subcatchment].find((q) => q.isError);
  return (
    // The desk spans the window (the page column is too narrow for a map beside a sheet).
    <div
      className="-mt-4 overflow-hidden rounded-md border border-ink-200 bg-white"
      style={{ marginInline: "min(-1rem, calc(36rem - 50vw - 1rem))" }}
    >
      <DocumentTitle title={`Map desk · ${project.name}`} />
      <div className="flex flex-wrap items-center gap-3 border-b border-ink-200 bg-white px-4 py-2">
        <h1 className="text-lg font-semibold text-ink-900">Map desk</h1>
        <SubcatchmentPicker
          subcatchments={list.data ?? []}
          value={chosen}
          onChange={(id) => setParams({ subcatchment: id }, { replace: true })}
        />
      </div>
      {failed ? (
        <div className="p-4">
          <LoadError error={failed.error} onRetry={() => void failed.refetch()} />
        </div>
      ) : list.data && list.data.length === 0 && layers.data && config.data ? (
        <MapOnly project={project} layers={layers.data} basemap={config.data.basemap} />
      ) : subcatchment.data && layers.data && config.data ? (
        <DeskWorkspace
          key={subcatchment.data.id}
          project={project}
          role={role}
          subcatchment={subcatchment.data}
          layers={layers.data}
          basemap={config.data.basemap}
        />
      ) : (
        <div className="p-4">
          <Loading label="Opening the Map desk…" />
        </div>
      )}
    </div>
  );
}
