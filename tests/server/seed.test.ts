import request from 'supertest';
import { BatchIngredientModel, BatchModel, FoodModel, PortionModel, RecipeModel, UserModel } from '../../server/models';
import { loadScenario, runDemoStep, seedDemo } from '../../server/seed/demo';
import { ensureDefaultDataset } from '../../server/services/imports.service';
import { useTestApp } from '../helpers/api';

const ctx = useTestApp();

describe('seedDemo', () => {
  it('does nothing until the IFCT table is imported', async () => {
    const result = await seedDemo(ctx.config, { today: '2026-03-10' });

    expect(result.skipped).toMatch(/IFCT/);
    expect(await UserModel.count()).toBe(0);
  });

  it('seeds the invented household once, and a second run creates nothing', async () => {
    await ensureDefaultDataset(ctx.sequelize);

    const first = await seedDemo(ctx.config, { today: '2026-03-10' });
    const second = await seedDemo(ctx.config, { today: '2026-03-11' });

    expect(first.created).toEqual(expect.arrayContaining(['member', 'batch of Red lentil and sweet potato dal']));
    expect(first.password).toMatch(/^[\w-]{16}$/);
    expect(second.created).toEqual([]);
    expect(second.password).toBeUndefined();
    expect(await BatchModel.count()).toBe(1);
    expect(await PortionModel.count()).toBe(4);
    expect(await RecipeModel.count({ where: { visibility: 'public' } })).toBe(1);
    expect(await FoodModel.count({ where: { source: 'label' } })).toBe(2);

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

  it('splits the demo dal into the weighed tubs with carbohydrate from the snapshot values', async () => {
    const scenario = loadScenario();
    const batch = (await BatchModel.findOne({ include: [{ model: BatchIngredientModel, as: 'ingredients' }] }))!;
    const portions = await PortionModel.findAll({ where: { batchId: batch.id }, order: [['position', 'ASC']] });

    // Pot 3220 g − 1380 g tare = 1840 g; tubs 558 − 118, 573 − 118, 551 − 121, 571 − 121.
    expect(batch.cookedGrams).toBe(1840);
    expect(portions.map((p) => p.netGrams)).toEqual([440, 455, 430, 450]);
    expect(batch.useBy).toBe('2026-03-12');
    const lines = batch.ingredients!.sort((a, b) => a.position - b.position);
    expect(lines.map((l) => l.actualGrams)).toEqual(scenario.batch.actualGrams);
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
