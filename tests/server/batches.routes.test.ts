import request from 'supertest';
import { BatchIngredientModel, BatchModel, FoodModel, PortionModel, ProfileModel, RecipeModel } from '../../server/models';
import * as portionCode from '../../shared/compute/portion-code';
import { normalizePortionCode } from '../../shared/compute/portion-code';
import { bearer, signUpMember, useTestApp } from '../helpers/api';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';
import { makeRecipe, overnightOats, postBatch } from './batches-fixtures';

const ctx = useTestApp();

const member = (name = 'Cook') => signUpMember(ctx.app, name);

describe('POST /api/profiles/:profileId/batches (weighed portions)', () => {
  it('saves the week of overnight oats with five weighed portions matching the hand calculation', async () => {
    const cook = await member();
    const { input } = await overnightOats(cook.userId);

    const res = await postBatch(ctx.app, cook.token, cook.profileId, input);

    expect(res.status).toBe(201);
    const batch = res.body;
    // Hand calculation (tests/shared/batch.test.ts): raw 1158 g, cooked 1612 − 480 = 1132 g,
    // available 196.4503 g, 17.35427 g/100 g; portions 226 g → 39.2206 g, 227 g → 39.3942 g.
    expect(batch).toMatchObject({ rawGrams: 1158, cookedGrams: 1132, splitMode: 'weighed', basis: 'available', unit: 'g', gramsLeft: 0 });
    expect(batch.yieldFactor).toBeCloseTo(0.97755, 5);
    expect(batch.carbTotal.grams).toBeCloseTo(196.4503, 6);
    expect(batch.carbPer100g.grams).toBeCloseTo(17.35427, 5);
    expect(batch.portions.map((p: { netGrams: number }) => p.netGrams)).toEqual([226, 226, 227, 227, 226]);
    expect(batch.portions[0].carb.grams).toBeCloseTo(39.2206, 3);
    expect(batch.portions[2].carb.grams).toBeCloseTo(39.3942, 3);
    expect(batch.ingredients.map((l: { differenceGrams: number }) => l.differenceGrams)).toEqual([2, -4, -3, 13]);
    const codes = batch.portions.map((p: { code: string }) => p.code);
    expect(new Set(codes).size).toBe(5);
    for (const code of codes) expect(normalizePortionCode(code)).toBe(code);
    expect(await PortionModel.count({ where: { batchId: batch.id, profileId: cook.profileId, status: 'available' } })).toBe(5);
  });

  it('gives the use-by date from the UK rule by default and shows its source', async () => {
    const cook = await member();
    const { input } = await overnightOats(cook.userId);

    const res = await postBatch(ctx.app, cook.token, cook.profileId, input);

    // check-values T26: UK fridge D+2 (FSA).
    expect(res.body).toMatchObject({ cookedOn: '2026-03-10', useBy: '2026-03-12', storage: 'fridge' });
    expect(res.body.useBySource).toMatch(/Food Standards Agency/);
  });

  it.each([
    // check-values T26: US fridge D+3 (USDA FSIS); freezer 3 months (USDA FSIS, best quality).
    { name: 'US fridge: + 3 days', change: { region: 'us' }, useBy: '2026-03-13', source: /USDA/ },
    { name: 'freezer: + 3 months', change: { storage: 'freezer' }, useBy: '2026-06-10', source: /USDA/ },
    { name: 'a date the cook set', change: { useBy: '2026-03-11' }, useBy: '2026-03-11', source: /cook/ },
  ])('uses $name', async ({ change, useBy, source }) => {
    const cook = await member();
    const { input } = await overnightOats(cook.userId);

    const res = await postBatch(ctx.app, cook.token, cook.profileId, { ...input, ...change });

    expect(res.status).toBe(201);
    expect(res.body.useBy).toBe(useBy);
    expect(res.body.useBySource).toMatch(source);
  });
});

