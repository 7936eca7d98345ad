import type { Page } from 'playwright-core';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';

let rig: BrowserRig;
let token: string;
beforeAll(async () => {
  rig = await startBrowserRig('dose');
  const res = await fetch(`${rig.baseUrl}/api/auth/sign-up`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'dose-check@example.test', displayName: 'Sam', password: 'a long kitchen passphrase' }),
  });
  token = ((await res.json()) as { token: string }).token;
});
afterAll(async () => {
  await rig?.close();
});

async function signedIn(viewport: { width: number; height: number }, path: string): Promise<Page> {
  const page = await rig.newPage(viewport);
  await page.goto(`${rig.baseUrl}/sign-in`);
  await rig.signIn(page, token);
  await page.goto(`${rig.baseUrl}${path}`);
  return page;
}

async function addDayKind(page: Page, name: string, ratio: string, factor: string) {
  await page.getByRole('link', { name: 'Add a day kind' }).first().click();
  await page.getByRole('heading', { name: 'New day kind' }).waitFor();
  await page.getByLabel('Name of this kind of day').fill(name);
  await page.getByLabel('Time of day 1 ratio').fill(ratio);
  await page.getByLabel('Time of day 1 correction factor').fill(factor);
  await rig.shot(page, `phone-new-day-kind-${name.toLowerCase().replace(/\W+/g, '-')}`);
  await page.getByRole('button', { name: 'Add day kind' }).click();
  await page.getByRole('heading', { name: 'Day kinds and ratios' }).waitFor();
  await page.getByRole('heading', { name, exact: true }).waitFor();
}

async function checkDose(page: Page, kind: string) {
  await page.getByRole('radio', { name: kind }).click();
  await page.getByRole('button', { name: 'Check a dose', exact: true }).click();
  await page.getByText(`ratio for ${kind},`).waitFor();
  await page.getByText('A calculation, not medical advice').scrollIntoViewIfNeeded();
}

describe('dose check in the browser', () => {
  it('sets units and two day kinds at phone width, then gives two different doses for the same carbohydrate', async () => {
    const page = await signedIn(PHONE, '/dose-check');

    await page.getByText('No dose can be suggested yet').waitFor();
    await rig.shot(page, 'phone-dose-check-not-set-up');
    await page.getByRole('link', { name: 'Set up ratios and limits' }).click();
    await page.getByRole('heading', { name: 'Settings', exact: true }).waitFor();
    await page.getByRole('link', { name: 'Units and safety limits' }).click();
    await page.getByRole('radio', { name: '0.5 unit' }).click();
    await page.getByLabel('Largest single dose').fill('15');
    await page.getByLabel('Insulin action time').fill('30');
    await page.getByLabel('Target range from').fill('5');
    await page.getByLabel('Target range to').fill('8');
    await page.getByLabel('Correct to').fill('6');
    await page.getByRole('button', { name: 'Save units and limits' }).click();
    await page.getByText('The action time must be 2 to 8 hours.').waitFor();
    await rig.shot(page, 'phone-units-error');
    await page.getByLabel('Insulin action time').fill('4');
    await page.getByRole('button', { name: 'Save units and limits' }).click();
    await page.getByRole('heading', { name: 'Settings', exact: true }).waitFor();

    await page.getByRole('link', { name: 'Day kinds and ratios' }).click();
    await page.getByText('No day kinds yet').waitFor();
    await addDayKind(page, 'Rest', '10', '2');
    await addDayKind(page, 'Long ride', '15', '3');
    await page.getByText('1 unit per 15 g carbohydrate').waitFor();
    await rig.shot(page, 'phone-day-kinds');

    await page.goto(`${rig.baseUrl}/`);
    await page.getByRole('link', { name: 'Check a dose' }).click();
    await page.getByRole('heading', { name: 'Check a dose' }).waitFor();
    await page.getByLabel('Carbohydrate (available)').fill('42');
    await page.getByLabel('Glucose now').fill('6');
    await page.getByLabel('Reading taken').fill('0');
    // T15 (check-values §12): 42 g at 10 g/U = 4.2 → 4.0 U; at 15 g/U = 2.8 → 2.5 U (round down to 0.5).
    await checkDose(page, 'Rest');
    const rest = await page.getByLabel('Suggested dose').innerText();
    await expect(page.getByText('A calculation, not medical advice').isVisible()).resolves.toBe(true);
    await rig.shot(page, 'phone-dose-rest');
    await checkDose(page, 'Long ride');
    const ride = await page.getByLabel('Suggested dose').innerText();
    await expect(page.getByText('A calculation, not medical advice').isVisible()).resolves.toBe(true);
    await rig.shot(page, 'phone-dose-long-ride');

    // Anchored on both sides so "14 units" or "4 units" inside "2.4 units" would not pass.
    expect(rest).toMatch(/(^|\s)4 units(\s|$)/);
    expect(ride).toMatch(/(^|\s)2\.5 units(\s|$)/);
    await page.getByText('Active insulin model: straight line over the action time (4 hours)', { exact: false }).waitFor();
    await expect(page.getByText('42 g ÷ 15 g per unit').isVisible()).resolves.toBe(true);

    await page.goto(`${rig.baseUrl}/settings/history`);
    await page.getByText('Sam set up day kind “Long ride”').waitFor();
    await page.getByText('Sam set up units and safety limits').waitFor();
    await rig.shot(page, 'phone-history');
  });

  it('shows the ratio table at wide width and a low glucose gives no dose', async () => {
    const page = await signedIn(WIDE, '/settings/day-kinds');

    await page.getByRole('table', { name: 'Rest ratios' }).waitFor();
    await rig.shot(page, 'wide-day-kinds-table');
    await page.goto(`${rig.baseUrl}/dose-check?carbs=55&portion=K7Q2&label=Lentil%20soup`);
    await page.getByText('For: Lentil soup (portion K7Q2)').waitFor();
    await page.getByLabel('Portion code (optional)').fill('ZZZZ9');
    await page.getByRole('button', { name: 'Use this portion' }).click();
    await page.getByText('No portion has that code.').waitFor();
    await page.getByLabel('Glucose now').fill('3.4');
    await page.getByLabel('Reading taken').fill('0');
    await page.getByRole('button', { name: 'Check a dose', exact: true }).click();
    await page.getByText('Treat the low first', { exact: false }).waitFor();
    await page.getByText('A calculation, not medical advice').scrollIntoViewIfNeeded();
    await rig.shot(page, 'wide-dose-low');

    await page.getByLabel('Glucose now').fill('11');
    await page.getByRole('button', { name: 'Check a dose', exact: true }).click();
    await page.getByText('How it adds up').waitFor();
    // By hand (Rest: 10 g per unit, 2 mmol/L per unit, correct to 6): 55 ÷ 10 = 5.5 + (11 − 6) ÷ 2 = 2.5 → 8 units.
    await expect(page.getByLabel('Suggested dose').innerText()).resolves.toMatch(/(^|\s)8 units(\s|$)/);
    await page.getByText('(11.0 mmol/L − 6.0 mmol/L) ÷ 2.0 mmol/L per unit').waitFor();
    await page.getByText('A calculation, not medical advice').scrollIntoViewIfNeeded();
    await rig.shot(page, 'wide-dose-correction');
    await expect(page.getByLabel('Carbohydrate (available)').inputValue()).resolves.toBe('55');
  });
});
