import { z } from "zod";
import { ROLES } from "../roles";
import { emailSchema, passwordSchema, personNameSchema, tokenSchema } from "./common";

export const signInBody = z.object({
  email: emailSchema,
  password: z
    .string({ message: "Enter your password." })
    .min(1, { message: "Enter your password." }),
});
export type SignInBody = z.infer<typeof signInBody>;

export const teamNameSchema = z
  .string({ message: "Enter a team name." })
  .trim()
  .min(2, { message: "Use at least 2 characters." })
  .max(120, { message: "Use at most 120 characters." });

export const signUpBody = z.object({
  email: emailSchema,
  name: personNameSchema,
  password: passwordSchema,
  teamName: teamNameSchema,
});
export type SignUpBody = z.infer<typeof signUpBody>;

export const tokenBody = z.object({ token: tokenSchema });

export const resetRequestBody = z.object({ email: emailSchema });
export const resetCompleteBody = z.object({ token: tokenSchema, password: passwordSchema });

export const acceptInvitationBody = z.object({
  name: personNameSchema.optional(),
  password: passwordSchema.optional(),
});
export type AcceptInvitationBody = z.infer<typeof acceptInvitationBody>;

export const updateAccountBody = z.object({ name: personNameSchema });
export const changePasswordBody = z.object({
  currentPassword: z.string().min(1, { message: "Enter your current password." }),
  newPassword: passwordSchema,
});

export const membershipSchema = z.object({
  teamId: z.string(),
  teamName: z.string(),
  role: z.enum(ROLES),
});
export const userSchema = z.object({ id: z.string(), email: z.string(), name: z.string() });
export const sessionInfoSchema = z.object({
  user: userSchema,
  memberships: z.array(membershipSchema),
});
export type SessionInfo = z.infer<typeof sessionInfoSchema>;
export type Membership = z.infer<typeof membershipSchema>;

export const invitationPreviewSchema = z.object({
  teamName: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  invitedBy: z.string(),
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/** What the map draws under project layers: the demo area, an admin's style, or a PMTiles file. */
export const basemapConfigSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("demo") }),
  z.object({ kind: z.literal("style"), url: z.string() }),
  z.object({ kind: z.literal("pmtiles"), url: z.string() }),
]);
export type BasemapConfigDto = z.infer<typeof basemapConfigSchema>;

export const publicConfigSchema = z.object({
  signUpEnabled: z.boolean(),
  outboxEnabled: z.boolean(),
  basemap: basemapConfigSchema,
});
export type PublicConfig = z.infer<typeof publicConfigSchema>;
