import request from 'supertest';
import type { Express } from 'express';
import { FoodModel, RecipeIngredientModel, RecipeModel } from '../../server/models';
import type { CreateBatchInput } from '../../shared/schemas/batch';
import { bearer } from '../helpers/api';

type Per100 = { carbTotal: number; fibre: number; carbAvailable?: number };

let counter = 0;
/** A table food with the given carbohydrate and fibre per 100 g (available derived as total − fibre). */
export async function makeFood(name: string, per100: Per100) {
  counter += 1;
  return FoodModel.create({
    source: 'usda_sr28',
    sourceCode: `T${process.pid}-${counter}`,
    name,
    foodGroup: null,
    energyKcal: null,
    energyKj: null,
    carbAvailable: per100.carbAvailable ?? per100.carbTotal - per100.fibre,
    carbTotal: per100.carbTotal,
    fibre: per100.fibre,
    sugars: null,
    protein: null,
    fat: null,
    water: null,
    carbMeasured: 'total',
    attribution: 'USDA ARS, FoodData Central SR Legacy (test fixture)',
    licence: 'Public domain (CC0)',
  });
}

/** A recipe owned by `ownerUserId` with the given (food, grams) lines, saved directly. */
export async function makeRecipe(ownerUserId: number, title: string, lines: { foodId: number; grams: number }[], visibility: 'private' | 'public' = 'private') {
  const recipe = await RecipeModel.create({ ownerUserId, title, defaultPortions: 4, visibility });
  await RecipeIngredientModel.bulkCreate(lines.map((l, i) => ({ recipeId: recipe.id, position: i + 1, foodId: l.foodId, grams: l.grams, measureLabel: null, note: null })));
  return recipe;
}

// Per 100 g, USDA SR Legacy via check-values §11 ([C2]) and §2.4 ([D]).
export const SR = {
  oats: { carbTotal: 67.7, fibre: 10.1 }, // NDB 08120
  wholeMilk: { carbTotal: 4.8, fibre: 0 }, // NDB 01077
  greekYogurt: { carbTotal: 3.6, fibre: 0 }, // NDB 01256
  apple: { carbTotal: 13.81, fibre: 2.4 }, // NDB 09003, from §2.4 (20.715 g carb, 3.60 g fibre in 150 g)
  water: { carbTotal: 0, fibre: 0 },
};

/** The week of overnight oats: four foods, a recipe and the weighed batch input with five jars. */
export async function overnightOats(ownerUserId: number) {
  const [oats, milk, yogurt, apple] = await Promise.all([
    makeFood('Oats, rolled, dry', SR.oats),
    makeFood('Milk, whole', SR.wholeMilk),
    makeFood('Yogurt, Greek, plain, nonfat', SR.greekYogurt),
    makeFood('Apple, raw, with skin', SR.apple),
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
