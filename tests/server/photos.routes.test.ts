import fs from 'node:fs';
import fsPromises from 'node:fs/promises';
import path from 'node:path';
import { JimpMime } from 'jimp';
import request from 'supertest';
import { readImageHeader } from '../../server/lib/photo-worker';
import { RecipeModel } from '../../server/models';
import { signedPhotoUrl } from '../../server/services/photos.service';
import { bearer, signUpUser, useTestApp, useUploadsDir } from '../helpers/api';
import { hugeDimensionPng, makeImage, withExif } from '../fixtures/photos/make-images';
import { createRecipeAs, insertOatsFoods, oatsRecipe } from './recipes-helpers';

// Decoding runs in worker threads that load jimp afresh; on a busy 2-core machine that takes seconds.
jest.setTimeout(120_000);

const uploads = useUploadsDir();
const ctx = useTestApp({ UPLOADS_DIR: uploads });
let foods: Awaited<ReturnType<typeof insertOatsFoods>>;
beforeAll(async () => {
  foods = await insertOatsFoods();
});

const upload = (id: number, token: string, data: Buffer, filename: string) =>
  request(ctx.app).put(`/api/recipes/${id}/photo`).set(bearer(token)).attach('photo', data, filename);

describe('PUT /api/recipes/:id/photo', () => {
  it('accepts a JPEG, stores a large and a thumbnail variant without its metadata, and serves them by signed link', async () => {
    const cook = await signUpUser(ctx.app, 'Photographer');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await upload(id, cook.token, withExif(await makeImage(1800, 900)), 'oats.jpg');

    expect(res.status).toBe(200);
    expect(res.body.largeUrl).toMatch(/^\/api\/photos\/recipes\/[a-f0-9]{32}\.jpg\?exp=\d+&sig=/);
    const large = await request(ctx.app).get(res.body.largeUrl);
    const thumb = await request(ctx.app).get(res.body.thumbUrl);
    expect(large.status).toBe(200);
    expect(large.headers['content-type']).toBe('image/jpeg');
    expect(large.headers['cache-control']).toMatch(/max-age=\d+/);
    expect(readImageHeader(large.body)).toEqual({ kind: 'jpeg', width: 1600, height: 800 });
    expect(readImageHeader(thumb.body)).toEqual({ kind: 'jpeg', width: 400, height: 200 });
    expect((large.body as Buffer).includes('CARBWRIGHT-SECRET-LOCATION')).toBe(false);
    const row = await RecipeModel.findByPk(id);
    expect(fs.existsSync(path.join(uploads, row!.photoLargeKey!))).toBe(true);
    expect(fs.existsSync(path.join(uploads, row!.photoThumbKey!))).toBe(true);
    const page = await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(cook.token));
    expect(page.body.photo.thumbUrl).toMatch(/^\/api\/photos\/recipes\//);
  });

  it('accepts a PNG and replaces the old photo files', async () => {
    const cook = await signUpUser(ctx.app, 'Replacer');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));
    await upload(id, cook.token, await makeImage(300, 200), 'first.jpg');
    const first = (await RecipeModel.findByPk(id))!.photoLargeKey!;

    const res = await upload(id, cook.token, await makeImage(320, 240, JimpMime.png), 'second.png');

    expect(res.status).toBe(200);
    const second = (await RecipeModel.findByPk(id))!.photoLargeKey!;
    expect(second).not.toBe(first);
    expect(fs.existsSync(path.join(uploads, first))).toBe(false);
    expect(readImageHeader((await request(ctx.app).get(res.body.largeUrl)).body)).toEqual({ kind: 'jpeg', width: 320, height: 240 });
  });

  it('accepts a WebP photo', async () => {
    const cook = await signUpUser(ctx.app, 'WebpCook');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await upload(id, cook.token, fs.readFileSync(path.join(__dirname, '../fixtures/photos/gradient-640x400.webp')), 'lunch.webp');

    expect(res.status).toBe(200);
    expect(readImageHeader((await request(ctx.app).get(res.body.thumbUrl)).body)).toEqual({ kind: 'jpeg', width: 400, height: 250 });
  });

  it.each([
    { name: 'a text file renamed to .jpg', make: async () => Buffer.from('Not a photo at all, just words.'), filename: 'soup.jpg', message: /not a JPEG, PNG or WebP/ },
    { name: 'a truncated JPEG', make: async () => (await makeImage(800, 600)).subarray(0, 700), filename: 'cut.jpg', message: /cut short/ },
    { name: 'a JPEG damaged after its header', make: async () => (await makeImage(800, 600)).subarray(0, 2000), filename: 'cut.jpg', message: /could not be read/ },
    { name: 'a 60000 × 60000 PNG', make: async () => hugeDimensionPng(), filename: 'huge.png', message: /too large to open \(the most is 40 megapixels/ },
    { name: 'a 100-byte PNG claiming 12000 × 3333', make: async () => hugeDimensionPng(12_000, 3_333), filename: 'bomb.png', message: /cut short/ },
  ])('returns 400 on photo for $name and stores nothing', async ({ make, filename, message }) => {
    const cook = await signUpUser(ctx.app, 'Refused');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));
    const before = fs.readdirSync(uploads, { recursive: true }).length;

    const res = await upload(id, cook.token, await make(), filename);

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.photo[0]).toMatch(message);
    expect((await RecipeModel.findByPk(id))!.photoLargeKey).toBeNull();
    expect(fs.readdirSync(uploads, { recursive: true }).length).toBe(before);
  });

  it('answers 507 `storage_full` when the disk fills mid-write, and leaves no file and no photo behind', async () => {
    const cook = await signUpUser(ctx.app, 'Full disk');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));
    const before = fs.readdirSync(uploads, { recursive: true }).filter((f) => String(f).includes('.')).length;
    // The second file write puts half its bytes on disk, then the disk is full.
    const real = fsPromises.writeFile;
    let writes = 0;
    const spy = jest.spyOn(fsPromises, 'writeFile').mockImplementation(async (file, data, options) => {
      writes += 1;
      if (writes < 2) return real(file, data, options);
      await real(file, (data as Buffer).subarray(0, (data as Buffer).length >> 1), options);
      throw Object.assign(new Error('ENOSPC: no space left on device, write'), { code: 'ENOSPC' });
    });
    try {
      const res = await upload(id, cook.token, await makeImage(1800, 900), 'oats.jpg');

      expect(res.status).toBe(507);
      expect(res.body.error.code).toBe('storage_full');
    } finally {
      spy.mockRestore();
    }
    expect(writes).toBe(2);
    expect((await RecipeModel.findByPk(id))!.photoLargeKey).toBeNull();
    expect(fs.readdirSync(uploads, { recursive: true }).filter((f) => String(f).includes('.')).length).toBe(before);
  });

  it('returns 413 for a file over 10 MB', async () => {
    const cook = await signUpUser(ctx.app, 'Heavy');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await upload(id, cook.token, Buffer.alloc(10 * 1024 * 1024 + 1, 1), 'big.jpg');

    expect(res.status).toBe(413);
  });

  it('lets only the owner change the photo', async () => {
    const cook = await signUpUser(ctx.app, 'PhotoOwner');
    const stranger = await signUpUser(ctx.app, 'PhotoStranger');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));

    const res = await upload(id, stranger.token, await makeImage(100, 100), 'x.jpg');

    expect(res.status).toBe(404);
  });
});

