/**
 * Overland (sheet) flow across several surfaces: how the times of consecutive sheet segments
 * combine. The split by cover cuts one overland plane into pieces; computing each piece as its
 * own plane starting from zero flow lengthens the path's time with no change on the ground
 * (a uniform plane cut into N pieces: N^0.4 longer by the kinematic wave, N^0.2 by TR-55).
 *
 * Kinematic wave, planes in series ("cascade") [derived]:
 *   Manning friction on a wide plane: q = α·h^m, m = 5/3, α = kM·√S/n (kM = 1.49 ft^(1/3)/s);
 *   continuity ∂h/∂t + ∂q/∂x = i. In characteristic form, along dx/dt = c(q) = dq/dh:
 *   dq/dx = i. The characteristic leaving the divide (x = 0, q = 0) therefore carries
 *   q = i·x whatever the planes it crosses, and its travel time is
 *     t(X) = ∫₀^X dx / c(i·x),   c(q) = m·α^(1/m)·q^((m−1)/m).
 *   On plane j (X_{j−1} < x ≤ X_j, constant α_j), with 1/m = 0.6 and (m−1)/m = 0.4:
 *     t_j = ∫ dx / (m·α_j^0.6·(i·x)^0.4) = (X_j^0.6 − X_{j−1}^0.6) / (α_j^0.6·i^0.4)
 *   and in the units of the printed equation (tc min, L ft, i in/h), with K as for one plane:
 *     tc = (K / i^0.4) · Σ_j (n_j/√S_j)^0.6 · (X_j^0.6 − X_{j−1}^0.6),   X_j cumulative length.
 *   One plane (X_0 = 0) gives K·(n·L)^0.6/(i^0.4·S^0.3); a uniform plane cut anywhere gives the
 *   uncut plane's time exactly, because the sum telescopes.
 * Kinematic wave, "independent": tc = (K/i^0.4)·Σ (n_j·L_j)^0.6/S_j^0.3, each segment a plane of
 *   its own starting from zero flow, as some manuals print it.
 *
 * TR-55 sheet flow, Tt = 0.007·(n·L)^0.8/(P2^0.5·s^0.4) h (TR-55 (1986) eq 3-3):
 *   "cascade" (an extension, not in TR-55) [derived]: (n·L)^0.8/s^0.4 is exactly
 *   [(n·L)^0.6/s^0.3]^(4/3), i.e. eq 3-3 is the kinematic solution above for one plane with
 *   the intensity tied to the duration (i ∝ t^−0.625 makes tc ∝ coefficient^(4/3)). For planes
 *   in series the kinematic coefficient of the path is C = Σ (n_j/√s_j)^0.6·(X_j^0.6 − X_{j−1}^0.6),
 *   so the same assumptions give Tt = 0.007·C^(4/3)/P2^0.5. Segment times share Tt in proportion
 *   to their part of C (one storm, one intensity along the path). Swapping the exponents inside
 *   the sum instead (Σ (n/√s)^0.8·(X_j^0.8 − X_{j−1}^0.8)) has no such derivation and is not used.
 *   "weighted-n" (common practice): one plane of the total length with the length-weighted n
 *   and the fall over length as slope; segment times are the arrival-time differences on that
 *   plane, Tt·[(X_j/L)^0.8 − (X_{j−1}/L)^0.8].
 *   "independent": eq 3-3 on each segment as its own plane.
 * Every option gives the uncut plane's time for a uniform plane; only "independent" does not.
 * Validity: sheet flow at the top of the path, within the sheet-flow cap of the design rules.
 */
import { sheetFlowTravelTimeHr, TR55_SHEET_COEFF_US } from "./tr55-sheet";

export const OVERLAND_SERIES = ["cascade", "independent"] as const;
export const SHEET_FLOW_SERIES = ["cascade", "weighted-n", "independent"] as const;
export type OverlandSeries = (typeof OVERLAND_SERIES)[number];
export type SheetFlowSeries = (typeof SHEET_FLOW_SERIES)[number];

/** One overland plane: Manning's n for sheet flow, length (ft) and slope (ft/ft). */
export interface Plane {
  readonly n: number;
  readonly lengthFt: number;
  readonly slopeFtPerFt: number;
}

/**
 * Each plane's part of the kinematic-wave coefficient Σ(...), so that tc_j = (K/i^0.4)·term_j.
 * "cascade": (n_j/√S_j)^0.6·(X_j^0.6 − X_{j−1}^0.6); "independent": (n_j·L_j)^0.6/S_j^0.3.
 */
export function kinematicTerms(planes: readonly Plane[], series: OverlandSeries): number[] {
  const terms: number[] = new Array<number>(planes.length);
  let before = 0;
  for (let j = 0; j < planes.length; j += 1) {
    const p = planes[j] as Plane;
    if (series === "independent") {
      terms[j] = Math.pow(p.n * p.lengthFt, 0.6) / Math.pow(p.slopeFtPerFt, 0.3);
    } else {
      const after = before + p.lengthFt;
      terms[j] =
        Math.pow(p.n / Math.sqrt(p.slopeFtPerFt), 0.6) *
        (Math.pow(after, 0.6) - Math.pow(before, 0.6));
      before = after;
    }
  }
  return terms;
}

/** Travel time (h) of each plane by TR-55 sheet flow under the chosen series rule. */
export function sheetFlowTimesHr(
  planes: readonly Plane[],
  p2In: number,
  series: SheetFlowSeries,
): number[] {
  if (series === "independent") {
    return planes.map((p) =>
      sheetFlowTravelTimeHr({
        manningN: p.n,
        lengthFt: p.lengthFt,
        p2In,
        slopeFtPerFt: p.slopeFtPerFt,
      }),
    );
  }
  if (series === "cascade") {
    const terms = kinematicTerms(planes, "cascade");
    const c = terms.reduce((a, b) => a + b, 0);
    const totalHr = (TR55_SHEET_COEFF_US * Math.pow(c, 4 / 3)) / Math.sqrt(p2In);
    return terms.map((t) => (totalHr * t) / c);
  }
  let lengthFt = 0;
  let nL = 0;
  let fall = 0;
  for (const p of planes) {
    lengthFt += p.lengthFt;
    nL += p.n * p.lengthFt;
    fall += p.slopeFtPerFt * p.lengthFt;
  }
  const totalHr = sheetFlowTravelTimeHr({
    manningN: nL / lengthFt,
    lengthFt,
    p2In,
    slopeFtPerFt: fall / lengthFt,
  });
  const out: number[] = [];
  let before = 0;
  for (const p of planes) {
    const after = before + p.lengthFt;
    out.push(totalHr * (Math.pow(after / lengthFt, 0.8) - Math.pow(before / lengthFt, 0.8)));
    before = after;
  }
  return out;
}

/** How each option is named on the sheet, with its basis. */
export const OVERLAND_SERIES_LABELS: Readonly<Record<OverlandSeries, string>> = {
  cascade: "planes in series, each carrying the flow of the planes above (derived)",
  independent: "each segment its own plane from zero flow (as some manuals print it)",
};
export const SHEET_FLOW_SERIES_LABELS: Readonly<Record<SheetFlowSeries, string>> = {
  cascade: "planes in series (an extension of TR-55 eq 3-3, derived)",
  "weighted-n": "one plane with the length-weighted n (common practice)",
  independent: "each segment its own plane (TR-55 eq 3-3 per segment)",
};
