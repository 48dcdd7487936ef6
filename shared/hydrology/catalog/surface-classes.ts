/**
 * Default Surface catalog classes: the land covers a flow path crosses and a subcatchment is
 * made of, each with sheet-flow n (TR-55 Table 3-1), velocity k (NEH 630 Table 15-3), TR-55
 * paved/unpaved k, Kerby N, CN by HSG (TR-55 Tables 2-2a to 2-2d) and runoff C (HEC-22
 * Table 3-1). Every number is copied from its table row with that row's source; which row goes
 * with which cover is Rillmark's default choice, stated in each field's note, and the team edits
 * it in its own catalog. Where no published row fits, the field is a gap with the reason.
 */
import { cn, gap, kerby, nehK, runoffC, sheetN, tr55K } from "./surface-picks";
import { type SurfaceClass } from "./types";

const C_NO_ROW = "FHWA HEC-22 (3rd ed., 2009) Table 3-1 has no row for this cover [from memory]";
const C_GAP_NOTE = "Enter C from the local drainage criteria or a rural C table by soil and slope";
const LAWN_C =
  "HEC-22 lawn rows vary with soil (sandy / heavy) and slope (flat < 2 %, average 2 % to 7 %, " +
  "steep > 7 %); the default takes heavy soil, average slope, pick the row for the site";
const UNIMPROVED_C = "Nearest HEC-22 row for undeveloped land";

const IMPERVIOUS = {
  sheetFlowN: sheetN("smooth"),
  velocityK: nehK("neh-pavement-upland-gullies"),
  shallowFlowK: tr55K("paved"),
  kerbyN: kerby("smooth-impervious"),
  curveNumber: cn("urban-impervious-paved-lots-roofs"),
} as const;

const LAWN = {
  velocityK: nehK("neh-short-grass-pasture"),
  shallowFlowK: tr55K("unpaved"),
  runoffC: runoffC("lawn-heavy-average", LAWN_C),
} as const;

