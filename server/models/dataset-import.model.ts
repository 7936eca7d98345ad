import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

export type DatasetName = 'ifct2017' | 'usda_sr28' | 'usda_fdc';
export type ImportStatus = 'running' | 'succeeded' | 'failed' | 'previewed';

/** One run of a dataset importer: what it loaded, what it skipped and why, how long it took. */
export class DatasetImportModel extends Model<InferAttributes<DatasetImportModel>, InferCreationAttributes<DatasetImportModel>> {
  declare id: CreationOptional<number>;
  declare dataset: DatasetName;
  declare version: string;
  declare status: CreationOptional<ImportStatus>;
  declare stage: CreationOptional<string | null>;
  declare rowsRead: CreationOptional<number>;
  declare rowsInserted: CreationOptional<number>;
  declare rowsUpdated: CreationOptional<number>;
  declare rowsUnchanged: CreationOptional<number>;
  declare rowsSkipped: CreationOptional<number>;
  declare report: CreationOptional<Record<string, unknown>>;
  declare error: CreationOptional<string | null>;
  declare durationMs: CreationOptional<number | null>;
  declare startedByUserId: CreationOptional<number | null>;
  declare finishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    DatasetImportModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        dataset: { type: DataTypes.ENUM('ifct2017', 'usda_sr28', 'usda_fdc'), allowNull: false },
        version: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.ENUM('running', 'succeeded', 'failed', 'previewed'), allowNull: false, defaultValue: 'running' },
        stage: { type: DataTypes.TEXT, allowNull: true },
        rowsRead: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        rowsInserted: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        rowsUpdated: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        rowsUnchanged: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        rowsSkipped: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        report: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        error: { type: DataTypes.TEXT, allowNull: true },
        durationMs: { type: DataTypes.INTEGER, allowNull: true },
        startedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        finishedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'dataset_imports', underscored: true },
    );
  }
}
