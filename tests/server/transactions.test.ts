import request from 'supertest';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { createApp } from '../../server/app';
import { createSequelize } from '../../server/db';
import { bearer, signUpMember } from '../helpers/api';
import { resetDatabase, testConfig, workerDatabaseUrl } from '../helpers/db';
import { overnightOats, postBatch } from './batches-fixtures';

// Sixty saves through a pool of three take a while on a busy machine; the time is not what is tested.
jest.setTimeout(120_000);

/** The app on this worker's database with a deliberately small pool, so a query outside its transaction deadlocks. */
async function smallPoolApp(poolMax: number, acquireMs: number): Promise<{ app: Express; sequelize: Sequelize }> {
  const sequelize = createSequelize(workerDatabaseUrl(), { poolMax, acquireTimeoutMs: acquireMs });
  await resetDatabase(sequelize);
  return { app: createApp(testConfig(), sequelize), sequelize };
}

describe('every query inside a transaction runs on it (pool of 3 connections)', () => {
  let ctx: { app: Express; sequelize: Sequelize };
  beforeAll(async () => {
    // A generous acquire timeout: only a deadlock (a query outside its transaction) can run it out.
    ctx = await smallPoolApp(3, 60_000);
  });
  afterAll(async () => {
    await ctx.sequelize.close();
  });

  it('answers 20 parallel recipe creations, 20 recipe updates and 20 batch saves, all successfully', async () => {
    const cook = await signUpMember(ctx.app, 'Parallel');
    const { input, recipe, foods } = await overnightOats(cook.userId);
    const recipeBody = {
      title: 'Oats for the week',
      defaultPortions: 5,
      visibility: 'private',
      ingredients: Object.values(foods).map((f) => ({ foodId: f.id, grams: 100 })),
    };

    const answers = await Promise.all([
      ...Array.from({ length: 20 }, () => request(ctx.app).post('/api/recipes').set(bearer(cook.token)).send(recipeBody)),
      ...Array.from({ length: 20 }, () => request(ctx.app).put(`/api/recipes/${recipe.id}`).set(bearer(cook.token)).send(recipeBody)),
      ...Array.from({ length: 20 }, () => postBatch(ctx.app, cook.token, cook.profileId, input)),
    ]);

    expect(answers.map((r) => r.status)).toEqual([...Array(20).fill(201), ...Array(20).fill(200), ...Array(20).fill(201)]);
  });
});

describe('an exhausted pool', () => {
  let ctx: { app: Express; sequelize: Sequelize };
  beforeAll(async () => {
    ctx = await smallPoolApp(1, 300);
  });
  afterAll(async () => {
    await ctx.sequelize.close();
  });

  it('answers 503 with its own code and Retry-After instead of hanging', async () => {
    const held = await ctx.sequelize.transaction();
    try {
      const busy = await request(ctx.app).post('/api/auth/sign-in').send({ email: 'a@example.test', password: 'whatever-long-enough' });
      expect(busy.status).toBe(503);
      expect(busy.body.error.code).toBe('busy');
      expect(Number(busy.headers['retry-after'])).toBeGreaterThan(0);
    } finally {
      await held.rollback();
    }
  });
});

describe('more writers than connections (pool of 2, acquire timeout 1.5 s)', () => {
  let ctx: { app: Express; sequelize: Sequelize };
  beforeAll(async () => {
    ctx = await smallPoolApp(2, 1_500);
  });
  afterAll(async () => {
    await ctx.sequelize.close();
  });

  it('answers all 40 parallel creates, each saved (201) or refused as busy (503, Retry-After), and keeps exactly the saved ones', async () => {
    const cook = await signUpMember(ctx.app, 'Crowd');
    const { input, foods } = await overnightOats(cook.userId);
    const recipeBody = { title: 'Crowd oats', defaultPortions: 5, visibility: 'private', ingredients: [{ foodId: foods.oats.id, grams: 100 }] };
    const sends = [
      ...Array.from({ length: 20 }, () => request(ctx.app).post('/api/recipes').set(bearer(cook.token)).send(recipeBody)),
      ...Array.from({ length: 20 }, () => postBatch(ctx.app, cook.token, cook.profileId, input)),
    ];

    // A hang would never settle; the jest timeout is the bound, not a speed target.
    const answers = await Promise.all(sends);

    for (const res of answers) {
      expect([201, 503]).toContain(res.status);
      if (res.status === 503) {
        expect(res.body.error.code).toBe('busy');
        expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      }
    }
    const savedRecipes = answers.slice(0, 20).filter((r) => r.status === 201).length;
    const savedBatches = answers.slice(20).filter((r) => r.status === 201).length;
    const [[counts]] = (await ctx.sequelize.query(
      `SELECT (SELECT count(*) FROM recipes WHERE title = 'Crowd oats')::int AS recipes, (SELECT count(*) FROM batches WHERE profile_id = ${cook.profileId})::int AS batches`,
    )) as [{ recipes: number; batches: number }[], unknown];
    expect(counts).toEqual({ recipes: savedRecipes, batches: savedBatches });
  });
});