describe('the answer to a save', () => {
  it.each([
    { name: 'weighed into containers with a pot', split: 'weighed' as const },
    { name: 'split equally', split: 'equal' as const },
  ])('is exactly the batch page ($name)', async ({ split }) => {
    const cook = await member();
    const { input } = await overnightOats(cook.userId);
    const containers = `/api/profiles/${cook.profileId}/containers`;
    const pot = await request(ctx.app).post(containers).set(bearer(cook.token)).send({ name: 'Big pot', kind: 'pot', tareGrams: 480 });
    const jar = await request(ctx.app).post(containers).set(bearer(cook.token)).send({ name: 'Jar 1', kind: 'container', tareGrams: 212 });
    const body = {
      ...input,
      note: 'Made on Sunday',
      cookedWeight: { ...input.cookedWeight, containerId: pot.body.id },
      split: split === 'equal' ? { mode: 'equal', count: 3 } : { mode: 'weighed', portions: input.split.mode === 'weighed' ? input.split.portions.map((p, i) => (i === 0 ? { ...p, containerId: jar.body.id } : p)) : [] },
    };

    const saved = await postBatch(ctx.app, cook.token, cook.profileId, body);
    const page = await request(ctx.app).get(`/api/profiles/${cook.profileId}/batches/${saved.body.id}`).set(bearer(cook.token));

    expect(saved.status).toBe(201);
    // Same keys in the same order and the same values as the batch page reads them back.
    expect(JSON.stringify(saved.body)).toBe(JSON.stringify(page.body));
    expect(saved.body).toMatchObject({ potName: 'Big pot', note: 'Made on Sunday', cookedBy: { id: cook.userId } });
    if (split === 'weighed') expect(saved.body.portions[0]).toMatchObject({ containerName: 'Jar 1', grossGrams: 438, tareGrams: 212 });
    else expect(saved.body.portions.map((p: { grossGrams: number | null }) => p.grossGrams)).toEqual([null, null, null]);
  });
});

describe('portion codes', () => {
  it('draws new codes and saves once when the unique index refuses a code already in use', async () => {
    const cook = await member();
    const { input } = await overnightOats(cook.userId);
    const first = await postBatch(ctx.app, cook.token, cook.profileId, input);
    const taken = first.body.portions[0].code as string;
    const real = portionCode.generatePortionCode;
    let calls = 0;
    const spy = jest.spyOn(portionCode, 'generatePortionCode').mockImplementation((randomInt) => (calls++ === 0 ? taken : real(randomInt)));
    try {
      const second = await postBatch(ctx.app, cook.token, cook.profileId, input);

      expect(second.status).toBe(201);
      // Five codes for the refused statement (one of them taken), five new ones for the saved one.
      expect(calls).toBeGreaterThanOrEqual(10);
      expect(second.body.portions.map((p: { code: string }) => p.code)).not.toContain(taken);
      expect(await BatchModel.count({ where: { profileId: cook.profileId } })).toBe(2);
      expect(await PortionModel.count({ where: { profileId: cook.profileId } })).toBe(10);
    } finally {
      spy.mockRestore();
    }
  });
});

