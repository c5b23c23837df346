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
import type { RouteRevision } from './route-revision';
import type { User } from './user';
import type { Workspace } from './workspace';

/** A comment on a revision, or on one of its steps; a reply names its thread's first comment. */
export class ReviewComment extends Model<
  InferAttributes<ReviewComment>,
  InferCreationAttributes<ReviewComment>
> {
  declare id: CreationOptional<string>;
  declare revisionId: ForeignKey<RouteRevision['id']>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare parentId: string | null;
  declare stepId: string | null;
  declare authorId: ForeignKey<User['id']>;
  declare body: string;
  declare resolvedAt: CreationOptional<Date | null>;
  declare resolvedById: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare author?: NonAttribute<User>;
  declare resolvedBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    ReviewComment.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        revisionId: { type: DataTypes.UUID, allowNull: false },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        authorId: { type: DataTypes.UUID, allowNull: false },
        parentId: { type: DataTypes.UUID, allowNull: true },
        stepId: { type: DataTypes.STRING(80), allowNull: true },
        body: { type: DataTypes.TEXT, allowNull: false },
        resolvedAt: { type: DataTypes.DATE, allowNull: true },
        resolvedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'review_comments', underscored: true },
    );
  }
}
