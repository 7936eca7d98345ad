import type { Migration } from '../db';

/** Typo-tolerant search compares the query with the food's name only (aliases are matched as substrings). */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('CREATE INDEX foods_name_key_trgm ON foods USING GIN (name_key gin_trgm_ops)');
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX IF EXISTS foods_name_key_trgm');
};
