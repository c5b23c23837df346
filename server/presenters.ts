// Shapes models into the shared API payloads. Only these fields ever leave the server.
import type {
  Member,
  Invitation as InvitationPayload,
  InvitationInfo,
  PendingInvitation as PendingInvitationPayload,
} from '@shared/schemas/members';
import type { OutboxMessage as OutboxPayload } from '@shared/schemas/outbox';
import type { Role, Session } from '@shared/schemas/session';
import type { ApiToken as ApiTokenPayload } from '@shared/schemas/tokens';
import type { DraftDocument, KeyTotals, RouteDetail, RouteSummary } from '@shared/schemas/routes';
import type { RouteTotals } from '@shared/engine/route/evaluate';
import type {
  ApiToken,
  Invitation,
  Membership,
  OutboxMessage,
  Route,
  RouteDraft,
  User,
} from './models';
import { Workspace } from './models';
import type { RouteView } from './services/routes';
import { abilitiesFor, can, type Actor } from './policies';

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

export const presentPendingInvitation = (invitation: Invitation): PendingInvitationPayload => ({
  ...presentInvitation(invitation),
  invitedBy: invitation.invitedBy
    ? { id: invitation.invitedBy.id, name: invitation.invitedBy.name }
    : null,
  createdAt: invitation.createdAt.toISOString(),
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
  scope: token.scope,
  createdAt: token.createdAt.toISOString(),
  expiresAt: token.expiresAt.toISOString(),
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

/** The figures a routes list shows, from stored totals and the engine version that computed them. */
export function presentKeyTotals(totals: unknown, engineVersion: string | null): KeyTotals | null {
  if (!totals) return null;
  const t = totals as RouteTotals;
  return { yieldPct: t.yieldPct, purityPct: t.purityWtPct, pmi: t.pmi, engineVersion };
}

const latest = (a: Date, b: Date) => (a > b ? a : b);

export function presentRouteSummary(route: Route | RouteView): RouteSummary {
  const draft = route.draft as RouteView['draft'] | RouteDraft;
  return {
    id: route.id,
    name: route.name,
    project: route.project ? { id: route.project.id, name: route.project.name } : null,
    status: route.archivedAt ? 'archived' : 'draft',
    owner: { id: route.owner!.id, name: route.owner!.name },
    updatedAt: latest(route.updatedAt, draft.updatedAt).toISOString(),
    draftVersion: draft.version,
    version: route.version,
    totals:
      'keyTotals' in draft ? draft.keyTotals : presentKeyTotals(draft.totals, draft.engineVersion),
    stepCount: draft.stepCount,
  };
}

/**
 * The route detail as JSON text, its draft document spliced in as stored (readRoute()): the
 * same reply presentRouteDetail() gives, without parsing the document and writing it again.
 */
export function presentRouteDetailJson(
  route: RouteView,
  documentJson: string,
  actor: Actor,
): string {
  const { draft, ...head } = presentRouteDetail(route, actor, null);
  const { document: _document, ...draftRest } = draft;
  return `${JSON.stringify(head).slice(0, -1)},"draft":{"document":${documentJson},${JSON.stringify(draftRest).slice(1)}}`;
}

export function presentRouteDetail(
  route: Route | RouteView,
  actor: Actor,
  /** The document to present; null when presentRouteDetailJson() splices it in. */
  document: unknown = (route as Route).draft?.document,
): RouteDetail {
  const draft = route.draft as RouteView['draft'];
  const scope = { workspaceId: route.workspaceId as string };
  const writable = !route.archivedAt;
  return {
    ...presentRouteSummary(route),
    draft: {
      document: document as DraftDocument,
      version: draft.version,
      updatedAt: draft.updatedAt.toISOString(),
      updatedBy: { id: draft.updatedBy!.id, name: draft.updatedBy!.name },
      evaluationError: (draft.evaluationError ?? null) as RouteDetail['draft']['evaluationError'],
    },
    abilities: {
      read: can(actor, 'route.read', scope),
      edit: writable && can(actor, 'route.editDraft', scope),
      rename: can(actor, 'route.rename', scope),
      duplicate: can(actor, 'route.duplicate', scope),
      archive: can(actor, 'route.archive', scope),
    },
  };
}
