import request from 'supertest';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('plan');
});
afterAll(async () => {
  await rig?.close();
});

/** Monday of this week (UTC, the new profile's time zone) and the days after it. */
function thisWeek(): string[] {
  const now = new Date();
  const back = (now.getUTCDay() + 6) % 7;
  const monday = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() - back);
  return Array.from({ length: 7 }, (_, i) => new Date(monday + i * 86_400_000).toISOString().slice(0, 10));
}

/** A member with invented settings (rest 10 g/unit by default, training 15 g/unit), a recipe and five jars of overnight oats in the fridge. */
async function setUpHousehold() {
  const res = await request(rig.baseUrl).post('/api/auth/sign-up').send({ email: 'plan-pat@example.test', displayName: 'Pat', password: 'a long kitchen passphrase' });
  const auth = { Authorization: `Bearer ${res.body.token}` };
  const profileId = res.body.me.profiles[0].id as number;
  const api = (method: 'post' | 'put', path: string, body: object) => request(rig.baseUrl)[method](`/api/profiles/${profileId}${path}`).set(auth).send(body);
  await api('put', '/settings', TEST_DOSE_SETTINGS).expect(200);
  for (const [name, carbRatio, isDefault, longActingUnits] of [['Rest', 10, true, 14], ['Training', 15, false, 12]] as const) {
    await api('post', '/day-kinds', { name, isDefault, longActingUnits, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio, correctionFactor: 2 }] }).expect(201);
  }
  // Per 100 g, USDA SR Legacy via check-values §11: rolled oats 67.7 g total, 10.1 g fibre; whole milk 4.8 g.
  const [oats, milk] = await Promise.all([createFood(withAvailable(SR_LEGACY.oats)), createFood(withAvailable(SR_LEGACY.wholeMilk))]);
  const recipe = await request(rig.baseUrl).post('/api/recipes').set(auth).send({ title: 'Overnight oats', defaultPortions: 5, ingredients: [{ foodId: oats.id, grams: 250 }, { foodId: milk.id, grams: 500 }] });
  const week = thisWeek();
  await api('post', '/batches', {
    recipeId: recipe.body.id, cookedOn: week[0], storage: 'fridge', useBy: week[6],
    ingredients: [{ foodId: oats.id, plannedGrams: 250, actualGrams: 250 }, { foodId: milk.id, plannedGrams: 500, actualGrams: 500 }],
    cookedWeight: { grossGrams: 1250, tareGrams: 500 },
    split: { mode: 'equal', count: 5 },
  }).expect(201);
  return { token: res.body.token as string, week };
}

