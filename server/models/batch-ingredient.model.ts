import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { Nutrients } from '../../shared/compute/nutrients';

/** One weighed line of a batch, a snapshot: the food's name and per-100 g values as they were when cooked. */
export class BatchIngredientModel extends Model<InferAttributes<BatchIngredientModel>, InferCreationAttributes<BatchIngredientModel>> {
  declare id: CreationOptional<number>;
  declare batchId: number;
  declare position: number;
  declare foodId: number | null;
  declare foodName: string;
  declare foodSource: string;
  declare per100g: Nutrients;
  declare plannedGrams: number;
  declare actualGrams: number | null;
  declare omitted: boolean;
  declare swappedFromFoodId: number | null;
  declare swappedFromName: string | null;

  static initModel(sequelize: Sequelize) {
    BatchIngredientModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        batchId: { type: DataTypes.INTEGER, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        foodId: { type: DataTypes.INTEGER, allowNull: true },
        foodName: { type: DataTypes.TEXT, allowNull: false },
        foodSource: { type: DataTypes.TEXT, allowNull: false },
        per100g: { type: DataTypes.JSONB, allowNull: false, field: 'per100g' },
        plannedGrams: { type: DataTypes.DOUBLE, allowNull: false },
        actualGrams: { type: DataTypes.DOUBLE, allowNull: true },
        omitted: { type: DataTypes.BOOLEAN, allowNull: false },
        swappedFromFoodId: { type: DataTypes.INTEGER, allowNull: true },
        swappedFromName: { type: DataTypes.TEXT, allowNull: true },
      },
      { sequelize, tableName: 'batch_ingredients', underscored: true, timestamps: false },
    );
  }
}
