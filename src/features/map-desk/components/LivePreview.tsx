import type { RegimeSegment } from "../../../../shared/geo";
import { ftFromM, type UnitSystem } from "../../../../shared/hydrology/units";
import type { SurfaceClass } from "../../../lib/surface-classes";

interface Props {
  segments: readonly RegimeSegment[];
  /** A path is being traced: the segments are of the vertices clicked so far. */
  tracing: boolean;
  units: UnitSystem;
  classes: readonly SurfaceClass[] | undefined;
  hovered: number | null;
  onHover: (index: number | null) => void;
}

/** The split the browser just made: stations, lengths and classes before the server's slopes. */
export function LivePreview({ segments, tracing, units, classes, hovered, onHover }: Props) {
  const len = (m: number) => (units === "us" ? ftFromM(m) : m).toFixed(2);
  const name = (id: string | null) =>
    id === null ? "unmapped" : (classes?.find((c) => c.id === id)?.name ?? "class not in catalog");
  return (
    <table className="w-full text-xs" aria-label="Segments being drawn" data-preview>
      <caption className="bg-caution-50 px-1.5 py-1 text-left text-caution-900">
        {tracing
          ? "Preview of the vertices placed so far: not saved, not computed yet."
          : "Preview split in this browser: slopes and times follow from the server."}
      </caption>
      <thead className="bg-ink-50 text-left text-ink-700">
        <tr>
          <th scope="col" className="px-1.5 py-1">
            Segment
          </th>
          <th scope="col" className="px-1.5 py-1 text-right">
            Station from ({units === "us" ? "ft" : "m"})
          </th>
          <th scope="col" className="px-1.5 py-1 text-right">
            Station to
          </th>
          <th scope="col" className="px-1.5 py-1 text-right">
            Length
          </th>
          <th scope="col" className="px-1.5 py-1">
            Flow regime
          </th>
          <th scope="col" className="px-1.5 py-1">
            Surface class
          </th>
          <th scope="col" className="px-1.5 py-1">
            Soil group
          </th>
        </tr>
      </thead>
      <tbody>
        {segments.map((s, i) => (
          <tr
            key={`${i}-${s.stationFromM}`}
            data-live-segment={i}
            onMouseEnter={() => onHover(i)}
            onMouseLeave={() => onHover(null)}
            className={hovered === i ? "bg-caution-100" : "odd:bg-white even:bg-ink-50/50"}
          >
            <td className="px-1.5 py-1">{i + 1}</td>
            <td className="px-1.5 py-1 text-right font-mono">{len(s.stationFromM)}</td>
            <td className="px-1.5 py-1 text-right font-mono">{len(s.stationToM)}</td>
            <td className="px-1.5 py-1 text-right font-mono">{len(s.lengthM)}</td>
            <td className="px-1.5 py-1">{s.regime}</td>
            <td className="px-1.5 py-1">{name(s.surfaceClassId)}</td>
            <td className="px-1.5 py-1">{s.hsg ?? "—"}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
