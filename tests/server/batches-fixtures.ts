import request from 'supertest';
import type { Express } from 'express';
import { RecipeIngredientModel, RecipeModel } from '../../server/models';
import type { CreateBatchInput } from '../../shared/schemas/batch';
import { bearer } from '../helpers/api';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';

/** A recipe owned by `ownerUserId` with the given (food, grams) lines, saved directly. */
export async function makeRecipe(ownerUserId: number, title: string, lines: { foodId: number; grams: number }[], visibility: 'private' | 'public' = 'private') {
  const recipe = await RecipeModel.create({ ownerUserId, title, defaultPortions: 4, visibility });
  await RecipeIngredientModel.bulkCreate(lines.map((l, i) => ({ recipeId: recipe.id, position: i + 1, foodId: l.foodId, grams: l.grams, measureLabel: null, note: null })));
  return recipe;
}

/** The week of overnight oats: four foods, a recipe and the weighed batch input with five portions. */
export async function overnightOats(ownerUserId: number) {
  const [oats, milk, yogurt, apple] = await Promise.all([
    createFood(withAvailable({ ...SR_LEGACY.oats, name: 'Oats, rolled, dry' })),
    createFood(withAvailable({ ...SR_LEGACY.wholeMilk, name: 'Milk, whole' })),
    createFood(withAvailable({ ...SR_LEGACY.greekYogurt, name: 'Yogurt, Greek, plain, nonfat' })),
    createFood(withAvailable({ ...SR_LEGACY.apple, name: 'Apple, raw, with skin' })),
  ]);
  const recipe = await makeRecipe(ownerUserId, 'Overnight oats', [
    { foodId: oats.id, grams: 250 },
    { foodId: milk.id, grams: 500 },
    { foodId: yogurt.id, grams: 250 },
    { foodId: apple.id, grams: 150 },
  ]);
  const input: CreateBatchInput = {
    recipeId: recipe.id,
    cookedOn: '2026-03-10',
    storage: 'fridge',
    region: 'uk',
    ingredients: [
      { foodId: oats.id, plannedGrams: 250, actualGrams: 252 },
      { foodId: milk.id, plannedGrams: 500, actualGrams: 496 },
      { foodId: yogurt.id, plannedGrams: 250, actualGrams: 247 },
      { foodId: apple.id, plannedGrams: 150, actualGrams: 163 },
    ],
    cookedWeight: { grossGrams: 1612, tareGrams: 480 },
    split: {
      mode: 'weighed',
      portions: [
        { grossGrams: 438, tareGrams: 212 },
        { grossGrams: 441, tareGrams: 215 },
        { grossGrams: 436, tareGrams: 209 },
        { grossGrams: 440, tareGrams: 213 },
        { grossGrams: 437, tareGrams: 211 },
      ],
    },
  };
  return { foods: { oats, milk, yogurt, apple }, recipe, input };
}

/** POSTs a batch for a profile. */
export function postBatch(app: Express, token: string, profileId: number, body: unknown) {
  return request(app).post(`/api/profiles/${profileId}/batches`).set(bearer(token)).send(body as object);
}
