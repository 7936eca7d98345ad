import type { Migration, MigrationContext } from '../db';

const NAME_AND_ALIAS_WORDS = `
    CREATE MATERIALIZED VIEW food_words AS
      SELECT DISTINCT w AS word
        FROM foods, unnest(string_to_array(search_text, ' ')) AS w
       WHERE owner_user_id IS NULL AND length(w) >= 3`;

// The other names of the synonym table too, so "porrige" is corrected to "porridge" and then searched as oats.
const WITH_SYNONYM_WORDS = `
    CREATE MATERIALIZED VIEW food_words AS
      SELECT DISTINCT w AS word FROM (
        SELECT unnest(string_to_array(search_text, ' ')) AS w FROM foods WHERE owner_user_id IS NULL
        UNION ALL SELECT unnest(string_to_array(term, ' ')) FROM food_synonyms
        UNION ALL SELECT unnest(string_to_array(equivalent, ' ')) FROM food_synonyms
      ) words
       WHERE length(w) >= 3`;

async function rebuild(qi: MigrationContext, definition: string): Promise<void> {
  await qi.sequelize.query('DROP MATERIALIZED VIEW IF EXISTS food_words');
  await qi.sequelize.query(definition);
  await qi.sequelize.query('CREATE UNIQUE INDEX food_words_word ON food_words (word)');
  await qi.sequelize.query('CREATE INDEX food_words_trgm ON food_words USING GIST (word gist_trgm_ops)');
}

/** The typo lexicon also takes the words of the synonym table. Refreshed after every import and synonym change. */
export const up: Migration = async ({ context: qi }) => {
  await rebuild(qi, WITH_SYNONYM_WORDS);
};

export const down: Migration = async ({ context: qi }) => {
  await rebuild(qi, NAME_AND_ALIAS_WORDS);
};
