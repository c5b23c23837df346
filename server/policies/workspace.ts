import { hasRole, workspaceRule, type WorkspaceScoped } from './types';

/** Workspaces and their members. Any member sees the workspace and its member list; admins manage members. */
export const workspaceRules = {
  'workspace.read': workspaceRule<WorkspaceScoped>(() => true),
  'member.list': workspaceRule<WorkspaceScoped>(() => true),
  'member.invite': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
  'member.updateRoles': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
  'member.remove': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
  // Pending invitations carry the invitees' addresses and a live link: admins only, like inviting.
  'invitation.list': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
  'invitation.resend': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
  'invitation.revoke': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
} as const;
