import request from 'supertest';
import { FoodMeasureModel, LogEntryModel, ProfileAccessModel } from '../../server/models';
import { bearer, signUpMember, useTestApp } from '../helpers/api';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';
import { countQueries } from '../helpers/query-count';
import { makeRecipe, overnightOats, postBatch } from './batches-fixtures';

const ctx = useTestApp();

// Ratios as check-values T15 (user-set): rest 10 g/unit, training 15 g/unit; invented long-acting doses 14 and 12 units.
const kind = (name: string, carbRatio: number, isDefault: boolean, longActingUnits: number) => ({
  name, isDefault, longActingUnits, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio, correctionFactor: 2 }],
});

async function setUp(opts: { dayKinds?: boolean } = {}) {
  const m = await signUpMember(ctx.app, 'Planner');
  const api = (method: 'get' | 'post' | 'put' | 'delete' | 'patch', path: string, token = m.token) => request(ctx.app)[method](`/api/profiles/${m.profileId}${path}`).set(bearer(token));
  await api('put', '/settings').send(TEST_DOSE_SETTINGS).expect(200);
  let restId = 0;
  let trainingId = 0;
  if (opts.dayKinds !== false) {
    restId = (await api('post', '/day-kinds').send(kind('Rest', 10, true, 14)).expect(201)).body.id;
    trainingId = (await api('post', '/day-kinds').send(kind('Training', 15, false, 12)).expect(201)).body.id;
  }
  const pattern = [1, 2, 3, 4, 5, 6, 7].map((weekday) => ({ weekday, dayKindId: weekday === 2 || weekday === 4 ? trainingId || null : null }));
  const settings = await api('put', '/plan/settings').send({ weekStart: 1, pattern, mealNames: [{ name: 'Breakfast', time: '07:30' }, { name: 'Lunch', time: '12:30' }] }).expect(200);
  const [breakfast, lunch] = settings.body.mealNames as { id: number }[];
  return { ...m, api, restId, trainingId, breakfastId: breakfast.id, lunchId: lunch.id };
}

const WEEK = ['2026-03-09', '2026-03-10', '2026-03-11', '2026-03-12', '2026-03-13', '2026-03-14', '2026-03-15'];

