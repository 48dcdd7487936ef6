/**
 * Layers of a project as the API shows them: uploaded files (cover, soil, terrain, channel,
 * boundary) with their processing status and progress, notes on what was repaired, problems
 * still open (unmapped values), and the attribute mapping of cover and soil layers.
 */
import { z } from "zod";
import { HSG_CODES } from "../geo/types";
import { idSchema } from "./common";

export const LAYER_KINDS = ["cover", "soil", "terrain", "channel", "boundary"] as const;
export type LayerKind = (typeof LAYER_KINDS)[number];
export const LAYER_STATUSES = ["queued", "processing", "ready", "failed"] as const;
export type LayerStatus = (typeof LAYER_STATUSES)[number];

/** The text fields sent beside the file (multipart/form-data). */
export const uploadLayerFields = z.strictObject({
  kind: z.enum(LAYER_KINDS, { error: "Choose cover, soil, terrain, channel or boundary." }),
  name: z.string().trim().max(160, "Use at most 160 characters.").optional(),
  /** Terrain only: the unit of the elevations stored in the GeoTIFF. */
  verticalUnit: z.enum(["m", "ft"], { error: "Choose m or ft." }).optional(),
});
export type UploadLayerFields = z.infer<typeof uploadLayerFields>;

export const layerProgressSchema = z.object({
  /** received → reading → saving → checking → done */
  stage: z.enum(["received", "reading", "saving", "checking", "done"]),
  bytesReceived: z.number().int().nonnegative(),
  bytesTotal: z.number().int().nonnegative(),
  featuresDone: z.number().int().nonnegative(),
  featuresTotal: z.number().int().nonnegative(),
});
export type LayerProgress = z.infer<typeof layerProgressSchema>;

/** Why a layer failed: what is wrong, and where (file, feature or row). */
export const layerErrorSchema = z.object({
  status: z.number().int(),
  code: z.string(),
  message: z.string(),
  where: z.string().optional(),
});
export type LayerError = z.infer<typeof layerErrorSchema>;

export const layerNoteSchema = z.object({ where: z.string(), message: z.string() });
export type LayerNote = z.infer<typeof layerNoteSchema>;

export const layerProblemSchema = z.object({
  kind: z.literal("unmapped-values"),
  /** The mapping field's values with no class (cover) or no HSG (soil); first 50. */
  values: z.array(z.string()),
  featureCount: z.number().int(),
  message: z.string(),
});
export type LayerProblem = z.infer<typeof layerProblemSchema>;

/** [west, south, east, north] in degrees, WGS84. */
export const bboxSchema = z.tuple([z.number(), z.number(), z.number(), z.number()]);
export type Bbox = z.infer<typeof bboxSchema>;

export const layerSchema = z.object({
  id: idSchema,
  projectId: idSchema,
  kind: z.enum(LAYER_KINDS),
  name: z.string(),
  /** shapefile | kml | kmz | gpx | geojson | geotiff */
  format: z.string(),
  originalFilename: z.string(),
  sizeBytes: z.number().int(),
  status: z.enum(LAYER_STATUSES),
  progress: layerProgressSchema,
  error: layerErrorSchema.nullable(),
  notes: z.array(layerNoteSchema),
  problems: z.array(layerProblemSchema),
  featureCount: z.number().int(),
  fields: z.array(z.string()),
  mappingField: z.string().nullable(),
  /** Terrain: size, pixel size, CRS, vertical unit, nodata (as read from the file). */
  terrain: z.record(z.string(), z.unknown()).nullable(),
  bbox4326: bboxSchema.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Layer = z.infer<typeof layerSchema>;

/** Long-poll: answer as soon as the layer is ready or failed, or after this many ms. */
export const layerPollQuery = z.object({
  waitMs: z.coerce.number().int().min(0).max(30_000).default(0),
});

const coord = (min: number, max: number) => z.number().min(min).max(max);
export const layerFeaturesQuery = z
  .object({
    /** west,south,east,north in degrees (WGS84). */
    bbox: z
      .string()
      .transform((s) => s.split(",").map(Number))
      .pipe(z.tuple([coord(-180, 180), coord(-90, 90), coord(-180, 180), coord(-90, 90)]))
      .optional(),
    limit: z.coerce.number().int().min(1).max(10_000).default(5000),
  })
  .refine((q) => !q.bbox || (q.bbox[0] <= q.bbox[2] && q.bbox[1] <= q.bbox[3]), {
    message: "Give the bbox as west,south,east,north.",
    path: ["bbox"],
  });

export const fieldName = z.string().min(1).max(200);

const mappingValue = z.string().max(500);

export const coverMappingBody = z.strictObject({
  field: fieldName,
  entries: z
    .array(z.strictObject({ value: mappingValue, surfaceClassId: idSchema.nullable() }))
    .max(10_000),
});
export const soilMappingBody = z.strictObject({
  field: fieldName,
  entries: z
    .array(z.strictObject({ value: mappingValue, hsg: z.enum(HSG_CODES).nullable() }))
    .max(10_000),
});
export type CoverMappingBody = z.infer<typeof coverMappingBody>;
export type SoilMappingBody = z.infer<typeof soilMappingBody>;

export const suggestionConfidence = z.enum(["exact", "likely"]);
export type SuggestionConfidence = z.infer<typeof suggestionConfidence>;

/** One distinct value of a layer's field, with what it maps to now and what we suggest. */
export const fieldValueSchema = z.object({
  value: z.string(),
  featureCount: z.number().int(),
  /** Cover: the mapped class id; soil: the mapped HSG; null when unmapped. */
  mapped: z.string().nullable(),
  /** Cover: a class id; soil: an HSG. */
  suggestion: z
    .object({ target: z.string(), label: z.string(), confidence: suggestionConfidence })
    .nullable(),
});
export type FieldValue = z.infer<typeof fieldValueSchema>;

export const fieldValuesSchema = z.object({
  field: z.string(),
  kind: z.enum(["cover", "soil"]),
  /** Every distinct value (up to 10,000), most features first. */
  values: z.array(fieldValueSchema),
  /** Values beyond the list's cap. */
  truncated: z.boolean(),
});
export type FieldValues = z.infer<typeof fieldValuesSchema>;
