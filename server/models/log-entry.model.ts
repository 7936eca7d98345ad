import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { DayKindModel } from './day-kind.model';
import type { PortionModel } from './portion.model';
import type { UserModel } from './user.model';
import type { LogEntryKind, MealSource, ReadingSource } from '../../shared/schemas/logbook';

/** One thing a person recorded on a profile's timeline (UTC instant + the local date and minute it fell on). */
export class LogEntryModel extends Model<InferAttributes<LogEntryModel>, InferCreationAttributes<LogEntryModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare kind: LogEntryKind;
  declare occurredAt: Date;
  declare localDate: string;
  declare localMinute: number;
  declare timeZone: string;
  declare dayKindId: number | null;
  declare groupKey: string | null;
  declare enteredByUserId: number | null;
  declare title: string | null;
  declare mealSource: MealSource | null;
  declare portionId: number | null;
  declare recipeId: number | null;
  declare foodId: number | null;
  declare grams: number | null;
  declare plateTareGrams: number | null;
  declare carbAvailableG: number | null;
  declare carbTotalG: number | null;
  declare planMealId: number | null;
  declare glucoseMmol: number | null;
  declare readingSource: ReadingSource | null;
  declare units: number | null;
  declare plannedUnits: number | null;
  declare suggestion: Record<string, unknown> | null;
  declare intensity: string | null;
  declare durationMinutes: number | null;
  declare note: string | null;
  declare deletedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare enteredBy?: NonAttribute<UserModel | null>;
  declare dayKind?: NonAttribute<DayKindModel | null>;
  declare portion?: NonAttribute<PortionModel | null>;

  static initModel(sequelize: Sequelize) {
    const opt = (type: DataTypes.DataType) => ({ type, allowNull: true });
    LogEntryModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.ENUM('meal', 'reading', 'rapid_dose', 'long_dose', 'exercise'), allowNull: false },
        occurredAt: { type: DataTypes.DATE, allowNull: false },
        localDate: { type: DataTypes.DATEONLY, allowNull: false },
        localMinute: { type: DataTypes.INTEGER, allowNull: false },
        timeZone: { type: DataTypes.STRING(64), allowNull: false },
        dayKindId: opt(DataTypes.INTEGER),
        groupKey: opt(DataTypes.UUID),
        enteredByUserId: opt(DataTypes.INTEGER),
        title: opt(DataTypes.STRING(200)),
        mealSource: opt(DataTypes.ENUM('portion', 'recipe', 'food', 'typed')),
        portionId: opt(DataTypes.INTEGER),
        recipeId: opt(DataTypes.INTEGER),
        foodId: opt(DataTypes.INTEGER),
        grams: opt(DataTypes.DOUBLE),
        plateTareGrams: opt(DataTypes.DOUBLE),
        carbAvailableG: { type: DataTypes.DOUBLE, allowNull: true, field: 'carb_available_g' },
        carbTotalG: { type: DataTypes.DOUBLE, allowNull: true, field: 'carb_total_g' },
        planMealId: opt(DataTypes.INTEGER),
        glucoseMmol: opt(DataTypes.DOUBLE),
        readingSource: opt(DataTypes.ENUM('typed', 'imported')),
        units: opt(DataTypes.DOUBLE),
        plannedUnits: opt(DataTypes.DOUBLE),
        suggestion: opt(DataTypes.JSONB),
        intensity: opt(DataTypes.STRING(16)),
        durationMinutes: opt(DataTypes.INTEGER),
        note: opt(DataTypes.STRING(500)),
        deletedAt: opt(DataTypes.DATE),
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'log_entries', underscored: true },
    );
  }
}

/** The version of a log entry before an edit or delete: who changed it, when, before → after. */
export class LogEntryChangeModel extends Model<InferAttributes<LogEntryChangeModel>, InferCreationAttributes<LogEntryChangeModel>> {
  declare id: CreationOptional<number>;
  declare entryId: number;
  declare changedByUserId: number | null;
  declare action: 'edit' | 'delete' | 'restore';
  declare before: Record<string, unknown>;
  declare after: Record<string, unknown> | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    LogEntryChangeModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        entryId: { type: DataTypes.INTEGER, allowNull: false },
        changedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        action: { type: DataTypes.ENUM('edit', 'delete', 'restore'), allowNull: false },
        before: { type: DataTypes.JSONB, allowNull: false },
        after: { type: DataTypes.JSONB, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'log_entry_changes', underscored: true, updatedAt: false },
    );
  }
}
