import request from 'supertest';
import { LogEntryModel, PortionModel } from '../../server/models';
import { bearer, useTestApp } from '../helpers/api';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';
import { breakfastProfile, SHOWN } from './logbook-fixtures';

const ctx = useTestApp();

const logMeal = (p: { token: string; profileId: number }, body: object) =>
  request(ctx.app).post(`/api/profiles/${p.profileId}/log-entries/meals`).set(bearer(p.token)).send(body);

const portionStatus = async (code: string) => (await PortionModel.findOne({ where: { code } }))!.status;

describe('POST /api/profiles/:profileId/log-entries/meals (log a meal)', () => {
  it.each([
    { name: 'a portion, a reading and a two-part dose on a set day', source: 'portion' },
    { name: 'typed carbohydrate on a default day', source: 'typed' },
  ])('answers exactly what the logbook then shows ($name)', async ({ source }) => {
    const p = await breakfastProfile(ctx.app);
    await request(ctx.app).put(`/api/profiles/${p.profileId}/days/2026-03-29`).set(bearer(p.token)).send({ dayKindId: p.trainingId }).expect(200);
    const meal = source === 'portion' ? { source: 'portion', portionCode: p.codes[0] } : { source: 'typed', carbsGrams: 45, note: 'Porridge' };
    const at = source === 'portion' ? '2026-03-29T07:30:00Z' : '2026-03-30T07:30:00Z';

    const res = await logMeal(p, { occurredAt: at, meal, reading: { glucose: 7.2 }, doses: [{ units: 2.5 }, { units: 1.5, occurredAt: at }], suggestion: SHOWN });
    const recent = await request(ctx.app).get(`/api/profiles/${p.profileId}/log-entries/recent`).set(bearer(p.token));

    expect(res.status).toBe(201);
    expect(res.body.entries).toHaveLength(4);
    // Same keys in the same order, the same values and the same order (newest first) as the logbook reads them back.
    expect(JSON.stringify(res.body.entries)).toBe(JSON.stringify(recent.body));
  });

  it('saves the meal, the reading, both parts of the dose with the suggestion shown, and the portion eaten, as one group', async () => {
    const p = await breakfastProfile(ctx.app);
    // 29 March 2026 is the night the clocks go forward in London (Directive 2000/84/EC: last Sunday of March, 01:00
    // UTC), so 07:30 UTC is 08:30 local; that date is set as a training day.
    await request(ctx.app).put(`/api/profiles/${p.profileId}/days/2026-03-29`).set(bearer(p.token)).send({ dayKindId: p.trainingId }).expect(200);

    const res = await logMeal(p, {
      occurredAt: '2026-03-29T07:30:00Z',
      meal: { source: 'portion', portionCode: p.codes[0] },
      reading: { glucose: 7.2, occurredAt: '2026-03-29T07:28:00Z' },
      doses: [{ units: 2.5 }, { units: 1.5, occurredAt: '2026-03-29T07:30:00Z' }],
      suggestion: SHOWN,
    });

    expect(res.status).toBe(201);
    const entries = res.body.entries as { kind: string; groupKey: string; localDate: string; localTime: string; dayKindName: string }[];
    expect(entries.map((e) => e.kind).sort()).toEqual(['meal', 'rapid_dose', 'rapid_dose', 'reading']);
    expect(new Set(entries.map((e) => e.groupKey))).toEqual(new Set([res.body.groupKey]));
    const meal = res.body.entries.find((e: { kind: string }) => e.kind === 'meal');
    expect(meal).toMatchObject({ localDate: '2026-03-29', localTime: '08:30', timeZone: 'Europe/London', dayKindName: 'Training', meal: { source: 'portion', portionCode: p.codes[0], title: 'Overnight oats', grams: 226 } });
    // Hand calculation in tests/shared/batch.test.ts: the 226 g jar holds 39.2206 g available carbohydrate.
    expect(meal.meal.carbAvailableG).toBeCloseTo(39.2206, 3);
    expect(await portionStatus(p.codes[0])).toBe('eaten');
    const rows = await LogEntryModel.findAll({ where: { profileId: p.profileId } });
    const jar = (await PortionModel.findOne({ where: { code: p.codes[0] } }))!;
    expect(rows.find((r) => r.kind === 'meal')).toMatchObject({ portionId: jar.id, carbTotalG: jar.carbTotal, localMinute: 8 * 60 + 30 });
    expect(rows.find((r) => r.kind === 'reading')!.glucoseMmol).toBe(7.2);
    const doses = rows.filter((r) => r.kind === 'rapid_dose');
    expect(doses.map((d) => d.units).sort()).toEqual([1.5, 2.5]);
    expect(doses[0].suggestion).toMatchObject({ caution: { version: 'test-caution-1' }, engineVersion: 'test-engine-1' });
  });

  it('lets exactly one of two devices eat the same portion at once; the other gets 409 and nothing is written for it', async () => {
    const p = await breakfastProfile(ctx.app);
    const body = { meal: { source: 'portion', portionCode: p.codes[1] }, reading: { glucose: 6 }, doses: [{ units: 3 }], suggestion: SHOWN };

    const results = await Promise.all([logMeal(p, body), logMeal(p, body)]);

    expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
    expect(results.find((r) => r.status === 409)!.body.error.message).toMatch(/already been eaten.*Nothing was saved/);
    expect(await LogEntryModel.count({ where: { profileId: p.profileId, kind: 'meal' } })).toBe(1);
    expect(await LogEntryModel.count({ where: { profileId: p.profileId, kind: 'reading' } })).toBe(1);
    expect(await LogEntryModel.count({ where: { profileId: p.profileId, kind: 'rapid_dose' } })).toBe(1);
  });

  it('writes nothing, not even the portion eaten, when a write after the portion update fails', async () => {
    const p = await breakfastProfile(ctx.app);
    // A real failing insert inside the transaction, after the portion has been marked eaten: a trigger that refuses
    // one dose of 13.5 units on this profile.
    await ctx.sequelize.query(`
      CREATE OR REPLACE FUNCTION test_refuse_dose() RETURNS trigger AS $$
      BEGIN
        IF NEW.kind = 'rapid_dose' AND NEW.units = 13.5 AND NEW.profile_id = ${p.profileId} THEN RAISE EXCEPTION 'refused for the test'; END IF;
        RETURN NEW;
      END $$ LANGUAGE plpgsql;
      CREATE TRIGGER test_refuse_dose BEFORE INSERT ON log_entries FOR EACH ROW EXECUTE FUNCTION test_refuse_dose();`);
    try {
      const res = await logMeal(p, { meal: { source: 'portion', portionCode: p.codes[2] }, reading: { glucose: 6 }, doses: [{ units: 13.5 }] });

      expect(res.status).toBe(500);
      expect(await portionStatus(p.codes[2])).toBe('available');
      expect(await LogEntryModel.count({ where: { profileId: p.profileId } })).toBe(0);
    } finally {
      await ctx.sequelize.query('DROP TRIGGER test_refuse_dose ON log_entries; DROP FUNCTION test_refuse_dose();');
    }
  });

  it('answers 409 for a portion already marked eaten on its page, writing nothing', async () => {
    const p = await breakfastProfile(ctx.app);
    await request(ctx.app).post(`/api/portions/${p.codes[3]}/status`).set(bearer(p.token)).send({ status: 'eaten' }).expect(200);

    const res = await logMeal(p, { meal: { source: 'portion', portionCode: p.codes[3] }, doses: [{ units: 2 }] });

    expect(res.status).toBe(409);
    expect(await LogEntryModel.count({ where: { profileId: p.profileId } })).toBe(0);
  });

  it('computes a food by grams and a recipe weighed on a plate in both bases, and keeps a typed meal in the profile basis', async () => {
    const p = await breakfastProfile(ctx.app);
    const oats = await createFood(withAvailable({ ...SR_LEGACY.oats }));

    const food = await logMeal(p, { meal: { source: 'food', foodId: oats.id, grams: 40 } });
    const plate = await logMeal(p, { meal: { source: 'recipe', recipeId: p.recipeId, grossGrams: 500, plateTareGrams: 300 } });
    const typed = await logMeal(p, { meal: { source: 'typed', carbsGrams: 30, note: 'Toast at the café' } });

    // USDA SR Legacy NDB 08120 oats: 67.7 g total carbohydrate and 10.1 g fibre per 100 g → 40 g: 27.08 g total, 23.04 g available.
    expect(food.body.entries[0].meal).toMatchObject({ source: 'food', title: 'Oats, rolled, dry', grams: 40 });
    expect(food.body.entries[0].meal.carbTotalG).toBeCloseTo(27.08, 6);
    expect(food.body.entries[0].meal.carbAvailableG).toBeCloseTo(23.04, 6);
    // Hand calculation in tests/shared/batch.test.ts: 17.35427 g available per 100 g cooked; 500 − 300 g plate = 200 g.
    expect(plate.body.entries[0].meal).toMatchObject({ source: 'recipe', grams: 200, plateTareGrams: 300, title: 'Overnight oats' });
    expect(plate.body.entries[0].meal.carbAvailableG).toBeCloseTo(34.70854, 4);
    expect(typed.body.entries[0].meal).toMatchObject({ source: 'typed', title: 'Toast at the café', carbAvailableG: 30, carbTotalG: null });
  });

  it('refuses a reading outside what a meter shows, field by field, and writes nothing', async () => {
    const p = await breakfastProfile(ctx.app);

    const res = await logMeal(p, { meal: { source: 'portion', portionCode: p.codes[4] }, reading: { glucose: 72 } });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty(['reading.glucose']);
    expect(await portionStatus(p.codes[4])).toBe('available');
  });
});

