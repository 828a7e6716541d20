import type { Browser, Page } from 'playwright-core';
import { PERMISSIONS, type Permission } from 'wick-core';
import { NAV_ITEMS } from '../src/app/core/navigation';
import { APP_URL, launch, openPage, screenshot } from './support/browser';
import { DEMO_ACCOUNTS, demoAccount, signIn, signOut, submitProviderLogin } from './support/sign-in';

/** Each journey goes through the provider's pages twice; the suite's default 5 s is too short. */
const JOURNEY_MS = 60_000;

/** The side-navigation labels a set of roles should see, from the permission table. */
function expectedMenu(roles: readonly string[]): string[] {
  const can = (p: Permission) => roles.some((r) => (PERMISSIONS[p] as readonly string[]).includes(r));
  return NAV_ITEMS.filter((i) => can(i.permission)).map((i) => i.label);
}

async function navLabels(page: Page): Promise<string[]> {
  return (await page.locator('mat-nav-list a [matListItemTitle]').allInnerTexts()).map((t) => t.trim());
}

function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && errors.push(`${page.url()}: ${m.text()}`));
  page.on('pageerror', (e) => errors.push(`${page.url()}: ${e.message}`));
  return errors;
}

describe('sign-in through the demo identity provider', () => {
  let browser: Browser;
  beforeAll(async () => (browser = await launch()), JOURNEY_MS);
  afterAll(async () => browser?.close());

  for (const account of DEMO_ACCOUNTS) {
    it(`when ${account.name} (${account.roles.join(' + ')}) signs in, then the menu shows their roles and areas, and sign-out works`, async () => {
      const { context, page } = await openPage(browser);
      const errors = watchErrors(page);
      await page.goto(APP_URL, { waitUntil: 'networkidle' });
      // Before sign-in every area is listed; each asks to sign in.
      expect(await navLabels(page)).toEqual(NAV_ITEMS.map((i) => i.label));

      await page.locator('wick-user-menu button', { hasText: 'Sign in' }).click();
      await page.waitForURL('**/interaction/**');
      // The provider's own page lists the demo people.
      expect(await page.locator('#demo-accounts').innerText()).toBe('Demo accounts');
      expect(await page.locator('table').innerText()).toContain(account.name);
      await submitProviderLogin(page, account);

      expect(await navLabels(page)).toEqual(expectedMenu(account.roles));
      await page.locator('wick-user-menu button[aria-label="Account menu"]').click();
      const panel = page.locator('.mat-mdc-menu-panel');
      await panel.waitFor();
      const labels: Record<string, string> = {
        engineer: 'Engineer',
        'materials-scientist': 'Materials scientist',
        reviewer: 'Reviewer',
        'program-manager': 'Programme manager',
        admin: 'Administrator',
      };
      for (const role of account.roles) expect(await panel.innerText()).toContain(labels[role]);
      await screenshot(page, `signed-in-${account.username}`);
      await page.keyboard.press('Escape');

      await signOut(page);
      expect(await navLabels(page)).toEqual(NAV_ITEMS.map((i) => i.label));
      // The session is gone on the server too.
      expect((await page.request.get(`${APP_URL}/api/me`)).status()).toBe(401);
      expect(errors).toEqual([]);
      await context.close();
    }, JOURNEY_MS);
  }

  it('when an anonymous visitor opens an area, then the sign-in page stands in and sign-in returns to that area', async () => {
    const { context, page } = await openPage(browser);
    await page.goto(`${APP_URL}/lab-data`, { waitUntil: 'networkidle' });
    expect(await page.locator('h1').innerText()).toBe('Lab data');
    expect(new URL(page.url()).pathname).toBe('/lab-data');
    await page.locator('wick-sign-in-page button', { hasText: 'Sign in' }).click();
    await page.waitForURL('**/interaction/**');
    await submitProviderLogin(page, demoAccount('priya'));
    expect(new URL(page.url()).pathname).toBe('/lab-data');
    // The area's lazy page renders after the user menu: wait for it rather than read a half-drawn heading.
    await page.locator('h1', { hasText: 'Lab data' }).waitFor();
    expect(await page.locator('wick-sign-in-page').count()).toBe(0);
    await context.close();
  }, JOURNEY_MS);

  it('when a role lacks the permission for a page, then the 403 page names the role it needs', async () => {
    const { context, page } = await openPage(browser);
    await signIn(page, 'priya');
    await page.goto(`${APP_URL}/reviews`, { waitUntil: 'networkidle' });
    expect(new URL(page.url()).pathname).toBe('/reviews');
    const text = await page.locator('wick-forbidden').innerText();
    expect(text).toContain('You do not have access to this page');
    expect(await page.locator('wick-forbidden .needed').innerText()).toBe('Reviewer');
    expect(text).toContain('Priya Raman');
    await screenshot(page, 'forbidden-reviews');
    await context.close();
  }, JOURNEY_MS);

  it('when the administrator opens Administration, then people and the audit log of sign-ins are there', async () => {
    const { context, page } = await openPage(browser);
    const errors = watchErrors(page);
    await signIn(page, 'ada');
    await page.locator('mat-nav-list a', { hasText: 'Administration' }).click();
    await page.waitForURL('**/admin');
    await page.locator('table.people').getByText('Ada Whitfield').waitFor();
    expect(await page.locator('table.people').innerText()).toContain('Priya Raman');
    await page.getByRole('tab', { name: 'Audit log' }).click();
    await page.locator('table.audit').getByText('sign-in').first().waitFor();
    await screenshot(page, 'admin-audit-log');
    expect(errors).toEqual([]);
    await context.close();
  }, JOURNEY_MS);
});
