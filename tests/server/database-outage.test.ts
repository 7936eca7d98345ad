import request from 'supertest';
import type { Express } from 'express';
import { ConnectionRefusedError, DatabaseError, type Sequelize } from 'sequelize';
import { createApp } from '../../server/app';
import { createSequelize } from '../../server/db';
import { isDatabaseUnavailable } from '../../server/middleware/error-handler';
import { RecipeModel } from '../../server/models';
import { bearer, signUpMember } from '../helpers/api';
import { resetDatabase, testConfig, workerDatabaseUrl } from '../helpers/db';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';
import { startTcpSwitch } from '../helpers/tcp-switch';

jest.setTimeout(60_000);

const pgError = (code: string, message = 'x') => new DatabaseError(Object.assign(new Error(message), { code, sql: 'SELECT 1', parameters: [] }) as never);

describe('isDatabaseUnavailable', () => {
  // PostgreSQL error codes from the PostgreSQL 16 manual, Appendix A (class 08, 57P01-57P03, 53300, 23505, 42601).
  const cases = [
    { name: 'connection refused', err: new ConnectionRefusedError(new Error('connect ECONNREFUSED 127.0.0.1:1')), expected: true },
    { name: 'admin shutdown 57P01', err: pgError('57P01', 'terminating connection due to administrator command'), expected: true },
    { name: 'starting up 57P03', err: pgError('57P03', 'the database system is starting up'), expected: true },
    { name: 'connection failure 08006', err: pgError('08006'), expected: true },
    { name: 'too many connections 53300', err: pgError('53300'), expected: true },
    { name: 'connection terminated mid-query', err: new DatabaseError(new Error('Connection terminated unexpectedly') as never), expected: true },
    { name: 'unique violation 23505', err: pgError('23505', 'duplicate key value'), expected: false },
    { name: 'syntax error 42601', err: pgError('42601', 'syntax error'), expected: false },
    { name: 'a plain bug', err: new TypeError('x is undefined'), expected: false },
  ];
  it.each(cases)('$name', ({ err, expected }) => {
    expect(isDatabaseUnavailable(err)).toBe(expected);
  });
});

describe('an API whose database goes away and comes back', () => {
  let app: Express;
  let sequelize: Sequelize;
  let link: Awaited<ReturnType<typeof startTcpSwitch>>;

  beforeAll(async () => {
    const real = new URL(workerDatabaseUrl());
    link = await startTcpSwitch({ host: real.hostname, port: Number(real.port || 5432) });
    const through = new URL(real);
    through.hostname = '127.0.0.1';
    through.port = String(link.port);
    sequelize = createSequelize(through.toString(), { poolMax: 3, acquireTimeoutMs: 2_000 });
    await resetDatabase(sequelize);
    app = createApp(testConfig(), sequelize);
  });
  afterAll(async () => {
    await sequelize.close();
    await link.close();
  });

  it('answers 503 `unavailable` with Retry-After while it is down, and saves again once it is back', async () => {
    const cook = await signUpMember(app, 'Outage');
    const oats = await createFood(withAvailable({ ...SR_LEGACY.oats, name: 'Oats, rolled, dry' }));
    const body = { title: 'Porridge', defaultPortions: 2, visibility: 'private', ingredients: [{ foodId: oats.id, grams: 80 }] };

    link.cut();
    const down = await Promise.all([
      request(app).post('/api/recipes').set(bearer(cook.token)).send(body),
      request(app).get('/api/recipes').set(bearer(cook.token)),
      request(app).post('/api/auth/sign-in').send({ email: 'someone@example.test', password: 'long enough password' }),
    ]);
    for (const res of down) {
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('unavailable');
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    }

    link.restore();
    const up = await request(app).post('/api/recipes').set(bearer(cook.token)).send(body);
    expect(up.status).toBe(201);
    expect(await RecipeModel.count({ where: { ownerUserId: cook.userId } })).toBe(1);
  });

  it('never answers an error for a recipe it saved: the save and its answer are one statement, so a save that fails keeps nothing', async () => {
    const cook = await signUpMember(app, 'Readback');
    const oats = await createFood(withAvailable({ ...SR_LEGACY.oats, name: 'Oats, rolled, dry' }));
    const body = { title: 'Flapjack', defaultPortions: 8, visibility: 'private', ingredients: [{ foodId: oats.id, grams: 200 }] };
    // The recipe, its lines and the answer come from one INSERT … RETURNING (no read-back after it); make that
    // statement fail as a dropped connection would.
    const query = sequelize.query.bind(sequelize);
    const spy = jest.spyOn(sequelize, 'query').mockImplementation(((sql: unknown, options?: unknown) =>
      typeof sql === 'string' && sql.startsWith('WITH r AS (\n  INSERT INTO recipes')
        ? Promise.reject(new DatabaseError(new Error('Connection terminated unexpectedly') as never))
        : query(sql as string, options as never)) as typeof sequelize.query);
    try {
      const res = await request(app).post('/api/recipes').set(bearer(cook.token)).send(body);
      expect(res.status).toBe(503);
      expect(spy.mock.calls.some(([sql]) => typeof sql === 'string' && sql.startsWith('WITH r AS'))).toBe(true);
    } finally {
      spy.mockRestore();
    }
    // Nothing was acknowledged, so nothing was kept: the retry is the only copy.
    expect(await RecipeModel.count({ where: { ownerUserId: cook.userId } })).toBe(0);
    const retry = await request(app).post('/api/recipes').set(bearer(cook.token)).send(body);
    expect(retry.status).toBe(201);
    expect(await RecipeModel.count({ where: { ownerUserId: cook.userId } })).toBe(1);
  });
});
