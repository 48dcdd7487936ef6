import { Button } from "../../../components/Button";
import { type FieldErrors } from "../../../lib/form";
import { arcRow, type ArcRow } from "./draft";

interface Props {
  rows: ArcRow[];
  onChange: (rows: ArcRow[]) => void;
  errors: FieldErrors;
  disabled: boolean;
}

/** Return periods whose storms use another ARC than the project's (e.g. ARC III for rare storms). */
export function ArcByPeriod({ rows, onChange, errors, disabled }: Props) {
  const update = (key: number, part: Partial<ArcRow>) =>
    onChange(rows.map((r) => (r.key === key ? { ...r, ...part } : r)));
  const error = Object.entries(errors).find(([k]) => k.startsWith("rules.arcByReturnPeriod"))?.[1];
  return (
    <div className="md:col-span-2">
      <p className="text-sm font-medium text-ink-800">ARC for particular return periods</p>
      <p className="mb-2 text-xs text-ink-500">
        None by default. Some agencies use ARC III for rare storms (common practice).
      </p>
      {rows.length > 0 && (
        <ul className="mb-2 space-y-2">
          {rows.map((r, i) => (
            <li key={r.key} className="flex items-center gap-2">
              <label htmlFor={`arc-years-${r.key}`} className="text-sm text-ink-700">
                Return period {i + 1} (years)
              </label>
              <input
                id={`arc-years-${r.key}`}
                value={r.years}
                inputMode="decimal"
                disabled={disabled}
                onChange={(e) => update(r.key, { years: e.target.value })}
                className="w-20 rounded-md border border-ink-300 px-2 py-1 text-sm"
              />
              <label htmlFor={`arc-value-${r.key}`} className="sr-only">
                ARC for return period {i + 1}
              </label>
              <select
                id={`arc-value-${r.key}`}
                value={r.arc}
                disabled={disabled}
                onChange={(e) => update(r.key, { arc: e.target.value as ArcRow["arc"] })}
                className="rounded-md border border-ink-300 px-2 py-1 text-sm"
              >
                <option value="I">ARC I</option>
                <option value="II">ARC II</option>
                <option value="III">ARC III</option>
              </select>
              {!disabled && (
                <Button
                  variant="quiet"
                  size="sm"
                  onClick={() => onChange(rows.filter((x) => x.key !== r.key))}
                >
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      {error && <p className="mb-2 text-sm text-brick-600">{error}</p>}
      {!disabled && (
        <Button variant="secondary" size="sm" onClick={() => onChange([...rows, arcRow("100")])}>
          Add a return period
        </Button>
      )}
    </div>
  );
}
