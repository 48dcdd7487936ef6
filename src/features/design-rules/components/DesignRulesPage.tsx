import { can } from "../../../../shared/roles";
import { Caution } from "../../../components/Caution";
import { PageHeader } from "../../../components/PageHeader";
import { Panel } from "../../../components/Panel";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { formatDateTime } from "../../../lib/format";
import { useProjectOutlet } from "../../../lib/project-outlet";
import { useDesignRules } from "../api/get-design-rules";
import { useSaveDesignRules } from "../api/save-design-rules";
import { useRainfallChoices } from "../api/get-rainfall-choices";
import { DesignRulesForm } from "./DesignRulesForm";

/** The agency's choices for this project, each with its default and source. */
export function DesignRulesPage() {
  const { project, role } = useProjectOutlet();
  const rules = useDesignRules(project.id);
  const tables = useRainfallChoices(project.id);
  const save = useSaveDesignRules(project.id);
  const mayEdit = role ? can(role, "project-data:edit") : false;

  return (
    <>
      <PageHeader
        context={project.name}
        title="Design rules"
        description="The reviewing agency's choices every subcatchment of the project is computed with."
      />
      <Panel
        title={mayEdit ? "Rules" : "Rules (read only)"}
        titleId="design-rules"
        description={
          rules.data
            ? rules.data.version === 0
              ? "Never saved: the defaults below apply."
              : `Version ${rules.data.version}${rules.data.updatedAt ? `, saved ${formatDateTime(rules.data.updatedAt)}` : ""}.`
            : undefined
        }
      >
        {(rules.isPending || tables.isPending) && <Loading />}
        {rules.isError && <LoadError error={rules.error} onRetry={() => void rules.refetch()} />}
        {tables.isError && <LoadError error={tables.error} onRetry={() => void tables.refetch()} />}
        {rules.data && tables.data && (
          <DesignRulesForm
            key={rules.data.version}
            save={save}
            units={project.units}
            saved={rules.data}
            tables={tables.data}
            mayEdit={mayEdit}
            onReload={() => {
              save.reset();
              void rules.refetch();
            }}
          />
        )}
        <Caution className="mt-6" />
      </Panel>
    </>
  );
}