describe('GET /api/photos/:folder/:file', () => {
  it('keeps a private recipe’s photo from a stranger: no link is handed out, and a tampered or expired link fails', async () => {
    const cook = await signUpUser(ctx.app, 'Private');
    const stranger = await signUpUser(ctx.app, 'Snoop');
    const { id } = await createRecipeAs(ctx.app, cook.token, oatsRecipe(foods));
    const { body } = await upload(id, cook.token, await makeImage(200, 100), 'p.jpg');
    const url = new URL(body.largeUrl, 'http://x');

    const page = await request(ctx.app).get(`/api/recipes/${id}`).set(bearer(stranger.token));
    const bare = await request(ctx.app).get(url.pathname).set(bearer(stranger.token));
    const tampered = await request(ctx.app).get(`${url.pathname}?exp=${url.searchParams.get('exp')}&sig=${'A'.repeat(43)}`);
    const extended = await request(ctx.app).get(`${url.pathname}?exp=${Number(url.searchParams.get('exp')) + 3600}&sig=${url.searchParams.get('sig')}`);
    const expired = await request(ctx.app).get(`${url.pathname}?exp=1000&sig=${url.searchParams.get('sig')}`);

    expect(page.status).toBe(404);
    expect(JSON.stringify(page.body)).not.toContain(url.pathname);
    expect(bare.status).toBe(400);
    expect(tampered.status).toBe(404);
    expect(extended.status).toBe(404);
    expect(expired.status).toBe(404);
  });

  it('refuses a correctly signed name that tries to leave the uploads folder, and reads nothing outside it', async () => {
    // A file beside the uploads folder that the traversal would reach: <uploads>/recipes/../../<name>.
    const name = `outside-${path.basename(uploads)}.jpg`;
    const outside = path.join(path.dirname(uploads), name);
    fs.writeFileSync(outside, 'NOT A PHOTO: PRIVATE');
    // Signed with the server's own key, so the signature check passes and only the path checks stand in the way.
    const signed = new URL(signedPhotoUrl(`recipes/../../${name}`), 'http://x');

    const res = await request(ctx.app).get(`/api/photos/recipes/..%2F..%2F${name}${signed.search}`);
    fs.rmSync(outside);

    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', fieldErrors: { file: ['Not a photo name.'] } });
    expect(res.text).not.toContain('PRIVATE');
  });
});
