import type { Sequelize } from 'sequelize';
import { ApiToken } from './api-token';
import { AuditEvent } from './audit-event';
import { Invitation } from './invitation';
import { Membership } from './membership';
import { OutboxMessage } from './outbox-message';
import { PasswordReset } from './password-reset';
import { User } from './user';
import { Workspace } from './workspace';

export { ApiToken, AuditEvent, Invitation, Membership, OutboxMessage, PasswordReset, User, Workspace };

/** Binds every model to the connection and declares the associations. */
export function initModels(sequelize: Sequelize): void {
  for (const model of [User, Workspace, Membership, Invitation, PasswordReset, ApiToken, OutboxMessage, AuditEvent]) {
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
}
