import { useState } from "react";
import { useSearchParams } from "react-router-dom";
import { can } from "../../../../shared/roles";
import { Button } from "../../../components/Button";
import { Caution } from "../../../components/Caution";
import { ConfirmDialog } from "../../../components/ConfirmDialog";
import { FormError } from "../../../components/FormError";
import { PageHeader } from "../../../components/PageHeader";
import { Panel } from "../../../components/Panel";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { isApiError } from "../../../lib/api";
import { unitLabels, useProjectOutlet } from "../../../lib/project-outlet";
import { useDeleteRainfallTable } from "../api/delete-rainfall-table";
import { useDesignTable, useSetDesignTable } from "../api/design-table";
import { useRainfallTables } from "../api/get-rainfall-tables";
import { CsvRainfallForm } from "./CsvRainfallForm";
import { FormulaRainfallForm } from "./FormulaRainfallForm";
import { RainfallTableView } from "./RainfallTableView";

type AddMode = "csv" | "formula";

/** The project's rainfall (IDF) tables: list, add by CSV or formula, view with curves. */
export function RainfallPage() {
  const { project, role } = useProjectOutlet();
  const tables = useRainfallTables(project.id);
  const design = useDesignTable(project.id);
  const setDesign = useSetDesignTable(project.id);
  const remove = useDeleteRainfallTable();
  const mayEdit = role ? can(role, "project-data:edit") : false;
  const [search, setSearch] = useSearchParams();
  const [mode, setMode] = useState<AddMode>("csv");
  const [deleting, setDeleting] = useState(false);
  const u = unitLabels(project.units);

  const list = tables.data ?? [];
  const selected = list.find((t) => t.id === search.get("table")) ?? list[0];
  const select = (id: string) => setSearch({ table: id }, { replace: true });
  // With no table chosen, the rules compute with the project's only table.
  const designId = design.data?.rainfallTableId ?? (list.length === 1 ? list[0]?.id : undefined);

  return (
    <>
      <PageHeader
        context={project.name}
        title="Rainfall tables"
        description="Intensity–duration–frequency data for the kinematic-wave solve, the rational method and TR-55 sheet flow."
      />
      <div className="grid items-start gap-6 lg:grid-cols-[16rem_1fr]">
        <Panel title="Tables" titleId="rainfall-tables">
          {tables.isPending && <Loading />}
          {tables.isError && (
            <LoadError error={tables.error} onRetry={() => void tables.refetch()} />
          )}
          {tables.data?.length === 0 && (
            <p className="text-sm text-ink-500">No rainfall tables yet.</p>
          )}
          <ul className="space-y-1">
            {list.map((t) => (
              <li key={t.id}>
                <button
                  type="button"
                  aria-current={t.id === selected?.id ? "true" : undefined}
                  onClick={() => select(t.id)}
                  className={`w-full rounded-md px-2 py-1.5 text-left text-sm ${t.id === selected?.id ? "bg-rill-50 font-medium text-rill-900" : "text-ink-800 hover:bg-ink-50"}`}
                >
                  {t.name}
                  {t.id === designId && (
                    <span className="ml-1 rounded-sm bg-rill-100 px-1 text-[11px] text-rill-900">
                      design
                    </span>
                  )}
                </button>
              </li>
            ))}
          </ul>
        </Panel>
        <div className="space-y-6">
          {selected && (
            <Panel
              title={selected.name}
              titleId="rainfall-selected"
              description={
                selected.id === designId ? "The Design rules compute with this table." : undefined
              }
              actions={
                mayEdit && (
                  <div className="flex gap-2">
                    {selected.id !== design.data?.rainfallTableId && (
                      <Button
                        size="sm"
                        variant="secondary"
                        pending={setDesign.isPending}
                        onClick={() => setDesign.mutate(selected.id)}
                      >
                        Compute with this table
                      </Button>
                    )}
                    <Button
                      size="sm"
                      variant="quiet"
                      onClick={() => {
                        remove.reset();
                        setDeleting(true);
                      }}
                    >
                      Delete table
                    </Button>
                  </div>
                )
              }
            >
              <div className="space-y-4">
                <FormError message={isApiError(setDesign.error) ? setDesign.error.message : null} />
                <RainfallTableView table={selected} />
                <Caution />
              </div>
            </Panel>
          )}
          {mayEdit && (
            <Panel title="Add a rainfall table" titleId="rainfall-add">
              <div role="group" aria-label="How to add the table" className="mb-4 flex gap-2">
                {(
                  [
                    ["csv", "From a CSV file"],
                    ["formula", "From formula coefficients"],
                  ] as const
                ).map(([value, label]) => (
                  <button
                    key={value}
                    type="button"
                    aria-pressed={mode === value}
                    onClick={() => setMode(value)}
                    className={`rounded-md border px-3 py-1.5 text-sm ${mode === value ? "border-rill-500 bg-rill-50 font-medium text-rill-900" : "border-ink-300 text-ink-700 hover:bg-ink-50"}`}
                  >
                    {label}
                  </button>
                ))}
              </div>
              <div className="max-w-xl">
                {mode === "csv" ? (
                  <CsvRainfallForm projectId={project.id} depthUnit={u.depth} onCreated={select} />
                ) : (
                  <FormulaRainfallForm projectId={project.id} units={u} onCreated={select} />
                )}
              </div>
            </Panel>
          )}
        </div>
      </div>
      <ConfirmDialog
        open={deleting && selected !== undefined}
        title={`Delete “${selected?.name ?? ""}”?`}
        confirmLabel="Delete table"
        pending={remove.isPending}
        error={isApiError(remove.error) ? remove.error.message : null}
        onClose={() => setDeleting(false)}
        onConfirm={() => {
          if (selected)
            remove.mutate(selected, {
              onSuccess: () => {
                setDeleting(false);
                setSearch({}, { replace: true });
              },
            });
        }}
      >
        Subcatchments computed with it keep their numbers until they are computed again.
      </ConfirmDialog>
    </>
  );
}
