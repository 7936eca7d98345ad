import jsQR from 'jsqr';
import type { Locator, Page } from 'playwright-core';
import { PNG } from 'pngjs';
import request from 'supertest';
import { formatPortionCode } from '../../shared/compute/portion-code';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('breakfast');
});
afterAll(async () => {
  await rig?.close();
});

const localToday = () => {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
};

/** A member with the invented test settings (Rest 10 g per unit), and three jars of porridge base in the fridge. */
async function breakfastReady() {
  const signUp = await request(rig.baseUrl)
    .post('/api/auth/sign-up')
    .send({ email: 'breakfast@example.test', displayName: 'Ari', password: 'a long kitchen passphrase', timeZone: 'Europe/London' });
  const auth = { Authorization: `Bearer ${signUp.body.token}` };
  const profileId = signUp.body.me.profiles[0].id as number;
  await request(rig.baseUrl).put(`/api/profiles/${profileId}/settings`).set(auth).send(TEST_DOSE_SETTINGS).expect(200);
  await request(rig.baseUrl)
    .post(`/api/profiles/${profileId}/day-kinds`)
    .set(auth)
    .send({ name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 3 }] })
    .expect(201);
  // Per 100 g, USDA SR Legacy via check-values §11: rolled oats 67.7 g total carbohydrate, 10.1 g fibre.
  const oats = await createFood(withAvailable(SR_LEGACY.oats));
  const recipe = await request(rig.baseUrl).post('/api/recipes').set(auth).send({ title: 'Porridge base', defaultPortions: 3, ingredients: [{ foodId: oats.id, grams: 150 }] }).expect(201);
  const batch = await request(rig.baseUrl)
    .post(`/api/profiles/${profileId}/batches`)
    .set(auth)
    .send({
      recipeId: recipe.body.id, cookedOn: localToday(), storage: 'fridge',
      ingredients: [{ foodId: oats.id, plannedGrams: 150, actualGrams: 150 }],
      cookedWeight: { grossGrams: 900, tareGrams: 300 }, split: { mode: 'equal', count: 3 },
    })
    .expect(201);
  const labels = await request(rig.baseUrl).get(`/api/profiles/${profileId}/batches/${batch.body.id}/labels`).set(auth).expect(200);
  return { token: signUp.body.token as string, label: labels.body.labels[0] as { code: string; qrDataUrl: string } };
}

/** What a phone camera reads from the printed label's QR code. */
function scanLabel(qrDataUrl: string): string {
  const png = PNG.sync.read(Buffer.from(qrDataUrl.replace(/^data:image\/png;base64,/, ''), 'base64'));
  return jsQR(new Uint8ClampedArray(png.data), png.width, png.height)!.data;
}

async function signedIn(token: string, viewport: { width: number; height: number }): Promise<Page> {
  const page = await rig.newPage(viewport);
  await rig.signIn(page, token);
  await page.goto(`${rig.baseUrl}/`);
  return page;
}

describe('breakfast: scan, glucose, dose check, taken, save', () => {
  it('logs a portion with its reading and dose in three taps, takes it off the fridge list and counts the dose as still active next time', async () => {
    const { token, label } = await breakfastReady();
    const page = await signedIn(token, PHONE);
    let taps = 0;
    const tap = async (target: Locator) => {
      taps += 1;
      await target.click();
    };
    await page.getByText('In the fridge and freezer').waitFor();
    await expect(page.getByRole('link', { name: /^Log this meal: Porridge base/ }).count()).resolves.toBe(3);
    await rig.shot(page, 'phone-today');

    // The camera opens the label's URL: no tap in the app.
    const scanned = scanLabel(label.qrDataUrl);
    expect(scanned).toMatch(new RegExp(`/portions/${label.code}$`));
    await page.goto(scanned);
    await page.getByText('Carbohydrate in this portion').waitFor();
    await tap(page.getByRole('button', { name: 'Log this meal' }));
    await page.getByRole('heading', { name: 'Log a meal' }).waitFor();
    await expect(page.getByLabel('Carbohydrate (available)').inputValue()).resolves.toBe('28.8');
    await page.getByLabel('Glucose now').fill('7.2');
    await tap(page.getByRole('button', { name: 'Check a dose', exact: true }));
    // By hand: 150 g oats × 57.6 g available / 100 ÷ 3 jars = 28.8 g; ÷ 10 g per unit = 2.88 units; 7.2 mmol/L is
    // inside the 5–8 target so no correction; rounded down to the 0.5-unit pen step: 2.5 units.
    await page.getByRole('heading', { name: 'How it adds up' }).waitFor();
    await expect(page.getByText('A calculation, not medical advice').isVisible()).resolves.toBe(true);
    await expect(page.getByLabel('Rapid-acting insulin taken').inputValue()).resolves.toBe('2.5');
    await page.getByRole('button', { name: 'Save to the logbook' }).scrollIntoViewIfNeeded();
    await rig.shot(page, 'phone-suggestion-and-taken');
    await tap(page.getByRole('button', { name: 'Save to the logbook' }));
    await page.getByText(/Saved in the logbook/).waitFor();
    await page.getByRole('button', { name: 'Undo' }).waitFor();
    await rig.shot(page, 'phone-saved');
    expect(taps).toBeLessThanOrEqual(5);

    await page.goto(`${rig.baseUrl}/`);
    await page.getByText('In the fridge and freezer').waitFor();
    await expect(page.getByRole('link', { name: /^Log this meal: Porridge base/ }).count()).resolves.toBe(2);
    await expect(page.getByRole('link', { name: `Log this meal: Porridge base ${formatPortionCode(label.code)}` }).count()).resolves.toBe(0);

    // The next dose check counts the logged dose as insulin still active, with its time.
    await page.getByRole('link', { name: 'Check a dose', exact: true }).click();
    await page.getByLabel('Carbohydrate (available)').fill('20');
    await page.getByRole('button', { name: 'Check a dose', exact: true }).click();
    await page.getByText(/From the logbook, still active: 2\.5 units at \d\d:\d\d/).waitFor();
    await page.getByText('Insulin still active').scrollIntoViewIfNeeded();
    await rig.shot(page, 'phone-next-dose-check');

    const wide = await signedIn(token, WIDE);
    await wide.getByText('In the fridge and freezer').waitFor();
    await rig.shot(wide, 'wide-today');
    await wide.getByRole('link', { name: /^Log this meal: Porridge base/ }).first().click();
    await wide.getByLabel('Glucose now').fill('6.1');
    await wide.getByRole('button', { name: 'Check a dose', exact: true }).click();
    await wide.getByRole('button', { name: 'Save to the logbook' }).waitFor();
    await rig.shot(wide, 'wide-log-a-meal');
  });
});
