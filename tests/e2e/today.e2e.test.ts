import type { Page } from 'playwright-core';
import request from 'supertest';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('today');
});
afterAll(async () => {
  await rig?.close();
});

const localToday = () => {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
};

async function signUp(email: string, displayName: string) {
  const res = await request(rig.baseUrl).post('/api/auth/sign-up').send({ email, displayName, password: 'a long kitchen passphrase' });
  if (res.status !== 201) throw new Error(`sign-up: ${JSON.stringify(res.body)}`);
  return { token: res.body.token as string, profileId: res.body.me.profiles[0].id as number, auth: { Authorization: `Bearer ${res.body.token}` } };
}

/** Invented settings for the test (not anyone's real ratios): action time 4 h, Rest 10 g/U, Long ride 15 g/U. */
async function setUpDoseSettings(profileId: number, auth: Record<string, string>) {
  const settings = await request(rig.baseUrl)
    .put(`/api/profiles/${profileId}/settings`)
    .set(auth)
    .send(TEST_DOSE_SETTINGS);
  if (settings.status !== 200) throw new Error(`settings: ${JSON.stringify(settings.body)}`);
  for (const [name, ratio, isDefault] of [
    ['Rest', 10, true],
    ['Long ride', 15, false],
  ] as const) {
    const kind = await request(rig.baseUrl)
      .post(`/api/profiles/${profileId}/day-kinds`)
      .set(auth)
      .send({ name, isDefault, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: ratio, correctionFactor: 3 }] });
    if (kind.status !== 201) throw new Error(`day kind: ${JSON.stringify(kind.body)}`);
  }
}

/** One batch of three equal portions in the fridge. */
async function cookBatch(profileId: number, auth: Record<string, string>) {
  // Per 100 g, USDA SR Legacy via check-values §11 ([C2]): rolled oats 67.7 g total carbohydrate, 10.1 g fibre.
  const oats = await createFood(withAvailable(SR_LEGACY.oats));
  const recipe = await request(rig.baseUrl)
    .post('/api/recipes')
    .set(auth)
    .send({ title: 'Porridge base', defaultPortions: 3, ingredients: [{ foodId: oats.id, grams: 150 }] });
  if (recipe.status !== 201) throw new Error(`recipe: ${JSON.stringify(recipe.body)}`);
  const batch = await request(rig.baseUrl)
    .post(`/api/profiles/${profileId}/batches`)
    .set(auth)
    .send({
      recipeId: recipe.body.id,
      cookedOn: localToday(),
      storage: 'fridge',
      ingredients: [{ foodId: oats.id, plannedGrams: 150, actualGrams: 150 }],
      cookedWeight: { grossGrams: 900, tareGrams: 300 },
      split: { mode: 'equal', count: 3 },
    });
  if (batch.status !== 201) throw new Error(`batch: ${JSON.stringify(batch.body)}`);
}

async function signedIn(token: string, viewport: { width: number; height: number }, path: string): Promise<Page> {
  const page = await rig.newPage(viewport);
  await page.goto(`${rig.baseUrl}/sign-in`);
  await page.evaluate((t) => localStorage.setItem('carbwright.session', t), token);
  await page.goto(`${rig.baseUrl}${path}`);
  return page;
}

