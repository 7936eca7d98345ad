import { DataTypes } from 'sequelize';
import type { Migration } from '../db';

/**
 * Answers to create requests sent with an `Idempotency-Key` header: one row per user, route and key, with a hash of
 * the request and the answer, written in the same transaction as what the request created.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('idempotency_keys', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    route: { type: DataTypes.STRING(200), allowNull: false },
    key: { type: DataTypes.STRING(200), allowNull: false },
    request_hash: { type: DataTypes.STRING(64), allowNull: false },
    status: { type: DataTypes.INTEGER, allowNull: false },
    body: { type: DataTypes.JSONB, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('idempotency_keys', ['user_id', 'route', 'key'], { unique: true, name: 'idempotency_keys_user_route_key' });
  await qi.addIndex('idempotency_keys', ['created_at'], { name: 'idempotency_keys_created_at' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('idempotency_keys');
};
