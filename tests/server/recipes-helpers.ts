import request from 'supertest';
import type { Express } from 'express';
import type { RecipeInput } from '../../shared/schemas/recipe';
import { bearer } from '../helpers/api';
import { createFood, SR_LEGACY, type FoodFixture } from '../helpers/foods';

/** Inserts a table food (or a member's pack food) and returns its id; the values passed in say where they come from. */
export async function insertFood(f: FoodFixture): Promise<number> {
  return (await createFood(f)).id;
}

/** Four foods with USDA SR Legacy values as in check-values §2.4 (overnight oats, example B). */
export async function insertOatsFoods() {
  return {
    oats: await insertFood(SR_LEGACY.oats),
    milk: await insertFood({ ...SR_LEGACY.wholeMilk, name: 'Milk, whole, 3.25%' }),
    yogurt: await insertFood(SR_LEGACY.greekYogurt),
    apple: await insertFood({ ...SR_LEGACY.apple, name: 'Apples, raw, with skin' }),
    raisins: await insertFood(SR_LEGACY.raisins),
  };
}

export function oatsRecipe(f: Awaited<ReturnType<typeof insertOatsFoods>>, over: Partial<RecipeInput> = {}): RecipeInput {
  return {
    title: 'Overnight oats',
    description: 'A week of breakfasts.',
    methodSteps: ['Mix everything in a bowl.', 'Divide into portions and chill overnight.'],
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
