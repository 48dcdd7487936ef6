import {
  CartesianGrid,
  ComposedChart,
  Legend,
  Line,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { type Series } from "./curves";

const fmt = (v: number) => (v >= 100 ? v.toFixed(0) : v >= 10 ? v.toFixed(1) : v.toFixed(2));

/**
 * Intensity against duration on log–log axes: the table's points as dots and the Sherman curve
 * of each return period as a line. A summary for screen readers sits beside it (the figure).
 */
export function IdfChart({ series, intensityUnit }: { series: Series[]; intensityUnit: string }) {
  const all = series.flatMap((s) => [...s.points, ...s.curve]).filter((p) => p.i > 0);
  if (all.length === 0) return null;
  const tMin = Math.min(...all.map((p) => p.t));
  const tMax = Math.max(...all.map((p) => p.t));
  const iMin = Math.min(...all.map((p) => p.i));
  const iMax = Math.max(...all.map((p) => p.i));
  return (
    <figure aria-labelledby="idf-chart-caption" className="space-y-2">
      <div className="h-80 w-full" data-testid="idf-chart">
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart margin={{ top: 8, right: 16, bottom: 24, left: 8 }}>
            <CartesianGrid stroke="#e8eef0" />
            <XAxis
              type="number"
              dataKey="t"
              scale="log"
              domain={[tMin, tMax]}
              allowDataOverflow
              tickFormatter={fmt}
              label={{ value: "Duration (min)", position: "insideBottom", offset: -12 }}
            />
            <YAxis
              type="number"
              dataKey="i"
              scale="log"
              domain={[iMin * 0.9, iMax * 1.1]}
              allowDataOverflow
              tickFormatter={fmt}
              label={{ value: `Intensity (${intensityUnit})`, angle: -90, position: "insideLeft" }}
            />
            <Tooltip
              formatter={(value) => (typeof value === "number" ? fmt(value) : String(value))}
              labelFormatter={(t) => (typeof t === "number" ? `${fmt(t)} min` : String(t))}
            />
            <Legend verticalAlign="top" height={28} />
            {series.map((s) =>
              s.curve.length > 0 ? (
                <Line
                  key={`c${s.returnPeriodYears}`}
                  data={s.curve}
                  dataKey="i"
                  name={`${s.returnPeriodYears}-year ${s.points.length > 0 ? "fit" : "formula"}`}
                  stroke={s.colour}
                  strokeWidth={2}
                  dot={false}
                  isAnimationActive={false}
                />
              ) : null,
            )}
            {series.map((s) =>
              s.points.length > 0 ? (
                <Scatter
                  key={`p${s.returnPeriodYears}`}
                  data={s.points}
                  dataKey="i"
                  name={`${s.returnPeriodYears}-year table`}
                  fill={s.colour}
                  isAnimationActive={false}
                />
              ) : null,
            )}
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <figcaption id="idf-chart-caption" className="text-xs text-ink-500">
        Intensity against duration, both on logarithmic scales.{" "}
        {series.some((s) => s.points.length > 0)
          ? "Dots are the table's values; lines are the fitted Sherman curves i = a/(t + b)^c."
          : "Lines are the Sherman formulas i = a/(t + b)^c as entered."}
      </figcaption>
    </figure>
  );
}
