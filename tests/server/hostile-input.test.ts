import fc from 'fast-check';
import request from 'supertest';
import { PhotoProcessor } from '../../server/lib/photo-worker';
import { localDiskStorage } from '../../server/lib/storage';
import { UserModel } from '../../server/models';
import { apiRoutes } from '../../server/routes';
import { enabledRoutes, type AnyRoute } from '../../server/routes/registry';
import { apiErrorSchema } from '../../shared/schemas/api-error';
import { calendarDate, decimalField, isCleanText } from '../../shared/schemas/fields';
import { bearer, signUpMember, useTestApp, useUploadsDir } from '../helpers/api';

// Bounded: a few requests per route and a time cap per route, so the whole registry runs in a minute or two.
jest.setTimeout(300_000);
const RUNS_PER_ROUTE = 12;
const MS_PER_ROUTE = 3_000;

const uploads = useUploadsDir();
const ctx = useTestApp({ UPLOADS_DIR: uploads });

// What a probe sent, and what JavaScript likes to coerce: control characters, lone surrogates, blanks, hex, year 0000.
const hostileText = fc.constantFrom(
  '\u0000', 'soup\u0000', '\ud800', 'a\udc00b', '   ', '', '0x10', '1e309', 'NaN', 'Infinity', '-0', '0000-01-01', '0000-01-01T00:00:00Z',
  '9999-12-31', '2026-02-30', "' OR 1=1 --", '../../etc/passwd', '<img src=x>', '%00', 'true', 'null', '[]',
);
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  hostileText,
  fc.constantFrom(null, true, false, [], {}, 0, -1, 1e308, -1e308, 2 ** 31, 2 ** 53 + 2, 0.1, [null], [''], { '\u0000': 1 }),
  fc.string({ unit: 'binary', maxLength: 12 }),
  fc.integer(),
  fc.double(),
  fc.array(hostileText, { maxLength: 3 }),
);

function shapeKeys(schema: unknown): string[] {
  let s = schema as { shape?: Record<string, unknown>; def?: { in?: unknown; schema?: unknown; innerType?: unknown } } | undefined;
  for (let i = 0; i < 5 && s && !s.shape; i += 1) s = (s.def?.in ?? s.def?.schema ?? s.def?.innerType) as typeof s;
  return s?.shape ? Object.keys(s.shape) : [];
}

/** A body: an object over the route's own field names (some hostile, some missing), or something that is not an object at all. */
function bodyFor(route: AnyRoute): fc.Arbitrary<unknown> {
  const keys = shapeKeys(route.body);
  const objects = keys.length ? fc.dictionary(fc.constantFrom(...keys), hostileValue, { maxKeys: keys.length }) : fc.object({ maxDepth: 1 });
  return fc.oneof({ weight: 4, arbitrary: objects }, { weight: 1, arbitrary: hostileValue });
}

/** A query over the route's own parameter names, each hostile text or repeated. */
function queryFor(route: AnyRoute): fc.Arbitrary<Record<string, unknown>> {
  const keys = shapeKeys(route.query);
  if (!keys.length) return fc.constant({});
  return fc.dictionary(fc.constantFrom(...keys), fc.oneof(hostileText, fc.string({ maxLength: 8 }), fc.array(hostileText, { maxLength: 2 })), { maxKeys: keys.length });
}

const segment = fc.oneof(fc.constantFrom('1', '0', '-1', '99999999999999999999', '0x10', '%00', '%ED%A0%80', '%', 'abc', '1.5'), fc.string({ maxLength: 6 }).map(encodeURIComponent));

type Counts = Record<string, number>;
async function rowCounts(): Promise<Counts> {
  const [tables] = await ctx.sequelize.query(
    // Sign-in attempt counters (rate limits) may count refused requests by design; everything else must not move.
    "SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'schema_migrations' AND tablename !~ 'rate|attempt'",
  );
  const names = (tables as { tablename: string }[]).map((t) => t.tablename);
  const [rows] = await ctx.sequelize.query(names.map((n) => `SELECT '${n}' AS t, count(*)::int AS n FROM "${n}"`).join(' UNION ALL '));
  return Object.fromEntries((rows as { t: string; n: number }[]).map((r) => [r.t, r.n]));
}

let routes: AnyRoute[];
let token: string;
let profileId: number;
beforeAll(async () => {
  const deps = { config: ctx.config, sequelize: ctx.sequelize, storage: localDiskStorage(uploads), photos: new PhotoProcessor(1) };
  routes = enabledRoutes(apiRoutes(deps), ctx.config);
  const admin = await signUpMember(ctx.app, 'Fuzz');
  await UserModel.update({ role: 'admin' }, { where: { id: admin.userId } });
  token = admin.token;
  profileId = admin.profileId;
});

