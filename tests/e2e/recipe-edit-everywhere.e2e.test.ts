import type { Page } from 'playwright-core';
import request from 'supertest';
import { PHONE, WIDE, startBrowserRig, type BrowserRig } from '../helpers/browser';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig('recipe-edit-everywhere');
});
afterAll(async () => {
  await rig?.close();
});

// An invented pack food and recipe: the test follows one edit through every screen that shows the recipe.
async function cookWithRecipe() {
  const signUp = await request(rig.baseUrl)
    .post('/api/auth/sign-up')
    .send({ email: 'edit-everywhere@example.test', displayName: 'Noor', password: 'a long kitchen passphrase' });
  const auth = { Authorization: `Bearer ${signUp.body.token}` };
  const food = await request(rig.baseUrl).post('/api/foods').set(auth).send({ name: 'Red lentils, dry', basis: 'per100g', convention: 'eu', carbohydrate: 48 });
  expect(food.status).toBe(201);
  const recipe = await request(rig.baseUrl)
    .post('/api/recipes')
    .set(auth)
    .send({ title: 'Lentil soup', defaultPortions: 4, ingredients: [{ foodId: food.body.food.id, grams: 200 }] });
  expect(recipe.status).toBe(201);
  return { token: signUp.body.token as string, recipeId: recipe.body.id as number };
}

/** The Kitchen tab keeps its own history: it may open on the kitchen, the recipe picker or the cook screen itself. */
async function openCookScreen(page: Page, title: string) {
  await page.getByRole('tab', { name: 'Kitchen' }).click();
  const cook = page.getByRole('heading', { name: `Cook: ${title}` });
  const pick = page.getByRole('button', { name: `Cook ${title}` });
  const kitchen = page.getByRole('button', { name: 'Cook a batch' });
  await cook.or(pick).or(kitchen).first().waitFor();
  if (await kitchen.isVisible()) await kitchen.click();
  if (!(await cook.isVisible())) await pick.click();
  await cook.waitFor();
}

describe('a recipe edit reaches every screen without a reload', () => {
  it('edits title and grams; the cook screen and the library show the edit', async () => {
    const { token, recipeId } = await cookWithRecipe();
    const page = await rig.newPage(PHONE);
    await rig.signIn(page, token);
    await page.goto(`${rig.baseUrl}/recipes`);
    await page.getByText('Lentil soup', { exact: true }).first().waitFor();
    // Set after the one page load: a reload would wipe it.
    await page.evaluate(() => ((window as unknown as { loadedOnce: boolean }).loadedOnce = true));

    // The kitchen's and the cook screen's copies are in the cache before the edit.
    await openCookScreen(page, 'Lentil soup');
    await page.getByLabel('Weighing checklist').getByText('200 g', { exact: true }).waitFor();

    await page.getByRole('tab', { name: 'Recipes' }).click();
    await page.getByText('Lentil soup', { exact: true }).first().click();
    await page.waitForURL(new RegExp(`/recipes/${recipeId}$`));
    await page.getByRole('button', { name: 'Edit' }).click();
    await page.getByLabel('Title', { exact: true }).fill('Red lentil soup');
    await page.getByLabel('Grams of Red lentils, dry', { exact: true }).fill('300');
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.waitForURL(new RegExp(`/recipes/${recipeId}$`));
    await page.getByRole('heading', { name: 'Red lentil soup' }).waitFor();

    await openCookScreen(page, 'Red lentil soup');
    await page.getByLabel('Weighing checklist').getByText('300 g', { exact: true }).waitFor();
    await rig.shot(page, 'phone-cook-after-edit');

    // The Recipes tab reopens on the recipe page; a second tap goes to the library.
    await page.getByRole('tab', { name: 'Recipes' }).click();
    await page.waitForURL(new RegExp(`/recipes/${recipeId}$`));
    await page.getByRole('tab', { name: 'Recipes' }).click();
    await page.waitForURL(/\/recipes$/);
    const library = page.getByRole('list', { name: 'Recipes' });
    await library.getByRole('listitem', { name: 'Red lentil soup', exact: true }).waitFor();
    await expect(library.getByRole('listitem', { name: 'Lentil soup', exact: true }).count()).resolves.toBe(0);
    await rig.shot(page, 'phone-library-after-edit');
    await expect(page.evaluate(() => (window as unknown as { loadedOnce?: boolean }).loadedOnce)).resolves.toBe(true);

    // The same two forms at a wide width, for the screenshots.
    const wide = await rig.newPage(WIDE);
    await rig.signIn(wide, token);
    await wide.goto(`${rig.baseUrl}/recipes/${recipeId}/edit`);
    await wide.getByLabel('Grams of Red lentils, dry', { exact: true }).waitFor();
    await rig.shot(wide, 'wide-recipe-editor');
    await wide.goto(`${rig.baseUrl}/kitchen/cook/${recipeId}`);
    await wide.getByLabel('Weighing checklist').getByText('300 g', { exact: true }).waitFor();
    await rig.shot(wide, 'wide-cook-weighing');
  });
});
