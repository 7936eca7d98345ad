import request from 'supertest';
import type { Express } from 'express';
import { localDiskStorage } from '../../server/lib/storage';
import { PhotoProcessor } from '../../server/lib/photo-worker';
import { openApiPath } from '../../server/openapi';
import { apiRoutes } from '../../server/routes';
import { enabledRoutes, type AnyRoute } from '../../server/routes/registry';
import { useTestApp } from '../helpers/api';

let registered: AnyRoute[];
const ctx = useTestApp({ BENCH_ROUTES: '1' });
beforeAll(async () => {
  const deps = { config: ctx.config, sequelize: ctx.sequelize, storage: localDiskStorage(ctx.config.UPLOADS_DIR), photos: new PhotoProcessor(1) };
  registered = enabledRoutes(apiRoutes(deps), ctx.config);
});

type Layer = { rawPath?: string; route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } };

/** Every route Express actually answers, as "METHOD /path" (Express 5 has no public listing; this walks its stack). */
function mountedRoutes(app: Express): string[] {
  const out: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) out.push(`${method.toUpperCase()} ${prefix}${layer.route.path}`);
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, `${prefix}${layer.rawPath ?? ''}`);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return out.filter((r) => r.includes(' /api/')).sort();
}

describe('the route registry', () => {
  it('lists exactly the API routes Express mounts (a route added beside the registry fails here)', () => {
    const fromRegistry = registered.map((r) => `${r.method.toUpperCase()} /api${r.path}`).sort();

    expect(mountedRoutes(ctx.app)).toEqual(fromRegistry);
  });

  it('says who may call every route', () => {
    const kinds = new Set(['public', 'signed-link', 'signed-in', 'role', 'profile']);
    for (const r of registered) expect(kinds.has(r.access.kind)).toBe(true);
    // Every route under /profiles/:profileId checks access to that profile.
    for (const r of registered.filter((x) => x.path.startsWith('/profiles/:profileId'))) expect(r.access.kind).toBe('profile');
  });
});

describe('GET /api/openapi.json', () => {
  it('is an OpenAPI 3.1 document with every registered route and its path parameters', async () => {
    const res = await request(ctx.app).get('/api/openapi.json');

    expect(res.status).toBe(200);
    const doc = res.body as { openapi: string; info: { title: string }; paths: Record<string, Record<string, { responses: object; parameters?: { in: string; name: string; required?: boolean }[]; 'x-access': string }>> };
    expect(doc.openapi).toBe('3.1.0');
    expect(doc.info.title).toBeTruthy();
    const documented = Object.entries(doc.paths).flatMap(([p, ops]) => Object.keys(ops).map((m) => `${m.toUpperCase()} ${p}`)).sort();
    expect(documented).toEqual(registered.map((r) => `${r.method.toUpperCase()} ${openApiPath(r.path)}`).sort());
    for (const [p, ops] of Object.entries(doc.paths)) {
      const templated = [...p.matchAll(/\{(\w+)\}/g)].map((m) => m[1]).sort();
      for (const op of Object.values(ops)) {
        // OpenAPI 3.1 §4.8.12: every templated path segment needs a required `in: path` parameter.
        const declared = (op.parameters ?? []).filter((x) => x.in === 'path');
        expect(declared.map((x) => x.name).sort()).toEqual(templated);
        for (const x of declared) expect(x.required).toBe(true);
        expect(Object.keys(op.responses).length).toBeGreaterThan(0);
        expect(op['x-access']).toBeTruthy();
      }
    }
  });

  it('describes request and response bodies with the shared zod schemas', async () => {
    const doc = (await request(ctx.app).get('/api/openapi.json')).body;

    const signIn = doc.paths['/api/auth/sign-in'].post;
    expect(Object.keys(signIn.requestBody.content['application/json'].schema.properties)).toEqual(expect.arrayContaining(['email', 'password']));
    expect(Object.keys(signIn.responses['200'].content['application/json'].schema.properties)).toEqual(expect.arrayContaining(['token', 'me']));
    expect(doc.paths['/api/foods'].get.parameters.map((x: { name: string }) => x.name)).toEqual(expect.arrayContaining(['q', 'limit']));
    expect(doc.paths['/api/recipes/{id}'].get.security).toEqual([{ bearer: [] }]);
    expect(doc.paths['/api/health'].get.security).toEqual([]);
  });
});
