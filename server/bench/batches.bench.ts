import request from 'supertest';
import { createFoods, withAvailable } from '../../tests/helpers/foods';
import type { BenchContext, BenchModule, HttpScenario } from './types';

// Invented per-100 g values for benchmark foods only (the numbers do not matter for speed).
const FOODS = [
  { name: 'Bench oats', carbTotal: 67.7, fibre: 10.1 },
  { name: 'Bench milk', carbTotal: 4.8, fibre: 0 },
  { name: 'Bench yogurt', carbTotal: 3.6, fibre: 0 },
  { name: 'Bench apple', carbTotal: 13.8, fibre: 2.4 },
  { name: 'Bench raisins', carbTotal: 79.2, fibre: 3.7 },
  { name: 'Bench seeds', carbTotal: 42.1, fibre: 34.4 },
];

/** Batch endpoints: saving a batch portioned out into 8 weighed portions, the batch page, the inventory, the label sheet (8 QR codes), a portion. */
export const scenarios: BenchModule['scenarios'] = async (ctx: BenchContext) => {
  const auth = { Authorization: `Bearer ${ctx.member.token}` };
  const foods = await createFoods(FOODS.map((f) => withAvailable(f)));
  const recipe = await request(ctx.baseUrl)
    .post('/api/recipes')
    .set(auth)
    .send({ title: 'Bench oats', defaultPortions: 8, ingredients: foods.map((f, i) => ({ foodId: f.id, grams: 100 + i * 40 })) });
  if (recipe.status !== 201) throw new Error(`bench recipe failed: ${JSON.stringify(recipe.body)}`);
  const body = {
    recipeId: recipe.body.id,
    cookedOn: '2026-03-10',
    storage: 'fridge',
    ingredients: foods.map((f, i) => ({ foodId: f.id, plannedGrams: 100 + i * 40, actualGrams: 102 + i * 40 })),
    cookedWeight: { grossGrams: 2400, tareGrams: 1300 },
    split: { mode: 'weighed', portions: Array.from({ length: 8 }, (_, i) => ({ grossGrams: 330 + i, tareGrams: 200 })) },
  };
  const base = `/api/profiles/${ctx.member.profileId}/batches`;
  let last: { id: number; portions: { code: string }[] } | null = null;
  for (let i = 0; i < 20; i += 1) {
    const res = await request(ctx.baseUrl).post(base).set(auth).send(body);
    if (res.status !== 201) throw new Error(`bench batch failed: ${JSON.stringify(res.body)}`);
    last = res.body;
  }
  const out: HttpScenario[] = [
    { kind: 'http', name: 'GET /api/recipes/:id (recipe nutrition, 6 ingredients)', path: `/api/recipes/${recipe.body.id}` },
    { kind: 'http', name: 'POST batches (portioned out into 8 portions)', method: 'POST', path: base, body },
    { kind: 'http', name: 'GET batches/:id (batch page, 8 portions)', path: `${base}/${last!.id}` },
    { kind: 'http', name: 'GET batches (inventory, 20+ batches)', path: `${base}?include=available` },
    { kind: 'http', name: 'GET batches/:id/labels (8 QR codes)', path: `${base}/${last!.id}/labels` },
    { kind: 'http', name: 'GET /api/portions/:code', path: `/api/portions/${last!.portions[0].code}` },
  ];
  return out;
};
