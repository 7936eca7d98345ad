import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { PortionStatus } from '../../shared/schemas/portion';
import type { BatchModel } from './batch.model';

/** One container or plate from a batch, with its short code; carbohydrate kept in both bases at full precision. */
export class PortionModel extends Model<InferAttributes<PortionModel>, InferCreationAttributes<PortionModel>> {
  declare id: CreationOptional<number>;
  declare batchId: number;
  declare profileId: number;
  declare code: string;
  declare position: number;
  declare containerId: number | null;
  declare containerName: string | null;
  declare grossGrams: number | null;
  declare tareGrams: number | null;
  declare netGrams: number;
  declare carbAvailable: number | null;
  declare carbTotal: number | null;
  declare status: CreationOptional<PortionStatus>;
  declare statusChangedAt: CreationOptional<Date | null>;
  declare statusChangedByUserId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare batch?: NonAttribute<BatchModel>;

  static initModel(sequelize: Sequelize) {
    PortionModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        batchId: { type: DataTypes.INTEGER, allowNull: false },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        code: { type: DataTypes.STRING(6), allowNull: false, unique: true },
        position: { type: DataTypes.INTEGER, allowNull: false },
        containerId: { type: DataTypes.INTEGER, allowNull: true },
        containerName: { type: DataTypes.TEXT, allowNull: true },
        grossGrams: { type: DataTypes.DOUBLE, allowNull: true },
        tareGrams: { type: DataTypes.DOUBLE, allowNull: true },
        netGrams: { type: DataTypes.DOUBLE, allowNull: false },
        carbAvailable: { type: DataTypes.DOUBLE, allowNull: true },
        carbTotal: { type: DataTypes.DOUBLE, allowNull: true },
        status: { type: DataTypes.ENUM('available', 'eaten', 'discarded'), allowNull: false, defaultValue: 'available' },
        statusChangedAt: { type: DataTypes.DATE, allowNull: true },
        statusChangedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'portions', underscored: true },
    );
  }
}
