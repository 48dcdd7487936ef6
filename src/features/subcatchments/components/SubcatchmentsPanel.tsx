import { can, type Role } from "../../../../shared/roles";
import { Caution } from "../../../components/Caution";
import { Panel } from "../../../components/Panel";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { useSubcatchments } from "../api/get-subcatchments";
import { NewSubcatchmentForm } from "./NewSubcatchmentForm";
import { SubcatchmentsTable } from "./SubcatchmentsTable";

/** The project's subcatchments with their governing Tc and state, and the form to add one. */
export function SubcatchmentsPanel({
  projectId,
  role,
}: {
  projectId: string;
  role: Role | undefined;
}) {
  const list = useSubcatchments(projectId);
  const mayAdd = role ? can(role, "geometry:edit") : false;

  return (
    <div className="grid items-start gap-6 lg:grid-cols-[1fr_20rem]">
      <Panel
        title="Subcatchments"
        titleId="project-subcatchments"
        description="Each subcatchment's governing time of concentration from its last computation."
        className={mayAdd ? "" : "lg:col-span-2"}
      >
        {list.isPending && <Loading />}
        {list.isError && <LoadError error={list.error} onRetry={() => void list.refetch()} />}
        {list.data?.length === 0 && (
          <div className="rounded-md border border-dashed border-ink-300 bg-paper/60 px-6 py-8 text-center">
            <p className="font-medium text-ink-800">No subcatchments yet</p>
            <p className="mx-auto mt-1 max-w-lg text-sm text-ink-500">
              A subcatchment gets its boundary, outlet and flow path on the Map desk once the
              project has its layers — land cover, soils and terrain. Its travel-time sheet and
              governing Tc are then listed here.
            </p>
          </div>
        )}
        {list.data && list.data.length > 0 && (
          <div className="space-y-4">
            <SubcatchmentsTable projectId={projectId} subcatchments={list.data} />
            <Caution />
          </div>
        )}
      </Panel>
      {mayAdd && (
        <Panel title="New subcatchment" titleId="project-new-subcatchment">
          <NewSubcatchmentForm projectId={projectId} />
        </Panel>
      )}
    </div>
  );
}
