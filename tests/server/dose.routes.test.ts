import request from 'supertest';
import { ProfileAccessModel } from '../../server/models';
import { bearer, signUpUser, useTestApp } from '../helpers/api';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';

const ctx = useTestApp();

const SETTINGS = TEST_DOSE_SETTINGS;
const kind = (name: string, carbRatio: number, isDefault: boolean) => ({
  name,
  isDefault,
  longActingUnits: null,
  glucoseUnit: 'mmol_l',
  timesOfDay: [{ from: '00:00', to: '24:00', carbRatio, correctionFactor: 2 }],
});

async function setUpProfile(name = 'Doser') {
  const s = await signUpUser(ctx.app, name);
  const profileId = s.me.profiles[0].id;
  await request(ctx.app).put(`/api/profiles/${profileId}/settings`).set(bearer(s.token)).send(SETTINGS).expect(200);
  const rest = await request(ctx.app).post(`/api/profiles/${profileId}/day-kinds`).set(bearer(s.token)).send(kind('Rest', 10, true)).expect(201);
  const training = await request(ctx.app).post(`/api/profiles/${profileId}/day-kinds`).set(bearer(s.token)).send(kind('Training', 15, false)).expect(201);
  return { token: s.token, profileId, restId: rest.body.id as number, trainingId: training.body.id as number };
}

const now = () => new Date().toISOString();

describe('POST /api/profiles/:profileId/dose-suggestions', () => {
  it('suggests no dose for a new member without settings and says why', async () => {
    const s = await signUpUser(ctx.app, 'New');

    const res = await request(ctx.app)
      .post(`/api/profiles/${s.me.profiles[0].id}/dose-suggestions`)
      .set(bearer(s.token))
      .send({ carbsGrams: 60, localTime: '12:00' });

    expect(res.status).toBe(200);
    expect(res.body.status).toBe('no_settings');
    expect(res.body.breakdown).toBeUndefined();
  });

  it('T15 gives 4.0 U on the rest day and 2.5 U on the training day for 42 g (check-values §12)', async () => {
    const p = await setUpProfile();

    const rest = await request(ctx.app).post(`/api/profiles/${p.profileId}/dose-suggestions`).set(bearer(p.token)).send({ carbsGrams: 42, glucose: 6, localTime: '12:30' });
    const training = await request(ctx.app)
      .post(`/api/profiles/${p.profileId}/dose-suggestions`)
      .set(bearer(p.token))
      .send({ carbsGrams: 42, glucose: 6, localTime: '12:30', dayKindId: p.trainingId });

    expect(rest.body).toMatchObject({ status: 'ok', dayKind: { name: 'Rest' }, breakdown: { carbRatio: 10, doseUnits: 4 } });
    expect(training.body).toMatchObject({ status: 'ok', dayKind: { name: 'Training' }, breakdown: { carbRatio: 15, doseUnits: 2.5 } });
  });

  it('uses the day kind set for the meal date when no day kind is named', async () => {
    const p = await setUpProfile();
    await request(ctx.app).put(`/api/profiles/${p.profileId}/days/2026-03-03`).set(bearer(p.token)).send({ dayKindId: p.trainingId }).expect(200);

    const planned = await request(ctx.app).post(`/api/profiles/${p.profileId}/dose-suggestions`).set(bearer(p.token)).send({ carbsGrams: 42, localTime: '12:30', date: '2026-03-03' });
    const other = await request(ctx.app).post(`/api/profiles/${p.profileId}/dose-suggestions`).set(bearer(p.token)).send({ carbsGrams: 42, localTime: '12:30', date: '2026-03-04' });

    expect(planned.body.dayKind.name).toBe('Training');
    expect(other.body.dayKind.name).toBe('Rest');
  });

  it('adds a correction above range and subtracts active insulin from it (T11: 6.0 + 2.0 − 1.5 = 6.5 U)', async () => {
    const p = await setUpProfile();
    const t = now();
    await request(ctx.app)
      .put(`/api/profiles/${p.profileId}/day-kinds/${p.restId}`)
      .set(bearer(p.token))
      .send({ ...kind('Rest', 10, true), timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 2.5 }] })
      .expect(200);

    const res = await request(ctx.app)
      .post(`/api/profiles/${p.profileId}/dose-suggestions`)
      .set(bearer(p.token))
      .send({ carbsGrams: 60, glucose: 11, glucoseTakenAt: t, mealAt: t, localTime: '13:00', earlierDoses: [{ units: 1.5, takenAt: t }] });

    expect(res.body.breakdown).toMatchObject({ mealUnits: 6, correctionUnits: 2, activeInsulinSubtracted: 1.5, doseUnits: 6.5 });
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('recent_insulin');
  });

  it('gives no dose and the treat-a-low guidance for glucose below the threshold', async () => {
    const p = await setUpProfile();

    const res = await request(ctx.app).post(`/api/profiles/${p.profileId}/dose-suggestions`).set(bearer(p.token)).send({ carbsGrams: 60, glucose: 3.2, localTime: '08:00' });

    expect(res.body.status).toBe('treat_low');
    expect(res.body.warnings[0].message).toMatch(/Treat the low first/);
  });

  it.each(['carer', 'clinician'] as const)('answers a %s with access', async (role) => {
    const p = await setUpProfile();
    const other = await signUpUser(ctx.app, role);
    await ProfileAccessModel.create({ profileId: p.profileId, userId: other.me.user.id, role, grantedByUserId: null });

    const res = await request(ctx.app).post(`/api/profiles/${p.profileId}/dose-suggestions`).set(bearer(other.token)).send({ carbsGrams: 30, localTime: '18:00' });

    expect(res.status).toBe(200);
    expect(res.body.status).toBe('ok');
  });

  it('returns 404 to a stranger', async () => {
    const p = await setUpProfile();
    const stranger = await signUpUser(ctx.app, 'Stranger');

    const res = await request(ctx.app).post(`/api/profiles/${p.profileId}/dose-suggestions`).set(bearer(stranger.token)).send({ carbsGrams: 30, localTime: '18:00' });

    expect(res.status).toBe(404);
  });

  it.each([
    { name: 'negative carbohydrate', body: { carbsGrams: -5, localTime: '12:00' }, field: 'carbsGrams' },
    { name: 'a missing meal time of day', body: { carbsGrams: 30 }, field: 'localTime' },
    { name: 'a glucose of 600 mmol/L', body: { carbsGrams: 30, glucose: 600, localTime: '12:00' }, field: 'glucose' },
    { name: 'a split of 95 % now', body: { carbsGrams: 30, localTime: '12:00', split: { nowPercent: 95, laterMinutes: 60 } }, field: 'split.nowPercent' },
    { name: 'an unknown exercise intensity', body: { carbsGrams: 30, localTime: '12:00', exercise: { intensity: 'extreme', durationMinutes: 30, startsInMinutes: 0 } }, field: 'exercise.intensity' },
  ])('returns 400 naming the field for $name', async ({ body, field }) => {
    const p = await setUpProfile();

    const res = await request(ctx.app).post(`/api/profiles/${p.profileId}/dose-suggestions`).set(bearer(p.token)).send(body);

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors[field]).toBeDefined();
  });

  it('returns 400 for a day kind of another profile', async () => {
    const p = await setUpProfile();
    const q = await setUpProfile('Other');

    const res = await request(ctx.app)
      .post(`/api/profiles/${p.profileId}/dose-suggestions`)
      .set(bearer(p.token))
      .send({ carbsGrams: 30, localTime: '12:00', dayKindId: q.restId });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.dayKindId).toBeDefined();
  });
});
