import { hasRole, workspaceRule, type WorkspaceScoped } from './types';

/** The audit trail and its verification: admins of the workspace only. */
export const auditRules = {
  'audit.read': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
  'audit.verify': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'admin')),
} as const;
