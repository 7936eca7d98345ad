import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { RecipeModel } from './recipe.model';
import type { UserModel } from './user.model';

/** A recipe offered to an e-mail address; it reaches their shelf only when they accept. */
export class RecipeShareOfferModel extends Model<InferAttributes<RecipeShareOfferModel>, InferCreationAttributes<RecipeShareOfferModel>> {
  declare id: CreationOptional<number>;
  declare recipeId: number;
  declare senderUserId: number;
  declare email: string;
  declare status: CreationOptional<'offered' | 'accepted' | 'declined'>;
  declare respondedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare recipe?: NonAttribute<RecipeModel>;
  declare sender?: NonAttribute<UserModel>;

  static initModel(sequelize: Sequelize) {
    RecipeShareOfferModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        recipeId: { type: DataTypes.INTEGER, allowNull: false },
        senderUserId: { type: DataTypes.INTEGER, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        status: { type: DataTypes.ENUM('offered', 'accepted', 'declined'), allowNull: false, defaultValue: 'offered' },
        respondedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'recipe_share_offers', underscored: true, updatedAt: false },
    );
  }
}
