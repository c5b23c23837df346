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
import type { Project } from './project';
import type { RouteDraft } from './route-draft';
import type { User } from './user';
import type { Workspace } from './workspace';

/** A chemist's isolation route in a workspace; its document lives in the draft. */
export class Route extends Model<InferAttributes<Route>, InferCreationAttributes<Route>> {
  declare id: CreationOptional<string>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare projectId: ForeignKey<Project['id']> | null;
  declare ownerId: ForeignKey<User['id']>;
  declare name: string;
  declare archivedAt: CreationOptional<Date | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare project?: NonAttribute<Project | null>;
  declare owner?: NonAttribute<User>;
  declare draft?: NonAttribute<RouteDraft>;

  static initModel(sequelize: Sequelize) {
    Route.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        archivedAt: { type: DataTypes.DATE, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'routes', underscored: true },
    );
  }
}
