import { type RainfallTable } from "../../../../shared/schemas/rainfall";
import { unitLabels } from "../../../lib/project-outlet";
import { IdfChart } from "./IdfChart";
import { seriesOf, type Series } from "./curves";

const num = (v: number | undefined) =>
  v === undefined ? "—" : Number(v.toPrecision(4)).toLocaleString();

function ValuesTable({ table }: { table: RainfallTable }) {
  const idf = table.idf;
  if (idf.kind !== "table") return null;
  const rows = idf.intensity ?? idf.depth ?? [];
  const u = unitLabels(table.units);
  const what = idf.depth ? `Depth (${u.depth})` : `Intensity (${u.intensity})`;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-right text-sm tabular-nums">
        <caption className="pb-2 text-left text-sm font-medium text-ink-800">
          {what} by duration and return period
        </caption>
        <thead className="border-b border-ink-200 text-xs text-ink-500">
          <tr>
            <th scope="col" className="py-1.5 pr-4 text-left font-semibold">
              Duration (min)
            </th>
            {idf.returnPeriodsYears.map((y) => (
              <th key={y} scope="col" className="py-1.5 pl-4 font-semibold">
                {y}-year
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-ink-100">
          {idf.durationsMin.map((d, r) => (
            <tr key={d}>
              <th scope="row" className="py-1 pr-4 text-left font-medium text-ink-800">
                {num(d)}
              </th>
              {idf.returnPeriodsYears.map((y, c) => (
                <td key={y} className="py-1 pl-4 text-ink-800">
                  {num(rows[r]?.[c])}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function FitTable({ series, table }: { series: Series[]; table: RainfallTable }) {
  const isTable = table.idf.kind === "table";
  return (
    <table className="w-full text-right text-sm tabular-nums">
      <caption className="pb-2 text-left text-sm font-medium text-ink-800">
        {isTable ? "Fitted Sherman curves, i = a/(t + b)^c" : "Sherman formulas, i = a/(t + b)^c"}
      </caption>
      <thead className="border-b border-ink-200 text-xs text-ink-500">
        <tr>
          <th scope="col" className="py-1.5 pr-4 text-left font-semibold">
            Return period
          </th>
          <th scope="col" className="py-1.5 pl-4 font-semibold">
            a
          </th>
          <th scope="col" className="py-1.5 pl-4 font-semibold">
            b (min)
          </th>
          <th scope="col" className="py-1.5 pl-4 font-semibold">
            c
          </th>
          {isTable && (
            <>
              <th scope="col" className="py-1.5 pl-4 font-semibold">
                R²
              </th>
              <th scope="col" className="py-1.5 pl-4 font-semibold">
                Largest error
              </th>
            </>
          )}
        </tr>
      </thead>
      <tbody className="divide-y divide-ink-100">
        {series.map((s) => {
          const fit = table.fit?.find((f) => f.returnPeriodYears === s.returnPeriodYears);
          return (
            <tr key={s.returnPeriodYears}>
              <th scope="row" className="py-1 pr-4 text-left font-medium text-ink-800">
                <span
                  aria-hidden="true"
                  className="mr-2 inline-block size-2.5 rounded-full align-middle"
                  style={{ backgroundColor: s.colour }}
                />
                {s.returnPeriodYears}-year
              </th>
              <td className="py-1 pl-4">{num(s.coefficients?.a)}</td>
              <td className="py-1 pl-4">{num(s.coefficients?.b)}</td>
              <td className="py-1 pl-4">{num(s.coefficients?.c)}</td>
              {isTable && (
                <>
                  <td className="py-1 pl-4">{fit ? fit.rSquared.toFixed(4) : "—"}</td>
                  <td className="py-1 pl-4">
                    {fit ? `${(fit.maxRelativeError * 100).toFixed(1)} %` : "no fit"}
                  </td>
                </>
              )}
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

/** One rainfall table: its values, its curves on log–log axes, and the quality of each fit. */
export function RainfallTableView({ table }: { table: RainfallTable }) {
  const series = seriesOf(table);
  const u = unitLabels(table.units);
  return (
    <div className="space-y-6">
      <dl className="grid grid-cols-[10rem_1fr] gap-x-4 gap-y-2 text-sm">
        <dt className="text-ink-500">Source</dt>
        <dd className="text-ink-900">{table.sourceNote || "—"}</dd>
        <dt className="text-ink-500">2-year 24-hour depth</dt>
        <dd className="text-ink-900">
          {table.p2_24h === null
            ? "not given (TR-55 sheet flow needs it)"
            : `${table.p2_24h} ${u.depth}`}
        </dd>
        {table.originalFilename && (
          <>
            <dt className="text-ink-500">File</dt>
            <dd className="text-ink-900">{table.originalFilename}</dd>
          </>
        )}
      </dl>
      <IdfChart series={series} intensityUnit={u.intensity} />
      {table.idf.kind === "table" && table.fit === null && (
        <p className="text-sm text-caution-800">
          No Sherman curve could be fitted to this table (a fit needs at least 3 durations); the
          table is still used as given, interpolating between its values.
        </p>
      )}
      <FitTable series={series} table={table} />
      <ValuesTable table={table} />
    </div>
  );
}