describe('the week plan', () => {
  it('five breakfasts from one overnight-oats batch on two kinds of day: carbohydrate per jar, dose = carbohydrate ÷ that day’s ratio', async () => {
    const p = await setUp();
    const oats = await overnightOats(p.userId);
    const batch = await postBatch(ctx.app, p.token, p.profileId, { ...oats.input, cookedOn: '2026-03-08', useBy: '2026-03-14' }).expect(201);
    await p.api('put', '/days/2026-03-13').send({ dayKindId: p.trainingId }).expect(200);
    const portions = batch.body.portions as { id: number; carb: { grams: number } }[];
    // One request places the batch's first jar on Monday and its next four on the days after.
    const placed = await p.api('post', '/plan/meals').send({ date: WEEK[0], mealNameId: p.breakfastId, source: 'portion', portionId: portions[0].id, repeatDays: 5 }).expect(201);
    expect(placed.body.ids).toHaveLength(5);
    const sixth = await p.api('post', '/plan/meals').send({ date: WEEK[5], mealNameId: p.breakfastId, source: 'portion', portionId: portions[4].id, repeatDays: 2 });
    expect(sixth.body.error.fieldErrors.repeatDays).toEqual(['The batch has only 1 portions after this one that are not planned yet.']);

    const week = (await p.api('get', '/plan/week?date=2026-03-11').expect(200)).body;

    expect(week.weekStart).toBe('2026-03-09');
    // Weekly pattern: Tuesday and Thursday training; Friday set to training for the date; the rest the default.
    expect(week.days.map((d: { dayKind: { name: string; from: string } }) => `${d.dayKind.name}/${d.dayKind.from}`)).toEqual([
      'Rest/default', 'Training/pattern', 'Rest/default', 'Training/pattern', 'Training/date', 'Rest/default', 'Rest/default',
    ]);
    // Worked by hand from the fixture's weighed lines (SR Legacy available carbohydrate, check-values §11): 252 g oats × 0.576
    // + 496 g milk × 0.048 + 247 g yogurt × 0.036 + 163 g apple × 0.1141 = 196.4503 g in 1132 g cooked; jars of 226 g
    // hold 39.2206 g, of 227 g 39.3942 g. Rest: 39.22 ÷ 10 = 3.92 → 3.5 units; training: 39.22 ÷ 15 = 2.61 → 2.5 units
    // (0.5-unit pen rounded down, TEST_DOSE_SETTINGS).
    const meals = week.days.slice(0, 5).map((d: { meals: { carb: { grams: number }; dose: { status: string; units: number; carbRatio: number }; time: string }[] }) => d.meals[0]);
    const expected = [
      { carb: 39.2206, ratio: 10, units: 3.5 },
      { carb: 39.2206, ratio: 15, units: 2.5 },
      { carb: 39.3942, ratio: 10, units: 3.5 },
      { carb: 39.3942, ratio: 15, units: 2.5 },
      { carb: 39.2206, ratio: 15, units: 2.5 },
    ];
    meals.forEach((m: (typeof meals)[number], i: number) => {
      expect(m.carb.grams).toBeCloseTo(portions[i].carb.grams, 9);
      expect(m.carb.grams).toBeCloseTo(expected[i].carb, 3);
      expect(m.dose).toMatchObject({ status: 'ok', carbRatio: expected[i].ratio, units: expected[i].units });
      expect(m.time).toBe('07:30');
    });
    // Week: the whole batch's 196.4503 g; 3.5 + 2.5 + 3.5 + 2.5 + 2.5 = 14.5 units; long-acting 4 rest × 14 + 3 training × 12 = 92 units.
    expect(week.totals.carbGrams).toBeCloseTo(196.4503, 3);
    expect(week.totals.rapidUnits).toBe(14.5);
    expect(week.totals.longActingUnits).toBe(92);
    expect(week.days[0].totals).toMatchObject({ rapidUnits: 3.5, longActingUnits: 14 });
    expect(week.use).toEqual([expect.objectContaining({ batchId: batch.body.id, holds: 5, placed: 5, left: 0 })]);
    expect(week.warnings).toEqual([]);
  });

  it('a planned cook placed before cooking, then cooked with other weights, shows planned vs cooked carbohydrate', async () => {
    const p = await setUp();
    const oats = await overnightOats(p.userId);
    const cook = await p.api('post', '/plan/cooks').send({ recipeId: oats.recipe.id, cookOn: '2026-03-09', portions: 5 }).expect(201);
    for (const date of WEEK.slice(0, 2)) await p.api('post', '/plan/meals').send({ date, mealNameId: p.breakfastId, source: 'planned_cook', plannedCookId: cook.body.id }).expect(201);

    const before = (await p.api('get', '/plan/week?date=2026-03-09').expect(200)).body;
    // The recipe's own weights: 250 × 0.576 + 500 × 0.048 + 250 × 0.036 + 150 × 0.1141 = 194.115 g over its 4 portions = 48.52875 g.
    expect(before.days[0].meals[0]).toMatchObject({ source: 'planned_cook', plannedCarb: null, dose: { status: 'ok', units: 4.5 } });
    expect(before.days[0].meals[0].carb.grams).toBeCloseTo(48.52875, 6);
    expect(before.use).toEqual([expect.objectContaining({ plannedCookId: cook.body.id, holds: 5, placed: 2, left: 3 })]);

    const batch = await postBatch(ctx.app, p.token, p.profileId, { ...oats.input, cookedOn: '2026-03-09', plannedCookId: cook.body.id }).expect(201);
    const after = (await p.api('get', '/plan/week?date=2026-03-09').expect(200)).body;
    const first = after.days[0].meals[0];
    // Cooked: the first jar (226 g) holds 39.2206 g (see the test above); the plan still shows the planned 48.53 g beside it.
    expect(first.portionId).toBe(batch.body.portions[0].id);
    expect(first.carb.grams).toBeCloseTo(39.2206, 3);
    expect(first.plannedCarb.grams).toBeCloseTo(48.52875, 6);
    expect(after.days[1].meals[0].portionId).toBe(batch.body.portions[1].id);
    expect(after.cooks[0]).toMatchObject({ id: cook.body.id, batchId: batch.body.id });
  });

  it('logging a planned meal marks it done and the next meal moves on', async () => {
    const p = await setUp();
    const today = new Date().toISOString().slice(0, 10);
    const [m1] = (await p.api('post', '/plan/meals').send({ date: today, mealNameId: p.breakfastId, time: '00:00', source: 'carb', carbGrams: 40 }).expect(201)).body.ids;
    const [m2] = (await p.api('post', '/plan/meals').send({ date: today, mealNameId: p.lunchId, time: '23:59', source: 'carb', carbGrams: 55 }).expect(201)).body.ids;
    expect((await p.api('get', '/plan/next-meal').expect(200)).body.meal.id).toBe(m1);

    // Logged through the logbook's own endpoint, naming the planned meal it fulfils.
    await p.api('post', '/log-entries/meals').send({ meal: { source: 'typed', carbsGrams: 42, note: 'Breakfast' }, planMealId: m1 }).expect(201);
    // A planned meal of another profile is refused and nothing is written.
    const other = await setUp();
    const [theirs] = (await other.api('post', '/plan/meals').send({ date: today, mealNameId: other.breakfastId, time: '00:00', source: 'carb', carbGrams: 10 }).expect(201)).body.ids;
    const refused = await p.api('post', '/log-entries/meals').send({ meal: { source: 'typed', carbsGrams: 10, note: 'x' }, planMealId: theirs }).expect(400);
    expect(refused.body.error.fieldErrors.planMealId).toBeDefined();
    expect(await LogEntryModel.count({ where: { profileId: p.profileId } })).toBe(1);

    const week = (await p.api('get', `/plan/week?date=${today}`).expect(200)).body;
    const day = week.days.find((d: { date: string }) => d.date === today);
    expect(day.meals[0].logged).toMatchObject({ carbGrams: 42 });
    expect(day.meals[1].logged).toBeNull();
    expect((await p.api('get', '/plan/next-meal').expect(200)).body.meal.id).toBe(m2);
  });
});

