import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/** A date given a day kind other than the default (the plan sets these); no row means the default kind. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('day_kind_days', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'profiles', key: 'id' }, onDelete: 'CASCADE' },
    date: { type: DataTypes.DATEONLY, allowNull: false },
    day_kind_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'day_kinds', key: 'id' }, onDelete: 'CASCADE' },
    set_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('day_kind_days', ['profile_id', 'date'], { unique: true, name: 'day_kind_days_profile_date' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('day_kind_days');
};
