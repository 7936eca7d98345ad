import type { Sequelize } from 'sequelize';

let next = 0;

/**
 * Runs `work` (one request against the test app, which serves one request at a time here) and returns its result with
 * the number of SQL statements sent meanwhile, counted by a Sequelize `beforeQuery` hook.
 */
export async function countQueries<T>(sequelize: Sequelize, work: () => Promise<T>): Promise<{ result: T; queries: number }> {
  const name = `count-queries-${(next += 1)}`;
  let queries = 0;
  sequelize.addHook('beforeQuery', name, () => {
    queries += 1;
  });
  try {
    const result = await work();
    return { result, queries };
  } finally {
    sequelize.removeHook('beforeQuery', name);
  }
}
