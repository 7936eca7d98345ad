import request from 'supertest';
import { DayKindModel, ProfileAccessModel, ProfileSettingsModel, SettingsChangeModel, TimeOfDayModel } from '../../server/models';
import { bearer, signUpMember, signUpUser, useTestApp } from '../helpers/api';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';

const ctx = useTestApp();

const member = (name = 'Member') => signUpMember(ctx.app, name);

const SETTINGS = TEST_DOSE_SETTINGS;
const REST = {
  name: 'Rest',
  isDefault: true,
  longActingUnits: 18,
  glucoseUnit: 'mmol_l',
  timesOfDay: [
    { from: '00:00', to: '11:00', carbRatio: 8, correctionFactor: 2 },
    { from: '11:00', to: '24:00', carbRatio: 10, correctionFactor: 2.5 },
  ],
};

async function owner(name = 'Owner') {
  const s = await signUpUser(ctx.app, name);
  return { token: s.token, userId: s.me.user.id, profileId: s.me.profiles[0].id };
}

async function grant(profileId: number, role: 'carer' | 'clinician', permissions: ('settings' | 'ratios')[] = []) {
  const s = await signUpUser(ctx.app, role);
  await ProfileAccessModel.create({ profileId, userId: s.me.user.id, role, grantedByUserId: null, permissions });
  return s.token;
}

