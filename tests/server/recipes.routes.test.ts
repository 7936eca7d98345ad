import request from 'supertest';
import { ProfileModel, RecipeIngredientModel, RecipeModel } from '../../server/models';
import { bearer, signUpUser, useTestApp } from '../helpers/api';
import { createRecipeAs, insertFood, insertOatsFoods, oatsRecipe } from './recipes-helpers';

let foods: Awaited<ReturnType<typeof insertOatsFoods>>;
const ctx = useTestApp();
beforeAll(async () => {
  foods = await insertOatsFoods();
});

describe('POST /api/recipes', () => {
  it('saves the recipe in order and answers with the full breakdown in the profile basis', async () => {
    const cook = await signUpUser(ctx.app, 'Cook');

    const res = await request(ctx.app).post('/api/recipes').set(bearer(cook.token)).send(oatsRecipe(foods));

    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ title: 'Overnight oats', tags: ['breakfast', 'no-cook'], isOwner: true, basis: 'available', unit: 'g' });
    expect(res.body.ingredients.map((i: { grams: number }) => i.grams)).toEqual([240, 480, 240, 150, 40]);
    expect(res.body.ingredients[1]).toMatchObject({ measureLabel: '2 cups', food: { name: 'Milk, whole, 3.25%' } });
    // check-values §2.4: available 217.227 g in 1150 g → 36.20 g per portion, 18.889 g per 100 g.
    expect(res.body.nutrition.carbTotal.grams).toBeCloseTo(217.227, 6);
    expect(res.body.nutrition.carbPerPortion.grams).toBeCloseTo(36.2, 2);
    expect(res.body.nutrition.carbPer100gRaw.grams).toBeCloseTo(18.889, 3);
    expect(res.body.nutrition.ingredients[0].carb.grams).toBeCloseTo(138.24, 6);
    const rows = await RecipeIngredientModel.findAll({ where: { recipeId: res.body.id }, order: [['position', 'ASC']] });
    expect(rows.map((r) => r.foodId)).toEqual([foods.oats, foods.milk, foods.yogurt, foods.apple, foods.raisins]);
  });

  it('answers exactly what the recipe page then shows', async () => {
    const cook = await signUpUser(ctx.app, 'Cook');
    const body = { ...oatsRecipe(foods), description: 'Soak overnight.', methodSteps: ['Mix.', 'Chill.'], visibility: 'public' };

    const saved = await request(ctx.app).post('/api/recipes').set(bearer(cook.token)).send(body);
    const page = await request(ctx.app).get(`/api/recipes/${saved.body.id}`).set(bearer(cook.token));

    expect(saved.status).toBe(201);
    // Same keys in the same order and the same values as the page reads them back.
    expect(JSON.stringify(saved.body)).toBe(JSON.stringify(page.body));
    expect(saved.body).toMatchObject({ owner: { id: cook.me.user.id, displayName: 'Cook' }, sharedWith: [], copiedFrom: null, lastCookedAt: null, methodSteps: ['Mix.', 'Chill.'] });
  });

  it.each([
    { name: '0 grams', patch: (b: ReturnType<typeof oatsRecipe>) => { b.ingredients[0].grams = 0; }, field: 'ingredients.0.grams' },
    { name: 'negative grams', patch: (b: ReturnType<typeof oatsRecipe>) => { b.ingredients[2].grams = -10; }, field: 'ingredients.2.grams' },
    { name: 'no ingredients', patch: (b: ReturnType<typeof oatsRecipe>) => { b.ingredients = []; }, field: 'ingredients' },
    { name: 'an empty title', patch: (b: ReturnType<typeof oatsRecipe>) => { b.title = '  '; }, field: 'title' },
    { name: '0 portions', patch: (b: ReturnType<typeof oatsRecipe>) => { b.defaultPortions = 0; }, field: 'defaultPortions' },
    { name: 'an unknown food', patch: (b: ReturnType<typeof oatsRecipe>) => { b.ingredients[3].foodId = 999_999; }, field: 'ingredients.3.foodId' },
  ])('returns 400 naming $field for $name and saves nothing', async ({ patch, field }) => {
    const cook = await signUpUser(ctx.app, 'Careless');
    const body = oatsRecipe(foods);
    patch(body);

    const res = await request(ctx.app).post('/api/recipes').set(bearer(cook.token)).send(body);

    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fieldErrors)).toContain(field);
    expect(await RecipeModel.count({ where: { ownerUserId: cook.me.user.id } })).toBe(0);
  });

  it('refuses another member’s pack food as an unknown food', async () => {
    const other = await signUpUser(ctx.app, 'LabelOwner');
    const cook = await signUpUser(ctx.app, 'Borrower');
    const label = await insertFood({ name: 'Their granola (label)', carbTotal: 60, fibre: 8, ownerUserId: other.me.user.id });

    const res = await request(ctx.app)
      .post('/api/recipes')
      .set(bearer(cook.token))
      .send(oatsRecipe(foods, { ingredients: [{ foodId: label, grams: 50 }] }));

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['ingredients.0.foodId']).toBeDefined();
  });

  it('returns 401 without a token', async () => {
    expect((await request(ctx.app).post('/api/recipes').send(oatsRecipe(foods))).status).toBe(401);
  });
});

