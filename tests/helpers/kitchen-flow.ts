import type { Page } from 'playwright-core';

/** Signs up a new person in the browser and waits for Today. */
export async function signUpInBrowser(page: Page, baseUrl: string, who: { name: string; email: string }) {
  await page.goto(`${baseUrl}/sign-up`);
  await page.getByLabel('Your name').fill(who.name);
  await page.getByLabel('Email').fill(who.email);
  await page.getByLabel('Password').fill('a long kitchen passphrase');
  await page.getByRole('button', { name: 'Create account' }).click();
  await page.waitForURL(`${baseUrl}/`);
}

/**
 * On the cook screen: types each scale reading, waits for its difference from the plan, and goes on to the pot.
 * `beforeNext(i)` runs on each ingredient's step before moving on (for screenshots).
 */
export async function weighEachIngredient(page: Page, lines: { planned: number; actual: number }[], beforeNext?: (i: number) => Promise<void>) {
  for (const [i, line] of lines.entries()) {
    await page.getByText(`Ingredient ${i + 1} of ${lines.length}`).waitFor();
    await page.getByLabel('Scale reading').fill(String(line.actual));
    const diff = line.actual - line.planned;
    await page.getByText(`${diff > 0 ? '+' : '−'}${Math.abs(diff)} g`).first().waitFor();
    await beforeNext?.(i);
    const last = i === lines.length - 1;
    await page.getByRole('button', { name: last ? 'All weighed: weigh the pot' : 'Next ingredient' }).click();
  }
}

/** Weighs the pot empty and full and waits for each expected figure in the batch numbers. */
export async function weighPot(page: Page, pot: { tare: number; gross: number }, expected: string[]) {
  await page.getByLabel('Empty pot (tare)').fill(String(pot.tare));
  await page.getByLabel('Pot with the food (gross)').fill(String(pot.gross));
  const numbers = page.getByLabel('Batch numbers');
  for (const text of expected) await numbers.getByText(text, { exact: true }).waitFor();
}

/** Fills each container's empty and full weight and waits for "Net N g · <carbohydrate>" as the caller worked it out. */
export async function weighContainers(page: Page, containers: [tare: number, gross: number][], carbOf: (net: number) => string) {
  for (const [i, [tare, gross]] of containers.entries()) {
    if (i > 0) await page.getByRole('button', { name: 'Add a container' }).click();
    await page.getByLabel(`Empty container ${i + 1} (tare)`).fill(String(tare));
    await page.getByLabel(`Full container ${i + 1} (gross)`).fill(String(gross));
    await page.getByText(`Net ${gross - tare} g · ${carbOf(gross - tare)}`).first().waitFor();
  }
}

/** Saves the batch, waits for its page (then `onBatchPage`), opens the label sheet and returns the labels of `title`. */
export async function saveBatchAndOpenLabels(page: Page, title: string, onBatchPage?: () => Promise<void>) {
  await page.getByRole('button', { name: 'Save batch and portions' }).click();
  await page.waitForURL(/\/kitchen\/batches\/\d+$/);
  await page.getByRole('heading', { name: 'Portions' }).waitFor();
  await onBatchPage?.();
  await page.getByRole('button', { name: 'Print labels' }).first().click();
  await page.waitForURL(/\/batches\/\d+\/labels$/);
  const labels = page.getByRole('listitem').filter({ hasText: title });
  await labels.first().waitFor();
  return labels;
}