describe('GET /api/profiles/:profileId/settings', () => {
  it('returns the unit defaults and no dose settings for a new member', async () => {
    const o = await owner();

    const res = await request(ctx.app).get(`/api/profiles/${o.profileId}/settings`).set(bearer(o.token));

    expect(res.status).toBe(200);
    expect(res.body).toEqual({ glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', preferredFoodTable: 'usda_sr28', timeZone: 'UTC', settings: null, updatedAt: null });
  });

  it('returns 404 to a stranger and 401 without a token', async () => {
    const o = await owner();
    const stranger = await owner('Stranger');

    expect((await request(ctx.app).get(`/api/profiles/${o.profileId}/settings`).set(bearer(stranger.token))).status).toBe(404);
    expect((await request(ctx.app).get(`/api/profiles/${o.profileId}/settings`)).status).toBe(401);
  });
});

describe('PUT /api/profiles/:profileId/settings', () => {
  it.each(['owner', 'carer'] as const)('lets the %s (a carer with the settings permission) save settings and records who did it', async (role) => {
    const o = await owner();
    const token = role === 'owner' ? o.token : await grant(o.profileId, role, ['settings']);

    const res = await request(ctx.app).put(`/api/profiles/${o.profileId}/settings`).set(bearer(token)).send(SETTINGS);

    expect(res.status).toBe(200);
    expect(res.body.settings).toMatchObject({ penIncrement: 0.5, maxDoseUnits: 15, targetLow: 5, hypoThreshold: 3.9 });
    const history = await SettingsChangeModel.findAll({ where: { profileId: o.profileId } });
    expect(history).toHaveLength(1);
    expect(history[0]).toMatchObject({ subject: 'settings', action: 'created' });
  });

  it('refuses a stranger with 404 and saves nothing', async () => {
    const o = await owner();
    const stranger = await owner('Stranger');

    const res = await request(ctx.app).put(`/api/profiles/${o.profileId}/settings`).set(bearer(stranger.token)).send(SETTINGS);

    expect(res.status).toBe(404);
    expect(await ProfileSettingsModel.findByPk(o.profileId)).toBeNull();
  });

  it.each([
    { name: 'a pen increment of 0.3', patch: { penIncrement: 0.3 }, field: 'penIncrement' },
    { name: 'an action time of 30 hours', patch: { actionTimeHours: 30 }, field: 'actionTimeHours' },
    { name: 'a target range upside down', patch: { targetLow: 9, targetHigh: 6, correctionTarget: 7 }, field: 'targetHigh' },
    { name: 'a low threshold above the range', patch: { hypoThreshold: 5.5 }, field: 'hypoThreshold' },
    { name: 'a mg/dL target entered as mmol/L', patch: { glucoseUnit: 'mg_dl' }, field: 'targetLow' },
    { name: 'a missing maximum dose', patch: { maxDoseUnits: '' }, field: 'maxDoseUnits' },
    { name: 'an exercise reduction of 120 %', patch: { exerciseReductions: { ...SETTINGS.exerciseReductions, light: { min30: 120, min60: 50 } } }, field: 'exerciseReductions.light.min30' },
  ])('returns 400 naming the field for $name and changes nothing', async ({ patch, field }) => {
    const o = await owner();

    const res = await request(ctx.app).put(`/api/profiles/${o.profileId}/settings`).set(bearer(o.token)).send({ ...SETTINGS, ...patch });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors[field]).toContainEqual(expect.any(String));
    expect(await ProfileSettingsModel.findByPk(o.profileId)).toBeNull();
    expect(await SettingsChangeModel.count({ where: { profileId: o.profileId } })).toBe(0);
  });

  it('fills in the straight-line active-insulin model when a body leaves it out, and refuses an unknown model', async () => {
    const o = await owner();
    const { activeInsulinModel: _left, ...withoutModel } = SETTINGS;

    const saved = await request(ctx.app).put(`/api/profiles/${o.profileId}/settings`).set(bearer(o.token)).send(withoutModel);
    const wrong = await request(ctx.app).put(`/api/profiles/${o.profileId}/settings`).set(bearer(o.token)).send({ ...SETTINGS, activeInsulinModel: 'bilinear' });

    expect(saved.status).toBe(200);
    expect(saved.body.settings.activeInsulinModel).toBe('linear');
    expect((await ProfileSettingsModel.findByPk(o.profileId))!.activeInsulinModel).toBe('linear');
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fieldErrors.activeInsulinModel).toContainEqual(expect.any(String));
  });

  it('records a change of active-insulin model in the history, and the dose answer then uses and names the curve', async () => {
    const o = await owner();
    await request(ctx.app).put(`/api/profiles/${o.profileId}/settings`).set(bearer(o.token)).send(SETTINGS);
    await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send(REST);

    const res = await request(ctx.app).put(`/api/profiles/${o.profileId}/settings`).set(bearer(o.token)).send({ ...SETTINGS, activeInsulinModel: 'curve' });
    const history = await request(ctx.app).get(`/api/profiles/${o.profileId}/settings/history`).set(bearer(o.token));
    const dose = await request(ctx.app)
      .post(`/api/profiles/${o.profileId}/dose-suggestions`)
      .set(bearer(o.token))
      .send({ carbsGrams: 0, localTime: '13:00', mealAt: '2026-03-01T12:00:00Z', earlierDoses: [{ units: 4, takenAt: '2026-03-01T10:00:00Z' }] });

    expect(res.status).toBe(200);
    const settingsChanges = history.body.changes.filter((c: { subject: string }) => c.subject === 'settings');
    expect(settingsChanges[0]).toMatchObject({ action: 'updated', changes: [{ field: 'settings.activeInsulinModel', from: 'linear', to: 'curve' }] });
    expect(dose.body.breakdown).toMatchObject({ activeInsulinModel: 'curve', actionTimeHours: 4 });
    // 4 units 2 h ago on the curve over 4 h: 4 × 0.3417 (numerical integration, tests/shared/active-insulin.test.ts).
    expect(dose.body.breakdown.activeInsulinUnits).toBeCloseTo(4 * 0.3417, 3);
  });

  it('stores mg/dL settings in mmol/L and gives them back in mg/dL', async () => {
    const o = await owner();
    const mgdl = { ...SETTINGS, glucoseUnit: 'mg_dl', targetLow: 90, targetHigh: 144, correctionTarget: 108, hypoThreshold: 70, veryHigh: 270 };

    const res = await request(ctx.app).put(`/api/profiles/${o.profileId}/settings`).set(bearer(o.token)).send(mgdl);

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ glucoseUnit: 'mg_dl', settings: { targetLow: 90, hypoThreshold: 70, veryHigh: 270 } });
    const row = await ProfileSettingsModel.findByPk(o.profileId);
    // 70 mg/dL = 3.886 mmol/L (check-values §5, factor 18.0156).
    expect(row!.hypoThresholdMmol).toBeCloseTo(3.886, 3);
  });
});