describe('equal portions and the profile basis and unit', () => {
  // check-values §2.3 / T1: porridge of oats 500 g, whole milk 1000 g, water 1000 g cooked to 2200 g, 8 portions.
  async function porridge() {
    const cook = await member();
    const oats = await createFood(withAvailable({ ...SR_LEGACY.oats, name: 'Oats, rolled' }));
    const milk = await createFood(withAvailable({ ...SR_LEGACY.wholeMilk, name: 'Milk, whole' }));
    const water = await createFood(withAvailable({ ...SR_LEGACY.water, name: 'Water' }));
    const recipe = await makeRecipe(cook.userId, 'Porridge', [
      { foodId: oats.id, grams: 500 },
      { foodId: milk.id, grams: 1000 },
      { foodId: water.id, grams: 1000 },
    ]);
    const res = await postBatch(ctx.app, cook.token, cook.profileId, {
      recipeId: recipe.id,
      cookedOn: '2026-03-10',
      storage: 'fridge',
      ingredients: [
        { foodId: oats.id, plannedGrams: 500, actualGrams: 500 },
        { foodId: milk.id, plannedGrams: 1000, actualGrams: 1000 },
        { foodId: water.id, plannedGrams: 1000, actualGrams: 1000 },
      ],
      cookedWeight: { grossGrams: 3400, tareGrams: 1200 },
      split: { mode: 'equal', count: 8 },
    });
    expect(res.status).toBe(201);
    return { cook, batchId: res.body.id as number, created: res.body };
  }

  it('splits T1 into 8 portions of 275 g with 42.00 g available carbohydrate each', async () => {
    const { created } = await porridge();

    expect(created.yieldFactor).toBeCloseTo(0.88, 9);
    expect(created.portions).toHaveLength(8);
    expect(created.portions[0].netGrams).toBeCloseTo(275, 9);
    // T1: available 42.000 g per portion, 15.273 g/100 g cooked (±0.01 g).
    expect(Math.abs(created.portions[0].carb.grams - 42.0)).toBeLessThan(0.01);
    expect(Math.abs(created.carbPer100g.grams - 15.273)).toBeLessThan(0.01);
  });

  it.each([
    // T1 total basis: 48.3125 g per portion; T22 unit sizes 10/12/15 g (check-values §6).
    { name: 'total carbohydrate in grams', basis: 'total', unit: 'g', grams: 48.3125, inUnit: 48.3125 },
    { name: 'available carbohydrate in 10 g portions', basis: 'available', unit: 'portion10', grams: 42.0, inUnit: 4.2 },
    { name: 'available carbohydrate in 12 g units', basis: 'available', unit: 'unit12', grams: 42.0, inUnit: 3.5 },
    { name: 'total carbohydrate in 15 g exchanges', basis: 'total', unit: 'exchange15', grams: 48.3125, inUnit: 3.2208 },
  ])('answers in the profile setting: $name', async ({ basis, unit, grams, inUnit }) => {
    const { cook, batchId } = await porridge();
    await ProfileModel.update({ carbBasis: basis as 'total', carbUnit: unit as 'g' }, { where: { id: cook.profileId } });

    const res = await request(ctx.app).get(`/api/profiles/${cook.profileId}/batches/${batchId}`).set(bearer(cook.token));

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ basis, unit });
    expect(Math.abs(res.body.portions[0].carb.grams - grams)).toBeLessThan(0.01);
    expect(res.body.portions[0].carb.inUnit).toBeCloseTo(inUnit, 3);
  });

  it('keeps its snapshot when the recipe and the food change afterwards', async () => {
    const { cook, batchId, created } = await porridge();
    await RecipeModel.update({ title: 'Porridge, renamed' }, { where: { id: created.recipeId } });
    await FoodModel.update({ carbTotal: 10, carbAvailable: 5, name: 'Oats, re-imported' }, { where: { id: created.ingredients[0].foodId } });

    const res = await request(ctx.app).get(`/api/profiles/${cook.profileId}/batches/${batchId}`).set(bearer(cook.token));

    expect(res.body.recipeTitle).toBe('Porridge');
    expect(res.body.ingredients[0]).toMatchObject({ foodName: 'Oats, rolled', per100g: expect.objectContaining({ carbTotal: 67.7 }) });
    expect(Math.abs(res.body.portions[0].carb.grams - 42.0)).toBeLessThan(0.01);
  });
});

describe('swapped and omitted ingredients', () => {
  it('records the swap and leaves an omitted line out of the totals', async () => {
    const cook = await member();
    const { input, foods } = await overnightOats(cook.userId);
    const skyr = await createFood(withAvailable({ name: 'Yogurt, strained, plain', carbTotal: 4, fibre: 0 }));
    const ingredients = [...input.ingredients];
    ingredients[2] = { foodId: skyr.id, plannedGrams: 250, actualGrams: 247, swappedFromFoodId: foods.yogurt.id };
    ingredients[3] = { foodId: foods.apple.id, plannedGrams: 150, omitted: true };

    const res = await postBatch(ctx.app, cook.token, cook.profileId, { ...input, ingredients, split: { mode: 'equal', count: 5 } });

    expect(res.status).toBe(201);
    expect(res.body.ingredients[2]).toMatchObject({ foodName: 'Yogurt, strained, plain', swappedFrom: { foodId: foods.yogurt.id, foodName: 'Yogurt, Greek, plain, nonfat' } });
    expect(res.body.ingredients[3]).toMatchObject({ omitted: true, actualGrams: null });
    // 252 + 496 + 247 = 995 g raw; available = 252×0.576 + 496×0.048 + 247×0.04 = 145.152 + 23.808 + 9.88 = 178.84 g.
    expect(res.body.rawGrams).toBe(995);
    expect(res.body.carbTotal.grams).toBeCloseTo(178.84, 6);
  });
});

