import type { Page } from 'playwright-core';
import request from 'supertest';
import { UserModel } from '../../server/models';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';
import { insertFood } from '../server/recipes-helpers';
import { overflowingElements, seriousAxeViolations, settled, smallTapTargets } from '../helpers/page-checks';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('shell');
});
afterAll(async () => {
  await rig?.close();
});

type Ids = { recipe: number; batch: number; portion: string; kind: number; food: number };

/** Every signed-in screen, by a short name, with its address. */
const PLACES: { name: string; path: (ids: Ids) => string }[] = [
  { name: 'today', path: () => '/' },
  { name: 'recipes', path: () => '/recipes' },
  { name: 'recipe', path: (i) => `/recipes/${i.recipe}` },
  { name: 'recipe-edit', path: (i) => `/recipes/${i.recipe}/edit` },
  { name: 'recipe-new', path: () => '/recipes/new' },
  { name: 'kitchen', path: () => '/kitchen' },
  { name: 'cook', path: (i) => `/kitchen/cook/${i.recipe}` },
  { name: 'batch', path: (i) => `/kitchen/batches/${i.batch}` },
  { name: 'labels', path: (i) => `/batches/${i.batch}/labels` },
  { name: 'portion', path: (i) => `/portions/${i.portion}` },
  { name: 'dose-check', path: () => '/dose-check' },
  { name: 'plan', path: () => '/plan' },
  { name: 'plan-settings', path: () => '/plan/settings' },
  { name: 'plan-meal', path: () => '/plan/meal?date=2026-03-09' },
  { name: 'plan-cook', path: () => '/plan/cook?date=2026-03-09' },
  { name: 'shopping-list', path: () => '/plan/shopping?date=2026-03-09' },
  { name: 'plan-print', path: () => '/plan/print?date=2026-03-09' },
  { name: 'you', path: () => '/more' },
  { name: 'password', path: () => '/more/password' },
  { name: 'email', path: () => '/more/email' },
  { name: 'confirm-email', path: () => '/confirm-email?token=not-a-real-token' },
  { name: 'new-profile', path: () => '/more/new-profile' },
  { name: 'settings', path: () => '/settings' },
  { name: 'units', path: () => '/settings/units' },
  { name: 'history', path: () => '/settings/history' },
  { name: 'day-kinds', path: () => '/settings/day-kinds' },
  { name: 'day-kind', path: (i) => `/settings/day-kinds/${i.kind}` },
  { name: 'foods', path: () => '/foods' },
  { name: 'food', path: (i) => `/foods/${i.food}` },
  { name: 'food-new', path: () => '/foods/new' },
  { name: 'imports', path: () => '/admin/imports' },
  { name: 'admin', path: () => '/admin' },
  { name: 'accounts', path: () => '/admin/accounts' },
  { name: 'outbox', path: () => '/admin/outbox' },
  { name: 'audit', path: () => '/admin/audit' },
  { name: 'logbook', path: () => '/logbook' },
  { name: 'log-add', path: () => '/logbook/add' },
  { name: 'ratio-review', path: () => '/logbook/review' },
  { name: 'readings-import', path: () => '/logbook/import' },
  { name: 'review-sheet', path: () => '/logbook/print' },
  { name: 'people', path: () => '/more/people' },
  { name: 'desk', path: () => '/desk' },
];

const SIGNED_OUT = ['/sign-in', '/sign-up'];

