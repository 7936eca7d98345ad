import fs from 'node:fs';
import path from 'node:path';
import { PNG } from 'pngjs';
import request from 'supertest';
import { FoodModel, ProfileAccessModel } from '../../server/models';
import { readImageHeader } from '../../server/lib/photo-worker';
import { bearer, signUpMember, signUpUser, useTestApp, useUploadsDir } from '../helpers/api';
import { makeImage, withExif } from '../fixtures/photos/make-images';

// Label photos are decoded in worker threads that load jimp afresh; on a busy 2-core machine that takes seconds.
jest.setTimeout(120_000);

const uploads = useUploadsDir();
const ctx = useTestApp({ UPLOADS_DIR: uploads });
let owner: Awaited<ReturnType<typeof signUpUser>>;
let other: Awaited<ReturnType<typeof signUpUser>>;
beforeAll(async () => {
  owner = await signUpUser(ctx.app, 'Labeller');
  other = await signUpUser(ctx.app, 'Other');
});

const member = (name = 'Member') => signUpMember(ctx.app, name);

const post = (token: string, body: unknown) => request(ctx.app).post('/api/foods').set(bearer(token)).send(body as object);
const euPer100 = { name: 'Oat crackers', basis: 'per100g', convention: 'eu', carbohydrate: 60, fibre: 10, sugars: 2, protein: 12, fat: 7, energyKcal: 371 };

describe('POST /api/foods (pack food)', () => {
  it('stores an EU label as available carbohydrate and derives total = available + fibre', async () => {
    const res = await post(owner.token, euPer100);

    // check-values.md §1.2 worked example: available 60 g, fibre 10 g, protein 12 g, fat 7 g → 371 kcal
    expect(res.status).toBe(201);
    expect(res.body.food).toMatchObject({ source: 'pack', carbMeasured: 'available', labelConvention: 'eu', ownerUserId: owner.me.user.id });
    expect(res.body.food.per100g).toMatchObject({ carbAvailable: 60, carbTotal: 70, fibre: 10, protein: 12, fat: 7, energyKcal: 371 });
    expect(res.body.food.per100g.energyKj).toBeCloseTo(371 * 4.184, 6);
  });

  it('stores a US label as total carbohydrate and derives available = total − fibre', async () => {
    const res = await post(owner.token, { name: 'Bran flakes', basis: 'per100g', convention: 'us', carbohydrate: 24, fibre: 4 });

    // check-values.md §1.3 US worked example: total 24 g, fibre 4 g → available 20 g
    expect(res.status).toBe(201);
    expect(res.body.food.carbMeasured).toBe('total');
    expect(res.body.food.per100g).toMatchObject({ carbTotal: 24, carbAvailable: 20, fibre: 4 });
    expect(res.body.food.derived).toEqual(['carbAvailable']);
  });

  it.each([
    { name: '30 g serving, EU', servingGrams: 30, convention: 'eu', carbohydrate: 18, fibre: 1.5, expected: { carbAvailable: 60, fibre: 5, carbTotal: 65 } },
    { name: '40 g serving, US', servingGrams: 40, convention: 'us', carbohydrate: 24, fibre: 4, expected: { carbTotal: 60, fibre: 10, carbAvailable: 50 } },
    { name: '250 g serving, EU, no fibre printed', servingGrams: 250, convention: 'eu', carbohydrate: 30, fibre: null, expected: { carbAvailable: 12, fibre: null, carbTotal: null } },
  ])('converts a per-serving label to per 100 g ($name)', async ({ servingGrams, convention, carbohydrate, fibre, expected }) => {
    const res = await post(owner.token, { name: 'Serving food', basis: 'perServing', servingGrams, convention, carbohydrate, fibre });

    expect(res.status).toBe(201);
    for (const [k, v] of Object.entries(expected)) {
      if (v == null) expect(res.body.food.per100g[k]).toBeNull();
      else expect(res.body.food.per100g[k]).toBeCloseTo(v, 9);
    }
  });

  it.each([
    { name: 'a negative value', patch: { fat: -1 }, field: 'fat' },
    { name: 'carbohydrate, protein and fat over 100 g per 100 g', patch: { carbohydrate: 70, protein: 20, fat: 15, fibre: 0 }, field: 'carbohydrate' },
    { name: 'over 100 g per 100 g once a serving is scaled', patch: { basis: 'perServing', servingGrams: 20, carbohydrate: 15, protein: 3, fat: 3, fibre: 0 }, field: 'carbohydrate' },
    { name: 'a serving of 0 g', patch: { basis: 'perServing', servingGrams: 0 }, field: 'servingGrams' },
    { name: 'per serving without the serving size', patch: { basis: 'perServing' }, field: 'servingGrams' },
    { name: 'a missing name', patch: { name: '  ' }, field: 'name' },
    { name: 'carbohydrate that is not a number', patch: { carbohydrate: 'lots' }, field: 'carbohydrate' },
    { name: 'US fibre larger than total carbohydrate', patch: { convention: 'us', carbohydrate: 5, fibre: 8 }, field: 'fibre' },
  ])('returns 400 naming the field for $name and saves nothing', async ({ patch, field }) => {
    const before = await FoodModel.count();

    const res = await post(owner.token, { ...euPer100, ...patch });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors[field]).toBeDefined();
    expect(await FoodModel.count()).toBe(before);
  });

  it('keeps a pack food private to its owner unless shared with a profile the other person cares for', async () => {
    const created = await post(owner.token, euPer100);
    const id = created.body.food.id;

    expect((await request(ctx.app).get(`/api/foods/${id}`).set(bearer(other.token))).status).toBe(404);
    expect((await request(ctx.app).get('/api/foods?q=oat%20crackers').set(bearer(other.token))).body.items).toEqual([]);

    const profileId = owner.me.profiles[0].id;
    await ProfileAccessModel.create({ profileId, userId: other.me.user.id, role: 'carer' });
    const shared = await post(owner.token, { ...euPer100, name: 'Shared crackers', sharedProfileId: profileId });
    expect((await request(ctx.app).get(`/api/foods/${shared.body.food.id}`).set(bearer(other.token))).status).toBe(200);
    expect((await request(ctx.app).get(`/api/foods/${id}`).set(bearer(other.token))).status).toBe(404);
  });

  it('refuses to share with a profile the member has no access to', async () => {
    const res = await post(other.token, { ...euPer100, sharedProfileId: 999999 });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.sharedProfileId).toBeDefined();
  });

  it('re-encodes the label photo without its EXIF and serves it by signed link only to people who may see the food', async () => {
    const res = await request(ctx.app)
      .post('/api/foods')
      .set(bearer(owner.token))
      .field('data', JSON.stringify({ ...euPer100, name: 'Photo crackers' }))
      .attach('photo', withExif(await makeImage(40, 30)), { filename: 'label.jpg', contentType: 'image/jpeg' });

    expect(res.status).toBe(201);
    expect(res.body.food.hasPhoto).toBe(true);
    const link = await request(ctx.app).get(`/api/foods/${res.body.food.id}/photo`).set(bearer(owner.token));
    expect(link.status).toBe(302);
    expect(link.headers.location).toMatch(/^\/api\/photos\/label-photos\/[a-f0-9]{32}\.jpg\?exp=\d+&sig=/);
    const photo = await request(ctx.app).get(link.headers.location).buffer(true);
    expect(photo.status).toBe(200);
    expect(photo.headers['content-type']).toBe('image/jpeg');
    expect(readImageHeader(photo.body as Buffer)).toEqual({ kind: 'jpeg', width: 40, height: 30 });
    expect((photo.body as Buffer).includes('CARBWRIGHT-SECRET-LOCATION')).toBe(false);
    const forged = link.headers.location.replace(/sig=[^&]+/, 'sig=forged');
    expect((await request(ctx.app).get(forged)).status).toBe(404);
    expect((await request(ctx.app).get(`/api/foods/${res.body.food.id}/photo`).set(bearer(other.token))).status).toBe(404);
  });

  it('rejects a photo that is not an image without saving the food', async () => {
    const before = await FoodModel.count();

    const res = await request(ctx.app)
      .post('/api/foods')
      .set(bearer(owner.token))
      .field('data', JSON.stringify(euPer100))
      .attach('photo', Buffer.from('not an image'), { filename: 'label.txt', contentType: 'text/plain' });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.photo).toBeDefined();
    expect(await FoodModel.count()).toBe(before);
  });

  it('lets only the owner delete a pack food', async () => {
    const created = await post(owner.token, { ...euPer100, name: 'Doomed crackers' });
    const id = created.body.food.id;

    expect((await request(ctx.app).delete(`/api/foods/${id}`).set(bearer(other.token))).status).toBe(404);
    expect((await request(ctx.app).delete(`/api/foods/${id}`).set(bearer(owner.token))).status).toBe(204);
    expect(await FoodModel.findByPk(id)).toBeNull();
  });
});

