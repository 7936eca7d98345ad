import request from 'supertest';
import { LogEntryModel } from '../../server/models';
import { bearer, signUpUser, useTestApp } from '../helpers/api';
import { lastCapturedId, linkIn, waitForMail } from '../helpers/mail';

const ctx = useTestApp();
const api = () => request(ctx.app);

type Who = { token: string; email: string };

/** Invites `who` to the profile through the captured mail's link and accepts it with their own session. */
async function inviteAndAccept(owner: Who, profileId: number, who: Who, role: 'carer' | 'clinician' | 'owner') {
  const after = await lastCapturedId(ctx.sequelize);
  await api().post(`/api/profiles/${profileId}/invitations`).set(bearer(owner.token)).send({ email: who.email, role, permissions: [] }).expect(201);
  const token = linkIn(await waitForMail(ctx.sequelize, who.email, { after }), '/invitation').searchParams.get('token')!;
  return api().post('/api/invitations/accept').set(bearer(who.token)).send({ token });
}

const typedMeal = (note: string, carbsGrams: number) => ({ occurredAt: '2026-03-02T12:30:00Z', meal: { source: 'typed', carbsGrams, note } });
const logMeal = (who: Who, profileId: number, note: string, carbsGrams: number) =>
  api().post(`/api/profiles/${profileId}/log-entries/meals`).set(bearer(who.token)).send(typedMeal(note, carbsGrams));
const recentMeals = async (who: Who, profileId: number) => {
  const res = await api().get(`/api/profiles/${profileId}/log-entries/recent?kind=meal`).set(bearer(who.token));
  return { status: res.status, meals: res.status === 200 ? (res.body as { meal: { title: string; carbAvailableG: number }; enteredBy: { name: string } | null }[]) : [] };
};

describe('the care team around one logbook', () => {
  it('a carer logs a meal on the profile they were invited to; the owner sees it, entered by the carer; a clinician reads it and cannot log', async () => {
    const owner = await signUpUser(ctx.app, 'Alex');
    const carer = await signUpUser(ctx.app, 'Jo');
    const clinician = await signUpUser(ctx.app, 'Nurse');
    const profileId = owner.me.profiles[0].id;
    await inviteAndAccept(owner, profileId, carer, 'carer');
    await inviteAndAccept(owner, profileId, clinician, 'clinician');

    const logged = await logMeal(carer, profileId, 'Pasta bake', 62);
    const ownerSees = await recentMeals(owner, profileId);
    const clinicianSees = await recentMeals(clinician, profileId);
    const clinicianLogs = await logMeal(clinician, profileId, 'Biscuit', 8);
    const clinicianLogsOne = await api()
      .post(`/api/profiles/${profileId}/log-entries`)
      .set(bearer(clinician.token))
      .send({ kind: 'rapid_dose', units: 2 });

    expect(logged.status).toBe(201);
    expect(ownerSees.meals.map((m) => [m.meal.title, m.meal.carbAvailableG, m.enteredBy?.name])).toEqual([['Pasta bake', 62, 'Jo']]);
    expect(clinicianSees.meals.map((m) => m.meal.title)).toEqual(['Pasta bake']);
    expect(clinicianLogs.status).toBe(403);
    expect(clinicianLogsOne.status).toBe(403);
    expect(await LogEntryModel.count({ where: { profileId } })).toBe(1);
    const row = await LogEntryModel.findOne({ where: { profileId } });
    expect(row!.enteredByUserId).toBe(carer.me.user.id);
  });

  it("a parent keeps a child's profile and logs for it; the clinician reads and cannot log; handed over, the child as owner sees the parent's entry", async () => {
    const parent = await signUpUser(ctx.app, 'Parent');
    const clinician = await signUpUser(ctx.app, 'Nurse');
    const created = await api().post('/api/profiles').set(bearer(parent.token)).send({ displayName: 'Sam' });
    const profileId = created.body.id as number;
    await inviteAndAccept(parent, profileId, clinician, 'clinician');

    const parentLogs = await logMeal(parent, profileId, 'Fish fingers and peas', 24);
    const clinicianBefore = await recentMeals(clinician, profileId);
    const clinicianLogs = await logMeal(clinician, profileId, 'Crisps', 15);

    const child = await signUpUser(ctx.app, 'Sam');
    const handed = await inviteAndAccept(parent, profileId, child, 'owner');
    const childMe = await api().get('/api/me').set(bearer(child.token));
    const parentMe = await api().get('/api/me').set(bearer(parent.token));
    const childSees = await recentMeals(child, profileId);
    const parentLogsAfter = await logMeal(parent, profileId, 'Toast', 30);
    const childSeesBoth = await recentMeals(child, profileId);
    const clinicianAfter = await recentMeals(clinician, profileId);
    const clinicianLogsAfter = await logMeal(clinician, profileId, 'Crisps', 15);

    expect(created.status).toBe(201);
    expect(parentLogs.status).toBe(201);
    expect(clinicianBefore.meals.map((m) => [m.meal.title, m.enteredBy?.name])).toEqual([['Fish fingers and peas', 'Parent']]);
    expect(clinicianLogs.status).toBe(403);
    expect(handed.status).toBe(200);
    const access = (me: request.Response) => me.body.profiles.find((p: { id: number }) => p.id === profileId)?.access;
    expect(access(childMe)).toBe('owner');
    expect(access(parentMe)).toBe('carer');
    expect(childSees.meals.map((m) => [m.meal.title, m.meal.carbAvailableG, m.enteredBy?.name])).toEqual([['Fish fingers and peas', 24, 'Parent']]);
    expect(parentLogsAfter.status).toBe(201);
    expect(childSeesBoth.meals.map((m) => m.enteredBy?.name)).toEqual(['Parent', 'Parent']);
    expect(clinicianAfter.meals).toHaveLength(2);
    expect(clinicianLogsAfter.status).toBe(403);
    expect(await LogEntryModel.count({ where: { profileId, kind: 'meal' } })).toBe(2);
  });
});
