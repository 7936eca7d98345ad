import request from 'supertest';
import { FoodModel, RecipeModel, RecipeShareModel, RecipeShareOfferModel } from '../../server/models';
import { lastCapturedId, linkIn, waitForMail } from '../helpers/mail';
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

/** Offers the recipe to the person and has them accept the offer from their list. */
async function offerAndAccept(id: number, ownerToken: string, person: { token: string; email: string }) {
  const offered = await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(ownerToken)).send({ email: person.email });
  const offers = await request(ctx.app).get('/api/recipe-offers').set(bearer(person.token));
  const offer = offers.body.items.find((o: { recipeId: number }) => o.recipeId === id);
  const accepted = await request(ctx.app).post(`/api/recipe-offers/${offer.id}/accept`).set(bearer(person.token));
  return [offered.status, accepted.status];
}

describe('POST /api/recipes/:id/shares (an offer)', () => {
  it('offers by email: nothing on their shelf until they accept; then they see it and the owner sees who has it', async () => {
    const { id, people } = await household('private', false);
    const after = await lastCapturedId(ctx.sequelize);

    const res = await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.owner.token)).send({ email: people.sharedWith.email.toUpperCase() });
    const mail = await waitForMail(ctx.sequelize, people.sharedWith.email, { after });
    const shelfBefore = await shelf(people.sharedWith.token, 'shared');
    const pageBefore = await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(people.sharedWith.token));
    const ownerList = await request(ctx.app).get(`/api/recipes/${id}/shares`).set(bearer(people.owner.token));
    const offers = await request(ctx.app).get('/api/recipe-offers').set(bearer(people.sharedWith.token));
    const accept = await request(ctx.app).post(`/api/recipe-offers/${offers.body.items[0].id}/accept`).set(bearer(people.sharedWith.token));
    const acceptAgain = await request(ctx.app).post(`/api/recipe-offers/${offers.body.items[0].id}/accept`).set(bearer(people.sharedWith.token));

    expect(res.status).toBe(202);
    expect(mail.text).toContain('"Overnight oats"');
    expect(shelfBefore).toEqual([]);
    expect(pageBefore.status).toBe(404);
    expect(ownerList.body).toMatchObject({ items: [], offers: [{ email: people.sharedWith.email }] });
    expect(offers.body.items).toEqual([expect.objectContaining({ recipeId: id, recipeTitle: 'Overnight oats', senderName: 'Owner' })]);
    expect(accept.status).toBe(204);
    expect(acceptAgain.status).toBe(404);
    expect(await shelf(people.sharedWith.token, 'shared')).toEqual([id]);
    expect((await RecipeModel.findByPk(id))!.visibility).toBe('shared');
    const page = await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(people.sharedWith.token));
    expect(page.body).toMatchObject({ isOwner: false, owner: { displayName: 'Owner' }, sharedWith: null });
    const ownerPage = await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(people.owner.token));
    expect(ownerPage.body.sharedWith).toHaveLength(1);
  });

  it('a declined offer leaves nothing on their shelf and no offer open', async () => {
    const { id, people } = await household('private', false);
    await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.owner.token)).send({ email: people.sharedWith.email });
    const offers = await request(ctx.app).get('/api/recipe-offers').set(bearer(people.sharedWith.token));

    const decline = await request(ctx.app).post(`/api/recipe-offers/${offers.body.items[0].id}/decline`).set(bearer(people.sharedWith.token));
    const strangerTries = await request(ctx.app).post(`/api/recipe-offers/${offers.body.items[0].id}/accept`).set(bearer(people.stranger.token));

    expect(decline.status).toBe(204);
    expect(strangerTries.status).toBe(404);
    expect(await shelf(people.sharedWith.token, 'shared')).toEqual([]);
    expect((await request(ctx.app).get('/api/recipe-offers').set(bearer(people.sharedWith.token))).body.items).toEqual([]);
    expect(await RecipeShareModel.count({ where: { recipeId: id } })).toBe(0);
  });

  it('answers the same for an unknown address, which gets a mail asking them to join; the offer waits for their account', async () => {
    const { id, people } = await household('private', false);
    const unknown = `newcomer-${process.pid}@example.test`;
    const after = await lastCapturedId(ctx.sequelize);

    const known = await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.owner.token)).send({ email: people.stranger.email });
    const res = await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.owner.token)).send({ email: unknown });
    const mail = await waitForMail(ctx.sequelize, unknown, { after });
    const joined = await request(ctx.app).post('/api/auth/sign-up').send({ email: unknown, displayName: 'Newcomer', password: 'correct horse battery' });
    const offers = await request(ctx.app).get('/api/recipe-offers').set(bearer(joined.body.token));

    expect([known.status, known.body]).toEqual([res.status, res.body]);
    expect(linkIn(mail, '/sign-up').searchParams.get('email')).toBe(unknown);
    expect(offers.body.items.map((o: { recipeId: number }) => o.recipeId)).toEqual([id]);
  });

  it('is rate-limited per sender: the 21st offer in an hour answers 429 and sends nothing', async () => {
    const { id, people } = await household('private', false);
    const statuses: number[] = [];
    for (let i = 0; i < 21; i++) {
      statuses.push((await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.owner.token)).send({ email: `probe${i}@example.test` })).status);
    }
    const otherSender = await signUpUser(ctx.app, 'Other');
    const { id: otherId } = await createRecipeAs(ctx.app, otherSender.token, oatsRecipe(foods, { visibility: 'private' }));
    const other = await request(ctx.app).post(`/api/recipes/${otherId}/shares`).set(bearer(otherSender.token)).send({ email: 'probe0@example.test' });

    // 20 an hour is the product's own limit (SHARE_OFFERS_PER_HOUR), chosen as common practice for invitation forms.
    expect(statuses.slice(0, 20).every((s) => s === 202)).toBe(true);
    expect(statuses[20]).toBe(429);
    expect(other.status).toBe(202);
    expect(await RecipeShareOfferModel.count({ where: { email: 'probe20@example.test' } })).toBe(0);
  });

  it('returns 400 on email for a malformed address and offers nothing', async () => {
    const { id, people } = await household('private', false);

    const res = await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.owner.token)).send({ email: 'not an email' });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.email[0]).toMatch(/valid email/);
    expect(await RecipeShareOfferModel.count({ where: { recipeId: id } })).toBe(0);
    expect((await RecipeModel.findByPk(id))!.visibility).toBe('private');
  });

  it('lets only the owner offer: 404 for a stranger, 403 for someone it is shared with', async () => {
    const { id, people } = await household('shared', true);

    const asStranger = await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.stranger.token)).send({ email: people.stranger.email });
    const asGuest = await request(ctx.app).post(`/api/recipes/${id}/shares`).set(bearer(people.sharedWith.token)).send({ email: people.stranger.email });

    expect(asStranger.status).toBe(404);
    expect(asGuest.status).toBe(403);
    expect(await RecipeShareOfferModel.count({ where: { recipeId: id } })).toBe(0);
  });
});

