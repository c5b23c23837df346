import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { ReviewRequest } from './review-request';
import type { RouteRevision } from './route-revision';
import type { User } from './user';

/**
 * A reviewer's signed decision: approve, or return with a reason. The record
 * keeps the signer's name and e-mail as they were when signing, the meaning
 * of the signature, the revision's content hash and the time. Immutable.
 */
export class ReviewDecision extends Model<
  InferAttributes<ReviewDecision>,
  InferCreationAttributes<ReviewDecision>
> {
  declare id: CreationOptional<string>;
  declare reviewRequestId: ForeignKey<ReviewRequest['id']>;
  declare revisionId: ForeignKey<RouteRevision['id']>;
  declare decision: 'approve' | 'return';
  declare signerId: ForeignKey<User['id']>;
  declare signerName: string;
  declare signerEmail: string;
  declare meaning: string;
  declare reason: string | null;
  declare contentHash: string;
  declare signedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ReviewDecision.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        reviewRequestId: { type: DataTypes.UUID, allowNull: false },
        revisionId: { type: DataTypes.UUID, allowNull: false },
        signerId: { type: DataTypes.UUID, allowNull: false },
        decision: { type: DataTypes.STRING(10), allowNull: false },
        signerName: { type: DataTypes.STRING(120), allowNull: false },
        signerEmail: { type: DataTypes.STRING(254), allowNull: false },
        meaning: { type: DataTypes.TEXT, allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: true },
        contentHash: { type: DataTypes.CHAR(64), allowNull: false },
        // Set by the database clock.
        signedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'review_decisions', underscored: true, timestamps: false },
    );
  }
}
