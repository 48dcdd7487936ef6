import type { SheetUncertainty, TravelTimeSheet } from "../../../../shared/schemas/sheet";

type Bar = SheetUncertainty["sensitivity"]["bars"][number];
type Measure = "tcMin" | "peak";

const fixed = (v: number | null | undefined, digits: number) =>
  v === null || v === undefined ? "—" : v.toFixed(digits);

/**
 * One tornado: a bar per input from its low end to its high end of the band, around the value
 * as entered; the inputs that move the figure most at the top. Plain SVG, no chart package.
 */
function Tornado(props: {
  title: string;
  unit: string;
  digits: number;
  entered: number | null;
  bars: readonly Bar[];
  measure: Measure;
}) {
  const { entered, measure } = props;
  if (entered === null) return null;
  const ends = (b: Bar) => [b.low[measure], b.high[measure]] as const;
  const bars = [...props.bars].sort((a, b) => {
    const span = (x: Bar) => {
      const [lo, hi] = ends(x);
      return Math.abs((hi ?? entered) - (lo ?? entered));
    };
    return span(b) - span(a);
  });
  const values = bars.flatMap((b) => ends(b).filter((v): v is number => v !== null));
  const min = Math.min(entered, ...values);
  const max = Math.max(entered, ...values);
  const spread = max - min || 1;
  const width = 240;
  const rowH = 18;
  const x = (v: number) => ((v - min) / spread) * width;
  return (
    <figure className="min-w-0 flex-1">
      <figcaption className="mb-1 text-xs font-semibold text-ink-800">
        {props.title} ({props.unit}), as entered {entered.toFixed(props.digits)}
      </figcaption>
      <table className="w-full text-xs" aria-label={`${props.title}: sensitivity`}>
        <thead className="sr-only">
          <tr>
            <th scope="col">Input</th>
            <th scope="col">Input lowered</th>
            <th scope="col">Bar</th>
            <th scope="col">Input raised</th>
          </tr>
        </thead>
        <tbody>
          {bars.map((b) => {
            const [lo, hi] = ends(b);
            const a = x(Math.min(lo ?? entered, hi ?? entered));
            const z = x(Math.max(lo ?? entered, hi ?? entered));
            return (
              <tr key={b.input} data-tornado={`${measure}:${b.input}`}>
                <th
                  scope="row"
                  className="pr-2 text-left font-normal whitespace-nowrap text-ink-700"
                >
                  {b.label}
                </th>
                <td className="pr-1 text-right font-mono text-ink-600">
                  {fixed(lo, props.digits)}
                </td>
                <td className="w-[240px]">
                  <svg width={width} height={rowH} role="presentation" className="block">
                    <rect
                      x={a}
                      y={4}
                      width={Math.max(z - a, 1)}
                      height={rowH - 8}
                      className="fill-rill-500"
                    />
                    <line
                      x1={x(entered)}
                      x2={x(entered)}
                      y1={0}
                      y2={rowH}
                      className="stroke-ink-800"
                    />
                  </svg>
                </td>
                <td className="pl-1 font-mono text-ink-600">{fixed(hi, props.digits)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </figure>
  );
}

/**
 * How sure the governing Tc and the peak flow are: the Monte Carlo band (P10 / P50 / P90, seeded
 * and reproducible) and the sensitivity view as two tornado charts, with each band's basis.
 */
export function HowSure({ sheet }: { sheet: TravelTimeSheet }) {
  const u = sheet.uncertainty;
  if (!u) return null;
  const mc = u.monteCarlo;
  const flow = sheet.unitLabels.flow ?? "";
  const band = (
    p: { p10: number; p50: number; p90: number } | null,
    digits: number,
    unit: string,
  ) =>
    p === null
      ? "not available"
      : `P10 ${p.p10.toFixed(digits)} · P50 ${p.p50.toFixed(digits)} · P90 ${p.p90.toFixed(digits)} ${unit}`;
  return (
    <section aria-label="How sure" className="mt-3 rounded border border-ink-200 p-2">
      <h3 className="text-sm font-semibold text-ink-800">How sure</h3>
      <dl className="my-1 grid grid-cols-[auto_1fr] gap-x-3 text-xs" data-testid="tc-band">
        <dt className="text-ink-600">Governing Tc</dt>
        <dd className="font-mono" data-band="governing">
          {band(mc.governingTcMin, 2, "min")}
        </dd>
        <dt className="text-ink-600">Peak flow</dt>
        <dd className="font-mono" data-band="peak">
          {band(mc.peak, 3, flow)}
        </dd>
      </dl>
      <p className="mb-2 text-xs text-ink-500">
        Monte Carlo of {mc.draws.toLocaleString("en-US")} draws, seed {mc.seed}: {mc.distribution}.
        The bands are design rules.
      </p>
      <div className="flex flex-wrap gap-4">
        <Tornado
          title="Governing Tc"
          unit="min"
          digits={2}
          entered={u.sensitivity.entered.tcMin}
          bars={u.sensitivity.bars}
          measure="tcMin"
        />
        <Tornado
          title="Peak flow"
          unit={flow}
          digits={3}
          entered={u.sensitivity.entered.peak}
          bars={u.sensitivity.bars}
          measure="peak"
        />
      </div>
      <details className="mt-1 text-xs text-ink-600">
        <summary className="cursor-pointer">Bands and their basis</summary>
        <ul className="mt-1 list-disc pl-5">
          {u.sensitivity.bars.map((b) => (
            <li key={b.input}>
              {b.label}: {b.band}
            </li>
          ))}
        </ul>
      </details>
    </section>
  );
}