describe('a pack food in a shared recipe', () => {
  it('is copied into the copy (values and photo), so its owner can delete theirs after someone copied the recipe', async () => {
    const owner = await signUpUser(ctx.app, 'Owner');
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
    await offerAndAccept(recipe.body.id, owner.token, friend);
    const copy = await request(ctx.app).post(`/api/recipes/${recipe.body.id}/copy`).set(bearer(friend.token));
    await request(ctx.app).delete(`/api/recipes/${recipe.body.id}`).set(bearer(owner.token));

    const deleted = await request(ctx.app).delete(`/api/foods/${crackers.body.food.id}`).set(bearer(owner.token));
    const mine = await request(ctx.app).get(`/api/recipes/${copy.body.id}`).set(bearer(friend.token));
    const copiedFood = await FoodModel.findByPk(mine.body.ingredients[0].foodId);

    expect(copy.status).toBe(201);
    expect(deleted.status).toBe(204);
    expect(copiedFood).toMatchObject({ source: 'pack', ownerUserId: friend.me.user.id, name: 'Oat crackers', carbAvailable: 60, fibre: 10 });
    // 100 g at 60 g available per 100 g in 2 portions: 30 g a portion.
    expect(mine.body.nutrition.carbPerPortion.grams).toBeCloseTo(30, 6);
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
    const share = await offerAndAccept(recipe.body.id, owner.token, { token: friend.token, email: friend.email });

    const cooked = await postBatch(ctx.app, friend.token, friend.me.profiles[0].id, {
      recipeId: recipe.body.id,
      cookedOn: '2026-03-10',
      storage: 'fridge',
      ingredients: [{ foodId: crackers.body.food.id, plannedGrams: 100, actualGrams: 100 }],
      cookedWeight: { grossGrams: 100, tareGrams: 0 },
      split: { mode: 'equal', count: 2 },
    });

    expect([crackers.status, recipe.status, ...share]).toEqual([201, 201, 202, 204]);
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
