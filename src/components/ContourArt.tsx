/**
 * A drawn hillside: contour rings around a summit and a flow path from the divide down to a
 * design point, with station ticks. Generated from a fixed formula so it never changes.
 */
const CX = 210;
const CY = 170;

function ring(level: number): string {
  const points: string[] = [];
  const base = 34 + level * 27;
  for (let k = 0; k <= 72; k++) {
    const t = (k / 72) * Math.PI * 2;
    const r =
      base *
      (1 + 0.09 * Math.sin(3 * t + level * 0.55) + 0.05 * Math.cos(5 * t - level * 0.8)) *
      (1 + level * 0.012);
    const x = CX + r * Math.cos(t) * 1.25;
    const y = CY + r * Math.sin(t) * 0.92 + level * 6;
    points.push(`${x.toFixed(1)},${y.toFixed(1)}`);
  }
  return `M${points.join("L")}Z`;
}

const RINGS = Array.from({ length: 9 }, (_, level) => ring(level));
const FLOW_PATH = "M224 160 C236 196 214 226 246 258 S300 302 292 338 S318 392 352 420";
const STATIONS: ReadonlyArray<readonly [number, number]> = [
  [231, 205],
  [252, 262],
  [293, 322],
  [318, 385],
];

export function ContourArt({ className = "" }: { className?: string }) {
  return (
    <svg viewBox="0 0 480 480" className={className} aria-hidden="true" focusable="false">
      <g fill="none" stroke="#77ccc8" strokeWidth="1.1">
        {RINGS.map((d, i) => (
          <path key={d} d={d} strokeOpacity={0.16 + (i % 4 === 0 ? 0.22 : 0.08)} />
        ))}
      </g>
      <path d={FLOW_PATH} fill="none" stroke="#43b0ad" strokeWidth="3" strokeLinecap="round" />
      {STATIONS.map(([x, y]) => (
        <circle
          key={`${x}-${y}`}
          cx={x}
          cy={y}
          r="3.6"
          fill="#18252e"
          stroke="#ade3df"
          strokeWidth="1.6"
        />
      ))}
      <circle cx="352" cy="420" r="13" fill="none" stroke="#f2a12b" strokeOpacity=".45" />
      <circle cx="352" cy="420" r="6" fill="#f2a12b" />
      <circle cx="224" cy="160" r="4" fill="#ade3df" />
    </svg>
  );
}
