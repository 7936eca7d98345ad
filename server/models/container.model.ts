import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { ContainerKind } from '../../shared/schemas/container';

/** A saved pot or container with its empty weight (tare), shared by everyone with access to the profile. */
export class ContainerModel extends Model<InferAttributes<ContainerModel>, InferCreationAttributes<ContainerModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare name: string;
  declare kind: ContainerKind;
  declare tareGrams: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ContainerModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(80), allowNull: false },
        kind: { type: DataTypes.ENUM('pot', 'container'), allowNull: false },
        tareGrams: { type: DataTypes.DOUBLE, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'containers', underscored: true },
    );
  }
}
