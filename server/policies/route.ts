import {
  accountRule,
  hasRole,
  ownerRule,
  workspaceRule,
  type Actor,
  type UserOwned,
  type WorkspaceScoped,
} from './types';

/**
 * Routes, their drafts and projects. Every member reads them (reviewers and
 * scale-up engineers included); chemists and admins write. Evaluation stores
 * nothing and is open to anyone who belongs to a workspace; a background job is seen only
 * by the user who started it.
 */
const isMemberSomewhere = (actor: Actor) => actor.memberships.size > 0;
const writes = (roles: Parameters<typeof hasRole>[0]) => hasRole(roles, 'chemist', 'admin');

export const routeRules = {
  'route.list': workspaceRule<WorkspaceScoped>(() => true),
  'route.read': workspaceRule<WorkspaceScoped>(() => true),
  'route.create': workspaceRule<WorkspaceScoped>(writes),
  'route.rename': workspaceRule<WorkspaceScoped>(writes),
  'route.duplicate': workspaceRule<WorkspaceScoped>(writes),
  'route.archive': workspaceRule<WorkspaceScoped>(writes),
  'route.editDraft': workspaceRule<WorkspaceScoped>(writes),
  'project.list': workspaceRule<WorkspaceScoped>(() => true),
  // Someone removed from every workspace may no longer use the server's engine.
  'route.evaluate': accountRule(isMemberSomewhere),
  'job.create': accountRule(isMemberSomewhere),
  'job.read': ownerRule<UserOwned>(),
  'job.cancel': ownerRule<UserOwned>(),
} as const;
