/**
 * The pipeline off the main thread and its stored form: a worker thread gives the same grids
 * as routing in-process, with progress; refusals come back as the same errors; the compact
 * binary object reads back cell for cell and a cut or foreign object is refused.
 */
import { describe, expect, it } from "vitest";
import { ReadError } from "../geodata/readers/types";
import { tempDir, writeTemp } from "../geodata/readers/test-support";
import { TerrainFlowError } from "./errors";
import { readElevationGrid } from "./read-terrain";
import { conditionAndRoute } from "./route";
import { decodeRouted, encodeRouted, StoredGridError } from "./store-format";
import { oversizedTiff } from "./test-grids";
import { routeTerrainInThread } from "./thread";

const DEMO = new URL("../../demo-geo/out/terrain.tif", import.meta.url).pathname;

// A worker thread starts tsx and compiles the engine first: seconds on a busy machine.
describe("routing in a worker thread", { timeout: 60_000 }, () => {
  it("gives the grids of routing in-process, reporting progress on the way", async () => {
    const fractions: number[] = [];
    const threaded = await routeTerrainInThread(
      { filePath: DEMO, verticalUnit: "m", fileLabel: "terrain.tif" },
      (fraction) => fractions.push(fraction),
    );
    const local = conditionAndRoute(await readElevationGrid(DEMO, "m"));
    expect(threaded.dir).toEqual(local.dir);
    expect(threaded.acc).toEqual(local.acc);
    expect(threaded.flowLenM).toEqual(local.flowLenM);
    expect(threaded.cond).toEqual(local.cond);
    expect(threaded.report).toEqual(local.report);
    expect(fractions.length).toBeGreaterThan(2);
    expect(fractions).toEqual([...fractions].sort((a, b) => a - b));
    expect(fractions.at(-1)).toBe(1);
  });

  it("brings back a refusal as the same error", async () => {
    const error = await routeTerrainInThread({
      filePath: writeTemp(tempDir(), "not.tif", "plain text"),
      verticalUnit: "m",
      fileLabel: "not.tif",
    }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ReadError);
    expect(error).toMatchObject({ code: "terrain-unreadable" });
    const bytes = oversizedTiff(12_000, 12_000);
    const huge = await routeTerrainInThread({
      filePath: writeTemp(tempDir(), "huge.tif", bytes),
      verticalUnit: "m",
      fileLabel: "huge.tif",
    }).catch((e: unknown) => e);
    expect(huge).toBeInstanceOf(TerrainFlowError);
    expect(huge).toMatchObject({ status: 413, code: "terrain-too-large" });
  });
});

describe("the stored form", () => {
  it("reads back cell for cell, in less than the 10 bytes a cell of the arrays", async () => {
    const routed = conditionAndRoute(await readElevationGrid(DEMO, "m"));
    const bytes = encodeRouted(routed);
    expect(bytes.length).toBeLessThan(10 * routed.width * routed.height);
    const back = decodeRouted(bytes);
    expect(back.dir).toEqual(routed.dir);
    expect(back.cond).toEqual(routed.cond);
    expect(back.acc).toEqual(routed.acc);
    expect(back.flowLenM).toEqual(routed.flowLenM);
    expect(back.metrics).toEqual(routed.metrics);
    expect(back.report).toEqual(routed.report);
    expect(back.georef).toEqual(routed.georef);
  });

  it("refuses an object cut short, a foreign one and a tampered header", async () => {
    const routed = conditionAndRoute(await readElevationGrid(DEMO, "m"));
    const bytes = encodeRouted(routed);
    const refused = (b: Uint8Array) => {
      try {
        decodeRouted(b);
      } catch (error) {
        return error instanceof StoredGridError ? error.message : `other: ${String(error)}`;
      }
      return "accepted";
    };
    expect(refused(bytes.subarray(0, bytes.length - 100))).toMatch(/cut short/);
    expect(refused(Buffer.from("GIF89a and so on"))).toMatch(/not a Rillmark flow-grid object/);
    const tampered = Buffer.from(bytes);
    const header = tampered.toString("latin1");
    const at = header.indexOf('"width":256');
    tampered.write('"width":257', at, "latin1");
    expect(refused(tampered)).toMatch(/wrong size/);
  });
});
