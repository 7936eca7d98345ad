import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/** Disabled accounts (with the reason and who did it) and the audit of what admins change on accounts. */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('users', 'disabled_at', { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn('users', 'disabled_reason', { type: DataTypes.STRING(500), allowNull: true });
  await qi.createTable('account_audit', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    actor_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    action: { type: DataTypes.ENUM('role_changed', 'disabled', 'enabled'), allowNull: false },
    old_value: { type: DataTypes.STRING(40), allowNull: true },
    new_value: { type: DataTypes.STRING(40), allowNull: true },
    reason: { type: DataTypes.STRING(500), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('account_audit', ['user_id'], { name: 'account_audit_user' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('account_audit');
  await qi.removeColumn('users', 'disabled_reason');
  await qi.removeColumn('users', 'disabled_at');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_account_audit_action');
};
