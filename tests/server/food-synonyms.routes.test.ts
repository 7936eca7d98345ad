import request from 'supertest';
import { FoodSynonymModel, UserModel } from '../../server/models';
import { runImport } from '../../server/services/imports.service';
import { bearer, signUpMember, startTestApp, type TestContext } from '../helpers/api';

let ctx: TestContext;
let admin: Awaited<ReturnType<typeof signUpMember>>;
let member: Awaited<ReturnType<typeof signUpMember>>;
beforeAll(async () => {
  ctx = await startTestApp();
  await runImport(ctx.sequelize, 'ifct');
  admin = await signUpMember(ctx.app, 'Admin');
  await UserModel.update({ role: 'admin' }, { where: { id: admin.userId } });
  member = await signUpMember(ctx.app, 'Member');
});
afterAll(async () => {
  await ctx.sequelize.close();
});

const api = () => request(ctx.app);
const names = async (q: string) =>
  ((await api().get('/api/foods').query({ q }).set(bearer(member.token))).body.items as { sourceCode: string }[]).map((f) => f.sourceCode);

describe('/api/admin/food-synonyms', () => {
  it('lists the migrated pairs, each with where it comes from', async () => {
    const res = await api().get('/api/admin/food-synonyms').set(bearer(admin.token));

    expect(res.status).toBe(200);
    expect(res.body.synonyms).toEqual(expect.arrayContaining([expect.objectContaining({ term: 'dahi', equivalent: 'yogurt', origin: 'common usage' })]));
    expect(res.body.synonyms.every((s: { reference: string }) => s.reference.length > 0)).toBe(true);
  });

  it('refuses members and signed-out callers', async () => {
    expect((await api().get('/api/admin/food-synonyms').set(bearer(member.token))).status).toBe(403);
    expect((await api().post('/api/admin/food-synonyms').set(bearer(member.token)).send({ term: 'a', equivalent: 'b', origin: 'dictionary', reference: 'x' })).status).toBe(403);
    expect((await api().get('/api/admin/food-synonyms')).status).toBe(401);
  });

  it('validates the input and names the field', async () => {
    const res = await api().post('/api/admin/food-synonyms').set(bearer(admin.token)).send({ term: 'kela', equivalent: 'Kela', origin: 'hearsay', reference: '' });

    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors ?? res.body.fieldErrors ?? {})).toEqual(expect.arrayContaining(['origin', 'reference']));
  });

  it('adds a pair that search uses at once, refuses it twice, and deletes it', async () => {
    // IFCT 2017 A010 "Ragi" (finger millet); "nachni" is its Marathi name in common usage (from memory).
    expect(await names('nachni')).not.toContain('A010');

    const created = await api()
      .post('/api/admin/food-synonyms')
      .set(bearer(admin.token))
      .send({ term: 'Nachni', equivalent: 'ragi', origin: 'common usage', reference: 'Marathi name of finger millet' });
    expect(created.status).toBe(201);
    expect(created.body.synonym).toMatchObject({ term: 'nachni', equivalent: 'ragi', origin: 'common usage' });
    expect(await FoodSynonymModel.count({ where: { term: 'nachni' } })).toBe(1);
    expect(await names('nachni')).toContain('A010');
    // A near-miss of the new name is corrected through the lexicon too.
    expect(await names('nachnii')).toContain('A010');

    const again = await api().post('/api/admin/food-synonyms').set(bearer(admin.token)).send({ term: 'ragi', equivalent: 'nachni', origin: 'dictionary', reference: 'x' });
    expect(again.status).toBe(409);

    const removed = await api().delete(`/api/admin/food-synonyms/${created.body.synonym.id}`).set(bearer(admin.token));
    expect(removed.status).toBe(204);
    expect(await FoodSynonymModel.count({ where: { term: 'nachni' } })).toBe(0);
    expect(await names('nachni')).not.toContain('A010');
    expect((await api().delete(`/api/admin/food-synonyms/${created.body.synonym.id}`).set(bearer(admin.token))).status).toBe(404);
  });
});