describe('pack food photos', () => {
  const values = { name: 'Photo crackers', basis: 'per100g', convention: 'eu', carbohydrate: 60, fibre: 10 };

  it('refuses a "photo" whose bytes are not an image, whatever type it claims, and saves no food', async () => {
    const m = await member();
    const page = Buffer.from('<html><script>alert(1)</script></html>');
    const photosDir = path.join(uploads, 'label-photos');
    const stored = () => (fs.existsSync(photosDir) ? fs.readdirSync(photosDir) : []);
    const before = stored();

    const res = await request(ctx.app)
      .post('/api/foods')
      .set(bearer(m.token))
      .field('data', JSON.stringify(values))
      .attach('photo', page, { filename: 'label.png', contentType: 'image/png' });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.photo).toBeDefined();
    expect(stored()).toEqual(before);
    expect(await FoodModel.count({ where: { ownerUserId: m.userId } })).toBe(0);
  });

  it('answers 404, not 500, when a label photo file has gone from the disk', async () => {
    const m = await member();
    const png = new PNG({ width: 4, height: 4 });
    png.data.fill(200);
    const created = await request(ctx.app)
      .post('/api/foods')
      .set(bearer(m.token))
      .field('data', JSON.stringify(values))
      .attach('photo', PNG.sync.write(png), { filename: 'label.png', contentType: 'image/png' });
    fs.rmSync(path.join(uploads, 'label-photos'), { recursive: true, force: true });

    const link = await request(ctx.app).get(`/api/foods/${created.body.food.id}/photo`).set(bearer(m.token));
    const res = await request(ctx.app).get(link.headers.location);

    expect(created.status).toBe(201);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
