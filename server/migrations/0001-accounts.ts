import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('CREATE EXTENSION IF NOT EXISTS pg_trgm');
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    display_name: { type: DataTypes.STRING(80), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    role: { type: DataTypes.ENUM('member', 'clinician', 'admin'), allowNull: false, defaultValue: 'member' },
    token_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('profiles', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    display_name: { type: DataTypes.STRING(80), allowNull: false },
    owner_user_id: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('profile_access', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'profiles', key: 'id' },
      onDelete: 'CASCADE',
    },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    role: { type: DataTypes.ENUM('owner', 'carer', 'clinician'), allowNull: false },
    granted_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('profile_access', ['profile_id', 'user_id'], { unique: true, name: 'profile_access_profile_user' });
  await qi.addIndex('profile_access', ['user_id'], { name: 'profile_access_user' });
  await qi.createTable('revoked_tokens', {
    jti: { type: DataTypes.STRING(64), primaryKey: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('revoked_tokens');
  await qi.dropTable('profile_access');
  await qi.dropTable('profiles');
  await qi.dropTable('users');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_profile_access_role; DROP TYPE IF EXISTS enum_users_role;');
};
