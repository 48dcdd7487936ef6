import { lazy, Suspense } from "react";
import type { FlowRegime } from "../../../../shared/geo";
import { ftFromM, mFromFt, type UnitSystem } from "../../../../shared/hydrology/units";
import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";
import { errorMessage } from "../../../components/QueryStatus";
import { sheetExportUrl } from "../api/get-sheet";
import { useSurfaceClasses } from "../api/get-surface-classes";
import type { LiveSplit } from "../lib/use-live-split";
import { breaksForRegime } from "../lib/regime-edit";
import { sheetInUnits } from "../lib/sheet-units";
import type { useDeskEdits } from "../lib/use-desk-edits";
import type { usePathAutosave } from "../lib/use-path-autosave";
import { LivePreview } from "./LivePreview";
import { HowSure } from "./HowSure";
import { MethodTotals } from "./MethodTotals";
import { OverlandSeriesNote } from "./OverlandSeriesNote";
import { SegmentTable } from "./SegmentTable";
import { SheetFigures } from "./SheetFigures";

// The charting package loads after the map and the sheet: the desk is usable before it arrives.
const SheetCharts = lazy(async () => ({ default: (await import("./SheetCharts")).SheetCharts }));
import { SheetStatus } from "./SheetStatus";

interface Props {
  sheet: TravelTimeSheet | null;
  sheetLoading: boolean;
  live: LiveSplit;
  upToDate: boolean;
  units: UnitSystem;
  onUnits: (units: UnitSystem) => void;
  hovered: number | null;
  onHover: (index: number | null) => void;
  canEdit: boolean;
  subcatchment: Subcatchment;
  edits: ReturnType<typeof useDeskEdits>;
  autosave: ReturnType<typeof usePathAutosave>;
  computing: boolean;
  computeError: unknown;
  onCompute: (() => void) | undefined;
}