export const SURFACE_CLASSES: readonly SurfaceClass[] = [
  {
    id: "pavement",
    name: "Asphalt paving",
    description: "Asphalt streets, parking and other paved areas",
    ...IMPERVIOUS,
    runoffC: runoffC("street-asphalt"),
  },
  {
    id: "concrete",
    name: "Concrete paving",
    description: "Concrete streets, slabs and paved yards",
    ...IMPERVIOUS,
    runoffC: runoffC("street-concrete"),
  },
  {
    id: "roof",
    name: "Roofs",
    description: "Building roofs draining to the surface or to the drainage system",
    ...IMPERVIOUS,
    runoffC: runoffC("roofs"),
  },
  {
    id: "drive-walk",
    name: "Driveways and walks",
    description: "Driveways, sidewalks and paths",
    ...IMPERVIOUS,
    runoffC: runoffC("drives-walks"),
  },
  {
    id: "gravel",
    name: "Gravel surface",
    description: "Gravel roads, lots and yards",
    sheetFlowN: sheetN("smooth", "TR-55 Table 3-1 lists gravel among smooth surfaces"),
    velocityK: nehK("neh-nearly-bare-untilled", "Nearest row: unpaved, nearly bare surface"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("bare-packed-soil", "Nearest row: smooth bare packed surface"),
    curveNumber: cn("urban-street-gravel", "Gravel roads, taken for gravel surfaces generally"),
    runoffC: gap(C_NO_ROW, C_GAP_NOTE),
  },
  {
    id: "bare-soil",
    name: "Bare graded soil",
    description: "Graded or compacted earth without vegetation, e.g. during construction",
    sheetFlowN: sheetN("smooth", "TR-55 Table 3-1 lists bare soil among smooth surfaces"),
    velocityK: nehK("neh-nearly-bare-untilled"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("bare-packed-soil"),
    curveNumber: cn("urban-newly-graded"),
    runoffC: gap(C_NO_ROW, C_GAP_NOTE),
  },
  {
    id: "lawn-good",
    name: "Lawn, good cover",
    description: "Maintained lawn or turf with grass cover over 75 %",
    sheetFlowN: sheetN("grass-dense", "Dense maintained turf"),
    kerbyN: kerby("average-grass"),
    curveNumber: cn("urban-open-space-good"),
    ...LAWN,
  },
  {
    id: "lawn-fair",
    name: "Lawn, fair cover",
    description: "Lawn or open space with grass cover of 50 % to 75 %",
    sheetFlowN: sheetN("grass-short-prairie", "Thinner grass than a dense lawn"),
    kerbyN: kerby("average-grass"),
    curveNumber: cn("urban-open-space-fair"),
    ...LAWN,
  },
  {
    id: "lawn-poor",
    name: "Lawn, poor cover",
    description: "Lawn or open space with grass cover under 50 %",
    sheetFlowN: sheetN("grass-short-prairie", "Sparse grass"),
    kerbyN: kerby("poor-grass"),
    curveNumber: cn("urban-open-space-poor"),
    ...LAWN,
  },
  {
    id: "turf-bermuda",
    name: "Bermudagrass turf",
    description: "Dense Bermudagrass lawn, sports turf or grassed slope",
    sheetFlowN: sheetN("grass-bermuda"),
    kerbyN: kerby("dense-grass-conifer", "Dense grass"),
    curveNumber: cn("urban-open-space-good"),
    ...LAWN,
  },
  {
    id: "grass-swale",
    name: "Grassed swale",
    description: "Grass-lined swale or waterway carrying concentrated flow",
    sheetFlowN: sheetN("grass-dense"),
    velocityK: nehK("neh-grassed-waterway"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("average-grass"),
    curveNumber: cn("urban-open-space-good"),
    runoffC: runoffC("lawn-heavy-average", LAWN_C),
  },
  {
    id: "pasture-good",
    name: "Pasture, good",
    description: "Grazed grassland with ground cover over 75 %, lightly grazed",
    sheetFlowN: sheetN("grass-short-prairie"),
    velocityK: nehK("neh-short-grass-pasture"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("average-grass"),
    curveNumber: cn("ag-pasture-good"),
    runoffC: runoffC("unimproved", UNIMPROVED_C),
  },
  {
    id: "pasture-poor",
    name: "Pasture, poor",
    description: "Heavily grazed grassland with ground cover under 50 %",
    sheetFlowN: sheetN("grass-short-prairie"),
    velocityK: nehK("neh-short-grass-pasture"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("poor-grass"),
    curveNumber: cn("ag-pasture-poor"),
    runoffC: runoffC("unimproved", UNIMPROVED_C),
  },
  {
    id: "meadow",
    name: "Hay meadow",
    description: "Continuous grass protected from grazing, mowed for hay",
    sheetFlowN: sheetN("grass-dense"),
    velocityK: nehK("neh-forest-litter-hay-meadow"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("dense-grass-conifer", "Dense grass"),
    curveNumber: cn("ag-meadow"),
    runoffC: runoffC("unimproved", UNIMPROVED_C),
  },
  {
    id: "range-natural",
    name: "Natural range",
    description: "Unimproved native grassland in a humid region, fair condition",
    sheetFlowN: sheetN("range-natural"),
    velocityK: nehK("neh-short-grass-pasture"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("average-grass"),
    curveNumber: cn("ag-pasture-fair", "Range in humid regions takes Table 2-2c"),
    runoffC: runoffC("unimproved", UNIMPROVED_C),
  },
  {
    id: "desert-shrub",
    name: "Desert shrub",
    description: "Arid or semiarid shrubland (saltbush, creosotebush, mesquite), fair condition",
    sheetFlowN: sheetN("range-natural"),
    velocityK: nehK("neh-nearly-bare-untilled", "Includes alluvial fans in western regions"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("poor-grass", "Moderately rough, sparsely covered surface"),
    curveNumber: cn("arid-desert-shrub-fair"),
    runoffC: runoffC("unimproved", UNIMPROVED_C),
  },
  {
    id: "woods-light",
    name: "Woods, light underbrush",
    description: "Woodland with light underbrush, grazed but not burned, some litter",
    sheetFlowN: sheetN("woods-light-underbrush"),
    velocityK: nehK("neh-min-tillage-woodland"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("deciduous-timber"),
    curveNumber: cn("ag-woods-fair", "Light underbrush read as fair condition"),
    runoffC: runoffC("unimproved", UNIMPROVED_C),
  },
  {
    id: "woods-dense",
    name: "Woods, dense underbrush",
    description: "Woodland protected from grazing, with litter and brush covering the soil",
    sheetFlowN: sheetN("woods-dense-underbrush"),
    velocityK: nehK("neh-forest-litter-hay-meadow"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("dense-grass-conifer", "Timberland with deep forest litter"),
    curveNumber: cn("ag-woods-good", "Dense underbrush read as good condition"),
    runoffC: runoffC("unimproved", UNIMPROVED_C),
  },
  {
    id: "cultivated-row",
    name: "Row crops, straight rows",
    description: "Cultivated row crops in straight rows, little residue, good condition",
    sheetFlowN: sheetN("cultivated-residue-le-20"),
    velocityK: nehK("neh-cultivated-straight-row"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("poor-grass"),
    curveNumber: cn("cult-row-sr-good"),
    runoffC: gap(C_NO_ROW, C_GAP_NOTE),
  },
  {
    id: "cultivated-residue",
    name: "Row crops with residue",
    description: "Conservation-tilled row crops with residue cover over 20 %, good condition",
    sheetFlowN: sheetN("cultivated-residue-gt-20"),
    velocityK: nehK("neh-min-tillage-woodland"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("poor-grass"),
    curveNumber: cn("cult-row-sr-cr-good"),
    runoffC: gap(C_NO_ROW, C_GAP_NOTE),
  },
  {
    id: "fallow",
    name: "Fallow field",
    description: "Tilled bare field without residue",
    sheetFlowN: sheetN("fallow"),
    velocityK: nehK("neh-nearly-bare-untilled", "Nearest row: nearly bare surface"),
    shallowFlowK: tr55K("unpaved"),
    kerbyN: kerby("poor-grass", "Moderately rough bare surface"),
    curveNumber: cn("cult-fallow-bare-soil"),
    runoffC: gap(C_NO_ROW, C_GAP_NOTE),
  },
  {
    id: "water",
    name: "Open water",
    description: "Ponds, lakes and wide channels with a free water surface",
    sheetFlowN: gap(
      "TR-55 (1986) Table 3-1 has no water row: flow over open water is not sheet flow",
      "Route travel through a pond or lake as storage or channel flow",
    ),
    velocityK: gap(
      "NEH 630 Ch 15 (2010) Table 15-3 has no water row",
      "Use a channel section with Manning's equation for flow along a stream or ditch",
    ),
    shallowFlowK: gap(
      "TR-55 (1986) Figure 3-1 covers paved and unpaved surfaces only",
      "Not a shallow concentrated flow surface",
    ),
    kerbyN: gap("Kerby (1959) covers overland flow surfaces only", "Not an overland surface"),
    curveNumber: {
      rowId: null,
      value: { A: 98, B: 98, C: 98, D: 98 },
      source:
        "Common practice: rain on open water taken as CN 98 like impervious areas (TR-55 (1986) " +
        "Table 2-2 has no water row)",
      note: "Some agencies use CN 100 for water; follow the local criteria",
    },
    runoffC: gap(C_NO_ROW, C_GAP_NOTE),
  },
];

export function surfaceClass(id: string): SurfaceClass | undefined {
  return SURFACE_CLASSES.find((c) => c.id === id);
}
