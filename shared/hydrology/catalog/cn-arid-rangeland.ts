/**
 * Runoff curve numbers for arid and semiarid rangelands, TR-55 (1986) Table 2-2d
 * (ARC II, Ia = 0.2S). For range in humid regions use Table 2-2c.
 *
 * Footnotes [from memory]: poor < 30 % ground cover (litter, grass and brush overstory), fair
 * 30 % to 70 %, good > 70 %. Curve numbers for group A have been developed only for desert shrub;
 * the other covers carry null for A (the table prints a dash).
 */
import { cnRows, type CnRowSpec } from "./cn-row";
import { type HydrologicCondition } from "./types";

const row = cnRows("2-2d");
const G = "Arid and semiarid rangelands";

type Quad = CnRowSpec<string>["cn"];

const NO_A = "No CN for group A: Table 2-2d gives group A only for desert shrub.";

/** Poor, fair and good rows of one cover type, as the table prints them. */
function cover<const Id extends string>(
  id: Id,
  description: string,
  poor: Quad,
  fair: Quad,
  good: Quad,
) {
  const one = <const Cond extends HydrologicCondition>(condition: Cond, cn: Quad) =>
    row(G, {
      id: `${id}-${condition}` as const,
      cover: description,
      condition,
      cn,
      notes: cn[0] === null ? [NO_A] : [],
    });
  return [one("poor", poor), one("fair", fair), one("good", good)] as const;
}

export const CN_ARID_RANGELAND = [
  ...cover(
    "arid-herbaceous",
    "Herbaceous: mixture of grass, weeds and low-growing brush, with brush the minor element",
    [null, 80, 87, 93],
    [null, 71, 81, 89],
    [null, 62, 74, 85],
  ),
  ...cover(
    "arid-oak-aspen",
    "Oak-aspen: mountain brush mixture of oak brush, aspen, mountain mahogany, bitter brush, " +
      "maple and other brush",
    [null, 66, 74, 79],
    [null, 48, 57, 63],
    [null, 30, 41, 48],
  ),
  ...cover(
    "arid-pinyon-juniper",
    "Pinyon-juniper: pinyon, juniper, or both; grass understory",
    [null, 75, 85, 89],
    [null, 58, 73, 80],
    [null, 41, 61, 71],
  ),
  ...cover(
    "arid-sagebrush",
    "Sagebrush with grass understory",
    [null, 67, 80, 85],
    [null, 51, 63, 70],
    [null, 35, 47, 55],
  ),
  ...cover(
    "arid-desert-shrub",
    "Desert shrub: major plants include saltbush, greasewood, creosotebush, blackbrush, " +
      "bursage, palo verde, mesquite and cactus",
    [63, 77, 85, 88],
    [55, 72, 81, 86],
    [49, 68, 79, 84],
  ),
] as const;