describe('day kinds', () => {
  it('creates two day kinds, keeps one default and lists them with their times of day', async () => {
    const o = await owner();

    const rest = await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send(REST);
    const ride = await request(ctx.app)
      .post(`/api/profiles/${o.profileId}/day-kinds`)
      .set(bearer(o.token))
      .send({ ...REST, name: 'Long ride', isDefault: false, timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 15, correctionFactor: 3 }] });
    const list = await request(ctx.app).get(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token));

    expect(rest.status).toBe(201);
    expect(ride.status).toBe(201);
    expect(list.body.dayKinds.map((k: { name: string; isDefault: boolean }) => [k.name, k.isDefault])).toEqual([
      ['Rest', true],
      ['Long ride', false],
    ]);
    expect(list.body.dayKinds[0].timesOfDay).toEqual(REST.timesOfDay);
    expect(list.body.dayKinds[0].longActingUnits).toBe(18);
  });

  it.each([
    { name: 'a ratio of 0', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 0, correctionFactor: 2 }], field: 'timesOfDay.0.carbRatio' },
    { name: 'a correction factor of 0', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 0 }], field: 'timesOfDay.0.correctionFactor' },
    {
      name: 'overlapping times of day',
      timesOfDay: [
        { from: '00:00', to: '12:00', carbRatio: 10, correctionFactor: 2 },
        { from: '11:00', to: '24:00', carbRatio: 10, correctionFactor: 2 },
      ],
      field: 'timesOfDay.1.from',
    },
    {
      name: 'a gap between times of day',
      timesOfDay: [
        { from: '00:00', to: '10:00', carbRatio: 10, correctionFactor: 2 },
        { from: '11:00', to: '24:00', carbRatio: 10, correctionFactor: 2 },
      ],
      field: 'timesOfDay.1.from',
    },
    { name: 'a day that stops before midnight', timesOfDay: [{ from: '00:00', to: '22:00', carbRatio: 10, correctionFactor: 2 }], field: 'timesOfDay.0.to' },
    { name: 'a time like 25:00', timesOfDay: [{ from: '00:00', to: '25:00', carbRatio: 10, correctionFactor: 2 }], field: 'timesOfDay.0.to' },
  ])('returns 400 naming the field for $name and saves nothing', async ({ timesOfDay, field }) => {
    const o = await owner();

    const res = await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send({ ...REST, timesOfDay });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors[field]).toBeDefined();
    expect(await DayKindModel.count({ where: { profileId: o.profileId } })).toBe(0);
  });

  it('returns 409 for a second day kind with the same name', async () => {
    const o = await owner();
    await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send(REST);

    const res = await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send({ ...REST, name: 'rest' });

    expect(res.status).toBe(409);
    expect(res.body.error.fieldErrors.name).toBeDefined();
  });

  it('lets a clinician with the ratios permission change a ratio, replaces the times of day and records old and new values in the history', async () => {
    const o = await owner();
    const clinician = await grant(o.profileId, 'clinician', ['ratios']);
    const created = await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send(REST);
    const timesOfDay = [{ ...REST.timesOfDay[0], carbRatio: 7 }, REST.timesOfDay[1]];

    const res = await request(ctx.app).put(`/api/profiles/${o.profileId}/day-kinds/${created.body.id}`).set(bearer(clinician)).send({ ...REST, timesOfDay });
    const history = await request(ctx.app).get(`/api/profiles/${o.profileId}/settings/history`).set(bearer(o.token));

    expect(res.status).toBe(200);
    expect(res.body.timesOfDay[0].carbRatio).toBe(7);
    expect(await TimeOfDayModel.count({ where: { dayKindId: created.body.id } })).toBe(2);
    expect(history.body.changes).toHaveLength(2);
    expect(history.body.changes[0]).toMatchObject({
      subject: 'day_kind',
      subjectName: 'Rest',
      action: 'updated',
      changedBy: { displayName: 'clinician' },
      changes: [{ field: 'timesOfDay.0.carbRatio', from: 8, to: 7 }],
    });
    expect(history.body.changes[1]).toMatchObject({ action: 'created', changedBy: { displayName: 'Owner' } });
    expect(history.body.changes[1].changes.map((c: { field: string }) => c.field).slice(0, 8)).toEqual([
      'name',
      'isDefault',
      'longActingUnits',
      'glucoseUnit',
      'timesOfDay.0.from',
      'timesOfDay.0.to',
      'timesOfDay.0.carbRatio',
      'timesOfDay.0.correctionFactor',
    ]);
  });

  it('keeps the old times of day when an update is invalid', async () => {
    const o = await owner();
    const created = await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send(REST);

    const res = await request(ctx.app)
      .put(`/api/profiles/${o.profileId}/day-kinds/${created.body.id}`)
      .set(bearer(o.token))
      .send({ ...REST, timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: -1, correctionFactor: 2 }] });

    expect(res.status).toBe(400);
    const timesOfDay = await TimeOfDayModel.findAll({ where: { dayKindId: created.body.id } });
    expect(timesOfDay.map((b) => b.carbRatio).sort()).toEqual([10, 8]);
  });

  it('moves the default when another day kind is made default, and refuses to drop the default without one', async () => {
    const o = await owner();
    const rest = await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send(REST);
    const ride = await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send({ ...REST, name: 'Ride', isDefault: false });

    const unset = await request(ctx.app).put(`/api/profiles/${o.profileId}/day-kinds/${rest.body.id}`).set(bearer(o.token)).send({ ...REST, isDefault: false });
    const move = await request(ctx.app).put(`/api/profiles/${o.profileId}/day-kinds/${ride.body.id}`).set(bearer(o.token)).send({ ...REST, name: 'Ride', isDefault: true });

    expect(unset.status).toBe(400);
    expect(unset.body.error.fieldErrors.isDefault).toBeDefined();
    expect(move.status).toBe(200);
    expect((await DayKindModel.findByPk(rest.body.id))!.isDefault).toBe(false);
    expect((await DayKindModel.findByPk(ride.body.id))!.isDefault).toBe(true);
  });

  it('deletes a day kind, records it, and gives 404 for a day kind of another profile', async () => {
    const o = await owner();
    const other = await owner('Other');
    await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send(REST);
    const ride = await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send({ ...REST, name: 'Ride', isDefault: false });

    const foreign = await request(ctx.app).delete(`/api/profiles/${other.profileId}/day-kinds/${ride.body.id}`).set(bearer(other.token));
    const res = await request(ctx.app).delete(`/api/profiles/${o.profileId}/day-kinds/${ride.body.id}`).set(bearer(o.token));

    expect(foreign.status).toBe(404);
    expect(res.status).toBe(204);
    expect(await DayKindModel.findByPk(ride.body.id)).toBeNull();
    expect(await SettingsChangeModel.count({ where: { profileId: o.profileId, action: 'deleted' } })).toBe(1);
  });
});

