import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import { searchKeys } from '../search/search-text';
import type { FoodMeasureModel } from './food-measure.model';

export type FoodSource = 'ifct2017' | 'usda_sr28' | 'usda_fdc' | 'pack';

/** Source details kept beside the nutrients: e.g. IFCT's measured starch + sugars, USDA's NDB number, a label's brand. */
export type FoodExtra = {
  scientificName?: string;
  ndbNumber?: string;
  carbStarchSugars?: number | null;
  brand?: string;
  /** SR28 ManufacName. */
  manufacturer?: string;
  /** A manufacturer's product (ranked after generic foods in search). */
  branded?: boolean;
  printed?: Record<string, number | string | null>;
};

// A fresh object per column: Sequelize writes the column name into the options it is given.
const nutrient = () => ({ type: DataTypes.DOUBLE, allowNull: true });

/** One food per 100 g edible portion; nutrient fields are named exactly as the shared `Nutrients` keys. */
export class FoodModel extends Model<InferAttributes<FoodModel>, InferCreationAttributes<FoodModel>> {
  declare id: CreationOptional<number>;
  declare source: FoodSource;
  declare sourceCode: string;
  declare name: string;
  declare foodGroup: string | null;
  declare altNames: CreationOptional<string[]>;
  declare energyKcal: number | null;
  declare energyKj: number | null;
  declare carbAvailable: number | null;
  declare carbTotal: number | null;
  declare fibre: number | null;
  declare sugars: number | null;
  declare protein: number | null;
  declare fat: number | null;
  declare water: number | null;
  declare carbMeasured: 'available' | 'total' | null;
  declare carbNote: CreationOptional<string | null>;
  declare derived: CreationOptional<string[]>;
  declare attribution: string;
  declare licence: string;
  declare rankPenalty: CreationOptional<number>;
  declare nameKey: CreationOptional<string>;
  declare searchText: CreationOptional<string>;
  declare importId: CreationOptional<number | null>;
  declare ownerUserId: CreationOptional<number | null>;
  declare sharedProfileId: CreationOptional<number | null>;
  declare labelConvention: CreationOptional<'eu' | 'us' | null>;
  declare photoPath: CreationOptional<string | null>;
  declare extra: CreationOptional<FoodExtra>;
  declare contentHash: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare measures?: NonAttribute<FoodMeasureModel[]>;

  static initModel(sequelize: Sequelize) {
    FoodModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        source: { type: DataTypes.ENUM('ifct2017', 'usda_sr28', 'usda_fdc', 'pack'), allowNull: false },
        sourceCode: { type: DataTypes.TEXT, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        foodGroup: { type: DataTypes.TEXT, allowNull: true },
        altNames: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
        energyKcal: nutrient(),
        energyKj: nutrient(),
        carbAvailable: nutrient(),
        carbTotal: nutrient(),
        fibre: nutrient(),
        sugars: nutrient(),
        protein: nutrient(),
        fat: nutrient(),
        water: nutrient(),
        carbMeasured: { type: DataTypes.ENUM('available', 'total'), allowNull: true },
        carbNote: { type: DataTypes.TEXT, allowNull: true },
        derived: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
        attribution: { type: DataTypes.TEXT, allowNull: false },
        licence: { type: DataTypes.TEXT, allowNull: false },
        rankPenalty: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        nameKey: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        searchText: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        importId: { type: DataTypes.INTEGER, allowNull: true },
        ownerUserId: { type: DataTypes.INTEGER, allowNull: true },
        sharedProfileId: { type: DataTypes.INTEGER, allowNull: true },
        labelConvention: { type: DataTypes.ENUM('eu', 'us'), allowNull: true },
        photoPath: { type: DataTypes.TEXT, allowNull: true },
        extra: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        contentHash: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        tableName: 'foods',
        underscored: true,
        hooks: {
          beforeSave: (food) => {
            const keys = searchKeys(food.name, food.altNames ?? [], { branded: Boolean(food.extra?.branded) });
            food.nameKey = keys.nameKey;
            food.searchText = keys.searchText;
            food.rankPenalty = keys.rankPenalty;
          },
        },
      },
    );
  }
}
