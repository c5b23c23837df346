import { Router } from 'express';
import { z } from 'zod';
import {
  equipmentCreateSchema,
  equipmentListQuerySchema,
  equipmentListSchema,
  equipmentSchema,
  equipmentUpdateSchema,
} from '@shared/schemas/equipment';
import { apiErrorSchema } from '@shared/schemas/errors';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import {
  createEquipment,
  deleteEquipment,
  listEquipment,
  loadEquipment,
  presentEquipment,
  updateEquipment,
} from '../services/equipment';
import { loadWorkspace, memberWorkspace } from '../services/members';

const workspaceParams = z.object({ workspaceId: z.uuid() });
const itemParams = z.object({ workspaceId: z.uuid(), id: z.uuid() });
const notFoundResponse = {
  description: 'No such workspace or equipment, or not one of yours.',
  schema: apiErrorSchema,
};
const forbiddenResponse = {
  description: 'Only scale-up engineers and admins manage equipment.',
  schema: apiErrorSchema,
};
const nameTakenResponse = {
  description: 'already_exists: the workspace has equipment of that name.',
  schema: apiErrorSchema,
};

export function equipmentRouter(): Router {
  const router = Router();

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/equipment',
    summary:
      'One page of the vessels, filters and dryers of the workspace (every member reads them): vessels first, by name; `kind` and `q` (part of the name) filter, `sort=size` puts the largest first; limit (default 50, at most 200) and the cursor of the previous page.',
    tags: ['equipment'],
    auth: true,
    params: workspaceParams,
    query: equipmentListQuerySchema,
    responses: {
      200: { description: 'One page of equipment.', schema: equipmentListSchema },
      404: notFoundResponse,
    },
    handle: async ({ actor, params, query, transaction }) => {
      const workspace = memberWorkspace(actor, params.workspaceId);
      authorize(actor, 'equipment.list', { workspaceId: workspace.id });
      const page = await listEquipment(workspace.id, query, transaction);
      return {
        status: 200,
        body: { items: page.items.map(presentEquipment), nextCursor: page.nextCursor },
      };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/workspaces/{workspaceId}/equipment',
    summary:
      'Add a vessel `{kind:"vessel", name, nominalL, minStirrableL, maxWorkingL, minC, maxC, minMbar, maxMbar, material}` or a filter or dryer `{kind, name, areaM2, capacityL}` (scale-up engineers and admins).',
    tags: ['equipment'],
    auth: true,
    params: workspaceParams,
    body: equipmentCreateSchema,
    responses: {
      201: { description: 'Added.', schema: equipmentSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
      409: nameTakenResponse,
    },
    handle: async ({ actor, params, body, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'equipment.create', { workspaceId: workspace.id });
      const item = await createEquipment(workspace.id, actor.userId, body, transaction);
      return { status: 201, body: presentEquipment(item) };
    },
  });

  defineRoute(router, {
    method: 'patch',
    path: '/workspaces/{workspaceId}/equipment/{id}',
    summary:
      'Change fields of a vessel, filter or dryer (scale-up engineers and admins); the kind stays. The joined rules (minimum below maximum) are checked on the record as it becomes.',
    tags: ['equipment'],
    auth: true,
    params: itemParams,
    body: equipmentUpdateSchema,
    responses: {
      200: { description: 'Changed.', schema: equipmentSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
      409: nameTakenResponse,
    },
    handle: async ({ actor, params, body, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'equipment.update', { workspaceId: workspace.id });
      const item = await loadEquipment(workspace.id, params.id, transaction);
      const updated = await updateEquipment(item, actor.userId, body, transaction);
      return { status: 200, body: presentEquipment(updated) };
    },
  });

  defineRoute(router, {
    method: 'delete',
    path: '/workspaces/{workspaceId}/equipment/{id}',
    summary:
      'Remove a vessel, filter or dryer (scale-up engineers and admins). Step lists already exported keep what they said.',
    tags: ['equipment'],
    auth: true,
    params: itemParams,
    responses: { 204: { description: 'Removed.' }, 403: forbiddenResponse, 404: notFoundResponse },
    handle: async ({ actor, params, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'equipment.delete', { workspaceId: workspace.id });
      const item = await loadEquipment(workspace.id, params.id, transaction);
      await deleteEquipment(item, actor.userId, transaction);
      return { status: 204 };
    },
  });

  return router;
}
