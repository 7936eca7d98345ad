import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { PlanMealSource } from '../../shared/schemas/plan';

const stamps = { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE };

/** A profile's plan settings: the ISO weekday its week starts on (1 = Monday). */
export class PlanSettingsModel extends Model<InferAttributes<PlanSettingsModel>, InferCreationAttributes<PlanSettingsModel>> {
  declare profileId: number;
  declare weekStart: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PlanSettingsModel.init(
      { profileId: { type: DataTypes.INTEGER, primaryKey: true }, weekStart: { type: DataTypes.SMALLINT, allowNull: false }, ...stamps },
      { sequelize, tableName: 'plan_settings', underscored: true },
    );
  }
}

/** One line of the weekly pattern: which kind of day an ISO weekday (1 = Monday) usually is. */
export class PlanWeekdayModel extends Model<InferAttributes<PlanWeekdayModel>, InferCreationAttributes<PlanWeekdayModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare weekday: number;
  declare dayKindId: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PlanWeekdayModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        weekday: { type: DataTypes.SMALLINT, allowNull: false },
        dayKindId: { type: DataTypes.INTEGER, allowNull: false },
        ...stamps,
      },
      { sequelize, tableName: 'plan_weekdays', underscored: true },
    );
  }
}

/** One of the person's named meals (breakfast, before training…) with its usual clock time. */
export class PlanMealNameModel extends Model<InferAttributes<PlanMealNameModel>, InferCreationAttributes<PlanMealNameModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare name: string;
  declare minute: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PlanMealNameModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(40), allowNull: false },
        minute: { type: DataTypes.INTEGER, allowNull: false },
        ...stamps,
      },
      { sequelize, tableName: 'plan_meal_names', underscored: true },
    );
  }
}

/** A recipe to cook on a date (or not given one yet) into a number of portions; the batch once cooked. */
export class PlannedCookModel extends Model<InferAttributes<PlannedCookModel>, InferCreationAttributes<PlannedCookModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare recipeId: number;
  declare cookOn: string | null;
  declare portions: number;
  declare batchId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PlannedCookModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        recipeId: { type: DataTypes.INTEGER, allowNull: false },
        cookOn: { type: DataTypes.DATEONLY, allowNull: true },
        portions: { type: DataTypes.INTEGER, allowNull: false },
        batchId: { type: DataTypes.INTEGER, allowNull: true },
        ...stamps,
      },
      { sequelize, tableName: 'planned_cooks', underscored: true },
    );
  }
}

/** One planned meal on a local date: what it holds (one source) and its clock time. */
export class PlanMealModel extends Model<InferAttributes<PlanMealModel>, InferCreationAttributes<PlanMealModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare date: string;
  declare mealNameId: number | null;
  declare minute: number;
  declare source: PlanMealSource;
  declare portionId: number | null;
  declare plannedCookId: number | null;
  declare recipeId: number | null;
  declare foodId: number | null;
  declare grams: number | null;
  declare portions: number | null;
  declare carbGrams: number | null;
  declare thawOn: string | null;
  declare note: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    const opt = (type: DataTypes.DataType) => ({ type, allowNull: true });
    PlanMealModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        date: { type: DataTypes.DATEONLY, allowNull: false },
        mealNameId: opt(DataTypes.INTEGER),
        minute: { type: DataTypes.INTEGER, allowNull: false },
        source: { type: DataTypes.ENUM('portion', 'planned_cook', 'recipe', 'food', 'carb'), allowNull: false },
        portionId: opt(DataTypes.INTEGER),
        plannedCookId: opt(DataTypes.INTEGER),
        recipeId: opt(DataTypes.INTEGER),
        foodId: opt(DataTypes.INTEGER),
        grams: opt(DataTypes.DOUBLE),
        portions: opt(DataTypes.DOUBLE),
        carbGrams: opt(DataTypes.DOUBLE),
        thawOn: opt(DataTypes.DATEONLY),
        note: opt(DataTypes.STRING(200)),
        ...stamps,
      },
      { sequelize, tableName: 'plan_meals', underscored: true },
    );
  }
}

/** A food ticked off the shopping list of the week starting on weekStart. */
export class ShoppingTickModel extends Model<InferAttributes<ShoppingTickModel>, InferCreationAttributes<ShoppingTickModel>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare weekStart: string;
  declare foodId: number;
  declare tickedByUserId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ShoppingTickModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        profileId: { type: DataTypes.INTEGER, allowNull: false },
        weekStart: { type: DataTypes.DATEONLY, allowNull: false },
        foodId: { type: DataTypes.INTEGER, allowNull: false },
        tickedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        ...stamps,
      },
      { sequelize, tableName: 'shopping_ticks', underscored: true },
    );
  }
}
