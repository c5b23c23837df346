import { Router } from 'express';
import { z } from 'zod';
import { text } from '@shared/schemas/text';
import { apiErrorSchema } from '@shared/schemas/errors';
import { acceptInvitationSchema, invitationInfoSchema } from '@shared/schemas/members';
import { sessionSchema } from '@shared/schemas/session';
import { logIn } from '../auth/passport';
import type { AppConfig } from '../config';
import { defineRoute } from '../http/route';
import { newCsrfToken } from '../middleware/csrf';
import { limitRequests } from '../middleware/rate-limit';
import { presentInvitationInfo, presentSession } from '../presenters';
import { loadActor } from '../services/actors';
import { acceptInvitation, loadOpenInvitation, userExists } from '../services/invitations';

const tokenParams = z.object({ token: text().min(20).max(200) });
const unusable = {
  404: { description: 'Unknown invitation.', schema: apiErrorSchema },
  410: { description: 'Already used or expired.', schema: apiErrorSchema },
};

export function invitationsRouter(config: AppConfig): Router {
  const router = Router();
  // Accepting checks a password for existing accounts, so it is limited like sign-in.
  const acceptLimiter = limitRequests({
    windowMinutes: config.rateLimits.windowMinutes,
    limit: config.rateLimits.signInPerWindow,
  });

  defineRoute(router, {
    method: 'get',
    path: '/invitations/{token}',
    summary: 'What an invitation link offers (public).',
    tags: ['invitations'],
    auth: false,
    params: tokenParams,
    responses: {
      200: { description: 'The invitation.', schema: invitationInfoSchema },
      ...unusable,
    },
    handle: async ({ params, transaction }) => {
      const invitation = await loadOpenInvitation(params.token, transaction);
      return {
        status: 200,
        body: presentInvitationInfo(invitation, await userExists(invitation.email, transaction)),
      };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/invitations/{token}/accept',
    summary:
      'Accept an invitation: creates the account if new (name + password) or checks the existing password; signs in.',
    tags: ['invitations'],
    auth: false,
    params: tokenParams,
    body: acceptInvitationSchema,
    before: [acceptLimiter],
    responses: {
      200: { description: 'Joined and signed in.', schema: sessionSchema },
      401: { description: 'Wrong password for the existing account.', schema: apiErrorSchema },
      ...unusable,
    },
    handle: async ({ req, params, body, transaction }) => {
      const invitation = await loadOpenInvitation(params.token, transaction);
      const user = await acceptInvitation({
        invitation,
        name: body.name,
        password: body.password,
        transaction,
      });
      await logIn(req, user);
      req.session.csrfToken = newCsrfToken();
      const actor = await loadActor(user.id, transaction);
      return { status: 200, body: await presentSession(user, actor, req.session.csrfToken) };
    },
  });
  return router;
}