export function SheetPanel(props: Props) {
  const { sheet, units, live, upToDate, subcatchment, edits } = props;
  const classes = useSurfaceClasses(subcatchment.projectId);
  const shown = sheet ? sheetInUnits(sheet, units) : null;
  // Values typed in the units shown go to the API in the project's length unit.
  const toProject = (v: number) =>
    units === sheet?.units ? v : sheet?.units === "us" ? ftFromM(v) : mFromFt(v);

  const onRegime = (index: number, regime: FlowRegime) => {
    const s = sheet?.segments[index];
    const change = s && breaksForRegime(s, regime);
    if (change) void edits.moveBreaks(change);
  };
  const onElevation = (index: number, end: "up" | "down", value: number) => {
    const s = sheet?.segments[index];
    if (s) void edits.setElevation(end === "up" ? s.stationFrom : s.stationTo, toProject(value));
  };
  // The stretch goes to the API in the project's length unit, as the stored sheet has it.
  const onSurface = (index: number, surfaceClassId: string | null) => {
    const s = sheet?.segments[index];
    if (s) void edits.setSurface(s, surfaceClassId);
  };

  return (
    <section aria-label="Travel-time sheet" className="flex min-h-0 flex-col bg-white">
      <div className="flex flex-wrap items-center gap-2 border-b border-ink-200 bg-paper px-3 py-2">
        <h2 className="text-base font-semibold text-ink-900">Travel-time sheet</h2>
        <fieldset className="ml-auto flex items-center gap-1 text-sm">
          <legend className="sr-only">Units shown</legend>
          {(["us", "si"] as const).map((u) => (
            <label
              key={u}
              className={`cursor-pointer rounded-md border px-2 py-0.5 has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-rill-600 ${units === u ? "border-rill-700 bg-rill-700 text-white" : "border-ink-300 bg-white"}`}
            >
              <input
                type="radio"
                name="desk-units"
                className="sr-only"
                checked={units === u}
                onChange={() => props.onUnits(u)}
              />
              {u === "us" ? "US" : "SI"}
            </label>
          ))}
        </fieldset>
        {sheet ? (
          <>
            <a
              className="rounded-md border border-ink-300 bg-white px-2 py-0.5 text-sm text-ink-800 hover:bg-ink-50"
              href={sheetExportUrl(subcatchment.id, "csv")}
              download
            >
              Download CSV
            </a>
            <a
              className="rounded-md border border-ink-300 bg-white px-2 py-0.5 text-sm text-ink-800 hover:bg-ink-50"
              href={sheetExportUrl(subcatchment.id, "xlsx")}
              download
            >
              Download XLSX
            </a>
          </>
        ) : null}
      </div>
      <SheetStatus
        sheet={sheet}
        upToDate={upToDate}
        computing={props.computing}
        saving={props.autosave.saving || edits.busy}
        draft={props.autosave.draft !== null}
        tracing={props.autosave.tracing}
        conflict={props.autosave.conflict}
        onKeepMine={props.autosave.keepMine}
        onTakeSaved={props.autosave.takeSaved}
        error={
          props.autosave.error ??
          edits.error ??
          (props.computeError ? errorMessage(props.computeError) : null)
        }
        onCompute={props.onCompute}
      />
      <div className="min-h-0 flex-1 overflow-auto px-3 pb-3">
        <p className="my-2 border-l-4 border-caution-400 bg-caution-50 px-2 py-1 text-xs text-caution-900">
          Design aid for qualified engineers; local drainage criteria and the engineer of record
          govern.
        </p>
        {shown?.governing && (
          <p className="mb-2 text-sm" data-testid="governing">
            <span className="font-semibold">
              Governing Tc: {shown.governing.tcMin.toFixed(2)} min
            </span>{" "}
            ({shown.governing.tcHr.toFixed(3)} h) by {shown.governing.label}.{" "}
            {shown.governing.reason}
          </p>
        )}
        {shown && (
          <SheetFigures
            sheet={shown}
            onReverse={props.canEdit ? () => void edits.reversePath() : undefined}
            busy={edits.busy || props.computing}
          />
        )}
        {shown && shown.problems.length > 0 && (
          <ul className="mb-2 list-disc pl-5 text-xs text-brick-700">
            {shown.problems.map((p) => (
              <li key={p}>{p}</li>
            ))}
          </ul>
        )}
        {shown && <OverlandSeriesNote sheet={shown} />}
        {shown && <MethodTotals sheet={shown} />}
        {shown && <HowSure sheet={shown} />}
        <h3 className="mt-3 mb-1 text-sm font-semibold text-ink-800">Segments</h3>
        <div
          className="min-h-40 overflow-x-auto rounded border border-ink-200"
          // The wide table scrolls sideways: reachable by keyboard as a labelled region.
          tabIndex={0}
          role="region"
          aria-label="Segments, scrolls sideways"
        >
          {shown && upToDate ? (
            <SegmentTable
              sheet={shown}
              hovered={props.hovered}
              onHover={props.onHover}
              canEdit={props.canEdit}
              onRegime={onRegime}
              onElevation={onElevation}
              classes={classes.data}
              onSurface={onSurface}
            />
          ) : live.segments.length > 0 ? (
            <LivePreview
              segments={live.segments}
              tracing={props.autosave.tracing}
              units={units}
              classes={classes.data}
              hovered={props.hovered}
              onHover={props.onHover}
            />
          ) : (
            <p className="p-3 text-sm text-ink-600">
              {props.sheetLoading
                ? "Loading the sheet…"
                : props.canEdit
                  ? "No flow path yet: choose Trace path and click from the divide to the outlet."
                  : "No flow path has been drawn yet."}
            </p>
          )}
        </div>
        {shown?.warnings.length ? (
          <ul className="mt-2 space-y-0.5 text-xs text-caution-800">
            {/* The multi-surface note above says it in full. */}
            {shown.warnings
              .filter((w) => w.code !== "sheet-multi-surface")
              .map((w) => (
                <li key={`${w.code}-${w.message}`}>⚠ {w.message}</li>
              ))}
          </ul>
        ) : null}
        {shown && (
          <Suspense fallback={<div className="mt-3 h-[44rem]" aria-busy="true" />}>
            <SheetCharts sheet={shown} live={upToDate ? null : live.segments} />
          </Suspense>
        )}
      </div>
    </section>
  );
}
