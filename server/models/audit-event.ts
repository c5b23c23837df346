import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { User } from './user';
import type { Workspace } from './workspace';

/**
 * One entry of the audit trail. Append-only: a database trigger refuses
 * UPDATE and DELETE, so not even a bug in the server can rewrite history.
 */
export class AuditEvent extends Model<
  InferAttributes<AuditEvent>,
  InferCreationAttributes<AuditEvent>
> {
  declare id: CreationOptional<string>;
  declare workspaceId: ForeignKey<Workspace['id']> | null;
  declare actorId: ForeignKey<User['id']> | null;
  declare action: string;
  declare entityType: string;
  declare entityId: string | null;
  declare before: unknown;
  declare after: unknown;
  declare at: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditEvent.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        action: { type: DataTypes.STRING(80), allowNull: false },
        entityType: { type: DataTypes.STRING(80), allowNull: false },
        entityId: { type: DataTypes.STRING(80), allowNull: true },
        before: { type: DataTypes.JSONB, allowNull: true },
        after: { type: DataTypes.JSONB, allowNull: true },
        at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: 'audit_events', underscored: true, timestamps: false },
    );
  }
}
