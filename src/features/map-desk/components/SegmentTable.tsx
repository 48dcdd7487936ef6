import type { FlowRegime } from "../../../../shared/geo";
import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";
import { sheetColumns, sheetTable, type Cell } from "../../../../shared/sheet/table";
import { ElevationCell, RegimeCell, SurfaceCell } from "./EditCells";

interface Props {
  /** The sheet in the units shown. */
  sheet: TravelTimeSheet;
  hovered: number | null;
  onHover: (index: number | null) => void;
  canEdit: boolean;
  onRegime: (index: number, regime: FlowRegime) => void;
  /** Elevation typed at a segment end, in the units shown. */
  onElevation: (index: number, end: "up" | "down", value: number) => void;
  /** The team's classes (as the project sees them) for the Surface cell. */
  classes?: readonly { id: string; name: string }[];
  /** A class chosen for the segment's stretch; null gives it back to the cover layer. */
  onSurface?: (index: number, surfaceClassId: string | null) => void;
}

const decimalsOf = (format: string | undefined) => (format?.split(".")[1] ?? "").length;

function show(value: Cell, format: string | undefined): string {
  if (value === null) return "—";
  if (typeof value === "number") return value.toFixed(decimalsOf(format));
  return value;
}

/** The travel-time sheet's segment rows, the same columns and rounding as the exports. */
export function SegmentTable(props: Props) {
  const { sheet, hovered, onHover, canEdit, onRegime, onElevation, classes, onSurface } = props;
  const columns = sheetColumns(sheet);
  const table = sheetTable(sheet);
  const totals = new Map(columns.map((c, i) => [c.key, table.totals[i] ?? null]));
  return (
    <table className="w-full border-collapse text-xs" aria-label="Travel time by segment">
      <thead className="sticky top-0 z-10 bg-ink-50">
        <tr>
          {columns.map((c) => (
            <th
              key={c.key}
              scope="col"
              className="border-b border-ink-200 px-1.5 py-1 text-left align-bottom font-semibold whitespace-nowrap text-ink-700"
            >
              {c.title}
              {c.unit && <span className="block font-normal text-ink-500">{c.unit}</span>}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {sheet.segments.map((s) => (
          <tr
            key={s.index}
            data-segment={s.index}
            onMouseEnter={() => onHover(s.index)}
            onMouseLeave={() => onHover(null)}
            onFocus={() => onHover(s.index)}
            className={`${hovered === s.index ? "bg-caution-100" : "odd:bg-white even:bg-ink-50/50"} ${s.error ? "text-brick-700" : ""}`}
          >
            {columns.map((c) => {
              const cls = "border-b border-ink-100 px-1.5 py-1 whitespace-nowrap";
              if (canEdit && c.key === "regime") {
                return (
                  <td key={c.key} className={cls}>
                    <RegimeCell
                      label={`Segment ${s.index + 1} flow regime`}
                      value={s.regime}
                      onChange={(r) => onRegime(s.index, r)}
                    />
                  </td>
                );
              }
              if (canEdit && onSurface && classes && c.key === "surface") {
                return (
                  <td key={c.key} className={cls}>
                    <SurfaceCell
                      label={`Segment ${s.index + 1} surface class`}
                      segment={s}
                      classes={classes}
                      onChange={(id) => onSurface(s.index, id)}
                    />
                  </td>
                );
              }
              if (canEdit && (c.key === "elevationUp" || c.key === "elevationDown")) {
                const up = c.key === "elevationUp";
                return (
                  <td key={c.key} className={cls}>
                    <ElevationCell
                      label={`Segment ${s.index + 1} elevation ${up ? "up" : "down"}`}
                      value={up ? s.elevationUp : s.elevationDown}
                      surveyed={s.elevationSource === "survey" || s.elevationSource === "mixed"}
                      decimals={decimalsOf(c.format)}
                      onSave={(v) => onElevation(s.index, up ? "up" : "down", v)}
                    />
                  </td>
                );
              }
              if (c.key === "notes") {
                const notes = [s.error, ...s.warnings].filter(Boolean);
                return (
                  <td key={c.key} className={`${cls} min-w-48 whitespace-normal`}>
                    {notes.length > 0 ? (
                      <span className="text-caution-800">⚠ {notes.join(" ")}</span>
                    ) : (
                      "—"
                    )}
                  </td>
                );
              }
              const v = c.value(s);
              return (
                <td
                  key={c.key}
                  data-column={c.key}
                  className={`${cls} ${typeof v === "number" ? "text-right font-mono" : ""}`}
                >
                  {show(v, c.format)}
                </td>
              );
            })}
          </tr>
        ))}
      </tbody>
      <tfoot>
        <tr className="bg-ink-100 font-semibold">
          {columns.map((c) => (
            <td
              key={c.key}
              data-total={c.key}
              className="px-1.5 py-1 text-right font-mono whitespace-nowrap first:text-left"
            >
              {show(totals.get(c.key) ?? null, c.format)}
            </td>
          ))}
        </tr>
      </tfoot>
    </table>
  );
}
