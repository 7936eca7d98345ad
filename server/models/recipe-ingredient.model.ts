import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { FoodModel } from './food.model';

/** One weighed line of a recipe, in order: a food, raw grams, an optional household measure and note. */
export class RecipeIngredientModel extends Model<
  InferAttributes<RecipeIngredientModel>,
  InferCreationAttributes<RecipeIngredientModel>
> {
  declare id: CreationOptional<number>;
  declare recipeId: number;
  declare position: number;
  declare foodId: number;
  declare grams: number;
  declare measureLabel: string | null;
  declare note: string | null;
  declare food?: NonAttribute<FoodModel>;

  static initModel(sequelize: Sequelize) {
    RecipeIngredientModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        recipeId: { type: DataTypes.INTEGER, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        foodId: { type: DataTypes.INTEGER, allowNull: false },
        grams: { type: DataTypes.DOUBLE, allowNull: false },
        measureLabel: { type: DataTypes.STRING(60), allowNull: true },
        note: { type: DataTypes.STRING(200), allowNull: true },
      },
      { sequelize, tableName: 'recipe_ingredients', underscored: true, timestamps: false },
    );
  }
}
