import request from 'supertest';
import { BatchIngredientModel, FoodModel } from '../../server/models';
import { bearer, signUpMember, useTestApp } from '../helpers/api';
import { makeRecipe, postBatch } from './batches-fixtures';

const ctx = useTestApp();
const member = (name = 'Packer') => signUpMember(ctx.app, name);

// check-values.md §1.2 worked example: EU label, available 60 g, fibre 10 g per 100 g → total 70 g.
const crackers = { name: 'Oat crackers', basis: 'per100g', convention: 'eu', carbohydrate: 60, fibre: 10, sugars: 2, protein: 12, fat: 7, energyKcal: 371 };

const create = async (token: string, body: object = crackers) => {
  const res = await request(ctx.app).post('/api/foods').set(bearer(token)).send(body);
  expect(res.status).toBe(201);
  return res.body.food as { id: number };
};
const put = (token: string, id: number, body: object) => request(ctx.app).put(`/api/foods/${id}`).set(bearer(token)).send(body);
const del = (token: string, id: number) => request(ctx.app).delete(`/api/foods/${id}`).set(bearer(token));

describe('PUT /api/foods/:id (edit a pack food)', () => {
  it('replaces the values with the create rule and stores them', async () => {
    const m = await member();
    const food = await create(m.token);

    // A US label of 40 g total with 8 g fibre per 100 g: available = 40 − 8 = 32 g (21 CFR 101.9(c)(6)).
    const res = await put(m.token, food.id, { name: 'Oat crackers, thin', brand: 'Hillside', basis: 'per100g', convention: 'us', carbohydrate: 40, fibre: 8 });

    expect(res.status).toBe(200);
    expect(res.body.food).toMatchObject({ id: food.id, name: 'Oat crackers, thin (Hillside)', carbMeasured: 'total', labelConvention: 'us' });
    expect(res.body.food.per100g).toMatchObject({ carbTotal: 40, carbAvailable: 32, fibre: 8, protein: null });
    const row = await FoodModel.findByPk(food.id);
    expect(row).toMatchObject({ name: 'Oat crackers, thin (Hillside)', carbTotal: 40, carbAvailable: 32, carbMeasured: 'total', ownerUserId: m.userId });
  });

  it('refuses the same invalid input as create, with the field named, and leaves the row alone', async () => {
    const m = await member();
    const food = await create(m.token);

    const res = await put(m.token, food.id, { ...crackers, carbohydrate: -1 });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.carbohydrate).toEqual(['Carbohydrate cannot be negative.']);
    expect((await FoodModel.findByPk(food.id))?.carbAvailable).toBe(60);
  });

  it("answers 404 for someone else's pack food and for a table food, changing nothing", async () => {
    const owner = await member('Owner');
    const other = await member('Other');
    const food = await create(owner.token);
    const table = await FoodModel.findOne({ where: { source: 'usda_sr28' } });

    expect((await put(other.token, food.id, { ...crackers, carbohydrate: 5 })).status).toBe(404);
    expect((await FoodModel.findByPk(food.id))?.carbAvailable).toBe(60);
    if (table) expect((await put(owner.token, table.id, crackers)).status).toBe(404);
  });

  it('changes the recipes that use the food from then on; a cooked batch keeps the values it was cooked with', async () => {
    const m = await member();
    const food = await create(m.token);
    const recipe = await makeRecipe(m.userId, 'Cracker crumble', [{ foodId: food.id, grams: 200 }]);
    const batch = await postBatch(ctx.app, m.token, m.profileId, {
      recipeId: recipe.id,
      cookedOn: '2026-03-10',
      storage: 'fridge',
      ingredients: [{ foodId: food.id, plannedGrams: 200, actualGrams: 200 }],
      cookedWeight: { grossGrams: 400, tareGrams: 200 },
      split: { mode: 'equal', count: 2 },
    });
    expect(batch.status).toBe(201);
    const perPortion = async () => (await request(ctx.app).get(`/api/recipes/${recipe.id}`).set(bearer(m.token))).body;

    // Hand calculation: 200 g × 60 g/100 g = 120 g available over makeRecipe's 4 portions = 30 g; after the edit 200 g × 45/100 = 90 g → 22.5 g.
    const before = await perPortion();
    expect(before.basis).toBe('available');
    expect(before.carbPerPortionGrams).toBeCloseTo(30, 9);
    expect((await put(m.token, food.id, { ...crackers, carbohydrate: 45 })).status).toBe(200);
    expect((await perPortion()).carbPerPortionGrams).toBeCloseTo(22.5, 9);

    const snapshot = await BatchIngredientModel.findOne({ where: { batchId: batch.body.id } });
    expect(snapshot?.per100g.carbAvailable).toBe(60);
    const page = await request(ctx.app).get(`/api/profiles/${m.profileId}/batches/${batch.body.id}`).set(bearer(m.token));
    expect(page.body.ingredients[0].per100g.carbAvailable).toBe(60);
  });
});

describe('DELETE /api/foods/:id (a pack food)', () => {
  it("is refused while the person's own recipes use it, naming them, and the food stays", async () => {
    const m = await member();
    const food = await create(m.token);
    await makeRecipe(m.userId, 'Overnight oats', [{ foodId: food.id, grams: 50 }]);
    await makeRecipe(m.userId, 'Cracker crumble', [{ foodId: food.id, grams: 200 }]);

    const res = await del(m.token, food.id);

    expect(res.status).toBe(409);
    expect(res.body.error.fieldErrors.recipes).toEqual(['Cracker crumble', 'Overnight oats']);
    expect(res.body.error.message).toContain('Cracker crumble, Overnight oats');
    expect(await FoodModel.findByPk(food.id)).not.toBeNull();
  });

  it('deletes the food once no recipe uses it, and only for its owner', async () => {
    const owner = await member('Owner');
    const other = await member('Other');
    const food = await create(owner.token);

    expect((await del(other.token, food.id)).status).toBe(404);
    expect(await FoodModel.findByPk(food.id)).not.toBeNull();
    expect((await del(owner.token, food.id)).status).toBe(204);
    expect(await FoodModel.findByPk(food.id)).toBeNull();
  });
});
