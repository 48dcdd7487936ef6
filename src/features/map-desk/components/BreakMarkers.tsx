import * as maplibregl from "maplibre-gl";
import { useEffect, useRef } from "react";
import { pointAtStation, type LonLat, type PathLengths } from "../../../../shared/geo";
import { nearestStationM } from "../lib/path-geometry";
import { REGIME_COLOURS } from "../map/palette";

export type BreakKind = "sheetEnd" | "channelStart";

const LABELS: Record<BreakKind, string> = {
  sheetEnd: "End of sheet flow",
  channelStart: "Start of channel flow",
};

interface Props {
  map: maplibregl.Map | null;
  path: readonly LonLat[];
  lengths: PathLengths | null;
  breaksM: { sheetEndM: number | null; channelStartM: number | null };
  editable: boolean;
  onDrag: (kind: BreakKind, stationM: number) => void;
  onDrop: (kind: BreakKind, stationM: number) => void;
}

/** Regime breaks as markers on the path; editors drag them and they snap to the path. */
export function BreakMarkers({ map, path, lengths, breaksM, editable, onDrag, onDrop }: Props) {
  const handlers = useRef({ onDrag, onDrop });
  useEffect(() => {
    handlers.current = { onDrag, onDrop };
  });
  const stations: Record<BreakKind, number | null> = {
    sheetEnd: breaksM.sheetEndM,
    channelStart: breaksM.channelStartM,
  };
  const key = `${stations.sheetEnd}|${stations.channelStart}`;

  useEffect(() => {
    if (!map || !lengths || path.length < 2) return;
    const markers: maplibregl.Marker[] = [];
    for (const kind of Object.keys(LABELS) as BreakKind[]) {
      const at = stations[kind];
      if (at === null) continue;
      const el = document.createElement("div");
      el.className = "desk-break";
      el.setAttribute("role", "img");
      el.setAttribute("aria-label", LABELS[kind]);
      el.title = `${LABELS[kind]}${editable ? " — drag along the path" : ""}`;
      el.dataset.break = kind;
      // maplibre positions the marker with the element's transform: the diamond is a child.
      const diamond = document.createElement("div");
      Object.assign(diamond.style, {
        width: "16px",
        height: "16px",
        borderRadius: "3px",
        transform: "rotate(45deg)",
        background: kind === "sheetEnd" ? REGIME_COLOURS.sheet : REGIME_COLOURS.channel,
        border: "2px solid white",
        boxShadow: "0 0 0 1px #18252e",
        cursor: editable ? "grab" : "default",
      });
      el.appendChild(diamond);
      const marker = new maplibregl.Marker({ element: el, draggable: editable })
        .setLngLat(pointAtStation(path, lengths, at) as [number, number])
        .addTo(map);
      let station = at;
      marker.on("drag", () => {
        const { lng, lat } = marker.getLngLat();
        const snap = nearestStationM(path, lengths, [lng, lat]);
        station = snap.stationM;
        marker.setLngLat(snap.point as [number, number]);
        handlers.current.onDrag(kind, station);
      });
      marker.on("dragend", () => handlers.current.onDrop(kind, station));
      markers.push(marker);
    }
    return () => markers.forEach((m) => m.remove());
    // Markers are rebuilt when the path or the stored breaks change, not on every drag move.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [map, path, lengths, key, editable]);

  return null;
}
