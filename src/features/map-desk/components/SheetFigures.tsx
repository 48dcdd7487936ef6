import { rationalFormula } from "../../../../shared/hydrology/rational";
import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";

interface Props {
  /** The sheet in the units shown. */
  sheet: TravelTimeSheet;
  /** Set for editors: reverses the saved path (offered when the path seems drawn backwards). */
  onReverse: (() => void) | undefined;
  busy: boolean;
}

const fixed = (v: number | null, digits: number) => (v === null ? "—" : v.toFixed(digits));

/**
 * The subcatchment's own figures beside the path's (area from the boundary, area-weighted CN
 * and C, average land slope) and the rational-method peak flow at the governing Tc; and, when
 * the outlet end is higher than the top, an offer to reverse the path.
 */
export function SheetFigures({ sheet, onReverse, busy }: Props) {
  const { figures, peakFlow, unitLabels } = sheet;
  const items: [string, string, string][] = [
    ["Area", fixed(figures.area, 2), unitLabels.area ?? ""],
    ["CN", fixed(figures.cn, 0), ""],
    ["C", fixed(figures.c, 2), ""],
    ["Land slope", fixed(figures.avgSlopePercent, 1), "%"],
  ];
  return (
    <div className="mb-2 text-xs">
      {sheet.reversed && (
        <p className="mb-1 flex flex-wrap items-center gap-2 text-caution-900" role="note">
          The outlet end of the path is higher than its top: it seems drawn the wrong way.
          {onReverse && (
            <button
              type="button"
              onClick={onReverse}
              disabled={busy}
              className="rounded border border-caution-500 bg-white px-2 py-0.5 disabled:text-ink-400"
            >
              Reverse the path
            </button>
          )}
        </p>
      )}
      <dl data-testid="sheet-figures" className="flex flex-wrap gap-x-4 gap-y-0.5">
        {items.map(([term, value, unit]) => (
          <div key={term} className="flex gap-1">
            <dt className="text-ink-600">{term}</dt>
            <dd className="font-medium text-ink-900" data-figure={term}>
              {value}
              {value !== "—" && unit ? ` ${unit}` : ""}
            </dd>
          </div>
        ))}
        {peakFlow && (
          <div className="flex gap-1">
            <dt className="text-ink-600">Peak flow (rational method)</dt>
            <dd className="font-medium text-ink-900" data-figure="Peak flow">
              {peakFlow.value.toFixed(2)} {peakFlow.unit}{" "}
              <span className="font-normal text-ink-600">
                (i = {peakFlow.intensity.toFixed(2)} {unitLabels.intensity ?? ""} for{" "}
                {peakFlow.durationMin.toFixed(1)} min, {peakFlow.returnPeriodYears}-year)
              </span>
            </dd>
          </div>
        )}
      </dl>
      {peakFlow && (
        <p className="mt-0.5 font-mono text-ink-700" data-testid="rational-formula">
          {rationalFormula(peakFlow, {
            intensity: unitLabels.intensity ?? "",
            area: unitLabels.area ?? "",
          })}
        </p>
      )}
    </div>
  );
}
