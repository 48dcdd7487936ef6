import { useState } from "react";
import { useSearchParams } from "react-router-dom";
import { can } from "../../../../shared/roles";
import { type Layer } from "../../../../shared/schemas/layers";
import { ConfirmDialog } from "../../../components/ConfirmDialog";
import { PageHeader } from "../../../components/PageHeader";
import { Panel } from "../../../components/Panel";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { isApiError } from "../../../lib/api";
import { useProjectOutlet } from "../../../lib/project-outlet";
import { useDeleteLayer } from "../api/delete-layer";
import { useLayers } from "../api/get-layers";
import { LayersTable } from "./LayersTable";
import { MappingPanel } from "./MappingPanel";
import { UploadLayerForm } from "./UploadLayerForm";

/** A project's layers: upload (GIS), processing progress, problems, attribute mapping. */
export function LayersPage() {
  const { project, role } = useProjectOutlet();
  const layers = useLayers(project.id);
  const mayEdit = role ? can(role, "layer:edit") : false;
  const [search, setSearch] = useSearchParams();
  const [deleting, setDeleting] = useState<Layer | null>(null);
  const remove = useDeleteLayer();
  const mapping = layers.data?.find((l) => l.id === search.get("mapping"));

  const openMapping = (layer: Layer | null) =>
    setSearch(layer ? { mapping: layer.id } : {}, { replace: true });

  return (
    <>
      <PageHeader
        context={project.name}
        title="Layers"
        description="Land cover, soils, terrain, channels and boundaries the flow paths are split and sloped by."
      />
      <div className="space-y-6">
        <div className="grid items-start gap-6 lg:grid-cols-[1fr_20rem]">
          <Panel
            title="Project layers"
            titleId="layers-list"
            className={mayEdit ? "" : "lg:col-span-2"}
          >
            {layers.isPending && <Loading />}
            {layers.isError && (
              <LoadError error={layers.error} onRetry={() => void layers.refetch()} />
            )}
            {layers.data?.length === 0 && (
              <p className="py-6 text-center text-sm text-ink-500">
                No layers yet.{" "}
                {mayEdit
                  ? "Upload land cover, soils and terrain with the form beside this list."
                  : "A GIS specialist or an admin uploads them."}
              </p>
            )}
            {layers.data && layers.data.length > 0 && (
              <LayersTable
                layers={layers.data}
                mayEdit={mayEdit}
                onMap={openMapping}
                onDelete={(layer) => {
                  remove.reset();
                  setDeleting(layer);
                }}
              />
            )}
          </Panel>
          {mayEdit && (
            <Panel title="Upload a layer" titleId="layers-upload">
              <UploadLayerForm projectId={project.id} />
            </Panel>
          )}
        </div>
        {mapping && (
          <MappingPanel
            key={mapping.id}
            layer={mapping}
            mayEdit={mayEdit}
            onClose={() => openMapping(null)}
          />
        )}
      </div>
      <ConfirmDialog
        open={deleting !== null}
        title={`Delete “${deleting?.name ?? ""}”?`}
        confirmLabel="Delete layer"
        pending={remove.isPending}
        error={isApiError(remove.error) ? remove.error.message : null}
        onClose={() => setDeleting(null)}
        onConfirm={() => {
          if (!deleting) return;
          remove.mutate(deleting, {
            onSuccess: () => {
              if (search.get("mapping") === deleting.id) openMapping(null);
              setDeleting(null);
            },
          });
        }}
      >
        The layer, its features and its mapping go for the whole project. Sheets computed with it
        keep their numbers until they are computed again.
      </ConfirmDialog>
    </>
  );
}
