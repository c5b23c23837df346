import type { RevisionStatus } from '@shared/schemas/revisions';
import { hasRole, workspaceRule, type WorkspaceScoped } from './types';

/** A saved revision as the rules see it. */
export interface RevisionScoped extends WorkspaceScoped {
  status: RevisionStatus;
}

/**
 * Saved revisions. Chemists save them; chemists, reviewers and admins read
 * every revision; scale-up engineers read approved revisions only (the ones
 * they may take to the plant).
 */
export const revisionRules = {
  'revision.list': workspaceRule<WorkspaceScoped>(() => true),
  'revision.listAll': workspaceRule<WorkspaceScoped>((roles) =>
    hasRole(roles, 'chemist', 'reviewer', 'admin'),
  ),
  'revision.read': workspaceRule<RevisionScoped>(
    (roles, _actor, revision) =>
      hasRole(roles, 'chemist', 'reviewer', 'admin') ||
      (hasRole(roles, 'engineer') && revision.status === 'approved'),
  ),
  'revision.create': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'chemist', 'admin')),
} as const;
