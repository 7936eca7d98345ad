import request from 'supertest';
import { ProfileModel } from '../../server/models';
import { bearer, startTestApp, type TestContext } from '../helpers/api';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(async () => {
  await ctx.sequelize.close();
});

let n = 0;
const signUp = (extra: Record<string, unknown> = {}) => {
  n += 1;
  return request(ctx.app).post('/api/auth/sign-up').send({ email: `table${n}@example.test`, displayName: 'Table', password: 'correct horse battery', ...extra });
};

describe('preferred food table', () => {
  it('is USDA SR28 when sign-up does not choose', async () => {
    const res = await signUp();

    expect(res.status).toBe(201);
    expect(res.body.me.profiles[0].preferredFoodTable).toBe('usda_sr28');
  });

  it('is taken from sign-up, and an unknown table is refused with the field named', async () => {
    const ok = await signUp({ preferredFoodTable: 'ifct2017' });
    const bad = await signUp({ preferredFoodTable: 'cofid' });

    expect(ok.status).toBe(201);
    expect(ok.body.me.profiles[0].preferredFoodTable).toBe('ifct2017');
    expect(await ProfileModel.count({ where: { preferredFoodTable: 'ifct2017' } })).toBe(1);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors).toHaveProperty('preferredFoodTable');
  });

  it('changes in settings, is kept when the settings are saved without it, and is recorded in the history', async () => {
    const session = (await signUp()).body;
    const profileId = session.me.profiles[0].id;
    const put = (body: object) => request(ctx.app).put(`/api/profiles/${profileId}/settings`).set(bearer(session.token)).send(body);

    const changed = await put({ ...TEST_DOSE_SETTINGS, preferredFoodTable: 'ifct2017' });
    expect(changed.status).toBe(200);
    expect(changed.body.preferredFoodTable).toBe('ifct2017');

    const again = await put(TEST_DOSE_SETTINGS);
    expect(again.status).toBe(200);
    expect((await ProfileModel.findByPk(profileId))!.preferredFoodTable).toBe('ifct2017');

    const history = await request(ctx.app).get(`/api/profiles/${profileId}/settings/history`).set(bearer(session.token));
    expect(JSON.stringify(history.body)).toContain('preferredFoodTable');
  });
});