describe('GET /api/recipes/:id', () => {
  it('answers in total carbohydrate and 15 g exchanges when the profile counts that way', async () => {
    const cook = await signUpUser(ctx.app, 'Exchanger');
    await ProfileModel.update({ carbBasis: 'total', carbUnit: 'exchange15' }, { where: { ownerUserId: cook.me.user.id } });
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(cook.token));

    expect(res.body).toMatchObject({ basis: 'total', unit: 'exchange15' });
    // 246.547 g total / 6 = 41.091 g per portion = 2.739 exchanges of 15 g (check-values §2.4, §6).
    expect(res.body.nutrition.carbPerPortion.grams).toBeCloseTo(41.091, 3);
    expect(res.body.nutrition.carbPerPortion.inUnit).toBeCloseTo(2.7394, 4);
  });

  it('answers in the basis of a profile the user may open, and 404 for one they may not', async () => {
    const cook = await signUpUser(ctx.app, 'TwoProfiles');
    const stranger = await signUpUser(ctx.app, 'NotMine');
    const strangerProfile = stranger.me.profiles[0].id;
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const own = await request(ctx.app).get(`/api/recipes/${id}?profileId=${cook.me.profiles[0].id}`).set(bearer(cook.token));
    const other = await request(ctx.app).get(`/api/recipes/${id}?profileId=${strangerProfile}`).set(bearer(cook.token));

    expect(own.status).toBe(200);
    expect(other.status).toBe(404);
  });

  it.each([
    // Scaling keeps per-portion carbohydrate when the portions scale with it: 217.227 / 6 = 36.20 g.
    { name: 'doubles the grams for factor 2 and keeps the portions', query: 'factor=2', grams: 480, portions: 6, perPortion: 72.409 },
    { name: 'scales to 3 portions with half the grams', query: 'portions=3', grams: 120, portions: 3, perPortion: 36.2045 },
  ])('$name', async ({ query, grams, portions, perPortion }) => {
    const cook = await signUpUser(ctx.app, 'Scaler');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await request(ctx.app).get(`/api/recipes/${id}?${query}`).set(bearer(cook.token));

    expect(res.status).toBe(200);
    expect(res.body.ingredients[0].grams).toBeCloseTo(grams, 9);
    expect(res.body.nutrition.portions).toBe(portions);
    expect(res.body.nutrition.carbPerPortion.grams).toBeCloseTo(perPortion, 3);
    expect((await RecipeIngredientModel.findOne({ where: { recipeId: id, position: 0 } }))!.grams).toBe(240);
  });

  it('returns 400 for a zero scale factor', async () => {
    const cook = await signUpUser(ctx.app, 'ZeroScale');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await request(ctx.app).get(`/api/recipes/${id}?factor=0`).set(bearer(cook.token));

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.factor).toBeDefined();
  });
});

