/**
 * Runoff curve numbers for cultivated agricultural lands, TR-55 (1986) Table 2-2b
 * (ARC II, Ia = 0.2S).
 *
 * Footnotes [from memory]: crop residue cover (CR) applies only if residue is on at least 5 % of
 * the surface throughout the year. Hydrologic condition combines canopy density, year-round
 * cover, amount of grass or close-seeded legumes, residue cover (good ≥ 20 %) and surface
 * roughness; poor factors impair infiltration, good factors encourage it.
 */
import { cnRows, type CnRowSpec } from "./cn-row";
import { type HydrologicCondition } from "./types";

const row = cnRows("2-2b");

type Quad = CnRowSpec<string>["cn"];

const SR = "Straight row (SR)";
const SR_CR = "SR + crop residue cover (CR)";
const C = "Contoured (C)";
const C_CR = "C + CR";
const CT = "Contoured & terraced (C&T)";
const CT_CR = "C&T + CR";

/** A poor/good pair of rows for one cover and treatment, as the table prints them. */
function pair<const Id extends string>(
  group: string,
  id: Id,
  treatment: string,
  poor: Quad,
  good: Quad,
) {
  const one = <const Cond extends HydrologicCondition>(condition: Cond, cn: Quad) =>
    row(group, { id: `${id}-${condition}` as const, cover: group, treatment, condition, cn });
  return [one("poor", poor), one("good", good)] as const;
}

const ROW_CROPS = "Row crops";
const SMALL_GRAIN = "Small grain";
const LEGUMES = "Close-seeded or broadcast legumes or rotation meadow";

export const CN_CULTIVATED = [
  row("Fallow", {
    id: "cult-fallow-bare-soil",
    cover: "Fallow",
    treatment: "Bare soil",
    cn: [77, 86, 91, 94],
  }),
  row("Fallow", {
    id: "cult-fallow-cr-poor",
    cover: "Fallow",
    treatment: "Crop residue cover (CR)",
    condition: "poor",
    cn: [76, 85, 90, 93],
  }),
  row("Fallow", {
    id: "cult-fallow-cr-good",
    cover: "Fallow",
    treatment: "Crop residue cover (CR)",
    condition: "good",
    cn: [74, 83, 88, 90],
  }),
  ...pair(ROW_CROPS, "cult-row-sr", SR, [72, 81, 88, 91], [67, 78, 85, 89]),
  ...pair(ROW_CROPS, "cult-row-sr-cr", SR_CR, [71, 80, 87, 90], [64, 75, 82, 85]),
  ...pair(ROW_CROPS, "cult-row-c", C, [70, 79, 84, 88], [65, 75, 82, 86]),
  ...pair(ROW_CROPS, "cult-row-c-cr", C_CR, [69, 78, 83, 87], [64, 74, 81, 85]),
  ...pair(ROW_CROPS, "cult-row-ct", CT, [66, 74, 80, 82], [62, 71, 78, 81]),
  ...pair(ROW_CROPS, "cult-row-ct-cr", CT_CR, [65, 73, 79, 81], [61, 70, 77, 80]),
  ...pair(SMALL_GRAIN, "cult-grain-sr", SR, [65, 76, 84, 88], [63, 75, 83, 87]),
  ...pair(SMALL_GRAIN, "cult-grain-sr-cr", SR_CR, [64, 75, 83, 86], [60, 72, 80, 84]),
  ...pair(SMALL_GRAIN, "cult-grain-c", C, [63, 74, 82, 85], [61, 73, 81, 84]),
  ...pair(SMALL_GRAIN, "cult-grain-c-cr", C_CR, [62, 73, 81, 84], [60, 72, 80, 83]),
  ...pair(SMALL_GRAIN, "cult-grain-ct", CT, [61, 72, 79, 82], [59, 70, 78, 81]),
  ...pair(SMALL_GRAIN, "cult-grain-ct-cr", CT_CR, [60, 71, 78, 81], [58, 69, 77, 80]),
  ...pair(LEGUMES, "cult-legumes-sr", SR, [66, 77, 85, 89], [58, 72, 81, 85]),
  ...pair(LEGUMES, "cult-legumes-c", C, [64, 75, 83, 85], [55, 69, 78, 83]),
  ...pair(LEGUMES, "cult-legumes-ct", CT, [63, 73, 80, 83], [51, 67, 76, 80]),
] as const;
