import type { Migration } from '../db';

/**
 * The store of rate-limiter-flexible's PostgreSQL limiter (its own column layout), so that every API process counts
 * attempts per address and per account in one place. The limiter is told `tableCreated: true`.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`CREATE TABLE rate_limits (
    key varchar(255) PRIMARY KEY,
    points integer NOT NULL DEFAULT 0,
    expire bigint
  )`);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('rate_limits');
};
