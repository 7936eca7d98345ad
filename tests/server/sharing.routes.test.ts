import request from 'supertest';
import { RecipeModel, RecipeShareModel } from '../../server/models';
import { bearer, signUpMember, signUpUser, useTestApp } from '../helpers/api';
import { createRecipeAs, insertOatsFoods, oatsRecipe } from './recipes-helpers';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';
import { makeRecipe, postBatch } from './batches-fixtures';

let foods: Awaited<ReturnType<typeof insertOatsFoods>>;
const ctx = useTestApp();
beforeAll(async () => {
  foods = await insertOatsFoods();
});

const member = (name = 'Member') => signUpMember(ctx.app, name);

type Who = 'owner' | 'sharedWith' | 'stranger';

async function household(visibility: 'private' | 'shared' | 'public', share: boolean) {
  const owner = await signUpUser(ctx.app, 'Owner');
  const sharedWith = await signUpUser(ctx.app, 'Guest');
  const stranger = await signUpUser(ctx.app, 'Outsider');
  const { id } = await createRecipeAs(ctx.app, owner.token, oatsRecipe(foods, { visibility }));
  if (share) await RecipeShareModel.create({ recipeId: id, userId: sharedWith.me.user.id, sharedByUserId: owner.me.user.id });
  return { id, people: { owner, sharedWith, stranger } };
}

const shelf = async (token: string, scope: string) =>
  (await request(ctx.app).get(`/api/recipes?scope=${scope}`).set(bearer(token))).body.items.map((r: { id: number }) => r.id);

describe('who sees a recipe', () => {
  it.each([
    { visibility: 'private' as const, share: false, sees: { owner: true, sharedWith: false, stranger: false } },
    { visibility: 'shared' as const, share: true, sees: { owner: true, sharedWith: true, stranger: false } },
    { visibility: 'shared' as const, share: false, sees: { owner: true, sharedWith: false, stranger: false } },
    { visibility: 'public' as const, share: false, sees: { owner: true, sharedWith: true, stranger: true } },
  ])('a $visibility recipe (shared row: $share) is seen by $sees', async ({ visibility, share, sees }) => {
    const { id, people } = await household(visibility, share);

    for (const who of Object.keys(sees) as Who[]) {
      const page = await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(people[who].token));
      const photo = await request(ctx.app).post(`/api/recipes/${id}/copy`).set(bearer(people[who].token));

      expect({ who, status: page.status }).toEqual({ who, status: sees[who] ? 200 : 404 });
      expect({ who, copy: photo.status }).toEqual({ who, copy: sees[who] ? 201 : 404 });
    }
  });

  it('keeps a private recipe off every shelf but the owner’s, including search', async () => {
    const { id, people } = await household('private', false);

    expect(await shelf(people.owner.token, 'mine')).toContain(id);
    expect(await shelf(people.stranger.token, 'public')).not.toContain(id);
    expect(await shelf(people.sharedWith.token, 'shared')).not.toContain(id);
    const searched = await request(ctx.app).get('/api/recipes?scope=public&q=oats').set(bearer(people.stranger.token));
    expect(searched.body.items.map((r: { id: number }) => r.id)).not.toContain(id);
  });
});