describe('PUT /api/recipes/:id', () => {
  it('replaces fields and ingredients for the owner', async () => {
    const cook = await signUpUser(ctx.app, 'Editor');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await request(ctx.app)
      .put(`/api/recipes/${id}`)
      .set(bearer(cook.token))
      .send(oatsRecipe(foods, { title: 'Oats, less fruit', defaultPortions: 5, ingredients: [{ foodId: foods.oats, grams: 250 }, { foodId: foods.milk, grams: 500 }] }));

    expect(res.status).toBe(200);
    expect(res.body.title).toBe('Oats, less fruit');
    expect(res.body.ingredients).toHaveLength(2);
    // By hand: 250 × 57.6 / 100 + 500 × 4.8 / 100 = 144 + 24 = 168 g available; / 5 = 33.6 g.
    expect(res.body.nutrition.carbPerPortion.grams).toBeCloseTo(33.6, 9);
  });

  it('keeps the old recipe whole when the new ingredients are bad', async () => {
    const cook = await signUpUser(ctx.app, 'HalfSaver');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await request(ctx.app)
      .put(`/api/recipes/${id}`)
      .set(bearer(cook.token))
      .send(oatsRecipe(foods, { title: 'Broken', ingredients: [{ foodId: foods.oats, grams: 100 }, { foodId: 424242, grams: 10 }] }));

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['ingredients.1.foodId']).toBeDefined();
    expect((await RecipeModel.findByPk(id))!.title).toBe('Overnight oats');
    expect(await RecipeIngredientModel.count({ where: { recipeId: id } })).toBe(5);
  });

  it('returns 404 to a stranger and 403 to someone it is shared with', async () => {
    const cook = await signUpUser(ctx.app, 'Keeper');
    const friend = await signUpUser(ctx.app, 'Friend');
    const stranger = await signUpUser(ctx.app, 'Stranger');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));
    // Shares are offers: the friend accepts it first, then can see the recipe but not change it.
    await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(cook.token)).send({ email: friend.email }).expect(202);
    const offers = await request(ctx.app).get('/api/recipe-offers').set(bearer(friend.token));
    const offer = offers.body.items.find((o: { recipeId: number }) => o.recipeId === id);
    await request(ctx.app).post(`/api/recipe-offers/${offer.id}/accept`).set(bearer(friend.token)).expect(204);

    const asStranger = await request(ctx.app).put(`/api/recipes/${id}`).set(bearer(stranger.token)).send(oatsRecipe(foods, { title: 'Mine now' }));
    const asFriend = await request(ctx.app).put(`/api/recipes/${id}`).set(bearer(friend.token)).send(oatsRecipe(foods, { title: 'Mine now' }));

    expect(asStranger.status).toBe(404);
    expect(asFriend.status).toBe(403);
    expect((await RecipeModel.findByPk(id))!.title).toBe('Overnight oats');
  });
});

describe('DELETE /api/recipes/:id and POST /api/recipes/:id/copy', () => {
  it('duplicates a recipe for its owner as an independent copy that remembers its source', async () => {
    const cook = await signUpUser(ctx.app, 'Duplicator');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const copy = await request(ctx.app).post(`/api/recipes/${id}/copy`).set(bearer(cook.token));
    await request(ctx.app).put(`/api/recipes/${copy.body.id}`).set(bearer(cook.token)).send(oatsRecipe(foods, { title: 'Changed copy', ingredients: [{ foodId: foods.milk, grams: 100 }] }));

    expect(copy.status).toBe(201);
    expect(copy.body).toMatchObject({ title: 'Overnight oats (copy)', copiedFromRecipeId: id, copiedFrom: { id }, visibility: 'private' });
    expect(await RecipeIngredientModel.count({ where: { recipeId: id } })).toBe(5);
  });

  it('deletes a recipe for its owner only', async () => {
    const cook = await signUpUser(ctx.app, 'Deleter');
    const other = await signUpUser(ctx.app, 'NotDeleter');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods, { visibility: 'public' }));

    const asOther = await request(ctx.app).delete(`/api/recipes/${id}`).set(bearer(other.token));
    const asOwner = await request(ctx.app).delete(`/api/recipes/${id}`).set(bearer(cook.token));

    expect(asOther.status).toBe(403);
    expect(asOwner.status).toBe(204);
    expect(await RecipeModel.findByPk(id)).toBeNull();
    expect(await RecipeIngredientModel.count({ where: { recipeId: id } })).toBe(0);
  });
});

