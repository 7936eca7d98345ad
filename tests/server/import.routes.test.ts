import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { FoodModel, UserModel } from '../../server/models';
import { bearer, signUpUser, useTestApp } from '../helpers/api';

const FDC_MINI = path.resolve(__dirname, '../fixtures/foods/fdc-mini');

let adminToken: string;
let memberToken: string;
const ctx = useTestApp();
beforeAll(async () => {
  const admin = await signUpUser(ctx.app, 'Admin');
  await UserModel.update({ role: 'admin' }, { where: { id: admin.me.user.id } });
  adminToken = admin.token;
  memberToken = (await signUpUser(ctx.app, 'Member')).token;
});

async function waitForImport(id: number) {
  for (let i = 0; i < 100; i += 1) {
    const res = await request(ctx.app).get(`/api/admin/imports/${id}`).set(bearer(adminToken));
    if (res.body.import.status !== 'running') return res.body.import;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('import did not finish');
}

const uploadFdc = (token: string, files: string[], edit?: (name: string, data: Buffer) => Buffer) => {
  let req = request(ctx.app).post('/api/admin/imports').set(bearer(token)).field('kind', 'fdc');
  for (const f of files) {
    const data = fs.readFileSync(path.join(FDC_MINI, f));
    req = req.attach('files', edit ? edit(f, data) : data, f);
  }
  return req;
};
const ALL = fs.readdirSync(FDC_MINI);

describe('POST /api/admin/imports', () => {
  it('imports uploaded FoodData Central files in the background and reports progress and the result', async () => {
    const res = await uploadFdc(adminToken, ALL);

    expect(res.status).toBe(202);
    expect(res.body.import.status).toBe('running');
    const done = await waitForImport(res.body.import.id);
    expect(done).toMatchObject({ status: 'succeeded', dataset: 'usda_fdc', rowsInserted: 2, rowsSkipped: 2 });
    expect(await FoodModel.count({ where: { source: 'usda_fdc' } })).toBe(2);
    const list = await request(ctx.app).get('/api/admin/imports').set(bearer(adminToken));
    expect(list.body.imports[0].id).toBe(res.body.import.id);
  });

  it('reports a bad uploaded file with its file, line and column and changes no food', async () => {
    const before = await FoodModel.findAll({ order: [['id', 'ASC']], raw: true });

    const res = await uploadFdc(adminToken, ALL, (name, data) =>
      name === 'food_nutrient.csv' ? Buffer.from(data.toString('utf8').replace('"12.5"', '"x"')) : data,
    );
    const done = await waitForImport(res.body.import.id);

    expect(done.status).toBe('failed');
    expect(done.report.fileError).toEqual({ file: 'food_nutrient.csv', line: 4, column: 'amount', reason: expect.stringContaining('not a number') });
    expect(await FoodModel.findAll({ order: [['id', 'ASC']], raw: true })).toEqual(before);
  });

  it('returns 400 for an unknown kind or unexpected file names', async () => {
    const noKind = await request(ctx.app).post('/api/admin/imports').set(bearer(adminToken)).field('kind', 'xls');
    const wrongFile = await request(ctx.app)
      .post('/api/admin/imports')
      .set(bearer(adminToken))
      .field('kind', 'sr28')
      .attach('files', Buffer.from('x'), 'food.csv');

    expect(noKind.status).toBe(400);
    expect(noKind.body.error.fieldErrors.kind).toBeDefined();
    expect(wrongFile.status).toBe(400);
    expect(wrongFile.body.error.fieldErrors.files[0]).toContain('food.csv');
  });

  it('is for admins only', async () => {
    expect((await uploadFdc(memberToken, ['food.csv'])).status).toBe(403);
    expect((await request(ctx.app).get('/api/admin/imports').set(bearer(memberToken))).status).toBe(403);
  });
});
