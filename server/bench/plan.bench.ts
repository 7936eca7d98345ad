import request from 'supertest';
import { DEFAULT_EXERCISE_REDUCTIONS } from '../../shared/compute/exercise';
import { createFoods, withAvailable } from '../../tests/helpers/foods';
import type { BenchContext, BenchModule } from './types';

// Invented per-100 g values for benchmark foods only (the numbers do not matter for speed).
const FOODS = [
  { name: 'Plan bench oats', carbTotal: 67.7, fibre: 10.1 },
  { name: 'Plan bench milk', carbTotal: 4.8, fibre: 0 },
  { name: 'Plan bench lentils', carbTotal: 60.1, fibre: 10.7 },
  { name: 'Plan bench rice', carbTotal: 28.2, fibre: 0.4 },
];

/** The week endpoint on a full week: two kinds of day, 3 meals × 7 days from two batches, recipes, typed amounts and two planned cooks. */
export const scenarios: BenchModule['scenarios'] = async (ctx: BenchContext) => {
  const auth = { Authorization: `Bearer ${ctx.member.token}` };
  const profileId = ctx.member.profileId;
  const api = async (method: 'post' | 'put', path: string, body: object) => {
    const res = await request(ctx.baseUrl)[method](`/api/profiles/${profileId}${path}`).set(auth).send(body);
    if (res.status >= 300) throw new Error(`plan bench ${path}: ${JSON.stringify(res.body)}`);
    return res.body;
  };
  await api('put', '/settings', {
    glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', penIncrement: 0.5, rounding: 'down', maxDoseUnits: 15,
    actionTimeHours: 4, targetLow: 5, targetHigh: 8, correctionTarget: 6, hypoThreshold: 3.9, veryHigh: 15,
    allowNegativeCorrection: false, iobConvention: 'correction_only', exerciseReductions: DEFAULT_EXERCISE_REDUCTIONS,
  });
  const kinds: number[] = [];
  // Not default kinds, and every weekday given one, so other bench files' day kinds do not change these numbers.
  for (const [name, ratio] of [['Plan rest', 10], ['Plan training', 15]] as const) {
    kinds.push((await api('post', '/day-kinds', { name, isDefault: false, longActingUnits: 14, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '11:00', carbRatio: ratio, correctionFactor: 2 }, { from: '11:00', to: '24:00', carbRatio: ratio + 2, correctionFactor: 2 }] })).id);
  }
  const settings = await api('put', '/plan/settings', {
    weekStart: 1,
    pattern: [1, 2, 3, 4, 5, 6, 7].map((weekday) => ({ weekday, dayKindId: kinds[weekday % 2] })),
    mealNames: [{ name: 'Breakfast', time: '07:30' }, { name: 'Lunch', time: '12:30' }, { name: 'Dinner', time: '18:30' }],
  });
  const [breakfast, lunch, dinner] = settings.mealNames.map((m: { id: number }) => m.id);
  const foods = await createFoods(FOODS.map((f) => withAvailable(f)));
  const recipe = await request(ctx.baseUrl).post('/api/recipes').set(auth).send({ title: 'Plan bench dal', defaultPortions: 4, ingredients: foods.map((f, i) => ({ foodId: f.id, grams: 100 + i * 50 })) });
  const week = ['2026-03-09', '2026-03-10', '2026-03-11', '2026-03-12', '2026-03-13', '2026-03-14', '2026-03-15'];
  const batch = async () =>
    api('post', '/batches', {
      recipeId: recipe.body.id, cookedOn: '2026-03-08', storage: 'fridge', useBy: '2026-03-15',
      ingredients: foods.map((f, i) => ({ foodId: f.id, plannedGrams: 100 + i * 50, actualGrams: 100 + i * 50 })),
      cookedWeight: { grossGrams: 1900, tareGrams: 500 },
      split: { mode: 'equal', count: 7 },
    });
  const [b1, b2] = [await batch(), await batch()];
  await api('post', '/plan/meals', { date: week[0], mealNameId: breakfast, source: 'portion', portionId: b1.portions[0].id, repeatDays: 7 });
  await api('post', '/plan/meals', { date: week[0], mealNameId: lunch, source: 'portion', portionId: b2.portions[0].id, repeatDays: 7 });
  await api('post', '/plan/meals', { date: week[0], mealNameId: dinner, source: 'recipe', recipeId: recipe.body.id, portions: 1, repeatDays: 5 });
  await api('post', '/plan/meals', { date: week[5], mealNameId: dinner, source: 'carb', carbGrams: 60, repeatDays: 2 });
  for (const cookOn of [week[5], null]) await api('post', '/plan/cooks', { recipeId: recipe.body.id, cookOn, portions: 4 });
  return [{ kind: 'http', name: 'GET plan/week (21 meals, 2 batches, 2 planned cooks)', path: `/api/profiles/${profileId}/plan/week?date=2026-03-11` }];
};