describe('plan warnings, each by its own case', () => {
  it('a portion planned past its use-by date', async () => {
    const p = await setUp();
    const oats = await overnightOats(p.userId);
    const batch = await postBatch(ctx.app, p.token, p.profileId, oats.input).expect(201); // cooked 2026-03-10, UK fridge: use by 2026-03-12 (FSA, check-values §9)
    await p.api('post', '/plan/meals').send({ date: '2026-03-13', mealNameId: p.breakfastId, source: 'portion', portionId: batch.body.portions[0].id }).expect(201);
    const week = (await p.api('get', '/plan/week?date=2026-03-13').expect(200)).body;
    expect(week.warnings.map((w: { code: string }) => w.code)).toEqual(['past_use_by']);
  });

  it('a frozen portion without a thaw day, then fine with one', async () => {
    const p = await setUp();
    const oats = await overnightOats(p.userId);
    const batch = await postBatch(ctx.app, p.token, p.profileId, { ...oats.input, storage: 'freezer' }).expect(201);
    const meal = await p.api('post', '/plan/meals').send({ date: '2026-03-13', mealNameId: p.breakfastId, source: 'portion', portionId: batch.body.portions[0].id }).expect(201);
    expect((await p.api('get', '/plan/week?date=2026-03-13')).body.warnings.map((w: { code: string }) => w.code)).toEqual(['needs_thaw']);
    await p.api('put', `/plan/meals/${meal.body.ids[0]}`).send({ date: '2026-03-13', mealNameId: p.breakfastId, source: 'portion', portionId: batch.body.portions[0].id, thawOn: '2026-03-12' }).expect(200);
    expect((await p.api('get', '/plan/week?date=2026-03-13')).body.warnings).toEqual([]);
  });

  it('more portions placed than a planned cook holds', async () => {
    const p = await setUp();
    const recipe = await makeRecipe(p.userId, 'Dal', [{ foodId: (await createFood(withAvailable(SR_LEGACY.rice))).id, grams: 400 }]);
    const cook = await p.api('post', '/plan/cooks').send({ recipeId: recipe.id, cookOn: '2026-03-09', portions: 1 }).expect(201);
    for (const mealNameId of [p.breakfastId, p.lunchId]) await p.api('post', '/plan/meals').send({ date: '2026-03-09', mealNameId, source: 'planned_cook', plannedCookId: cook.body.id }).expect(201);
    const week = (await p.api('get', '/plan/week?date=2026-03-09')).body;
    expect(week.warnings.map((w: { code: string }) => w.code)).toEqual(['over_placed']);
  });

  it('a meal with no ratio for its time (no kind of day set up)', async () => {
    const p = await setUp({ dayKinds: false });
    await p.api('post', '/plan/meals').send({ date: '2026-03-09', mealNameId: p.breakfastId, source: 'carb', carbGrams: 30 }).expect(201);
    const week = (await p.api('get', '/plan/week?date=2026-03-09')).body;
    expect(week.warnings.map((w: { code: string }) => w.code)).toEqual(['no_ratio']);
    expect(week.days[0].meals[0].dose).toEqual({ status: 'no_ratio' });
  });

  it('a planned cook with no date', async () => {
    const p = await setUp();
    const oats = await overnightOats(p.userId);
    await p.api('post', '/plan/cooks').send({ recipeId: oats.recipe.id, cookOn: null, portions: 4 }).expect(201);
    const week = (await p.api('get', '/plan/week?date=2026-03-09')).body;
    expect(week.warnings.map((w: { code: string }) => w.code)).toEqual(['cook_no_date']);
  });
});

