import request from 'supertest';
import type { Express } from 'express';
import { FoodModel } from '../../server/models';
import type { RecipeInput } from '../../shared/schemas/recipe';
import { bearer } from '../helpers/api';

type FoodValues = { name: string; carbTotal: number | null; fibre: number | null; carbAvailable?: number | null; ownerUserId?: number | null };

let code = 0;
/** Inserts a table food directly (the values passed in say where they come from). */
export async function insertFood(v: FoodValues): Promise<number> {
  code += 1;
  const row = await FoodModel.create({
    source: v.ownerUserId ? 'label' : 'usda_sr28',
    sourceCode: `test-${process.pid}-${code}`,
    name: v.name,
    foodGroup: null,
    energyKcal: null,
    energyKj: null,
    carbAvailable: v.carbAvailable ?? null,
    carbTotal: v.carbTotal,
    fibre: v.fibre,
    sugars: null,
    protein: null,
    fat: null,
    water: null,
    carbMeasured: 'total',
    attribution: 'test data',
    licence: 'test data',
    ownerUserId: v.ownerUserId ?? null,
  });
  return row.id;
}

/** Four foods with USDA SR Legacy values as in check-values §2.4 (overnight oats, example B). */
export async function insertOatsFoods() {
  return {
    oats: await insertFood({ name: 'Oats, rolled, dry', carbTotal: 67.7, fibre: 10.1 }),
    milk: await insertFood({ name: 'Milk, whole, 3.25%', carbTotal: 4.8, fibre: 0 }),
    yogurt: await insertFood({ name: 'Yogurt, Greek, plain, nonfat', carbTotal: 3.6, fibre: 0 }),
    apple: await insertFood({ name: 'Apples, raw, with skin', carbTotal: 13.81, fibre: 2.4 }),
    raisins: await insertFood({ name: 'Raisins, seedless', carbTotal: 79.18, fibre: 3.7 }),
  };
}

export function oatsRecipe(f: Awaited<ReturnType<typeof insertOatsFoods>>, over: Partial<RecipeInput> = {}): RecipeInput {
  return {
    title: 'Overnight oats jars',
    description: 'A week of breakfasts.',
    methodSteps: ['Mix everything in a bowl.', 'Divide into jars and chill overnight.'],
    tags: ['Breakfast', 'no-cook'],
    defaultPortions: 6,
    visibility: 'private',
    ingredients: [
      { foodId: f.oats, grams: 240 },
      { foodId: f.milk, grams: 480, measureLabel: '2 cups' },
      { foodId: f.yogurt, grams: 240 },
      { foodId: f.apple, grams: 150, note: 'grated' },
      { foodId: f.raisins, grams: 40 },
    ],
    ...over,
  };
}

export async function createRecipeAs(app: Express, token: string, input: RecipeInput) {
  const res = await request(app).post('/api/recipes').set(bearer(token)).send(input);
  if (res.status !== 201) throw new Error(`create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { id: number };
}