describe('GET /api/recipes', () => {
  it('searches my shelf by title, tag and ingredient name and sorts by carbohydrate per portion', async () => {
    const cook = await signUpUser(ctx.app, 'Librarian');
    const lentils = await insertFood({ name: 'Lentils, red, dry', carbTotal: 60, fibre: 11 });
    await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));
    await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods, { title: 'Red lentil soup', tags: ['soup'], defaultPortions: 4, ingredients: [{ foodId: lentils, grams: 200 }] }));
    await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods, { title: 'Milk pudding', tags: ['dessert'], defaultPortions: 2, ingredients: [{ foodId: foods.milk, grams: 500 }] }));
    const list = (q: string) => request(ctx.app).get(`/api/recipes?${q}`).set(bearer(cook.token));

    const byTitle = await list('q=lentil');
    const byTag = await list('q=DESSERT');
    const byIngredient = await list('q=raisins');
    const sorted = await list('sort=carbPerPortion');

    expect(byTitle.body.items.map((r: { title: string }) => r.title)).toEqual(['Red lentil soup']);
    expect(byTag.body.items.map((r: { title: string }) => r.title)).toEqual(['Milk pudding']);
    expect(byIngredient.body.items.map((r: { title: string }) => r.title)).toEqual(['Overnight oats']);
    // Available per portion by hand: pudding 24 / 2 = 12 g; lentils 200 × 49 / 100 / 4 = 24.5 g; oats 36.2 g.
    expect(sorted.body.items.map((r: { carbPerPortionGrams: number }) => Math.round(r.carbPerPortionGrams * 10) / 10)).toEqual([12, 24.5, 36.2]);
  });

  it('treats search text as text, not as a pattern', async () => {
    const cook = await signUpUser(ctx.app, 'Percent');
    await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await request(ctx.app).get('/api/recipes?q=_').set(bearer(cook.token));

    expect(res.status).toBe(200);
    expect(res.body.items).toEqual([]);
  });

  it('sorts by when the user last cooked each recipe, never-cooked last', async () => {
    const cook = await signUpUser(ctx.app, 'Batcher');
    const profileId = cook.me.profiles[0].id;
    const a = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods, { title: 'Cooked long ago' }));
    const b = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods, { title: 'Never cooked' }));
    const c = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods, { title: 'Cooked yesterday' }));
    const batch = (recipeId: number, at: string) =>
      ctx.sequelize.query(
        `INSERT INTO batches (profile_id, recipe_id, recipe_title, cooked_by_user_id, cooked_on, storage, use_by, use_by_source,
           raw_grams, cooked_gross_grams, pot_tare_grams, cooked_grams, split_mode, totals, per100g, created_at, updated_at)
         VALUES (:profileId, :recipeId, 'x', :userId, :at, 'fridge', :at, 'test', 1000, 1500, 500, 1000, 'equal', '{}', '{}', :at, :at)`,
        { replacements: { profileId, recipeId, userId: cook.me.user.id, at } },
      );
    await batch(a.id, '2026-01-05T12:00:00Z');
    await batch(c.id, '2026-11-30T12:00:00Z');

    const res = await request(ctx.app).get('/api/recipes?sort=cooked').set(bearer(cook.token));

    expect(res.body.items.map((r: { id: number }) => r.id)).toEqual([c.id, a.id, b.id]);
    expect(res.body.items[0].lastCookedAt).toBe('2026-11-30T12:00:00.000Z');
  });
});
