import type { Role, Session } from '@shared/schemas/session';

/**
 * Whether the session allows an action, read from the abilities map the
 * server sends with the session (action names as in server/policies). When
 * the map does not name the action, fall back to the role that normally holds
 * it. Only for showing or hiding controls: the server decides again on every request.
 */
export function canInWorkspace(
  session: Session,
  workspaceId: string,
  action: string,
  fallbackRole: Role,
): boolean {
  const declared = session.abilities.workspaces[workspaceId]?.[action];
  if (typeof declared === 'boolean') return declared;
  return (
    session.workspaces.find((w) => w.id === workspaceId)?.roles.includes(fallbackRole) ?? false
  );
}

export const canInviteMembers = (s: Session, workspaceId: string) =>
  canInWorkspace(s, workspaceId, 'member.invite', 'admin');
export const canUpdateRoles = (s: Session, workspaceId: string) =>
  canInWorkspace(s, workspaceId, 'member.updateRoles', 'admin');
export const canRemoveMembers = (s: Session, workspaceId: string) =>
  canInWorkspace(s, workspaceId, 'member.remove', 'admin');

/** Whether any member-management control shows (invite, change roles or remove). */
export const canManageMembers = (s: Session, workspaceId: string) =>
  canInviteMembers(s, workspaceId) ||
  canUpdateRoles(s, workspaceId) ||
  canRemoveMembers(s, workspaceId);

/** The outbox is an admin's tool in the demo and in development. */
export function canViewOutbox(session: Session): boolean {
  const declared = session.abilities.global['outbox.read'];
  if (typeof declared === 'boolean') return declared;
  return session.workspaces.some((w) => w.roles.includes('admin'));
}
