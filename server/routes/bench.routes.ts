import { access, defineRoute, type AnyRoute, type AppDeps } from './registry';

/** Only mounted when BENCH_ROUTES=1: a bare database round trip, the floor for npm run bench. */
export function benchRoutes({ sequelize }: AppDeps): AnyRoute[] {
  return [
    defineRoute({
      method: 'get', path: '/bench/floor', access: access.public, enabled: (config) => config.BENCH_ROUTES === '1',
      summary: '`SELECT 1`, the benchmark floor (only with BENCH_ROUTES=1).',
      handler: async (_ctx, _req, res) => {
        const [rows] = await sequelize.query('SELECT 1 AS one');
        res.json(rows[0]);
      },
    }),
  ];
}
