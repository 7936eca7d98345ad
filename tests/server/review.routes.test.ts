import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PNG } from 'pngjs';
import request from 'supertest';
import { FoodModel } from '../../server/models';
import { bearer, signUpMember, signUpUser, startTestApp, type TestContext } from '../helpers/api';
import { makeFood, makeRecipe, postBatch } from './batches-fixtures';

let ctx: TestContext;
const uploads = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-review-uploads-'));
beforeAll(async () => {
  ctx = await startTestApp({ UPLOADS_DIR: uploads });
});
afterAll(async () => {
  await ctx.sequelize.close();
  fs.rmSync(uploads, { recursive: true, force: true });
});

const member = (name = 'Member') => signUpMember(ctx.app, name);

describe('PATCH /api/profiles/:profileId/containers/:id', () => {
  it('keeps a pot a pot when only its name is changed', async () => {
    const m = await member();
    const base = `/api/profiles/${m.profileId}/containers`;
    const pot = await request(ctx.app).post(base).set(bearer(m.token)).send({ name: 'Big pot', kind: 'pot', tareGrams: 1450 });

    const renamed = await request(ctx.app).patch(`${base}/${pot.body.id}`).set(bearer(m.token)).send({ name: 'Big blue pot' });
    const list = await request(ctx.app).get(base).set(bearer(m.token));

    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({ name: 'Big blue pot', kind: 'pot', tareGrams: 1450 });
    expect(list.body.items).toEqual([expect.objectContaining({ id: pot.body.id, kind: 'pot' })]);
  });
});

