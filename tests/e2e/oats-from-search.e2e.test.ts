import { restoreShippedFoods } from '../helpers/db';
import { PHONE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { saveBatchAndOpenLabels, signUpInBrowser, weighContainers, weighEachIngredient, weighPot } from '../helpers/kitchen-flow';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('oats-from-search');
  await restoreShippedFoods(rig.sequelize);
});
afterAll(async () => {
  await rig?.close();
});

/*
 * Source: USDA ARS, Nutrient Database for Standard Reference, Release 28 (SR28), as shipped in data/usda-sr28
 * (NUT_DATA.txt: nutrient 205 carbohydrate by difference, 291 total dietary fibre; per 100 g), also in
 * ../shared/reference/check-values.md:
 *   08120 Cereals, oats, regular and quick, not fortified, dry   carbohydrate 67.70 g, fibre 10.1 g → available 57.60 g
 *   01077 Milk, whole, 3.25% milkfat, with added vitamin D       carbohydrate  4.80 g, fibre  0.0 g → available  4.80 g
 *   01256 Yogurt, Greek, plain, nonfat                           carbohydrate  3.60 g, fibre  0.0 g → available  3.60 g
 *   09050 Blueberries, raw                                       carbohydrate 14.49 g, fibre  2.4 g → available 12.09 g
 * The new profile counts available carbohydrate (carb − fibre), shown to the nearest gram from 10 g up.
 */
const FOODS = [
  { search: 'rolled oats', name: 'Cereals, oats, regular and quick, not fortified, dry', per100: '58 g', avail: 57.6, planned: 250, actual: 252 },
  { search: 'milk', name: 'Milk, whole, 3.25% milkfat, with added vitamin D', per100: '4.8 g', avail: 4.8, planned: 500, actual: 496 },
  { search: 'greek yogurt', name: 'Yogurt, Greek, plain, nonfat', per100: '3.6 g', avail: 3.6, planned: 250, actual: 247 },
  { search: 'blueberries', name: 'Blueberries, raw', per100: '12 g', avail: 12.09, planned: 150, actual: 163 },
];
/*
 * Hand calculation, the recipe as planned (5 portions, 1150 g raw):
 *   250 × 0.5760 = 144.000; 500 × 0.0480 = 24.000; 250 × 0.0360 = 9.000; 150 × 0.1209 = 18.135
 *   total 195.135 g → per portion 195.135 ÷ 5 = 39.03 g ("39 g"); per 100 g raw 195.135 ÷ 1150 × 100 = 16.97 g ("17 g").
 * The batch as weighed:
 *   252 × 0.5760 = 145.152; 496 × 0.0480 = 23.808; 247 × 0.0360 = 8.892; 163 × 0.1209 = 19.7067
 *   total 197.5587 g ("198 g"); the bowl 1612 g full − 480 g empty = 1132 g → 197.5587 ÷ 1132 × 100 = 17.45 g per 100 g ("17 g").
 * Five weighed containers, net = full − empty: 438−212 = 226, 441−215 = 226, 436−209 = 227, 440−213 = 227, 437−211 = 226
 *   (sum 1132 g, the whole bowl). FAO recipe method: 226 g × 0.174522 = 39.44 g ("39 g"); 227 g × 0.174522 = 39.62 g ("40 g").
 */
const PORTIONS = 5;
const BOWL = { tare: 480, gross: 1612 };
const CONTAINERS: [tare: number, gross: number][] = [
  [212, 438],
  [215, 441],
  [209, 436],
  [213, 440],
  [211, 437],
];
const EXPECT = {
  recipePerPortion: '39 g',
  recipePer100g: '17 g',
  recipeWhole: 'whole recipe 195 g in 1150 g',
  cooked: '1132 g',
  batchTotal: '198 g',
  batchPer100g: '17 g',
  container: { 226: '39 g', 227: '40 g' } as Record<number, string>,
};

describe('a Sunday batch of overnight oats from the USDA table only, on a phone', () => {
  it('finds every food by search, cooks with weights, portions it out into five weighed containers and prints labels', async () => {
    const page = await rig.newPage(PHONE);
    await signUpInBrowser(page, rig.baseUrl, { name: 'Jo', email: 'jo-oats@example.test' });

    await page.getByRole('tab', { name: 'Recipes' }).click();
    await page.getByRole('button', { name: 'New recipe' }).click();
    await page.waitForURL(/\/recipes\/new/);
    await page.getByLabel('Title', { exact: true }).fill('Overnight oats');
    await page.getByLabel('Portions', { exact: true }).fill(String(PORTIONS));
    for (const [i, f] of FOODS.entries()) {
      await page.getByLabel('Add an ingredient', { exact: true }).fill(f.search);
      const hit = page.getByRole('button', { name: `Add ${f.name}`, exact: true });
      await hit.getByText(f.per100, { exact: true }).waitFor();
      await rig.shot(page, `search-${i + 1}-${f.search.replace(/\s+/g, '-')}`);
      await hit.click();
      await page.getByLabel(`Grams of ${f.name}`, { exact: true }).fill(String(f.planned));
    }
    await page.getByLabel('Method (one step per line)', { exact: true }).fill('Stir oats, milk and yogurt.\nFold in the blueberries.\nChill overnight.');
    await rig.shot(page, 'recipe-editor');
    await page.getByRole('button', { name: 'Save recipe' }).click();

    await page.waitForURL(/\/recipes\/\d+$/);
    await page.getByTestId('carb-per-portion').getByText(EXPECT.recipePerPortion, { exact: true }).waitFor();
    await page.getByTestId('carb-per-100g').getByText(EXPECT.recipePer100g, { exact: true }).waitFor();
    await page.getByText(EXPECT.recipeWhole).waitFor();
    await rig.shot(page, 'recipe-page');

    await page.getByRole('button', { name: 'Cook a batch' }).click();
    await page.waitForURL(/\/kitchen\/cook\/\d+$/);
    await weighEachIngredient(page, FOODS, async (i) => {
      if (i === FOODS.length - 1) await rig.shot(page, 'weighing-last');
    });
    await weighPot(page, BOWL, [EXPECT.cooked, EXPECT.batchPer100g, EXPECT.batchTotal]);
    await rig.shot(page, 'bowl');
    await page.getByRole('button', { name: 'Portion out', exact: true }).click();

    await weighContainers(page, CONTAINERS, (net) => EXPECT.container[net]);
    await page.getByText(`Left to portion out: 0 g of ${BOWL.gross - BOWL.tare} g`).waitFor();
    await rig.shot(page, 'split');
    await page.getByRole('button', { name: 'Storage and use-by' }).click();
    const labels = await saveBatchAndOpenLabels(page, 'Overnight oats', () => rig.shot(page, 'batch'));
    expect(await labels.count()).toBe(PORTIONS);
    for (const net of [226, 227]) {
      const these = labels.filter({ hasText: `Net ${net} g ·` });
      expect(await these.count()).toBe(net === 226 ? 3 : 2);
      for (let k = 0; k < (await these.count()); k += 1) {
        await these.nth(k).getByText(`${EXPECT.container[net]} carbohydrate (available)`, { exact: true }).waitFor();
        await these.nth(k).getByText(`Net ${net} g · ${EXPECT.batchPer100g} per 100 g`, { exact: true }).waitFor();
      }
    }
    await rig.shot(page, 'labels');
  });
});
