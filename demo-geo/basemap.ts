/**
 * The invented basemap of the demo area (basemap.geojson): what a general map of the place would
 * show under a project's own layers. Roads, buildings and the swale come from the same invented
 * site as the cover and channel (so they line up), a county road and a creek carry the map past
 * the site's edge, contours come from the analytic ground (contours.ts), and the place names are
 * made up. Nothing here describes a real place. Each feature's `layer` is the vector-tile
 * source-layer it is served in (roads, streams, buildings, contours, places).
 */
import type { Feature, Geometry, Polygon, Position } from "geojson";
import { contourLines } from "./contours";
import { coverPolygons } from "./cover";
import { channelLine } from "./paths";
import { lonLatOf, thalwegX, type XY } from "./site";

export const BASEMAP_FILE = "basemap.geojson";

/** The county road runs east–west just south of the site; Terrace Road meets it. */
const COUNTY_ROAD_Y = -12;
const COUNTY_ROAD_WEST_X = -180;
const COUNTY_ROAD_EAST_X = 700;
/** The swale's outfall continues south of the site as a creek. */
const CREEK_END_Y = -160;
const CREEK_STEP_M = 10;

const PLACES: { name: string; kind: string; at: XY }[] = [
  { name: "Harrow Hill", kind: "hill", at: [60, 440] },
  { name: "Harrow Hill Terraces", kind: "neighbourhood", at: [292, 300] },
  { name: "Pinfold Meadow", kind: "locality", at: [238, 190] },
  { name: "Long Commons", kind: "locality", at: [462, 150] },
];

type Props = Record<string, string | number | boolean | null>;

const line = (points: readonly XY[]): Geometry => ({
  type: "LineString",
  coordinates: points.map(lonLatOf),
});

function feature(layer: string, properties: Props, geometry: Geometry): Feature<Geometry, Props> {
  return { type: "Feature", properties: { layer, ...properties }, geometry };
}

/** [west, south, east, north] of a polygon's outer ring, local metres. */
function extent(polygon: Polygon): [number, number, number, number] {
  const ring = polygon.coordinates[0] ?? [];
  const xs = ring.map((p: Position) => p[0] ?? 0);
  const ys = ring.map((p: Position) => p[1] ?? 0);
  return [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)];
}

function roads(): Feature<Geometry, Props>[] {
  const cover = coverPolygons();
  const paved = cover.find((c) => c.landuse === "PAVED");
  if (!paved) throw new Error("demo basemap: the cover has no road");
  const [w, , e, n] = extent(paved.geometry);
  const roadX = (w + e) / 2;
  const drives = cover
    .filter((c) => c.landuse === "GRAVEL")
    .map((c, k) => {
      const [dw, ds, de, dn] = extent(c.geometry);
      const y = (ds + dn) / 2;
      return feature(
        "roads",
        { name: null, class: "driveway", ref: `drive ${k + 1}` },
        line([
          [dw, y],
          [de, y],
        ]),
      );
    });
  return [
    feature(
      "roads",
      { name: "Harrow Hill Road", class: "collector" },
      line([
        [COUNTY_ROAD_WEST_X, COUNTY_ROAD_Y],
        [roadX, COUNTY_ROAD_Y],
        [COUNTY_ROAD_EAST_X, COUNTY_ROAD_Y],
      ]),
    ),
    feature(
      "roads",
      { name: "Terrace Road", class: "street" },
      line([
        [roadX, COUNTY_ROAD_Y],
        [roadX, n],
      ]),
    ),
    ...drives,
  ];
}

function streams(): Feature<Geometry, Props>[] {
  const swale = channelLine();
  const outfall = swale[swale.length - 1];
  if (!outfall) throw new Error("demo basemap: the channel line is empty");
  const creek: XY[] = [outfall];
  for (let y = outfall[1] - CREEK_STEP_M; y >= CREEK_END_Y; y -= CREEK_STEP_M) {
    creek.push([thalwegX(y), y]);
  }
  return [
    feature("streams", { name: "Harrow Hill swale", class: "swale" }, line(swale)),
    feature("streams", { name: "Marrow Creek", class: "creek" }, line(creek)),
  ];
}

function buildings(): Feature<Geometry, Props>[] {
  return coverPolygons()
    .filter((c) => c.landuse === "ROOF")
    .map((c, k) =>
      feature(
        "buildings",
        { name: null, class: "house", ref: `house ${k + 1}` },
        {
          type: "Polygon",
          coordinates: c.geometry.coordinates.map((ring) =>
            ring.map(([x = 0, y = 0]) => lonLatOf([x, y])),
          ),
        },
      ),
    );
}

function contours(): Feature<Geometry, Props>[] {
  return contourLines().map((c) =>
    feature("contours", { elevation: c.elevationM, unit: "m", index: c.index }, line(c.points)),
  );
}

function places(): Feature<Geometry, Props>[] {
  return PLACES.map((p) =>
    feature(
      "places",
      { name: p.name, kind: p.kind },
      { type: "Point", coordinates: lonLatOf(p.at) },
    ),
  );
}

export function basemapFeatures(): Feature<Geometry, Props>[] {
  return [...contours(), ...streams(), ...roads(), ...buildings(), ...places()];
}

/** A FeatureCollection with one feature per line (a readable diff), saying it is invented. */
export function basemapGeoJson(): string {
  const about =
    "Invented basemap of the Rillmark demo area (Harrow Hill Terraces): roads, streams, " +
    "buildings, contours and place names are made up and describe no real place.";
  const lines = basemapFeatures().map((f) => JSON.stringify(f));
  return `{"type":"FeatureCollection","about":${JSON.stringify(about)},"features":[\n${lines.join(",\n")}\n]}\n`;
}
