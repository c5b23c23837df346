import { hasRole, workspaceRule, type WorkspaceScoped } from './types';

/**
 * In-process-control chromatograms on a route's steps: every member of the
 * workspace reads them (reviewers and scale-up engineers included); chemists
 * and admins upload them, edit their integration and assignments, and delete them.
 */
const writes = (roles: Parameters<typeof hasRole>[0]) => hasRole(roles, 'chemist', 'admin');

export const chromatogramRules = {
  'chromatogram.list': workspaceRule<WorkspaceScoped>(() => true),
  'chromatogram.read': workspaceRule<WorkspaceScoped>(() => true),
  'chromatogram.upload': workspaceRule<WorkspaceScoped>(writes),
  'chromatogram.update': workspaceRule<WorkspaceScoped>(writes),
  'chromatogram.delete': workspaceRule<WorkspaceScoped>(writes),
} as const;
