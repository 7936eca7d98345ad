import type { Migration } from '../db';

/**
 * The distinct words of table-food names, for correcting typos: a query word is matched to its nearest words here
 * (trigram index on short strings, fast), and those are then searched as substrings. Label foods are left out so a
 * private name never shapes anyone else's search. Refreshed after every import.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE MATERIALIZED VIEW food_words AS
      SELECT DISTINCT w AS word
        FROM foods, unnest(string_to_array(name_key, ' ')) AS w
       WHERE owner_user_id IS NULL AND length(w) >= 3`);
  await qi.sequelize.query('CREATE UNIQUE INDEX food_words_word ON food_words (word)');
  await qi.sequelize.query('CREATE INDEX food_words_trgm ON food_words USING GIN (word gin_trgm_ops)');
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('DROP MATERIALIZED VIEW IF EXISTS food_words');
};
