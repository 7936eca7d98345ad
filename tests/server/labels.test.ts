import jsQR from 'jsqr';
import { PNG } from 'pngjs';
import request from 'supertest';
import { ProfileModel } from '../../server/models';
import { bearer, signUpUser, useTestApp } from '../helpers/api';
import { overnightOats, postBatch } from './batches-fixtures';

const ctx = useTestApp({ PUBLIC_URL: 'https://carbwright.example' });

function decodeQr(dataUrl: string): string | null {
  const png = PNG.sync.read(Buffer.from(dataUrl.replace(/^data:image\/png;base64,/, ''), 'base64'));
  return jsQR(new Uint8ClampedArray(png.data), png.width, png.height)?.data ?? null;
}

describe('GET /api/profiles/:profileId/batches/:id/labels', () => {
  it('has one label per portion with the right numbers and a QR code that decodes to the portion URL', async () => {
    const session = await signUpUser(ctx.app, 'Cook');
    const profileId = session.me.profiles[0].id;
    await ProfileModel.update({ carbUnit: 'portion10' }, { where: { id: profileId } });
    const { input } = await overnightOats(session.me.user.id);
    const batch = (await postBatch(ctx.app, session.token, profileId, input)).body;

    const res = await request(ctx.app).get(`/api/profiles/${profileId}/batches/${batch.id}/labels`).set(bearer(session.token));

    expect(res.status).toBe(200);
    expect(res.body.labels).toHaveLength(5);
    expect(res.body.labels.map((l: { code: string }) => l.code)).toEqual(batch.portions.map((p: { code: string }) => p.code));
    // Hand calculation (tests/shared/batch.test.ts): 226 g portion 39.2206 g = 3.9 CP; 227 g portion 39.3942 g; 17.35 g/100 g.
    expect(res.body.labels[0]).toMatchObject({
      recipeTitle: 'Overnight oats',
      cookedOn: '2026-03-10',
      useBy: '2026-03-12',
      netGrams: 226,
      text: { net: '226 g', carb: '3.9 CP', carbGrams: '39 g', carbLine: '3.9 CP · 39 g carbohydrate (available)', carbPer100g: '17 g' },
    });
    expect(res.body.personName).toBeNull();
    expect(res.body.labels[2].carb.grams).toBeCloseTo(39.3942, 3);
    for (const label of res.body.labels) {
      expect(label.url).toBe(`https://carbwright.example/portions/${label.code}`);
      expect(decodeQr(label.qrDataUrl)).toBe(label.url);
    }
  });

  it('names the person whose batch it is once the household has a second profile', async () => {
    const session = await signUpUser(ctx.app, 'Cook');
    const profileId = session.me.profiles[0].id;
    const { input } = await overnightOats(session.me.user.id);
    const batch = (await postBatch(ctx.app, session.token, profileId, input)).body;
    const url = `/api/profiles/${profileId}/batches/${batch.id}/labels`;

    const alone = await request(ctx.app).get(url).set(bearer(session.token));
    await ProfileModel.create({ displayName: 'Sam', ownerUserId: session.me.user.id });
    const shared = await request(ctx.app).get(url).set(bearer(session.token));

    expect(alone.body.personName).toBeNull();
    expect(shared.body.personName).toBe(session.me.profiles[0].displayName);
    // Grams profile: the unit is said once, with the basis the profile counts.
    expect(shared.body.labels[0].text.carbLine).toBe('39 g carbohydrate (available)');
  });
});
