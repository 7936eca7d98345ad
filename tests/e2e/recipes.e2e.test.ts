import type { Page } from 'playwright-core';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';
import { createFoods, SR_LEGACY } from '../helpers/foods';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('recipes');
  // Per-100 g values as in check-values §2.4 (USDA SR Legacy 08120, 01077, 01256, 09003, 09298).
  await createFoods([
    SR_LEGACY.oats,
    { ...SR_LEGACY.wholeMilk, name: 'Milk, whole, 3.25%' },
    SR_LEGACY.greekYogurt,
    { ...SR_LEGACY.apple, name: 'Apples, raw, with skin' },
    SR_LEGACY.raisins,
  ]);
});
afterAll(async () => {
  await rig?.close();
});

async function signUp(name: string): Promise<{ token: string; email: string }> {
  const email = `${name.toLowerCase()}-${Date.now()}@example.test`;
  const res = await fetch(`${rig.baseUrl}/api/auth/sign-up`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, displayName: name, password: 'a long kitchen passphrase' }),
  });
  const body = (await res.json()) as { token: string };
  return { token: body.token, email };
}

async function signedInPage(viewport: { width: number; height: number }, token: string): Promise<Page> {
  const page = await rig.newPage(viewport);
  await rig.signIn(page, token);
  return page;
}

async function addIngredient(page: Page, search: string, name: string, grams: string) {
  await page.getByLabel('Add an ingredient', { exact: true }).fill(search);
  await page.getByRole('button', { name: `Add ${name}` }).click();
  await page.getByLabel(`Grams of ${name}`, { exact: true }).fill(grams);
}

describe('recipes in the browser', () => {
  it('builds a recipe from food search on a phone, shows its numbers and shares it; the guest sees list and detail side by side on a wide screen', async () => {
    const cook = await signUp('Wren');
    const guest = await signUp('Juniper');
    const page = await signedInPage(PHONE, cook.token);

    await page.goto(`${rig.baseUrl}/recipes`);
    await page.getByText('No recipes yet').waitFor();
    await rig.shot(page, 'phone-library-empty');
    await page.getByRole('button', { name: 'New recipe' }).click();
    await page.waitForURL(/\/recipes\/new/);
    await page.getByLabel('Title', { exact: true }).fill('Overnight oats');
    await page.getByLabel('Portions', { exact: true }).fill('6');
    await page.getByLabel('Tags (separated by commas)', { exact: true }).fill('breakfast, no-cook');
    await page.getByRole('button', { name: 'Save recipe' }).click();
    await page.getByText('Add at least one ingredient.').waitFor();
    await addIngredient(page, 'oats', 'Oats, rolled, dry', '240');
    await addIngredient(page, 'milk whole', 'Milk, whole, 3.25%', '480');
    await addIngredient(page, 'yogurt', 'Yogurt, Greek, plain, nonfat', '240');
    await addIngredient(page, 'apples raw', 'Apples, raw, with skin', '150');
    await addIngredient(page, 'raisins', 'Raisins, seedless', '0');
    await page.getByRole('button', { name: 'Save recipe' }).click();
    await page.getByText('Grams must be more than 0.').waitFor();
    await page.getByLabel('Grams of Raisins, seedless', { exact: true }).fill('40');
    await page.getByLabel('Method (one step per line)', { exact: true }).fill('Mix everything in a bowl.\nDivide into six portions and chill overnight.');
    await rig.shot(page, 'phone-editor');
    await page.getByRole('button', { name: 'Save recipe' }).click();

    await page.waitForURL(/\/recipes\/\d+$/);
    // Available carbohydrate by hand (check-values §2.4): 217.227 g / 6 = 36.2 g per portion; 18.889 g per 100 g → "36 g", "19 g".
    await page.getByTestId('carb-per-portion').getByText('36 g').waitFor();
    await page.getByTestId('carb-per-100g').getByText('19 g').waitFor();
    await rig.shot(page, 'phone-recipe-page');
    const png = await page.screenshot({ clip: { x: 0, y: 0, width: 390, height: 240 } });
    await page.getByTestId('recipe-photo-input').setInputFiles({ name: 'oats.png', mimeType: 'image/png', buffer: png });
    await page.getByRole('button', { name: 'Change photo' }).waitFor({ timeout: 60_000 });
    await page.getByLabel('Photo of Overnight oats', { exact: true }).last().waitFor();
    await page.getByRole('button', { name: 'Change photo' }).waitFor();
    await page.getByRole('button', { name: '× 2' }).click();
    await page.getByText('Per portion (1 of 6)').waitFor();
    await page.getByText('480 g').first().waitFor();
    await page.getByLabel('Their email address', { exact: true }).fill('nobody-at-all@example.test');
    await page.getByRole('button', { name: 'Offer', exact: true }).click();
    // The same answer whether or not an account uses the address (issue 14 §3).
    await page.getByText('Offer sent. It appears here once they accept.').waitFor();
    await page.getByLabel('Their email address', { exact: true }).fill(guest.email);
    await page.getByRole('button', { name: 'Offer', exact: true }).click();
    await page.getByText('Offer sent. It appears here once they accept.').waitFor();
    await rig.shot(page, 'phone-recipe-shared');

    const wide = await signedInPage(WIDE, guest.token);
    await wide.goto(`${rig.baseUrl}/recipes`);
    await wide.getByRole('button', { name: 'Accept Overnight oats' }).click();
    await wide.getByRole('tab', { name: 'Shared with me' }).click();
    await wide.getByRole('listitem', { name: 'Overnight oats' }).waitFor();
    await wide.getByText('Shared by Wren').waitFor();
    await wide.getByTestId('carb-per-portion').getByText('36 g').waitFor();
    await rig.shot(wide, 'wide-library-list-and-detail');
    await wide.getByRole('button', { name: 'Copy to my recipes' }).click();
    await wide.waitForURL(/\/recipes\/\d+$/);
    await wide.getByText(/copied from “Overnight oats”/).waitFor();
  });
});
