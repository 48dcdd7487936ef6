import { useState } from "react";
import { useParams } from "react-router-dom";
import { can } from "../../../../shared/roles";
import { Button } from "../../../components/Button";
import { PageHeader } from "../../../components/PageHeader";
import { Panel } from "../../../components/Panel";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { useMembership } from "../../../lib/session";
import { type SurfaceClass } from "../../../lib/surface-classes";
import { useSurfaceClasses } from "../api/get-surface-classes";
import { CatalogTable } from "./CatalogTable";
import { ClassDialog } from "./ClassDialog";

/** The team's surface classes: n, k, Kerby N, CN by soil group and C, with their sources. */
export function CatalogPage() {
  const { teamId = "" } = useParams();
  const membership = useMembership(teamId);
  const classes = useSurfaceClasses(teamId);
  const mayEdit = membership ? can(membership.role, "catalog:edit") : false;
  // undefined: closed; null: adding; a class: editing it.
  const [editing, setEditing] = useState<SurfaceClass | null | undefined>(undefined);

  return (
    <>
      <PageHeader
        context={membership?.teamName}
        title="Surface catalog"
        description="The team's surface classes and the published values every project computes with. Owners and admins keep it; a project can override a value with its own source."
        actions={mayEdit && <Button onClick={() => setEditing(null)}>Add a class</Button>}
      />
      <Panel>
        {classes.isPending && <Loading />}
        {classes.isError && (
          <LoadError error={classes.error} onRetry={() => void classes.refetch()} />
        )}
        {classes.data && (
          <CatalogTable
            classes={classes.data}
            mayEdit={mayEdit}
            onEdit={(cls) => setEditing(cls)}
          />
        )}
      </Panel>
      {editing !== undefined && (
        <ClassDialog
          key={editing?.id ?? "new"}
          teamId={teamId}
          current={editing}
          onClose={() => setEditing(undefined)}
        />
      )}
    </>
  );
}
