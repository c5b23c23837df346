import { z } from 'zod';
import { text } from './text';
import { listQuerySchema, listReplySchema } from './lists';

const isoDateTime = z.iso.datetime({
  offset: true,
  message: 'Use a date and time such as 2026-12-01T08:00:00Z.',
});
const isoDateOrDateTime = z.union([z.iso.date(), isoDateTime], {
  message: 'Use a date (2026-12-01) or a date and time (2026-12-01T08:00:00Z).',
});

/** Filters of the audit trail list and its CSV export. */
export const auditFilterSchema = z.object({
  entityType: text().trim().min(1).max(80).optional(),
  entityId: text().trim().min(1).max(80).optional(),
  actorId: z.uuid({ message: 'Choose a person from the list.' }).optional(),
  action: text().trim().min(1).max(80).optional(),
  /** From this time on (a date means its start, UTC). */
  from: isoDateOrDateTime.optional(),
  /** Up to this time (a date means its end, UTC). */
  to: isoDateOrDateTime.optional(),
  /** Part of the action or the kind of record ("route.rename", "compound"). */
  q: text().trim().max(200).optional(),
});
/** Newest first: the one order of the trail. */
export const auditListQuerySchema = auditFilterSchema.extend(
  listQuerySchema(['newest'], 'The trail reads newest first (newest).').shape,
);
export type AuditFilter = z.infer<typeof auditFilterSchema>;

export const auditEventSchema = z.object({
  id: text(),
  /** Set by the database clock, UTC. */
  at: text(),
  action: text(),
  entityType: text(),
  entityId: text().nullable(),
  actor: z.object({ id: text(), name: text(), email: text() }).nullable(),
  /** null for account events (sign-ins, passwords, tokens). */
  workspaceId: text().nullable(),
  before: z.unknown(),
  after: z.unknown(),
  /** The hash chain: the workspace id or "account", the position in it, and the hashes. */
  chain: text(),
  position: z.number().int(),
  prevHash: text(),
  hash: text(),
});
export type AuditEventPayload = z.infer<typeof auditEventSchema>;
export const auditListSchema = listReplySchema(auditEventSchema);

export const auditVerifySchema = z.object({
  ok: z.boolean(),
  /** Rows whose hash was recomputed. */
  checked: z.number().int(),
  firstBroken: z
    .object({
      id: text(),
      at: text(),
      chain: text(),
      position: z.number().int(),
      reason: text(),
    })
    .optional(),
});
export type AuditVerify = z.infer<typeof auditVerifySchema>;
