import { emptyNutrients } from '../../shared/compute/nutrients';
import { computeRecipe } from '../../shared/compute/recipe';
import { createFood } from '../../tests/helpers/foods';
import type { BenchContext, BenchModule } from './types';

async function post(ctx: BenchContext, path: string, body: unknown): Promise<{ id: number }> {
  const res = await fetch(`${ctx.baseUrl}${path}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', authorization: `Bearer ${ctx.member.token}` },
    body: JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`POST ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as { id: number };
}

/** Recipe nutrition over HTTP (one 20-ingredient recipe, a 60-recipe shelf with search) and the pure computation. */
export const scenarios: BenchModule['scenarios'] = async (ctx) => {
  const foodIds: number[] = [];
  for (let i = 0; i < 20; i++) {
    // Invented composition values for load only.
    const food = await createFood({ name: `Bench ingredient ${i}`, energyKcal: 100 + i, carbTotal: 5 + i * 3, fibre: i % 4, protein: 2, fat: 1, ownerUserId: ctx.member.userId });
    foodIds.push(food.id);
  }
  const recipe = (n: number, title: string) => ({
    title, defaultPortions: 6, tags: ['bench', n % 2 ? 'soup' : 'bake'],
    ingredients: foodIds.slice(0, n).map((foodId, i) => ({ foodId, grams: 50 + i * 10 })),
  });
  const big = await post(ctx, '/api/recipes', recipe(20, 'Bench stew with twenty ingredients'));
  for (let i = 0; i < 59; i++) await post(ctx, '/api/recipes', recipe(4 + (i % 10), `Bench recipe ${i}`));
  const lines = Array.from({ length: 20 }, (_, i) => ({ grams: 50 + i * 10, per100g: { ...emptyNutrients(), carbTotal: 5 + i * 3, fibre: i % 4 } }));
  return [
    { kind: 'http', name: 'GET recipe with breakdown (20 ingredients)', path: `/api/recipes/${big.id}` },
    { kind: 'http', name: 'GET recipe scaled to 10 portions', path: `/api/recipes/${big.id}?portions=10` },
    { kind: 'http', name: 'GET recipe shelf (60 recipes, carb sort)', path: '/api/recipes?scope=mine&sort=carbPerPortion' },
    { kind: 'http', name: 'GET recipe search by ingredient', path: '/api/recipes?scope=mine&q=ingredient%2015' },
    { kind: 'http', name: 'GET public recipes (4,000 of the volume)', path: '/api/recipes?scope=public' },
    { kind: 'http', name: 'POST /api/recipes (save a recipe, 8 ingredients)', method: 'POST', path: '/api/recipes', body: recipe(8, 'Bench saved recipe') },
    {
      kind: 'task',
      name: 'computeRecipe (pure, 20 ingredients, 100k calls)',
      run: async () => {
        const start = process.hrtime.bigint();
        for (let i = 0; i < 100_000; i++) computeRecipe(lines, { portions: 1 + (i % 12), basis: i % 2 ? 'total' : 'available', unit: 'g' });
        const ms = Number(process.hrtime.bigint() - start) / 1e6;
        return { figure: ((ms * 1000) / 100_000).toFixed(2), unit: 'µs per recipe' };
      },
    },
  ];
};
