import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { ProfileColour } from '../../shared/schemas/auth';
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
  /** Shown beside every number from this profile, so a carer can tell whose they are. */
  declare colour: CreationOptional<ProfileColour>;
  /** Created by a carer for someone without an account; handed over by inviting that person as owner. */
  declare managed: CreationOptional<boolean>;
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
        colour: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'teal' },
        managed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'profiles', underscored: true },
    );
  }
}
