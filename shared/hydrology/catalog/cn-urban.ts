/**
 * Runoff curve numbers for urban areas, TR-55 (1986) Table 2-2a (ARC II, Ia = 0.2S).
 *
 * Footnote 2 [from memory]: the composite CNs of the urban districts assume impervious areas
 * directly connected to the drainage system, impervious CN 98, and pervious areas equivalent to
 * open space in good hydrologic condition, at the tabulated average percent impervious. For
 * other impervious fractions or unconnected impervious areas, TR-55 Figures 2-3 and 2-4 apply.
 */
import { cnRows } from "./cn-row";

const row = cnRows("2-2a");

const OPEN = "Fully developed urban areas (vegetation established): open space";
const IMPERVIOUS = "Fully developed urban areas: impervious areas";
const STREETS = "Fully developed urban areas: streets and roads";
const DESERT = "Western desert urban areas";
const DISTRICTS = "Urban districts";
const RESIDENTIAL = "Residential districts by average lot size";
const DEVELOPING = "Developing urban areas";

const OPEN_NOTE =
  "Lawns, parks, golf links, cemeteries, etc. Footnote 3: CNs are equivalent to those of " +
  "pasture; composite CNs may be computed for other combinations of open space cover type.";

export const CN_URBAN = [
  row(OPEN, {
    id: "urban-open-space-poor",
    cover: "Open space, poor condition (grass cover < 50 %)",
    condition: "poor",
    cn: [68, 79, 86, 89],
    notes: [OPEN_NOTE],
  }),
  row(OPEN, {
    id: "urban-open-space-fair",
    cover: "Open space, fair condition (grass cover 50 % to 75 %)",
    condition: "fair",
    cn: [49, 69, 79, 84],
    notes: [OPEN_NOTE],
  }),
  row(OPEN, {
    id: "urban-open-space-good",
    cover: "Open space, good condition (grass cover > 75 %)",
    condition: "good",
    cn: [39, 61, 74, 80],
    notes: [OPEN_NOTE],
    corroborated: true,
  }),
  row(IMPERVIOUS, {
    id: "urban-impervious-paved-lots-roofs",
    cover: "Paved parking lots, roofs, driveways, etc. (excluding right-of-way)",
    cn: [98, 98, 98, 98],
    corroborated: true,
  }),
  row(STREETS, {
    id: "urban-street-paved-curbs-sewers",
    cover: "Paved; curbs and storm sewers (excluding right-of-way)",
    cn: [98, 98, 98, 98],
  }),
  row(STREETS, {
    id: "urban-street-paved-open-ditches",
    cover: "Paved; open ditches (including right-of-way)",
    cn: [83, 89, 92, 93],
  }),
  row(STREETS, {
    id: "urban-street-gravel",
    cover: "Gravel (including right-of-way)",
    cn: [76, 85, 89, 91],
  }),
  row(STREETS, {
    id: "urban-street-dirt",
    cover: "Dirt (including right-of-way)",
    cn: [72, 82, 87, 89],
  }),
  row(DESERT, {
    id: "urban-desert-natural-landscaping",
    cover: "Natural desert landscaping (pervious areas only)",
    cn: [63, 77, 85, 88],
    notes: [
      "Footnote 4: pervious area CNs are taken as desert shrub in poor hydrologic condition; " +
        "compute composites with Figure 2-3 or 2-4 from the impervious percentage (CN 98).",
    ],
  }),
  row(DESERT, {
    id: "urban-desert-artificial-landscaping",
    cover:
      "Artificial desert landscaping (impervious weed barrier, desert shrub with 1- to 2-inch " +
      "sand or gravel mulch and basin borders)",
    cn: [96, 96, 96, 96],
  }),
  row(DISTRICTS, {
    id: "urban-commercial-business",
    cover: "Commercial and business",
    imperviousPercent: 85,
    cn: [89, 92, 94, 95],
    corroborated: true,
  }),
  row(DISTRICTS, {
    id: "urban-industrial",
    cover: "Industrial",
    imperviousPercent: 72,
    cn: [81, 88, 91, 93],
  }),
  row(RESIDENTIAL, {
    id: "urban-residential-1-8-ac",
    cover: "1/8 acre or less (town houses)",
    imperviousPercent: 65,
    cn: [77, 85, 90, 92],
  }),
  row(RESIDENTIAL, {
    id: "urban-residential-1-4-ac",
    cover: "1/4 acre",
    imperviousPercent: 38,
    cn: [61, 75, 83, 87],
    corroborated: true,
  }),
  row(RESIDENTIAL, {
    id: "urban-residential-1-3-ac",
    cover: "1/3 acre",
    imperviousPercent: 30,
    cn: [57, 72, 81, 86],
  }),
  row(RESIDENTIAL, {
    id: "urban-residential-1-2-ac",
    cover: "1/2 acre",
    imperviousPercent: 25,
    cn: [54, 70, 80, 85],
  }),
  row(RESIDENTIAL, {
    id: "urban-residential-1-ac",
    cover: "1 acre",
    imperviousPercent: 20,
    cn: [51, 68, 79, 84],
  }),
  row(RESIDENTIAL, {
    id: "urban-residential-2-ac",
    cover: "2 acres",
    imperviousPercent: 12,
    cn: [46, 65, 77, 82],
  }),
  row(DEVELOPING, {
    id: "urban-newly-graded",
    cover: "Newly graded areas (pervious areas only, no vegetation)",
    cn: [77, 86, 91, 94],
    notes: [
      "Footnote 5: for temporary measures during grading and construction, compute composites " +
        "with Figure 2-3 or 2-4 from the degree of development and the newly graded CN.",
    ],
  }),
  row(DEVELOPING, {
    id: "urban-idle-lands",
    cover: "Idle lands",
    cn: [null, null, null, null],
    notes: [
      "The table gives no CNs for idle lands: determine them with cover types similar to " +
        "those in Table 2-2c.",
    ],
  }),
] as const;
