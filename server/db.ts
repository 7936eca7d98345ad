import path from 'node:path';
import { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import type { QueryInterface } from 'sequelize';
import { enableTransactionContext } from './lib/transaction-context';
import { initModels } from './models';

export type MigrationContext = QueryInterface;
export type Migration = (params: { context: MigrationContext }) => Promise<void>;

export type PoolOptions = { poolMax?: number; acquireTimeoutMs?: number };

/**
 * Opens a pool to PostgreSQL and initialises every model on it. A request that waits longer than
 * acquireTimeoutMs for a connection fails (503 `busy`) instead of hanging.
 */
export function createSequelize(databaseUrl: string, options: PoolOptions = {}): Sequelize {
  enableTransactionContext();
  const sequelize = new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: false,
    pool: { max: options.poolMax ?? 10, min: 0, idle: 10_000, acquire: options.acquireTimeoutMs ?? 5_000 },
  });
  initModels(sequelize);
  return sequelize;
}

/** Migrations live in server/migrations as NNNN-name.ts, each exporting up and down. */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: {
      glob: ['migrations/*.{ts,js}', { cwd: __dirname, ignore: ['**/*.d.ts'] }],
      resolve: ({ name, path: file, context }) => {
        // eslint-disable-next-line @typescript-eslint/no-require-imports
        const migration = require(file as string) as { up: Migration; down: Migration };
        return {
          name: path.basename(name, path.extname(name)),
          up: () => migration.up({ context }),
          down: () => migration.down({ context }),
        };
      },
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Applies every pending migration; returns their names. */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const done = await createMigrator(sequelize).up();
  return done.map((m) => m.name);
}
