import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';
import { adminRouter } from './admin.routes';
import { authRouter } from './auth.routes';
import { foodSynonymsRouter } from './food-synonyms.routes';
import { foodsRouter } from './foods.routes';
import { importsRouter } from './imports.routes';
import { doseRouter } from './dose.routes';
import { profilesRouter } from './profiles.routes';
import { batchesRouter } from './batches.routes';
import { containersRouter } from './containers.routes';
import { portionsRouter } from './portions.routes';
import { benchRouter } from './bench.routes';
import { healthRouter } from './health.routes';
import { photosRouter } from './photos.routes';
import { recipesRouter } from './recipes.routes';

/** Every API router, mounted under /api by createApp. Add one line per new router file. */
export function apiRouter(config: Config, sequelize: Sequelize) {
  const api = Router();
  api.use(healthRouter(sequelize));
  api.use(authRouter(config));
  api.use(adminRouter(config));
  api.use(foodsRouter(config));
  api.use(foodSynonymsRouter(config));
  api.use(importsRouter(config, sequelize));
  api.use(recipesRouter(config));
  api.use(photosRouter(config));
  api.use(profilesRouter(config));
  api.use(doseRouter(config));
  api.use(containersRouter(config));
  api.use(batchesRouter(config));
  api.use(portionsRouter(config));
  if (config.BENCH_ROUTES === '1') api.use(benchRouter(sequelize));
  return api;
}
