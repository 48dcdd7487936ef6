/**
 * Benchmarks of the file readers (`npm run bench`, or alone: `npx tsx bench/readers.ts`):
 * - reading a 100,000-polygon zipped shapefile through readVectorFile (unzip, parse, dbf,
 *   reprojection, checks), timed, with the peak resident memory of a fresh process that does
 *   only that (the database insert of the upload pipeline comes on top);
 * - sampling a ~200 MB terrain GeoTIFF along a 10 km path at 1 m spacing (10,000 points),
 *   first read after opening and again with the block cache warm.
 * The files are invented and written to a temp folder, then removed.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import proj4 from "proj4";
import { readVectorFile } from "../server/geodata/readers";
import { inspectTerrain, openTerrain } from "../server/geodata/terrain";
import { makeCoverShapefile, makeTerrain } from "./geodata-files";
import type { BenchRow } from "./table";

const POLYGONS = 100_000;
const TERRAIN_CELLS = 7_200;
const UTM10 = "+proj=utm +zone=10 +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs";

/** Child-process mode: read one file and print its time and peak RSS as JSON. */
async function ingestChild(filePath: string): Promise<void> {
  const start = performance.now();
  const result = await readVectorFile(filePath, "shapefile", "cover.zip");
  const ms = performance.now() - start;
  const peakMb = process.resourceUsage().maxRSS / 1024;
  console.log(JSON.stringify({ ms, peakMb, features: result.features.length }));
}

function measureIngest(filePath: string): { ms: number; peakMb: number; features: number } {
  const self = fileURLToPath(import.meta.url);
  const child = spawnSync(process.execPath, ["--import", "tsx", self, "--ingest", filePath], {
    encoding: "utf8",
    maxBuffer: 1024 * 1024,
  });
  if (child.status !== 0) throw new Error(`ingest child failed: ${child.stderr}`);
  return JSON.parse(child.stdout.trim().split("\n").pop() ?? "{}");
}

/** A 10 km path across the terrain at 1 m spacing, in WGS84, bending once. */
function tenKmPath(): [number, number][] {
  const points: [number, number][] = [];
  for (let s = 0; s < 10_000; s += 1) {
    const x = 561000 + (s < 6000 ? s * 0.8 : 4800 + (s - 6000) * 0.6);
    const y = 4254000 - (s < 6000 ? s * 0.6 : 3600 + (s - 6000) * 0.8);
    points.push(proj4(UTM10, "EPSG:4326", [x, y]) as [number, number]);
  }
  return points;
}

export async function run(): Promise<BenchRow[]> {
  const dir = mkdtempSync(join(tmpdir(), "rillmark-bench-readers-"));
  try {
    const shp = makeCoverShapefile(dir, POLYGONS);
    const ingest = measureIngest(shp);
    const tif = await makeTerrain(dir, TERRAIN_CELLS);
    const sizeMb = statSync(tif).size / 1024 ** 2;
    const path = tenKmPath();
    const t0 = performance.now();
    const info = await inspectTerrain(tif, "m");
    const sampler = await openTerrain(tif, info);
    const first = await sampler.elevationsM(path);
    const coldMs = performance.now() - t0;
    const t1 = performance.now();
    await sampler.elevationsM(path);
    const warmMs = performance.now() - t1;
    await sampler.close();
    const missing = first.filter((z) => z === null).length;
    return [
      {
        name: `read ${POLYGONS.toLocaleString("en-US")}-polygon shapefile (reader only)`,
        value: (ingest.ms / 1000).toFixed(2),
        unit: "s",
        target: "< 30 s (whole ingest)",
        ok: ingest.ms < 30_000,
      },
      {
        name: "  peak memory of that read (fresh process)",
        value: ingest.peakMb.toFixed(0),
        unit: "MB",
        target: "< 1024 MB",
        ok: ingest.peakMb < 1024,
      },
      {
        name: `sample ${sizeMb.toFixed(0)} MB terrain, 10 km at 1 m, open + first read`,
        value: coldMs.toFixed(0),
        unit: "ms",
        target: "< 1000 ms",
        ok: coldMs < 1000 && missing === 0,
      },
      {
        name: "  same path again, block cache warm",
        value: warmMs.toFixed(0),
        unit: "ms",
        target: "< 1000 ms",
        ok: warmMs < 1000,
      },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const invoked =
  process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href;
if (invoked && process.argv[2] === "--ingest") {
  await ingestChild(process.argv[3] ?? "");
} else if (invoked) {
  const { formatTable } = await import("./table");
  console.log(formatTable(await run()));
}
