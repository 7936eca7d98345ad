import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

/** One versioned change to a profile's settings or a day kind: who, when, old and new values. */
export class SettingsChangeModel extends Model<InferAttributes<SettingsChangeModel>, InferCreationAttributes<SettingsChangeModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare userId: number | null;
  declare subject: 'settings' | 'day_kind';
  declare subjectId: number | null;
  declare subjectName: string;
  declare action: 'created' | 'updated' | 'deleted';
  declare oldValue: Record<string, unknown> | null;
  declare newValue: Record<string, unknown> | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SettingsChangeModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        userId: { type: DataTypes.INTEGER, allowNull: true },
        subject: { type: DataTypes.ENUM('settings', 'day_kind'), allowNull: false },
        subjectId: { type: DataTypes.INTEGER, allowNull: true },
        subjectName: { type: DataTypes.STRING(80), allowNull: false },
        action: { type: DataTypes.ENUM('created', 'updated', 'deleted'), allowNull: false },
        oldValue: { type: DataTypes.JSONB, allowNull: true },
        newValue: { type: DataTypes.JSONB, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'settings_changes', underscored: true, updatedAt: false },
    );
  }
}
