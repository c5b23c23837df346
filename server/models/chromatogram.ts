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
import type {
  ChromatogramKind,
  IntegrationWindowPayload,
  StoredPeak,
  StoredProcessing,
} from '@shared/schemas/chromatograms';
import type { Route } from './route';
import type { User } from './user';
import type { Workspace } from './workspace';

/**
 * An in-process-control sample attached to a step of a route: the original
 * file (in the file storage, under `storageKey`), and for a trace the parsed
 * times and signal (packed float64), its peak table, any hand-set
 * integration limits and the peaks' assignments to route components.
 */
export class Chromatogram extends Model<
  InferAttributes<Chromatogram>,
  InferCreationAttributes<Chromatogram>
> {
  declare id: CreationOptional<string>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare routeId: ForeignKey<Route['id']>;
  declare stepId: string;
  declare revision: number | null;
  declare sampleName: string;
  declare takenAt: Date | null;
  declare methodNote: CreationOptional<string>;
  declare kind: ChromatogramKind;
  declare contentType: string;
  declare fileName: string;
  declare sizeBytes: number;
  declare storageKey: string;
  declare format: string;
  declare signalName: string | null;
  declare signals: CreationOptional<string[]>;
  declare traceTime: Buffer | null;
  declare traceSignal: Buffer | null;
  declare points: CreationOptional<number>;
  declare peaks: CreationOptional<StoredPeak[]>;
  declare processing: StoredProcessing | null;
  declare integration: IntegrationWindowPayload[] | null;
  declare assignments: CreationOptional<Record<string, string>>;
  declare createdById: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    Chromatogram.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        routeId: { type: DataTypes.UUID, allowNull: false },
        stepId: { type: DataTypes.STRING(100), allowNull: false },
        revision: { type: DataTypes.INTEGER, allowNull: true },
        sampleName: { type: DataTypes.STRING(200), allowNull: false },
        takenAt: { type: DataTypes.DATE, allowNull: true },
        methodNote: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        kind: { type: DataTypes.STRING(10), allowNull: false },
        contentType: { type: DataTypes.STRING(100), allowNull: false },
        fileName: { type: DataTypes.STRING(255), allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
        storageKey: { type: DataTypes.STRING(300), allowNull: false },
        format: { type: DataTypes.STRING(20), allowNull: false },
        signalName: { type: DataTypes.STRING(200), allowNull: true },
        signals: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        traceTime: { type: DataTypes.BLOB, allowNull: true },
        traceSignal: { type: DataTypes.BLOB, allowNull: true },
        points: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        peaks: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        processing: { type: DataTypes.JSONB, allowNull: true },
        integration: { type: DataTypes.JSONB, allowNull: true },
        assignments: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'chromatograms', underscored: true },
    );
  }
}
