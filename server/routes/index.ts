import { Router } from 'express';
import { buildOpenApiDocument } from '../openapi';
import { accessRoutes } from './access.routes';
import { adminRoutes } from './admin.routes';
import { authRoutes } from './auth.routes';
import { batchesRoutes } from './batches.routes';
import { benchRoutes } from './bench.routes';
import { clinicianDeskRoutes } from './clinician-desk.routes';
import { containersRoutes } from './containers.routes';
import { doseRoutes } from './dose.routes';
import { foodSynonymsRoutes } from './food-synonyms.routes';
import { foodsRoutes } from './foods.routes';
import { healthRoutes } from './health.routes';
import { importsRoutes } from './imports.routes';
import { logbookRoutes } from './logbook.routes';
import { logHistoryRoutes } from './log-history.routes';
import { mailRoutes } from './mail.routes';
import { photosRoutes } from './photos.routes';
import { planRoutes } from './plan.routes';
import { portionsRoutes } from './portions.routes';
import { profilesRoutes } from './profiles.routes';
import { recipesRoutes } from './recipes.routes';
import { access, defineRoute, enabledRoutes, mountRoutes, type AnyRoute, type AppDeps } from './registry';

/**
 * The route registry: every API route, with its schemas and who may call it. It mounts the routes and feeds the
 * OpenAPI document, so a route exists only if it is listed here. A new route file adds one line.
 */
export function apiRoutes(deps: AppDeps): AnyRoute[] {
  const routes = [
    ...healthRoutes(deps),
    ...authRoutes(deps),
    ...adminRoutes(),
    ...mailRoutes(),
    ...foodsRoutes(deps),
    ...foodSynonymsRoutes(),
    ...importsRoutes(deps),
    ...recipesRoutes(deps),
    ...photosRoutes(deps),
    ...profilesRoutes(),
    ...accessRoutes(),
    ...clinicianDeskRoutes(),
    ...doseRoutes(),
    ...containersRoutes(),
    ...batchesRoutes(deps),
    ...portionsRoutes(),
    ...logbookRoutes(),
    ...logHistoryRoutes(),
    ...planRoutes(),
    ...benchRoutes(deps),
  ];
  let document: object | undefined;
  routes.push(
    defineRoute({
      method: 'get', path: '/openapi.json', access: access.public, summary: 'This API as an OpenAPI 3.1 document, generated from the route registry.',
      handler: (_ctx, _req, res) => res.json((document ??= buildOpenApiDocument(enabledRoutes(routes, deps.config)))),
    }),
  );
  return routes;
}

/** Every API route mounted on one router (under /api by createApp). */
export function apiRouter(deps: AppDeps) {
  const api = Router();
  mountRoutes(api, apiRoutes(deps), deps.config, deps.sequelize);
  return api;
}
