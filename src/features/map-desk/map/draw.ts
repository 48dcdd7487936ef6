/**
 * Drawing on the Map desk with terra-draw and its maplibre adapter: tracing and editing the
 * flow path, outlining the subcatchment, placing the outlet and measuring. Undo and redo are the
 * desk's own (lib/desk-history.ts): they work on saved versions, which terra-draw cannot see.
 */
import type { Map as MapLibreMap } from "maplibre-gl";
import {
  TerraDraw,
  TerraDrawLineStringMode,
  TerraDrawPointMode,
  TerraDrawPolygonMode,
  TerraDrawRenderMode,
  TerraDrawSelectMode,
  type GeoJSONStoreFeatures,
} from "terra-draw";
import { TerraDrawMapLibreGLAdapter } from "terra-draw-maplibre-gl-adapter";
import type { LonLat } from "../../../../shared/geo";
import { placedVertices, sameVertices } from "../lib/trace-vertices";
import { MAP_COLOURS } from "./palette";

export type DrawTool = "pan" | "trace" | "edit" | "outline" | "outlet" | "measure";

export interface DrawEvents {
  /**
   * The path changed; `settled` is false while a new path is still being traced, and then
   * `coords` are the vertices clicked so far (two or more), told once per click.
   */
  onPath(coords: LonLat[], settled: boolean): void;
  /** A trace was left unfinished (Escape, or another tool chosen): its vertices are gone. */
  onTraceCancel(): void;
  onArea(ring: LonLat[]): void;
  onOutlet(point: LonLat): void;
  onMeasure(coords: LonLat[]): void;
}

const INK = MAP_COLOURS.subcatchment as `#${string}`;
const ids = { path: "", area: "", outlet: "", measure: "" };
type Kind = keyof typeof ids;

const coordsOf = (f: GeoJSONStoreFeatures | undefined): LonLat[] => {
  const g = f?.geometry;
  if (!g) return [];
  if (g.type === "LineString") return g.coordinates.map((c) => [c[0]!, c[1]!] as const);
  if (g.type === "Polygon") return (g.coordinates[0] ?? []).map((c) => [c[0]!, c[1]!] as const);
  if (g.type === "Point") return [[g.coordinates[0]!, g.coordinates[1]!]];
  return [];
};

export class DeskDraw {
  private readonly draw: TerraDraw;
  private readonly ids = { ...ids };
  private loading = false;
  /** The line being traced and the vertices last told for it. */
  private tracing: { id: string; placed: LonLat[] } | null = null;

  constructor(
    map: MapLibreMap,
    private readonly events: DrawEvents,
  ) {
    const editable = { draggable: true, deletable: true, midpoints: true };
    this.draw = new TerraDraw({
      adapter: new TerraDrawMapLibreGLAdapter({ map }),
      idStrategy: {
        isValidId: (id) => typeof id === "string" && id.length > 0,
        getId: () => crypto.randomUUID(),
      },
      modes: [
        new TerraDrawRenderMode({ modeName: "static", styles: {} }),
        new TerraDrawLineStringMode({
          modeName: "trace",
          styles: { lineStringColor: INK, lineStringWidth: 3, closingPointColor: INK },
        }),
        new TerraDrawPolygonMode({
          modeName: "outline",
          styles: { fillColor: "#ffffff", fillOpacity: 0.05, outlineColor: INK, outlineWidth: 2 },
        }),
        new TerraDrawPointMode({ modeName: "outlet", styles: { pointColor: INK, pointWidth: 7 } }),
        new TerraDrawLineStringMode({
          modeName: "measure",
          styles: { lineStringColor: MAP_COLOURS.measure as `#${string}`, lineStringWidth: 2 },
        }),
        new TerraDrawSelectMode({
          modeName: "edit",
          flags: {
            trace: { feature: { coordinates: editable } },
            outline: { feature: { coordinates: editable } },
            outlet: { feature: { draggable: true } },
          },
        }),
      ],
    });
    this.draw.start();
    this.draw.on("change", (changed, type) => this.changed(changed as string[], type));
    this.draw.on("finish", (id) => this.finished(String(id)));
  }

