import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";
import type { PathConflict } from "../lib/use-path-autosave";

interface Props {
  sheet: TravelTimeSheet | null;
  upToDate: boolean;
  computing: boolean;
  saving: boolean;
  draft: boolean;
  tracing: boolean;
  conflict: PathConflict | null;
  onKeepMine: () => void;
  onTakeSaved: () => void;
  error: string | null;
  onCompute: (() => void) | undefined;
}

/** One line saying where the sheet stands; fixed height so the sheet below never jumps. */
export function SheetStatus(p: Props) {
  const text = p.saving
    ? "Saving…"
    : p.computing
      ? "Computing every method…"
      : p.tracing
        ? "Tracing: the segments below preview the vertices placed; not saved yet. Enter finishes."
        : p.draft
          ? "Drawing: the segments below are the live split; the sheet follows when you pause."
          : !p.sheet
            ? "Not computed yet."
            : p.upToDate
              ? `Computed ${new Date(p.sheet.computedAt).toLocaleString()} for path version ${p.sheet.flowPathVersion}.`
              : "The path changed since this sheet was computed.";
  return (
    <div
      className="flex min-h-10 flex-wrap items-center gap-2 border-b border-ink-100 px-3 py-1.5 text-xs"
      aria-live="polite"
      data-testid="sheet-status"
    >
      {p.conflict ? (
        <span role="alert" className="flex flex-wrap items-center gap-2 text-caution-900">
          Someone saved this path while you were drawing (now version {p.conflict.version}).
          <button
            type="button"
            className="rounded border border-caution-500 bg-white px-2 py-0.5"
            onClick={p.onKeepMine}
          >
            Keep my drawing
          </button>
          <button
            type="button"
            className="rounded border border-ink-300 bg-white px-2 py-0.5"
            onClick={p.onTakeSaved}
          >
            Use the saved path
          </button>
        </span>
      ) : (
        <span className="text-ink-600">{text}</span>
      )}
      {p.error && (
        <span role="alert" className="text-brick-700">
          {p.error}
        </span>
      )}
      {p.onCompute && p.sheet && !p.upToDate && !p.computing && !p.draft && (
        <button
          type="button"
          onClick={p.onCompute}
          className="ml-auto rounded border border-rill-700 px-2 py-0.5 text-rill-800"
        >
          Compute now
        </button>
      )}
    </div>
  );
}
