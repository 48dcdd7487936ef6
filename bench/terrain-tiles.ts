/**
 * Where a terrain tile's time goes, without HTTP or the database (in the "map tiles" suite of
 * `npm run bench`, or alone with `npx tsx bench/terrain-tiles.ts`): the demo terrain's tiles at
 * zooms 14–17, three rounds, sampled per point (proj4 at each of the 65,536 pixel centres) and on
 * the grid (the projected lattice the route uses), the largest difference between the two, the
 * terrarium PNG, and the PNG's zlib settings compared on a full tile (time and size).
 */
import { pathToFileURL } from "node:url";
import { PNG } from "pngjs";
import { inspectTerrain, openTerrain } from "../server/geodata/terrain";
import { tileGrid } from "../server/tiles/terrain-tiles";
import { PNG_DEFLATE_LEVEL, terrariumPng } from "../server/tiles/terrarium";
import type { BenchRow } from "./table";

const ROUNDS = 3;
const TARGET_MS = 50;

const quantile = (values: number[], q: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? Number.NaN;
};
const p50p95 = (values: number[]) =>
  `${quantile(values, 0.5).toFixed(1)} / ${quantile(values, 0.95).toFixed(1)}`;

function tilesOver([w, s, e, n]: readonly number[], zooms: number[]) {
  const out: { z: number; x: number; y: number }[] = [];
  for (const z of zooms) {
    const count = 2 ** z;
    const tx = (lon: number) => Math.floor(((lon + 180) / 360) * count);
    const ty = (lat: number) => {
      const r = (lat * Math.PI) / 180;
      return Math.floor(((1 - Math.log(Math.tan(r) + 1 / Math.cos(r)) / Math.PI) / 2) * count);
    };
    for (let x = tx(w!); x <= tx(e!); x += 1)
      for (let y = ty(n!); y <= ty(s!); y += 1) {
        out.push({ z, x, y });
      }
  }
  return out;
}

interface ZlibOptions {
  deflateLevel: number;
  deflateStrategy: number;
}

/**
 * Median time and size of encoding the same RGBA image with each zlib setting, taking turns so a
 * busy machine slows them alike.
 */
function encodeEach(png: PNG, settings: readonly ZlibOptions[]) {
  const times = settings.map(() => [] as number[]);
  const sizes = settings.map(() => 0);
  for (let k = 0; k < 21; k += 1) {
    settings.forEach((options, i) => {
      const start = performance.now();
      sizes[i] = PNG.sync.write(png, { filterType: 1, ...options }).length;
      times[i]!.push(performance.now() - start);
    });
  }
  return settings.map((_, i) => ({ ms: quantile(times[i]!, 0.5), kb: sizes[i]! / 1024 }));
}

export async function run(): Promise<BenchRow[]> {
  const file = new URL("../demo-geo/out/terrain.tif", import.meta.url).pathname;
  const info = await inspectTerrain(file, "m");
  const sampler = await openTerrain(file, info);
  const tiles = tilesOver(info.bbox4326, [14, 15, 16, 17]);
  const perPoint: number[] = [];
  const onGrid: number[] = [];
  const pngs: number[] = [];
  let worst = 0;
  let full: Float64Array | null = null;
  try {
    for (let round = 0; round < ROUNDS; round += 1) {
      for (const t of tiles) {
        const grid = tileGrid(t);
        const points: [number, number][] = [];
        for (let j = 0; j < grid.height; j += 1) {
          for (let i = 0; i < grid.width; i += 1) {
            points.push(grid.lonLatAt(i + 0.5, j + 0.5) as [number, number]);
          }
        }
        let start = performance.now();
        const exact = await sampler.elevationsM(points);
        perPoint.push(performance.now() - start);
        start = performance.now();
        const fast = await sampler.elevationsOnGridM(grid);
        onGrid.push(performance.now() - start);
        exact.forEach((e, k) => {
          if (e !== null) worst = Math.max(worst, Math.abs(e - fast[k]!));
        });
        if (fast.every((z) => Number.isNaN(z))) continue;
        start = performance.now();
        terrariumPng(fast, grid.width);
        pngs.push(performance.now() - start);
        if (!full || (!fast.some(Number.isNaN) && t.z === 17)) full = fast;
      }
    }
  } finally {
    await sampler.close();
  }
  const rows: BenchRow[] = [
    {
      name: `terrain tile sampling per point, proj4 at every pixel (${perPoint.length}) p50 / p95`,
      value: p50p95(perPoint),
      unit: "ms",
    },
    {
      name: `terrain tile sampling on the lattice grid (${onGrid.length}) p50 / p95`,
      value: p50p95(onGrid),
      unit: "ms",
      target: `p95 < ${TARGET_MS}`,
      ok: quantile(onGrid, 0.95) < TARGET_MS,
    },
    {
      name: "terrain tile, largest grid vs per-point elevation difference",
      value: worst.toExponential(1),
      unit: "m",
      target: "< 1/256 m",
      ok: worst < 1 / 256,
    },
    {
      name: `terrarium PNG, fill and encode (${pngs.length}) p50 / p95`,
      value: p50p95(pngs),
      unit: "ms",
    },
  ];
  if (full) {
    const png = new PNG({ width: 256, height: 256, colorType: 6 });
    PNG.sync.read(terrariumPng(full, 256)).data.copy(png.data);
    const settings = [
      ["pngjs default (zlib 9, run-length)", { deflateLevel: 9, deflateStrategy: 3 }],
      ["zlib 1, run-length", { deflateLevel: 1, deflateStrategy: 3 }],
      ["zlib 1, default strategy", { deflateLevel: 1, deflateStrategy: 0 }],
      ["zlib 3, default strategy", { deflateLevel: 3, deflateStrategy: 0 }],
      ["zlib 6, default strategy", { deflateLevel: 6, deflateStrategy: 0 }],
    ] as const;
    const results = encodeEach(
      png,
      settings.map(([, options]) => options),
    );
    settings.forEach(([label], i) => {
      const used = label === `zlib ${PNG_DEFLATE_LEVEL}, default strategy` ? " (used)" : "";
      rows.push({
        name: `terrain PNG encode, full tile, ${label}${used}: median / size`,
        value: `${results[i]!.ms.toFixed(1)} / ${results[i]!.kb.toFixed(0)} KB`,
        unit: "ms",
      });
    });
  }
  return rows;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const { formatTable } = await import("./table");
  console.log(formatTable(await run()));
}
