import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { EquipmentKind } from '@shared/schemas/equipment';
import type { User } from './user';
import type { Workspace } from './workspace';

/**
 * A vessel, filter or dryer of a workspace. Vessel fields are null for
 * filters and dryers and the other way round (the table checks it).
 */
export class Equipment extends Model<
  InferAttributes<Equipment>,
  InferCreationAttributes<Equipment>
> {
  declare id: CreationOptional<string>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare kind: EquipmentKind;
  declare name: string;
  declare nominalL: number | null;
  declare minStirrableL: number | null;
  declare maxWorkingL: number | null;
  declare minC: number | null;
  declare maxC: number | null;
  declare minMbar: number | null;
  declare maxMbar: number | null;
  declare material: string | null;
  declare areaM2: number | null;
  declare capacityL: number | null;
  declare createdById: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    const double = (field: string) => ({ type: DataTypes.DOUBLE, allowNull: true, field });
    Equipment.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        kind: { type: DataTypes.STRING(20), allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        nominalL: double('nominal_l'),
        minStirrableL: double('min_stirrable_l'),
        maxWorkingL: double('max_working_l'),
        minC: double('min_c'),
        maxC: double('max_c'),
        minMbar: double('min_mbar'),
        maxMbar: double('max_mbar'),
        material: { type: DataTypes.STRING(120), allowNull: true },
        areaM2: double('area_m2'),
        capacityL: double('capacity_l'),
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'equipment', underscored: true },
    );
  }
}