/** An admin with settings, a day kind, a food, a recipe and a cooked batch, so that every page has something to show. */
async function setUpHousehold() {
  const email = 'shell-admin@example.test';
  const signUp = await request(rig.baseUrl).post('/api/auth/sign-up').send({ email, displayName: 'Robin', password: 'a long kitchen passphrase' });
  if (signUp.status !== 201) throw new Error(`sign-up: ${JSON.stringify(signUp.body)}`);
  await UserModel.update({ role: 'admin' }, { where: { email } });
  const token = signUp.body.token as string;
  const profileId = signUp.body.me.profiles[0].id as number;
  const auth = { Authorization: `Bearer ${token}` };
  const ok = (res: request.Response, what: string) => {
    if (res.status >= 300) throw new Error(`${what}: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body;
  };
  ok(await request(rig.baseUrl).put(`/api/profiles/${profileId}/settings`).set(auth).send(TEST_DOSE_SETTINGS), 'settings');
  const kind = ok(
    await request(rig.baseUrl)
      .post(`/api/profiles/${profileId}/day-kinds`)
      .set(auth)
      .send({ name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l', timesOfDay: [{ from: '00:00', to: '24:00', carbRatio: 10, correctionFactor: 3 }] }),
    'day kind',
  );
  // Invented round values: the checks here are about layout, not numbers.
  const food = { id: await insertFood({ name: 'Rice, long grain, cooked, with a deliberately long name to test wrapping', carbTotal: 28.4, fibre: 0.4, carbAvailable: 28 }) };
  const recipe = ok(
    await request(rig.baseUrl)
      .post('/api/recipes')
      .set(auth)
      .send({ title: 'Rice pot for the week', defaultPortions: 4, ingredients: [{ foodId: food.id, grams: 400 }] }),
    'recipe',
  );
  const d = new Date();
  const today = `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
  const batch = ok(
    await request(rig.baseUrl)
      .post(`/api/profiles/${profileId}/batches`)
      .set(auth)
      .send({
        recipeId: recipe.id,
        cookedOn: today,
        storage: 'fridge',
        ingredients: [{ foodId: food.id, plannedGrams: 400, actualGrams: 400 }],
        cookedWeight: { grossGrams: 1000, tareGrams: 200 },
        split: { mode: 'equal', count: 4 },
      }),
    'batch',
  );
  return { token, ids: { recipe: recipe.id as number, batch: batch.id as number, portion: batch.portions[0].code as string, kind: kind.id as number, food: food.id } };
}

async function signedInPage(token: string, viewport: { width: number; height: number }): Promise<Page> {
  const page = await rig.newPage(viewport);
  await page.goto(`${rig.baseUrl}/sign-in`);
  await rig.signIn(page, token);
  return page;
}

/** Opens an address, waits for it to settle and keeps a screenshot. */
async function visit(page: Page, path: string, shot: string) {
  await page.goto(`${rig.baseUrl}${path}`);
  await settled(page);
  await rig.shot(page, shot);
}

/** What a phone-width page must not have: anything past the right edge, small tap targets, serious axe findings. */
async function phoneFindings(page: Page) {
  return [
    ...(await overflowingElements(page)).map((f) => `runs past the edge: ${f}`),
    ...(await smallTapTargets(page)).map((f) => `small target: ${f}`),
    ...(await seriousAxeViolations(page)),
  ];
}

describe('one shell for every screen', () => {
  let ids: Ids;
  let token: string;
  let wide: Page;
  let phone: Page;
  let signedOut: Page;
  beforeAll(async () => {
    ({ token, ids } = await setUpHousehold());
    [wide, phone, signedOut] = await Promise.all([signedInPage(token, WIDE), signedInPage(token, PHONE), rig.newPage(PHONE)]);
  });

  it.each(SIGNED_OUT)('at 390 × 844 %s stays inside the screen, with large tap targets and no serious axe finding', async (path) => {
    await visit(signedOut, path, `phone${path.replace(/\//g, '-')}`);
    await expect(phoneFindings(signedOut)).resolves.toEqual([]);
  });

  it.each(PLACES)('at 390 × 844 $name stays inside the screen under the tab bar, with large tap targets and no serious axe finding', async ({ name, path }) => {
    await visit(phone, path(ids), `phone-${name}`);
    const findings = await phoneFindings(phone);
    if ((await phone.getByRole('navigation', { name: 'Main' }).getByRole('tab').count()) !== 5) findings.push('no tab bar');
    expect(findings).toEqual([]);
  });

  it.each(PLACES)('at 1440 × 900 $name sits in the shell: navigation with the name outside the tab list, one main, no serious axe finding', async ({ name, path }) => {
    await visit(wide, path(ids), `wide-${name}`);
    const findings: string[] = [];
    const nav = wide.getByRole('navigation', { name: 'Main' });
    if (!(await nav.isVisible())) findings.push('no navigation');
    else {
      if ((await nav.getByRole('tab').count()) !== 5) findings.push('navigation without its five tabs');
      if ((await wide.getByRole('tablist').getByText('Carbwright').count()) !== 0) findings.push('the name inside the tab list');
      if (!(await nav.getByText('Carbwright', { exact: true }).isVisible())) findings.push('no name in the navigation');
    }
    if ((await wide.getByRole('main').count()) !== 1) findings.push('not exactly one main landmark');
    findings.push(...(await seriousAxeViolations(wide)));
    expect(findings).toEqual([]);
  });

  it('lights the area a page outside the tab bar belongs to, and its tab returns to that area', async () => {
    await wide.goto(`${rig.baseUrl}/settings/units`);
    await settled(wide);
    await expect(wide.getByRole('tab', { name: 'You' }).getAttribute('aria-selected')).resolves.toBe('true');
    await expect(wide.getByRole('tab', { name: 'Today' }).getAttribute('aria-selected')).resolves.toBe('false');
    await wide.getByRole('tab', { name: 'Kitchen' }).click();
    await wide.waitForURL(`${rig.baseUrl}/kitchen`);
    await wide.goto(`${rig.baseUrl}/dose-check`);
    await settled(wide);
    await expect(wide.getByRole('tab', { name: 'Today' }).getAttribute('aria-selected')).resolves.toBe('true');
    await wide.getByRole('tab', { name: 'Recipes' }).click();
    await wide.waitForURL(`${rig.baseUrl}/recipes`);
    await wide.getByRole('heading', { name: 'Recipes', exact: true }).waitFor();
  });

  it('prints the label sheet without the navigation', async () => {
    await wide.goto(`${rig.baseUrl}/batches/${ids.batch}/labels`);
    await settled(wide);
    await expect(wide.getByRole('navigation', { name: 'Main' }).isVisible()).resolves.toBe(true);
    await wide.emulateMedia({ media: 'print' });
    await expect(wide.getByRole('navigation', { name: 'Main' }).isVisible()).resolves.toBe(false);
    await expect(wide.getByRole('listitem', { name: /^Label / }).first().isVisible()).resolves.toBe(true);
    await wide.emulateMedia({ media: 'screen' });
  });
});