describe('PATCH /api/profiles/:profileId/batches/:id', () => {
  it('gives a rice batch moved from the freezer to the fridge the one-day rice use-by date', async () => {
    const m = await member();
    // USDA SR Legacy NDB 20045, rice, white, long-grain, cooked: 28.17 g total carbohydrate, 0.4 g fibre (check-values §11).
    const rice = await makeFood('Rice, white, long-grain, cooked', { carbTotal: 28.17, fibre: 0.4 });
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
    const lentils = await makeFood('Lentils, red, dry (invented test values)', { carbTotal: 60, fibre: 10 });
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

describe('PUT /api/profiles/:profileId/days/:date', () => {
  it('answers every one of several simultaneous requests for the same date, and keeps one of them', async () => {
    const m = await member();
    const kinds: number[] = [];
    for (const name of ['Rest', 'Ride']) {
      const res = await request(ctx.app)
        .post(`/api/profiles/${m.profileId}/day-kinds`)
        .set(bearer(m.token))
        .send({ name, isDefault: name === 'Rest', longActingUnits: 18, glucoseUnit: 'mmol_l', blocks: [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 2 }] });
      kinds.push(res.body.id);
    }

    const answers = await Promise.all(
      Array.from({ length: 8 }, (_, i) =>
        request(ctx.app).put(`/api/profiles/${m.profileId}/days/2026-03-03`).set(bearer(m.token)).send({ dayKindId: kinds[i % 2] }),
      ),
    );
    const day = await request(ctx.app).get(`/api/profiles/${m.profileId}/days?from=2026-03-03&to=2026-03-03`).set(bearer(m.token));

    expect(answers.map((a) => a.status)).toEqual(Array(8).fill(200));
    expect(day.body.days).toHaveLength(1);
    expect(kinds).toContain(day.body.days[0].dayKindId);
    expect(day.body.days[0].isSet).toBe(true);
  });
});

describe('POST /api/profiles/:profileId/batches (a recipe shared with me)', () => {
  it('lets the person a recipe was shared with cook it when it uses the owner’s label food', async () => {
    const owner = await member('Owner');
    const friend = await signUpUser(ctx.app, 'Friend');
    // check-values.md §1.2 worked example label: 60 g available carbohydrate and 10 g fibre per 100 g.
    const crackers = await request(ctx.app)
      .post('/api/foods')
      .set(bearer(owner.token))
      .send({ name: 'Oat crackers', basis: 'per100g', convention: 'eu', carbohydrate: 60, fibre: 10, protein: 12, fat: 7 });
    const recipe = await request(ctx.app)
      .post('/api/recipes')
      .set(bearer(owner.token))
      .send({ title: 'Cracker snack', defaultPortions: 2, visibility: 'private', ingredients: [{ foodId: crackers.body.food.id, grams: 100 }] });
    const share = await request(ctx.app).post(`/api/recipes/${recipe.body.id}/shares`).set(bearer(owner.token)).send({ email: friend.email });

    const cooked = await postBatch(ctx.app, friend.token, friend.me.profiles[0].id, {
      recipeId: recipe.body.id,
      cookedOn: '2026-03-10',
      storage: 'fridge',
      ingredients: [{ foodId: crackers.body.food.id, plannedGrams: 100, actualGrams: 100 }],
      cookedWeight: { grossGrams: 100, tareGrams: 0 },
      split: { mode: 'equal', count: 2 },
    });

    expect([crackers.status, recipe.status, share.status]).toEqual([201, 201, 201]);
    expect(cooked.status).toBe(201);
    // 100 g at 60 g available per 100 g, split in two: 30 g each.
    expect(cooked.body.carbTotal.grams).toBeCloseTo(60, 6);
    expect(cooked.body.portions.map((p: { carb: { grams: number } }) => p.carb.grams)).toEqual([30, 30]);
  });

  it('still refuses another member’s private label food that is not in the recipe', async () => {
    const owner = await member('Owner');
    const stranger = await member('Stranger');
    const hidden = await request(ctx.app)
      .post('/api/foods')
      .set(bearer(stranger.token))
      .send({ name: 'Secret crackers', basis: 'per100g', convention: 'eu', carbohydrate: 60, fibre: 10 });
    // USDA SR Legacy NDB 20045 cooked rice, 28.17 g total carbohydrate, 0.4 g fibre (check-values §11).
    const rice = await makeFood('Rice, white, long-grain, cooked', { carbTotal: 28.17, fibre: 0.4 });
    const recipe = await makeRecipe(owner.userId, 'Rice', [{ foodId: rice.id, grams: 100 }]);

    const res = await postBatch(ctx.app, owner.token, owner.profileId, {
      recipeId: recipe.id,
      cookedOn: '2026-03-10',
      storage: 'fridge',
      ingredients: [{ foodId: hidden.body.food.id, plannedGrams: 100, actualGrams: 100 }],
      cookedWeight: { grossGrams: 100, tareGrams: 0 },
      split: { mode: 'equal', count: 1 },
    });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['ingredients.0.foodId']).toBeDefined();
  });
});

describe('label food photos', () => {
  const values = { name: 'Photo crackers', basis: 'per100g', convention: 'eu', carbohydrate: 60, fibre: 10 };

  it('refuses a "photo" whose bytes are not an image, whatever type it claims, and saves no food', async () => {
    const m = await member();
    const page = Buffer.from('<html><script>alert(1)</script></html>');

    const res = await request(ctx.app)
      .post('/api/foods')
      .set(bearer(m.token))
      .field('data', JSON.stringify(values))
      .attach('photo', page, { filename: 'label.png', contentType: 'image/png' });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.photo).toBeDefined();
    expect(fs.existsSync(path.join(uploads, 'label-photos')) ? fs.readdirSync(path.join(uploads, 'label-photos')) : []).toEqual([]);
    expect(await FoodModel.count({ where: { ownerUserId: m.userId } })).toBe(0);
  });

  it('answers 404, not 500, when a label photo file has gone from the disk', async () => {
    const m = await member();
    const png = new PNG({ width: 4, height: 4 });
    png.data.fill(200);
    const created = await request(ctx.app)
      .post('/api/foods')
      .set(bearer(m.token))
      .field('data', JSON.stringify(values))
      .attach('photo', PNG.sync.write(png), { filename: 'label.png', contentType: 'image/png' });
    fs.rmSync(path.join(uploads, 'label-photos'), { recursive: true, force: true });

    const link = await request(ctx.app).get(`/api/foods/${created.body.food.id}/photo`).set(bearer(m.token));
    const res = await request(ctx.app).get(link.headers.location);

    expect(created.status).toBe(201);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

describe('a batch with an ingredient of unknown carbohydrate', () => {
  it('shows the portions’ carbohydrate as unknown instead of a partial sum that understates it', async () => {
    const m = await member();
    // USDA SR Legacy NDB 08120 rolled oats: 67.7 g total carbohydrate, 10.1 g fibre per 100 g (check-values §11).
    const oats = await makeFood('Oats, rolled, dry', { carbTotal: 67.7, fibre: 10.1 });
    const sauce = await FoodModel.create({
      source: 'usda_sr28',
      sourceCode: `REVIEW-${process.pid}`,
      name: 'Sauce with no carbohydrate value',
      foodGroup: null,
      energyKcal: null,
      energyKj: null,
      carbAvailable: null,
      carbTotal: null,
      fibre: null,
      sugars: null,
      protein: null,
      fat: null,
      water: null,
      carbMeasured: 'total',
      attribution: 'test fixture',
      licence: 'test fixture',
    });
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
