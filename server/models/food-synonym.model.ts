import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { SynonymOrigin } from '../../shared/schemas/food-synonym';

/** Two names of the same food (normalised words), used by search in both directions, with where it comes from. */
export class FoodSynonymModel extends Model<InferAttributes<FoodSynonymModel>, InferCreationAttributes<FoodSynonymModel>> {
  declare id: CreationOptional<number>;
  declare term: string;
  declare equivalent: string;
  declare origin: SynonymOrigin;
  declare reference: CreationOptional<string>;
  declare createdByUserId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    FoodSynonymModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        term: { type: DataTypes.TEXT, allowNull: false },
        equivalent: { type: DataTypes.TEXT, allowNull: false },
        origin: { type: DataTypes.ENUM('dictionary', 'table', 'common usage'), allowNull: false },
        reference: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdByUserId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'food_synonyms', underscored: true },
    );
  }
}
