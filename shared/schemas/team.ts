import { z } from "zod";
import { ROLES } from "../roles";
import { emailSchema } from "./common";

export const roleSchema = z.enum(ROLES, { message: "Choose a role." });

export const inviteBody = z.object({ email: emailSchema, role: roleSchema });
export type InviteBody = z.infer<typeof inviteBody>;

export const changeRoleBody = z.object({ role: roleSchema });

export const teamSchema = z.object({ id: z.string(), name: z.string(), role: roleSchema });
export const memberSchema = z.object({
  userId: z.string(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  joinedAt: z.string(),
});
export const invitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: roleSchema,
  invitedBy: z.string(),
  createdAt: z.string(),
  expiresAt: z.string(),
});
export type Team = z.infer<typeof teamSchema>;
export type Member = z.infer<typeof memberSchema>;
export type Invitation = z.infer<typeof invitationSchema>;