describe('bad input gets a 400 naming the field and saves nothing', () => {
  type Mutate = (input: Record<string, any>, extra: { strangerFoodId: number }) => Record<string, unknown>;
  const cases: { name: string; mutate: Mutate; field: string }[] = [
    { name: '0 g weighed', mutate: (i) => ({ ...i, ingredients: [{ ...i.ingredients[0], actualGrams: 0 }, ...i.ingredients.slice(1)] }), field: 'ingredients.0.actualGrams' },
    { name: 'negative grams weighed', mutate: (i) => ({ ...i, ingredients: [i.ingredients[0], { ...i.ingredients[1], actualGrams: -5 }, ...i.ingredients.slice(2)] }), field: 'ingredients.1.actualGrams' },
    { name: 'a missing scale reading', mutate: (i) => ({ ...i, ingredients: [{ ...i.ingredients[0], actualGrams: null }, ...i.ingredients.slice(1)] }), field: 'ingredients.0.actualGrams' },
    { name: 'cooked weight 0 (gross 0)', mutate: (i) => ({ ...i, cookedWeight: { grossGrams: 0, tareGrams: 0 } }), field: 'cookedWeight.grossGrams' },
    { name: 'pot tare equal to the gross weight', mutate: (i) => ({ ...i, cookedWeight: { grossGrams: 480, tareGrams: 480 } }), field: 'cookedWeight.tareGrams' },
    { name: 'a container tare above its gross weight', mutate: (i) => ({ ...i, split: { mode: 'weighed', portions: [{ grossGrams: 200, tareGrams: 212 }] } }), field: 'split.portions.0.tareGrams' },
    { name: 'more weighed into portions than the batch holds', mutate: (i) => ({ ...i, split: { mode: 'weighed', portions: [...i.split.portions, { grossGrams: 400, tareGrams: 200 }] } }), field: 'split.portions' },
    { name: '0 equal portions', mutate: (i) => ({ ...i, split: { mode: 'equal', count: 0 } }), field: 'split.count' },
    { name: 'an unknown food', mutate: (i) => ({ ...i, ingredients: [{ ...i.ingredients[0], foodId: 999999 }, ...i.ingredients.slice(1)] }), field: 'ingredients.0.foodId' },
    { name: "another member's pack food", mutate: (i, x) => ({ ...i, ingredients: [{ ...i.ingredients[0], foodId: x.strangerFoodId }, ...i.ingredients.slice(1)] }), field: 'ingredients.0.foodId' },
    { name: 'no ingredients', mutate: (i) => ({ ...i, ingredients: [] }), field: 'ingredients' },
    { name: 'every ingredient left out', mutate: (i) => ({ ...i, ingredients: i.ingredients.map((l: object) => ({ ...l, omitted: true })) }), field: 'ingredients' },
    { name: 'an unknown recipe', mutate: (i) => ({ ...i, recipeId: 999999 }), field: 'recipeId' },
    { name: 'a use-by date before cooking', mutate: (i) => ({ ...i, useBy: '2026-03-01' }), field: 'useBy' },
    // Checked inside the transaction after the batch row and its lines are written: the rollback must undo them.
    { name: 'a container of another profile', mutate: (i) => ({ ...i, split: { mode: 'weighed', portions: [{ ...i.split.portions[0], containerId: 999999 }] } }), field: 'split.portions.0.containerId' },
    { name: 'a container of another profile', mutate: (i) => ({ ...i, cookedWeight: { ...i.cookedWeight, containerId: 999999 } }), field: 'cookedWeight.containerId' },
  ];

  it.each(cases)('$name → 400 on $field', async ({ mutate, field }) => {
    const cook = await member();
    const stranger = await member('Stranger');
    const { input } = await overnightOats(cook.userId);
    const strangerFood = await createFood(withAvailable({ name: 'Stranger pack food', carbTotal: 10, fibre: 0 }));
    await strangerFood.update({ source: 'pack', ownerUserId: stranger.userId });
    const before = { batches: await BatchModel.count(), lines: await BatchIngredientModel.count(), portions: await PortionModel.count() };

    const res = await postBatch(ctx.app, cook.token, cook.profileId, mutate(input as Record<string, unknown>, { strangerFoodId: strangerFood.id }));

    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fieldErrors)).toContain(field);
    expect({ batches: await BatchModel.count(), lines: await BatchIngredientModel.count(), portions: await PortionModel.count() }).toEqual(before);
  });
});

