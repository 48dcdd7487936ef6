/**
 * One compute of a subcatchment: load, split, regimes, slopes, figures, the engineering core,
 * the travel-time sheet; stored as the subcatchment's current result under the path version it
 * was computed from (a path changed meanwhile leaves a result that names its older version).
 */
import {
  CAUTION,
  compute,
  computeInputSchema,
  isHydrologyError,
  type ComputeResult,
} from "../../../shared/hydrology";
import { UNIT_LABELS } from "../../../shared/hydrology/units";
import type { RulesInput } from "../../../shared/hydrology/rules";
import type { SheetWarning, TravelTimeSheet } from "../../../shared/schemas/sheet";
import { assembleSheet, rowProblems } from "../../../shared/sheet/assemble";
import { buildRows } from "../../../shared/sheet/rows";
import type { ProjectRow } from "../../auth/guards";
import type { Db } from "../../db/client";
import { subcatchmentResults } from "../../db/schema-geodata";
import type { ObjectStore } from "../../storage";
import { openTerrain, type TerrainInfo, type TerrainSampler } from "../terrain";
import { subcatchmentFigures } from "./figures";
import { loadComputeData } from "./load";
import { pathProfile } from "./path-profile";

const lengthOut = (units: "us" | "si", m: number) => (units === "si" ? m : m / 0.3048);

/**
 * The Monte Carlo runs inside the compute request (about 20 µs a draw), so the server bounds
 * its draws: a project asking for more gets this many and a note (the command line has no cap).
 */
export const SERVER_MAX_DRAWS = 5_000;

function boundedDraws(rules: RulesInput, warnings: SheetWarning[]): RulesInput {
  const draws = rules.uncertainty?.draws;
  if (draws === undefined || draws <= SERVER_MAX_DRAWS) return rules;
  warnings.push({
    code: "monte-carlo-draws-capped",
    message: `The design rules ask for ${draws} Monte Carlo draws; the sheet uses ${SERVER_MAX_DRAWS} (run npm run calc with the sheet's input for more).`,
  });
  return { ...rules, uncertainty: { ...rules.uncertainty, draws: SERVER_MAX_DRAWS } };
}

/** The project's terrain, or null with the reason when its file cannot be read. */
async function openProjectTerrain(
  store: ObjectStore,
  t: { objectKey: string; info: unknown; name: string } | null,
): Promise<{ sampler: TerrainSampler | null; problem: string | null }> {
  if (!t) return { sampler: null, problem: null };
  try {
    const file = await store.localCopy(t.objectKey);
    return { sampler: await openTerrain(file, t.info as TerrainInfo), problem: null };
  } catch (err) {
    console.error(`terrain ${t.objectKey} could not be opened:`, err);
    return {
      sampler: null,
      problem: `The file of terrain layer "${t.name}" could not be read; upload it again.`,
    };
  }
}