describe('the week endpoint’s work per request', () => {
  // The figure the README's Plan section gives; it must not grow with the number of meals.
  const MAX_WEEK_QUERIES = 7;

  it('reads a full week (every kind of planned meal, a logged one) in a fixed number of queries', async () => {
    const p = await setUp();
    const oats = await overnightOats(p.userId);
    const rice = await createFood(withAvailable(SR_LEGACY.rice));
    const batch = await postBatch(ctx.app, p.token, p.profileId, { ...oats.input, cookedOn: '2026-03-08', useBy: '2026-03-14' }).expect(201);
    const cook = await p.api('post', '/plan/cooks').send({ recipeId: oats.recipe.id, cookOn: '2026-03-11', portions: 4 }).expect(201);
    const week = () => countQueries(ctx.sequelize, () => p.api('get', '/plan/week?date=2026-03-11').expect(200));
    const meal = (date: string, body: object) => p.api('post', '/plan/meals').send({ date, mealNameId: p.lunchId, ...body }).expect(201);

    await p.api('post', '/plan/meals').send({ date: WEEK[0], mealNameId: p.breakfastId, source: 'portion', portionId: batch.body.portions[0].id }).expect(201);
    const small = await week();

    await p.api('post', '/plan/meals').send({ date: WEEK[1], mealNameId: p.breakfastId, source: 'portion', portionId: batch.body.portions[1].id, repeatDays: 4 }).expect(201);
    await meal(WEEK[2], { source: 'planned_cook', plannedCookId: cook.body.id, repeatDays: 3 });
    await meal(WEEK[0], { source: 'recipe', recipeId: oats.recipe.id, grams: 250 });
    await meal(WEEK[1], { source: 'recipe', recipeId: oats.recipe.id, portions: 1 });
    await meal(WEEK[5], { source: 'food', foodId: rice.id, grams: 180 });
    const [typed] = (await meal(WEEK[6], { source: 'carb', carbGrams: 45 })).body.ids;
    await p.api('post', '/log-entries/meals').send({ meal: { source: 'typed', carbsGrams: 45, note: 'Lunch' }, planMealId: typed }).expect(201);
    const full = await week();

    const sources = full.result.body.days.flatMap((d: { meals: { source: string }[] }) => d.meals.map((m) => m.source));
    expect(new Set(sources)).toEqual(new Set(['portion', 'planned_cook', 'recipe', 'food', 'carb']));
    expect(full.queries).toBeLessThanOrEqual(MAX_WEEK_QUERIES);
    expect(full.queries).toBe(small.queries);
    // The joined rows still carry each part: the food by grams (180 g × (28.17 − 0.4) g per 100 g available, NDB 20045,
    // check-values §11 = 49.986 g) and the typed meal's log entry.
    const meals = full.result.body.days.flatMap((d: { meals: object[] }) => d.meals);
    expect(meals.find((m: { source: string }) => m.source === 'food')).toMatchObject({ title: 'Rice, white, long-grain, cooked', detail: '180 g', carb: { grams: expect.closeTo(49.986, 6) } });
    expect(meals.find((m: { id: number }) => m.id === typed).logged).toMatchObject({ carbGrams: 45 });
    expect(full.result.body.cooks).toEqual([expect.objectContaining({ id: cook.body.id, placed: 3 })]);
  });
});

