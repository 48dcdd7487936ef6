/**
 * Subcatchments, their longest flow path (divide → outlet), regime breaks, surveyed elevations
 * and surface overrides. Geometry is GeoJSON in WGS84 longitude/latitude. Stations and
 * elevations in bodies are in the project's length unit (ft or m) and stored in metres.
 */
import { z } from "zod";
import { sectionSchema } from "../hydrology/input-schema";
import { idSchema } from "./common";

const lon = z
  .number()
  .min(-180, "longitude must be at least -180")
  .max(180, "longitude must be at most 180");
const lat = z
  .number()
  .min(-90, "latitude must be at least -90")
  .max(90, "latitude must be at most 90");
export const positionSchema = z.tuple([lon, lat]).rest(z.number());

const distinctCount = (coords: readonly (readonly number[])[]) =>
  new Set(coords.map((c) => `${c[0]},${c[1]}`)).size;

export const lineStringSchema = z.strictObject({
  type: z.literal("LineString"),
  coordinates: z
    .array(positionSchema)
    .max(200_000, "has more than 200,000 vertices")
    .refine((c) => distinctCount(c) >= 2, "needs at least 2 distinct vertices"),
});

const ringSchema = z
  .array(positionSchema)
  .min(4, "a ring needs at least 4 positions (closed)")
  .refine((r) => {
    const a = r[0];
    const b = r[r.length - 1];
    return a !== undefined && b !== undefined && a[0] === b[0] && a[1] === b[1];
  }, "a ring must end where it starts")
  .refine((r) => distinctCount(r) >= 3, "a ring needs at least 3 distinct vertices");

export const polygonSchema = z.strictObject({
  type: z.literal("Polygon"),
  coordinates: z.array(ringSchema).min(1, "needs an outer ring"),
});
export const multiPolygonSchema = z.strictObject({
  type: z.literal("MultiPolygon"),
  coordinates: z.array(z.array(ringSchema).min(1)).min(1, "needs at least one polygon"),
});
export const boundarySchema = z.discriminatedUnion("type", [polygonSchema, multiPolygonSchema], {
  error: "must be a GeoJSON Polygon or MultiPolygon",
});
export const pointSchema = z.strictObject({
  type: z.literal("Point"),
  coordinates: positionSchema,
});

/** Channel segments' Manning n and section, in the project's units (the core's fields). */
export const channelSchema = z.strictObject({
  manningN: z
    .number()
    .gt(0, "Manning's n must be greater than 0")
    .lt(1, "Manning's n must be less than 1"),
  section: sectionSchema,
});

const name = z.string().trim().min(1, "Enter a name.").max(160, "Use at most 160 characters.");
export const SCENARIOS = ["existing", "proposed"] as const;
const scenario = z.enum(SCENARIOS, { error: "must be existing or proposed" });

export const createSubcatchmentBody = z.strictObject({
  name,
  scenario: scenario.default("existing"),
  boundary: boundarySchema.nullable().default(null),
  outlet: pointSchema.nullable().default(null),
  channel: channelSchema.nullable().default(null),
  note: z.string().trim().max(2000).default(""),
});
export type CreateSubcatchmentBody = z.input<typeof createSubcatchmentBody>;

/** The subcatchment's own version read by the client (its fields; the path has its own). */
export const subcatchmentVersion = z
  .number({ error: "send the subcatchment's version you read" })
  .int()
  .min(1, "must be at least 1");

export const updateSubcatchmentBody = z.strictObject({
  name: name.optional(),
  scenario: scenario.optional(),
  boundary: boundarySchema.nullable().optional(),
  outlet: pointSchema.nullable().optional(),
  channel: channelSchema.nullable().optional(),
  note: z.string().trim().max(2000).optional(),
  version: subcatchmentVersion,
});

const version = z
  .number({ error: "send the version you read (0 for a new path)" })
  .int()
  .min(0, "must be at least 0");

export const putFlowPathBody = z.strictObject({
  geometry: lineStringSchema,
  version: version.default(0),
});
export const versionBody = z.strictObject({ version });

const station = z.number().min(0, "a station must be at least 0").max(1e7);

/** Regime breaks, stations from the divide in the project's length unit; null removes one. */
export const putBreaksBody = z.strictObject({
  sheetEnd: station.nullable().optional(),
  channelStart: station.nullable().optional(),
  version,
});

