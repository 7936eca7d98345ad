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

/** Empties every table but the migration log, so each test file starts from the same state. */
export async function resetDatabase(sequelize: Sequelize): Promise<void> {
  const [rows] = await sequelize.query(
    "SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'schema_migrations'",
  );
  const tables = (rows as { tablename: string }[]).map((r) => `"${r.tablename}"`);
  if (tables.length) await sequelize.query(`TRUNCATE ${tables.join(', ')} RESTART IDENTITY CASCADE`);
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
