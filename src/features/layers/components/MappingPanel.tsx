import { useState } from "react";
import { type Layer } from "../../../../shared/schemas/layers";
import { Button } from "../../../components/Button";
import { Panel } from "../../../components/Panel";
import { LoadError, Loading } from "../../../components/QueryStatus";
import { Select } from "../../../components/Select";
import { useFieldValues } from "../api/get-field-values";
import { useProjectClasses } from "../api/get-project-classes";
import { MappingRows } from "./MappingRows";

/** A first guess at the field that holds the cover class or the soil group. */
function likelyField(layer: Layer): string {
  if (layer.mappingField) return layer.mappingField;
  const hint = layer.kind === "soil" ? /hsg|hydgrp|group|soil/i : /name|class|cover|land|use/i;
  return layer.fields.find((f) => hint.test(f)) ?? layer.fields[0] ?? "";
}

interface MappingPanelProps {
  layer: Layer;
  mayEdit: boolean;
  onClose: () => void;
}

/** The attribute mapping of one cover or soil layer: pick the field, choose per value. */
export function MappingPanel({ layer, mayEdit, onClose }: MappingPanelProps) {
  const [field, setField] = useState(() => likelyField(layer));
  const values = useFieldValues(layer.id, field);
  const classes = useProjectClasses(layer.projectId);
  const what = layer.kind === "cover" ? "a surface class" : "a hydrologic soil group";

  return (
    <Panel
      title={`Mapping of “${layer.name}”`}
      titleId="layer-mapping"
      description={`Each value of the chosen field maps to ${what}. Values left unmapped stay listed as a problem of the layer.`}
      actions={
        <Button variant="secondary" size="sm" onClick={onClose}>
          Close mapping
        </Button>
      }
    >
      <div className="space-y-4">
        <Select
          label="Field that holds the values"
          name="field"
          className="max-w-xs"
          options={layer.fields.map((f) => ({ value: f, label: f }))}
          value={field}
          onChange={(e) => setField(e.target.value)}
          disabled={!mayEdit && layer.mappingField !== null}
        />
        {(values.isPending || classes.isPending) && <Loading label="Reading the values…" />}
        {values.isError && <LoadError error={values.error} onRetry={() => void values.refetch()} />}
        {classes.isError && (
          <LoadError error={classes.error} onRetry={() => void classes.refetch()} />
        )}
        {values.data && classes.data && (
          <MappingRows
            key={`${layer.id}:${field}`}
            layer={layer}
            data={values.data}
            classes={classes.data}
            mayEdit={mayEdit}
          />
        )}
      </div>
    </Panel>
  );
}
