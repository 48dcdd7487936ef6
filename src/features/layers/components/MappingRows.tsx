import { useState, type FormEvent } from "react";
import { HSG_CODES } from "../../../../shared/geo/types";
import { type FieldValues, type Layer } from "../../../../shared/schemas/layers";
import { Button } from "../../../components/Button";
import { FormError, Notice } from "../../../components/FormError";
import { TableHead } from "../../../components/TableHead";
import { isApiError } from "../../../lib/api";
import { type SurfaceClass } from "../../../lib/surface-classes";
import { useSaveMapping, type MappingBody } from "../api/save-mapping";

const COLUMNS = [
  { label: "Value in the file" },
  { label: "Features" },
  { label: "Suggested" },
  { label: "Maps to" },
];

const shown = (value: string) => (value === "" ? "(empty)" : value);

function Swatch({ colour }: { colour: string | undefined }) {
  return (
    <span
      aria-hidden="true"
      className="inline-block size-4 shrink-0 rounded-sm border border-ink-300"
      style={{ backgroundColor: colour ?? "transparent" }}
    />
  );
}

interface MappingRowsProps {
  layer: Layer;
  data: FieldValues;
  classes: readonly SurfaceClass[];
  mayEdit: boolean;
}

/** One row per distinct value; the choice starts at the current mapping, else the suggestion. */
export function MappingRows({ layer, data, classes, mayEdit }: MappingRowsProps) {
  const save = useSaveMapping(layer);
  // Suggestions fill in a first mapping only; once the field is mapped, a value left unmapped
  // was left so on purpose.
  const suggest = mayEdit && layer.mappingField !== data.field;
  const [choices, setChoices] = useState<Record<string, string>>(() =>
    Object.fromEntries(
      data.values.map((v) => [v.value, v.mapped ?? (suggest ? (v.suggestion?.target ?? "") : "")]),
    ),
  );
  const byId = new Map(classes.map((c) => [c.id, c]));
  const targetLabel = (target: string) =>
    data.kind === "cover" ? (byId.get(target)?.name ?? "Unknown class") : `HSG ${target}`;
  const options =
    data.kind === "cover"
      ? classes.map((c) => ({ value: c.id, label: c.name }))
      : HSG_CODES.map((h) => ({ value: h, label: `HSG ${h}` }));
  const unmapped = data.values.filter((v) => !choices[v.value]).length;

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const entries = data.values.map((v) => ({ value: v.value, target: choices[v.value] || null }));
    const body: MappingBody =
      data.kind === "cover"
        ? {
            field: data.field,
            entries: entries.map((e) => ({ value: e.value, surfaceClassId: e.target })),
          }
        : {
            field: data.field,
            entries: entries.map((e) => ({
              value: e.value,
              hsg: e.target as (typeof HSG_CODES)[number] | null,
            })),
          };
    save.mutate(body);
  }

  return (
    <form onSubmit={onSubmit} aria-label={`Mapping of ${layer.name}`} className="space-y-4">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">
          Values of {data.field} in {layer.name}
        </caption>
        <TableHead columns={COLUMNS} />
        <tbody className="divide-y divide-ink-100">
          {data.values.map((v) => {
            const choice = choices[v.value] ?? "";
            const colour = data.kind === "cover" ? byId.get(choice)?.values.colour : undefined;
            return (
              <tr key={v.value}>
                <th scope="row" className="py-2 pr-4 font-medium text-ink-900">
                  {shown(v.value)}
                </th>
                <td className="py-2 pr-4 text-ink-700 tabular-nums">
                  {v.featureCount.toLocaleString()}
                </td>
                <td className="py-2 pr-4 text-ink-600">
                  {v.suggestion ? (
                    <>
                      {v.suggestion.label}
                      <span className="ml-1 text-xs text-ink-500">
                        ({v.suggestion.confidence === "exact" ? "same name" : "likely"})
                      </span>
                    </>
                  ) : (
                    "—"
                  )}
                </td>
                <td className="py-2">
                  <div className="flex items-center gap-2">
                    {data.kind === "cover" && <Swatch colour={colour} />}
                    {mayEdit ? (
                      <>
                        <label htmlFor={`map-${layer.id}-${v.value}`} className="sr-only">
                          {`${shown(v.value)} maps to`}
                        </label>
                        <select
                          id={`map-${layer.id}-${v.value}`}
                          value={choice}
                          onChange={(e) => setChoices((c) => ({ ...c, [v.value]: e.target.value }))}
                          className="block w-full rounded-md border border-ink-300 bg-white px-2 py-1.5 text-sm"
                        >
                          <option value="">Not mapped</option>
                          {options.map((o) => (
                            <option key={o.value} value={o.value}>
                              {o.label}
                            </option>
                          ))}
                        </select>
                      </>
                    ) : (
                      <span className={choice ? "text-ink-900" : "text-caution-800"}>
                        {choice ? targetLabel(choice) : "Not mapped"}
                      </span>
                    )}
                  </div>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {data.truncated && (
        <p className="text-sm text-caution-800">
          Only the first 10,000 values are listed; values beyond them stay unmapped.
        </p>
      )}
      {mayEdit && (
        <>
          <p className="text-sm text-ink-600" aria-live="polite">
            {unmapped === 0
              ? "Every value has a choice."
              : `${unmapped} ${unmapped === 1 ? "value has" : "values have"} no choice yet and will stay unmapped.`}
          </p>
          <FormError
            message={
              isApiError(save.error)
                ? save.error.message
                : save.error
                  ? "The mapping was not saved. Try again."
                  : null
            }
          />
          {save.isSuccess && <Notice>Mapping saved.</Notice>}
          <Button type="submit" pending={save.isPending}>
            Save mapping
          </Button>
        </>
      )}
    </form>
  );
}
