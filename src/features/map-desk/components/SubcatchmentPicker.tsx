import type { Subcatchment } from "../../../../shared/schemas/subcatchments";

interface Props {
  subcatchments: readonly Subcatchment[];
  value: string | undefined;
  onChange: (id: string) => void;
}

export function SubcatchmentPicker({ subcatchments, value, onChange }: Props) {
  if (subcatchments.length === 0) return null;
  return (
    <label className="flex items-center gap-2 text-sm text-ink-700">
      Subcatchment
      <select
        value={value ?? ""}
        onChange={(e) => onChange(e.target.value)}
        className="h-8 rounded-md border border-ink-300 bg-white px-2 text-sm text-ink-900"
      >
        {subcatchments.map((s) => (
          <option key={s.id} value={s.id}>
            {s.name} ({s.scenario})
          </option>
        ))}
      </select>
    </label>
  );
}
