import { hasRole, workspaceRule, type WorkspaceScoped } from './types';

const manages = (roles: Parameters<typeof hasRole>[0]) => hasRole(roles, 'engineer', 'admin');

/**
 * Plant equipment: every member of the workspace reads it (a chemist sees what
 * the plant has); scale-up engineers and admins add, change and remove it.
 */
export const equipmentRules = {
  'equipment.list': workspaceRule<WorkspaceScoped>(() => true),
  'equipment.create': workspaceRule<WorkspaceScoped>(manages),
  'equipment.update': workspaceRule<WorkspaceScoped>(manages),
  'equipment.delete': workspaceRule<WorkspaceScoped>(manages),
} as const;
