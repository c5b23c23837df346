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

/**
 * The document being edited for one route. `version` goes up by one with
 * every save; a save names the version it started from, so a concurrent
 * edit is detected instead of overwritten. Totals and the evaluation error
 * are what the engine said about this document when it was saved.
 */
export class RouteDraft extends Model<
  InferAttributes<RouteDraft>,
  InferCreationAttributes<RouteDraft>
> {
  declare routeId: ForeignKey<Route['id']>;
  declare document: unknown;
  declare version: number;
  declare totals: unknown;
  declare evaluationError: unknown;
  declare engineVersion: string | null;
  declare stepCount: number;
  declare updatedById: ForeignKey<User['id']>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare updatedBy?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    RouteDraft.init(
      {
        routeId: { type: DataTypes.UUID, primaryKey: true },
        document: { type: DataTypes.JSONB, allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false },
        totals: { type: DataTypes.JSONB, allowNull: true },
        evaluationError: { type: DataTypes.JSONB, allowNull: true },
        engineVersion: { type: DataTypes.STRING(40), allowNull: true },
        stepCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'route_drafts', underscored: true },
    );
  }
}
