import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/** Single-use links for a password reset or a change of e-mail address; only the SHA-256 of the token is kept. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('account_tokens', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    purpose: { type: DataTypes.ENUM('password_reset', 'email_change'), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    new_email: { type: DataTypes.STRING(254), allowNull: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('account_tokens', ['user_id', 'purpose'], { name: 'account_tokens_user_purpose' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('account_tokens');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_account_tokens_purpose');
};
