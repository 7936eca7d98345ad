import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import { readImageHeader } from '../../server/lib/photo-worker';
import { LogEntryModel, PortionModel, RecipeModel } from '../../server/models';
import { bearer, signUpUser } from '../helpers/api';
import { roundRobinProxy, startApiCopy, stopApiCopies, type RoundRobin } from '../helpers/api-copies';
import { openTestDatabase, workerDatabaseUrl } from '../helpers/db';
import { fakeS3Keys, useFakeS3 } from '../helpers/fake-s3';
import { makeImage } from '../fixtures/photos/make-images';
import { breakfastProfile, SHOWN } from './logbook-fixtures';
import { createRecipeAs, insertOatsFoods, oatsRecipe } from './recipes-helpers';

// Each request crosses a proxy and a second process; a photo is decoded in a worker. Start-up is bounded separately:
// two TypeScript processes take about 5 s of CPU each, which on a 2-core machine shared by other work (load 20+) has
// taken 25 s of wall time each.
jest.setTimeout(60_000);
const START_UP_MS = 120_000;

const ACCOUNT_LIMIT = 4;
const ADDRESS_LIMIT = 12;

const s3 = useFakeS3();
const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-two-'));
let sequelize: Sequelize;
let proxy: RoundRobin;
/** The one address: supertest takes a URL as well as an app, so the shared fixtures run through the proxy too. */
let app: Express;

beforeAll(async () => {
  sequelize = await openTestDatabase();
  const env = {
    ...s3.env,
    NODE_ENV: 'test',
    DATABASE_URL: workerDatabaseUrl(),
    JWT_SECRET: 'two-copies-share-this-secret-of-enough-length',
    BCRYPT_COST: '4',
    DB_POOL_MAX: '3',
    AUTH_RATE_LIMIT: String(ADDRESS_LIMIT),
    ACCOUNT_RATE_LIMIT: String(ACCOUNT_LIMIT),
    TRUST_PROXY: 'loopback',
    // Never written: the copies keep files in the fake S3 only.
    UPLOADS_DIR: path.join(scratch, 'uploads'),
    DATA_DIR: path.join(scratch, 'data'),
  };
  const copies = await Promise.all([startApiCopy(env, START_UP_MS - 5_000), startApiCopy(env, START_UP_MS - 5_000)]);
  proxy = await roundRobinProxy(copies.map((c) => c.port));
  app = proxy.url as unknown as Express;
}, START_UP_MS);

afterAll(async () => {
  await proxy?.close();
  await stopApiCopies();
  await sequelize?.close();
  fs.rmSync(scratch, { recursive: true, force: true });
});

const upstream = (res: request.Response) => res.headers['x-upstream'];

