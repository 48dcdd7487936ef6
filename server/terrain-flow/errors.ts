/**
 * A request the terrain engine refuses, with a message for the person who made it: an HTTP
 * status for the routes and a code for the command line and the tests.
 */
export class TerrainFlowError extends Error {
  constructor(
    readonly status: 413 | 422,
    readonly code:
      | "terrain-too-large"
      | "outlet-outside"
      | "outlet-on-nodata"
      | "outlets-same-cell"
      | "snap-radius",
    message: string,
  ) {
    super(message);
    this.name = "TerrainFlowError";
  }
}

/**
 * Largest grid the engine computes: 10,000 × 10,000 cells. The pipeline needs about 19 bytes a
 * cell at its peak (route.ts), so 1.9 GB here; the limit keeps one terrain from taking the
 * server's memory.
 */
export const MAX_CELLS = 100_000_000;

export function checkGridSize(width: number, height: number, file: string): void {
  const cells = width * height;
  if (cells > MAX_CELLS) {
    throw new TerrainFlowError(
      413,
      "terrain-too-large",
      `${file} has ${width.toLocaleString("en-US")} × ${height.toLocaleString("en-US")} = ` +
        `${cells.toLocaleString("en-US")} cells; delineation reads at most ` +
        `${MAX_CELLS.toLocaleString("en-US")} (10,000 × 10,000). Clip it to the area of interest ` +
        "or resample it to larger cells.",
    );
  }
}
