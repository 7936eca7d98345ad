import request from 'supertest';
import { PortionModel, ProfileAccessModel } from '../../server/models';
import { formatPortionCode } from '../../shared/compute/portion-code';
import { bearer, signUpMember, useTestApp } from '../helpers/api';
import { overnightOats, postBatch } from './batches-fixtures';

const ctx = useTestApp();

const member = (name = 'Cook') => signUpMember(ctx.app, name);

async function cookedPortions() {
  const cook = await member();
  const { input } = await overnightOats(cook.userId);
  const res = await postBatch(ctx.app, cook.token, cook.profileId, input);
  return { cook, batch: res.body, code: res.body.portions[0].code as string };
}

describe('GET /api/portions/:code', () => {
  it('shows the portion with its batch numbers, accepting the code typed in lower case with a dash', async () => {
    const { cook, code } = await cookedPortions();

    const res = await request(ctx.app).get(`/api/portions/${formatPortionCode(code).toLowerCase()}`).set(bearer(cook.token));

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ code, recipeTitle: 'Overnight oats', cookedOn: '2026-03-10', useBy: '2026-03-12', netGrams: 226, status: 'available', basis: 'available', unit: 'g' });
    // Hand calculation in tests/shared/batch.test.ts: 226 g portion → 39.2206 g; 17.35427 g/100 g.
    expect(res.body.carb.grams).toBeCloseTo(39.2206, 3);
    expect(res.body.carbPer100g.grams).toBeCloseTo(17.35427, 4);
  });

  it('shows the portion to a carer of the profile and hides it from a stranger', async () => {
    const { cook, code } = await cookedPortions();
    const carer = await member('Carer');
    const stranger = await member('Stranger');
    await ProfileAccessModel.create({ profileId: cook.profileId, userId: carer.userId, role: 'carer', grantedByUserId: cook.userId });

    const carerRes = await request(ctx.app).get(`/api/portions/${code}`).set(bearer(carer.token));
    const strangerRes = await request(ctx.app).get(`/api/portions/${code}`).set(bearer(stranger.token));
    const signedOut = await request(ctx.app).get(`/api/portions/${code}`);

    expect(carerRes.status).toBe(200);
    expect(strangerRes.status).toBe(404);
    expect(signedOut.status).toBe(401);
  });

  it('answers 404 for a code that cannot exist', async () => {
    const cook = await member();

    const res = await request(ctx.app).get('/api/portions/OOOO00').set(bearer(cook.token));

    expect(res.status).toBe(404);
  });
});

