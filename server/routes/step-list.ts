import { Router } from 'express';
import { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import { routeDetailSchema } from '@shared/schemas/routes';
import {
  STEP_LIST_CONTENT_TYPES,
  stepListDocumentSchema,
  stepListRequestSchema,
} from '@shared/schemas/step-list';
import type { AppConfig } from '../config';
import { defineRoute, withTransaction } from '../http/route';
import { presentRouteDetail } from '../presenters';
import { authorize } from '../policies';
import { evaluateDraftInPool } from '../services/drafts';
import { loadWorkspace } from '../services/members';
import { createRoute, loadRoute } from '../services/routes';
import {
  importedDocument,
  importedRouteName,
  loadStepListRevision,
  makeStepList,
} from '../services/step-list';
import { fileName, renderCsv, renderPdf, renderXlsx } from '../services/step-list-export';

const revisionNumber = z.coerce
  .number({ message: 'Use a revision number.' })
  .int({ message: 'Use a revision number.' })
  .min(1, { message: 'Use a revision number.' })
  .max(1_000_000_000);
const params = z.object({ workspaceId: z.uuid(), routeId: z.uuid(), number: revisionNumber });

export function stepListRouter(config: AppConfig): Router {
  const router = Router();

  defineRoute(router, {
    method: 'post',
    path: '/workspaces/{workspaceId}/routes/{routeId}/revisions/{number}/step-list',
    summary:
      'The plant step list of a revision (scale-up engineers and admins): `{ batchKg, basis: "input"|"product", equipment: { stepId: equipmentId }, format: "json"|"csv"|"xlsx"|"pdf" }` → the step list in that format (application/json, text/csv, the XLSX type or application/pdf). A revision that is not approved exports with draft: true and a DRAFT mark. JSON numbers are unrounded; docs/step-list-format.md describes the JSON.',
    tags: ['step list'],
    auth: true,
    params,
    body: stepListRequestSchema,
    // Nothing is written: an export of a read-only token is allowed.
    writes: false,
    transaction: false,
    responses: {
      200: {
        description:
          'The step list. The schema is the JSON format; csv, xlsx and pdf answer the file with its content type.',
        schema: stepListDocumentSchema,
      },
      403: {
        description: 'Only scale-up engineers and admins export step lists.',
        schema: apiErrorSchema,
      },
      404: {
        description: 'No such workspace, route or revision, or not one of yours.',
        schema: apiErrorSchema,
      },
      422: {
        description:
          'not_computable (the revision has no evaluation, or isolates no product on the product basis), route_invalid or route_unevaluable (the scaled route cannot be evaluated).',
        schema: apiErrorSchema,
      },
    },
    handle: async ({ actor, params: p, body, res }) => {
      const { route, revision } = await withTransaction(async (transaction) => {
        const workspace = await loadWorkspace(p.workspaceId, transaction);
        authorize(actor, 'stepList.export', { workspaceId: workspace.id });
        const found = await loadRoute(workspace.id, p.routeId, transaction);
        return { route: found, revision: await loadStepListRevision(found, p.number, transaction) };
      });
      const list = await makeStepList({
        route,
        revision,
        request: body,
        userId: actor.userId,
        limits: config.evaluation,
        transaction: null,
      });
      switch (body.format) {
        case 'json':
          res.attachment(fileName(list, 'json'));
          return { status: 200, json: JSON.stringify(list) };
        case 'csv':
          return {
            status: 200,
            file: {
              contentType: STEP_LIST_CONTENT_TYPES.csv,
              filename: fileName(list, 'csv'),
              content: renderCsv(list),
            },
          };
        case 'xlsx':
          return {
            status: 200,
            file: {
              contentType: STEP_LIST_CONTENT_TYPES.xlsx,
              filename: fileName(list, 'xlsx'),
              content: await renderXlsx(list),
            },
          };
        case 'pdf':
          return {
            status: 200,
            file: {
              contentType: STEP_LIST_CONTENT_TYPES.pdf,
              filename: fileName(list, 'pdf'),
              content: await renderPdf(list),
            },
          };
      }
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/workspaces/{workspaceId}/routes/import',
    summary:
      "Import a step list exported as JSON (chemists and admins): a new route whose draft is the step list's route document, scaled to its batch, so it evaluates to the same totals.",
    tags: ['step list'],
    auth: true,
    params: z.object({ workspaceId: z.uuid() }),
    body: stepListDocumentSchema,
    transaction: false,
    responses: {
      201: { description: 'The new route.', schema: routeDetailSchema },
      403: { description: 'Only chemists and admins create routes.', schema: apiErrorSchema },
      404: { description: 'No such workspace, or not one of yours.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params: p, body }) => {
      const workspace = await loadWorkspace(p.workspaceId, null);
      authorize(actor, 'route.import', { workspaceId: workspace.id });
      const document = importedDocument(body);
      const evaluation = await evaluateDraftInPool(document, actor.userId, config.evaluation);
      const route = await withTransaction((transaction) =>
        createRoute(
          {
            workspaceId: workspace.id,
            ownerId: actor.userId,
            name: importedRouteName(body),
            document,
            evaluation,
          },
          transaction,
        ),
      );
      return { status: 201, body: presentRouteDetail(route, actor) };
    },
  });

  return router;
}