export const putElevationsBody = z.strictObject({
  entries: z
    .array(
      z.strictObject({
        station,
        elevation: z.number().min(-1e4, "must be at least -10,000").max(1e5),
        note: z.string().trim().max(500).default(""),
      }),
    )
    .max(10_000)
    .refine(
      (e) => new Set(e.map((x) => x.station)).size === e.length,
      "two entries share a station",
    ),
  /** The path's version: surveyed points are stations along it, like the breaks. */
  version,
});

/** A stretch of the path said to be of one surface class (stations in the project's unit). */
export const surfaceOverrideEntry = z.strictObject({
  stationFrom: station,
  stationTo: station,
  surfaceClassId: idSchema,
  note: z.string().trim().max(500, "Use at most 500 characters.").default(""),
});

/** Replaces every surface override; a change of the path, so it takes the path's version. */
export const putSurfaceOverridesBody = z.strictObject({
  entries: z
    .array(surfaceOverrideEntry)
    .max(1000, "Use at most 1,000 overrides.")
    .superRefine((entries, ctx) => {
      entries.forEach((e, i) => {
        if (!(e.stationTo > e.stationFrom)) {
          ctx.addIssue({
            code: "custom",
            path: [i, "stationTo"],
            message: `Override ${i + 1}: station to (${e.stationTo}) must be greater than station from (${e.stationFrom}).`,
          });
        }
      });
      // In order of start, each must begin at or past the furthest end of those before it.
      const order = entries
        .map((e, i) => ({ ...e, i }))
        .sort((a, b) => a.stationFrom - b.stationFrom);
      let reach = order[0];
      for (const cur of order.slice(1)) {
        if (!reach) break;
        if (cur.stationFrom < reach.stationTo) {
          ctx.addIssue({
            code: "custom",
            path: [cur.i, "stationFrom"],
            message: `Override ${cur.i + 1} (from ${cur.stationFrom}) overlaps override ${reach.i + 1} (${reach.stationFrom} to ${reach.stationTo}).`,
          });
        }
        if (cur.stationTo > reach.stationTo) reach = cur;
      }
    }),
  version,
});
export type PutSurfaceOverridesBody = z.input<typeof putSurfaceOverridesBody>;

export const flowPathSchema = z.object({
  geometry: lineStringSchema,
  version: z.number().int(),
  lengthM: z.number(),
  updatedAt: z.string(),
});

export const subcatchmentSchema = z.object({
  id: idSchema,
  projectId: idSchema,
  name: z.string(),
  scenario,
  boundary: boundarySchema.nullable(),
  outlet: pointSchema.nullable(),
  channel: channelSchema.nullable(),
  note: z.string(),
  /** Version of the fields above; an edit sends the one it read (409 when someone changed it). */
  version: z.number().int(),
  flowPath: flowPathSchema.nullable(),
  breaks: z.object({ sheetEnd: z.number().nullable(), channelStart: z.number().nullable() }),
  elevations: z.array(z.object({ station: z.number(), elevation: z.number(), note: z.string() })),
  /** Stretches given another surface class than the cover layer's, in station order. */
  surfaceOverrides: z.array(
    z.object({
      stationFrom: z.number(),
      stationTo: z.number(),
      surfaceClassId: idSchema,
      note: z.string(),
    }),
  ),
  /** The length unit of stations and elevations above ("ft" or "m"). */
  lengthUnit: z.enum(["ft", "m"]),
  /** Path version of the stored sheet, or null when never computed. */
  computedVersion: z.number().int().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Subcatchment = z.output<typeof subcatchmentSchema>;

/**
 * What the list tells of a subcatchment's stored sheet, so an overview needs no sheet of its
 * own: the governing Tc and its method, or the first problem that kept the methods from running.
 */
export const resultSummarySchema = z.object({
  governingTcMin: z.number().nullable(),
  governingMethodLabel: z.string().nullable(),
  /** The first problem on the sheet when no Tc governs (null when one does or none is noted). */
  problem: z.string().nullable(),
  computedAt: z.string(),
  flowPathVersion: z.number().int(),
  /** The path changed since the sheet was computed (or the path is gone). */
  stale: z.boolean(),
});
export type ResultSummary = z.output<typeof resultSummarySchema>;

/** An item of a project's list: the subcatchment with its result summary (null: never computed). */
export const subcatchmentListItemSchema = subcatchmentSchema.extend({
  result: resultSummarySchema.nullable(),
});
export type SubcatchmentListItem = z.output<typeof subcatchmentListItemSchema>;