describe('POST /api/recipes/:id/shares', () => {
  it('shares by email: the person sees it under shared with me, the owner sees who has it', async () => {
    const { id, people } = await household('private', false);

    const res = await request(ctx.app)
      .post(`/api/recipes/${id}/shares`)
      .set(bearer(people.owner.token))
      .send({ email: people.sharedWith.email.toUpperCase() });

    expect(res.status).toBe(201);
    expect(res.body.items).toEqual([expect.objectContaining({ userId: people.sharedWith.me.user.id, email: people.sharedWith.email })]);
    expect(await shelf(people.sharedWith.token, 'shared')).toEqual([id]);
    expect((await RecipeModel.findByPk(id))!.visibility).toBe('shared');
    const page = await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(people.sharedWith.token));
    expect(page.body).toMatchObject({ isOwner: false, owner: { displayName: 'Owner' }, sharedWith: null });
    const ownerPage = await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(people.owner.token));
    expect(ownerPage.body.sharedWith).toHaveLength(1);
  });

  it.each([
    { name: 'an email with no account', email: () => 'nobody-here@example.test', message: /No Carbwright account/ },
    { name: 'a malformed email', email: () => 'not an email', message: /valid email/ },
  ])('returns 400 on email for $name and shares nothing', async ({ email, message }) => {
    const { id, people } = await household('private', false);

    const res = await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.owner.token)).send({ email: email() });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.email[0]).toMatch(message);
    expect(await RecipeShareModel.count({ where: { recipeId: id } })).toBe(0);
    expect((await RecipeModel.findByPk(id))!.visibility).toBe('private');
  });

  it('lets only the owner share: 404 for a stranger, 403 for someone it is shared with', async () => {
    const { id, people } = await household('shared', true);

    const asStranger = await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.stranger.token)).send({ email: people.stranger.email });
    const asGuest = await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.sharedWith.token)).send({ email: people.stranger.email });

    expect(asStranger.status).toBe(404);
    expect(asGuest.status).toBe(403);
    expect(await RecipeShareModel.count({ where: { recipeId: id } })).toBe(1);
  });
});

describe('revoking and copying', () => {
  it('revoking takes the recipe away while a copy made before stays with its maker', async () => {
    const { id, people } = await household('shared', true);
    const copy = await request(ctx.app).post(`/api/recipes/${id}/copy`).set(bearer(people.sharedWith.token));

    const revoke = await request(ctx.app).delete(`/api/recipes/${id}/shares/${people.sharedWith.me.user.id}`).set(bearer(people.owner.token));

    expect(revoke.status).toBe(204);
    expect((await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(people.sharedWith.token))).status).toBe(404);
    const mine = await request(ctx.app).get(`/api/recipes/${copy.body.id}`).set(bearer(people.sharedWith.token));
    expect(mine.status).toBe(200);
    expect(mine.body).toMatchObject({ isOwner: true, title: 'Overnight oats', copiedFromRecipeId: id, copiedFrom: null });
    expect(mine.body.nutrition.carbPerPortion.grams).toBeCloseTo(36.2, 2);
  });

  it('a copy is independent: editing the original does not change it', async () => {
    const { id, people } = await household('public', false);
    const copy = await request(ctx.app).post(`/api/recipes/${id}/copy`).set(bearer(people.stranger.token));

    await request(ctx.app).put(`/api/recipes/${id}`).set(bearer(people.owner.token)).send(oatsRecipe(foods, { visibility: 'public', ingredients: [{ foodId: foods.milk, grams: 100 }] }));

    const mine = await request(ctx.app).get(`/api/recipes/${copy.body.id}`).set(bearer(people.stranger.token));
    expect(mine.body.ingredients).toHaveLength(5);
    expect(mine.body.visibility).toBe('private');
    expect(await shelf(people.stranger.token, 'mine')).toEqual([copy.body.id]);
  });

  it('making a recipe private again withdraws every share', async () => {
    const { id, people } = await household('shared', true);

    await request(ctx.app).put(`/api/recipes/${id}`).set(bearer(people.owner.token)).send(oatsRecipe(foods, { visibility: 'private' }));

    expect(await RecipeShareModel.count({ where: { recipeId: id } })).toBe(0);
    expect((await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(people.sharedWith.token))).status).toBe(404);
  });
});

describe('POST /api/profiles/:profileId/batches (a recipe shared with me)', () => {
  it('lets the person a recipe was shared with cook it when it uses the owner’s pack food', async () => {
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

  it('still refuses another member’s private pack food that is not in the recipe', async () => {
    const owner = await member('Owner');
    const stranger = await member('Stranger');
    const hidden = await request(ctx.app)
      .post('/api/foods')
      .set(bearer(stranger.token))
      .send({ name: 'Secret crackers', basis: 'per100g', convention: 'eu', carbohydrate: 60, fibre: 10 });
    // USDA SR Legacy NDB 20045 cooked rice, 28.17 g total carbohydrate, 0.4 g fibre (check-values §11).
    const rice = await createFood(withAvailable(SR_LEGACY.rice));
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
