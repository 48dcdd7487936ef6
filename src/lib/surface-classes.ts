import { z } from "zod";
import { surfaceValuesSchema } from "../../shared/schemas/catalog";
import { idSchema } from "../../shared/schemas/common";

/** A Surface catalog class as the API answers it (team view, or a project's with overrides). */
export const surfaceClassSchema = z.object({
  id: idSchema,
  teamId: idSchema,
  key: z.string(),
  name: z.string(),
  description: z.string(),
  values: surfaceValuesSchema,
  seededFrom: z.string().nullable(),
  override: z
    .object({ values: surfaceValuesSchema.partial(), note: z.string() })
    .nullable()
    .optional(),
});
export type SurfaceClass = z.output<typeof surfaceClassSchema>;
