import { Router } from 'express';
import { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import {
  createRouteSchema,
  draftConflictSchema,
  duplicateRouteSchema,
  listRoutesQuerySchema,
  projectListQuerySchema,
  projectListSchema,
  routeDetailSchema,
  routeListSchema,
  saveDraftResponseSchema,
  saveDraftSchema,
  updateRouteSchema,
  emptyRouteDocument,
  type DraftDocument,
} from '@shared/schemas/routes';
import type { AppConfig } from '../config';
import { defineRoute, withTransaction } from '../http/route';
import { presentKeyTotals, presentRouteDetail, presentRouteDetailJson } from '../presenters';
import { ENGINE_VERSION } from '@shared/engine/version';
import { authorize } from '../policies';
import { evaluateDraftInPool, saveDraft, PROCESS_SAFETY_NOTE } from '../services/drafts';
import { loadWorkspace, memberWorkspace } from '../services/members';
import {
  createRoute,
  duplicateRoute,
  listProjects,
  listRoutes,
  loadRoute,
  readRoute,
  updateRoute,
} from '../services/routes';

const workspaceParams = z.object({ workspaceId: z.uuid() });
const routeParams = z.object({ workspaceId: z.uuid(), routeId: z.uuid() });
const notFoundResponse = {
  description: 'No such workspace or route, or not one of yours.',
  schema: apiErrorSchema,
};
const forbiddenResponse = {
  description: 'Only chemists and admins change routes.',
  schema: apiErrorSchema,
};

export function routesRouter(config: AppConfig): Router {
  const router = Router();

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/routes',
    summary:
      'One page of the routes of the workspace with project, owner, status, last change and key totals; archived=true lists the archived ones; q searches route and project names; sort=changed (newest first, default) or name; limit (default 50, at most 200) and the cursor of the previous page.',
    tags: ['routes'],
    auth: true,
    params: workspaceParams,
    query: listRoutesQuerySchema,
    responses: {
      200: {
        description: 'One page of routes and the cursor of the next page (null on the last).',
        schema: routeListSchema,
      },
      404: notFoundResponse,
    },
    handle: async ({ actor, params, query, transaction }) => {
      const workspace = memberWorkspace(actor, params.workspaceId);
      authorize(actor, 'route.list', { workspaceId: workspace.id });
      const page = await listRoutes(workspace.id, query, transaction);
      // The items come as JSON text from the database (listRoutes()).
      return {
        status: 200,
        json: `{"items":[${page.itemsJson.join(',')}],"nextCursor":${JSON.stringify(page.nextCursor)}}`,
      };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/workspaces/{workspaceId}/routes',
    summary:
      'Create a route (chemists and admins), optionally in a project (created when new) and from a document; otherwise it starts empty.',
    tags: ['routes'],
    auth: true,
    params: workspaceParams,
    body: createRouteSchema,
    responses: {
      201: { description: 'Created.', schema: routeDetailSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
    },
    // The engine pool evaluates the document first; the transaction holds no connection meanwhile.
    transaction: false,
    handle: async ({ actor, params, body }) => {
      const workspace = await loadWorkspace(params.workspaceId, null);
      authorize(actor, 'route.create', { workspaceId: workspace.id });
      const document = body.document ?? (emptyRouteDocument(body.name) as DraftDocument);
      const evaluation = await evaluateDraftInPool(document, actor.userId, config.evaluation);
      const route = await withTransaction((transaction) =>
        createRoute(
          {
            workspaceId: workspace.id,
            ownerId: actor.userId,
            name: body.name,
            projectName: body.projectName,
            document,
            evaluation,
          },
          transaction,
        ),
      );
      return { status: 201, body: presentRouteDetail(route, actor) };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/routes/{routeId}',
    summary:
      'A route with its draft document, version, who saved it last, and what the caller may do.',
    tags: ['routes'],
    auth: true,
    params: routeParams,
    responses: {
      200: { description: 'The route.', schema: routeDetailSchema },
      404: notFoundResponse,
    },
    handle: async ({ actor, params, transaction }) => {
      const workspace = memberWorkspace(actor, params.workspaceId);
      authorize(actor, 'route.read', { workspaceId: workspace.id });
      const { route, documentJson } = await readRoute(workspace.id, params.routeId, transaction);
      return { status: 200, json: presentRouteDetailJson(route, documentJson, actor) };
    },
  });

  defineRoute(router, {
    method: 'patch',
    path: '/workspaces/{workspaceId}/routes/{routeId}',
    summary:
      'Rename a route, move it to a project (projectName, or null for none), archive or unarchive it (chemists and admins).',
    tags: ['routes'],
    auth: true,
    params: routeParams,
    body: updateRouteSchema,
    responses: {
      200: { description: 'Updated.', schema: routeDetailSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
    },
    handle: async ({ actor, params, body, transaction }) => {
      const workspace = memberWorkspace(actor, params.workspaceId);
      const scope = { workspaceId: workspace.id };
      authorize(actor, 'route.read', scope);
      if (body.name !== undefined || body.projectName !== undefined)
        authorize(actor, 'route.rename', scope);
      if (body.archived !== undefined) authorize(actor, 'route.archive', scope);
      const route = await loadRoute(workspace.id, params.routeId, transaction);
      const updated = await updateRoute(route, body, actor.userId, transaction);
      return { status: 200, body: presentRouteDetail(updated, actor) };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/workspaces/{workspaceId}/routes/{routeId}/duplicate',
    summary:
      'Copy a route and its current draft into a new route owned by the caller (chemists and admins).',
    tags: ['routes'],
    auth: true,
    params: routeParams,
    body: duplicateRouteSchema,
    responses: {
      201: { description: 'The copy.', schema: routeDetailSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
    },
    transaction: false,
    handle: async ({ actor, params, body }) => {
      const workspace = await loadWorkspace(params.workspaceId, null);
      authorize(actor, 'route.duplicate', { workspaceId: workspace.id });
      const source = await loadRoute(workspace.id, params.routeId, null);
      const evaluation = await evaluateDraftInPool(
        source.draft!.document as DraftDocument,
        actor.userId,
        config.evaluation,
      );
      const copy = await withTransaction(async (transaction) => {
        // Copies the draft as it is now; the evaluation above is of the same document unless it changed meanwhile.
        const route = await loadRoute(workspace.id, params.routeId, transaction);
        return duplicateRoute(route, body.name, evaluation, actor.userId, transaction);
      });
      return { status: 201, body: presentRouteDetail(copy, actor) };
    },
  });

  defineRoute(router, {
    method: 'put',
    path: '/workspaces/{workspaceId}/routes/{routeId}/draft',
    summary:
      'Save the draft (autosave). baseVersion is the version the edit started from; if the draft changed since, 409 draft_conflict returns the current draft and who changed it. The document is evaluated; totals are null with the reason when it cannot be.',
    tags: ['routes'],
    auth: true,
    params: routeParams,
    body: saveDraftSchema,
    responses: {
      200: {
        description: 'Saved: the new version, the totals and the engine cautions.',
        schema: saveDraftResponseSchema,
      },
      403: forbiddenResponse,
      404: notFoundResponse,
      409: {
        description:
          'draft_conflict (changed since baseVersion; details.current) or route_archived.',
        schema: draftConflictSchema,
      },
    },
    transaction: false,
    handle: async ({ actor, params, body }) => {
      const workspace = await loadWorkspace(params.workspaceId, null);
      authorize(actor, 'route.editDraft', { workspaceId: workspace.id });
      await loadRoute(workspace.id, params.routeId, null);
      const { document } = body;
      // Evaluated in the engine pool before the transaction, so no row stays locked meanwhile.
      const evaluated = await evaluateDraftInPool(document, actor.userId, config.evaluation);
      const { draft, evaluation } = await withTransaction(async (transaction) =>
        saveDraft(
          await loadRoute(workspace.id, params.routeId, transaction),
          { document, baseVersion: body.baseVersion, evaluation: evaluated },
          actor.userId,
          transaction,
        ),
      );
      return {
        status: 200,
        body: {
          version: draft.version,
          updatedAt: draft.updatedAt.toISOString(),
          totals: presentKeyTotals(evaluation.totals, ENGINE_VERSION),
          evaluationError: evaluation.evaluationError,
          warnings: evaluation.warnings,
          processSafetyNote: PROCESS_SAFETY_NOTE,
        },
      };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/projects',
    summary:
      'One page of the projects of the workspace by name, each with the number of its routes that are not archived; q searches project names; limit (default 50, at most 200) and the cursor of the previous page.',
    tags: ['routes'],
    auth: true,
    params: workspaceParams,
    query: projectListQuerySchema,
    responses: {
      200: {
        description: 'One page of projects and the cursor of the next page (null on the last).',
        schema: projectListSchema,
      },
      404: notFoundResponse,
    },
    handle: async ({ actor, params, query, transaction }) => {
      const workspace = memberWorkspace(actor, params.workspaceId);
      authorize(actor, 'project.list', { workspaceId: workspace.id });
      return { status: 200, body: await listProjects(workspace.id, query, transaction) };
    },
  });

  return router;
}
