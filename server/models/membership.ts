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
import type { Role } from '@shared/schemas/session';
import type { User } from './user';
import type { Workspace } from './workspace';

export class Membership extends Model<
  InferAttributes<Membership>,
  InferCreationAttributes<Membership>
> {
  declare id: CreationOptional<string>;
  declare userId: ForeignKey<User['id']>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare roles: Role[];
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare user?: NonAttribute<User>;
  declare workspace?: NonAttribute<Workspace>;

  static initModel(sequelize: Sequelize) {
    Membership.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        roles: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'memberships', underscored: true },
    );
  }
}
