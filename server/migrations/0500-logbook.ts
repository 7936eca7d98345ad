import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/**
 * The logbook: one row per thing a person records (meal, glucose reading, rapid-acting dose, long-acting dose,
 * exercise) on the profile's timeline, stored in UTC with the local date and minute the profile's time zone gave it;
 * every edit or delete keeps the version before in log_entry_changes. Profiles get an IANA time zone.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('profiles', 'time_zone', { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' });
  await qi.createTable('log_entries', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'profiles', key: 'id' }, onDelete: 'CASCADE' },
    kind: { type: DataTypes.ENUM('meal', 'reading', 'rapid_dose', 'long_dose', 'exercise'), allowNull: false },
    occurred_at: { type: DataTypes.DATE, allowNull: false },
    local_date: { type: DataTypes.DATEONLY, allowNull: false },
    local_minute: { type: DataTypes.INTEGER, allowNull: false },
    time_zone: { type: DataTypes.STRING(64), allowNull: false },
    day_kind_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'day_kinds', key: 'id' }, onDelete: 'SET NULL' },
    /** Entries saved together (a breakfast: meal + reading + dose) share a group: one undo reverts them all. */
    group_key: { type: DataTypes.UUID, allowNull: true },
    entered_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    // meal
    /** What the meal was called when it was logged (batch or recipe title, food name, typed note). */
    title: { type: DataTypes.STRING(200), allowNull: true },
    meal_source: { type: DataTypes.ENUM('portion', 'recipe', 'food', 'typed'), allowNull: true },
    portion_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'portions', key: 'id' }, onDelete: 'SET NULL' },
    recipe_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'recipes', key: 'id' }, onDelete: 'SET NULL' },
    food_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'foods', key: 'id' }, onDelete: 'SET NULL' },
    grams: { type: DataTypes.DOUBLE, allowNull: true },
    plate_tare_grams: { type: DataTypes.DOUBLE, allowNull: true },
    carb_available_g: { type: DataTypes.DOUBLE, allowNull: true },
    carb_total_g: { type: DataTypes.DOUBLE, allowNull: true },
    plan_meal_id: { type: DataTypes.INTEGER, allowNull: true },
    // reading (stored in mmol/L whatever the profile's unit)
    glucose_mmol: { type: DataTypes.DOUBLE, allowNull: true },
    reading_source: { type: DataTypes.ENUM('typed', 'imported'), allowNull: true },
    // doses
    units: { type: DataTypes.DOUBLE, allowNull: true },
    planned_units: { type: DataTypes.DOUBLE, allowNull: true },
    /** The whole dose suggestion shown (inputs, parts, warnings, engine and caution versions) beside what was taken. */
    suggestion: { type: DataTypes.JSONB, allowNull: true },
    // exercise
    intensity: { type: DataTypes.STRING(16), allowNull: true },
    duration_minutes: { type: DataTypes.INTEGER, allowNull: true },
    note: { type: DataTypes.STRING(500), allowNull: true },
    deleted_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('log_entries', ['profile_id', 'occurred_at', 'id'], { name: 'log_entries_profile_time' });
  await qi.addIndex('log_entries', ['profile_id', 'kind', 'occurred_at'], { name: 'log_entries_profile_kind_time' });
  await qi.addIndex('log_entries', ['profile_id', 'local_date'], { name: 'log_entries_profile_local_date' });
  await qi.addIndex('log_entries', ['group_key'], { name: 'log_entries_group' });
  // A portion is eaten once: at most one live meal entry points at it.
  await qi.sequelize.query(
    'CREATE UNIQUE INDEX log_entries_portion_once ON log_entries (portion_id) WHERE portion_id IS NOT NULL AND deleted_at IS NULL',
  );

  await qi.createTable('log_entry_changes', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    entry_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'log_entries', key: 'id' }, onDelete: 'CASCADE' },
    changed_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    action: { type: DataTypes.ENUM('edit', 'delete', 'restore'), allowNull: false },
    before: { type: DataTypes.JSONB, allowNull: false },
    after: { type: DataTypes.JSONB, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('log_entry_changes', ['entry_id', 'created_at'], { name: 'log_entry_changes_entry' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('log_entry_changes');
  await qi.dropTable('log_entries');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_log_entry_changes_action;');
  for (const t of ['kind', 'meal_source', 'reading_source']) await qi.sequelize.query(`DROP TYPE IF EXISTS enum_log_entries_${t};`);
  await qi.removeColumn('profiles', 'time_zone');
};
