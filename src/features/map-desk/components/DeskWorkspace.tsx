import { useQueryClient } from "@tanstack/react-query";
import type { Map as MapLibreMap } from "maplibre-gl";
import { useCallback, useMemo, useState } from "react";
import { pathLengthsM, type LonLat } from "../../../../shared/geo";
import { mFromFt, type UnitSystem } from "../../../../shared/hydrology/units";
import { can, type Role } from "../../../../shared/roles";
import type { Layer } from "../../../../shared/schemas/layers";
import type { Project } from "../../../../shared/schemas/projects";
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";
import { newestReady } from "../api/get-layers";
import type { BasemapConfig } from "../api/get-map-config";
import { useSheet } from "../api/get-sheet";
import { subcatchmentQueryOptions } from "../api/get-subcatchment";
import { useRunCompute } from "../api/run-compute";
import { initialBounds } from "../lib/initial-bounds";
import { usePathAutosave } from "../lib/use-path-autosave";
import { useDeskDraw } from "../lib/use-desk-draw";
import { useDeskEdits } from "../lib/use-desk-edits";
import {
  areaOutline,
  outletOutline,
  outlineChange,
  reverseChange,
  type OutlineChange,
} from "../lib/desk-history";
import { useDeskHistory } from "../lib/use-desk-history";
import type { BreakChange } from "../lib/regime-edit";
import { useLiveSplit } from "../lib/use-live-split";
import { useOverlays } from "../lib/use-overlays";
import type { DrawTool } from "../map/draw";
import { BreakMarkers, type BreakKind } from "./BreakMarkers";
import { DeskMap } from "./DeskMap";
import { terrainTiling } from "../lib/terrain-tiling";
import { DeskToolbar } from "./DeskToolbar";
import { LayerPanel } from "./LayerPanel";
import { SheetPanel } from "./SheetPanel";

interface Props {
  project: Project;
  role: Role | undefined;
  subcatchment: Subcatchment;
  layers: readonly Layer[];
  basemap: BasemapConfig;
}