describe('POST /api/profiles/:profileId/log-groups/:groupKey/undo', () => {
  it('reverts the meal, the reading, the dose and the portion eaten together, once', async () => {
    const p = await breakfastProfile(ctx.app);
    const saved = await logMeal(p, { meal: { source: 'portion', portionCode: p.codes[0] }, reading: { glucose: 6 }, doses: [{ units: 4 }], suggestion: SHOWN });

    const undo = await request(ctx.app).post(`/api/profiles/${p.profileId}/log-groups/${saved.body.groupKey}/undo`).set(bearer(p.token));
    const again = await request(ctx.app).post(`/api/profiles/${p.profileId}/log-groups/${saved.body.groupKey}/undo`).set(bearer(p.token));

    expect(undo.status).toBe(200);
    expect(undo.body.entries.every((e: { deleted: boolean }) => e.deleted)).toBe(true);
    expect(again.status).toBe(404);
    expect(await portionStatus(p.codes[0])).toBe('available');
    expect(await LogEntryModel.count({ where: { profileId: p.profileId, deletedAt: null } })).toBe(0);
    const recent = await request(ctx.app).get(`/api/profiles/${p.profileId}/log-entries/recent`).set(bearer(p.token));
    expect(recent.body).toEqual([]);
    // The portion can be logged again after the undo.
    expect((await logMeal(p, { meal: { source: 'portion', portionCode: p.codes[0] } })).status).toBe(201);
  });
});
