import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/**
 * The week plan: per profile a week start and a weekly pattern (weekday → day kind; a date set in day_kind_days
 * still wins), the person's named meals with their usual clock time, planned cooks (recipe, date, portions; the batch
 * once cooked), planned meals per local date (a portion, a planned cook's portion, a recipe amount, a pack food or a
 * plain carbohydrate amount) and the shopping list's ticks. log_entries.plan_meal_id gets its foreign key.
 */
export const up: Migration = async ({ context: qi }) => {
  const profileRef = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'profiles', key: 'id' }, onDelete: 'CASCADE' };
  const stamps = { created_at: { type: DataTypes.DATE, allowNull: false }, updated_at: { type: DataTypes.DATE, allowNull: false } };

  await qi.createTable('plan_settings', {
    profile_id: { ...profileRef, primaryKey: true },
    /** ISO weekday the week starts on: 1 = Monday … 7 = Sunday. */
    week_start: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 1 },
    ...stamps,
  });

  await qi.createTable('plan_weekdays', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: profileRef,
    /** ISO weekday: 1 = Monday … 7 = Sunday. */
    weekday: { type: DataTypes.SMALLINT, allowNull: false },
    day_kind_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'day_kinds', key: 'id' }, onDelete: 'CASCADE' },
    ...stamps,
  });
  await qi.addIndex('plan_weekdays', ['profile_id', 'weekday'], { unique: true, name: 'plan_weekdays_profile_weekday' });

  await qi.createTable('plan_meal_names', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: profileRef,
    name: { type: DataTypes.STRING(40), allowNull: false },
    /** The usual clock time, minutes from midnight: picks the time of day whose ratio applies. */
    minute: { type: DataTypes.INTEGER, allowNull: false },
    ...stamps,
  });
  await qi.addIndex('plan_meal_names', ['profile_id', 'minute'], { name: 'plan_meal_names_profile_minute' });

  await qi.createTable('planned_cooks', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: profileRef,
    recipe_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'recipes', key: 'id' }, onDelete: 'CASCADE' },
    /** Null: not given a day yet (the plan warns). */
    cook_on: { type: DataTypes.DATEONLY, allowNull: true },
    portions: { type: DataTypes.INTEGER, allowNull: false },
    /** The batch that fulfilled it, once cooked. */
    batch_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'batches', key: 'id' }, onDelete: 'SET NULL' },
    ...stamps,
  });
  await qi.addIndex('planned_cooks', ['profile_id', 'cook_on'], { name: 'planned_cooks_profile_date' });

  await qi.createTable('plan_meals', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: profileRef,
    /** The local date in the profile's time zone. */
    date: { type: DataTypes.DATEONLY, allowNull: false },
    meal_name_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'plan_meal_names', key: 'id' }, onDelete: 'SET NULL' },
    /** Clock time of this meal (from its meal name when planned), minutes from midnight. */
    minute: { type: DataTypes.INTEGER, allowNull: false },
    source: { type: DataTypes.ENUM('portion', 'planned_cook', 'recipe', 'food', 'carb'), allowNull: false },
    portion_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'portions', key: 'id' }, onDelete: 'SET NULL' },
    planned_cook_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'planned_cooks', key: 'id' }, onDelete: 'CASCADE' },
    recipe_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'recipes', key: 'id' }, onDelete: 'CASCADE' },
    food_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'foods', key: 'id' }, onDelete: 'CASCADE' },
    grams: { type: DataTypes.DOUBLE, allowNull: true },
    portions: { type: DataTypes.DOUBLE, allowNull: true },
    /** A plain carbohydrate amount in grams, in the profile's basis. */
    carb_grams: { type: DataTypes.DOUBLE, allowNull: true },
    /** A frozen portion's thaw day: its fridge use-by counts from here. */
    thaw_on: { type: DataTypes.DATEONLY, allowNull: true },
    note: { type: DataTypes.STRING(200), allowNull: true },
    ...stamps,
  });
  await qi.addIndex('plan_meals', ['profile_id', 'date', 'minute'], { name: 'plan_meals_profile_date' });
  await qi.addIndex('plan_meals', ['portion_id'], { name: 'plan_meals_portion' });
  await qi.addIndex('plan_meals', ['planned_cook_id'], { name: 'plan_meals_planned_cook' });

  await qi.createTable('shopping_ticks', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: profileRef,
    week_start: { type: DataTypes.DATEONLY, allowNull: false },
    food_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'foods', key: 'id' }, onDelete: 'CASCADE' },
    ticked_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    ...stamps,
  });
  await qi.addIndex('shopping_ticks', ['profile_id', 'week_start', 'food_id'], { unique: true, name: 'shopping_ticks_profile_week_food' });

  await qi.addConstraint('log_entries', {
    fields: ['plan_meal_id'],
    type: 'foreign key',
    name: 'log_entries_plan_meal_fk',
    references: { table: 'plan_meals', field: 'id' },
    onDelete: 'SET NULL',
    onUpdate: 'CASCADE',
  });
  await qi.sequelize.query('CREATE INDEX log_entries_plan_meal ON log_entries (plan_meal_id) WHERE plan_meal_id IS NOT NULL');
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX IF EXISTS log_entries_plan_meal');
  await qi.removeConstraint('log_entries', 'log_entries_plan_meal_fk');
  for (const t of ['shopping_ticks', 'plan_meals', 'planned_cooks', 'plan_meal_names', 'plan_weekdays', 'plan_settings']) await qi.dropTable(t);
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_plan_meals_source;');
};
