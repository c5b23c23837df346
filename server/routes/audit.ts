import { Router } from 'express';
import { z } from 'zod';
import {
  auditFilterSchema,
  auditListQuerySchema,
  auditListSchema,
  auditVerifySchema,
} from '@shared/schemas/audit';
import { apiErrorSchema } from '@shared/schemas/errors';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import { allAuditEvents, listAudit, verifyChains, workspaceChains } from '../services/audit';
import { toCsv } from '@shared/csv';
import { loadWorkspace } from '../services/members';

const workspaceParams = z.object({ workspaceId: z.uuid() });
const notFoundResponse = {
  description: 'No such workspace, or not one of yours.',
  schema: apiErrorSchema,
};
const forbiddenResponse = {
  description: 'Only admins read the audit trail.',
  schema: apiErrorSchema,
};

/** Most rows one CSV export holds; narrow the filter for more. */
export const AUDIT_EXPORT_MAX_ROWS = 100_000;

export function auditRouter(): Router {
  const router = Router();

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/audit',
    summary:
      "The workspace's audit trail, newest first: every change with actor, database time, old and new values, and the account events (sign-ins, passwords, tokens) of its members. Admins only.",
    tags: ['audit'],
    auth: true,
    params: workspaceParams,
    query: auditListQuerySchema,
    responses: {
      200: { description: 'One page of events.', schema: auditListSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
    },
    transaction: false,
    handle: async ({ actor, params, query }) => {
      const workspace = await loadWorkspace(params.workspaceId, null);
      authorize(actor, 'audit.read', { workspaceId: workspace.id });
      return { status: 200, body: await listAudit(workspace.id, query) };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/audit/export.csv',
    summary: 'The filtered audit trail as CSV (spreadsheet formulas neutralised). Admins only.',
    tags: ['audit'],
    auth: true,
    params: workspaceParams,
    query: auditFilterSchema,
    responses: {
      200: { description: 'text/csv, newest first.' },
      403: forbiddenResponse,
      404: notFoundResponse,
    },
    transaction: false,
    handle: async ({ actor, params, query }) => {
      const workspace = await loadWorkspace(params.workspaceId, null);
      authorize(actor, 'audit.read', { workspaceId: workspace.id });
      const rows: unknown[][] = [];
      for await (const event of allAuditEvents(workspace.id, query)) {
        rows.push([
          event.at,
          event.actor?.name ?? '',
          event.actor?.email ?? '',
          event.action,
          event.entityType,
          event.entityId ?? '',
          event.before === null ? '' : JSON.stringify(event.before),
          event.after === null ? '' : JSON.stringify(event.after),
          event.chain,
          event.position,
          event.hash,
          event.id,
        ]);
        if (rows.length >= AUDIT_EXPORT_MAX_ROWS) break;
      }
      const header = [
        'at_utc',
        'actor',
        'actor_email',
        'action',
        'entity_type',
        'entity_id',
        'old_value',
        'new_value',
        'chain',
        'position',
        'hash',
        'event_id',
      ];
      const stamp = new Date().toISOString().slice(0, 10);
      return {
        status: 200,
        file: {
          contentType: 'text/csv; charset=utf-8',
          filename: `audit-trail-${workspace.slug}-${stamp}.csv`,
          content: toCsv(header, rows),
        },
      };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/audit/verify',
    summary:
      "Recomputes the hash chain of the workspace's audit trail and of the account events, and names the first broken link. Admins only.",
    tags: ['audit'],
    auth: true,
    params: workspaceParams,
    responses: {
      200: {
        description: 'ok, rows checked, and the first broken link if any.',
        schema: auditVerifySchema,
      },
      403: forbiddenResponse,
      404: notFoundResponse,
    },
    transaction: false,
    handle: async ({ actor, params }) => {
      const workspace = await loadWorkspace(params.workspaceId, null);
      authorize(actor, 'audit.verify', { workspaceId: workspace.id });
      return { status: 200, body: await verifyChains(workspaceChains(workspace.id)) };
    },
  });

  return router;
}
