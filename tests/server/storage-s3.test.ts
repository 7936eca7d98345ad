import crypto from 'node:crypto';
import request from 'supertest';
import { stopApp } from '../../server/app';
import { readImageHeader } from '../../server/lib/photo-worker';
import { s3Storage } from '../../server/lib/s3-storage';
import { newStorageKey } from '../../server/lib/storage';
import { RecipeModel } from '../../server/models';
import { bearer, signUpUser, startTestApp, type TestContext } from '../helpers/api';
import { FAKE_S3_BUCKET, fakeS3Keys, useFakeS3 } from '../helpers/fake-s3';
import { makeImage } from '../fixtures/photos/make-images';
import { createRecipeAs, insertOatsFoods, oatsRecipe } from './recipes-helpers';

// Decoding runs in worker threads that load jimp afresh; on a busy 2-core machine that takes seconds.
jest.setTimeout(120_000);

const s3 = useFakeS3();
const storage = () => s3Storage({ bucket: FAKE_S3_BUCKET, region: 'us-east-1', endpoint: s3.endpoint, accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', forcePathStyle: true });
const objectKeys = () => fakeS3Keys(s3);

describe('s3Storage against a local fake S3', () => {
  it.each([
    { name: 'random bytes (every byte value, 300 kB)', make: async () => crypto.randomBytes(300_000) },
    { name: 'a JPEG', make: async () => makeImage(640, 400) },
    { name: 'one byte', make: async () => Buffer.from([0]) },
  ])('gives back exactly the bytes it was given: $name', async ({ make }) => {
    const data = await make();
    const key = newStorageKey('recipes', 'jpg');

    await storage().put(key, data);
    const back = await storage().get(key);

    expect(back).not.toBeNull();
    expect(back!.length).toBe(data.length);
    expect(back!.equals(data)).toBe(true);
  });

  it('answers null for a key with nothing stored', async () => {
    expect(await storage().get(newStorageKey('recipes', 'png'))).toBeNull();
  });

  it('removes a file, and removing it again is not an error', async () => {
    const key = newStorageKey('label-photos', 'webp');
    await storage().put(key, Buffer.from('bytes'));

    await storage().remove(key);

    expect(await storage().get(key)).toBeNull();
    await expect(storage().remove(key)).resolves.toBeUndefined();
  });

  it.each(['recipes/../../etc/passwd.jpg', '/etc/passwd.jpg', 'recipes/notes.txt'])('refuses the invalid key %s before any request', async (key) => {
    await expect(storage().put(key, Buffer.from('x'))).rejects.toThrow('invalid storage key');
    await expect(storage().get(key)).rejects.toThrow('invalid storage key');
    await expect(storage().remove(key)).rejects.toThrow('invalid storage key');
  });

  it('reports a missing bucket as an error, not as a missing file', async () => {
    const other = s3Storage({ bucket: 'no-such-bucket', region: 'us-east-1', endpoint: s3.endpoint, accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', forcePathStyle: true });
    await expect(other.get(newStorageKey('recipes', 'jpg'))).rejects.toThrow();
  });
});

describe('recipe photos through the S3 driver (STORAGE=s3)', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await startTestApp(s3.env);
  });
  afterAll(async () => {
    if (ctx?.app) await stopApp(ctx.app);
    await ctx?.sequelize.close();
  });

  it('stores the large and thumbnail variants as objects in the bucket, serves them by signed link, and removes them with the photo', async () => {
    const foods = await insertOatsFoods();
    const cook = await signUpUser(ctx.app, 'Cloud cook');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await request(ctx.app).put(`/api/recipes/${id}/photo`).set(bearer(cook.token)).attach('photo', await makeImage(800, 400), 'oats.jpg');

    // The body first, so a refusal (e.g. the 30 s decode limit on a loaded machine) shows its message.
    expect(res.body).toEqual(expect.objectContaining({ largeUrl: expect.any(String) }));
    expect(res.status).toBe(200);
    const row = (await RecipeModel.findByPk(id))!;
    expect(await objectKeys()).toEqual(expect.arrayContaining([row.photoLargeKey, row.photoThumbKey]));
    const large = await request(ctx.app).get(res.body.largeUrl);
    expect(large.status).toBe(200);
    expect(large.headers['content-type']).toBe('image/jpeg');
    expect(readImageHeader(large.body)).toEqual({ kind: 'jpeg', width: 800, height: 400 });
    expect((large.body as Buffer).equals((await storage().get(row.photoLargeKey!))!)).toBe(true);

    const removed = await request(ctx.app).delete(`/api/recipes/${id}/photo`).set(bearer(cook.token));

    expect(removed.status).toBe(204);
    expect(await objectKeys()).not.toEqual(expect.arrayContaining([row.photoLargeKey]));
    expect((await request(ctx.app).get(res.body.largeUrl)).status).toBe(404);
  });
});