describe('POST /api/portions/:code/status', () => {
  it('marks a portion eaten once and answers 409 the second time', async () => {
    const { cook, code } = await cookedPortions();

    const first = await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(cook.token)).send({ status: 'eaten' });
    const second = await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(cook.token)).send({ status: 'discarded' });

    expect(first.status).toBe(200);
    expect(first.body.status).toBe('eaten');
    expect(second.status).toBe(409);
    const row = await PortionModel.findOne({ where: { code } });
    expect(row!.status).toBe('eaten');
    expect(row!.statusChangedByUserId).toBe(cook.userId);
  });

  it('lets exactly one of ten simultaneous taps win', async () => {
    const { cook, code } = await cookedPortions();

    const results = await Promise.all(
      Array.from({ length: 10 }, (_, i) =>
        request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(cook.token)).send({ status: i % 2 ? 'eaten' : 'discarded' }),
      ),
    );

    expect(results.filter((r) => r.status === 200)).toHaveLength(1);
    expect(results.filter((r) => r.status === 409)).toHaveLength(9);
  });

  it('counts the change in the inventory', async () => {
    const { cook, batch } = await cookedPortions();
    await request(ctx.app).post(`/api/portions/${batch.portions[0].code}/status`).set(bearer(cook.token)).send({ status: 'eaten' });
    await request(ctx.app).post(`/api/portions/${batch.portions[1].code}/status`).set(bearer(cook.token)).send({ status: 'discarded' });

    const res = await request(ctx.app).get(`/api/profiles/${cook.profileId}/batches`).set(bearer(cook.token));

    expect(res.body.items[0].counts).toEqual({ available: 3, eaten: 1, discarded: 1 });
  });

  it('drops a batch from the available inventory once every portion is gone, but keeps it under all', async () => {
    const { cook, batch } = await cookedPortions();
    for (const p of batch.portions) {
      await request(ctx.app).post(`/api/portions/${p.code}/status`).set(bearer(cook.token)).send({ status: 'eaten' });
    }

    const available = await request(ctx.app).get(`/api/profiles/${cook.profileId}/batches?include=available`).set(bearer(cook.token));
    const all = await request(ctx.app).get(`/api/profiles/${cook.profileId}/batches?include=all`).set(bearer(cook.token));

    expect(available.body.items).toEqual([]);
    expect(all.body.items[0].counts).toEqual({ available: 0, eaten: 5, discarded: 0 });
  });

  it('refuses a clinician (403), a stranger (404) and an unknown status (400)', async () => {
    const { cook, code } = await cookedPortions();
    const clinician = await member('Clinician');
    const stranger = await member('Stranger');
    await ProfileAccessModel.create({ profileId: cook.profileId, userId: clinician.userId, role: 'clinician', grantedByUserId: cook.userId });

    const byClinician = await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(clinician.token)).send({ status: 'eaten' });
    const byStranger = await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(stranger.token)).send({ status: 'eaten' });
    const badStatus = await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(cook.token)).send({ status: 'gone' });

    expect([byClinician.status, byStranger.status, badStatus.status]).toEqual([403, 404, 400]);
    expect(badStatus.body.error.fieldErrors.status).toBeDefined();
    expect((await PortionModel.findOne({ where: { code } }))!.status).toBe('available');
  });
});

describe('POST /api/portions/:code/status back to available (the undo)', () => {
  it.each([{ from: 'eaten' }, { from: 'discarded' }])('undoes $from: the portion is not eaten yet again and can be marked anew', async ({ from }) => {
    const { cook, code } = await cookedPortions();
    await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(cook.token)).send({ status: from });

    const undo = await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(cook.token)).send({ status: 'available' });
    const again = await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(cook.token)).send({ status: 'eaten' });

    expect(undo.status).toBe(200);
    expect(undo.body.status).toBe('available');
    expect(again.status).toBe(200);
    const row = await PortionModel.findOne({ where: { code } });
    expect(row!.status).toBe('eaten');
  });

  it('records who undid it in the database and counts the portion as not eaten yet in the inventory', async () => {
    const { cook, code } = await cookedPortions();
    const carer = await member('Carer');
    await ProfileAccessModel.create({ profileId: cook.profileId, userId: carer.userId, role: 'carer', grantedByUserId: cook.userId });
    await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(cook.token)).send({ status: 'discarded' });

    const undo = await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(carer.token)).send({ status: 'available' });
    const list = await request(ctx.app).get(`/api/profiles/${cook.profileId}/batches`).set(bearer(cook.token));

    expect(undo.status).toBe(200);
    const row = await PortionModel.findOne({ where: { code } });
    expect(row!.status).toBe('available');
    expect(row!.statusChangedByUserId).toBe(carer.userId);
    expect(list.body.items[0].counts).toEqual({ available: 5, eaten: 0, discarded: 0 });
  });

  it('answers 409 for a portion that is already not eaten yet, and 403 to a clinician, leaving the row as it was', async () => {
    const { cook, code } = await cookedPortions();
    const clinician = await member('Clinician');
    await ProfileAccessModel.create({ profileId: cook.profileId, userId: clinician.userId, role: 'clinician', grantedByUserId: cook.userId });

    const notMarked = await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(cook.token)).send({ status: 'available' });
    await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(cook.token)).send({ status: 'eaten' });
    const byClinician = await request(ctx.app).post(`/api/portions/${code}/status`).set(bearer(clinician.token)).send({ status: 'available' });

    expect(notMarked.status).toBe(409);
    expect(notMarked.body.error.message).toBe('This portion is already not eaten yet.');
    expect(byClinician.status).toBe(403);
    expect((await PortionModel.findOne({ where: { code } }))!.status).toBe('eaten');
  });
});
