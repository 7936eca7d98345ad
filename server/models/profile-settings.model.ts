import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { ActiveInsulinModel } from '../../shared/compute/active-insulin';
import type { IobConvention, Rounding } from '../../shared/compute/dose';
import type { ExerciseReductionTable } from '../../shared/compute/exercise';

/** A profile's dose settings; no row means "not set up" (and so no dose suggestion). Glucose in mmol/L. */
export class ProfileSettingsModel extends Model<InferAttributes<ProfileSettingsModel>, InferCreationAttributes<ProfileSettingsModel>> {
  declare profileId: number;
  declare penIncrement: number;
  declare rounding: Rounding;
  declare maxDoseUnits: number;
  declare actionTimeHours: number;
  declare activeInsulinModel: CreationOptional<ActiveInsulinModel>;
  declare targetLowMmol: number;
  declare targetHighMmol: number;
  declare correctionTargetMmol: number;
  declare hypoThresholdMmol: number;
  declare veryHighMmol: number;
  declare allowNegativeCorrection: boolean;
  declare iobConvention: IobConvention;
  declare exerciseReductions: ExerciseReductionTable;
  declare updatedByUserId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ProfileSettingsModel.init(
      {
        profileId: { type: DataTypes.INTEGER, primaryKey: true },
        penIncrement: { type: DataTypes.DOUBLE, allowNull: false },
        rounding: { type: DataTypes.ENUM('down', 'nearest'), allowNull: false },
        maxDoseUnits: { type: DataTypes.DOUBLE, allowNull: false },
        actionTimeHours: { type: DataTypes.DOUBLE, allowNull: false },
        activeInsulinModel: { type: DataTypes.ENUM('linear', 'curve'), allowNull: false, defaultValue: 'linear' },
        targetLowMmol: { type: DataTypes.DOUBLE, allowNull: false },
        targetHighMmol: { type: DataTypes.DOUBLE, allowNull: false },
        correctionTargetMmol: { type: DataTypes.DOUBLE, allowNull: false },
        hypoThresholdMmol: { type: DataTypes.DOUBLE, allowNull: false },
        veryHighMmol: { type: DataTypes.DOUBLE, allowNull: false },
        allowNegativeCorrection: { type: DataTypes.BOOLEAN, allowNull: false },
        iobConvention: { type: DataTypes.ENUM('correction_only', 'total'), allowNull: false },
        exerciseReductions: { type: DataTypes.JSONB, allowNull: false },
        updatedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'profile_settings', underscored: true },
    );
  }
}