describe('hostile input on every write route and query string in the registry', () => {
  it('never answers 5xx, answers every error in the standard shape, and stores nothing on a 4xx', async () => {
    // Signing out would end the session the other routes use; it takes no input.
    const targets = routes.filter((r) => (r.method !== 'get' || r.query) && r.path !== '/auth/sign-out');
    expect(targets.length).toBeGreaterThan(20);
    const failures: string[] = [];
    for (const route of targets) {
      const params = route.path.match(/:\w+/g) ?? [];
      const pathArb = fc.tuple(...params.map((p) => (p === ':profileId' ? fc.oneof(fc.constant(String(profileId)), segment) : segment)), fc.constant(''));
      await fc.assert(
        fc.asyncProperty(pathArb, queryFor(route), bodyFor(route), async (values, query, body) => {
          let url = `/api${route.path}`;
          params.forEach((p, i) => (url = url.replace(p, values[i] as string)));
          const before = await rowCounts();
          let req = request(ctx.app)[route.method](url).set(bearer(token)).query(query as Record<string, string>);
          if (route.method !== 'get') req = req.set('Content-Type', 'application/json').send(JSON.stringify(body ?? null));
          const res = await req;
          const where = `${route.method.toUpperCase()} ${url} ${JSON.stringify(query)} ${JSON.stringify(body)?.slice(0, 200)} → ${res.status}`;
          if (res.status >= 500) failures.push(`${where} ${JSON.stringify(res.body)}`);
          if (res.status >= 400 && !apiErrorSchema.safeParse(res.body).success) failures.push(`${where}: not the error shape`);
          if (res.status >= 400 && res.status < 500) {
            const after = await rowCounts();
            const moved = Object.keys(after).filter((t) => after[t] !== before[t]);
            if (moved.length) failures.push(`${where}: stored rows in ${moved.join(', ')}`);
          }
        }),
        { numRuns: RUNS_PER_ROUTE, interruptAfterTimeLimit: MS_PER_ROUTE, seed: 20261202 },
      );
    }
    expect(failures).toEqual([]);
  });

  it.each([
    { name: 'no boundary', type: 'multipart/form-data', body: 'hello' },
    { name: 'a body cut short', type: 'multipart/form-data; boundary=XyZ', body: '--XyZ\r\nContent-Disposition: form-data; name="data"\r\n\r\n{"name":"Oat' },
    { name: 'a broken part header', type: 'multipart/form-data; boundary=XyZ', body: '--XyZ\r\nContent-Dispo\r\n' },
  ])('answers 400 in the standard shape to a multipart body with $name', async ({ type, body }) => {
    for (const url of ['/api/foods', '/api/admin/imports']) {
      const res = await request(ctx.app).post(url).set(bearer(token)).set('Content-Type', type).send(body);
      expect(res.status).toBe(400);
      expect(apiErrorSchema.parse(res.body).error.code).toBe('validation_failed');
    }
  });

  it.each([
    { name: 'a tare of []', tareGrams: [] },
    { name: 'a tare of null', tareGrams: null },
    { name: 'a tare of blanks', tareGrams: '   ' },
    { name: 'a tare of true', tareGrams: true },
    { name: 'a tare of "0x10"', tareGrams: '0x10' },
  ])('refuses $name instead of storing a coerced number', async ({ tareGrams }) => {
    const res = await request(ctx.app).post(`/api/profiles/${profileId}/containers`).set(bearer(token)).send({ name: 'Jar', tareGrams });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toContain('tareGrams');
  });

  it('still accepts a tare typed with a decimal comma', async () => {
    const res = await request(ctx.app).post(`/api/profiles/${profileId}/containers`).set(bearer(token)).send({ name: 'Jar', tareGrams: ' 212,5 ' });
    expect(res.status).toBe(201);
    expect(res.body.tareGrams).toBe(212.5);
  });

  it('refuses a carbohydrate of blanks for a dose, rather than counting 0 g', async () => {
    const res = await request(ctx.app).post(`/api/profiles/${profileId}/dose-suggestions`).set(bearer(token)).send({ carbsGrams: '   ' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toContain('carbsGrams');
  });
});

describe('field building blocks', () => {
  it('refuse coerced numbers, impossible years and unclean text the same way on the client', () => {
    const tare = decimalField('x');
    // Table: input → accepted number, or refused (null). From the probe list; the decimal comma is common practice.
    const cases: [unknown, number | null][] = [[12, 12], ['12.5', 12.5], ['12,5', 12.5], [' 7 ', 7], ['   ', null], [[], null], [true, null], ['0x10', null], ['1e3', null], [null, null]];
    for (const [input, expected] of cases) {
      const r = tare.safeParse(input);
      expect([input, r.success ? r.data : null]).toEqual([input, expected]);
    }
    expect(calendarDate('x').safeParse('0000-01-01').success).toBe(false);
    expect(calendarDate('x').safeParse('1899-12-31').success).toBe(false);
    expect(calendarDate('x').safeParse('2026-03-10').success).toBe(true);
    expect(calendarDate('x').safeParse('2200-12-31').success).toBe(true);
    expect([isCleanText('Soup\nline two\ttab'), isCleanText('a\u0000'), isCleanText('\ud800'), isCleanText('🍲')]).toEqual([true, false, false, true]);
  });
});
