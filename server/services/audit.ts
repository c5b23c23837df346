import type { Transaction } from 'sequelize';
import { AuditEvent } from '../models';

export interface AuditEntry {
  workspaceId: string | null;
  actorId: string | null;
  action: string;
  entityType: string;
  entityId: string | null;
  before?: unknown;
  after?: unknown;
}

/** Appends to the audit trail in the caller's transaction, so the record and the change commit together. */
export async function recordAudit(
  entry: AuditEntry,
  transaction: Transaction | null,
): Promise<void> {
  await AuditEvent.create(
    {
      workspaceId: entry.workspaceId,
      actorId: entry.actorId,
      action: entry.action,
      entityType: entry.entityType,
      entityId: entry.entityId,
      before: entry.before ?? null,
      after: entry.after ?? null,
    },
    { transaction },
  );
}
