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
import type { Route } from './route';
import type { User } from './user';
import type { Workspace } from './workspace';

/**
 * A saved revision: an immutable snapshot of the route document with the
 * server's own evaluation, the engine version and a content hash. Numbered
 * per route. A database trigger refuses UPDATE and DELETE.
 */
export class RouteRevision extends Model<
  InferAttributes<RouteRevision>,
  InferCreationAttributes<RouteRevision>
> {
  declare id: CreationOptional<string>;
  declare routeId: ForeignKey<Route['id']>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare number: number;
  declare message: string;
  declare document: unknown;
  declare result: unknown;
  declare evaluationError: unknown;
  declare totals: unknown;
  declare engineVersion: string;
  declare contentHash: string;
  declare draftVersion: number;
  declare authorId: ForeignKey<User['id']>;
  declare createdAt: CreationOptional<Date>;
  declare author?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    RouteRevision.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        routeId: { type: DataTypes.UUID, allowNull: false },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        authorId: { type: DataTypes.UUID, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        message: { type: DataTypes.TEXT, allowNull: false },
        document: { type: DataTypes.JSONB, allowNull: false },
        result: { type: DataTypes.JSONB, allowNull: true },
        evaluationError: { type: DataTypes.JSONB, allowNull: true },
        totals: { type: DataTypes.JSONB, allowNull: true },
        engineVersion: { type: DataTypes.STRING(40), allowNull: false },
        contentHash: { type: DataTypes.CHAR(64), allowNull: false },
        draftVersion: { type: DataTypes.INTEGER, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'route_revisions', underscored: true, updatedAt: false },
    );
  }
}
