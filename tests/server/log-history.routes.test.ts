import request from 'supertest';
import { parse } from 'csv-parse/sync';
import { ProfileAccessModel } from '../../server/models';
import { bearer, signUpMember, signUpUser, useTestApp } from '../helpers/api';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';
import { addLogEntries, setProfileTimeZone } from '../helpers/logbook';

const ctx = useTestApp();

const kind = (name: string, isDefault: boolean, times: { from: string; to: string }[]) => ({
  name,
  isDefault,
  longActingUnits: null,
  glucoseUnit: 'mmol_l',
  timesOfDay: times.map((b) => ({ ...b, carbRatio: 10, correctionFactor: 2 })),
});

async function member(name = 'Reader') {
  const m = await signUpMember(ctx.app, name);
  await request(ctx.app).put(`/api/profiles/${m.profileId}/settings`).set(bearer(m.token)).send(TEST_DOSE_SETTINGS).expect(200);
  const rest = await request(ctx.app)
    .post(`/api/profiles/${m.profileId}/day-kinds`)
    .set(bearer(m.token))
    .send(kind('Rest', true, [{ from: '00:00', to: '11:00' }, { from: '11:00', to: '24:00' }]))
    .expect(201);
  const training = await request(ctx.app).post(`/api/profiles/${m.profileId}/day-kinds`).set(bearer(m.token)).send(kind('Training', false, [{ from: '00:00', to: '24:00' }])).expect(201);
  return { ...m, restId: rest.body.id as number, trainingId: training.body.id as number };
}

const get = (token: string, url: string) => request(ctx.app).get(`/api${url}`).set(bearer(token));

