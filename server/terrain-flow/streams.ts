/**
 * Stream lines: cells whose contributing area reaches a threshold, joined into links from each
 * source or confluence down to the next confluence (or to where the water leaves the grid), each
 * link with its Strahler order (Strahler 1957, "Quantitative analysis of watershed
 * geomorphology", Trans. AGU 38: a source link is order 1; where two links of the same order
 * meet the order goes up by one, otherwise the higher order carries on). Orders are settled
 * upstream first, by in-flow counts as in accumulation, with no recursion.
 */
import { offsets } from "./d8";
import { gridProjection } from "./georef";
import type { RoutedGrid } from "./types";

export interface StreamLink {
  readonly order: number;
  /** Cells from the link's upstream end to the confluence (or exit) it ends at. */
  readonly cells: Int32Array;
}

/**
 * The threshold in cells for a contributing area in m², from the grid's middle row (a
 * geographic grid's cells shrink toward the pole; over a DEM's few kilometres the threshold
 * moves by well under one cell in a thousand).
 */
export function cellsForArea(routed: RoutedGrid, minAreaM2: number): number {
  // A millionth of a cell of slack: an area of exactly 20 cells is 20 cells, not 21.
  const cells = minAreaM2 / routed.metrics.areaM2[routed.height >> 1]!;
  return Math.max(1, Math.ceil(cells - 1e-6));
}

export function streamLinks(routed: RoutedGrid, thresholdCells: number): StreamLink[] {
  const { width, dir, acc } = routed;
  const n = width * routed.height;
  const off = offsets(width);
  const isStream = (c: number) => acc[c]! >= thresholdCells;
  // Donors from the network: a stream cell's downstream cell is a stream cell (accumulation
  // only grows downstream).
  const donors = new Uint8Array(n);
  const cells: number[] = [];
  for (let c = 0; c < n; c += 1) {
    if (!isStream(c)) continue;
    cells.push(c);
    const d = dir[c]!;
    if (d !== 0) {
      const down = c + off[d]!;
      donors[down] = donors[down]! + 1;
    }
  }
  const order = new Uint8Array(n);
  const highest = new Uint8Array(n); // highest order flowing in so far
  const reaching = new Uint8Array(n); // how many in-flows carry that order
  const waiting = donors.slice();
  const queue = cells.filter((c) => donors[c] === 0);
  for (let head = 0; head < queue.length; head += 1) {
    const c = queue[head]!;
    order[c] = donors[c] === 0 ? 1 : reaching[c]! >= 2 ? highest[c]! + 1 : highest[c]!;
    const d = dir[c]!;
    if (d === 0) continue;
    const down = c + off[d]!;
    if (order[c]! > highest[down]!) {
      highest[down] = order[c]!;
      reaching[down] = 1;
    } else if (order[c] === highest[down]) reaching[down] = reaching[down]! + 1;
    waiting[down] = waiting[down]! - 1;
    if (waiting[down] === 0) queue.push(down);
  }
  const links: StreamLink[] = [];
  for (const start of cells) {
    if (donors[start] === 1) continue; // inside a link
    const path = [start];
    for (let c = start; dir[c] !== 0;) {
      c += off[dir[c]!]!;
      path.push(c);
      if (donors[c]! >= 2) break; // a confluence: the next link starts here
    }
    links.push({ order: order[start]!, cells: Int32Array.from(path) });
  }
  return links;
}

/** Stream links as GeoJSON LineStrings through cell centres (collinear points dropped). */
export function streamLinesGeoJSON(routed: RoutedGrid, links: readonly StreamLink[]) {
  const projection = gridProjection(routed.georef);
  const { width, dir } = routed;
  return {
    type: "FeatureCollection" as const,
    features: links
      .filter((link) => link.cells.length >= 2)
      .map((link) => {
        const coordinates: [number, number][] = [];
        link.cells.forEach((c, i) => {
          const last = i === link.cells.length - 1;
          if (i > 0 && !last && dir[c] === dir[link.cells[i - 1]!]) return;
          const row = Math.floor(c / width);
          coordinates.push(projection.lonLatAt(c - row * width + 0.5, row + 0.5));
        });
        return {
          type: "Feature" as const,
          properties: { order: link.order },
          geometry: { type: "LineString" as const, coordinates },
        };
      }),
  };
}