export function DeskWorkspace({ project, role, subcatchment, layers, basemap }: Props) {
  const canEdit = role !== undefined && can(role, "geometry:edit") && can(role, "compute:run");
  const queryClient = useQueryClient();
  const sheetQuery = useSheet(subcatchment.id);
  const compute = useRunCompute(subcatchment.id, project.id);
  const recompute = useCallback(() => compute.mutateAsync(), [compute]);
  const refetch = useCallback(
    () => queryClient.fetchQuery({ ...subcatchmentQueryOptions(subcatchment.id), staleTime: 0 }),
    [queryClient, subcatchment.id],
  );
  const history = useDeskHistory((change, side) => {
    if (change.kind === "path") {
      const coords = [...change[side]];
      draw?.load("path", coords);
      autosave.restore(coords);
    } else if (change.kind === "breaks") void saved.moveBreaks(change[side]);
    else if (change.kind === "reverse") void saved.reversePath(change[side]);
    else void saved.setOutline(change[side]);
  });
  const autosave = usePathAutosave(subcatchment, recompute, refetch, (before, after) =>
    history.record({ kind: "path", before, after }),
  );
  const saved = useDeskEdits(subcatchment, project.id, recompute);
  // Break moves (dragged on the map or by a regime chosen in the sheet) go into the history.
  const edits = {
    ...saved,
    moveBreaks: (change: BreakChange) => {
      const before: BreakChange = {};
      if (change.sheetEnd !== undefined) before.sheetEnd = subcatchment.breaks.sheetEnd;
      if (change.channelStart !== undefined) before.channelStart = subcatchment.breaks.channelStart;
      history.record({ kind: "breaks", before, after: change });
      return saved.moveBreaks(change);
    },
    // Recorded once saved: a refused change has nothing to undo.
    reversePath: async () => {
      const change = reverseChange(subcatchment.breaks);
      const ok = await saved.reversePath();
      if (ok) history.record(change);
      return ok;
    },
    setOutline: async (patch: OutlineChange) => {
      const change = outlineChange(subcatchment, patch);
      const ok = await saved.setOutline(patch);
      if (ok) history.record(change);
      return ok;
    },
  };
  const [map, setMap] = useState<MapLibreMap | null>(null);
  const [hovered, setHovered] = useState<number | null>(null);
  const [units, setUnits] = useState<UnitSystem>(project.units === "si" ? "si" : "us");
  const [tool, setTool] = useState<DrawTool>("pan");
  const [measure, setMeasure] = useState<LonLat[]>([]);
  const [breakDrag, setBreakDrag] = useState<{ kind: BreakKind; stationM: number } | null>(null);

  const sheet = sheetQuery.data ?? null;
  const flowPath = subcatchment.flowPath;
  const savedPath = useMemo(
    () => (flowPath?.geometry.coordinates ?? []).map(([x, y]): LonLat => [x, y]),
    [flowPath],
  );
  const path = autosave.draft ?? savedPath;
  const lengths = useMemo(() => (path.length >= 2 ? pathLengthsM(path) : null), [path]);
  const toM = (v: number) => (subcatchment.lengthUnit === "ft" ? mFromFt(v) : v);
  const userOr = (user: number | null, computed: number | null | undefined) =>
    user !== null ? toM(user) : computed !== null && computed !== undefined ? toM(computed) : null;
  const restingBreaksM = {
    sheetEndM: userOr(subcatchment.breaks.sheetEnd, sheet?.breaks.sheetEnd),
    channelStartM: userOr(subcatchment.breaks.channelStart, sheet?.breaks.channelStart),
  };
  const breaksM = {
    sheetEndM:
      breakDrag?.kind === "sheetEnd"
        ? breakDrag.stationM
        : userOr(subcatchment.breaks.sheetEnd, sheet?.breaks.sheetEnd),
    channelStartM:
      breakDrag?.kind === "channelStart"
        ? breakDrag.stationM
        : userOr(subcatchment.breaks.channelStart, sheet?.breaks.channelStart),
  };

  const live = useLiveSplit(layers, path, subcatchment, breaksM);
  const upToDate =
    sheet !== null &&
    !autosave.draft &&
    !breakDrag &&
    sheet.flowPathVersion === (subcatchment.flowPath?.version ?? -1) &&
    !compute.isPending;
  useOverlays(map, {
    path,
    savedPath,
    live: live.segments,
    sheet,
    upToDate,
    subcatchment,
    measure,
  });

  const { draw } = useDeskDraw(map, canEdit, subcatchment, autosave.draft !== null, {
    onPath: (coords, settled) => {
      autosave.edit(coords, settled);
      // A finished trace hands the map back to panning, so the next click starts nothing.
      if (settled && tool === "trace") {
        setTool("pan");
        draw?.setTool("pan");
      }
    },
    onArea: (ring) => {
      const patch = areaOutline(ring);
      if (patch) void edits.setOutline(patch);
    },
    onOutlet: (p) => void edits.setOutline(outletOutline(p)),
    onMeasure: setMeasure,
    onTraceCancel: autosave.cancelTrace,
  });
  const chooseTool = (next: DrawTool) => {
    setTool(next);
    if (next === "edit") draw?.editPath();
    else draw?.setTool(next);
  };

  const reverse = () => {
    if (autosave.draft) autosave.edit([...autosave.draft].reverse(), true);
    else void edits.reversePath();
  };
  const moveBreak = (kind: BreakKind, stationM: number) => {
    setBreakDrag(null);
    const station = subcatchment.lengthUnit === "ft" ? stationM / mFromFt(1) : stationM;
    void edits.moveBreaks({ [kind]: Math.round(station * 100) / 100 });
  };
  // Undo and redo wait for the edit in hand to be saved: they replace the whole path.
  const busy = edits.busy || autosave.saving || autosave.draft !== null;
  const terrain = newestReady(layers, "terrain");
  // The first view: the subcatchment (boundary and path), else every layer's extent.
  const [bounds] = useState(() => initialBounds(subcatchment, layers));

  return (
    <div className="grid h-[calc(100vh-12rem)] min-h-[32rem] grid-cols-[minmax(0,1fr)_minmax(0,1.15fr)]">
      <section aria-label="Map and tools" className="flex min-h-0 flex-col border-r border-ink-200">
        {canEdit && (
          <DeskToolbar
            tool={tool}
            onTool={chooseTool}
            onUndo={history.undo}
            onRedo={history.redo}
            history={{
              canUndo: history.canUndo && !busy,
              canRedo: history.canRedo && !busy,
            }}
            onReverse={reverse}
            onFile={(what, file) => void edits.loadFile({ what, file })}
            measure={measure}
            units={units}
            busy={edits.busy || autosave.saving}
          />
        )}
        <div className="relative min-h-0 flex-1">
          <DeskMap
            basemap={basemap}
            projectId={project.id}
            terrainLayerId={terrain?.id}
            terrainTiling={terrainTiling(terrain ?? { bbox4326: null, terrain: null })}
            bounds={bounds}
            lengthUnit={units === "si" ? "m" : "ft"}
            hovered={hovered}
            onHover={setHovered}
            onReady={setMap}
          />
          <LayerPanel
            map={map}
            projectId={project.id}
            terrainLayerId={terrain?.id}
            unit={units === "si" ? "m" : "ft"}
          />
          <BreakMarkers
            map={map}
            path={path}
            lengths={lengths}
            breaksM={restingBreaksM}
            editable={canEdit}
            onDrag={(kind, stationM) => setBreakDrag({ kind, stationM })}
            onDrop={moveBreak}
          />
        </div>
      </section>
      <SheetPanel
        sheet={sheet}
        sheetLoading={sheetQuery.isPending}
        live={live}
        upToDate={upToDate}
        units={units}
        onUnits={setUnits}
        hovered={hovered}
        onHover={setHovered}
        canEdit={canEdit}
        subcatchment={subcatchment}
        edits={edits}
        autosave={autosave}
        computing={compute.isPending}
        computeError={compute.error}
        onCompute={canEdit ? () => void recompute().catch(() => undefined) : undefined}
      />
    </div>
  );
}
