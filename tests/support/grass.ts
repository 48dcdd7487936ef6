/**
 * GRASS GIS (Debian's grass-core) as a reference: r.watershed with single flow direction
 * (-s, D8) and r.water.outlet for basins, r.stats for their cell counts, the drainage raster exported
 * with r.out.gdal. The longest flow path is traced on GRASS's drainage codes
 * (1–8 counter-clockwise from north-east, 45° apart; negative where the flow leaves the region)
 * in its own cell steps, 1 or √2 cells in the region's map units; areas are r.stats -c cell
 * counts × the region's resolution (a projected location). Each outlet is first snapped
 * on GRASS's own accumulation, as Rillmark snaps on its own (the largest within the radius, a
 * disc of cells; the nearest among equals). Used by the reference tests and the bench; both
 * skip with a message when GRASS is not installed.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fromFile } from "geotiff";

/** Why GRASS cannot be used here, or null when `grass` runs. */
export function grassMissing(): string | null {
  const run = spawnSync("grass", ["--version"], { encoding: "utf8" });
  if (run.error || run.status !== 0) {
    return "GRASS GIS is not installed (apt-get install grass-core; npm test installs it as root)";
  }
  return null;
}

export interface GrassBasin {
  readonly cells: number;
  readonly areaM2: number;
  /** From half a step upstream of the most remote cell's centre to the outlet's centre. */
  readonly longestPathM: number;
}

export interface GrassRun {
  /** r.watershed alone: wall-clock seconds and peak resident memory (VmHWM) in kB. */
  readonly watershedS: number;
  readonly peakKb: number;
  readonly basins: GrassBasin[];
}

/** One GRASS session: a script run in the location, its standard output returned. */
function inGrass(session: string, dir: string, name: string, lines: string[]): string {
  const script = join(dir, name);
  writeFileSync(script, `set -e\n${lines.join("\n")}\n`);
  const run = spawnSync("grass", [session, "--exec", "bash", script], {
    encoding: "utf8",
    env: { ...process.env, GRASS_VERBOSE: "0" },
    maxBuffer: 64 * 1024 * 1024,
  });
  if (run.status !== 0) throw new Error(`GRASS failed: ${run.stderr.slice(-2000)}`);
  return run.stdout;
}

/**
 * Runs r.watershed -s on a GeoTIFF (timed, with its peak memory), then r.water.outlet at each
 * click (map coordinates in the file's CRS) snapped within `snapCells` on GRASS's accumulation.
 */
