import { useRef } from "react";
import { pathLengthsM, type LonLat } from "../../../../shared/geo";
import { ftFromM, type UnitSystem } from "../../../../shared/hydrology/units";
import type { DrawTool } from "../map/draw";

const TOOLS: readonly { id: DrawTool; label: string; hint: string }[] = [
  { id: "pan", label: "Pan", hint: "Move and zoom the map" },
  { id: "trace", label: "Trace path", hint: "Click from the divide to the outlet; Enter finishes" },
  { id: "edit", label: "Shape path", hint: "Drag a vertex; right-click a vertex to delete it" },
  { id: "outline", label: "Outline area", hint: "Click the subcatchment's corners; Enter closes" },
  { id: "outlet", label: "Place outlet", hint: "Click where the path leaves the area" },
  { id: "measure", label: "Measure", hint: "Click points; the length shows here" },
];

interface Props {
  tool: DrawTool;
  onTool: (tool: DrawTool) => void;
  onUndo: () => void;
  onRedo: () => void;
  history: { canUndo: boolean; canRedo: boolean };
  onReverse: () => void;
  onFile: (what: "flow-path" | "boundary", file: File) => void;
  measure: readonly LonLat[];
  units: UnitSystem;
  busy: boolean;
}

const btn =
  "h-8 rounded-md border px-2.5 text-sm font-medium transition-colors disabled:cursor-not-allowed disabled:text-ink-400";

export function DeskToolbar(props: Props) {
  const { tool, onTool, history, measure, units } = props;
  const pathFile = useRef<HTMLInputElement>(null);
  const areaFile = useRef<HTMLInputElement>(null);
  const measured = measure.length >= 2 ? pathLengthsM(measure).totalM : null;
  const hint = TOOLS.find((t) => t.id === tool)?.hint ?? "";
  const fileInput = (
    what: "flow-path" | "boundary",
    ref: React.RefObject<HTMLInputElement | null>,
    label: string,
  ) => (
    <>
      <button
        type="button"
        className={`${btn} border-ink-300 bg-white text-ink-800 hover:bg-ink-50`}
        onClick={() => ref.current?.click()}
      >
        {label}
      </button>
      <input
        ref={ref}
        type="file"
        aria-label={label}
        className="sr-only"
        tabIndex={-1}
        accept=".kml,.kmz,.gpx,.geojson,.json,.zip"
        onChange={(e) => {
          const file = e.target.files?.[0];
          if (file) props.onFile(what, file);
          e.target.value = "";
        }}
      />
    </>
  );
  return (
    <div className="border-b border-ink-200 bg-paper px-3 py-2">
      <div
        role="toolbar"
        aria-label="Drawing tools"
        className="flex flex-wrap items-center gap-1.5"
      >
        {TOOLS.map((t) => (
          <button
            key={t.id}
            type="button"
            aria-pressed={tool === t.id}
            title={t.hint}
            onClick={() => onTool(t.id)}
            className={`${btn} ${tool === t.id ? "border-rill-700 bg-rill-700 text-white" : "border-ink-300 bg-white text-ink-800 hover:bg-ink-50"}`}
          >
            {t.label}
          </button>
        ))}
        <span aria-hidden="true" className="mx-1 h-6 w-px bg-ink-200" />
        <button
          type="button"
          className={`${btn} border-ink-300 bg-white text-ink-800`}
          onClick={props.onReverse}
          disabled={props.busy}
        >
          Reverse path
        </button>
        <button
          type="button"
          className={`${btn} border-ink-300 bg-white text-ink-800`}
          onClick={props.onUndo}
          disabled={!history.canUndo}
        >
          Undo
        </button>
        <button
          type="button"
          className={`${btn} border-ink-300 bg-white text-ink-800`}
          onClick={props.onRedo}
          disabled={!history.canRedo}
        >
          Redo
        </button>
        {fileInput("flow-path", pathFile, "Load path file")}
        {fileInput("boundary", areaFile, "Load area file")}
      </div>
      <p className="mt-1 h-4 text-xs text-ink-600" aria-live="polite">
        {tool === "measure" && measured !== null
          ? `Measured: ${(units === "us" ? ftFromM(measured) : measured).toFixed(1)} ${units === "us" ? "ft" : "m"}`
          : hint}
      </p>
    </div>
  );
}
