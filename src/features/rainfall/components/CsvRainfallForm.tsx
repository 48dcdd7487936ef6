import { useState, type FormEvent } from "react";
import { rainfallCsvFields } from "../../../../shared/schemas/rainfall";
import { Button } from "../../../components/Button";
import { ChoiceGroup } from "../../../components/ChoiceGroup";
import { FormError } from "../../../components/FormError";
import { TextAreaField, TextField } from "../../../components/TextField";
import { isApiError } from "../../../lib/api";
import { fieldErrorsOf, type FieldErrors } from "../../../lib/form";
import { useUploadRainfallCsv } from "../api/upload-rainfall-csv";

const KINDS = [
  { value: "intensity", label: "Intensity", description: "in/h or mm/h" },
  { value: "depth", label: "Depth", description: "in or mm, to the end of each duration" },
];

/** The CSV layout in brief; docs/file-formats.md has the whole of it. */
function FormatHelp({ depthUnit }: { depthUnit: string }) {
  return (
    <details className="rounded-md border border-ink-200 bg-paper/60 px-3 py-2 text-xs text-ink-700">
      <summary className="cursor-pointer font-medium text-ink-800">
        What the file looks like
      </summary>
      <pre className="mt-2 overflow-x-auto text-[11px] leading-relaxed">
        {`# Source: agency IDF curves, 2024 edition
duration_min / intensity, 2-yr, 10-yr, 25-yr, 100-yr
5,  4.9, 6.6, 7.6, 9.2
10, 3.9, 5.3, 6.1, 7.4`}
      </pre>
      <ul className="mt-2 list-disc space-y-1 pl-4">
        <li>
          The first header cell names the duration unit (<code>duration_min</code> or{" "}
          <code>duration_hr</code>) and may say <code>intensity</code> or <code>depth</code>.
        </li>
        <li>
          Return periods in years head the other columns: <code>2</code>, <code>2-yr</code>,{" "}
          <code>2-year</code>, <code>T=2</code>.
        </li>
        <li>
          Values are in the project&apos;s units (depths in {depthUnit}). Lines starting with{" "}
          <code>#</code> are kept as notes.
        </li>
        <li>
          Durations and return periods increase; intensity never rises with duration. A problem
          names its row and column.
        </li>
      </ul>
    </details>
  );
}

export function CsvRainfallForm({
  projectId,
  depthUnit,
  onCreated,
}: {
  projectId: string;
  depthUnit: string;
  onCreated: (tableId: string) => void;
}) {
  const upload = useUploadRainfallCsv(projectId);
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const serverFields = isApiError(upload.error) ? upload.error.fields : {};
  const errors = { ...serverFields, ...clientErrors };

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const target = event.currentTarget;
    const data = new FormData(target);
    const parsed = rainfallCsvFields.safeParse({
      name: data.get("name") ?? "",
      sourceNote: data.get("sourceNote") ?? "",
      kind: data.get("kind") ?? undefined,
      p2_24h: data.get("p2_24h") ?? "",
    });
    const found: FieldErrors = parsed.success ? {} : fieldErrorsOf(parsed.error);
    const file = data.get("file");
    if (!(file instanceof File) || file.size === 0) found.file = "Choose a CSV file.";
    setClientErrors(found);
    if (!parsed.success || !(file instanceof File) || found.file) return upload.reset();
    upload.mutate(
      { fields: parsed.data, file },
      {
        onSuccess: (table) => {
          target.reset();
          onCreated(table.id);
        },
      },
    );
  }

  return (
    <form
      noValidate
      onSubmit={onSubmit}
      className="space-y-4"
      aria-label="Rainfall table from a CSV file"
    >
      <FormatHelp depthUnit={depthUnit} />
      <TextField label="Table name" name="name" autoComplete="off" error={errors.name} />
      <ChoiceGroup
        legend="The values are"
        name="kind"
        choices={KINDS}
        defaultValue="intensity"
        error={errors.kind}
        inline
      />
      <TextField
        label={`2-year 24-hour depth (${depthUnit})`}
        name="p2_24h"
        inputMode="decimal"
        optional
        hint="TR-55 sheet flow needs it."
        error={errors.p2_24h}
      />
      <TextAreaField
        label="Source"
        name="sourceNote"
        optional
        hint="Agency, document, edition."
        error={errors.sourceNote}
      />
      <TextField
        label="CSV file"
        name="file"
        type="file"
        accept=".csv,text/csv"
        error={errors.file}
      />
      <FormError
        message={
          isApiError(upload.error)
            ? upload.error.message
            : upload.error
              ? "The upload failed. Try again."
              : null
        }
      />
      <Button type="submit" pending={upload.isPending} className="w-full">
        Upload table
      </Button>
    </form>
  );
}