describe('the week plan in the browser', () => {
  let pat: Awaited<ReturnType<typeof setUpHousehold>>;
  beforeAll(async () => {
    pat = await setUpHousehold();
  });

  it('at phone width plans a week from an empty plan: weekly pattern, five breakfasts from one batch, one planned cook', async () => {
    const page = await rig.newPage(PHONE);
    await rig.signIn(page, pat.token);
    await page.goto(`${rig.baseUrl}/plan`);
    await page.getByText('No meals planned.').waitFor();
    await rig.shot(page, 'phone-1-empty');

    await page.getByRole('link', { name: 'Weekly pattern and meals' }).click();
    for (const day of ['Tuesday', 'Thursday']) await page.getByRole('radiogroup', { name: day }).getByRole('radio', { name: 'Training' }).click();
    await rig.shot(page, 'phone-2-pattern');
    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByRole('link', { name: 'Plan a cook' }).waitFor();

    await page.getByRole('link', { name: 'Plan a cook' }).click();
    await page.getByRole('radio', { name: 'Overnight oats' }).click();
    await page.getByLabel('Cook on').fill(pat.week[5]);
    await page.getByRole('button', { name: 'Plan this cook' }).click();
    await page.getByText(/To cook: Overnight oats, 4 portions/).waitFor();

    await page.getByRole('link', { name: 'Plan a meal' }).click();
    await page.getByLabel('Date').fill(pat.week[0]);
    await page.getByRole('radio', { name: /Overnight oats · .* · 34 g/ }).first().click();
    await page.getByLabel('Days in a row').fill('5');
    await rig.shot(page, 'phone-3-place-portions');
    await page.getByRole('button', { name: 'Plan this meal' }).click();
    await page.getByText(/Overnight oats: 5 of 5 portions placed, 0 left/).waitFor();

    // Monday: a rest day by default. 250 g oats × 0.576 + 500 g milk × 0.048 = 168 g in five jars = 33.6 g each
    // (SR Legacy, check-values §11); 33.6 ÷ 10 = 3.36 → 3 units on the 0.5-unit pen rounded down (TEST_DOSE_SETTINGS).
    const before = page.getByRole('button', { name: '‹ Day before' });
    for (let i = 0; i < 6 && (await before.getAttribute('aria-disabled')) !== 'true'; i += 1) await before.click();
    await page.getByText('Rest (default)').waitFor();
    await page.getByText('Carbohydrate: 34 g').waitFor();
    await page.getByText('Planned dose: 3 units (1 unit per 10 g)').waitFor();
    await page.getByText('Planned dose — meal part only; glucose unknown until you eat.').waitFor();
    await rig.shot(page, 'phone-4-monday');
    // Tuesday: training from the weekly pattern: 33.6 ÷ 15 = 2.24 → 2 units.
    await page.getByRole('button', { name: 'Day after ›' }).click();
    await page.getByText('Training (weekly pattern)').waitFor();
    await page.getByText('Planned dose: 2 units (1 unit per 15 g)').waitFor();
    await rig.shot(page, 'phone-5-tuesday');

    // A food by grams on Sunday, found with the food search: 40 g rolled oats × 57.6 g available per 100 g (SR Legacy
    // 67.7 − 10.1, check-values §11) = 23.04 g → 23 g; a rest day by default: 2.304 → 2 units (rounded down).
    await page.getByRole('link', { name: 'Plan a meal' }).click();
    await page.getByLabel('Date').fill(pat.week[6]);
    await page.getByRole('radio', { name: 'A food by grams (a pack food or one from the tables)' }).click();
    await page.getByLabel('Food', { exact: true }).fill('Oats, rolled');
    await page.getByRole('button', { name: `Plan ${SR_LEGACY.oats.name}` }).first().click();
    await page.getByRole('textbox', { name: 'Grams', exact: true }).fill('40');
    await rig.shot(page, 'phone-6-food-by-grams');
    await page.getByRole('button', { name: 'Plan this meal' }).click();
    const after = page.getByRole('button', { name: 'Day after ›' });
    await after.waitFor();
    for (let i = 0; i < 6 && (await after.getAttribute('aria-disabled')) !== 'true'; i += 1) await after.click();
    await page.getByText(`${SR_LEGACY.oats.name} — 40 g`).waitFor();
    await page.getByText('Carbohydrate: 23 g').waitFor();
    await page.getByText('Planned dose: 2 units (1 unit per 10 g)').waitFor();
    await page.close();
  });

  it('at wide width shows the week as seven columns with day totals', async () => {
    const page = await rig.newPage(WIDE);
    await rig.signIn(page, pat.token);
    await page.goto(`${rig.baseUrl}/plan`);
    const week = page.getByLabel('The week');
    await week.getByLabel('Day totals').first().waitFor();
    expect(await week.getByLabel('Day totals').count()).toBe(7);
    const boxes = await Promise.all((await week.getByLabel('Day totals').all()).map((b) => b.boundingBox()));
    // Seven columns side by side: each day starts to the right of the one before.
    expect(boxes.every((b, i) => i === 0 || b!.x > boxes[i - 1]!.x)).toBe(true);
    // Monday and Wednesday are rest days (3 units each), Tuesday a training day (2 units): Monday's column says so.
    await week.getByText('Planned rapid-acting 3 units').first().waitFor();
    await rig.shot(page, 'wide-week');
    await page.close();
  });
});
