import type { Page } from 'playwright-core';

/** The demo project seeded by migrations/seeders/04-designs.ts, as a link name. */
export const DEMO_PROJECT = 'Night pad 2027 (demo)';
export const DEMO_PROJECT_LINK = new RegExp(DEMO_PROJECT.replace(/[()]/g, '.'));

/** Waits until the variant editor has recomputed more than `after` times (the results carry a counter). */
export async function recomputedPast(page: Page, after: number): Promise<number> {
  const handle = await page.waitForFunction(
    (n) => {
      const el = document.querySelector('[data-testid="results"]');
      const count = Number(el?.getAttribute('data-recomputes') ?? 0);
      return count > n ? count : null;
    },
    after,
    { timeout: 20_000 },
  );
  return (await handle.jsonValue()) as number;
}

/** How many times the variant editor has recomputed so far. */
export async function recomputes(page: Page): Promise<number> {
  return Number((await page.locator('[data-testid="results"]').getAttribute('data-recomputes')) ?? 0);
}

/** Picks an option of a Material select (opened by clicking the field), once its options have loaded. */
export async function choose(page: Page, select: string, option: string | RegExp): Promise<void> {
  const field = page.locator(select);
  await page.waitForFunction((sel) => document.querySelector(sel)?.getAttribute('aria-disabled') !== 'true', select);
  await field.click();
  const wanted = page.getByRole('option', { name: option }).first();
  if (!(await wanted.isVisible())) {
    // Options arrived after the panel opened empty: open it again.
    await page.keyboard.press('Escape');
    await field.click();
  }
  await wanted.click();
}

/** Types into the field the editor names `field` (a unit input or a plain input). */
export async function typeInto(page: Page, field: string, text: string): Promise<void> {
  const input = page.locator(`wick-unit-input[data-field="${field}"] input, input[data-field="${field}"]`).first();
  await input.fill(text);
}
