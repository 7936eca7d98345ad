import request from 'supertest';
import { addDaysIso } from '../../shared/compute/plan';
import type { ClinicianDesk, DeskPerson } from '../../shared/schemas/clinician-desk';
import { MailOutboxModel, ProfileAccessModel, RecipeShareOfferModel, UserModel } from '../../server/models';
import { bearer, signUpMember, signUpUser, useTestApp } from '../helpers/api';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';
import { addLogEntries } from '../helpers/logbook';
import { makeRecipe } from './batches-fixtures';

const ctx = useTestApp();
const get = (token: string, url: string) => request(ctx.app).get(`/api${url}`).set(bearer(token));

/**
 * Dates are counted back from today (UTC; both profiles keep the default UTC time zone), so the hand-counted log sits
 * inside the desk's 14 local days (today − 13 … today) whenever the test runs; the entries 20 days back sit outside.
 */
const today = new Date().toISOString().slice(0, 10);
const day = (back: number) => addDaysIso(today, -back);
const at = (back: number, time: string) => `${day(back)}T${time}:00Z`;

async function adaWithBreakfasts() {
  const m = await signUpMember(ctx.app, 'Ada');
  // Target range 5–8 mmol/L (TEST_DOSE_SETTINGS, invented test values).
  await request(ctx.app).put(`/api/profiles/${m.profileId}/settings`).set(bearer(m.token)).send(TEST_DOSE_SETTINGS).expect(200);
  const rest = await request(ctx.app)
    .post(`/api/profiles/${m.profileId}/day-kinds`)
    .set(bearer(m.token))
    .send({ name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '11:00', carbRatio: 10, correctionFactor: 2 }, { from: '11:00', to: '24:00', carbRatio: 10, correctionFactor: 2 }] })
    .expect(201);
  const dayKindId = rest.body.id as number;
  // Five breakfasts on days 2–6 back, each: reading 07:50, 40 g at 08:00 with 4 units, reading 10:30 (2 h 30 min after).
  const pairs: [number, number][] = [[6.0, 9.0], [6.5, 9.0], [5.5, 9.0], [7.0, 9.0], [6.0, 10.0]];
  const breakfasts = pairs.flatMap(([before, after], i) => [
    { kind: 'reading' as const, at: at(i + 2, '07:50'), glucoseMmol: before, dayKindId },
    { kind: 'meal' as const, at: at(i + 2, '08:00'), title: 'Porridge', carbAvailableG: 40, carbTotalG: 44, dayKindId },
    { kind: 'rapid_dose' as const, at: at(i + 2, '08:00'), units: 4, dayKindId },
    { kind: 'reading' as const, at: at(i + 2, '10:30'), glucoseMmol: after, dayKindId },
  ]);
  await addLogEntries(m.profileId, [
    ...breakfasts,
    // The latest meal: a lunch with a reading before and none 2–4 h after (left out of the review).
    { kind: 'reading', at: at(2, '12:20'), glucoseMmol: 4.5, dayKindId },
    { kind: 'meal', at: at(2, '12:30'), title: 'Lentil soup', carbAvailableG: 55, carbTotalG: 60, dayKindId },
    // Outside the 14 days, and a deleted reading inside them: neither counts.
    { kind: 'reading', at: at(20, '07:00'), glucoseMmol: 3.0, dayKindId },
    { kind: 'meal', at: at(20, '08:00'), title: 'Old toast', carbAvailableG: 30, carbTotalG: 32, dayKindId },
    { kind: 'reading', at: at(3, '15:00'), glucoseMmol: 2.5, dayKindId, deletedAt: new Date() },
  ]);
  return m;
}

async function beaWithoutSettings() {
  const m = await signUpMember(ctx.app, 'Bea');
  await addLogEntries(m.profileId, [
    { kind: 'reading', at: at(1, '11:50'), glucoseMmol: 10.0 },
    { kind: 'meal', at: at(1, '12:00'), title: 'Rice bowl', carbAvailableG: 30, carbTotalG: 33 },
    { kind: 'reading', at: at(1, '14:30'), glucoseMmol: 5.0 },
    { kind: 'reading', at: at(3, '07:00'), glucoseMmol: 3.5 },
    { kind: 'reading', at: at(3, '18:00'), glucoseMmol: 9.9 },
    { kind: 'reading', at: at(3, '21:00'), glucoseMmol: 12.0 },
  ]);
  return m;
}

