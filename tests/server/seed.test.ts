import request from 'supertest';
import { BatchIngredientModel, BatchModel, FoodModel, PortionModel, RecipeModel, UserModel } from '../../server/models';
import { loadScenario, runDemoStep, seedDemo } from '../../server/seed/demo';
import { useTestApp } from '../helpers/api';
import { restoreShippedFoods } from '../helpers/db';

const ctx = useTestApp();

describe('seedDemo', () => {
  it('does nothing until the food tables are imported', async () => {
    const result = await seedDemo(ctx.config, { today: '2026-03-10' });

    expect(result.skipped).toMatch(/IFCT 2017 and USDA SR28/);
    expect(await UserModel.count()).toBe(0);
  });

  it('seeds the invented household once, and a second run creates nothing', async () => {
    await restoreShippedFoods(ctx.sequelize);

    const first = await seedDemo(ctx.config, { today: '2026-03-10' });
    const second = await seedDemo(ctx.config, { today: '2026-03-11' });

    expect(first.created).toEqual(expect.arrayContaining(['member', 'batch of Sunday overnight oats', 'batch of Red lentil and sweet potato dal']));
    expect(first.password).toMatch(/^[\w-]{16}$/);
    expect(second.created).toEqual([]);
    expect(second.password).toBeUndefined();
    expect(await BatchModel.count({ where: { storage: 'fridge' } })).toBe(2);
    expect(await PortionModel.count()).toBe(9);
    expect(await RecipeModel.count({ where: { visibility: 'public' } })).toBe(1);
    expect(await FoodModel.count({ where: { source: 'pack' } })).toBe(2);

    const signIn = await request(ctx.app).post('/api/auth/sign-in').send({ email: first.email, password: first.password });
    expect(signIn.status).toBe(200);

    // The invented demo ratios let the dose check be tried: 60 g at 12:30 on the rest day with the
    // 11:00–17:00 ratio of 10 g/U is 6 U (meal dose = carbohydrate ÷ ratio, check-values §12 T8).
    const profileId = signIn.body.me.profiles[0].id;
    const dose = await request(ctx.app)
      .post(`/api/profiles/${profileId}/dose-suggestions`)
      .set('Authorization', `Bearer ${signIn.body.token}`)
      .send({ carbsGrams: 60, localTime: '12:30' });
    expect(dose.body).toMatchObject({ status: 'ok', dayKind: { name: 'Rest day' }, breakdown: { carbRatio: 10, doseUnits: 6 } });
    expect(first.created).toEqual(expect.arrayContaining(['dose settings', 'day kind Rest day', 'day kind Swim training']));
  }, 120_000);

  it('builds the overnight oats only from generic USDA SR28 foods and portions them out into five weighed portions', async () => {
    const recipe = (await RecipeModel.findOne({ where: { title: 'Sunday overnight oats' } }))!;
    const batch = (await BatchModel.findOne({ where: { recipeId: recipe.id }, include: [{ model: BatchIngredientModel, as: 'ingredients' }] }))!;
    const portions = await PortionModel.findAll({ where: { batchId: batch.id }, order: [['position', 'ASC']] });
    const foods = await FoodModel.findAll({ where: { id: batch.ingredients!.map((l) => l.foodId!) } });

    expect(foods.map((f) => `${f.source} ${f.sourceCode}`).sort()).toEqual(['usda_sr28 01077', 'usda_sr28 01293', 'usda_sr28 08120', 'usda_sr28 09050']);
    expect(foods.some((f) => f.extra.branded)).toBe(false);
    // Bowl 1790 g − 642 g tare = 1148 g; portions 443, 441, 445, 440, 437 g − 214 g tare each.
    expect(batch.cookedGrams).toBe(1148);
    expect(portions.map((p) => p.netGrams)).toEqual([229, 227, 231, 226, 223]);
    // Available carbohydrate by hand from USDA SR28 per 100 g (205 by difference − 291 fibre, check-values §11 for
    // oats, milk, yogurt, blueberries): oats 252 g × (67.70 − 10.1), milk 505 g × (4.80 − 0), Greek yogurt
    // 247 g × (3.98 − 0), blueberries 156 g × (14.49 − 2.4) = 145.152 + 24.24 + 9.8306 + 18.8604 = 198.083 g.
    const available = (252 * 57.6 + 505 * 4.8 + 247 * 3.98 + 156 * 12.09) / 100;
    expect(available).toBeCloseTo(198.083, 3);
    // First portion: 198.083 g × 229 / 1148 = 39.51 g.
    expect(portions[0].carbAvailable).toBeCloseTo((available * 229) / 1148, 6);
    expect(portions[0].carbAvailable).toBeCloseTo(39.513, 2);
  });

  it('splits the demo dal into the weighed tubs with carbohydrate from the snapshot values', async () => {
    const scenario = loadScenario();
    const dal = scenario.batches.find((b) => b.recipe === 'dal')!;
    const recipe = (await RecipeModel.findOne({ where: { title: 'Red lentil and sweet potato dal' } }))!;
    const batch = (await BatchModel.findOne({ where: { recipeId: recipe.id }, include: [{ model: BatchIngredientModel, as: 'ingredients' }] }))!;
    const portions = await PortionModel.findAll({ where: { batchId: batch.id }, order: [['position', 'ASC']] });

    // Pot 3220 g − 1380 g tare = 1840 g; tubs 558 − 118, 573 − 118, 551 − 121, 571 − 121.
    expect(batch.cookedGrams).toBe(1840);
    expect(portions.map((p) => p.netGrams)).toEqual([440, 455, 430, 450]);
    expect(batch.useBy).toBe('2026-03-12');
    const lines = batch.ingredients!.sort((a, b) => a.position - b.position);
    expect(lines.map((l) => l.actualGrams)).toEqual(dal.actualGrams);
    let available = 0;
    for (const l of lines) available += (l.actualGrams! * l.per100g.carbAvailable!) / 100;
    expect(portions[0].carbAvailable).toBeCloseTo((available / 1840) * 440, 6);
  });
});

describe('runDemoStep', () => {
  it('reports an already present household without creating anything', async () => {
    const before = await BatchModel.count();
    const log = jest.spyOn(console, 'log').mockImplementation(() => undefined);

    await runDemoStep(ctx.config, {});

    expect(log).toHaveBeenCalledWith('Demo household is already present.');
    expect(await BatchModel.count()).toBe(before);
    log.mockRestore();
  });

  it('skips everything with SKIP_DEMO=1', async () => {
    const before = await UserModel.count();
    const log = jest.spyOn(console, 'log').mockImplementation(() => undefined);

    await runDemoStep(ctx.config, { SKIP_DEMO: '1' });

    expect(log).toHaveBeenCalledWith(expect.stringMatching(/skipped/));
    expect(await UserModel.count()).toBe(before);
    log.mockRestore();
  });

  it('refuses a DEMO_PASSWORD under 10 characters', async () => {
    await expect(runDemoStep(ctx.config, { DEMO_PASSWORD: 'short' })).rejects.toThrow(/10 characters/);
  });
});
