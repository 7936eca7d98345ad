import request from 'supertest';
import { FoodModel } from '../../server/models';
import { runImport } from '../../server/services/imports.service';
import { bearer, signUpUser, useTestApp } from '../helpers/api';

let token: string;
const ctx = useTestApp();
beforeAll(async () => {
  await runImport(ctx.sequelize, 'ifct');
  // Invented foods that exercise ranking: the raw food must come before its processed variants.
  const base = { energyKcal: null, energyKj: null, carbAvailable: 10, carbTotal: null, fibre: null, sugars: null, protein: null, fat: null, water: null, carbMeasured: 'available' as const, attribution: 'Invented for a test', licence: 'none', foodGroup: 'Test' };
  for (const [code, name] of [['Z1', 'Zorblefruit juice, canned'], ['Z2', 'Zorblefruit, dried, sweetened'], ['Z3', 'Zorblefruit, raw'], ['Z4', 'Zorblefruit pie, baked']]) {
    await FoodModel.create({ ...base, source: 'usda_sr28', sourceCode: code, name });
  }
  token = (await signUpUser(ctx.app, 'Searcher')).token;
});

const search = (query: Record<string, string | number>) => request(ctx.app).get('/api/foods').query(query).set(bearer(token));
const names = (res: request.Response) => (res.body.items as { name: string }[]).map((f) => f.name);

describe('GET /api/foods', () => {
  it('finds bananas with a typo ("bananna")', async () => {
    const res = await search({ q: 'bananna' });

    expect(res.status).toBe(200);
    expect(names(res).slice(0, 4).every((n) => n.startsWith('Banana, ripe'))).toBe(true);
  });

  it('finds as the user types a prefix ("bana", "chick")', async () => {
    expect(names(await search({ q: 'bana' }))[0]).toMatch(/^Banana/);
    expect(names(await search({ q: 'chick' }))[0]).toMatch(/^Chick/);
  });

  it('finds a food by a local-language alternative name ("kela" → banana)', async () => {
    const res = await search({ q: 'kela' });

    expect(names(res)).toEqual(expect.arrayContaining(['Banana, ripe, robusta']));
    expect(res.body.items.find((f: { name: string }) => f.name === 'Banana, ripe, robusta').altNames).toContain('Kela');
  });

  it('ranks the plain raw food before processed variants', async () => {
    const res = await search({ q: 'zorblefruit' });

    expect(names(res)[0]).toBe('Zorblefruit, raw');
    expect(names(res)).toHaveLength(4);
  });

  it('pages through results with a cursor without repeats or gaps', async () => {
    const all = names(await search({ q: 'seed', limit: 50 }));
    const first = await search({ q: 'seed', limit: 5 });
    const second = await search({ q: 'seed', limit: 5, cursor: first.body.nextCursor });

    expect(all.length).toBeGreaterThan(10);
    expect(first.body.nextCursor).toBe('5');
    expect([...names(first), ...names(second)]).toEqual(all.slice(0, 10));
  });

  it('filters by source and group', async () => {
    const res = await search({ q: 'zorble', source: 'ifct2017' });
    const fruits = await search({ group: 'Fruits', limit: 50 });

    expect(res.body.items).toEqual([]);
    expect(fruits.body.items.length).toBeGreaterThan(10);
    expect(fruits.body.items.every((f: { group: string }) => f.group === 'Fruits')).toBe(true);
  });

  it.each([["'; DROP TABLE foods; --"], ['%'], ['_'], ['\\'], ["zzq' OR '1'='1"], ["banana' OR '1'='1"]])('treats SQL-looking input %j as text', async (q) => {
    const res = await search({ q });

    expect(res.status).toBe(200);
    expect(res.body.items).toEqual([]);
    expect(await FoodModel.count()).toBe(546);
  });

  it('returns carbohydrate per 100 g with both bases and which one was measured', async () => {
    const res = await search({ q: 'banana ripe robusta' });
    const robusta = res.body.items[0];

    // IFCT 2017 E012: choavldf 23.63 (available), fibtg 1.94 → total 25.57
    expect(robusta.name).toBe('Banana, ripe, robusta');
    expect(robusta.per100g.carbAvailable).toBe(23.63);
    expect(robusta.per100g.carbTotal).toBeCloseTo(25.57, 9);
    expect(robusta.carbMeasured).toBe('available');
    expect(robusta.derived).toContain('carbTotal');
  });

  it('returns 400 with fieldErrors for a bad limit or cursor and 401 without a token', async () => {
    const bad = await search({ q: 'rice', limit: 500, cursor: 'abc' });
    const anonymous = await request(ctx.app).get('/api/foods?q=rice');

    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fieldErrors).sort()).toEqual(['cursor', 'limit']);
    expect(anonymous.status).toBe(401);
  });
});

describe('GET /api/foods/:id', () => {
  it('returns every value, the source and the licence', async () => {
    const banana = await FoodModel.findOne({ where: { sourceCode: 'E012' } });

    const res = await request(ctx.app).get(`/api/foods/${banana!.id}`).set(bearer(token));

    expect(res.status).toBe(200);
    expect(res.body.food).toMatchObject({
      name: 'Banana, ripe, robusta',
      source: 'ifct2017',
      sourceCode: 'E012',
      group: 'Fruits',
      measures: [],
      carbStarchSugars: 18.94,
      scientificName: 'Musa x paradisiaca',
    });
    expect(res.body.food.attribution).toContain('Indian Food Composition Tables 2017');
    expect(res.body.food.licence).toBeTruthy();
  });

  it('returns 404 for a food that does not exist and 400 for a bad id', async () => {
    expect((await request(ctx.app).get('/api/foods/999999').set(bearer(token))).status).toBe(404);
    const bad = await request(ctx.app).get('/api/foods/abc').set(bearer(token));
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors.id).toBeDefined();
  });
});
