import { hasRole, workspaceRule, type WorkspaceScoped } from './types';

/** A revision under review, with its author (who may never review it). */
export interface ReviewScoped extends WorkspaceScoped {
  authorId: string;
}

/**
 * Review requests and signed decisions. Chemists submit revisions; members
 * with the reviewer role decide, never on a revision they wrote. Whether the
 * reviewer was asked for this review is checked by the review service.
 */
export const reviewRules = {
  'review.submit': workspaceRule<WorkspaceScoped>((roles) => hasRole(roles, 'chemist', 'admin')),
  'review.decide': workspaceRule<ReviewScoped>(
    (roles, actor, revision) =>
      hasRole(roles, 'reviewer') &&
      (revision.authorId === undefined || revision.authorId !== actor.userId),
  ),
  'attention.list': workspaceRule<WorkspaceScoped>(() => true),
} as const;
