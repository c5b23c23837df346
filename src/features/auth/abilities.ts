import type { AccountAction, WorkspaceAction } from '@shared/schemas/actions';
import type { Session } from '@shared/schemas/session';

/**
 * Whether the session allows an action in a workspace, read from the abilities map the server
 * sends with the session. Action names are typed from shared/schemas/actions.ts, the list the
 * server's policies are checked against; there is no fallback to roles, so a page cannot
 * disagree with the server about who may act. Only for showing or hiding controls: the server
 * decides again on every request.
 */
export function canInWorkspace(
  session: Session,
  workspaceId: string,
  action: WorkspaceAction,
): boolean {
  return session.abilities.workspaces[workspaceId]?.[action] ?? false;
}

/** Whether the session allows an account-wide action. */
export function canOnAccount(session: Session, action: AccountAction): boolean {
  return session.abilities.global[action];
}