describe('the shopping list', () => {
  it('sums grams of a food shared by two recipes, groups by food group, gives a household measure, keeps ticks, exports CSV', async () => {
    const p = await setUp();
    const [oats, milk, apple] = await Promise.all([
      createFood({ ...withAvailable(SR_LEGACY.oats), foodGroup: 'Breakfast Cereals' }),
      createFood({ ...withAvailable(SR_LEGACY.wholeMilk), foodGroup: 'Dairy and Egg Products' }),
      createFood({ ...withAvailable(SR_LEGACY.apple), foodGroup: 'Fruits and Fruit Juices' }),
    ]);
    // 1 cup of rolled oats = 81 g (USDA SR28 household weight for NDB 08120, from memory).
    await FoodMeasureModel.create({ foodId: oats.id, label: '1 cup', grams: 81, seq: 1 });
    const a = await makeRecipe(p.userId, 'Overnight oats', [{ foodId: oats.id, grams: 250 }, { foodId: milk.id, grams: 500 }]); // 4 portions
    const b = await makeRecipe(p.userId, 'Apple porridge', [{ foodId: oats.id, grams: 100 }, { foodId: apple.id, grams: 150 }]); // 4 portions
    await p.api('post', '/plan/cooks').send({ recipeId: a.id, cookOn: '2026-03-09', portions: 4 }).expect(201);
    await p.api('post', '/plan/cooks').send({ recipeId: b.id, cookOn: '2026-03-11', portions: 8 }).expect(201);
    await p.api('post', '/plan/cooks').send({ recipeId: b.id, cookOn: '2026-03-16', portions: 4 }).expect(201); // next week: not on this list

    const list = (await p.api('get', '/plan/shopping-list?date=2026-03-10').expect(200)).body;
    // Oats: 250 g (recipe A as written) + 100 g × 8/4 (recipe B doubled) = 450 g = 5.56 cups → 5.5 (to the half).
    const oatsLine = list.groups.flatMap((g: { lines: unknown[] }) => g.lines).find((l: { foodId: number }) => l.foodId === oats.id);
    expect(oatsLine).toMatchObject({ grams: 450, group: 'Breakfast Cereals', measure: { label: '1 cup', count: 5.5 }, recipes: ['Apple porridge', 'Overnight oats'], ticked: false });
    expect(list.groups.map((g: { group: string }) => g.group)).toEqual(['Breakfast Cereals', 'Dairy and Egg Products', 'Fruits and Fruit Juices']);
    expect(list.groups[2].lines[0].grams).toBe(300);

    await p.api('put', '/plan/shopping-list/ticks').send({ weekStart: list.weekStart, foodId: oats.id, ticked: true }).expect(200);
    const again = (await p.api('get', '/plan/shopping-list?date=2026-03-14')).body;
    expect(again.groups[0].lines[0].ticked).toBe(true);

    const csv = await p.api('get', '/plan/shopping-list.csv?date=2026-03-10').expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.text.split('\n')[0]).toBe('group,food,grams,household measure,recipes,ticked');
    expect(csv.text).toContain('Breakfast Cereals,"Oats, rolled, dry",450,about 5.5 × 1 cup,Apple porridge; Overnight oats,yes');
  });
});

describe('plan access', () => {
  it('a clinician reads the plan but cannot write it; a stranger gets 404; a carer writes', async () => {
    const p = await setUp();
    const clinician = await signUpMember(ctx.app, 'Clinician');
    const carer = await signUpMember(ctx.app, 'Carer');
    const stranger = await signUpMember(ctx.app, 'Stranger');
    await ProfileAccessModel.create({ profileId: p.profileId, userId: clinician.userId, role: 'clinician', grantedByUserId: p.userId });
    await ProfileAccessModel.create({ profileId: p.profileId, userId: carer.userId, role: 'carer', grantedByUserId: p.userId });
    const meal = { date: '2026-03-09', mealNameId: p.breakfastId, source: 'carb', carbGrams: 30 };

    const statuses = [
      (await p.api('get', '/plan/week', clinician.token)).status,
      (await p.api('get', '/plan/shopping-list', clinician.token)).status,
      (await p.api('post', '/plan/meals', clinician.token).send(meal)).status,
      (await p.api('put', '/plan/shopping-list/ticks', clinician.token).send({ weekStart: '2026-03-09', foodId: 1, ticked: true })).status,
      (await p.api('get', '/plan/week', stranger.token)).status,
      (await p.api('post', '/plan/meals', carer.token).send(meal)).status,
    ];
    expect(statuses).toEqual([200, 200, 403, 403, 404, 201]);
  });

  it('refuses a meal whose source is missing its part, and a portion of another profile', async () => {
    const p = await setUp();
    const other = await signUpMember(ctx.app, 'Other');
    const oats = await overnightOats(other.userId);
    const batch = await postBatch(ctx.app, other.token, other.profileId, oats.input).expect(201);
    const missing = await p.api('post', '/plan/meals').send({ date: '2026-03-09', mealNameId: p.breakfastId, source: 'food', foodId: null });
    const foreign = await p.api('post', '/plan/meals').send({ date: '2026-03-09', mealNameId: p.breakfastId, source: 'portion', portionId: batch.body.portions[0].id });
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fieldErrors).sort()).toEqual(['foodId', 'grams']);
    expect([foreign.status, foreign.body.error.fieldErrors]).toEqual([400, { portionId: ['That portion is not on this profile.'] }]);
  });
});
