import { OpenAPIRegistry, OpenApiGeneratorV31, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { apiErrorSchema } from '../shared/schemas/api-error';
import { PROFILE_ACTIONS } from '../shared/schemas/profile-actions';
import type { Access, AnyRoute } from './routes/registry';

const WHO: Record<Access['kind'], string> = {
  public: 'anyone',
  'signed-link': 'holder of a signed link (no bearer token)',
  'signed-in': 'signed in',
  role: 'signed in with the role',
  profile: 'signed in with access to the profile as',
};

/** Who may call a route, in words (also the `x-access` extension of each operation). */
export function describeAccess(a: Access): string {
  if (a.kind === 'role') return `${WHO[a.kind]} ${a.roles.join(' / ')}`;
  if (a.kind === 'profile') return `${WHO[a.kind]} ${PROFILE_ACTIONS[a.action].join(' / ')} (action \`${a.action}\`)`;
  return WHO[a.kind];
}

/** `/recipes/:id` → `/api/recipes/{id}` */
export function openApiPath(expressPath: string): string {
  return `/api${expressPath.replace(/:([A-Za-z0-9_]+)/g, '{$1}')}`;
}

const jsonContent = (schema: z.ZodType) => ({ 'application/json': { schema } });

/**
 * The OpenAPI 3.1 document of the API, generated from the route registry with @asteasolutions/zod-to-openapi
 * (server only: the web bundle never imports it). Errors share one envelope, `{ error: { code, message, fieldErrors? } }`.
 */
export function buildOpenApiDocument(routes: AnyRoute[]) {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'bearer', { type: 'http', scheme: 'bearer', bearerFormat: 'JWT' });
  for (const route of routes) {
    const status = String(route.status ?? 200);
    const success =
      status === '204'
        ? { description: 'No content.' }
        : { description: route.response ? 'Success.' : 'Success (body not described by a schema yet).', ...(route.response ? { content: jsonContent(route.response) } : {}) };
    const body = route.body
      ? { content: route.bodyFormat === 'multipart' ? { 'multipart/form-data': { schema: route.body } } : jsonContent(route.body) }
      : route.bodyFormat === 'multipart'
        ? { content: { 'multipart/form-data': { schema: z.object({}) } } }
        : undefined;
    const config: RouteConfig & { 'x-access': string } = {
      method: route.method,
      path: openApiPath(route.path),
      summary: route.summary,
      security: route.access.kind === 'public' || route.access.kind === 'signed-link' ? [] : [{ bearer: [] }],
      'x-access': describeAccess(route.access),
      request: { params: route.params, query: route.query, body },
      responses: { [status]: success, default: { description: 'An error, in the one error envelope.', content: jsonContent(apiErrorSchema) } },
    };
    registry.registerPath(config);
  }
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Carbwright API',
      version: '1',
      description: 'Bodies are JSON unless marked multipart. Errors: `{ "error": { "code", "message", "fieldErrors"? } }`.',
    },
  });
}
