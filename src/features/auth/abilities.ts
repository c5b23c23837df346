import type { Role, Session } from '@shared/schemas/session';

/**
 * Whether the session allows an action, from the abilities map the server
 * sends. When the server has not named the action, fall back to the role that
 * normally holds it. The server decides again on every request.
 */
export function canInWorkspace(session: Session, workspaceId: string, action: string, fallbackRole: Role): boolean {
  const declared = session.abilities.workspaces[workspaceId]?.[action];
  if (typeof declared === 'boolean') return declared;
  return session.workspaces.find((w) => w.id === workspaceId)?.roles.includes(fallbackRole) ?? false;
}

export function canManageMembers(session: Session, workspaceId: string) {
  return canInWorkspace(session, workspaceId, 'manageMembers', 'admin');
}

/** The outbox is an admin's tool in the demo and in development. */
export function canViewOutbox(session: Session): boolean {
  const declared = session.abilities.global.viewOutbox;
  if (typeof declared === 'boolean') return declared;
  return session.workspaces.some((w) => w.roles.includes('admin'));
}
