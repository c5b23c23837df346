import { hasRole, workspaceRule, type WorkspaceScoped } from './types';

/** Workspaces and their members. Any member sees the workspace and its member list; admins manage members. */
export const workspaceRules = {
  'workspace.read': workspaceRule<WorkspaceScoped>(() => true),
  'member.list': workspaceRule<WorkspaceScoped>(() => true),
  'member.invite': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
  'member.updateRoles': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
  'member.remove': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
} as const;
