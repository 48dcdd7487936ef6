import { z } from "zod";

/** The one error shape every API failure uses. `fields` maps a field path to its message. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>["error"];

export const idSchema = z.uuid({ message: "Must be a valid id." });
export const idParams = z.object({ id: idSchema });

export const emailSchema = z
  .string({ message: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .pipe(z.email({ message: "Enter a valid e-mail address." }).max(254));

/** NIST SP 800-63B sets 8 characters as the floor; we ask for 10, with no composition rules. */
export const passwordSchema = z
  .string({ message: "Enter a password." })
  .min(10, { message: "Use at least 10 characters." })
  .max(200, { message: "Use at most 200 characters." });

export const personNameSchema = z
  .string({ message: "Enter a name." })
  .trim()
  .min(1, { message: "Enter a name." })
  .max(120, { message: "Use at most 120 characters." });

export const tokenSchema = z
  .string()
  .regex(/^[A-Za-z0-9_-]{32,128}$/, { message: "This link is not valid." });
