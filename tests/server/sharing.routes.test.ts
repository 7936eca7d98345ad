import request from 'supertest';
import { RecipeModel, RecipeShareModel } from '../../server/models';
import { bearer, signUpUser, startTestApp, type TestContext } from '../helpers/api';
import { createRecipeAs, insertOatsFoods, oatsRecipe } from './recipes-helpers';

let ctx: TestContext;
let foods: Awaited<ReturnType<typeof insertOatsFoods>>;
beforeAll(async () => {
  ctx = await startTestApp();
  foods = await insertOatsFoods();
});
afterAll(async () => {
  await ctx.sequelize.close();
});

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
    expect(mine.body).toMatchObject({ isOwner: true, title: 'Overnight oats jars', copiedFromRecipeId: id, copiedFrom: null });
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