describe('GET /api/profiles/:profileId/settings/history', () => {
  it('shows the history to a carer and records an update of the settings field by field', async () => {
    const o = await owner();
    const carer = await grant(o.profileId, 'carer');
    await request(ctx.app).put(`/api/profiles/${o.profileId}/settings`).set(bearer(o.token)).send(SETTINGS);
    await request(ctx.app).put(`/api/profiles/${o.profileId}/settings`).set(bearer(o.token)).send({ ...SETTINGS, maxDoseUnits: 12 });

    const res = await request(ctx.app).get(`/api/profiles/${o.profileId}/settings/history`).set(bearer(carer));

    expect(res.status).toBe(200);
    expect(res.body.changes[0]).toMatchObject({ subject: 'settings', action: 'updated', changes: [{ field: 'settings.maxDoseUnits', from: 15, to: 12 }] });
  });

  it('returns 404 to a stranger', async () => {
    const o = await owner();
    const stranger = await owner('Stranger');

    expect((await request(ctx.app).get(`/api/profiles/${o.profileId}/settings/history`).set(bearer(stranger.token))).status).toBe(404);
  });
});

describe('days given a day kind', () => {
  it('gives a date another kind, lists the range with the default elsewhere, and puts it back', async () => {
    const o = await owner();
    const rest = await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send(REST);
    const ride = await request(ctx.app).post(`/api/profiles/${o.profileId}/day-kinds`).set(bearer(o.token)).send({ ...REST, name: 'Ride', isDefault: false });

    const set = await request(ctx.app).put(`/api/profiles/${o.profileId}/days/2026-03-03`).set(bearer(o.token)).send({ dayKindId: ride.body.id });
    const week = await request(ctx.app).get(`/api/profiles/${o.profileId}/days?from=2026-03-02&to=2026-03-04`).set(bearer(o.token));
    const back = await request(ctx.app).put(`/api/profiles/${o.profileId}/days/2026-03-03`).set(bearer(o.token)).send({ dayKindId: null });

    expect(set.status).toBe(200);
    expect(week.body.days).toEqual([
      { date: '2026-03-02', dayKindId: rest.body.id, dayKindName: 'Rest', isSet: false },
      { date: '2026-03-03', dayKindId: ride.body.id, dayKindName: 'Ride', isSet: true },
      { date: '2026-03-04', dayKindId: rest.body.id, dayKindName: 'Rest', isSet: false },
    ]);
    expect(back.body).toEqual({ date: '2026-03-03', dayKindId: rest.body.id, dayKindName: 'Rest', isSet: false });
  });

  it.each([
    { name: 'a date that does not exist', path: '2026-02-30', body: { dayKindId: null }, field: 'date' },
    { name: 'a day kind of another profile', path: '2026-03-03', body: { dayKindId: 999999 }, field: 'dayKindId' },
  ])('returns 400 naming the field for $name', async ({ path, body, field }) => {
    const o = await owner();

    const res = await request(ctx.app).put(`/api/profiles/${o.profileId}/days/${path}`).set(bearer(o.token)).send(body);

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors[field]).toBeDefined();
  });

  it('returns 404 to a stranger', async () => {
    const o = await owner();
    const stranger = await owner('Stranger');

    const res = await request(ctx.app).get(`/api/profiles/${o.profileId}/days?from=2026-03-01&to=2026-03-07`).set(bearer(stranger.token));

    expect(res.status).toBe(404);
  });
});

describe('PUT /api/profiles/:profileId/days/:date', () => {
  it('answers every one of several simultaneous requests for the same date, and keeps one of them', async () => {
    const m = await member();
    const kinds: number[] = [];
    for (const name of ['Rest', 'Ride']) {
      const res = await request(ctx.app)
        .post(`/api/profiles/${m.profileId}/day-kinds`)
        .set(bearer(m.token))
        .send({ name, isDefault: name === 'Rest', longActingUnits: 18, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 2 }] });
      kinds.push(res.body.id);
    }

    const answers = await Promise.all(
      Array.from({ length: 8 }, (_, i) =>
        request(ctx.app).put(`/api/profiles/${m.profileId}/days/2026-03-03`).set(bearer(m.token)).send({ dayKindId: kinds[i % 2] }),
      ),
    );
    const day = await request(ctx.app).get(`/api/profiles/${m.profileId}/days?from=2026-03-03&to=2026-03-03`).set(bearer(m.token));

    expect(answers.map((a) => a.status)).toEqual(Array(8).fill(200));
    expect(day.body.days).toHaveLength(1);
    expect(kinds).toContain(day.body.days[0].dayKindId);
    expect(day.body.days[0].isSet).toBe(true);
  });
});
