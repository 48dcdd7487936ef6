/**
 * Route-table rows of the map's tile routes: every role of the team reads tiles; the tile asked
 * for lies far from the fixture's data, so the answers are 204 (an empty tile) once access is
 * granted. The terrain layer row has no file behind it: a tile off its extent never opens one.
 */
import type { Db } from "../../server/db/client";
import { layers } from "../../server/db/schema-geodata";
import type { Caller, RouteCase } from "./route-table";

const table = (...s: [number, number, number, number, number, number]): Record<Caller, number> => ({
  owner: s[0],
  admin: s[1],
  engineer: s[2],
  gis: s[3],
  reviewer: s[4],
  viewer: s[5],
  anonymous: 401,
});
const EMPTY = table(204, 204, 204, 204, 204, 204);
// A z 15 tile in central Europe; the fixtures' shapes lie near 122° W.
const FAR = "15/17294/11165";

async function freshTerrainLayer(db: Db, projectId: string): Promise<string> {
  const [row] = await db
    .insert(layers)
    .values({
      projectId,
      kind: "terrain",
      name: "Route test terrain",
      format: "geotiff",
      originalFilename: "route.tif",
      sizeBytes: 1,
      objectKey: `tests/${projectId}/route-terrain.tif`,
      status: "ready",
      terrain: {
        epsg: 4326,
        crsName: "WGS 84",
        width: 10,
        height: 10,
        originX: -122.4,
        originY: 37.71,
        pixelSizeX: 0.001,
        pixelSizeY: 0.001,
        rasterType: "area",
        nodata: null,
        verticalUnit: "m",
        bbox4326: [-122.4, 37.7, -122.39, 37.71],
        blockWidth: 10,
        blockHeight: 10,
        tiled: false,
      },
    })
    .returning({ id: layers.id });
  if (!row) throw new Error("layer insert returned no row");
  return row.id;
}

export const MAP_ROUTE_CASES: RouteCase[] = [
  {
    method: "get",
    route: "/api/projects/:projectId/tiles/:z/:x/:y.mvt",
    teamScoped: true,
    prepare: async (f) => ({ path: `/api/projects/${f.projectId}/tiles/${FAR}.mvt` }),
    expected: EMPTY,
  },
  {
    method: "get",
    route: "/api/layers/:layerId/terrain/:z/:x/:y.png",
    teamScoped: true,
    prepare: async (f) => ({
      path: `/api/layers/${await freshTerrainLayer(f.db, f.projectId)}/terrain/${FAR}.png`,
    }),
    expected: EMPTY,
  },
  {
    method: "get",
    route: "/api/basemap/tiles/:z/:x/:y.mvt",
    teamScoped: false,
    prepare: async () => ({ path: `/api/basemap/tiles/${FAR}.mvt` }),
    expected: EMPTY,
  },
  {
    method: "get",
    route: "/api/basemap/archive.pmtiles",
    teamScoped: false,
    // No archive is configured in tests: signed in, the answer is "not found".
    prepare: async () => ({ path: "/api/basemap/archive.pmtiles" }),
    expected: table(404, 404, 404, 404, 404, 404),
  },
];
