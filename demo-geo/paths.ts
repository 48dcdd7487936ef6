/**
 * The invented subcatchment "HH-1": its longest flow path, outlet, boundary, and the channel
 * line (the swale along the valley's thalweg), in local site metres (see site.ts).
 *
 * The path starts at the divide high on the wooded hillside, runs east-south-east down through
 * the woods, the meadow, a row of house lots (across a gravel drive) and the road, reaches the
 * swale at y = 300 m and follows it south to the outlet at y = 40 m: about 510 m in all.
 */
import { thalwegX, type XY } from "./site";

/** Where the path begins: on the subcatchment's divide. */
export const DIVIDE: XY = [140, 405];
/** Where the hillside leg meets the swale (a vertex of the channel line too). */
export const SWALE_JOIN_Y = 300;
export const OUTLET_Y = 40;
/** The channel line runs the valley from here south to CHANNEL_END_Y, one vertex per 10 m. */
const CHANNEL_START_Y = 500;
const CHANNEL_END_Y = 10;
const CHANNEL_STEP_M = 10;
const HILLSIDE_STEPS = 20;

function thalwegPoints(fromY: number, toY: number): XY[] {
  const out: XY[] = [];
  for (let y = fromY; y >= toY; y -= CHANNEL_STEP_M) out.push([thalwegX(y), y]);
  return out;
}

export const OUTLET: XY = [thalwegX(OUTLET_Y), OUTLET_Y];

/** The longest flow path, divide → outlet. */
export function flowPath(): XY[] {
  const join: XY = [thalwegX(SWALE_JOIN_Y), SWALE_JOIN_Y];
  const hillside: XY[] = [];
  for (let k = 0; k < HILLSIDE_STEPS; k += 1) {
    const t = k / HILLSIDE_STEPS;
    hillside.push([DIVIDE[0] + t * (join[0] - DIVIDE[0]), DIVIDE[1] + t * (join[1] - DIVIDE[1])]);
  }
  return [...hillside, ...thalwegPoints(SWALE_JOIN_Y, OUTLET_Y)];
}

/** The swale's centre line, upstream → downstream (north → south). */
export function channelLine(): XY[] {
  return thalwegPoints(CHANNEL_START_Y, CHANNEL_END_Y);
}

/**
 * The subcatchment boundary, counter-clockwise from the outlet, drawn by hand around the area
 * that drains to it; the divide point and the outlet are two of its vertices.
 */
export function boundaryRing(): XY[] {
  const ring: XY[] = [
    OUTLET,
    [412, 62],
    [432, 120],
    [450, 220],
    [456, 330],
    [440, 420],
    [390, 448],
    [300, 452],
    [200, 452],
    [132, 436],
    DIVIDE,
    [150, 340],
    [225, 245],
    [290, 160],
    [345, 75],
  ];
  return [...ring, OUTLET];
}