describe('who may see and cook batches', () => {
  it('answers 404 to a stranger for the batch, its labels and creating on that profile', async () => {
    const cook = await member();
    const stranger = await member('Stranger');
    const { input } = await overnightOats(cook.userId);
    const created = await postBatch(ctx.app, cook.token, cook.profileId, input);

    const get = await request(ctx.app).get(`/api/profiles/${cook.profileId}/batches/${created.body.id}`).set(bearer(stranger.token));
    const labels = await request(ctx.app).get(`/api/profiles/${cook.profileId}/batches/${created.body.id}/labels`).set(bearer(stranger.token));
    const post = await postBatch(ctx.app, stranger.token, cook.profileId, input);
    const ownProfile = await request(ctx.app).get(`/api/profiles/${stranger.profileId}/batches/${created.body.id}`).set(bearer(stranger.token));

    expect([get.status, labels.status, post.status, ownProfile.status]).toEqual([404, 404, 404, 404]);
  });

  it("refuses a private recipe of someone else as the batch's recipe", async () => {
    const cook = await member();
    const other = await member('Other');
    const { input } = await overnightOats(other.userId);

    const res = await postBatch(ctx.app, cook.token, cook.profileId, input);

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.recipeId).toBeDefined();
  });

  it('lists the inventory by batch with counts, newest cook first', async () => {
    const cook = await member();
    const { input } = await overnightOats(cook.userId);
    await postBatch(ctx.app, cook.token, cook.profileId, input);
    await postBatch(ctx.app, cook.token, cook.profileId, { ...input, cookedOn: '2026-03-12', split: { mode: 'equal', count: 2 } });

    const res = await request(ctx.app).get(`/api/profiles/${cook.profileId}/batches`).set(bearer(cook.token));

    expect(res.status).toBe(200);
    expect(res.body.items.map((b: { cookedOn: string }) => b.cookedOn)).toEqual(['2026-03-12', '2026-03-10']);
    expect(res.body.items[1].counts).toEqual({ available: 5, eaten: 0, discarded: 0 });
  });
});

describe('PATCH /api/profiles/:profileId/batches/:id', () => {
  it('moving to the freezer resets the use-by date from the freezer rule', async () => {
    const cook = await member();
    const { input } = await overnightOats(cook.userId);
    const created = await postBatch(ctx.app, cook.token, cook.profileId, input);

    const res = await request(ctx.app)
      .patch(`/api/profiles/${cook.profileId}/batches/${created.body.id}`)
      .set(bearer(cook.token))
      .send({ storage: 'freezer' });

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ storage: 'freezer', useBy: '2026-06-10' });
  });
});

