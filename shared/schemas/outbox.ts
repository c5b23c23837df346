import { z } from 'zod';

/** A message caught by the built-in mail fake (demo and development only). */
export const outboxMessageSchema = z.object({
  id: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  receivedAt: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
export const outboxMessageListSchema = z.array(outboxMessageSchema);
