import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { User } from './user';
import type { Workspace } from './workspace';

/**
 * One entry of the audit trail. Append-only: a database trigger refuses
 * UPDATE and DELETE, and the server's database role is granted only INSERT
 * and SELECT. Another trigger sets the time, the chain (workspace id, or
 * "account"), the position in it and the hashes; values sent for those
 * columns are overwritten.
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
  declare chain: CreationOptional<string>;
  declare position: CreationOptional<string>;
  declare prevHash: CreationOptional<string>;
  declare hash: CreationOptional<string>;
  declare actor?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    AuditEvent.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        action: { type: DataTypes.STRING(80), allowNull: false },
        entityType: { type: DataTypes.STRING(80), allowNull: false },
        entityId: { type: DataTypes.STRING(80), allowNull: true },
        before: { type: DataTypes.JSONB, allowNull: true },
        after: { type: DataTypes.JSONB, allowNull: true },
        // Set by the database trigger; never sent by the server.
        at: { type: DataTypes.DATE, allowNull: true },
        chain: { type: DataTypes.TEXT, allowNull: true },
        position: { type: DataTypes.BIGINT, allowNull: true },
        prevHash: { type: DataTypes.CHAR(64), allowNull: true },
        hash: { type: DataTypes.CHAR(64), allowNull: true },
      },
      { sequelize, tableName: 'audit_events', underscored: true, timestamps: false },
    );
  }
}
