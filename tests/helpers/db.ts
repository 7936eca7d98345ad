import type { Sequelize } from 'sequelize';
import { loadConfig, type Config } from '../../server/config';
import { createSequelize } from '../../server/db';

/** This jest worker's own database (cloned from the migrated template in global-setup). */
export function workerDatabaseUrl(): string {
  const url = new URL(process.env.DATABASE_URL!);
  const worker = Number(process.env.JEST_WORKER_ID ?? '1');
  url.pathname = `${url.pathname}_w${((worker - 1) % 4) + 1}`;
  return url.toString();
}

/** Tables copied into the schema `shipped` after the template's import (global-setup). */
export const SHIPPED_TABLES = ['dataset_imports', 'foods', 'food_measures', 'food_synonyms'] as const;

/** Copies a shipped table back and moves its id sequence past the copied rows. */
async function restore(sequelize: Sequelize, table: (typeof SHIPPED_TABLES)[number]): Promise<void> {
  // Generated columns (the search vectors) are computed again, so only the stored ones are copied.
  const [cols] = await sequelize.query(
    `SELECT string_agg(quote_ident(column_name), ', ' ORDER BY ordinal_position) AS list FROM information_schema.columns
      WHERE table_schema = 'public' AND table_name = '${table}' AND is_generated = 'NEVER'`,
  );
  const list = (cols as { list: string }[])[0].list;
  await sequelize.query(`INSERT INTO public.${table} (${list}) SELECT ${list} FROM shipped.${table}`);
  await sequelize.query(`SELECT setval(pg_get_serial_sequence('${table}', 'id'), GREATEST(1, (SELECT max(id) FROM ${table})))`);
}

/**
 * Empties every table but the migration log, so each test file starts from the same state: no foods, and the
 * synonym table as migrated.
 */
export async function resetDatabase(sequelize: Sequelize): Promise<void> {
  const [rows] = await sequelize.query(
    "SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'schema_migrations'",
  );
  const tables = (rows as { tablename: string }[]).map((r) => `"${r.tablename}"`);
  if (tables.length) await sequelize.query(`TRUNCATE ${tables.join(', ')} RESTART IDENTITY CASCADE`);
  await restore(sequelize, 'food_synonyms');
  await sequelize.query('REFRESH MATERIALIZED VIEW food_words');
}

/** Puts back the food tables the product ships (IFCT 2017 and all of USDA SR28), as imported by global-setup. */
export async function restoreShippedFoods(sequelize: Sequelize): Promise<void> {
  for (const table of ['dataset_imports', 'foods', 'food_measures'] as const) await restore(sequelize, table);
  await sequelize.query('REFRESH MATERIALIZED VIEW food_words; ANALYZE foods; ANALYZE food_words;');
}

/** A config for tests: this worker's database, cheap hashing, a generous sign-in limit. */
export function testConfig(overrides: Record<string, string> = {}): Config {
  return loadConfig({
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: workerDatabaseUrl(),
    JWT_SECRET: 'test-secret-that-is-long-enough-for-hs256-signing',
    BCRYPT_COST: '4',
    AUTH_RATE_LIMIT: '1000',
    ...overrides,
  });
}

/** Opens this worker's database and empties it. Call close() in afterAll. */
export async function openTestDatabase() {
  const sequelize = createSequelize(workerDatabaseUrl(), { poolMax: 4 });
  await resetDatabase(sequelize);
  return sequelize;
}
