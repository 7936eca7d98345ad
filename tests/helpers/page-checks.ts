import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';

/** WCAG 2.2 success criterion 2.5.5 (Target Size, Enhanced): at least 44 × 44 CSS pixels. */
export const MIN_TARGET_PX = 44;

/** Waits until the page shows its level-1 heading and nothing is loading any more. */
export async function settled(page: Page) {
  await page.locator('[role="heading"][aria-level="1"], h1').first().waitFor();
  await page.waitForFunction(() => !document.querySelector('[role="progressbar"]'));
  await page.waitForLoadState('networkidle');
}

/**
 * Elements whose right edge passes the viewport: cut off, or making the page scroll sideways on a phone. Only a
 * deliberate sideways scroller (an ancestor with overflow-x auto or scroll) may hold content past its edge; content
 * clipped by a hidden overflow still counts, since it cannot be seen.
 */
export async function overflowingElements(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const limit = document.documentElement.clientWidth + 0.5;
    const out: string[] = [];
    const over = new Set<Element>();
    for (const el of Array.from(document.body.querySelectorAll('*'))) {
      const box = el.getBoundingClientRect();
      if (box.width === 0 || box.height === 0) continue;
      if (getComputedStyle(el).visibility === 'hidden') continue;
      let right = box.right;
      for (let a = el.parentElement; a && a !== document.body; a = a.parentElement) {
        const overflowX = getComputedStyle(a).overflowX;
        if (overflowX === 'auto' || overflowX === 'scroll') right = Math.min(right, a.getBoundingClientRect().right);
      }
      if (right <= limit) continue;
      over.add(el);
      // Report the outermost offender only: its children pass the edge because it does.
      if (el.parentElement && over.has(el.parentElement)) continue;
      const name = el.getAttribute('aria-label') ?? (el.textContent ?? '').trim().slice(0, 40);
      out.push(`<${el.tagName.toLowerCase()}${el.getAttribute('role') ? ` role=${el.getAttribute('role')}` : ''}> "${name}" right=${Math.round(right)}`);
    }
    return out;
  });
}

/** Buttons, links, tabs and choices that take focus (so can be activated) and are smaller than MIN_TARGET_PX either way. */
export async function smallTapTargets(page: Page): Promise<string[]> {
  return page.evaluate((min) => {
    const selector = 'a[href], button, [role="button"], [role="link"], [role="tab"], [role="radio"], [role="checkbox"], [role="switch"], input[type="checkbox"], input[type="radio"]';
    const out: string[] = [];
    for (const el of Array.from(document.querySelectorAll(selector))) {
      const box = el.getBoundingClientRect();
      if (box.width === 0 || box.height === 0 || getComputedStyle(el).visibility === 'hidden') continue;
      if ((el as HTMLElement).tabIndex < 0) continue;
      // Roles nested in another target (a radio drawn inside its pressable row) are measured by the outer one.
      if (el.parentElement?.closest(selector)) continue;
      if (box.width + 0.5 >= min && box.height + 0.5 >= min) continue;
      const name = el.getAttribute('aria-label') ?? (el.textContent ?? '').trim().slice(0, 40);
      out.push(`"${name}" ${Math.round(box.width)}×${Math.round(box.height)}`);
    }
    return out;
  }, MIN_TARGET_PX);
}

/** axe-core's serious and critical violations, one line each with the first offending nodes. */
export async function seriousAxeViolations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page } as never).analyze();
  if (result.passes.length === 0) throw new Error('axe checked nothing on this page');
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.impact} ${v.id}: ${v.help} — ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join(' | ')}`);
}
