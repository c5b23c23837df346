import { z } from 'zod';
import { text } from './text';

/** A message caught by the built-in mail fake (demo and development only). */
export const outboxMessageSchema = z.object({
  id: text(),
  to: text(),
  subject: text(),
  text: text(),
  html: text().nullable(),
  receivedAt: text(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
export const outboxMessageListSchema = z.array(outboxMessageSchema);
