import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { Nutrients } from '../../shared/compute/nutrients';
import type { BatchIngredientModel } from './batch-ingredient.model';
import type { PortionModel } from './portion.model';
import type { UserModel } from './user.model';

/** One real cook of a recipe: what was weighed (snapshot), the cooked weight, storage and use-by. */
export class BatchModel extends Model<InferAttributes<BatchModel>, InferCreationAttributes<BatchModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare recipeId: number | null;
  declare recipeTitle: string;
  declare scaleFactor: number;
  declare cookedByUserId: number | null;
  declare cookedOn: string;
  declare storage: 'fridge' | 'freezer';
  declare useBy: string;
  declare useBySource: string;
  declare foodSafetyRegion: CreationOptional<'uk' | 'us'>;
  declare useByNote: CreationOptional<string>;
  declare rawGrams: number;
  declare cookedGrossGrams: number;
  declare potTareGrams: number;
  declare potContainerId: number | null;
  declare potName: string | null;
  declare cookedGrams: number;
  declare splitMode: 'equal' | 'weighed';
  declare totals: Nutrients;
  declare per100g: Nutrients;
  declare incomplete: CreationOptional<string[]>;
  declare note: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare ingredients?: NonAttribute<BatchIngredientModel[]>;
  declare portions?: NonAttribute<PortionModel[]>;
  declare cookedBy?: NonAttribute<UserModel | null>;

  static initModel(sequelize: Sequelize) {
    BatchModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        recipeId: { type: DataTypes.INTEGER, allowNull: true },
        recipeTitle: { type: DataTypes.TEXT, allowNull: false },
        scaleFactor: { type: DataTypes.DOUBLE, allowNull: false },
        cookedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        cookedOn: { type: DataTypes.DATEONLY, allowNull: false },
        storage: { type: DataTypes.ENUM('fridge', 'freezer'), allowNull: false },
        useBy: { type: DataTypes.DATEONLY, allowNull: false },
        useBySource: { type: DataTypes.TEXT, allowNull: false },
        foodSafetyRegion: { type: DataTypes.ENUM('uk', 'us'), allowNull: false, defaultValue: 'uk' },
        useByNote: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        rawGrams: { type: DataTypes.DOUBLE, allowNull: false },
        cookedGrossGrams: { type: DataTypes.DOUBLE, allowNull: false },
        potTareGrams: { type: DataTypes.DOUBLE, allowNull: false },
        potContainerId: { type: DataTypes.INTEGER, allowNull: true },
        potName: { type: DataTypes.TEXT, allowNull: true },
        cookedGrams: { type: DataTypes.DOUBLE, allowNull: false },
        splitMode: { type: DataTypes.ENUM('equal', 'weighed'), allowNull: false },
        totals: { type: DataTypes.JSONB, allowNull: false },
        per100g: { type: DataTypes.JSONB, allowNull: false, field: 'per100g' },
        incomplete: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'batches', underscored: true },
    );
  }
}
