import type { Migration } from '../db';

/**
 * The stemmed first word of the name, stored (search ranks a food whose name starts with a query word before one
 * that merely contains it). Search computed to_tsvector(split_part(name_key, ' ', 1)) for every candidate row of every
 * query; generated from name_key, so every writer keeps it right.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE foods
      ADD COLUMN first_word_vector tsvector GENERATED ALWAYS AS (to_tsvector('english'::regconfig, split_part(name_key, ' ', 1))) STORED`);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE foods DROP COLUMN IF EXISTS first_word_vector');
};
