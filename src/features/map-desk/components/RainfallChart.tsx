import {
  CartesianGrid,
  ComposedChart,
  Legend,
  Line,
  ReferenceDot,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import type { TravelTimeSheet } from "../../../../shared/schemas/sheet";
import { useRainfallTable } from "../api/get-rainfall-table";
import { idfPoints, kinematicRelation } from "../lib/idf-points";

/**
 * The kinematic-wave solve: the design IDF curve, the kinematic-wave relation tc(i), the
 * iterates on the curve and the solution where the two meet.
 */
export function RainfallChart({ sheet }: { sheet: TravelTimeSheet }) {
  const table = useRainfallTable(sheet.rainfall?.tableId);
  const kw = sheet.kinematic;
  const unit = sheet.unitLabels.intensity ?? (sheet.units === "si" ? "mm/h" : "in/h");
  if (!kw) {
    return (
      <p className="text-xs text-ink-600">
        The kinematic-wave method did not run for this path, so there is no rainfall solve to plot.
      </p>
    );
  }
  const idf = table.data
    ? idfPoints(table.data, sheet.returnPeriodYears, sheet.units, kw.tcMin * 3)
    : [];
  // The relation over the intensities the curve spans, and well either side of the solution.
  const spread = Array.from({ length: 25 }, (_, k) => kw.intensity * Math.pow(6, k / 24 - 0.5));
  const relation = kinematicRelation({ tcMin: kw.tcMin, intensity: kw.intensity }, [
    ...spread,
    ...idf.map((p) => p.intensity),
  ]).sort((a, b) => a.tcMin - b.tcMin);
  const minTc = typeof sheet.rules?.minTcMin === "number" ? sheet.rules.minTcMin : null;
  return (
    <figure aria-label="Kinematic-wave rainfall solve">
      <figcaption className="text-xs font-semibold text-ink-700">
        Kinematic-wave solve: {sheet.returnPeriodYears}-year IDF curve and tc(i),{" "}
        {kw.iterations.length} iterates ({kw.solver})
      </figcaption>
      <ComposedChart width={520} height={230} margin={{ top: 8, right: 12, bottom: 16, left: 4 }}>
        <CartesianGrid stroke="#e8eef0" />
        <XAxis
          dataKey="tcMin"
          type="number"
          domain={[0, "auto"]}
          fontSize={11}
          allowDuplicatedCategory={false}
          label={{
            value: "Duration, tc (min)",
            position: "insideBottom",
            offset: -8,
            fontSize: 11,
          }}
        />
        <YAxis
          dataKey="intensity"
          type="number"
          domain={[0, "auto"]}
          fontSize={11}
          width={52}
          label={{ value: `i (${unit})`, angle: -90, position: "insideLeft", fontSize: 11 }}
        />
        <Tooltip formatter={(v) => (typeof v === "number" ? v.toFixed(2) : String(v))} />
        <Legend verticalAlign="top" wrapperStyle={{ fontSize: 11 }} />
        <Line
          data={idf}
          dataKey="intensity"
          name="IDF curve"
          stroke="#1f5f9e"
          dot={false}
          strokeWidth={2}
          isAnimationActive={false}
        />
        <Line
          data={relation}
          dataKey="intensity"
          name="Kinematic wave tc(i)"
          stroke="#d98013"
          dot={false}
          strokeWidth={2}
          strokeDasharray="5 3"
          isAnimationActive={false}
        />
        <Scatter
          data={kw.iterations}
          dataKey="intensity"
          name="Iterates"
          fill="#667a84"
          isAnimationActive={false}
        />
        <ReferenceDot x={kw.tcMin} y={kw.intensity} r={6} fill="#155f61" stroke="#ffffff" />
      </ComposedChart>
      <p className="text-xs text-ink-600">
        Solution: tc = {kw.tcMin.toFixed(2)} min at i = {kw.intensity.toFixed(2)} {unit}.
        {minTc !== null && kw.tcMin < minTc
          ? ` Below the minimum Tc of ${minTc} min the IDF is read at ${minTc} min (design rule).`
          : ""}
      </p>
    </figure>
  );
}