async function grant(profileId: number, userId: number, role: 'clinician' | 'carer', permissions: ('ratios' | 'settings')[] = []) {
  await ProfileAccessModel.create({ profileId, userId, role, permissions });
}

const person = (desk: ClinicianDesk, profileId: number) => desk.people.find((p) => p.profileId === profileId)!;

describe('GET /api/clinician-desk', () => {
  let ada: Awaited<ReturnType<typeof adaWithBreakfasts>>;
  let bea: Awaited<ReturnType<typeof beaWithoutSettings>>;
  let clinician: Awaited<ReturnType<typeof signUpUser>>;
  let desk: ClinicianDesk;

  beforeAll(async () => {
    ada = await adaWithBreakfasts();
    bea = await beaWithoutSettings();
    clinician = await signUpUser(ctx.app, 'Nurse');
    await UserModel.update({ role: 'clinician' }, { where: { id: clinician.me.user.id } });
    await grant(ada.profileId, clinician.me.user.id, 'clinician', ['ratios']);
    await grant(bea.profileId, clinician.me.user.id, 'clinician');
    // An invitation to a third person's profile, still open, and one the owner withdrew.
    const cy = await signUpMember(ctx.app, 'Cy');
    await request(ctx.app).post(`/api/profiles/${cy.profileId}/invitations`).set(bearer(cy.token)).send({ email: clinician.email, role: 'clinician', permissions: [] }).expect(201);
    const dee = await signUpMember(ctx.app, 'Dee');
    const withdrawn = await request(ctx.app).post(`/api/profiles/${dee.profileId}/invitations`).set(bearer(dee.token)).send({ email: clinician.email, role: 'clinician', permissions: [] }).expect(201);
    await request(ctx.app).delete(`/api/profiles/${dee.profileId}/invitations/${withdrawn.body.id}`).set(bearer(dee.token)).expect(204);
    desk = (await get(clinician.token, '/clinician-desk').expect(200)).body;
  });

  it('lists the people the clinician supports, by name, with colour, period and permissions', () => {
    expect(desk.people.map((p) => [p.displayName, p.permissions])).toEqual([['Ada', ['ratios']], ['Bea', []]]);
    expect(person(desk, ada.profileId).period).toEqual({ from: day(13), to: today });
    expect(typeof person(desk, ada.profileId).colour).toBe('string');
  });

  it('gives time in range and ratio-review flags as counted by hand', () => {
    const a = person(desk, ada.profileId);
    const b = person(desk, bea.profileId);

    // Ada, range 5–8: in range the five readings before breakfast (6.0, 6.5, 5.5, 7.0, 6.0); above the five after
    // (9.0 ×4, 10.0); below the 4.5 before lunch. The 3.0 twenty days back and the deleted 2.5 do not count.
    // 11 readings: 1 below (100/11 %), 5 in (500/11 %), 5 above (500/11 %).
    expect(a.targetRange).toEqual({ lowMmol: 5, highMmol: 8, fromProfile: true });
    expect(a.timeInRange.readings).toBe(11);
    expect(a.timeInRange.belowPercent).toBeCloseTo(100 / 11, 10);
    expect(a.timeInRange.inPercent).toBeCloseTo(500 / 11, 10);
    expect(a.timeInRange.abovePercent).toBeCloseTo(500 / 11, 10);
    // Breakfast changes +3.0, +2.5, +3.5, +2.0, +4.0 = 15.0 over 5 meals → +3.0 mmol/L, outside ±2 (check-values
    // §13.4) with 5 meals (not too few): one "rose" flag for Rest 00:00–11:00. The lunch has no reading after.
    expect(a.review).toMatchObject({ mealsInPeriod: 6, mealsUsed: 5, minimumMeals: 5, flagLimitMmol: 2 });
    expect(a.review.flags).toHaveLength(1);
    expect(a.review.flags[0]).toMatchObject({ dayKindName: 'Rest', startMinute: 0, endMinute: 660, direction: 'rose', meals: 5 });
    expect(a.review.flags[0].averageChangeMmol).toBeCloseTo(3, 10);
    expect(a.lastMeal).toEqual({ occurredAt: new Date(at(2, '12:30')).toISOString(), localDate: day(2), localTime: '12:30', title: 'Lentil soup', carbG: 55 });

    // Bea has no settings: the 2019 consensus 3.9–10.0. Readings 10.0 (bound, in), 5.0, 3.5 (below), 9.9, 12.0
    // (above) → 1 below, 3 in, 1 above of 5 = 20 / 60 / 20 %. One usable meal (−5.0): too few, so no flag.
    expect(b.targetRange).toEqual({ lowMmol: 3.9, highMmol: 10, fromProfile: false });
    expect(b.timeInRange).toEqual({ readings: 5, belowPercent: 20, inPercent: 60, abovePercent: 20 });
    expect(b.review).toMatchObject({ mealsInPeriod: 1, mealsUsed: 1, flags: [] });
    expect(b.lastMeal).toMatchObject({ localDate: day(1), localTime: '12:00', title: 'Rice bowl', carbG: 30 });
  });

  it('says what each person\'s own charts, review and History say for the same period', async () => {
    for (const p of desk.people) {
      const q = `?from=${p.period.from}&to=${p.period.to}`;
      const charts = await get(clinician.token, `/profiles/${p.profileId}/logbook/charts${q}`).expect(200);
      const review = await get(clinician.token, `/profiles/${p.profileId}/logbook/review${q}`).expect(200);
      const history = await get(clinician.token, `/profiles/${p.profileId}/logbook/history?kinds=meal&limit=1`).expect(200);

      expect(p.timeInRange).toEqual(charts.body.timeInRange);
      expect(p.targetRange).toEqual(charts.body.targetRange);
      expect([p.review.mealsInPeriod, p.review.mealsUsed]).toEqual([review.body.mealsInPeriod, review.body.mealsUsed]);
      for (const flag of p.review.flags) {
        const group = review.body.groups.find((g: DeskPerson['review']['flags'][number]) => g.dayKindId === flag.dayKindId && g.startMinute === flag.startMinute);
        expect(group).toMatchObject({ meals: flag.meals, averageChangeMmol: flag.averageChangeMmol, tooFew: false });
      }
      const latest = history.body.entries[0];
      expect([p.lastMeal?.occurredAt, p.lastMeal?.localTime, p.lastMeal?.carbG]).toEqual([latest.occurredAt, latest.localTime, latest.meal.carbAvailableG]);
    }
  });

  it('lists the open invitation to the clinician\'s address and not the withdrawn one', () => {
    expect(desk.invitations.map((i) => [i.profileName, i.inviterName, i.role])).toEqual([['Cy', 'Cy', 'clinician']]);
  });

  it('shows a clinician without access nothing of a stranger, and the stranger\'s logbook stays 404', async () => {
    const other = await signUpUser(ctx.app, 'Other clinic');
    await UserModel.update({ role: 'clinician' }, { where: { id: other.me.user.id } });

    const res = await get(other.token, '/clinician-desk').expect(200);

    expect(res.body).toEqual({ people: [], invitations: [], caution: expect.any(String) });
    await get(other.token, `/profiles/${ada.profileId}/logbook/charts?from=${day(13)}&to=${today}`).expect(404);
  });

  it('gives owners and carers no rows for profiles they do not hold as clinician', async () => {
    const both = await signUpUser(ctx.app, 'Partner');
    await grant(ada.profileId, both.me.user.id, 'clinician');
    await grant(bea.profileId, both.me.user.id, 'carer', ['settings']);

    const owner = await get(ada.token, '/clinician-desk').expect(200);
    const mixed = await get(both.token, '/clinician-desk').expect(200);

    expect(owner.body.people).toEqual([]);
    expect(mixed.body.people.map((p: DeskPerson) => p.displayName)).toEqual(['Ada']);
  });

  it('answers 401 signed out', async () => {
    await request(ctx.app).get('/api/clinician-desk').expect(401);
  });
});

