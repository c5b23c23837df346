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
import type { ReviewDecision } from './review-decision';
import type { Route } from './route';
import type { RouteRevision } from './route-revision';
import type { User } from './user';
import type { Workspace } from './workspace';

export type ReviewStatus = 'in_review' | 'approved' | 'returned' | 'superseded';

/** A revision submitted to named reviewers, with the submitter's note. */
export class ReviewRequest extends Model<
  InferAttributes<ReviewRequest>,
  InferCreationAttributes<ReviewRequest>
> {
  declare id: CreationOptional<string>;
  declare revisionId: ForeignKey<RouteRevision['id']>;
  declare routeId: ForeignKey<Route['id']>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare submittedById: ForeignKey<User['id']>;
  declare note: string;
  declare status: CreationOptional<ReviewStatus>;
  declare closedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare reviewers?: NonAttribute<User[]>;
  declare decisions?: NonAttribute<ReviewDecision[]>;
  declare submittedBy?: NonAttribute<User>;
  declare revision?: NonAttribute<RouteRevision>;

  static initModel(sequelize: Sequelize) {
    ReviewRequest.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        revisionId: { type: DataTypes.UUID, allowNull: false },
        routeId: { type: DataTypes.UUID, allowNull: false },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        submittedById: { type: DataTypes.UUID, allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'in_review' },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'review_requests', underscored: true },
    );
  }
}

/** Who is asked to review a request. */
export class ReviewRequestReviewer extends Model<
  InferAttributes<ReviewRequestReviewer>,
  InferCreationAttributes<ReviewRequestReviewer>
> {
  declare reviewRequestId: string;
  declare reviewerId: string;

  static initModel(sequelize: Sequelize) {
    ReviewRequestReviewer.init(
      {
        reviewRequestId: { type: DataTypes.UUID, primaryKey: true },
        reviewerId: { type: DataTypes.UUID, primaryKey: true },
      },
      { sequelize, tableName: 'review_request_reviewers', underscored: true, timestamps: false },
    );
  }
}
