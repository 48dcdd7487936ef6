import { z } from "zod";

export const UNIT_SYSTEMS = ["us", "si"] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];
export const UNIT_SYSTEM_LABELS: Record<UnitSystem, string> = {
  us: "US customary (ft, in, ac, cfs)",
  si: "SI (m, mm, ha, m³/s)",
};

/** Return periods offered for the design storm (years); the common NOAA Atlas 14 ARIs. */
export const RETURN_PERIODS_YEARS = [1, 2, 5, 10, 25, 50, 100, 200, 500] as const;

export const projectNameSchema = z
  .string({ message: "Enter a project name." })
  .trim()
  .min(2, { message: "Use at least 2 characters." })
  .max(160, { message: "Use at most 160 characters." });

export const projectDescriptionSchema = z
  .string()
  .trim()
  .max(2000, { message: "Use at most 2000 characters." });

// A JSON number only: `true` or "10" in a body is a client bug to report, not to guess at.
const returnPeriodYears = z
  .number({ message: "Choose a return period." })
  .refine((v) => (RETURN_PERIODS_YEARS as readonly number[]).includes(v), {
    message: `Choose one of ${RETURN_PERIODS_YEARS.join(", ")} years.`,
  });

const projectFields = {
  name: projectNameSchema,
  description: projectDescriptionSchema,
  units: z.enum(UNIT_SYSTEMS, { message: "Choose US customary or SI." }),
  designReturnPeriodYears: returnPeriodYears,
};

export const createProjectBody = z.object({
  ...projectFields,
  description: projectDescriptionSchema.default(""),
});
export type CreateProjectBody = z.input<typeof createProjectBody>;

// Built from the fields without the create-time default, so a PATCH that leaves the description
// out keeps it instead of clearing it.
export const updateProjectBody = z.object(projectFields).partial();
export type UpdateProjectBody = z.input<typeof updateProjectBody>;

/** A form's <select> gives the return period as text; the forms read it as the number it is. */
const returnPeriodFromForm = z.preprocess(
  (v) => (typeof v === "string" && /^\d+$/.test(v) ? Number(v) : v),
  returnPeriodYears,
);
export const createProjectForm = createProjectBody.extend({
  designReturnPeriodYears: returnPeriodFromForm,
});
export const updateProjectForm = updateProjectBody.extend({
  designReturnPeriodYears: returnPeriodFromForm.optional(),
});

export const projectSchema = z.object({
  id: z.string(),
  teamId: z.string(),
  name: z.string(),
  description: z.string(),
  units: z.enum(UNIT_SYSTEMS),
  designReturnPeriodYears: z.number(),
  isDemo: z.boolean(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Project = z.infer<typeof projectSchema>;
