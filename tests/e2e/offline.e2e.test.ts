import request from 'supertest';
import { PHONE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { createFood, SR_LEGACY, withAvailable } from '../helpers/foods';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('offline');
});
afterAll(async () => {
  await rig?.close();
});

const COPY_KEY = 'carbwright.offline-copy';
const dateIn = (d: Date) => `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;

/** Every "HH:MM" a clock in the zone showed between two instants: what the stamp may say. */
function minutesBetween(from: number, to: number, timeZone: string): string[] {
  const f = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
  const out = new Set<string>();
  for (let t = from - 60_000; t <= to + 60_000; t += 30_000) out.add(f.format(t));
  return [...out];
}

/** Dana: two day kinds (Rest by default) and one batch of two oat portions in the fridge, all made through the API. */
async function danaWithAFridge() {
  const res = await request(rig.baseUrl).post('/api/auth/sign-up').send({ email: 'offline-dana@example.test', displayName: 'Dana', password: 'a long kitchen passphrase' });
  if (res.status !== 201) throw new Error(`sign-up: ${JSON.stringify(res.body)}`);
  const token = res.body.token as string;
  const profile = res.body.me.profiles[0] as { id: number; timeZone: string };
  const auth = { Authorization: `Bearer ${token}` };
  // Invented ratios for the test, not anyone's real settings.
  for (const [name, ratio, isDefault] of [['Rest', 12, true], ['Swim day', 18, false]] as const) {
    const kind = await request(rig.baseUrl)
      .post(`/api/profiles/${profile.id}/day-kinds`)
      .set(auth)
      .send({ name, isDefault, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: ratio, correctionFactor: 2.5 }] });
    if (kind.status !== 201) throw new Error(`day kind: ${JSON.stringify(kind.body)}`);
  }
  const oats = await createFood(withAvailable(SR_LEGACY.oats));
  const recipe = await request(rig.baseUrl).post('/api/recipes').set(auth).send({ title: 'Offline oat bake', defaultPortions: 2, ingredients: [{ foodId: oats.id, grams: 100 }] });
  if (recipe.status !== 201) throw new Error(`recipe: ${JSON.stringify(recipe.body)}`);
  const batch = await request(rig.baseUrl)
    .post(`/api/profiles/${profile.id}/batches`)
    .set(auth)
    .send({
      recipeId: recipe.body.id,
      cookedOn: dateIn(new Date()),
      storage: 'fridge',
      ingredients: [{ foodId: oats.id, plannedGrams: 100, actualGrams: 100 }],
      cookedWeight: { grossGrams: 500, tareGrams: 200 },
      split: { mode: 'equal', count: 2 },
    });
  if (batch.status !== 201) throw new Error(`batch: ${JSON.stringify(batch.body)}`);
  return { token, profile, auth };
}

describe('offline in the browser', () => {
  it('opens Today and the fridge list offline from the copy, refuses the dose check and writes, and keeps nothing after sign-out', async () => {
    const dana = await danaWithAFridge();
    const page = await rig.newPage(PHONE, { serviceWorkers: 'allow' });
    await page.goto(`${rig.baseUrl}/sign-in`);
    await rig.signIn(page, dana.token);

    const started = Date.now();
    await page.goto(`${rig.baseUrl}/`);
    await page.getByLabel('Today’s kind of day', { exact: true }).waitFor();
    await page.getByRole('listitem', { name: /^Offline oat bake, portion/ }).first().waitFor();
    await page.getByRole('tab', { name: 'Kitchen' }).click();
    await page.getByRole('heading', { name: 'Fridge and freezer' }).waitFor();
    await page.getByText('Offline oat bake').filter({ visible: true }).first().waitFor();
    // The app shell is cached once the service worker controls the page; the copy is written just after the fetches.
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    await page.waitForFunction(() => !!navigator.serviceWorker.controller);
    // Both lists are in it: Today's (portions not eaten yet) and the kitchen's (every batch).
    await page.waitForFunction((key) => /"include":"available".*"include":"all"|"include":"all".*"include":"available"/s.test(localStorage.getItem(key) ?? ''), COPY_KEY);
    const fetched = Date.now();

    await page.context().setOffline(true);
    await page.reload();
    await page.getByRole('heading', { name: 'Fridge and freezer' }).waitFor();
    const kitchenStamp = page.getByText(/^. Offline — as of \d\d:\d\d$/).filter({ visible: true });
    await kitchenStamp.waitFor();
    await page.getByText('Offline oat bake').filter({ visible: true }).first().waitFor();
    await rig.shot(page, 'phone-kitchen-offline');

    await page.goto(`${rig.baseUrl}/`);
    const stamp = page.getByText(/^. Offline — as of \d\d:\d\d$/).filter({ visible: true });
    await stamp.waitFor();
    const time = (await stamp.innerText()).slice(-5);
    expect(minutesBetween(started, fetched, dana.profile.timeZone)).toContain(time);
    await page.getByRole('listitem', { name: /^Offline oat bake, portion/ }).first().waitFor();
    const kindNow = page.getByLabel('Today’s kind of day', { exact: true });
    await expect(kindNow.innerText()).resolves.toBe('Rest');
    await rig.shot(page, 'phone-today-offline');

    // A write made offline says it was not saved, and was not.
    await page.getByRole('radio', { name: 'Swim day' }).click();
    await page.getByText('Not saved: you are offline.', { exact: false }).waitFor();
    await expect(kindNow.innerText()).resolves.toBe('Rest');
    const today = dateIn(new Date());
    const days = await request(rig.baseUrl).get(`/api/profiles/${dana.profile.id}/days?from=${today}&to=${today}`).set(dana.auth);
    expect(days.body.days[0]).toMatchObject({ isSet: false });
    await rig.shot(page, 'phone-today-offline-not-saved');

    // No dose check offline: the refusal, and no form to work one out.
    await page.getByRole('link', { name: 'Check a dose', exact: true }).first().click();
    await page.getByText('Offline: no dose is worked out').waitFor();
    await expect(page.getByRole('button', { name: 'Check a dose', exact: true }).count()).resolves.toBe(0);
    await expect(page.getByLabel('Glucose now').count()).resolves.toBe(0);
    await rig.shot(page, 'phone-dose-check-offline');

    // Back online: fresh data, no stamp, and the same write saves.
    await page.context().setOffline(false);
    await page.goto(`${rig.baseUrl}/`);
    await page.getByRole('listitem', { name: /^Offline oat bake, portion/ }).first().waitFor();
    await page.getByRole('radio', { name: 'Swim day' }).click();
    await page.getByText('Chosen for today.', { exact: false }).waitFor();
    await expect(page.getByText(/Offline — as of/).count()).resolves.toBe(0);

    // Sign out: the copy is gone, and offline the app shows sign-in and nothing of Dana's.
    await page.getByRole('tab', { name: 'You' }).click();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await expect(page.evaluate((key) => localStorage.getItem(key), COPY_KEY)).resolves.toBeNull();
    await page.context().setOffline(true);
    await page.goto(`${rig.baseUrl}/`);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    const text = await page.locator('body').innerText();
    expect(text).not.toContain('Offline oat bake');
    expect(text).not.toContain('Dana');
    expect(text).not.toContain('Swim day');
    await rig.shot(page, 'phone-signed-out-offline');
    // One walk through online, offline, online and signed out: longer than the default test time on a shared machine.
  }, 300_000);
});
