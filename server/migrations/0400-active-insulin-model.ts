import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/**
 * How active insulin falls over the action time, per profile. Existing profiles get the straight line, which never
 * counts less insulin as active than the cited anchor (50 % at 2 hours of a 4-hour action time).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('profile_settings', 'active_insulin_model', {
    type: DataTypes.ENUM('linear', 'curve'),
    allowNull: false,
    defaultValue: 'linear',
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('profile_settings', 'active_insulin_model');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_profile_settings_active_insulin_model;');
};