describe('two API processes on one database and one fake S3, behind one address', () => {
  it('answers from both copies in turn', async () => {
    const answers = [await request(app).get('/api/health'), await request(app).get('/api/health')];

    expect(answers.map((r) => r.status)).toEqual([200, 200]);
    expect(new Set(answers.map(upstream))).toEqual(new Set(['0', '1']));
  });

  it('keeps a cookie session signed in on one copy valid on the other, with its CSRF token, until it is signed out on either', async () => {
    const member = await signUpUser(app, 'Roamer');
    const signIn = await request(app).post('/api/auth/sign-in').send({ email: member.email, password: member.password });
    const cookies = (signIn.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]);
    const cookie = cookies.join('; ');
    const csrf = decodeURIComponent(cookies.find((c) => c.startsWith('cw_csrf='))!.slice('cw_csrf='.length));

    const reads = [await request(app).get('/api/me').set('Cookie', cookie), await request(app).get('/api/me').set('Cookie', cookie)];
    const withoutCsrf = await request(app).post('/api/auth/sign-out').set('Cookie', cookie);
    const signOut = await request(app).post('/api/auth/sign-out').set('Cookie', cookie).set('x-csrf-token', csrf);
    const after = [await request(app).get('/api/me').set('Cookie', cookie), await request(app).get('/api/me').set('Cookie', cookie)];

    expect(signIn.status).toBe(200);
    expect(reads.map((r) => r.status)).toEqual([200, 200]);
    expect(new Set(reads.map(upstream)).size).toBe(2);
    expect(reads.map((r) => r.body.user.email)).toEqual([member.email, member.email]);
    expect(withoutCsrf.status).toBe(403);
    expect(signOut.status).toBe(204);
    expect(after.map((r) => r.status)).toEqual([401, 401]);
    expect(new Set(after.map(upstream)).size).toBe(2);
  });

  it('serves a photo uploaded through one copy from the other, out of the shared bucket', async () => {
    const foods = await insertOatsFoods();
    const cook = await signUpUser(app, 'Snapper');
    const { id } = await createRecipeAs(app, cook.token, oatsRecipe(foods));

    const put = await request(app).put(`/api/recipes/${id}/photo`).set(bearer(cook.token)).attach('photo', await makeImage(400, 200), 'oats.jpg');
    const large = await request(app).get(put.body.largeUrl);

    expect(put.body).toEqual(expect.objectContaining({ largeUrl: expect.any(String) }));
    expect(put.status).toBe(200);
    expect(large.status).toBe(200);
    expect(upstream(large)).not.toBe(upstream(put));
    expect(readImageHeader(large.body)).toEqual({ kind: 'jpeg', width: 400, height: 200 });
    const row = (await RecipeModel.findByPk(id))!;
    expect(await fakeS3Keys(s3)).toEqual(expect.arrayContaining([row.photoLargeKey, row.photoThumbKey]));
    expect(fs.existsSync(path.join(scratch, 'uploads'))).toBe(false);
  });

  it('shows a meal logged through one copy in the logbook read through the other', async () => {
    const p = await breakfastProfile(app, 'Logger');

    const logged = await request(app).post(`/api/profiles/${p.profileId}/log-entries/meals`).set(bearer(p.token))
      .send({ meal: { source: 'portion', portionCode: p.codes[0] }, reading: { glucose: 6.4 }, doses: [{ units: 3 }], suggestion: SHOWN });
    const history = await request(app).get(`/api/profiles/${p.profileId}/logbook/history`).set(bearer(p.token));

    expect(logged.status).toBe(201);
    expect(history.status).toBe(200);
    expect(upstream(history)).not.toBe(upstream(logged));
    expect(JSON.stringify(history.body)).toContain(logged.body.groupKey);
  });

  it('lets exactly one of two devices, each on its own copy, eat the last portion of a batch', async () => {
    const p = await breakfastProfile(app, 'Last');
    const logMeal = (code: string) => request(app).post(`/api/profiles/${p.profileId}/log-entries/meals`).set(bearer(p.token))
      .send({ meal: { source: 'portion', portionCode: code }, reading: { glucose: 6 }, doses: [{ units: 3 }], suggestion: SHOWN });
    for (const code of p.codes.slice(0, -1)) expect((await logMeal(code)).status).toBe(201);
    const last = p.codes[p.codes.length - 1];

    const results = await Promise.all([logMeal(last), logMeal(last)]);

    expect(new Set(results.map(upstream)).size).toBe(2);
    expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
    expect(results.find((r) => r.status === 409)!.body.error.message).toMatch(/already been eaten.*Nothing was saved/);
    expect(await PortionModel.count({ where: { batchId: p.batchId, status: 'available' } })).toBe(0);
    expect(await LogEntryModel.count({ where: { profileId: p.profileId, kind: 'meal' } })).toBe(p.codes.length);
  });

  it(`refuses an account after ${ACCOUNT_LIMIT} wrong passwords spread over both copies, as one process would`, async () => {
    const member = await signUpUser(app, 'Forgetful');
    const attempt = (password: string) => request(app).post('/api/auth/sign-in').set('X-Forwarded-For', '198.51.100.20').send({ email: member.email, password });

    const wrong = [];
    for (let i = 0; i < ACCOUNT_LIMIT; i++) wrong.push(await attempt(`wrong password ${i}`));
    const right = await attempt(member.password);

    expect(wrong.map((r) => r.status)).toEqual(Array(ACCOUNT_LIMIT).fill(401));
    expect(new Set(wrong.map(upstream)).size).toBe(2);
    expect(right.status).toBe(429);
    expect(Number(right.headers['retry-after'])).toBeGreaterThan(0);
  });

  it(`counts sign-in attempts per client address (from X-Forwarded-For) across both copies: the ${ADDRESS_LIMIT + 1}th is refused`, async () => {
    const attempt = (address: string, i: number) =>
      request(app).post('/api/auth/sign-in').set('X-Forwarded-For', address).send({ email: `nobody${i}@example.test`, password: 'not the password' });

    const allowed = [];
    for (let i = 0; i < ADDRESS_LIMIT; i++) allowed.push(await attempt('203.0.113.7', i));
    const over = await attempt('203.0.113.7', ADDRESS_LIMIT);
    const neighbour = await attempt('203.0.113.8', 0);

    expect(allowed.map((r) => r.status)).toEqual(Array(ADDRESS_LIMIT).fill(401));
    expect(new Set(allowed.map(upstream)).size).toBe(2);
    expect(over.status).toBe(429);
    expect(neighbour.status).toBe(401);
  });
});
