import type { Sequelize } from 'sequelize';
import { ApiToken } from './api-token';
import { AuditEvent } from './audit-event';
import { Chromatogram } from './chromatogram';
import { Compound } from './compound';
import { Equipment } from './equipment';
import { Invitation } from './invitation';
import { Membership } from './membership';
import { OutboxMessage } from './outbox-message';
import { PasswordReset } from './password-reset';
import { EvaluationJob } from './job';
import { Project } from './project';
import { Route } from './route';
import { RouteDraft } from './route-draft';
import { RouteRevision } from './route-revision';
import { ReviewComment } from './review-comment';
import { ReviewDecision } from './review-decision';
import { ReviewRequest, ReviewRequestReviewer } from './review-request';
import { User } from './user';
import { Workspace } from './workspace';

export {
  ApiToken,
  AuditEvent,
  Compound,
  Invitation,
  Membership,
  OutboxMessage,
  PasswordReset,
  User,
  Workspace,
};
export { EvaluationJob, Equipment, Project, Route, RouteDraft };
export { RouteRevision, ReviewRequest, ReviewRequestReviewer, ReviewDecision, ReviewComment };
export { Chromatogram };

/** Binds every model to the connection and declares the associations. */
export function initModels(sequelize: Sequelize): void {
  for (const model of [
    User,
    Workspace,
    Membership,
    Invitation,
    PasswordReset,
    ApiToken,
    OutboxMessage,
    AuditEvent,
    Compound,
    Equipment,
    Project,
    Route,
    RouteDraft,
    EvaluationJob,
    RouteRevision,
    ReviewRequest,
    ReviewRequestReviewer,
    ReviewDecision,
    ReviewComment,
    Chromatogram,
  ]) {
    model.initModel(sequelize);
  }
  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Workspace.hasMany(Membership, { foreignKey: 'workspaceId', as: 'memberships' });
  Membership.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
  Invitation.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
  Invitation.belongsTo(User, { foreignKey: 'invitedById', as: 'invitedBy' });
  PasswordReset.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  ApiToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  AuditEvent.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
  AuditEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
  Compound.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
  Compound.belongsTo(User, { foreignKey: 'createdById', as: 'createdBy' });
  Equipment.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
  Project.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
  Route.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
  Route.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
  Project.hasMany(Route, { foreignKey: 'projectId', as: 'routes' });
  Route.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
  Route.hasOne(RouteDraft, { foreignKey: 'routeId', as: 'draft' });
  RouteDraft.belongsTo(Route, { foreignKey: 'routeId', as: 'route' });
  RouteDraft.belongsTo(User, { foreignKey: 'updatedById', as: 'updatedBy' });
  EvaluationJob.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  RouteRevision.belongsTo(Route, { foreignKey: 'routeId', as: 'route' });
  RouteRevision.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  RouteRevision.hasMany(ReviewRequest, { foreignKey: 'revisionId', as: 'reviews' });
  ReviewRequest.belongsTo(RouteRevision, { foreignKey: 'revisionId', as: 'revision' });
  ReviewRequest.belongsTo(User, { foreignKey: 'submittedById', as: 'submittedBy' });
  ReviewRequest.belongsToMany(User, {
    through: ReviewRequestReviewer,
    foreignKey: 'reviewRequestId',
    otherKey: 'reviewerId',
    as: 'reviewers',
  });
  ReviewRequest.hasMany(ReviewDecision, { foreignKey: 'reviewRequestId', as: 'decisions' });
  ReviewDecision.belongsTo(ReviewRequest, { foreignKey: 'reviewRequestId', as: 'reviewRequest' });
  ReviewComment.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  ReviewComment.belongsTo(RouteRevision, { foreignKey: 'revisionId', as: 'revision' });
  ReviewComment.belongsTo(User, { foreignKey: 'resolvedById', as: 'resolvedBy' });
  Chromatogram.belongsTo(Route, { foreignKey: 'routeId', as: 'route' });
  Chromatogram.belongsTo(User, { foreignKey: 'createdById', as: 'createdBy' });
}
