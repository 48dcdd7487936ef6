/**
 * The terra-draw controller's life on the map (editors only): made when the map is ready, fed
 * the server's path, boundary and outlet whenever they change and no local draft is pending.
 */
import type { Map as MapLibreMap } from "maplibre-gl";
import { useEffect, useRef, useState } from "react";
import type { LonLat } from "../../../../shared/geo";
import type { Subcatchment } from "../../../../shared/schemas/subcatchments";
import { DeskDraw, type DrawEvents } from "../map/draw";

export function useDeskDraw(
  map: MapLibreMap | null,
  enabled: boolean,
  subcatchment: Subcatchment,
  hasDraft: boolean,
  events: DrawEvents,
) {
  const [draw, setDraw] = useState<DeskDraw | null>(null);
  const eventsRef = useRef(events);
  useEffect(() => {
    eventsRef.current = events;
  });

  useEffect(() => {
    if (!map || !enabled) return;
    const made = new DeskDraw(map, {
      onPath: (c, s) => eventsRef.current.onPath(c, s),
      onArea: (r) => eventsRef.current.onArea(r),
      onOutlet: (p) => eventsRef.current.onOutlet(p),
      onMeasure: (c) => eventsRef.current.onMeasure(c),
      onTraceCancel: () => eventsRef.current.onTraceCancel(),
    });
    setDraw(made);
    return () => {
      setDraw(null);
      made.destroy();
    };
  }, [map, enabled]);

  const path = subcatchment.flowPath;
  useEffect(() => {
    if (!draw || hasDraft) return;
    draw.load("path", (path?.geometry.coordinates ?? null) as LonLat[] | null);
  }, [draw, path, hasDraft]);

  const { boundary, outlet } = subcatchment;
  useEffect(() => {
    if (!draw) return;
    const ring =
      boundary?.type === "Polygon" ? boundary.coordinates[0] : boundary?.coordinates[0]?.[0];
    draw.load("area", (ring ?? null) as LonLat[] | null);
    draw.load("outlet", outlet ? [outlet.coordinates as unknown as LonLat] : null);
  }, [draw, boundary, outlet]);

  return { draw };
}
