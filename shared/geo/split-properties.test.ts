/**
 * Properties of the split over random paths on a small grid of classes and soils (fast-check):
 * the pieces tile the path, match an exhaustive point-in-polygon test of every polygon, are
 * merged once and for all, and do not depend on the path's direction.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { pathLengthsM } from "./geodesic";
import { buildPolygonIndex, winnerAt } from "./polygon-index";
import { mergePieces, splitFlowPath } from "./split";
import { pointAtStation } from "./stations";
import type { HsgCode, LonLat, PathPiece, ValuedPolygon } from "./types";

const X0 = -97.5;
const Y0 = 35.2;
/** A grid cell of about 90 m × 110 m near (X0, Y0). */
const D = 0.001;
const cell = (i: number, j: number): LonLat[] => [
  [X0 + i * D, Y0 + j * D],
  [X0 + (i + 1) * D, Y0 + j * D],
  [X0 + (i + 1) * D, Y0 + (j + 1) * D],
  [X0 + i * D, Y0 + (j + 1) * D],
  [X0 + i * D, Y0 + j * D],
];
const at = (x: number, y: number): LonLat => [X0 + x * D, Y0 + y * D];

describe("splitFlowPath: properties over random paths on a 6 × 6 grid of classes and soils", () => {
  const CLASSES = ["lawn", "woods", "range"];
  const HSGS: HsgCode[] = ["A", "B", "D"];
  const coverCells: ValuedPolygon<string | null>[] = [];
  const soilCells: ValuedPolygon<HsgCode | null>[] = [];
  for (let i = 0; i < 6; i += 1) {
    for (let j = 0; j < 6; j += 1) {
      coverCells.push({
        featureId: i * 6 + j,
        value: CLASSES[(i * 7 + j * 3) % 3]!,
        rings: [cell(i, j)],
      });
      if ((i + j) % 4 !== 3)
        soilCells.push({
          featureId: 100 + i * 6 + j,
          value: HSGS[(i + 2 * j) % 3]!,
          rings: [cell(i, j)],
        });
    }
  }
  const cover = buildPolygonIndex(coverCells);
  const soil = buildPolygonIndex(soilCells);
  // Vertices snap to a 1/4-cell lattice half the time, so edges often run along or end on
  // polygon edges: the hard cases.
  // Other vertices sit on a 1e-6-cell lattice (0.1 mm): never a hair's breadth off an edge,
  // where the 1e-12° on-boundary tolerance would decide (a difference of 1e-7 m at most).
  const coordinate = fc.oneof(
    fc.integer({ min: -500_000, max: 6_500_000 }).map((k) => k / 1e6),
    fc.integer({ min: -2, max: 26 }).map((k) => k / 4),
  );
  const paths = fc.array(fc.tuple(coordinate, coordinate), { minLength: 2, maxLength: 30 });
  const toPath = (cells: [number, number][]): LonLat[] => cells.map(([x, y]) => at(x, y));

  it("the pieces sum to the path length (1e-9 relative) and tile it in order from station 0", () => {
    fc.assert(
      fc.property(paths, (cells) => {
        const path = toPath(cells);
        const pieces = splitFlowPath(path, cover, soil);
        const totalM = pathLengthsM(path).totalM;
        const sumM = pieces.reduce((s, p) => s + p.lengthM, 0);
        expect(Math.abs(sumM - totalM)).toBeLessThanOrEqual(1e-9 * Math.max(totalM, 1));
        pieces.forEach((p, k) => {
          expect(p.lengthM).toBeGreaterThan(0);
          expect(p.stationFromM).toBe(k === 0 ? 0 : pieces[k - 1]!.stationToM);
        });
        if (pieces.length > 0) expect(pieces[pieces.length - 1]!.stationToM).toBe(totalM);
      }),
      { numRuns: 300 },
    );
  });

  it("every piece has the class and soil that an exhaustive test of every polygon gives", () => {
    const allCover = coverCells.map((_, k) => k);
    const allSoil = soilCells.map((_, k) => k);
    fc.assert(
      fc.property(paths, (cells) => {
        const path = toPath(cells);
        const lengths = pathLengthsM(path);
        for (const p of splitFlowPath(path, cover, soil, lengths)) {
          if (p.lengthM < 0.01) continue; // a sample point could fall off a sliver
          // Off-centre fractions: a round one can land on a path vertex, where a single point
          // may touch a third polygon that no stretch of the path enters.
          for (const f of [0.213, 0.517, 0.821]) {
            const [x, y] = pointAtStation(path, lengths, p.stationFromM + f * p.lengthM);
            const c = winnerAt(cover, allCover, x, y);
            const s = winnerAt(soil, allSoil, x, y);
            expect([p.surfaceClassId, p.hsg]).toEqual([
              c < 0 ? null : cover.values[c],
              s < 0 ? null : soil.values[s],
            ]);
          }
        }
      }),
      { numRuns: 300 },
    );
  });

  it("merging is idempotent: no two neighbours share (class, soil)", () => {
    fc.assert(
      fc.property(paths, (cells) => {
        const pieces = splitFlowPath(toPath(cells), cover, soil);
        expect(mergePieces(pieces)).toEqual(pieces);
      }),
      { numRuns: 300 },
    );
  });

  it("reversing the path gives the same length per class (1e-6 relative)", () => {
    const perClass = (pieces: readonly PathPiece[]) => {
      const totals = new Map<string, number>();
      for (const p of pieces) {
        const key = `${p.surfaceClassId}|${p.hsg}`;
        totals.set(key, (totals.get(key) ?? 0) + p.lengthM);
      }
      return totals;
    };
    fc.assert(
      fc.property(paths, (cells) => {
        const path = toPath(cells);
        const forward = perClass(splitFlowPath(path, cover, soil));
        const backward = perClass(splitFlowPath([...path].reverse(), cover, soil));
        for (const [key, lengthM] of forward) {
          expect(Math.abs((backward.get(key) ?? 0) - lengthM)).toBeLessThanOrEqual(
            1e-6 * Math.max(lengthM, 1),
          );
        }
      }),
      { numRuns: 200 },
    );
  });
});
