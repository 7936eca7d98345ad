import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { CarbBasis, CarbUnit, GlucoseUnit, PreferredFoodTable } from '../../shared/schemas/units';

/** The person with diabetes whose numbers these are. Dose settings live in their own tables. */
export class ProfileModel extends Model<InferAttributes<ProfileModel>, InferCreationAttributes<ProfileModel>> {
  declare id: CreationOptional<number>;
  declare displayName: string;
  declare ownerUserId: number | null;
  declare glucoseUnit: CreationOptional<GlucoseUnit>;
  declare carbBasis: CreationOptional<CarbBasis>;
  declare carbUnit: CreationOptional<CarbUnit>;
  declare preferredFoodTable: CreationOptional<PreferredFoodTable>;
  /** IANA zone name: decides the local date, the day kind and the time of day of every logbook entry. */
  declare timeZone: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ProfileModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        displayName: { type: DataTypes.STRING(80), allowNull: false },
        ownerUserId: { type: DataTypes.INTEGER, allowNull: true },
        glucoseUnit: { type: DataTypes.ENUM('mmol_l', 'mg_dl'), allowNull: false, defaultValue: 'mmol_l' },
        carbBasis: { type: DataTypes.ENUM('available', 'total'), allowNull: false, defaultValue: 'available' },
        carbUnit: { type: DataTypes.ENUM('g', 'portion10', 'unit12', 'exchange15'), allowNull: false, defaultValue: 'g' },
        preferredFoodTable: { type: DataTypes.ENUM('usda_sr28', 'ifct2017'), allowNull: false, defaultValue: 'usda_sr28' },
        timeZone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'profiles', underscored: true },
    );
  }
}
