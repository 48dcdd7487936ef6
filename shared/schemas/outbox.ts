import { z } from "zod";

export const outboxMessageSummarySchema = z.object({
  id: z.string(),
  to: z.string(),
  from: z.string(),
  subject: z.string(),
  receivedAt: z.string(),
});
export const outboxMessageSchema = outboxMessageSummarySchema.extend({
  text: z.string(),
  html: z.string().nullable(),
});
export type OutboxMessageSummary = z.infer<typeof outboxMessageSummarySchema>;
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
