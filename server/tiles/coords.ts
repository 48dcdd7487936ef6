/**
 * Tile addresses (z/x/y in the XYZ scheme maplibre requests) parsed with zod: zoom 0–24, x and y
 * inside the 2^z × 2^z grid of that zoom.
 */
import { z } from "zod";

export const MAX_TILE_ZOOM = 24;

const whole = (what: string) =>
  z.coerce
    .number({ message: `The tile ${what} must be a number.` })
    .int({ message: `The tile ${what} must be a whole number.` });

export const tileCoordsSchema = z
  .object({
    z: whole("zoom")
      .min(0, { message: `Use a zoom from 0 to ${MAX_TILE_ZOOM}.` })
      .max(MAX_TILE_ZOOM, { message: `Use a zoom from 0 to ${MAX_TILE_ZOOM}.` }),
    x: whole("column").min(0, { message: "The tile column cannot be negative." }),
    y: whole("row").min(0, { message: "The tile row cannot be negative." }),
  })
  .superRefine((t, ctx) => {
    const size = 2 ** t.z;
    if (t.x >= size) {
      ctx.addIssue({
        code: "custom",
        path: ["x"],
        message: `At zoom ${t.z} use a column below ${size}.`,
      });
    }
    if (t.y >= size) {
      ctx.addIssue({
        code: "custom",
        path: ["y"],
        message: `At zoom ${t.z} use a row below ${size}.`,
      });
    }
  });

export type TileCoords = z.output<typeof tileCoordsSchema>;

/** The tile's extent in WGS84 degrees, [west, south, east, north] (inverse Web Mercator). */
export function tileBounds4326({ z: zoom, x, y }: TileCoords): [number, number, number, number] {
  const n = 2 ** zoom;
  const lon = (col: number) => (col / n) * 360 - 180;
  const lat = (row: number) =>
    (Math.atan(Math.sinh(Math.PI * (1 - (2 * row) / n))) * 180) / Math.PI;
  return [lon(x), lat(y + 1), lon(x + 1), lat(y)];
}
