/**
 * Runoff curve numbers for other agricultural lands, TR-55 (1986) Table 2-2c
 * (ARC II, Ia = 0.2S). Also the table to use for range in humid regions and for idle lands.
 */
import { cnRows, FLOOR_30_NOTE } from "./cn-row";

const row = cnRows("2-2c");
const G = "Other agricultural lands";

const PASTURE = "Pasture, grassland, or range: continuous forage for grazing";
const PASTURE_NOTE =
  "Footnote 2 [from memory]: poor < 50 % ground cover or heavily grazed with no mulch; fair " +
  "50 % to 75 % ground cover and not heavily grazed; good > 75 % ground cover and lightly or " +
  "only occasionally grazed.";
const BRUSH = "Brush: brush-weed-grass mixture with brush the major element";
const BRUSH_NOTE =
  "Footnote 3 [from memory]: poor < 50 % ground cover; fair 50 % to 75 %; good > 75 %.";
const WOODS_GRASS = "Woods-grass combination (orchard or tree farm)";
const WOODS_GRASS_NOTE =
  "Footnote 5 [from memory]: computed for areas with 50 % woods and 50 % grass (pasture) " +
  "cover; other combinations may be computed from the CNs for woods and pasture.";
const WOODS = "Woods";
const WOODS_NOTE =
  "Footnote 6 [from memory]: poor, forest litter, small trees and brush destroyed by heavy " +
  "grazing or regular burning; fair, woods grazed but not burned, some forest litter covers " +
  "the soil; good, woods protected from grazing, litter and brush adequately cover the soil.";

export const CN_OTHER_AGRICULTURAL = [
  row(G, {
    id: "ag-pasture-poor",
    cover: PASTURE,
    condition: "poor",
    cn: [68, 79, 86, 89],
    notes: [PASTURE_NOTE],
  }),
  row(G, {
    id: "ag-pasture-fair",
    cover: PASTURE,
    condition: "fair",
    cn: [49, 69, 79, 84],
    notes: [PASTURE_NOTE],
  }),
  row(G, {
    id: "ag-pasture-good",
    cover: PASTURE,
    condition: "good",
    cn: [39, 61, 74, 80],
    notes: [PASTURE_NOTE],
    corroborated: true,
  }),
  row(G, {
    id: "ag-meadow",
    cover: "Meadow: continuous grass, protected from grazing and generally mowed for hay",
    cn: [30, 58, 71, 78],
    flooredAt30: ["A"],
    notes: [FLOOR_30_NOTE],
    corroborated: true,
  }),
  row(G, {
    id: "ag-brush-poor",
    cover: BRUSH,
    condition: "poor",
    cn: [48, 67, 77, 83],
    notes: [BRUSH_NOTE],
  }),
  row(G, {
    id: "ag-brush-fair",
    cover: BRUSH,
    condition: "fair",
    cn: [35, 56, 70, 77],
    notes: [BRUSH_NOTE],
  }),
  row(G, {
    id: "ag-brush-good",
    cover: BRUSH,
    condition: "good",
    cn: [30, 48, 65, 73],
    flooredAt30: ["A"],
    notes: [BRUSH_NOTE, FLOOR_30_NOTE],
    corroborated: true,
  }),
  row(G, {
    id: "ag-woods-grass-poor",
    cover: WOODS_GRASS,
    condition: "poor",
    cn: [57, 73, 82, 86],
    notes: [WOODS_GRASS_NOTE],
  }),
  row(G, {
    id: "ag-woods-grass-fair",
    cover: WOODS_GRASS,
    condition: "fair",
    cn: [43, 65, 76, 82],
    notes: [WOODS_GRASS_NOTE],
  }),
  row(G, {
    id: "ag-woods-grass-good",
    cover: WOODS_GRASS,
    condition: "good",
    cn: [32, 58, 72, 79],
    notes: [WOODS_GRASS_NOTE],
  }),
  row(G, {
    id: "ag-woods-poor",
    cover: WOODS,
    condition: "poor",
    cn: [45, 66, 77, 83],
    notes: [WOODS_NOTE],
  }),
  row(G, {
    id: "ag-woods-fair",
    cover: WOODS,
    condition: "fair",
    cn: [36, 60, 73, 79],
    notes: [WOODS_NOTE],
  }),
  row(G, {
    id: "ag-woods-good",
    cover: WOODS,
    condition: "good",
    cn: [30, 55, 70, 77],
    flooredAt30: ["A"],
    notes: [WOODS_NOTE, FLOOR_30_NOTE],
    corroborated: true,
  }),
  row(G, {
    id: "ag-farmsteads",
    cover: "Farmsteads: buildings, lanes, driveways and surrounding lots",
    cn: [59, 74, 82, 86],
  }),
] as const;
