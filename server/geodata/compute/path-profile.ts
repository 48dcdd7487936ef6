/**
 * The flow path's geometry work for a compute: split by cover and soil, the engineer's surface
 * overrides, regime breaks, terrain samples at every station the slopes and the profile need
 * (one batched read), surveyed points taking over, slopes per segment. Pure apart from the
 * terrain read.
 */
import {
  applySurfaceOverrides,
  buildPolygonIndex,
  firstCrossingStationM,
  isPathReversed,
  pathLengthsM,
  pointAtStation,
  regimeSegments,
  segmentSlopes,
  sheetEndStationM,
  splitFlowPath,
  stationsAlong,
  withSurveyOverrides,
  type PathPiece,
  type RegimeSegment,
  type SegmentSlope,
} from "../../../shared/geo";
import { resolveRules } from "../../../shared/hydrology/rules";
import type { RowSource } from "../../../shared/sheet/rows";
import type { TerrainSampler } from "../terrain";
import type { ComputeData } from "./load";

export interface PathProfile {
  readonly totalM: number;
  readonly pieces: PathPiece[];
  readonly sources: RowSource[];
  readonly reversed: boolean;
  readonly sheetEnd: { stationM: number | null; source: "user" | "design-rule" | "none" };
  readonly channelStart: { stationM: number | null; source: "user" | "channel-layer" | "none" };
  readonly profile: { stationM: number; elevationM: number | null }[];
  readonly problems: string[];
}

/** The stations segmentSlopes will ask for, computed by the same expressions it uses. */
function slopeStations(segments: readonly RegimeSegment[], tenEightyFive: boolean): number[] {
  const out: number[] = [];
  for (const s of segments) {
    out.push(s.stationFromM, s.stationToM);
    if (tenEightyFive && s.regime === "channel") {
      const lengthM = s.stationToM - s.stationFromM;
      out.push(s.stationFromM + 0.1 * lengthM, s.stationFromM + 0.85 * lengthM);
    }
  }
  return out;
}

export async function pathProfile(
  data: ComputeData,
  terrain: TerrainSampler | null,
): Promise<PathProfile> {
  const path = data.path ?? [];
  const lengths = pathLengthsM(path);
  const totalM = lengths.totalM;
  const problems: string[] = [];
  const pieces = splitFlowPath(
    path,
    buildPolygonIndex(data.cover),
    buildPolygonIndex(data.soil),
    lengths,
  );
  // The engineer's surface overrides act on the split; `pieces` stays the cover layer's own.
  const surfaced = applySurfaceOverrides(pieces, data.surfaceOverrides);

  // Terrain at every station asked for: segment ends, the top 100 ft (McCuen–Spiess), profile.
  const samples = new Map<number, number | null>();
  const sample = async (stations: readonly number[]) => {
    const todo = [...new Set(stations)].filter((s) => !samples.has(s));
    if (todo.length === 0) return;
    const z = terrain
      ? await terrain.elevationsM(todo.map((s) => pointAtStation(path, lengths, s)))
      : todo.map(() => null);
    todo.forEach((s, i) => samples.set(s, z[i] ?? null));
  };
  const terrainAt = (stationM: number) => samples.get(stationM) ?? null;
  const elevationAt = withSurveyOverrides(terrainAt, data.surveyed);

  const units = data.project.units === "si" ? "si" : "us";
  const rules = resolveRules(data.rules.rules, units, data.project.designReturnPeriodYears);
  const topM = Math.min(totalM, 30.48);
  await sample([0, topM, totalM]);
  const first = surfaced[0];
  const topN = first?.surfaceClassId
    ? data.classes.get(first.surfaceClassId)?.values.sheetFlowN?.value
    : undefined;
  const top = elevationAt(0);
  const below = elevationAt(topM);
  const end = sheetEndStationM({
    totalM,
    userBreakM: data.breaks.sheetEndM,
    cap: rules.sheetCap,
    mcCuenSpiess:
      top && below && topN && topM > 0
        ? { slopeFtPerFt: (top.elevationM - below.elevationM) / topM, manningN: topN }
        : null,
  });
  if (!end.ok) problems.push(`Sheet flow: ${end.problem}.`);
  const crossing =
    data.breaks.channelStartM === null
      ? firstCrossingStationM(path, lengths, data.channelLines)
      : null;
  const channelStartM = data.breaks.channelStartM ?? crossing;
  let sheetEndM = end.ok ? end.stationM : null;
  if (sheetEndM !== null && channelStartM !== null && sheetEndM > channelStartM)
    sheetEndM = channelStartM;

  const segments = regimeSegments(surfaced, { sheetEndM, channelStartM }).filter(
    (s) => s.lengthM > 0,
  );
  const tenEightyFive = data.rules.channelSlope === "10-85";
  const profileStations = stationsAlong(totalM, data.rules.profileSpacingM);
  await sample([...slopeStations(segments, tenEightyFive), ...profileStations]);
  const slopes: SegmentSlope[] = segmentSlopes(segments, elevationAt, {
    channelSlope: data.rules.channelSlope,
  });

  const sources: RowSource[] = segments.map((s, i) => {
    const sl = slopes[i];
    const from = sl?.from ?? null;
    const to = sl?.to ?? null;
    const problem = sl?.problem ?? null;
    return {
      stationFromM: s.stationFromM,
      stationToM: s.stationToM,
      lengthM: s.lengthM,
      regime: s.regime,
      surfaceClassId: s.surfaceClassId,
      surfaceSource: s.surfaceSource,
      hsg: s.hsg,
      elevationUpM: from?.elevationM ?? null,
      elevationDownM: to?.elevationM ?? null,
      elevationSource:
        from && to
          ? from.source === to.source
            ? from.source
            : "mixed"
          : ((from ?? to)?.source ?? null),
      slope: problem === null ? (sl?.slopeMPerM ?? null) : null,
      slopeProblem: problem === "zero-length" ? null : problem,
    };
  });
  const topZ = elevationAt(0)?.elevationM ?? null;
  const outletZ = elevationAt(totalM)?.elevationM ?? null;
  if (!terrain && data.surveyed.length === 0) {
    problems.push(
      "No terrain layer and no surveyed elevations: slopes cannot be had. Upload a terrain layer or enter elevations.",
    );
  }
  return {
    totalM,
    pieces,
    sources,
    reversed: isPathReversed(topZ, outletZ),
    sheetEnd: {
      stationM: sheetEndM,
      source: data.breaks.sheetEndM !== null ? "user" : sheetEndM !== null ? "design-rule" : "none",
    },
    channelStart: {
      stationM: channelStartM,
      source:
        data.breaks.channelStartM !== null ? "user" : crossing !== null ? "channel-layer" : "none",
    },
    profile: profileStations.map((s) => ({
      stationM: s,
      elevationM: elevationAt(s)?.elevationM ?? null,
    })),
    problems,
  };
}
