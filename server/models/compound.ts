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
import type { Compound as CompoundPayload } from '@shared/schemas/compounds';
import type { User } from './user';
import type { Workspace } from './workspace';

/** A workspace compound: structure, derived data, measured data and marked estimates. */
export class Compound extends Model<InferAttributes<Compound>, InferCreationAttributes<Compound>> {
  declare id: CreationOptional<string>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare name: string;
  declare role: CompoundPayload['role'];
  declare smiles: string | null;
  declare molfile: string | null;
  declare canonicalSmiles: string;
  declare formula: string;
  declare molarMassGmol: number;
  declare svg: string;
  declare pKa: CompoundPayload['pKa'];
  declare logP: CompoundPayload['logP'];
  declare meltingPointC: number | null;
  declare enthalpyFusionKJmol: number | null;
  declare hansen: CompoundPayload['hansen'];
  declare unifac: CompoundPayload['unifac'];
  declare estimateNotes: string[];
  declare solubility: CompoundPayload['solubility'];
  declare partition: CompoundPayload['partition'];
  declare notes: string;
  declare specLimitPct: number | null;
  declare solidIncorporation: number | null;
  declare createdById: ForeignKey<User['id']> | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    Compound.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        role: { type: DataTypes.STRING(20), allowNull: false },
        smiles: { type: DataTypes.TEXT, allowNull: true },
        molfile: { type: DataTypes.TEXT, allowNull: true },
        canonicalSmiles: { type: DataTypes.TEXT, allowNull: false },
        formula: { type: DataTypes.STRING(200), allowNull: false },
        molarMassGmol: { type: DataTypes.DOUBLE, allowNull: false, field: 'molar_mass_gmol' },
        svg: { type: DataTypes.TEXT, allowNull: false },
        pKa: { type: DataTypes.JSONB, allowNull: false, defaultValue: [], field: 'pka' },
        logP: { type: DataTypes.JSONB, allowNull: true, field: 'log_p' },
        meltingPointC: { type: DataTypes.DOUBLE, allowNull: true, field: 'melting_point_c' },
        enthalpyFusionKJmol: {
          type: DataTypes.DOUBLE,
          allowNull: true,
          field: 'enthalpy_fusion_kjmol',
        },
        hansen: { type: DataTypes.JSONB, allowNull: true },
        unifac: { type: DataTypes.JSONB, allowNull: false },
        estimateNotes: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        solubility: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        partition: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        specLimitPct: { type: DataTypes.DOUBLE, allowNull: true, field: 'spec_limit_pct' },
        solidIncorporation: { type: DataTypes.DOUBLE, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'compounds', underscored: true },
    );
  }
}
