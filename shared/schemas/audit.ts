import { z } from 'zod';
import { listPagingSchema, listReplySchema } from './lists';

const isoDateTime = z.iso.datetime({
  offset: true,
  message: 'Use a date and time such as 2026-12-01T08:00:00Z.',
});
const isoDateOrDateTime = z.union([z.iso.date(), isoDateTime], {
  message: 'Use a date (2026-12-01) or a date and time (2026-12-01T08:00:00Z).',
});

/** Filters of the audit trail list and its CSV export. */
export const auditFilterSchema = z.object({
  entityType: z.string().trim().min(1).max(80).optional(),
  entityId: z.string().trim().min(1).max(80).optional(),
  actorId: z.uuid({ message: 'Choose a person from the list.' }).optional(),
  action: z.string().trim().min(1).max(80).optional(),
  /** From this time on (a date means its start, UTC). */
  from: isoDateOrDateTime.optional(),
  /** Up to this time (a date means its end, UTC). */
  to: isoDateOrDateTime.optional(),
});
export const auditListQuerySchema = auditFilterSchema.extend(listPagingSchema.shape);
export type AuditFilter = z.infer<typeof auditFilterSchema>;

export const auditEventSchema = z.object({
  id: z.string(),
  /** Set by the database clock, UTC. */
  at: z.string(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.string().nullable(),
  actor: z.object({ id: z.string(), name: z.string(), email: z.string() }).nullable(),
  /** null for account events (sign-ins, passwords, tokens). */
  workspaceId: z.string().nullable(),
  before: z.unknown(),
  after: z.unknown(),
  /** The hash chain: the workspace id or "account", the position in it, and the hashes. */
  chain: z.string(),
  position: z.number().int(),
  prevHash: z.string(),
  hash: z.string(),
});
export type AuditEventPayload = z.infer<typeof auditEventSchema>;
export const auditListSchema = listReplySchema(auditEventSchema);

export const auditVerifySchema = z.object({
  ok: z.boolean(),
  /** Rows whose hash was recomputed. */
  checked: z.number().int(),
  firstBroken: z
    .object({
      id: z.string(),
      at: z.string(),
      chain: z.string(),
      position: z.number().int(),
      reason: z.string(),
    })
    .optional(),
});
export type AuditVerify = z.infer<typeof auditVerifySchema>;
