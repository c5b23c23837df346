import { hasRole, workspaceRule, type WorkspaceScoped } from './types';

/**
 * The plant step list: scale-up engineers and admins export it (from any
 * revision; one that is not approved carries the draft mark); chemists and
 * admins import a step list back as a new route.
 */
export const stepListRules = {
  'stepList.export': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'engineer', 'admin')),
  'route.import': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'chemist', 'admin')),
} as const;