export async function computeSheet(
  db: Db,
  store: ObjectStore,
  project: ProjectRow,
  subcatchmentId: string,
): Promise<TravelTimeSheet> {
  const data = await loadComputeData(db, project, subcatchmentId);
  const units = project.units === "si" ? "si" : "us";
  let terrain: TerrainSampler | null = null;
  try {
    const opened = await openProjectTerrain(store, data.terrain);
    terrain = opened.sampler;
    // The figures (PostGIS areas, land slope) and the path work are independent.
    const figuresPending = subcatchmentFigures(db, {
      projectId: project.id,
      subcatchmentId,
      units,
      boundary: data.boundary,
      classes: data.classes,
      dualHsg: data.rules.dualHsg,
      terrain,
      terrainKey: data.terrain?.objectKey ?? null,
    });
    const [figures, computedProfile] = await Promise.all([
      figuresPending,
      data.path ? pathProfile(data, terrain) : Promise.resolve(null),
    ]);
    const frameBase = {
      project: { id: project.id, name: project.name },
      subcatchment: {
        id: data.subcatchment.id,
        name: data.subcatchment.name,
        scenario: data.subcatchment.scenario,
      },
      flowPathVersion: data.pathVersion,
      computedAt: new Date().toISOString(),
      units,
      unitLabels: { ...UNIT_LABELS[units] },
      returnPeriodYears: project.designReturnPeriodYears,
      figures: {
        area: figures.area,
        cn: figures.cn,
        c: figures.c,
        avgSlopePercent: figures.avgSlopePercent,
        notes: figures.notes,
      },
      rainfall: data.rainfall && {
        tableId: data.rainfall.id,
        name: data.rainfall.name,
        sourceNote: data.rainfall.sourceNote,
      },
    } as const;
    if (!data.path || !computedProfile) {
      const problems = ["The subcatchment has no flow path: draw or upload one."];
      return assembleSheet(
        {
          ...frameBase,
          totalLength: 0,
          reversed: false,
          breaks: {
            sheetEnd: null,
            sheetEndSource: "none",
            channelStart: null,
            channelStartSource: "none",
          },
          profile: [],
          split: { pieces: [], coverFeatureIds: [], soilFeatureIds: [] },
        },
        [],
        null,
        problems,
      );
    }
    const profile = computedProfile;
    const built = buildRows(profile.sources, {
      units,
      classes: data.classes,
      dualHsg: data.rules.dualHsg,
      channel: data.subcatchment.channel as { manningN: number; section: unknown } | null,
    });
    const problems = [...profile.problems, ...rowProblems(built.rows)];
    if (data.rainfallProblem) problems.push(data.rainfallProblem);
    if (opened.problem) problems.push(opened.problem);
    if (profile.reversed) {
      problems.push(
        "The outlet end of the path is higher than its top: the path seems drawn the wrong way. Reverse it (Reverse path on the Map desk, or POST …/flow-path/reverse) or check the terrain.",
      );
    }
    let result: ComputeResult | null = null;
    let calcInput: unknown;
    const extraWarnings: SheetWarning[] = [];
    if (built.segments && data.rainfall && problems.length === 0) {
      const rules = boundedDraws(data.rules.rules, extraWarnings);
      calcInput = {
        units,
        returnPeriodYears: project.designReturnPeriodYears,
        rules,
        rainfall: {
          ...(data.rainfall.p2_24h !== null && { p2_24h: data.rainfall.p2_24h }),
          idf: data.rainfall.idf,
        },
        watershed: {
          ...(figures.area !== null && figures.area > 0 && { area: figures.area }),
          ...(figures.avgSlopePercent !== null &&
            figures.avgSlopePercent > 0 && {
              avgSlopePercent: Math.min(100, figures.avgSlopePercent),
            }),
          ...(figures.cn !== null && { cn: figures.cn }),
          ...(figures.c !== null && { c: figures.c }),
          label: data.subcatchment.name,
        },
        segments: built.segments,
        title: `${project.name}: ${data.subcatchment.name} (${data.subcatchment.scenario})`,
      };
      const parsed = computeInputSchema.safeParse(calcInput);
      if (!parsed.success) {
        for (const issue of parsed.error.issues) {
          problems.push(`${issue.path.join(".")}: ${issue.message}`);
        }
      } else {
        try {
          result = compute(parsed.data, { uncertainty: true });
        } catch (err) {
          if (!isHydrologyError(err)) throw err;
          problems.push(err.message);
        }
      }
    }
    const coverIds = [...new Set(data.cover.map((p) => p.featureId))];
    const soilIds = [...new Set(data.soil.map((p) => p.featureId))];
    return assembleSheet(
      {
        ...frameBase,
        totalLength: lengthOut(units, profile.totalM),
        reversed: profile.reversed,
        breaks: {
          sheetEnd:
            profile.sheetEnd.stationM === null ? null : lengthOut(units, profile.sheetEnd.stationM),
          sheetEndSource: profile.sheetEnd.source,
          channelStart:
            profile.channelStart.stationM === null
              ? null
              : lengthOut(units, profile.channelStart.stationM),
          channelStartSource: profile.channelStart.source,
        },
        profile: profile.profile.map((p) => ({
          station: lengthOut(units, p.stationM),
          elevation: p.elevationM === null ? null : lengthOut(units, p.elevationM),
        })),
        split: { pieces: profile.pieces, coverFeatureIds: coverIds, soilFeatureIds: soilIds },
      },
      built.rows,
      result,
      problems,
      extraWarnings,
      result === null ? undefined : calcInput,
    );
  } finally {
    await terrain?.close();
  }
}

/** Stores the sheet as the subcatchment's current result. */
export async function storeSheet(
  db: Db,
  subcatchmentId: string,
  sheet: TravelTimeSheet,
  userId: string,
) {
  const values = {
    flowPathVersion: sheet.flowPathVersion,
    sheet,
    computedBy: userId,
    computedAt: new Date(sheet.computedAt),
  };
  await db
    .insert(subcatchmentResults)
    .values({ subcatchmentId, ...values })
    .onConflictDoUpdate({ target: subcatchmentResults.subcatchmentId, set: values });
}

export { CAUTION };
