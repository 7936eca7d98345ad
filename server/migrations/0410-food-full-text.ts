import type { Migration } from '../db';

/**
 * Full-text food search: a stemmed (english) vector of the name (weight A) and the aliases (B), and one of the
 * name's head ("Yogurt, Greek" in "Yogurt, Greek, plain, whole milk"), which ranks the food itself
 * before mixtures that merely contain the word. Both are generated from the stored columns, so every writer keeps
 * them right. `unaccent` folds the typed text the way the stored text is folded. The head is the first two
 * comma-separated parts, as the USDA names often open with a category ("Cereals, oats, …", "Cheese, cheddar").
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('CREATE EXTENSION IF NOT EXISTS unaccent');
  await qi.sequelize.query(`
    ALTER TABLE foods
      ADD COLUMN search_vector tsvector GENERATED ALWAYS AS
        (setweight(to_tsvector('english'::regconfig, name_key), 'A') || setweight(to_tsvector('english'::regconfig, search_text), 'B')) STORED,
      ADD COLUMN head_vector tsvector GENERATED ALWAYS AS
        (to_tsvector('english'::regconfig, split_part(name, ',', 1) || ' ' || split_part(name, ',', 2))) STORED`);
  await qi.sequelize.query('CREATE INDEX foods_search_vector ON foods USING GIN (search_vector)');
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX IF EXISTS foods_search_vector');
  await qi.sequelize.query('ALTER TABLE foods DROP COLUMN IF EXISTS head_vector, DROP COLUMN IF EXISTS search_vector');
};
