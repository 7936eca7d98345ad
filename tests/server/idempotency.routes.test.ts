import request from 'supertest';
import { BatchModel, ContainerModel, FoodModel, RecipeModel } from '../../server/models';
import { bearer, signUpMember, useTestApp } from '../helpers/api';
import { overnightOats, postBatch } from './batches-fixtures';

const ctx = useTestApp();

const idem = (key: string) => ({ 'Idempotency-Key': key });
const crackers = { name: 'Oat crackers', basis: 'per100g', convention: 'eu', carbohydrate: 60, fibre: 10 };

describe('Idempotency-Key on creates', () => {
  it('answers a retried recipe create with the first answer and keeps one row', async () => {
    const cook = await signUpMember(ctx.app, 'Retry');
    const { foods } = await overnightOats(cook.userId);
    const body = { title: 'Oat bake', defaultPortions: 4, visibility: 'private', ingredients: [{ foodId: foods.oats.id, grams: 200 }] };
    const before = await RecipeModel.count({ where: { ownerUserId: cook.userId } });

    const first = await request(ctx.app).post('/api/recipes').set(bearer(cook.token)).set(idem('recipe-1')).send(body);
    const again = await request(ctx.app).post('/api/recipes').set(bearer(cook.token)).set(idem('recipe-1')).send(body);

    expect(first.status).toBe(201);
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await RecipeModel.count({ where: { ownerUserId: cook.userId } })).toBe(before + 1);
  });

  it('keeps one batch when the same key is sent twice at the same time', async () => {
    const cook = await signUpMember(ctx.app, 'Twice');
    const { input } = await overnightOats(cook.userId);
    const send = () => postBatch(ctx.app, cook.token, cook.profileId, input).set(idem('batch-at-once'));

    const [a, b] = await Promise.all([send(), send()]);

    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body.id).toBe(b.body.id);
    expect(await BatchModel.count({ where: { profileId: cook.profileId } })).toBe(1);
  });

  it('answers 422 when a key is reused for a different request, and saves nothing more', async () => {
    const cook = await signUpMember(ctx.app, 'Reuse');
    const base = `/api/profiles/${cook.profileId}/containers`;

    const first = await request(ctx.app).post(base).set(bearer(cook.token)).set(idem('jar')).send({ name: 'Jar', tareGrams: 210 });
    const other = await request(ctx.app).post(base).set(bearer(cook.token)).set(idem('jar')).send({ name: 'Jar', tareGrams: 310 });

    expect(first.status).toBe(201);
    expect(other.status).toBe(422);
    expect(other.body.error.code).toBe('unprocessable');
    expect(await ContainerModel.count({ where: { profileId: cook.profileId } })).toBe(1);
  });

  it('keeps keys apart per user and per route, and leaves creates without a key alone', async () => {
    const a = await signUpMember(ctx.app, 'Ana');
    const b = await signUpMember(ctx.app, 'Ben');
    const jar = { name: 'Jar', tareGrams: 200 };

    const mine = await request(ctx.app).post(`/api/profiles/${a.profileId}/containers`).set(bearer(a.token)).set(idem('same')).send(jar);
    const theirs = await request(ctx.app).post(`/api/profiles/${b.profileId}/containers`).set(bearer(b.token)).set(idem('same')).send(jar);
    const food = await request(ctx.app).post('/api/foods').set(bearer(a.token)).set(idem('same')).send(crackers);
    await request(ctx.app).post(`/api/profiles/${a.profileId}/containers`).set(bearer(a.token)).send(jar);
    await request(ctx.app).post(`/api/profiles/${a.profileId}/containers`).set(bearer(a.token)).send(jar);

    expect([mine.status, theirs.status]).toEqual([201, 201]);
    expect(theirs.body.id).not.toBe(mine.body.id);
    expect(food.status).toBe(201);
    expect(food.headers['idempotent-replayed']).toBeUndefined();
    expect(await ContainerModel.count({ where: { profileId: a.profileId } })).toBe(3);
    expect(await ContainerModel.count({ where: { profileId: b.profileId } })).toBe(1);
  });

  it('stores no key for a refused create, so a corrected retry with the same key is saved', async () => {
    const cook = await signUpMember(ctx.app, 'Fix');
    const base = `/api/profiles/${cook.profileId}/containers`;

    const bad = await request(ctx.app).post(base).set(bearer(cook.token)).set(idem('fix-1')).send({ name: 'Jar', tareGrams: -5 });
    const good = await request(ctx.app).post(base).set(bearer(cook.token)).set(idem('fix-1')).send({ name: 'Jar', tareGrams: 5 });

    expect(bad.status).toBe(400);
    expect(good.status).toBe(201);
    expect(await ContainerModel.count({ where: { profileId: cook.profileId } })).toBe(1);
  });

  it.each([
    { name: 'an empty key', key: '' },
    { name: 'a key with a space', key: 'a b' },
    { name: 'a key over 200 characters', key: 'k'.repeat(201) },
  ])('refuses $name with 400', async ({ key }) => {
    const cook = await signUpMember(ctx.app, 'Bad key');

    const res = await request(ctx.app).post(`/api/profiles/${cook.profileId}/containers`).set(bearer(cook.token)).set(idem(key)).send({ name: 'Jar', tareGrams: 1 });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('Idempotency-Key');
    expect(await ContainerModel.count({ where: { profileId: cook.profileId } })).toBe(0);
  });

  it('replays a pack food create (one food row)', async () => {
    const cook = await signUpMember(ctx.app, 'Pack');
    const send = () => request(ctx.app).post('/api/foods').set(bearer(cook.token)).set(idem('pack-1')).send(crackers);

    const first = await send();
    const again = await send();

    expect(first.status).toBe(201);
    expect(again.body).toEqual(first.body);
    expect(await FoodModel.count({ where: { ownerUserId: cook.userId } })).toBe(1);
  });
});