describe('POST /api/recipes/:id/offers-to-my-people', () => {
  async function clinicianWithPeople(n: number) {
    const nurse = await signUpMember(ctx.app, 'Dietitian');
    const people = [];
    for (let i = 0; i < n; i += 1) {
      const m = await signUpMember(ctx.app, `Person ${i}`);
      await grant(m.profileId, nurse.userId, 'clinician');
      people.push(m);
    }
    const rice = await createFood(withAvailable(SR_LEGACY.rice));
    const recipe = await makeRecipe(nurse.userId, 'Rice for the week', [{ foodId: rice.id, grams: 200 }]);
    return { nurse, people, recipe };
  }
  const emailOf = async (userId: number) => (await UserModel.findByPk(userId))!.email;

  it('offers the recipe to every person the clinician supports; each accepts or declines', async () => {
    const { nurse, people, recipe } = await clinicianWithPeople(2);
    const carer = await signUpMember(ctx.app, 'Carer only');
    await grant(carer.profileId, nurse.userId, 'carer');

    const res = await request(ctx.app).post(`/api/recipes/${recipe.id}/offers-to-my-people`).set(bearer(nurse.token)).expect(202);

    expect(res.body).toEqual({ status: 'offered', people: 2 });
    const offers = await RecipeShareOfferModel.findAll({ where: { recipeId: recipe.id } });
    expect(offers.map((o) => [o.email, o.status]).sort()).toEqual([[await emailOf(people[0].userId), 'offered'], [await emailOf(people[1].userId), 'offered']].sort());
    expect(await MailOutboxModel.count({ where: { kind: 'share_offer', toAddress: await emailOf(people[0].userId) } })).toBe(1);
    // Nothing is on anyone's shelf until they accept.
    const before = await get(people[0].token, '/recipes?scope=shared').expect(200);
    expect(before.body.items).toEqual([]);
    const mine = await get(people[0].token, '/recipe-offers').expect(200);
    await request(ctx.app).post(`/api/recipe-offers/${mine.body.items[0].id}/accept`).set(bearer(people[0].token)).expect(204);
    const after = await get(people[0].token, '/recipes?scope=shared').expect(200);
    expect(after.body.items.map((r: { title: string }) => r.title)).toEqual(['Rice for the week']);
  });

  it('counts every offer toward the hourly limit and sends none when they would pass it', async () => {
    const { nurse, recipe } = await clinicianWithPeople(2);
    const other = await makeRecipe(nurse.userId, 'Soup', []);
    // 19 offers already this hour (README: at most 20 per sender per hour): two more would make 21.
    await RecipeShareOfferModel.bulkCreate(Array.from({ length: 19 }, (_, i) => ({ recipeId: other.id, senderUserId: nurse.userId, email: `earlier${i}@example.test` })));

    const res = await request(ctx.app).post(`/api/recipes/${recipe.id}/offers-to-my-people`).set(bearer(nurse.token));

    expect(res.status).toBe(429);
    expect(await RecipeShareOfferModel.count({ where: { recipeId: recipe.id } })).toBe(0);
  });

  it('refuses with 422 when the sender supports nobody, and another person\'s recipe is not theirs to offer', async () => {
    const { nurse, recipe } = await clinicianWithPeople(1);
    const loner = await signUpMember(ctx.app, 'Loner');
    const own = await makeRecipe(loner.userId, 'Loner stew', []);

    await request(ctx.app).post(`/api/recipes/${own.id}/offers-to-my-people`).set(bearer(loner.token)).expect(422);
    await request(ctx.app).post(`/api/recipes/${recipe.id}/offers-to-my-people`).set(bearer(loner.token)).expect(404);
    expect(await RecipeShareOfferModel.count({ where: { senderUserId: nurse.userId } })).toBe(0);
  });
});
