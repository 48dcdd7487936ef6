/**
 * scenario.json: everything the seed needs besides the files themselves — which file is which
 * layer, how the cover codes and soil groups map, the rainfall table's fields, the Design rules
 * and the subcatchment's channel section. Every value here is invented for the demo; a real
 * project takes its rules from the reviewing agency and its channel from survey and design.
 * Lengths follow the demo project's units (US customary: ft, in).
 */
import { IDF_NOTE, p2Depth24hIn } from "./rainfall";
import { CELL_M, NODATA, UTM_EPSG, UTM_NAME } from "./site";

export const OUT_FILES = {
  terrain: "terrain.tif",
  cover: "cover.zip",
  soils: "soils.geojson",
  channel: "channel.geojson",
  rainfall: "rainfall-idf.csv",
  subcatchment: "subcatchment.kml",
  scenario: "scenario.json",
} as const;

/** LANDUSE codes → the Surface catalog's default class keys (shared/hydrology/catalog). */
export const COVER_CLASS_BY_CODE = {
  WOODS: "woods-light",
  RANGE: "range-natural",
  LAWN: "lawn-good",
  ROOF: "roof",
  GRAVEL: "gravel",
  PAVED: "pavement",
  SWALE: "grass-swale",
} as const;

export const SUBCATCHMENT_NAME = "HH-1 Upper terraces";

export function scenarioDocument() {
  return {
    about:
      "Invented demo scenario for Rillmark: Harrow Hill Terraces. The place, terrain, cover, " +
      "soils, channel, rainfall and every number below are made up and describe no real site. " +
      "Results are design aids; local drainage criteria and the engineer of record govern.",
    crs: {
      projected: { epsg: UTM_EPSG, name: UTM_NAME },
      note: "cover.zip and terrain.tif are in the projected CRS; the other files in WGS84.",
    },
    layers: [
      {
        kind: "terrain",
        file: OUT_FILES.terrain,
        name: "Synthetic terrain, 2 m (invented)",
        verticalUnit: "m",
        cellSizeM: CELL_M,
        nodata: NODATA,
      },
      {
        kind: "cover",
        file: OUT_FILES.cover,
        name: "Land cover (invented county codes)",
        mappingField: "LANDUSE",
        mapping: COVER_CLASS_BY_CODE,
      },
      {
        kind: "soil",
        file: OUT_FILES.soils,
        name: "Soil map units (invented)",
        mappingField: "HSG",
        mapping: { B: "B", C: "C", "C/D": "C/D" },
      },
      { kind: "channel", file: OUT_FILES.channel, name: "Valley swale (invented)" },
    ],
    rainfall: {
      file: OUT_FILES.rainfall,
      name: "Harrow Hill invented IDF",
      kind: "intensity",
      sourceNote: IDF_NOTE,
      p2_24h: p2Depth24hIn(),
      p2Note: "Invented 2-year 24-hour depth (in), consistent with the invented 2-year curve.",
    },
    catalogOverrides: [
      {
        classKey: "gravel",
        note:
          "Invented for the demo: the published defaults leave C for gravel open (no HEC-22 " +
          "row), so the demo project sets one; a real project takes it from its local criteria.",
        values: {
          runoffC: {
            low: 0.4,
            high: 0.6,
            design: 0.5,
            source: "Invented demo value (no published row)",
            note: "Take C for gravel from the local drainage criteria.",
          },
        },
      },
    ],
    designRules: {
      note:
        "Invented demo Design rules; a real project takes them from the reviewing agency's " +
        "criteria.",
      rules: {
        minTcMin: 10,
        sheetFlowMaxLength: "100ft",
        kinematicWaveK: "theory-1.49",
        arc: "II",
        arcByReturnPeriod: { "100": "III" },
        arcMethod: "table",
        governing: "nrcs-segmental",
        frequencyFactor: true,
        allowIdfExtrapolation: false,
        lagCn: "path-weighted",
        manningConstant: "1.49",
      },
      dualHsg: "undrained",
      channelSlope: "10-85",
      profileSpacingM: 5,
    },
    subcatchment: {
      file: OUT_FILES.subcatchment,
      name: SUBCATCHMENT_NAME,
      scenario: "existing",
      note:
        "Invented demo subcatchment: woods, meadow, house lots and a road draining to a grassed " +
        "swale. Boundary, outlet and longest flow path come from subcatchment.kml.",
      channel: {
        manningN: 0.035,
        section: { shape: "trapezoid", bottomWidth: 2, sideSlope: 4, depth: 0.5 },
      },
      channelNote:
        "Invented grassed trapezoidal swale: 2 ft bottom, 4H:1V sides, 0.5 ft flow depth, " +
        "Manning's n 0.035 (a demo value, not a survey).",
    },
  };
}
