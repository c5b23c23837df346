import {
  accountRule,
  hasRole,
  ownerRule,
  workspaceRule,
  type UserOwned,
  type WorkspaceScoped,
} from './types';

/**
 * Routes, their drafts and projects. Every member reads them (reviewers and
 * scale-up engineers included); chemists and admins write. Evaluation stores
 * nothing and is open to any signed-in user; a background job is seen only
 * by the user who started it.
 */
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
  'route.evaluate': accountRule(),
  'job.create': accountRule(),
  'job.read': ownerRule<UserOwned>(),
} as const;