describe('GET /api/profiles/:profileId/logbook/history', () => {
  it('puts a meal at 23:30 and one at 00:30 Berlin time on different days, though both are on one UTC date', async () => {
    const m = await member('Night');
    await setProfileTimeZone(m.profileId, 'Europe/Berlin');
    // Berlin is UTC+1 in January (CET): 22:30Z is 23:30 on the 14th, 23:30Z is 00:30 on the 15th (by hand).
    await addLogEntries(m.profileId, [
      { kind: 'meal', at: '2026-01-14T22:30:00Z', local: '2026-01-14 23:30', zone: 'Europe/Berlin', title: 'Late toast', carbAvailableG: 20, carbTotalG: 22 },
      { kind: 'meal', at: '2026-01-14T23:30:00Z', local: '2026-01-15 00:30', zone: 'Europe/Berlin', title: 'Midnight soup', carbAvailableG: 30, carbTotalG: 33 },
    ]);

    const the15th = await get(m.token, `/profiles/${m.profileId}/logbook/history?from=2026-01-15&to=2026-01-15`).expect(200);
    const the14th = await get(m.token, `/profiles/${m.profileId}/logbook/history?from=2026-01-14&to=2026-01-14`).expect(200);
    const charts = await get(m.token, `/profiles/${m.profileId}/logbook/charts?from=2026-01-14&to=2026-01-15`).expect(200);

    expect(the15th.body.entries.map((e: { meal: { title: string }; localTime: string }) => [e.meal.title, e.localTime])).toEqual([['Midnight soup', '00:30']]);
    expect(the14th.body.entries.map((e: { meal: { title: string }; localTime: string }) => [e.meal.title, e.localTime])).toEqual([['Late toast', '23:30']]);
    expect(charts.body.days.map((d: { date: string; carbG: number }) => [d.date, d.carbG])).toEqual([['2026-01-14', 20], ['2026-01-15', 30]]);
  });

  it('filters by entry type and day kind, sorts both ways and walks every entry once by cursor', async () => {
    const m = await member('Pager');
    await addLogEntries(m.profileId, [
      { kind: 'reading', at: '2026-02-01T07:00:00Z', glucoseMmol: 6, readingSource: 'typed', dayKindId: m.restId },
      { kind: 'meal', at: '2026-02-01T07:05:00Z', title: 'Oats', carbAvailableG: 40, carbTotalG: 45, dayKindId: m.restId },
      { kind: 'rapid_dose', at: '2026-02-01T07:05:00Z', units: 4, dayKindId: m.restId },
      { kind: 'meal', at: '2026-02-02T12:00:00Z', title: 'Rice', carbAvailableG: 60, carbTotalG: 62, dayKindId: m.trainingId },
      { kind: 'long_dose', at: '2026-02-02T21:00:00Z', units: 14, dayKindId: m.trainingId },
      { kind: 'meal', at: '2026-02-03T08:00:00Z', title: 'Gone', carbAvailableG: 10, carbTotalG: 10, deletedAt: new Date() },
    ]);
    const base = `/profiles/${m.profileId}/logbook/history`;

    const meals = await get(m.token, `${base}?kinds=meal&sort=oldest`).expect(200);
    const training = await get(m.token, `${base}?dayKindId=${m.trainingId}`).expect(200);
    const walked: number[] = [];
    let cursor: string | null = null;
    do {
      const page: request.Response = await get(m.token, `${base}?limit=2${cursor ? `&cursor=${cursor}` : ''}`).expect(200);
      expect(page.body.entries.length).toBeLessThanOrEqual(2);
      walked.push(...page.body.entries.map((e: { id: number }) => e.id));
      cursor = page.body.nextCursor;
    } while (cursor);
    const all = await get(m.token, `${base}?limit=200`).expect(200);

    expect(meals.body.entries.map((e: { meal: { title: string } }) => e.meal.title)).toEqual(['Oats', 'Rice']);
    expect(training.body.entries.map((e: { kind: string }) => e.kind)).toEqual(['long_dose', 'meal']);
    expect(walked).toHaveLength(5);
    expect(new Set(walked).size).toBe(5);
    expect(walked).toEqual(all.body.entries.map((e: { id: number }) => e.id));
    expect(all.body.entries[0].kind).toBe('long_dose'); // newest first
  });

  it('shows each meal with the reading before it and the dose suggested and taken', async () => {
    const m = await member('Context');
    await addLogEntries(m.profileId, [
      { kind: 'reading', at: '2026-02-05T07:40:00Z', glucoseMmol: 7.2, readingSource: 'typed' },
      { kind: 'meal', at: '2026-02-05T08:00:00Z', title: 'Porridge', carbAvailableG: 45, carbTotalG: 50, groupKey: '7e0a5f0e-3c1b-4d7a-9a5e-000000000001' },
      {
        kind: 'rapid_dose', at: '2026-02-05T08:00:00Z', units: 4, groupKey: '7e0a5f0e-3c1b-4d7a-9a5e-000000000001',
        suggestion: { status: 'ok', breakdown: { doseUnits: 4.5, mealUnits: 4.5 } },
      },
      { kind: 'meal', at: '2026-02-05T19:00:00Z', title: 'Pasta', carbAvailableG: 70, carbTotalG: 75 },
    ]);

    const res = await get(m.token, `/profiles/${m.profileId}/logbook/history?kinds=meal&sort=oldest`).expect(200);

    expect(res.body.entries[0].mealContext).toEqual({ readingBefore: { glucose: 7.2, localTime: '07:40' }, suggestedUnits: 4.5, takenUnits: 4 });
    expect(res.body.entries[1].mealContext).toEqual({ readingBefore: null, suggestedUnits: null, takenUnits: null });
  });

  it('refuses a bad filter with the field named', async () => {
    const m = await member('Bad');
    const res = await get(m.token, `/profiles/${m.profileId}/logbook/history?kinds=meal,snack`);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(['kinds']);
  });

  it('lets a clinician read and refuses a stranger', async () => {
    const m = await member('Shared');
    const clinician = await signUpUser(ctx.app, 'Clinic');
    const stranger = await signUpUser(ctx.app, 'Stranger');
    await ProfileAccessModel.create({ profileId: m.profileId, userId: clinician.me.user.id, role: 'clinician' });

    await get(clinician.token, `/profiles/${m.profileId}/logbook/history`).expect(200);
    await get(clinician.token, `/profiles/${m.profileId}/logbook/review?from=2026-01-01&to=2026-01-31`).expect(200);
    await get(stranger.token, `/profiles/${m.profileId}/logbook/history`).expect(404);
  });
});

