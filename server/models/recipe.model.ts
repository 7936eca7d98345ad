import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { RecipeVisibility } from '../../shared/schemas/recipe';
import type { RecipeIngredientModel } from './recipe-ingredient.model';
import type { UserModel } from './user.model';

/** A recipe: ordered weighed ingredients, method, default portions, visibility and an optional photo. */
export class RecipeModel extends Model<InferAttributes<RecipeModel>, InferCreationAttributes<RecipeModel>> {
  declare id: CreationOptional<number>;
  declare ownerUserId: number;
  declare title: string;
  declare description: CreationOptional<string>;
  declare methodSteps: CreationOptional<string[]>;
  declare tags: CreationOptional<string[]>;
  declare defaultPortions: number;
  declare visibility: CreationOptional<RecipeVisibility>;
  declare photoLargeKey: CreationOptional<string | null>;
  declare photoThumbKey: CreationOptional<string | null>;
  declare copiedFromRecipeId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare ingredients?: NonAttribute<RecipeIngredientModel[]>;
  declare owner?: NonAttribute<UserModel>;

  static initModel(sequelize: Sequelize) {
    RecipeModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        ownerUserId: { type: DataTypes.INTEGER, allowNull: false },
        title: { type: DataTypes.STRING(120), allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        methodSteps: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        tags: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
        defaultPortions: { type: DataTypes.INTEGER, allowNull: false },
        visibility: { type: DataTypes.ENUM('private', 'shared', 'public'), allowNull: false, defaultValue: 'private' },
        photoLargeKey: { type: DataTypes.TEXT, allowNull: true },
        photoThumbKey: { type: DataTypes.TEXT, allowNull: true },
        copiedFromRecipeId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'recipes', underscored: true },
    );
  }
}
