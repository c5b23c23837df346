import { Router } from 'express';
import { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import {
  invitationSchema,
  inviteSchema,
  memberListQuerySchema,
  memberListSchema,
  memberSchema,
  pendingInvitationListSchema,
  updateRolesSchema,
} from '@shared/schemas/members';
import type { AppConfig } from '../config';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import { presentInvitation, presentMember, presentPendingInvitation } from '../presenters';
import {
  inviteMember,
  listPendingInvitations,
  loadPendingInvitation,
  resendInvitation,
  revokeInvitation,
} from '../services/invitations';
import {
  listMembers,
  loadMembership,
  loadWorkspace,
  memberWorkspace,
  removeMember,
  updateRoles,
} from '../services/members';

const workspaceParams = z.object({ workspaceId: z.uuid() });
const memberParams = z.object({ workspaceId: z.uuid(), userId: z.uuid() });
const invitationParams = z.object({ workspaceId: z.uuid(), invitationId: z.uuid() });
const notFoundResponse = {
  description: 'No such workspace or member, or not one of yours.',
  schema: apiErrorSchema,
};
const forbiddenResponse = { description: 'Only admins may do this.', schema: apiErrorSchema };

export function membersRouter(config: AppConfig): Router {
  const router = Router();

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/members',
    summary:
      'One page of the members of a workspace with their roles, by name; q matches part of the name or e-mail; role keeps the holders of one role; limit (default 50, at most 200) and the cursor of the previous page.',
    tags: ['members'],
    auth: true,
    params: workspaceParams,
    query: memberListQuerySchema,
    responses: {
      200: {
        description: 'One page of members and the cursor of the next page (null on the last).',
        schema: memberListSchema,
      },
      404: notFoundResponse,
    },
    handle: async ({ actor, params, query, transaction }) => {
      const workspace = memberWorkspace(actor, params.workspaceId);
      authorize(actor, 'member.list', { workspaceId: workspace.id });
      const page = await listMembers(workspace.id, query, transaction);
      return {
        status: 200,
        body: { items: page.items.map(presentMember), nextCursor: page.nextCursor },
      };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/workspaces/{workspaceId}/invitations',
    summary: 'Invite someone by e-mail with the given roles (admins).',
    tags: ['members'],
    auth: true,
    params: workspaceParams,
    body: inviteSchema,
    responses: {
      201: { description: 'Invitation created and e-mail queued.', schema: invitationSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
      409: { description: 'Already a member.', schema: apiErrorSchema },
    },
    handle: async ({ req, actor, params, body, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'member.invite', { workspaceId: workspace.id });
      const invitation = await inviteMember({
        workspace,
        inviter: req.user!,
        email: body.email,
        roles: body.roles,
        appUrl: config.appUrl,
        transaction,
      });
      return { status: 201, body: presentInvitation(invitation) };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/invitations',
    summary:
      'The invitations not yet accepted and not expired or revoked, newest first, with who sent each (admins).',
    tags: ['members'],
    auth: true,
    params: workspaceParams,
    responses: {
      200: { description: 'The pending invitations.', schema: pendingInvitationListSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
    },
    handle: async ({ actor, params, transaction }) => {
      const workspace = memberWorkspace(actor, params.workspaceId);
      authorize(actor, 'invitation.list', { workspaceId: workspace.id });
      const items = await listPendingInvitations(workspace.id, transaction);
      return { status: 200, body: { items: items.map(presentPendingInvitation) } };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/workspaces/{workspaceId}/invitations/{invitationId}/resend',
    summary:
      'Send a pending invitation again: a new link, valid for another 7 days; the old link stops working (admins).',
    tags: ['members'],
    auth: true,
    params: invitationParams,
    responses: {
      200: { description: 'Sent again; the new expiry.', schema: invitationSchema },
      403: forbiddenResponse,
      404: { description: 'No such pending invitation in this workspace.', schema: apiErrorSchema },
    },
    handle: async ({ req, actor, params, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'invitation.resend', { workspaceId: workspace.id });
      const invitation = await loadPendingInvitation(
        workspace.id,
        params.invitationId,
        transaction,
      );
      await resendInvitation({
        invitation,
        workspace,
        actor: req.user!,
        appUrl: config.appUrl,
        transaction,
      });
      return { status: 200, body: presentInvitation(invitation) };
    },
  });

  defineRoute(router, {
    method: 'delete',
    path: '/workspaces/{workspaceId}/invitations/{invitationId}',
    summary: 'Revoke a pending invitation: its link stops working at once (admins).',
    tags: ['members'],
    auth: true,
    params: invitationParams,
    responses: {
      204: { description: 'Revoked.' },
      403: forbiddenResponse,
      404: { description: 'No such pending invitation in this workspace.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'invitation.revoke', { workspaceId: workspace.id });
      const invitation = await loadPendingInvitation(
        workspace.id,
        params.invitationId,
        transaction,
      );
      await revokeInvitation({ invitation, actorId: actor.userId, transaction });
      return { status: 204 };
    },
  });

  defineRoute(router, {
    method: 'patch',
    path: '/workspaces/{workspaceId}/members/{userId}',
    summary: "Replace a member's roles (admins).",
    tags: ['members'],
    auth: true,
    params: memberParams,
    body: updateRolesSchema,
    responses: {
      200: { description: 'Updated.', schema: memberSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
      409: { description: 'Would leave the workspace without an admin.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params, body, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'member.updateRoles', { workspaceId: workspace.id });
      const membership = await loadMembership(workspace.id, params.userId, transaction);
      await updateRoles(membership, body.roles, actor.userId, transaction);
      return { status: 200, body: presentMember(membership) };
    },
  });

  defineRoute(router, {
    method: 'delete',
    path: '/workspaces/{workspaceId}/members/{userId}',
    summary: 'Remove a member from the workspace (admins; never the last admin).',
    tags: ['members'],
    auth: true,
    params: memberParams,
    responses: {
      204: { description: 'Removed.' },
      403: forbiddenResponse,
      404: notFoundResponse,
      409: { description: 'The last admin cannot be removed.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'member.remove', { workspaceId: workspace.id });
      const membership = await loadMembership(workspace.id, params.userId, transaction);
      await removeMember(membership, actor.userId, transaction);
      return { status: 204 };
    },
  });
  return router;
}