describe('GET /api/profiles/:profileId/logbook/charts and /review', () => {
  it('counts time in range against the profile range and reviews a meal per time of day', async () => {
    const m = await member('Review');
    await addLogEntries(m.profileId, [
      { kind: 'reading', at: '2026-03-02T07:50:00Z', glucoseMmol: 6.0, dayKindId: m.restId },
      { kind: 'meal', at: '2026-03-02T08:00:00Z', title: 'Toast', carbAvailableG: 40, carbTotalG: 44, dayKindId: m.restId },
      { kind: 'rapid_dose', at: '2026-03-02T08:00:00Z', units: 4, dayKindId: m.restId },
      { kind: 'reading', at: '2026-03-02T10:30:00Z', glucoseMmol: 9.0, dayKindId: m.restId },
      { kind: 'reading', at: '2026-03-02T15:00:00Z', glucoseMmol: 4.5, dayKindId: m.restId },
      { kind: 'reading', at: '2026-03-02T22:00:00Z', glucoseMmol: 5.0, dayKindId: m.restId },
    ]);
    const q = '?from=2026-03-01&to=2026-03-03';

    const charts = await get(m.token, `/profiles/${m.profileId}/logbook/charts${q}`).expect(200);
    const review = await get(m.token, `/profiles/${m.profileId}/logbook/review${q}`).expect(200);

    // Profile range 5–8 mmol/L (TEST_DOSE_SETTINGS): 4.5 below; 6.0 and 5.0 (bound) in; 9.0 above → 25 / 50 / 25 %, by hand
    expect(charts.body.targetRange).toEqual({ lowMmol: 5, highMmol: 8, fromProfile: true });
    expect(charts.body.timeInRange).toEqual({ readings: 4, belowPercent: 25, inPercent: 50, abovePercent: 25 });
    expect(charts.body.days).toEqual([
      { date: '2026-03-01', carbG: 0, rapidUnits: 0, longUnits: 0, meals: 0 },
      { date: '2026-03-02', carbG: 40, rapidUnits: 4, longUnits: 0, meals: 1 },
      { date: '2026-03-03', carbG: 0, rapidUnits: 0, longUnits: 0, meals: 0 },
    ]);
    // 9.0 at 2 h 30 min after − 6.0 before = +3.0, morning time of day of the Rest day
    const morning = review.body.groups.find((g: { dayKindId: number; startMinute: number }) => g.dayKindId === m.restId && g.startMinute === 0);
    expect(morning).toMatchObject({ meals: 1, averageChangeMmol: 3, averageCarbG: 40, averageUnits: 4, tooFew: true });
    expect(review.body.minimumMeals).toBe(5);
    expect(review.body.caution).toMatch(/diabetes team/);
    expect(review.body.dayKinds.map((k: { name: string }) => k.name)).toEqual(['Rest', 'Training']);
  });
});

describe('GET /api/profiles/:profileId/logbook/export.csv', () => {
  it('round-trips quotes, commas and non-Latin names through csv-parse, with units in the headers', async () => {
    const m = await member('Export');
    const titles = ['Gran\'s "best" soup, with rice', 'Борщ; со сметаной', '親子丼\nand miso'];
    await addLogEntries(m.profileId, [
      ...titles.map((title, i) => ({ kind: 'meal' as const, at: `2026-04-0${i + 1}T12:00:00Z`, title, carbAvailableG: 30.25 + i, carbTotalG: 33 + i })),
      { kind: 'reading', at: '2026-04-01T11:50:00Z', glucoseMmol: 6.04, readingSource: 'typed' as const },
      { kind: 'rapid_dose', at: '2026-04-01T12:00:00Z', units: 3.5, note: '=1+1 typed by a carer' },
    ]);

    const res = await get(m.token, `/profiles/${m.profileId}/logbook/export.csv?from=2026-04-01&to=2026-04-30`).expect(200);
    const records = parse(res.text, { bom: true, columns: true }) as Record<string, string>[];

    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(Object.keys(records[0])).toEqual(
      expect.arrayContaining(['Carbohydrate available (g)', 'Carbohydrate total (g)', 'Glucose (mmol/L)', 'Rapid-acting insulin (units)', 'Time (UTC)']),
    );
    expect(records.filter((r) => r.Entry === 'Meal').map((r) => r.Meal)).toEqual(titles);
    expect(records.find((r) => r.Entry === 'Meal')!['Carbohydrate available (g)']).toBe('30.3');
    expect(records.find((r) => r.Entry === 'Glucose reading')!['Glucose (mmol/L)']).toBe('6');
    // A cell a spreadsheet would run as a formula starts with an apostrophe (OWASP, CSV injection).
    expect(records.find((r) => r.Entry === 'Rapid-acting dose')).toMatchObject({ 'Rapid-acting insulin (units)': '3.5', Note: "'=1+1 typed by a carer" });
  });
});
