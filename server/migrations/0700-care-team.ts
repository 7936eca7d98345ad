import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/**
 * The care team: extra permissions on a grant, a colour and a "managed" flag on profiles, invitations (the token kept
 * only as its SHA-256), the access audit, and recipe share offers (a share waits for the recipient's consent).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('profile_access', 'permissions', { type: DataTypes.ARRAY(DataTypes.STRING(16)), allowNull: false, defaultValue: [] });
  await qi.addColumn('profiles', 'colour', { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'teal' });
  await qi.addColumn('profiles', 'managed', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });

  await qi.createTable('invitations', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'profiles', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.ENUM('owner', 'carer', 'clinician'), allowNull: false },
    permissions: { type: DataTypes.ARRAY(DataTypes.STRING(16)), allowNull: false, defaultValue: [] },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    invited_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    accepted_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    cancelled_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('invitations', ['profile_id'], { name: 'invitations_profile' });

  await qi.createTable('access_events', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    profile_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'profiles', key: 'id' }, onDelete: 'CASCADE' },
    actor_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    subject_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    subject_email: { type: DataTypes.STRING(254), allowNull: true },
    kind: { type: DataTypes.ENUM('invited', 'invitation_cancelled', 'granted', 'changed', 'revoked', 'handed_over'), allowNull: false },
    role: { type: DataTypes.ENUM('owner', 'carer', 'clinician'), allowNull: true },
    permissions: { type: DataTypes.ARRAY(DataTypes.STRING(16)), allowNull: false, defaultValue: [] },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('access_events', ['profile_id', 'created_at'], { name: 'access_events_profile_time' });

  await qi.createTable('recipe_share_offers', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    recipe_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'recipes', key: 'id' }, onDelete: 'CASCADE' },
    sender_user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.STRING(254), allowNull: false },
    status: { type: DataTypes.ENUM('offered', 'accepted', 'declined'), allowNull: false, defaultValue: 'offered' },
    responded_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('recipe_share_offers', ['email', 'status'], { name: 'recipe_share_offers_email' });
  await qi.addIndex('recipe_share_offers', ['sender_user_id', 'created_at'], { name: 'recipe_share_offers_sender_time' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('recipe_share_offers');
  await qi.dropTable('access_events');
  await qi.dropTable('invitations');
  await qi.sequelize.query('DROP TYPE IF EXISTS "enum_recipe_share_offers_status"; DROP TYPE IF EXISTS "enum_access_events_kind"; DROP TYPE IF EXISTS "enum_access_events_role"; DROP TYPE IF EXISTS "enum_invitations_role"');
  await qi.removeColumn('profiles', 'managed');
  await qi.removeColumn('profiles', 'colour');
  await qi.removeColumn('profile_access', 'permissions');
};
