import { hasRole, workspaceRule, type WorkspaceScoped } from './types';

/**
 * Review comments: chemists (authors answering) and reviewers write, reply,
 * resolve and reopen; whoever may read the revision reads its comments.
 */
export const commentRules = {
  'comment.create': workspaceRule<WorkspaceScoped>((roles) =>
    hasRole(roles, 'chemist', 'reviewer'),
  ),
  'comment.resolve': workspaceRule<WorkspaceScoped>((roles) =>
    hasRole(roles, 'chemist', 'reviewer'),
  ),
} as const;