export async function grassReference(
  tif: string,
  clicks: readonly (readonly [number, number])[],
  snapCells: number,
): Promise<GrassRun> {
  const dir = mkdtempSync(join(tmpdir(), "rillmark-grass-"));
  try {
    const location = join(dir, "location");
    const create = spawnSync("grass", ["-c", tif, "-e", location], { encoding: "utf8" });
    if (create.status !== 0) throw new Error(`grass -c failed: ${create.stderr}`);
    const session = join(location, "PERMANENT");
    const dirTif = join(dir, "drainage.tif");
    const accTif = join(dir, "accumulation.tif");
    const routed = inGrass(session, dir, "route.sh", [
      `r.in.gdal -o input=${tif} output=dem --quiet`,
      "g.region raster=dem",
      // Timed alone; its peak memory read from /proc while it runs (no GNU time needed).
      "start=$(date +%s.%N); peak=0",
      "r.watershed -s elevation=dem accumulation=acc drainage=dir --quiet & pid=$!",
      // r.watershed runs its worker (r.watershed.ram) as a child: the peak of either counts.
      'while kill -0 $pid 2>/dev/null; do for p in $pid $(cat /proc/$pid/task/*/children 2>/dev/null); do hwm=$(awk \'/VmHWM/ {print $2}\' /proc/$p/status 2>/dev/null || true); [ -n "$hwm" ] && [ "$hwm" -gt "$peak" ] && peak=$hwm; done; sleep 0.02; done',
      "wait $pid",
      'echo "WATERSHED $(awk "BEGIN { print $(date +%s.%N) - $start }") $peak"',
      `r.out.gdal input=acc output=${accTif} type=Float64 format=GTiff -c --quiet`,
      `r.out.gdal input=dir output=${dirTif} type=Int16 format=GTiff -c --quiet`,
      'eval "$(g.region -g)"; echo "CELL $ewres $nsres"',
    ]);
    const res = /CELL ([\d.]+) ([\d.]+)/.exec(routed);
    const cellM2 = Number(res?.[1]) * Number(res?.[2]);
    const watershed = /WATERSHED ([\d.]+) (\d+)/.exec(routed);
    if (!watershed) throw new Error(`no r.watershed timing in: ${routed.slice(-500)}`);
    const outlets = clicks.length > 0 ? await snapped(accTif, clicks, snapCells) : [];
    const basinsOut =
      outlets.length === 0
        ? ""
        : inGrass(
            session,
            dir,
            "basins.sh",
            outlets.flatMap(([x, y], k) => [
              `r.water.outlet input=dir output=b${k} coordinates=${x},${y} --quiet`,
              `echo "BASIN ${k} $(r.stats -c -n b${k} | awk '{print $2}')"`,
            ]),
          );
    const counted = outlets.map((_, k) => {
      const m = new RegExp(`BASIN ${k} (\\d+)`).exec(basinsOut);
      if (!m) throw new Error(`no basin ${k} in GRASS's output`);
      // r.stats -a would say the same in a projected location: cells × ewres × nsres.
      return { areaM2: Number(m[1]) * cellM2, cells: Number(m[1]) };
    });
    const lengths = await longestPaths(dirTif, outlets);
    return {
      watershedS: Number(watershed[1]),
      peakKb: Number(watershed[2]),
      basins: counted.map((b, k) => {
        if (lengths[k]!.cells !== b.cells) {
          throw new Error(`basin ${k}: ${b.cells} cells in GRASS, ${lengths[k]!.cells} traced`);
        }
        return { ...b, longestPathM: lengths[k]!.lengthM };
      }),
    };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** GRASS code → column and row step (rows run south). */
const GRASS_STEP: Record<number, [number, number]> = {
  1: [1, -1],
  2: [0, -1],
  3: [-1, -1],
  4: [-1, 0],
  5: [-1, 1],
  6: [0, 1],
  7: [1, 1],
  8: [1, 0],
};

interface Raster {
  values: ArrayLike<number>;
  width: number;
  height: number;
  x0: number;
  y0: number;
  sx: number;
  sy: number;
}

async function readRaster(file: string): Promise<Raster> {
  const tiff = await fromFile(file);
  const image = await tiff.getImage();
  const [values] = (await image.readRasters()) as unknown as ArrayLike<number>[];
  const [x0, y0] = image.getOrigin() as [number, number];
  const [sx, sy] = image.getResolution() as [number, number];
  const raster = {
    values: values!,
    width: image.getWidth(),
    height: image.getHeight(),
    x0,
    y0,
    sx,
    sy: Math.abs(sy),
  };
  tiff.close();
  return raster;
}

/** Cell centres of the clicks moved to GRASS's largest |accumulation| within the radius. */
async function snapped(
  accTif: string,
  clicks: readonly (readonly [number, number])[],
  radius: number,
) {
  const acc = await readRaster(accTif);
  return clicks.map(([x, y]) => {
    const col = Math.floor((x - acc.x0) / acc.sx);
    const row = Math.floor((acc.y0 - y) / acc.sy);
    let [best, bestAcc, bestD2] = [[col, row], -1, Infinity];
    for (let dr = -radius; dr <= radius; dr += 1) {
      for (let dc = -radius; dc <= radius; dc += 1) {
        const d2 = dr * dr + dc * dc;
        const [q, r] = [col + dc, row + dr];
        if (d2 > radius * radius || q < 0 || r < 0 || q >= acc.width || r >= acc.height) continue;
        const a = Math.abs(acc.values[r * acc.width + q]!);
        if (a > bestAcc || (a === bestAcc && d2 < bestD2))
          [best, bestAcc, bestD2] = [[q, r], a, d2];
      }
    }
    return [acc.x0 + (best[0]! + 0.5) * acc.sx, acc.y0 - (best[1]! + 0.5) * acc.sy] as const;
  });
}

async function longestPaths(dirTif: string, outlets: readonly (readonly [number, number])[]) {
  const { values: codes, width, height, x0, y0, sx, sy } = await readRaster(dirTif);
  const cellM = sx;
  const stepM = ([dc, dr]: [number, number]) => (dc !== 0 && dr !== 0 ? Math.SQRT2 : 1) * cellM;
  return outlets.map(([x, y]) => {
    const outlet = Math.floor((y0 - y) / sy) * width + Math.floor((x - x0) / sx);
    // Upstream breadth-first on GRASS's codes, each cell's distance from its downstream one.
    const dist = new Map<number, number>([[outlet, 0]]);
    const queue = [outlet];
    let [start, far] = [outlet, -1];
    for (let head = 0; head < queue.length; head += 1) {
      const c = queue[head]!;
      const row = Math.floor(c / width);
      const col = c - row * width;
      const code = Math.abs(codes[c]!);
      const half = code in GRASS_STEP ? stepM(GRASS_STEP[code]!) / 2 : cellM / 2;
      if (dist.get(c)! + half > far) [far, start] = [dist.get(c)! + half, c];
      for (const [k, step] of Object.entries(GRASS_STEP)) {
        const [q, r] = [col - step[0], row - step[1]];
        if (q < 0 || r < 0 || q >= width || r >= height) continue;
        const nb = r * width + q;
        if (Math.abs(codes[nb]!) === Number(k) && !dist.has(nb)) {
          dist.set(nb, dist.get(c)! + stepM(step));
          queue.push(nb);
        }
      }
    }
    return { cells: queue.length, lengthM: far, start };
  });
}
