import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/**
 * Dose settings (one row per profile, absent until set up), day kinds with their time-of-day ratio
 * blocks, and the change history. Glucose values are stored in mmol/L.
 */
export const up: Migration = async ({ context: qi }) => {
  const profileRef = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'profiles', key: 'id' }, onDelete: 'CASCADE' };
  const userRef = { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' };
  await qi.createTable('profile_settings', {
    profile_id: { ...profileRef, primaryKey: true },
    pen_increment: { type: DataTypes.DOUBLE, allowNull: false },
    rounding: { type: DataTypes.ENUM('down', 'nearest'), allowNull: false, defaultValue: 'down' },
    max_dose_units: { type: DataTypes.DOUBLE, allowNull: false },
    action_time_hours: { type: DataTypes.DOUBLE, allowNull: false },
    target_low_mmol: { type: DataTypes.DOUBLE, allowNull: false },
    target_high_mmol: { type: DataTypes.DOUBLE, allowNull: false },
    correction_target_mmol: { type: DataTypes.DOUBLE, allowNull: false },
    hypo_threshold_mmol: { type: DataTypes.DOUBLE, allowNull: false },
    very_high_mmol: { type: DataTypes.DOUBLE, allowNull: false },
    allow_negative_correction: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    iob_convention: { type: DataTypes.ENUM('correction_only', 'total'), allowNull: false, defaultValue: 'correction_only' },
    exercise_reductions: { type: DataTypes.JSONB, allowNull: false },
    updated_by_user_id: userRef,
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('day_kinds', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: profileRef,
    name: { type: DataTypes.STRING(40), allowNull: false },
    is_default: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    long_acting_units: { type: DataTypes.DOUBLE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('day_kinds', ['profile_id'], { name: 'day_kinds_profile' });
  await qi.sequelize.query('CREATE UNIQUE INDEX day_kinds_one_default ON day_kinds (profile_id) WHERE is_default');
  await qi.sequelize.query('CREATE UNIQUE INDEX day_kinds_profile_name ON day_kinds (profile_id, lower(name))');
  await qi.createTable('ratio_blocks', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    day_kind_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'day_kinds', key: 'id' }, onDelete: 'CASCADE' },
    start_minute: { type: DataTypes.INTEGER, allowNull: false },
    end_minute: { type: DataTypes.INTEGER, allowNull: false },
    carb_ratio: { type: DataTypes.DOUBLE, allowNull: false },
    correction_factor_mmol: { type: DataTypes.DOUBLE, allowNull: false },
  });
  await qi.addIndex('ratio_blocks', ['day_kind_id', 'start_minute'], { unique: true, name: 'ratio_blocks_kind_start' });
  await qi.sequelize.query(
    'ALTER TABLE ratio_blocks ADD CONSTRAINT ratio_blocks_sane CHECK (start_minute >= 0 AND end_minute <= 1440 AND start_minute < end_minute AND carb_ratio > 0 AND correction_factor_mmol > 0)',
  );
  await qi.createTable('settings_changes', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: profileRef,
    user_id: userRef,
    subject: { type: DataTypes.ENUM('settings', 'day_kind'), allowNull: false },
    subject_id: { type: DataTypes.INTEGER, allowNull: true },
    subject_name: { type: DataTypes.STRING(80), allowNull: false },
    action: { type: DataTypes.ENUM('created', 'updated', 'deleted'), allowNull: false },
    old_value: { type: DataTypes.JSONB, allowNull: true },
    new_value: { type: DataTypes.JSONB, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('settings_changes', ['profile_id', 'created_at'], { name: 'settings_changes_profile_time' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('settings_changes');
  await qi.dropTable('ratio_blocks');
  await qi.dropTable('day_kinds');
  await qi.dropTable('profile_settings');
  await qi.sequelize.query(
    'DROP TYPE IF EXISTS enum_settings_changes_subject; DROP TYPE IF EXISTS enum_settings_changes_action; DROP TYPE IF EXISTS enum_profile_settings_rounding; DROP TYPE IF EXISTS enum_profile_settings_iob_convention;',
  );
};