  private kindOf(id: string): Kind | undefined {
    return (Object.keys(this.ids) as Kind[]).find((k) => this.ids[k] === id);
  }

  private changed(changed: string[], type: string) {
    if (this.loading) return;
    for (const id of changed) {
      if (type === "delete") {
        if (this.tracing?.id === id) {
          this.tracing = null;
          this.events.onTraceCancel();
        }
        continue;
      }
      const f = this.draw.getSnapshotFeature(id);
      const mode = f?.properties.mode;
      const kind = this.kindOf(id);
      // A path with fewer than two points left (its feature deleted) is not a path to save.
      if (kind === "path") {
        const coords = coordsOf(f);
        if (coords.length >= 2) this.events.onPath(coords, true);
      } else if (mode === "trace" && this.draw.getMode() === "trace") {
        // The trace's closing point is a feature of the same mode: only the line is the path.
        if (f?.geometry.type === "LineString") this.traced(id, f);
      } else if (mode === "measure") this.events.onMeasure(coordsOf(f));
    }
  }

  /** Tells the vertices clicked so far, once per click: moving the pointer changes nothing. */
  private traced(id: string, f: GeoJSONStoreFeatures) {
    const drawing = f.properties.currentlyDrawing === true;
    const placed = placedVertices(coordsOf(f), drawing);
    if (this.tracing?.id === id && sameVertices(this.tracing.placed, placed)) return;
    this.tracing = { id, placed };
    if (placed.length >= 2) this.events.onPath(placed, false);
  }

  private finished(id: string) {
    if (this.loading) return;
    if (this.tracing?.id === id) this.tracing = null;
    const f = this.draw.getSnapshotFeature(id);
    const mode = f?.properties.mode;
    const replace = (kind: Kind) => {
      const old = this.ids[kind];
      if (old && old !== id && this.draw.hasFeature(old)) this.draw.removeFeatures([old]);
      this.ids[kind] = id;
    };
    if (mode === "trace" && this.kindOf(id) !== "path") {
      replace("path");
      this.events.onPath(coordsOf(f), true);
    } else if (mode === "outline" && this.kindOf(id) !== "area") {
      replace("area");
      this.events.onArea(coordsOf(f));
    } else if (mode === "outlet" && this.kindOf(id) !== "outlet") {
      replace("outlet");
      const [point] = coordsOf(f);
      if (point) this.events.onOutlet(point);
    } else if (mode === "measure") {
      replace("measure");
      this.events.onMeasure(coordsOf(f));
    } else if (this.kindOf(id) === "area") {
      this.events.onArea(coordsOf(f));
    } else if (this.kindOf(id) === "outlet") {
      const [point] = coordsOf(f);
      if (point) this.events.onOutlet(point);
    }
  }

  setTool(tool: DrawTool) {
    this.draw.setMode(tool === "pan" ? "static" : tool);
  }

  /** Puts the server's geometry on the map without counting it as an edit. */
  load(kind: "path" | "area" | "outlet", coords: readonly LonLat[] | null) {
    this.loading = true;
    try {
      const old = this.ids[kind];
      if (old && this.draw.hasFeature(old)) this.draw.removeFeatures([old]);
      this.ids[kind] = "";
      if (!coords || coords.length === 0) return;
      const id = crypto.randomUUID();
      const c = coords.map(([x, y]) => [x, y]);
      const geometry =
        kind === "path"
          ? { type: "LineString" as const, coordinates: c }
          : kind === "area"
            ? { type: "Polygon" as const, coordinates: [c] }
            : { type: "Point" as const, coordinates: c[0]! };
      const mode = kind === "path" ? "trace" : kind === "area" ? "outline" : "outlet";
      const [result] = this.draw.addFeatures([
        { id, type: "Feature", geometry, properties: { mode } },
      ]);
      if (result?.valid) this.ids[kind] = id;
    } finally {
      this.loading = false;
    }
  }

  /** Selects the path so its vertices can be dragged (right-click a vertex to delete it). */
  editPath() {
    this.draw.setMode("edit");
    if (this.ids.path && this.draw.hasFeature(this.ids.path))
      this.draw.selectFeature(this.ids.path);
  }

  destroy() {
    this.draw.stop();
  }
}
