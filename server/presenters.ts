// Shapes models into the shared API payloads. Only these fields ever leave the server.
import type {
  Member,
  Invitation as InvitationPayload,
  InvitationInfo,
} from '@shared/schemas/members';
import type { OutboxMessage as OutboxPayload } from '@shared/schemas/outbox';
import type { Role, Session } from '@shared/schemas/session';
import type { ApiToken as ApiTokenPayload } from '@shared/schemas/tokens';
import type { ApiToken, Invitation, Membership, OutboxMessage, User } from './models';
import { Workspace } from './models';
import { abilitiesFor, type Actor } from './policies';

export async function presentSession(
  user: User,
  actor: Actor,
  csrfToken: string,
): Promise<Session> {
  const workspaces = await Workspace.findAll({
    where: { id: [...actor.memberships.keys()] },
    order: [['name', 'ASC']],
  });
  return {
    user: { id: user.id, email: user.email, name: user.name },
    workspaces: workspaces.map((w) => ({
      id: w.id,
      name: w.name,
      slug: w.slug,
      roles: [...(actor.memberships.get(w.id) ?? [])],
    })),
    csrfToken,
    abilities: abilitiesFor(actor),
  };
}

export const presentMember = (membership: Membership): Member => ({
  userId: membership.userId as string,
  email: membership.user!.email,
  name: membership.user!.name,
  roles: membership.roles as Role[],
  joinedAt: membership.createdAt.toISOString(),
});

export const presentInvitation = (invitation: Invitation): InvitationPayload => ({
  id: invitation.id,
  email: invitation.email,
  roles: invitation.roles,
  expiresAt: invitation.expiresAt.toISOString(),
});

export const presentInvitationInfo = (
  invitation: Invitation,
  existingUser: boolean,
): InvitationInfo => ({
  workspaceName: invitation.workspace!.name,
  email: invitation.email,
  roles: invitation.roles,
  expiresAt: invitation.expiresAt.toISOString(),
  existingUser,
});

export const presentToken = (token: ApiToken): ApiTokenPayload => ({
  id: token.id,
  name: token.name,
  createdAt: token.createdAt.toISOString(),
  lastUsedAt: token.lastUsedAt ? token.lastUsedAt.toISOString() : null,
});

export const presentOutboxMessage = (message: OutboxMessage): OutboxPayload => ({
  id: message.id,
  to: message.to,
  subject: message.subject,
  text: message.text,
  html: message.html,
  receivedAt: message.receivedAt.toISOString(),
});
