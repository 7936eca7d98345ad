import request from 'supertest';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { createFoods, withAvailable } from '../helpers/foods';
import type { Page } from 'playwright-core';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('kitchen');
});
afterAll(async () => {
  await rig?.close();
});

// Per 100 g, USDA SR Legacy via check-values §11 ([C2]) and §2.4 ([D]).
const FOODS = [
  { name: 'Oats, rolled, dry', carbTotal: 67.7, fibre: 10.1, planned: 250, reading: '252' },
  { name: 'Milk, whole', carbTotal: 4.8, fibre: 0, planned: 500, reading: '496' },
  { name: 'Yogurt, Greek, plain, nonfat', carbTotal: 3.6, fibre: 0, planned: 250, reading: '247' },
  { name: 'Apple, raw, with skin', carbTotal: 13.81, fibre: 2.4, planned: 150, reading: '163' },
];
const WEIGHED_PORTIONS = [
  ['212', '438'],
  ['215', '441'],
  ['209', '436'],
  ['213', '440'],
  ['211', '437'],
];

async function setUpCook() {
  const email = 'kitchen-cook@example.test';
  const password = 'a long kitchen passphrase';
  const signUp = await request(rig.baseUrl).post('/api/auth/sign-up').send({ email, displayName: 'Ada', password });
  const auth = { Authorization: `Bearer ${signUp.body.token}` };
  const foods = await createFoods(FOODS.map((f) => withAvailable({ name: f.name, carbTotal: f.carbTotal, fibre: f.fibre })));
  const recipe = await request(rig.baseUrl)
    .post('/api/recipes')
    .set(auth)
    .send({ title: 'Overnight oats', defaultPortions: 5, ingredients: foods.map((f, i) => ({ foodId: f.id, grams: FOODS[i].planned })) });
  if (recipe.status !== 201) throw new Error(`recipe: ${JSON.stringify(recipe.body)}`);
  await request(rig.baseUrl).post(`/api/profiles/${signUp.body.me.profiles[0].id}/containers`).set(auth).send({ name: 'Mixing bowl', kind: 'pot', tareGrams: 480 });
  return { email, password };
}

async function signIn(page: Page, email: string, password: string) {
  await page.goto(`${rig.baseUrl}/sign-in`);
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${rig.baseUrl}/`);
}

describe('the kitchen in the browser', () => {
  let cook: { email: string; password: string };
  beforeAll(async () => {
    cook = await setUpCook();
  });

  it('cooks a batch on a phone: weighing checklist, pot, five weighed portions, label sheet, portion page', async () => {
    const page = await rig.newPage(PHONE);
    await signIn(page, cook.email, cook.password);

    await page.getByRole('tab', { name: 'Kitchen' }).click();
    await page.getByRole('heading', { name: 'Kitchen', exact: true }).waitFor();
    await page.getByRole('button', { name: 'Cook a batch' }).click();
    await page.getByRole('button', { name: 'Cook Overnight oats' }).click();
    await page.getByText('Ingredient 1 of 4').waitFor();
    await rig.shot(page, 'phone-weighing-first');
    for (const [i, f] of FOODS.entries()) {
      await page.getByText(`Ingredient ${i + 1} of 4`).waitFor();
      await page.getByLabel('Scale reading').fill(f.reading);
      if (i === 3) {
        await page.getByText('+13 g').waitFor();
        await rig.shot(page, 'phone-weighing-difference');
        await page.getByRole('button', { name: 'All weighed: weigh the pot' }).click();
      } else await page.getByRole('button', { name: 'Next ingredient' }).click();
    }

    await page.getByRole('radio', { name: /Mixing bowl/ }).click();
    await page.getByLabel('Pot with the food (gross)').fill('1612');
    // Hand calculation (tests/shared/batch.test.ts): 1612 − 480 = 1132 g; 196.4503 g available → 17 g/100 g.
    await page.getByText('1132 g').first().waitFor();
    await page.getByText('0.98').waitFor();
    await rig.shot(page, 'phone-pot');
    await page.getByRole('button', { name: 'Portion out', exact: true }).click();

    for (const [i, [tare, gross]] of WEIGHED_PORTIONS.entries()) {
      if (i > 0) await page.getByRole('button', { name: 'Add a container' }).click();
      await page.getByLabel(`Empty container ${i + 1} (tare)`).fill(tare);
      await page.getByLabel(`Full container ${i + 1} (gross)`).fill(gross);
    }
    await page.getByText('Left to portion out: 0 g of 1132 g').waitFor();
    await page.getByText('Net 226 g · 39 g').first().waitFor();
    await rig.shot(page, 'phone-split');
    await page.getByRole('button', { name: 'Storage and use-by' }).click();
    await page.getByText(/Default \d{4}-\d{2}-\d{2}\. /).waitFor();
    await rig.shot(page, 'phone-storage');
    await page.getByRole('button', { name: 'Save batch and portions' }).click();

    await page.waitForURL(/\/kitchen\/batches\/\d+$/);
    await page.getByRole('heading', { name: 'Portions' }).waitFor();
    await page.getByText('226 g · 39 g', { exact: true }).first().waitFor();
    await rig.shot(page, 'phone-batch');
    await page.getByRole('button', { name: 'Print labels' }).first().click();
    await page.waitForURL(/\/batches\/\d+\/labels$/);
    const labels = page.getByRole('listitem').filter({ hasText: 'Overnight oats' });
    await labels.first().waitFor();
    expect(await labels.count()).toBe(5);
    expect(await page.getByRole('img', { name: /QR code for http/ }).count()).toBe(5);
    await page.getByText('39 g carbohydrate (available)', { exact: true }).first().waitFor();
    await rig.shot(page, 'phone-labels');
    await page.emulateMedia({ media: 'print' });
    await page.getByRole('heading', { name: 'Labels: Overnight oats' }).waitFor({ state: 'hidden' });
    expect(await labels.count()).toBe(5);
    await rig.shot(page, 'phone-labels-print');
    await page.emulateMedia({ media: 'screen' });

    const firstLabel = (await labels.first().getAttribute('aria-label'))!.replace('Label ', '');
    await page.goto(`${rig.baseUrl}/portions/${firstLabel.replace('-', '')}`);
    await page.getByText('Carbohydrate in this portion').waitFor();
    await page.getByRole('button', { name: 'Check a dose for this' }).waitFor();
    await rig.shot(page, 'phone-portion');
    await page.getByRole('button', { name: 'Mark eaten' }).click();
    await page.getByText('Already eaten').waitFor();
  });

  it('shows the inventory beside the code finder and containers on a wide screen', async () => {
    const page = await rig.newPage(WIDE);
    await signIn(page, cook.email, cook.password);

    await page.goto(`${rig.baseUrl}/kitchen`);
    await page.getByText('Fridge and freezer').waitFor();
    await page.getByText(/4 left, 1 eaten, 0 thrown away/).waitFor();
    await page.getByLabel('Code on the label').fill('nope');
    await page.getByRole('button', { name: 'Open portion' }).click();
    await page.getByText('A portion code has 6 letters and digits').waitFor();
    await rig.shot(page, 'wide-kitchen');
  });
});
