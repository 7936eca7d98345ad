import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { UserModel } from './user.model';

/** A recipe given to one named person to view (and copy). */
export class RecipeShareModel extends Model<InferAttributes<RecipeShareModel>, InferCreationAttributes<RecipeShareModel>> {
  declare id: CreationOptional<number>;
  declare recipeId: number;
  declare userId: number;
  declare sharedByUserId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare user?: NonAttribute<UserModel>;

  static initModel(sequelize: Sequelize) {
    RecipeShareModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        recipeId: { type: DataTypes.INTEGER, allowNull: false },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        sharedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'recipe_shares', underscored: true, updatedAt: false },
    );
  }
}
