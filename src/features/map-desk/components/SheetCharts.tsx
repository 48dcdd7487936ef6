import {
  Bar,
  BarChart,
  CartesianGrid,
  Cell,
  Line,
  LineChart,
  ReferenceLine,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import type { RegimeSegment } from "../../../../shared/geo";
import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";
import { REGIME_COLOURS } from "../map/palette";
import { RainfallChart } from "./RainfallChart";

const WIDTH = 520;

/** Elevation against station, the line coloured by each segment's regime, breaks marked. */
function ProfileChart({ sheet }: { sheet: TravelTimeSheet }) {
  const len = sheet.unitLabels.length ?? "";
  const points = sheet.profile.filter((p) => p.elevation !== null);
  const regimeAt = (station: number) =>
    sheet.segments.find((s) => station >= s.stationFrom && station <= s.stationTo)?.regime ??
    "shallow";
  // One series per regime, each null outside its stretches, so the line changes colour.
  const data = points.map((p) => {
    const r = regimeAt(p.station);
    return {
      station: p.station,
      sheet: r === "sheet" ? p.elevation : null,
      shallow: r === "shallow" ? p.elevation : null,
      channel: r === "channel" ? p.elevation : null,
    };
  });
  // Join the series at the regime changes.
  for (let i = 1; i < data.length; i += 1) {
    const prev = regimeAt(points[i - 1]!.station);
    const cur = regimeAt(points[i]!.station);
    if (prev !== cur) data[i - 1]![cur] = points[i - 1]!.elevation;
  }
  const breaks = [sheet.breaks.sheetEnd, sheet.breaks.channelStart].filter(
    (b): b is number => b !== null,
  );
  return (
    <figure aria-label="Longitudinal profile">
      <figcaption className="text-xs font-semibold text-ink-700">
        Profile along the flow path
      </figcaption>
      <LineChart
        width={WIDTH}
        height={200}
        data={data}
        margin={{ top: 8, right: 12, bottom: 16, left: 4 }}
      >
        <CartesianGrid stroke="#e8eef0" />
        <XAxis
          dataKey="station"
          type="number"
          domain={[0, "dataMax"]}
          tickFormatter={(v: number) => v.toFixed(0)}
          label={{ value: `Station (${len})`, position: "insideBottom", offset: -8, fontSize: 11 }}
          fontSize={11}
        />
        <YAxis
          domain={["auto", "auto"]}
          fontSize={11}
          width={52}
          label={{ value: `Elevation (${len})`, angle: -90, position: "insideLeft", fontSize: 11 }}
        />
        <Tooltip
          formatter={(v) => (typeof v === "number" ? v.toFixed(2) : String(v))}
          labelFormatter={(v) => `Station ${Number(v).toFixed(1)} ${len}`}
        />
        {(["sheet", "shallow", "channel"] as const).map((r) => (
          <Line
            key={r}
            dataKey={r}
            stroke={REGIME_COLOURS[r]}
            strokeWidth={2.5}
            dot={false}
            connectNulls={false}
            isAnimationActive={false}
            name={r}
          />
        ))}
        {breaks.map((b) => (
          <ReferenceLine key={b} x={b} stroke="#3a4b54" strokeDasharray="4 3" />
        ))}
      </LineChart>
    </figure>
  );
}

/** Tc by method as bars, the governing one drawn in the action colour. */
function MethodBars({ sheet }: { sheet: TravelTimeSheet }) {
  const data = sheet.methods
    .filter((m) => m.totalMin !== null)
    .map((m) => ({ id: m.id, label: m.label, tc: m.totalMin }));
  return (
    <figure aria-label="Tc by method">
      <figcaption className="text-xs font-semibold text-ink-700">
        Tc by method (min); the governing one is dark
      </figcaption>
      <BarChart
        width={WIDTH}
        height={40 + 26 * data.length}
        data={data}
        layout="vertical"
        margin={{ top: 4, right: 16, bottom: 4, left: 4 }}
      >
        <CartesianGrid stroke="#e8eef0" horizontal={false} />
        <XAxis type="number" fontSize={11} />
        <YAxis type="category" dataKey="label" width={150} fontSize={11} />
        <Tooltip formatter={(v) => (typeof v === "number" ? `${v.toFixed(2)} min` : String(v))} />
        <Bar dataKey="tc" isAnimationActive={false}>
          {data.map((d) => (
            <Cell key={d.id} fill={d.id === sheet.governing?.method ? "#155f61" : "#ade3df"} />
          ))}
        </Bar>
      </BarChart>
    </figure>
  );
}

export function SheetCharts({
  sheet,
  live,
}: {
  sheet: TravelTimeSheet;
  live: readonly RegimeSegment[] | null;
}) {
  return (
    <div className="mt-3 space-y-3" aria-busy={live !== null}>
      <ProfileChart sheet={sheet} />
      <MethodBars sheet={sheet} />
      <RainfallChart sheet={sheet} />
    </div>
  );
}
