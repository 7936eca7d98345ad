import request from 'supertest';
import { LogEntryChangeModel, PortionModel, ProfileAccessModel } from '../../server/models';
import { bearer, signUpMember, useTestApp } from '../helpers/api';
import { breakfastProfile } from './logbook-fixtures';

const ctx = useTestApp();

type P = { token: string; profileId: number };
const base = (p: P) => `/api/profiles/${p.profileId}/log-entries`;
const post = (p: P, body: object) => request(ctx.app).post(base(p)).set(bearer(p.token)).send(body);

describe('POST /api/profiles/:profileId/log-entries (one entry)', () => {
  it('logs each kind, with the day from the profile zone: 23:30 and 00:30 London time fall on different days', async () => {
    const p = await breakfastProfile(ctx.app);

    // London is on summer time (UTC+1) in July (Directive 2000/84/EC): 22:30 UTC is 23:30, 23:30 UTC is 00:30 next day.
    const late = await post(p, { kind: 'reading', glucose: 6.5, occurredAt: '2026-07-14T22:30:00Z' });
    const early = await post(p, { kind: 'reading', glucose: 5.5, occurredAt: '2026-07-14T23:30:00Z' });
    const longDose = await post(p, { kind: 'long_dose', units: 13, occurredAt: '2026-07-14T21:00:00Z' });
    const exercise = await post(p, { kind: 'exercise', intensity: 'moderate', durationMinutes: 45, occurredAt: '2026-07-14T17:00:00Z' });
    const rapid = await post(p, { kind: 'rapid_dose', units: 3, occurredAt: '2026-07-14T12:00:00Z', suggestion: null });

    expect(late.body.entries[0]).toMatchObject({ kind: 'reading', localDate: '2026-07-14', localTime: '23:30', reading: { glucose: 6.5, source: 'typed' } });
    expect(early.body.entries[0]).toMatchObject({ localDate: '2026-07-15', localTime: '00:30' });
    // The default day kind (Rest) plans 14 units of long-acting insulin (the fixture).
    expect(longDose.body.entries[0]).toMatchObject({ kind: 'long_dose', dayKindName: 'Rest', dose: { units: 13, plannedUnits: 14 } });
    expect(exercise.body.entries[0]).toMatchObject({ kind: 'exercise', exercise: { intensity: 'moderate', durationMinutes: 45 } });
    expect(rapid.body.entries[0]).toMatchObject({ kind: 'rapid_dose', dose: { units: 3, suggestion: null } });
    const recent = await request(ctx.app).get(`${base(p)}/recent?limit=2`).set(bearer(p.token));
    expect(recent.body.map((e: { localTime: string }) => e.localTime)).toEqual(['00:30', '23:30']);
  });

  it('refuses a time in the future and an unknown kind', async () => {
    const p = await breakfastProfile(ctx.app);

    const future = await post(p, { kind: 'reading', glucose: 6, occurredAt: new Date(Date.now() + 3_600_000).toISOString() });
    const unknown = await post(p, { kind: 'nap', minutes: 20 });

    expect(future.status).toBe(400);
    expect(future.body.error.fieldErrors).toHaveProperty('occurredAt');
    expect(unknown.status).toBe(400);
  });

  it('lets a clinician read the logbook but not write to it', async () => {
    const p = await breakfastProfile(ctx.app);
    const clinician = await signUpMember(ctx.app, 'Clinician');
    await ProfileAccessModel.create({ profileId: p.profileId, userId: clinician.userId, role: 'clinician', grantedByUserId: p.userId });
    const asClinician = { token: clinician.token, profileId: p.profileId };

    const read = await request(ctx.app).get(`${base(p)}/recent`).set(bearer(clinician.token));
    const write = await post(asClinician, { kind: 'reading', glucose: 6 });

    expect(read.status).toBe(200);
    expect(write.status).toBe(403);
  });
});

