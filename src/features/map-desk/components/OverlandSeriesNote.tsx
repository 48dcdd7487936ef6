import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";

/** The Design rules page's names of the two rules. */
const RULE_NAMES: Record<string, string> = {
  overlandSeries: "Overland flow across segments (kinematic wave)",
  sheetFlowSeries: "Sheet flow across segments (TR-55)",
};

/**
 * Sheet flow that crosses more than one segment: which rule of the Design rules combined them
 * for each method, and the Tc the other rules would give, so a reviewer sees what the choice is
 * worth before asking for another.
 */
export function OverlandSeriesNote({ sheet }: { sheet: TravelTimeSheet }) {
  const notes = sheet.methods.filter((m) => m.status === "ok" && m.overlandSeries);
  if (notes.length === 0) return null;
  return (
    <div
      role="note"
      data-testid="overland-series"
      className="mb-2 border-l-4 border-rill-500 bg-rill-50 px-2 py-1 text-xs text-ink-800"
    >
      <p className="font-semibold">
        Sheet flow runs over {notes[0]?.overlandSeries?.sheetSegments} segments; how their times
        combine is a design rule.
      </p>
      <ul className="mt-0.5 space-y-0.5">
        {notes.map((m) => {
          const s = m.overlandSeries;
          if (!s) return null;
          return (
            <li key={m.id} data-series={m.id}>
              {m.label}: {m.totalMin?.toFixed(2)} min as {s.usedLabel} (
              {RULE_NAMES[s.rule] ?? s.rule})
              {s.alternatives.map((a) => (
                <span key={a.option}>
                  ; {a.label}: {a.totalMin.toFixed(2)} min
                </span>
              ))}
              .
            </li>
          );
        })}
      </ul>
    </div>
  );
}
