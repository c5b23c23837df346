import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  /** Always stored lower-case; unique. */
  declare email: string;
  declare name: string;
  /** argon2id hash, never sent to clients. */
  declare passwordHash: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        email: {
          type: DataTypes.STRING(254),
          allowNull: false,
          unique: true,
          set(value: string) {
            this.setDataValue('email', value.trim().toLowerCase());
          },
        },
        name: { type: DataTypes.STRING(120), allowNull: false },
        passwordHash: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', underscored: true },
    );
  }
}
