import type { Migration, MigrationContext } from '../db';

const NAME_WORDS = `
    CREATE MATERIALIZED VIEW food_words AS
      SELECT DISTINCT w AS word
        FROM foods, unnest(string_to_array(name_key, ' ')) AS w
       WHERE owner_user_id IS NULL AND length(w) >= 3`;

// search_text is the normalised name followed by the aliases (local-language and scientific names).
const NAME_AND_ALIAS_WORDS = `
    CREATE MATERIALIZED VIEW food_words AS
      SELECT DISTINCT w AS word
        FROM foods, unnest(string_to_array(search_text, ' ')) AS w
       WHERE owner_user_id IS NULL AND length(w) >= 3`;

async function rebuild(qi: MigrationContext, definition: string, trigramIndex: string): Promise<void> {
  await qi.sequelize.query('DROP MATERIALIZED VIEW IF EXISTS food_words');
  await qi.sequelize.query(definition);
  await qi.sequelize.query('CREATE UNIQUE INDEX food_words_word ON food_words (word)');
  await qi.sequelize.query(`CREATE INDEX food_words_trgm ON food_words USING ${trigramIndex}`);
}

/**
 * The typo lexicon also takes the words of table foods' alternative names (IFCT local names such as "Kathirikkai"),
 * so a misspelt local name is corrected like a misspelt English one. Still refreshed after every import.
 * Its trigram index becomes GiST: with some thousands of words the planner read the GIN-indexed lexicon in full
 * (it underprices the `%` test), while a GiST index answers "nearest words" (`<->`) directly.
 */
export const up: Migration = async ({ context: qi }) => {
  await rebuild(qi, NAME_AND_ALIAS_WORDS, 'GIST (word gist_trgm_ops)');
};

export const down: Migration = async ({ context: qi }) => {
  await rebuild(qi, NAME_WORDS, 'GIN (word gin_trgm_ops)');
};
