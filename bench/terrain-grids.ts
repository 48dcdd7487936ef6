/**
 * Synthetic terrains for the terrain-flow bench (invented, deterministic): a slope of 1 m cells
 * in UTM 14N with two trains of waves across it — closed hollows that must be filled, about an
 * eighth of the cells — and 5 cm of pseudo-random roughness that leaves pits everywhere, as a
 * lidar DEM does.
 */
import type { ElevationGrid } from "../server/terrain-flow/types";

export function benchTerrain(width: number, height: number): ElevationGrid {
  const z = new Float32Array(width * height);
  let seed = 12345;
  for (let r = 0; r < height; r += 1) {
    for (let c = 0; c < width; c += 1) {
      seed = (Math.imul(seed, 1103515245) + 12345) | 0;
      const rough = ((seed >>> 8) & 0xffff) / 0xffff;
      z[r * width + c] =
        100 +
        0.02 * r +
        5 * Math.sin(c / 97) * Math.cos(r / 131) +
        3 * Math.sin((c + r) / 41) +
        0.05 * rough;
    }
  }
  return {
    width,
    height,
    z,
    verticalToM: 1,
    georef: { epsg: 32614, originX: 400_000, originY: 4_300_000, pixelSizeX: 1, pixelSizeY: 1 },
  };
}
