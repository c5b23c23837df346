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

/**
 * A background evaluation a user started (a Monte Carlo run). The queue
 * (pg-boss) carries only the id; this row holds the input, the progress the
 * client polls, and the result or the error.
 */
export class EvaluationJob extends Model<
  InferAttributes<EvaluationJob>,
  InferCreationAttributes<EvaluationJob>
> {
  declare id: CreationOptional<string>;
  declare userId: ForeignKey<User['id']>;
  declare kind: 'monte-carlo' | 'optimise';
  declare status: CreationOptional<'queued' | 'running' | 'done' | 'failed' | 'cancelled'>;
  declare progress: CreationOptional<number>;
  declare input: unknown;
  declare result: CreationOptional<Record<string, unknown> | null>;
  declare error: CreationOptional<{ code: string; message: string } | null>;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    EvaluationJob.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        kind: { type: DataTypes.STRING(40), allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'queued' },
        progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        input: { type: DataTypes.JSONB, allowNull: false },
        result: { type: DataTypes.JSONB, allowNull: true },
        error: { type: DataTypes.JSONB, allowNull: true },
        startedAt: { type: DataTypes.DATE, allowNull: true },
        finishedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'evaluation_jobs', underscored: true },
    );
  }
}
