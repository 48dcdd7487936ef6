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

export type Bbox = readonly [west: number, south: number, east: number, north: number];

export interface Layer {
  id: string;
  projectId: string;
  kind: LayerKind;
  name: string;
  format: string;
  originalFilename: string;
  sizeBytes: number;
  status: LayerStatus;
  progress: LayerProgress;
  error: LayerError | null;
  notes: LayerNote[];
  problems: LayerProblem[];
  featureCount: number;
  fields: string[];
  mappingField: string | null;
  /** Terrain: size, pixel size, CRS, vertical unit, nodata (as read from the file). */
  terrain: Record<string, unknown> | null;
  bbox4326: Bbox | null;
  createdAt: string;
  updatedAt: string;
}

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

export type SuggestionConfidence = "exact" | "likely";

/** One distinct value of a layer's field, with what it maps to now and what we suggest. */
export interface FieldValue {
  value: string;
  featureCount: number;
  /** Cover: the mapped class id; soil: the mapped HSG; null when unmapped. */
  mapped: string | null;
  suggestion: { target: string; label: string; confidence: SuggestionConfidence } | null;
}

export interface FieldValues {
  field: string;
  kind: "cover" | "soil";
  /** Every distinct value (up to 10,000), most features first. */
  values: FieldValue[];
  /** Values beyond the list's cap. */
  truncated: boolean;
}
