/**
 * Synthetic (invented) data for the split benchmark, the same on every run (seeded): a
 * perturbed grid of 400 × 250 quadrilateral cover polygons (100,000) and 40 × 25 soil polygons
 * over about 10 km × 10 km, and a meandering 10,000-vertex flow path across it.
 */
import type { HsgCode, LonLat, ValuedPolygon } from "../shared/geo/index";

/** South-west corner of the invented area and its size in degrees (≈ 10 km × 10 km at 35° N). */
const X0 = -98.2;
const Y0 = 35.1;
const WIDTH_DEG = 0.11;
const HEIGHT_DEG = 0.09;
const CLASSES = ["woods", "range", "lawn", "pavement", "roofs", "fallow", "crops", "gravel"];
const HSGS: HsgCode[] = ["A", "B", "C", "D", "B/D"];

/** Mulberry32: a small, well-mixed 32-bit generator, enough for test geometry. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * A grid of cols × rows cells whose inner vertices are moved by up to 30 % of a cell, so no
 * edge lines up with another; neighbouring cells share vertices, so the cells tile the area
 * without gaps or overlaps.
 */
function perturbedGrid<V>(
  cols: number,
  rows: number,
  seed: number,
  valueOf: (k: number, next: () => number) => V,
): ValuedPolygon<V>[] {
  const next = random(seed);
  const dx = WIDTH_DEG / cols;
  const dy = HEIGHT_DEG / rows;
  const vx = new Float64Array((cols + 1) * (rows + 1));
  const vy = new Float64Array((cols + 1) * (rows + 1));
  for (let j = 0; j <= rows; j += 1) {
    for (let i = 0; i <= cols; i += 1) {
      const inner = i > 0 && j > 0 && i < cols && j < rows;
      const k = j * (cols + 1) + i;
      vx[k] = X0 + i * dx + (inner ? (next() - 0.5) * 0.6 * dx : 0);
      vy[k] = Y0 + j * dy + (inner ? (next() - 0.5) * 0.6 * dy : 0);
    }
  }
  const at = (i: number, j: number): LonLat => {
    const k = j * (cols + 1) + i;
    return [vx[k]!, vy[k]!];
  };
  const out: ValuedPolygon<V>[] = [];
  for (let j = 0; j < rows; j += 1) {
    for (let i = 0; i < cols; i += 1) {
      const k = j * cols + i;
      const ring = [at(i, j), at(i + 1, j), at(i + 1, j + 1), at(i, j + 1), at(i, j)];
      out.push({ featureId: k + 1, value: valueOf(k, next), rings: [ring] });
    }
  }
  return out;
}

export function coverPolygons(): ValuedPolygon<string>[] {
  return perturbedGrid(400, 250, 11, (_, next) => CLASSES[Math.floor(next() * CLASSES.length)]!);
}

export function soilPolygons(): ValuedPolygon<HsgCode>[] {
  return perturbedGrid(40, 25, 23, (_, next) => HSGS[Math.floor(next() * HSGS.length)]!);
}

/**
 * A 10,000-vertex path from near the north-west corner to near the south-east one, meandering
 * about the diagonal (two sine waves and a little noise): about 16 km long, vertices 1–2 m apart.
 */
export function flowPath(vertexCount = 10_000): LonLat[] {
  const next = random(37);
  const path: LonLat[] = [];
  for (let k = 0; k < vertexCount; k += 1) {
    const s = k / (vertexCount - 1);
    const meander = 0.12 * Math.sin(2 * Math.PI * 3 * s) + 0.04 * Math.sin(2 * Math.PI * 17 * s);
    const u = 0.05 + 0.9 * s + meander * 0.5;
    const v = 0.95 - 0.9 * s + meander * 0.5;
    const jitter = () => (next() - 0.5) * 2e-6;
    path.push([X0 + WIDTH_DEG * u + jitter(), Y0 + HEIGHT_DEG * v + jitter()]);
  }
  return path;
}
