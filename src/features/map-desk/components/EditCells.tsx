import { useState } from "react";
import type { FlowRegime } from "../../../../shared/geo";
import { REGIME_NAMES } from "../map/palette";

/** A number cell that checks what is typed as it is typed, and saves on Enter or leaving it. */
export function ElevationCell({
  label,
  value,
  surveyed,
  decimals,
  onSave,
}: {
  label: string;
  value: number | null;
  surveyed: boolean;
  decimals: number;
  onSave: (value: number) => void;
}) {
  const shown = value === null ? "" : value.toFixed(decimals);
  const [text, setText] = useState<string | null>(null);
  const current = text ?? shown;
  const parsed = Number(current.trim());
  const problem =
    current.trim() === ""
      ? "Enter an elevation."
      : !Number.isFinite(parsed)
        ? "Enter a number, e.g. 412.5."
        : parsed < -10_000 || parsed > 100_000
          ? "Use a value between -10,000 and 100,000."
          : null;
  const commit = () => {
    if (text === null || text === shown) return setText(null);
    if (problem) return;
    onSave(parsed);
    setText(null);
  };
  return (
    <span className="inline-flex flex-col">
      <input
        type="text"
        inputMode="decimal"
        aria-label={label}
        aria-invalid={problem !== null && text !== null}
        value={current}
        onChange={(e) => setText(e.target.value)}
        onBlur={commit}
        onKeyDown={(e) => {
          if (e.key === "Enter") commit();
          if (e.key === "Escape") setText(null);
        }}
        className={`w-20 rounded border px-1 py-0.5 text-right font-mono text-xs ${
          problem && text !== null
            ? "border-brick-500 bg-brick-50"
            : surveyed
              ? "border-rill-500 bg-rill-50"
              : "border-ink-200"
        }`}
      />
      {problem && text !== null && (
        <span role="alert" className="text-[10px] text-brick-700">
          {problem}
        </span>
      )}
    </span>
  );
}

export function RegimeCell({
  label,
  value,
  onChange,
}: {
  label: string;
  value: FlowRegime;
  onChange: (regime: FlowRegime) => void;
}) {
  return (
    <select
      aria-label={label}
      value={value}
      onChange={(e) => onChange(e.target.value as FlowRegime)}
      className="rounded border border-ink-200 bg-white px-1 py-0.5 text-xs"
    >
      {(Object.keys(REGIME_NAMES) as FlowRegime[]).map((r) => (
        <option key={r} value={r}>
          {r}
        </option>
      ))}
    </select>
  );
}

/**
 * The surface of one segment: the class from the cover layer, or one the engineer chose for the
 * stretch. Choosing the first option gives the stretch back to the cover layer.
 */
export function SurfaceCell({
  label,
  segment,
  classes,
  onChange,
}: {
  label: string;
  segment: {
    surfaceClassId: string | null;
    surfaceClassName: string | null;
    surfaceSource: "cover-layer" | "override";
  };
  classes: readonly { id: string; name: string }[];
  onChange: (surfaceClassId: string | null) => void;
}) {
  const overridden = segment.surfaceSource === "override";
  const value = overridden ? (segment.surfaceClassId ?? "") : "";
  return (
    <select
      aria-label={label}
      value={value}
      onChange={(e) => onChange(e.target.value === "" ? null : e.target.value)}
      title={
        overridden ? "Chosen for this stretch (overrides the cover layer)" : "From the cover layer"
      }
      className={`max-w-44 rounded border px-1 py-0.5 text-xs ${
        overridden ? "border-rill-500 bg-rill-50" : "border-ink-200 bg-white"
      }`}
    >
      <option value="">
        {overridden
          ? "From the cover layer"
          : `${segment.surfaceClassName ?? "unmapped"} (cover layer)`}
      </option>
      {classes.map((c) => (
        <option key={c.id} value={c.id}>
          {c.name}
        </option>
      ))}
    </select>
  );
}
