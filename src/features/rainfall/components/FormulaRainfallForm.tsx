import { useState, type FormEvent } from "react";
import { createRainfallBody } from "../../../../shared/schemas/rainfall";
import { Button } from "../../../components/Button";
import { FormError } from "../../../components/FormError";
import { TextAreaField, TextField } from "../../../components/TextField";
import { isApiError } from "../../../lib/api";
import { fieldErrorsOf, type FieldErrors } from "../../../lib/form";
import { useCreateRainfallTable } from "../api/create-rainfall-table";

interface Row {
  key: number;
  years: string;
  a: string;
  b: string;
  c: string;
}

const toNumber = (s: string) => (s.trim() === "" ? Number.NaN : Number(s));
let nextKey = 1;
const emptyRow = (years = ""): Row => ({ key: nextKey++, years, a: "", b: "", c: "" });

/** Sherman coefficients i = a/(t + b)^c, one row per return period. */
export function FormulaRainfallForm({
  projectId,
  units,
  onCreated,
}: {
  projectId: string;
  units: { depth: string; intensity: string };
  onCreated: (tableId: string) => void;
}) {
  const create = useCreateRainfallTable(projectId);
  const [rows, setRows] = useState<Row[]>(() => [emptyRow("10")]);
  const [clientErrors, setClientErrors] = useState<FieldErrors | null>(null);
  const errors = clientErrors ?? (isApiError(create.error) ? create.error.fields : {});

  const update = (key: number, part: Partial<Row>) =>
    setRows((rs) => rs.map((r) => (r.key === key ? { ...r, ...part } : r)));

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const found: FieldErrors = {};
    const years = rows.map((r) => r.years.trim());
    years.forEach((y, i) => {
      if (!/^\d+(\.\d+)?$/.test(y) || Number(y) <= 0)
        found[`rows.${i}.years`] = "Enter a return period in years.";
      else if (years.indexOf(y) !== i)
        found[`rows.${i}.years`] = "This return period is listed twice.";
    });
    const p2 = String(data.get("p2_24h") ?? "").trim();
    const body = {
      name: String(data.get("name") ?? ""),
      sourceNote: String(data.get("sourceNote") ?? ""),
      p2_24h: p2 === "" ? null : toNumber(p2),
      idf: {
        kind: "formula",
        formula: Object.fromEntries(
          rows.map((r) => [
            r.years.trim(),
            { a: toNumber(r.a), b: toNumber(r.b), c: toNumber(r.c) },
          ]),
        ),
      },
    };
    const parsed = createRainfallBody.safeParse(body);
    if (!parsed.success) Object.assign(found, fieldErrorsOf(parsed.error));
    // The schema speaks of idf.formula.<years>.<coef>; the form shows it on that row's cell.
    for (const [path, message] of Object.entries(found)) {
      const m = /^idf\.formula\.([^.]+)\.(a|b|c)$/.exec(path);
      const row = m ? years.indexOf(m[1]!) : -1;
      if (m && row >= 0) found[`rows.${row}.${m[2]}`] = message;
    }
    setClientErrors(found);
    if (Object.keys(found).length > 0 || !parsed.success) return create.reset();
    setClientErrors(null);
    create.mutate(parsed.data, { onSuccess: (table) => onCreated(table.id) });
  }

  const cell = (r: Row, i: number, part: "years" | "a" | "b" | "c", label: string) => (
    <TextField
      label={`${label}, row ${i + 1}`}
      name={`${part}-${r.key}`}
      value={r[part]}
      onChange={(e) => update(r.key, { [part]: e.target.value })}
      inputMode="decimal"
      error={errors[`rows.${i}.${part}`]}
      className="min-w-0"
    />
  );

  const orphan = Object.entries(errors)
    .filter(([k]) => !k.startsWith("rows.") && !["name", "sourceNote", "p2_24h"].includes(k))
    .map(([, v]) => v);

  return (
    <form
      noValidate
      onSubmit={onSubmit}
      className="space-y-4"
      aria-label="Rainfall formula coefficients"
    >
      <TextField label="Table name" name="name" autoComplete="off" error={errors.name} />
      <p className="text-xs text-ink-600">
        i = a / (t + b)^c with t in minutes and i in {units.intensity}; one row per return period.
      </p>
      <div className="space-y-3">
        {rows.map((r, i) => (
          <fieldset
            key={r.key}
            className="grid grid-cols-4 items-start gap-2 rounded-md border border-ink-200 p-2"
          >
            <legend className="px-1 text-xs font-medium text-ink-700">Return period {i + 1}</legend>
            {cell(r, i, "years", "Years")}
            {cell(r, i, "a", "a")}
            {cell(r, i, "b", "b")}
            {cell(r, i, "c", "c")}
            {rows.length > 1 && (
              <Button
                variant="quiet"
                size="sm"
                className="col-span-4 justify-self-end"
                onClick={() => setRows((rs) => rs.filter((x) => x.key !== r.key))}
              >
                Remove return period {i + 1}
              </Button>
            )}
          </fieldset>
        ))}
        <Button variant="secondary" size="sm" onClick={() => setRows((rs) => [...rs, emptyRow()])}>
          Add a return period
        </Button>
      </div>
      <TextField
        label={`2-year 24-hour depth (${units.depth})`}
        name="p2_24h"
        inputMode="decimal"
        optional
        error={errors.p2_24h}
      />
      <TextAreaField
        label="Source"
        name="sourceNote"
        optional
        hint="Agency, document, edition."
        error={errors.sourceNote}
      />
      <FormError
        message={
          clientErrors && Object.keys(clientErrors).length > 0
            ? ["Check the fields marked in red.", ...orphan].join(" ")
            : isApiError(create.error)
              ? [create.error.message, ...orphan].join(" ")
              : null
        }
      />
      <Button type="submit" pending={create.isPending} className="w-full">
        Save formulas
      </Button>
    </form>
  );
}
