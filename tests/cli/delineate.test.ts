/**
 * The delineation command line (scripts/delineate.ts) on terrains written for the test: the V
 * valley of server/terrain-flow/route.test.ts as a UTM GeoTIFF (closed forms worked out there),
 * a pit in feet, and the refusals, each a non-zero exit with one line on stderr. The runs start
 * together: each spends most of its time starting Node.
 */
import { spawn } from "node:child_process";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { delineationOutputSchema } from "../../shared/schemas/delineation";
import { tempDir, writeTemp } from "../../server/geodata/readers/test-support";
import { geoTiffBytes } from "../../server/geodata/writers";
import { gridProjection } from "../../server/terrain-flow/georef";

const root = fileURLToPath(new URL("../..", import.meta.url));
const K0 = 0.9996; // UTM scale on the central meridian: ground = grid / k0
const [W, H, XC, CELL] = [21, 40, 10, 10];
const georeference = {
  epsg: 32614,
  originX: 500_000 - 105,
  originY: 4_200_000,
  pixelSizeX: CELL,
  pixelSizeY: CELL,
};
const centre = (c: number, r: number) => gridProjection(georeference).lonLatAt(c + 0.5, r + 0.5);
const arg = ([lon, lat]: readonly number[]) => `${lon},${lat}`;

interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

function delineate(...args: string[]): Promise<Run> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ["--import", "tsx", "scripts/delineate.ts", ...args], {
      cwd: root,
    });
    let [stdout, stderr] = ["", ""];
    child.stdout.on("data", (d: Buffer) => (stdout += d.toString()));
    child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
    child.on("close", (code) => resolve({ code, stdout, stderr }));
  });
}

const runs: Record<string, Run> = {};

beforeAll(async () => {
  const dir = tempDir();
  const valley = writeTemp(
    dir,
    "valley.tif",
    geoTiffBytes({
      width: W,
      height: H,
      georeference,
      nodata: -9999,
      tileSize: 16,
      // route.test.ts's valley in metres on a 10 m grid; column 0 of the last row is nodata.
      values: (c, r) =>
        c === 0 && r === H - 1
          ? -9999
          : 50 + (3 * Math.abs(c - XC)) / K0 + (2.5 * (H - 1 - r)) / K0,
    }),
  );
  // A 9 × 9 plane in feet with a pit 5 ft deep in the middle.
  const pit = writeTemp(
    dir,
    "pit-ft.tif",
    geoTiffBytes({
      width: 9,
      height: 9,
      georeference,
      values: (c, r) => 300 - c - (c === 4 && r === 4 ? 5 : 0),
    }),
  );
  const cases: Record<string, string[]> = {
    valley: [
      valley,
      "--outlet",
      arg(centre(XC, 38)),
      "--outlet",
      arg(centre(XC, 20)),
      "--snap",
      "0",
    ],
    pit: [pit, "--outlet", arg(centre(8, 4)), "--vertical-unit", "ft"],
    outside: [valley, "--outlet", "10,10"],
    nodata: [valley, "--outlet", arg(centre(0, H - 1))],
    unreadable: ["README.md", "--outlet", arg(centre(XC, 38))],
    missing: ["no-such-terrain.tif", "--outlet", arg(centre(XC, 38))],
    badOutlet: [valley, "--outlet", "west,north"],
  };
  const done = await Promise.all(
    Object.entries(cases).map(async ([name, args]) => [name, await delineate(...args)] as const),
  );
  for (const [name, run] of done) runs[name] = run;
}, 120_000);

describe("npm run delineate", () => {
  it("prints one proposal per outlet, nested outlets splitting the valley", () => {
    const run = runs.valley!;
    expect(run.stderr).toBe("");
    expect(run.code).toBe(0);
    const [lower, upper] = delineationOutputSchema.parse(JSON.parse(run.stdout));
    // route.test.ts: cells reaching the channel by row r = Σ_{j ≤ r} 1 + 2·min(j, 10).
    const reach = (r: number) =>
      Array.from({ length: r + 1 }, (_, j) => 1 + 2 * Math.min(j, XC)).reduce((a, b) => a + b);
    expect(upper!.cells).toBe(reach(20));
    expect(lower!.cells).toBe(reach(38) - reach(20));
    const cellM2 = (CELL / K0) ** 2;
    expect(Math.abs(upper!.cellsAreaM2 / (reach(20) * cellM2) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(upper!.areaM2 / upper!.cellsAreaM2 - 1)).toBeLessThan(0.005);
    // Upper: from the north-west corner of cell (0, 0), half a diagonal, 10 diagonals, 10 south.
    const step = CELL / K0;
    const upperM = (0.5 + 10) * Math.SQRT2 * step + 10 * step;
    expect(Math.abs(upper!.longestFlowPathM / upperM - 1)).toBeLessThan(1e-5);
    expect(upper!.outlet.requested).toEqual(centre(XC, 20));
    expect(upper!.longestFlowPath.coordinates.at(-1)).toEqual(centre(XC, 20));
    expect(upper!.boundary.type).toBe("Polygon");
  });

  it("reads elevations in feet when told, and reports the fill in metres", () => {
    const run = runs.pit!;
    expect(run.code).toBe(0);
    const [proposal] = delineationOutputSchema.parse(JSON.parse(run.stdout));
    // The pit (291 ft) is raised to its lowest neighbour (295 ft): 4 ft = 1.2192 m.
    expect(proposal!.terrainConditioning.filledCells).toBe(1);
    expect(proposal!.terrainConditioning.maxFillDepthM).toBeCloseTo(4 * 0.3048, 6);
  });

  it.each([
    ["outside", 1, "outlet 1 (10.000000, 10.000000) is outside the terrain grid"],
    ["nodata", 1, "outlet 1 "],
    ["unreadable", 2, "README.md: is not a readable TIFF"],
    ["missing", 2, "cannot read no-such-terrain.tif: no such file"],
    ["badOutlet", 2, "--outlet 1: must be <lon>,<lat> in degrees"],
  ])("refuses %s with exit %i and one line", (name, code, message) => {
    const run = runs[name]!;
    expect(run.code).toBe(code);
    expect(run.stdout).toBe("");
    expect(run.stderr).toContain(message);
    expect(run.stderr.trimEnd().split("\n")).toHaveLength(1);
    if (name === "nodata") expect(run.stderr).toContain("is on a nodata cell of the terrain");
  });
});
