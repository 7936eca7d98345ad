import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

/** A household measure of a food ("1 cup", "1 medium") and its weight in grams. */
export class FoodMeasureModel extends Model<InferAttributes<FoodMeasureModel>, InferCreationAttributes<FoodMeasureModel>> {
  declare id: CreationOptional<number>;
  declare foodId: number;
  declare label: string;
  declare grams: number;
  declare seq: CreationOptional<number>;

  static initModel(sequelize: Sequelize) {
    FoodMeasureModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        foodId: { type: DataTypes.INTEGER, allowNull: false },
        label: { type: DataTypes.TEXT, allowNull: false },
        grams: { type: DataTypes.DOUBLE, allowNull: false },
        seq: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      },
      { sequelize, tableName: 'food_measures', underscored: true, timestamps: false },
    );
  }
}