describe('Today in the browser', () => {
  let sam: Awaited<ReturnType<typeof signUp>>;
  beforeAll(async () => {
    sam = await signUp('today-sam@example.test', 'Sam');
    await setUpDoseSettings(sam.profileId, sam.auth);
    await cookBatch(sam.profileId, sam.auth);
  });

  it('switches today to another day kind on a phone, and the dose check for a fridge portion uses its ratio and adds up two earlier doses', async () => {
    const page = await signedIn(sam.token, PHONE, '/');
    const kindNow = page.getByLabel('Today’s kind of day', { exact: true });
    await kindNow.waitFor();
    await expect(kindNow.innerText()).resolves.toBe('Rest');
    await page.getByText('Your default kind of day.', { exact: false }).waitFor();
    await page.getByText('In the fridge and freezer').waitFor();
    // By hand: available carbohydrate 67.7 − 10.1 = 57.6 g per 100 g (USDA SR Legacy, check-values §11);
    // 150 g × 57.6 / 100 ÷ 3 portions = 28.8 g per portion, shown to whole grams at 10 g and above: "29 g".
    await page.getByText('29 g', { exact: true }).first().waitFor();
    await expect(page.getByRole('link', { name: /^Check a dose for Porridge base/ }).count()).resolves.toBe(3);
    await rig.shot(page, 'phone-today-rest');

    await page.getByRole('radio', { name: 'Long ride' }).click();
    await page.getByText('Chosen for today.', { exact: false }).waitFor();
    await expect(kindNow.innerText()).resolves.toBe('Long ride');
    await rig.shot(page, 'phone-today-long-ride');
    const days = await request(rig.baseUrl).get(`/api/profiles/${sam.profileId}/days?from=${localToday()}&to=${localToday()}`).set(sam.auth);
    expect(days.body.days[0]).toMatchObject({ dayKindName: 'Long ride', isSet: true });

    await page.getByRole('link', { name: /^Check a dose for Porridge base/ }).first().click();
    await page.getByRole('heading', { name: 'Check a dose' }).waitFor();
    await page.getByText('For: Porridge base (portion', { exact: false }).waitFor();
    await expect(page.getByLabel('Carbohydrate (available)').inputValue()).resolves.toBe('28.8');
    await expect(page.getByRole('radio', { name: 'Long ride' }).getAttribute('aria-checked')).resolves.toBe('true');
    await page.getByLabel('Glucose now').fill('11');
    await page.getByLabel('Reading taken').fill('0');

    await page.getByRole('button', { name: 'Add an earlier dose' }).click();
    await page.getByLabel('Earlier dose 1', { exact: true }).fill('2');
    await page.getByLabel('Dose 1 taken').fill('30');
    await page.getByRole('button', { name: 'Add another earlier dose' }).click();
    await page.getByLabel('Earlier dose 2', { exact: true }).fill('1');
    await page.getByLabel('Dose 2 taken').fill('abc');
    await page.getByRole('button', { name: 'Check a dose', exact: true }).click();
    await page.getByText('Enter how long ago, 0 to 1440 minutes.').waitFor();
    await rig.shot(page, 'phone-dose-earlier-error');
    await page.getByLabel('Dose 2 taken').fill('90');
    await page.getByRole('button', { name: 'Add another earlier dose' }).click();
    await page.getByLabel('Earlier dose 3', { exact: true }).fill('5');
    await page.getByRole('button', { name: 'Remove earlier dose 3' }).click();
    await expect(page.getByLabel('Earlier dose 3', { exact: true }).count()).resolves.toBe(0);

    await page.getByRole('button', { name: 'Check a dose', exact: true }).click();
    await page.getByText('ratio for Long ride,', { exact: false }).waitFor();
    // Both doses count, by hand on the default straight line over a 4 h action time (240 minutes):
    // 2 units × (1 − 30/240) = 1.75 plus 1 unit × (1 − 90/240) = 0.625 → 2.375, shown as "2.38 units" (the first alone: 1.75).
    await page.getByText('2.38 units from earlier doses', { exact: false }).waitFor();
    await page.getByText('Active insulin model: straight line over the action time (4 hours)', { exact: false }).waitFor();
    await expect(page.getByText('A calculation, not medical advice').isVisible()).resolves.toBe(true);
    await page.getByText('Insulin still active').scrollIntoViewIfNeeded();
    await rig.shot(page, 'phone-dose-two-earlier-doses');
  });

  it('shows the day kind and the fridge side by side at wide width, and honest empty states for a new profile', async () => {
    const page = await signedIn(sam.token, WIDE, '/');
    await page.getByLabel('Today’s kind of day', { exact: true }).waitFor();
    await page.getByText('In the fridge and freezer').waitFor();
    const kindBox = await page.getByLabel('Kind of day', { exact: true }).boundingBox();
    const fridgeBox = await page.getByLabel('In the fridge and freezer', { exact: true }).boundingBox();
    expect(kindBox && fridgeBox && fridgeBox.x > kindBox.x + kindBox.width).toBe(true);
    await rig.shot(page, 'wide-today');

    await page.getByRole('button', { name: 'Back to the default kind' }).click();
    await page.getByText('Your default kind of day.', { exact: false }).waitFor();
    await expect(page.getByLabel('Today’s kind of day', { exact: true }).innerText()).resolves.toBe('Rest');

    const newcomer = await signUp('today-new@example.test', 'Noor');
    const fresh = await signedIn(newcomer.token, WIDE, '/');
    await fresh.getByText('No day kinds yet').waitFor();
    await fresh.getByText('Nothing cooked in the fridge or freezer').waitFor();
    await expect(fresh.getByRole('link', { name: 'Check a dose' }).isVisible()).resolves.toBe(true);
    await rig.shot(fresh, 'wide-today-empty');
    await fresh.getByRole('link', { name: 'Set up day kinds' }).click();
    await fresh.getByRole('heading', { name: 'Settings', exact: true }).waitFor();
  });
});
