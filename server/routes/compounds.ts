import { Router } from 'express';
import { z } from 'zod';
import {
  compoundCreateSchema,
  compoundListQuerySchema,
  compoundListSchema,
  compoundSchema,
  compoundUpdateSchema,
  structurePreviewRequestSchema,
  structurePreviewSchema,
} from '@shared/schemas/compounds';
import { apiErrorSchema } from '@shared/schemas/errors';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import {
  createCompound,
  deleteCompound,
  listCompounds,
  loadCompound,
  presentCompound,
  previewStructure,
  updateCompound,
} from '../services/compounds';
import { loadWorkspace, memberWorkspace } from '../services/members';

const workspaceParams = z.object({ workspaceId: z.uuid() });
const compoundParams = z.object({ workspaceId: z.uuid(), compoundId: z.uuid() });
const notFoundResponse = {
  description: 'No such workspace or compound, or not one of yours.',
  schema: apiErrorSchema,
};
const forbiddenResponse = {
  description: 'Only chemists and admins enter or change compounds.',
  schema: apiErrorSchema,
};
const unparsableResponse = {
  description:
    'structure_unparsable: the SMILES or molfile cannot be read; the message names the problem and details the field.',
  schema: apiErrorSchema,
};

export function compoundsRouter(): Router {
  const router = Router();

  defineRoute(router, {
    method: 'post',
    path: '/structures/preview',
    summary:
      'Parse a SMILES or molfile: formula, molar mass, drawing, UNIFAC groups and the logP/Hansen estimates.',
    tags: ['compounds'],
    auth: true,
    transaction: false,
    body: structurePreviewRequestSchema,
    responses: {
      200: { description: 'What the structure is.', schema: structurePreviewSchema },
      422: unparsableResponse,
    },
    handle: async ({ actor, body }) => {
      authorize(actor, 'structure.preview', null);
      return { status: 200, body: previewStructure(body) };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/compounds',
    summary:
      'One page of the compounds of a workspace; sort=name (default) or created (newest first); q matches part of the name or the formula; limit (default 50, at most 200) and the cursor of the previous page.',
    tags: ['compounds'],
    auth: true,
    params: workspaceParams,
    query: compoundListQuerySchema,
    responses: {
      200: {
        description: 'One page of compounds and the cursor of the next page (null on the last).',
        schema: compoundListSchema,
      },
      404: notFoundResponse,
    },
    handle: async ({ actor, params, query, transaction }) => {
      const workspace = memberWorkspace(actor, params.workspaceId);
      authorize(actor, 'compound.list', { workspaceId: workspace.id });
      const page = await listCompounds(workspace.id, query, transaction);
      return {
        status: 200,
        body: { items: page.items.map(presentCompound), nextCursor: page.nextCursor },
      };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/workspaces/{workspaceId}/compounds',
    summary:
      'Add a compound from a SMILES or molfile (chemists and admins); what is not entered is estimated and marked so.',
    tags: ['compounds'],
    auth: true,
    params: workspaceParams,
    body: compoundCreateSchema,
    responses: {
      201: { description: 'Created.', schema: compoundSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
      422: unparsableResponse,
    },
    handle: async ({ actor, params, body, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'compound.create', { workspaceId: workspace.id });
      const compound = await createCompound(
        { workspaceId: workspace.id, actorId: actor.userId, input: body },
        transaction,
      );
      return { status: 201, body: presentCompound(compound) };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/compounds/{compoundId}',
    summary: 'One compound with its structure, groups, measured data and estimates.',
    tags: ['compounds'],
    auth: true,
    params: compoundParams,
    responses: {
      200: { description: 'The compound.', schema: compoundSchema },
      404: notFoundResponse,
    },
    handle: async ({ actor, params, transaction }) => {
      const workspace = memberWorkspace(actor, params.workspaceId);
      authorize(actor, 'compound.read', { workspaceId: workspace.id });
      const compound = await loadCompound(workspace.id, params.compoundId, transaction);
      return { status: 200, body: presentCompound(compound) };
    },
  });

  defineRoute(router, {
    method: 'patch',
    path: '/workspaces/{workspaceId}/compounds/{compoundId}',
    summary:
      'Change a compound (chemists and admins). null clears a value: an entered logP or Hansen set goes back to the estimate, edited groups to the automatic ones.',
    tags: ['compounds'],
    auth: true,
    params: compoundParams,
    body: compoundUpdateSchema,
    responses: {
      200: { description: 'Updated.', schema: compoundSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
      422: unparsableResponse,
    },
    handle: async ({ actor, params, body, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'compound.update', { workspaceId: workspace.id });
      const compound = await loadCompound(workspace.id, params.compoundId, transaction);
      const updated = await updateCompound(compound, body, actor.userId, transaction);
      return { status: 200, body: presentCompound(updated) };
    },
  });

  defineRoute(router, {
    method: 'delete',
    path: '/workspaces/{workspaceId}/compounds/{compoundId}',
    summary: 'Delete a compound (chemists and admins). Routes keep their own snapshot of it.',
    tags: ['compounds'],
    auth: true,
    params: compoundParams,
    responses: { 204: { description: 'Deleted.' }, 403: forbiddenResponse, 404: notFoundResponse },
    handle: async ({ actor, params, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'compound.delete', { workspaceId: workspace.id });
      const compound = await loadCompound(workspace.id, params.compoundId, transaction);
      await deleteCompound(compound, actor.userId, transaction);
      return { status: 204 };
    },
  });

  return router;
}
