/**
 * The inner loop of the split: one path edge against the candidate polygons of both layers.
 * State is kept between edges so nothing is allocated per edge (in a 10,000-vertex split the
 * garbage collector, not the arithmetic, was the largest cost) and so an edge that no boundary
 * touches can take the cover and soil of the edge before it without a point-in-polygon test.
 */
import { stationOnEdgeM, type PathLengths } from "./geodesic";
import { ON_LINE_EPS_DEG, edgeSegmentParams } from "./planar";
import { winnerAmong, type PolygonIndex } from "./polygon-index";
import type { HsgCode, LonLat, PathPiece } from "./types";

/** Breaks closer than this fraction of an edge are one break (1e-9 of 1 km is 1 µm). */
const SAME_T = 1e-9;

export type MutablePiece = { -readonly [K in keyof PathPiece]: PathPiece[K] };

const ascending = (x: number, y: number) => x - y;

export class EdgeSplitter {
  readonly pieces: MutablePiece[] = [];
  private readonly raw: number[] = [];
  private coverNear = new Int32Array(64);
  private soilNear = new Int32Array(64);
  /** The winners of the last stretch and the vertex it ended on (-2: none yet). */
  private lastCover = -2;
  private lastSoil = -2;
  private lastEndVertex = -1;

  constructor(
    private readonly path: readonly LonLat[],
    private readonly lengths: PathLengths,
    private readonly cover: PolygonIndex<string | null>,
    private readonly soil: PolygonIndex<HsgCode | null>,
  ) {}

  /** Splits edge `edge` given the entries of each layer found near its run of edges. */
  splitEdge(edge: number, coverRun: readonly number[], soilRun: readonly number[]): void {
    const a = this.path[edge]!;
    const b = this.path[edge + 1]!;
    const ax = a[0];
    const ay = a[1];
    const bx = b[0];
    const by = b[1];
    if (this.coverNear.length < coverRun.length) this.coverNear = new Int32Array(coverRun.length);
    if (this.soilNear.length < soilRun.length) this.soilNear = new Int32Array(soilRun.length);
    const coverHits = this.coverNear;
    const soilHits = this.soilNear;
    const coverCount = near(this.cover, coverRun, ax, ay, bx, by, coverHits);
    const soilCount = near(this.soil, soilRun, ax, ay, bx, by, soilHits);
    const raw = this.raw;
    if (raw.length > 0) raw.length = 0;
    collectParams(this.cover, coverHits, coverCount, ax, ay, bx, by, raw);
    collectParams(this.soil, soilHits, soilCount, ax, ay, bx, by, raw);
    if (raw.length > 1) raw.sort(ascending);
    // A boundary through the edge's first vertex shows as a parameter 0 (params are collected
    // with the ends included); without one, the stretch just after the vertex lies in the same
    // polygons as the stretch just before it.
    const touchesStart = raw.length > 0 && raw[0]! <= SAME_T;
    const canReuse = !touchesStart && this.lastEndVertex === edge && this.lastCover !== -2;

    let fromM = this.lengths.cumulativeM[edge]!;
    let tFrom = 0;
    let k = 0;
    for (;;) {
      while (k < raw.length && (raw[k]! - tFrom <= SAME_T || raw[k]! >= 1 - SAME_T)) k += 1;
      const tTo = k < raw.length ? raw[k]! : 1;
      const toM = stationOnEdgeM(this.path, this.lengths, edge, tTo);
      if (toM > fromM) {
        let c: number;
        let s: number;
        if (tFrom === 0 && canReuse) {
          c = this.lastCover;
          s = this.lastSoil;
        } else {
          const tMid = (tFrom + tTo) / 2;
          const mx = ax + (bx - ax) * tMid;
          const my = ay + (by - ay) * tMid;
          c = winnerAmong(this.cover, coverHits, coverCount, mx, my);
          s = winnerAmong(this.soil, soilHits, soilCount, mx, my);
        }
        this.emit(fromM, toM, c, s);
        fromM = toM;
      }
      if (tTo === 1) break;
      tFrom = tTo;
    }
    this.lastEndVertex = edge + 1;
  }

  /** A repeated vertex: the next edge starts where this one did. */
  skipEdge(edge: number): void {
    if (this.lastEndVertex === edge) this.lastEndVertex = edge + 1;
  }

  private emit(fromM: number, toM: number, c: number, s: number): void {
    this.lastCover = c;
    this.lastSoil = s;
    const surfaceClassId = c < 0 ? null : this.cover.values[c]!;
    const hsg = s < 0 ? null : this.soil.values[s]!;
    const last = this.pieces[this.pieces.length - 1];
    if (last && last.surfaceClassId === surfaceClassId && last.hsg === hsg) {
      last.stationToM = toM;
      last.lengthM = toM - last.stationFromM;
      return;
    }
    this.pieces.push({
      stationFromM: fromM,
      stationToM: toM,
      lengthM: toM - fromM,
      surfaceClassId,
      hsg,
      coverFeatureId: c < 0 ? null : this.cover.featureIds[c]!,
      soilFeatureId: s < 0 ? null : this.soil.featureIds[s]!,
    });
  }
}

/** Writes the entries of `run` whose boxes touch the edge's box into `out`; returns how many. */
function near<V>(
  index: PolygonIndex<V>,
  run: readonly number[],
  ax: number,
  ay: number,
  bx: number,
  by: number,
  out: Int32Array,
): number {
  const boxes = index.boxes;
  const e = ON_LINE_EPS_DEG;
  const minX = (ax < bx ? ax : bx) - e;
  const maxX = (ax < bx ? bx : ax) + e;
  const minY = (ay < by ? ay : by) - e;
  const maxY = (ay < by ? by : ay) + e;
  let count = 0;
  for (let i = 0; i < run.length; i += 1) {
    const k = 4 * run[i]!;
    if (
      boxes[k]! <= maxX &&
      boxes[k + 2]! >= minX &&
      boxes[k + 1]! <= maxY &&
      boxes[k + 3]! >= minY
    ) {
      out[count] = run[i]!;
      count += 1;
    }
  }
  return count;
}

/** Every parameter in [0, 1] where the edge meets a ring of the candidates. */
function collectParams<V>(
  index: PolygonIndex<V>,
  candidates: Int32Array,
  count: number,
  ax: number,
  ay: number,
  bx: number,
  by: number,
  out: number[],
): void {
  for (let c = 0; c < count; c += 1) {
    const rings = index.rings[candidates[c]!]!;
    for (let r = 0; r < rings.length; r += 1) {
      const ring = rings[r]!;
      for (let k = 0; k + 3 < ring.length; k += 2) {
        edgeSegmentParams(
          ax,
          ay,
          bx,
          by,
          ring[k]!,
          ring[k + 1]!,
          ring[k + 2]!,
          ring[k + 3]!,
          out,
          true,
        );
      }
    }
  }
}
