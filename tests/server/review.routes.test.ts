import request from 'supertest';
import { bearer, signUpUser, startTestApp, type TestContext } from '../helpers/api';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await startTestApp();
});
afterAll(async () => {
  await ctx.sequelize.close();
});

async function member(name = 'Member') {
  const s = await signUpUser(ctx.app, name);
  return { token: s.token, userId: s.me.user.id, profileId: s.me.profiles[0].id };
}

describe('PATCH /api/profiles/:profileId/containers/:id', () => {
  it('keeps a pot a pot when only its name is changed', async () => {
    const m = await member();
    const base = `/api/profiles/${m.profileId}/containers`;
    const pot = await request(ctx.app).post(base).set(bearer(m.token)).send({ name: 'Big pot', kind: 'pot', tareGrams: 1450 });

    const renamed = await request(ctx.app).patch(`${base}/${pot.body.id}`).set(bearer(m.token)).send({ name: 'Big blue pot' });
    const list = await request(ctx.app).get(base).set(bearer(m.token));

    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({ name: 'Big blue pot', kind: 'pot', tareGrams: 1450 });
    expect(list.body.items).toEqual([expect.objectContaining({ id: pot.body.id, kind: 'pot' })]);
  });
});