describe('corrections keep history', () => {
  it('edits a reading and lists who changed it, when, before → after, in the profile unit', async () => {
    const p = await breakfastProfile(ctx.app);
    const saved = await post(p, { kind: 'reading', glucose: 7, occurredAt: '2026-05-01T07:00:00Z' });
    const id = saved.body.entries[0].id as number;

    const edit = await request(ctx.app).patch(`${base(p)}/${id}`).set(bearer(p.token)).send({ glucose: 8.2, occurredAt: '2026-05-01T07:10:00Z' });
    const changes = await request(ctx.app).get(`${base(p)}/${id}/changes`).set(bearer(p.token));

    expect(edit.status).toBe(200);
    expect(edit.body).toMatchObject({ reading: { glucose: 8.2 }, localTime: '08:10', changed: true });
    expect(changes.body).toHaveLength(1);
    expect(changes.body[0]).toMatchObject({
      action: 'edit',
      changedBy: { id: p.userId, name: 'Breakfast' },
      before: { reading: { glucose: 7 }, localTime: '08:00' },
      after: { reading: { glucose: 8.2 }, localTime: '08:10' },
    });
    expect(Date.parse(changes.body[0].changedAt)).not.toBeNaN();
  });

  it('refuses a change that does not fit the kind of entry, and keeps no change for it', async () => {
    const p = await breakfastProfile(ctx.app);
    const saved = await post(p, { kind: 'reading', glucose: 7 });
    const id = saved.body.entries[0].id as number;

    const res = await request(ctx.app).patch(`${base(p)}/${id}`).set(bearer(p.token)).send({ units: 4 });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('units');
    expect(await LogEntryChangeModel.count({ where: { entryId: id } })).toBe(0);
  });

  it('deletes a meal (kept, marked deleted, its portion back to not eaten) and refuses to edit it after', async () => {
    const p = await breakfastProfile(ctx.app);
    const saved = await post(p, { kind: 'meal', meal: { source: 'portion', portionCode: p.codes[0] } });
    const id = saved.body.entries[0].id as number;

    const del = await request(ctx.app).delete(`${base(p)}/${id}`).set(bearer(p.token));
    const edit = await request(ctx.app).patch(`${base(p)}/${id}`).set(bearer(p.token)).send({ note: 'late' });
    const changes = await request(ctx.app).get(`${base(p)}/${id}/changes`).set(bearer(p.token));

    expect(del.status).toBe(200);
    expect(del.body.deleted).toBe(true);
    expect(edit.status).toBe(409);
    expect(changes.body.map((c: { action: string }) => c.action)).toEqual(['delete']);
    expect(changes.body[0].after).toBeNull();
    expect((await PortionModel.findOne({ where: { code: p.codes[0] } }))!.status).toBe('available');
  });

  it('corrects the carbohydrate of a typed meal only', async () => {
    const p = await breakfastProfile(ctx.app);
    const typed = await post(p, { kind: 'meal', meal: { source: 'typed', carbsGrams: 30, note: 'Sandwich' } });
    const jar = await post(p, { kind: 'meal', meal: { source: 'portion', portionCode: p.codes[1] } });

    const ok = await request(ctx.app).patch(`${base(p)}/${typed.body.entries[0].id}`).set(bearer(p.token)).send({ carbsGrams: 35 });
    const refused = await request(ctx.app).patch(`${base(p)}/${jar.body.entries[0].id}`).set(bearer(p.token)).send({ carbsGrams: 35 });

    expect(ok.body.meal).toMatchObject({ carbAvailableG: 35 });
    expect(refused.status).toBe(400);
  });

  it("hides another profile's entries", async () => {
    const p = await breakfastProfile(ctx.app);
    const other = await signUpMember(ctx.app, 'Other');
    const saved = await post(p, { kind: 'reading', glucose: 7 });

    const res = await request(ctx.app).get(`/api/profiles/${other.profileId}/log-entries/${saved.body.entries[0].id}/changes`).set(bearer(other.token));

    expect(res.status).toBe(404);
  });
});