describe('PATCH /api/profiles/:profileId/batches/:id', () => {
  it('gives a rice batch moved from the freezer to the fridge the one-day rice use-by date', async () => {
    const m = await member();
    // USDA SR Legacy NDB 20045, rice, white, long-grain, cooked: 28.17 g total carbohydrate, 0.4 g fibre (check-values §11).
    const rice = await createFood(withAvailable(SR_LEGACY.rice));
    const recipe = await makeRecipe(m.userId, 'Plain rice', [{ foodId: rice.id, grams: 500 }]);
    const created = await postBatch(ctx.app, m.token, m.profileId, {
      recipeId: recipe.id,
      cookedOn: '2026-03-10',
      storage: 'freezer',
      region: 'uk',
      ingredients: [{ foodId: rice.id, plannedGrams: 500, actualGrams: 500 }],
      cookedWeight: { grossGrams: 500, tareGrams: 0 },
      split: { mode: 'equal', count: 2 },
    });

    const moved = await request(ctx.app)
      .patch(`/api/profiles/${m.profileId}/batches/${created.body.id}`)
      .set(bearer(m.token))
      .send({ storage: 'fridge', region: 'uk' });

    expect(created.status).toBe(201);
    expect(moved.status).toBe(200);
    // check-values T26: UK cooked rice in the fridge, D+1 (FSA); other leftovers D+2.
    expect(moved.body).toMatchObject({ storage: 'fridge', useBy: '2026-03-11' });
    expect(moved.body.useBySource).toMatch(/cooked rice/);
  });

  it('keeps the region the batch was saved with when it is moved without naming one', async () => {
    const m = await member();
    // Dal ingredient with invented values (only the use-by date is under test here).
    const lentils = await createFood(withAvailable({ name: 'Lentils, red, dry (invented test values)', carbTotal: 60, fibre: 10 }));
    const recipe = await makeRecipe(m.userId, 'Dal', [{ foodId: lentils.id, grams: 400 }]);
    const created = await postBatch(ctx.app, m.token, m.profileId, {
      recipeId: recipe.id,
      cookedOn: '2026-03-10',
      storage: 'freezer',
      region: 'us',
      ingredients: [{ foodId: lentils.id, plannedGrams: 400, actualGrams: 400 }],
      cookedWeight: { grossGrams: 1000, tareGrams: 0 },
      split: { mode: 'equal', count: 4 },
    });

    const moved = await request(ctx.app).patch(`/api/profiles/${m.profileId}/batches/${created.body.id}`).set(bearer(m.token)).send({ storage: 'fridge' });

    expect(created.status).toBe(201);
    // check-values T26: USDA FSIS leftovers 3–4 days in the fridge → D+3 (the UK rule would give D+2).
    expect(moved.body).toMatchObject({ storage: 'fridge', useBy: '2026-03-13' });
  });
});

describe('a batch with an ingredient of unknown carbohydrate', () => {
  it('shows the portions’ carbohydrate as unknown instead of a partial sum that understates it', async () => {
    const m = await member();
    // USDA SR Legacy NDB 08120 rolled oats: 67.7 g total carbohydrate, 10.1 g fibre per 100 g (check-values §11).
    const oats = await createFood(withAvailable({ name: 'Oats, rolled, dry', carbTotal: 67.7, fibre: 10.1 }));
    const sauce = await createFood({ name: 'Sauce with no carbohydrate value', carbTotal: null, fibre: null });
    const recipe = await makeRecipe(m.userId, 'Oats with sauce', [
      { foodId: oats.id, grams: 100 },
      { foodId: sauce.id, grams: 100 },
    ]);
    const batch = await postBatch(ctx.app, m.token, m.profileId, {
      recipeId: recipe.id,
      cookedOn: '2026-03-10',
      storage: 'fridge',
      ingredients: [
        { foodId: oats.id, plannedGrams: 100, actualGrams: 100 },
        { foodId: sauce.id, plannedGrams: 100, actualGrams: 100 },
      ],
      cookedWeight: { grossGrams: 200, tareGrams: 0 },
      split: { mode: 'equal', count: 2 },
    });

    const portion = await request(ctx.app).get(`/api/portions/${batch.body.portions[0].code}`).set(bearer(m.token));
    const labels = await request(ctx.app).get(`/api/profiles/${m.profileId}/batches/${batch.body.id}/labels`).set(bearer(m.token));

    expect(batch.status).toBe(201);
    expect(batch.body.incomplete).toContain('carbAvailable');
    expect(batch.body.portions.map((p: { carb: { grams: number | null } }) => p.carb.grams)).toEqual([null, null]);
    expect(batch.body.carbTotal.grams).toBeNull();
    expect(portion.body.carb.grams).toBeNull();
    expect(portion.body.carbPer100g.grams).toBeNull();
    expect(labels.body.labels[0].text.carb).toBe('unknown');
  });
});
