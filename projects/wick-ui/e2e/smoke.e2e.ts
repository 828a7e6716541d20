import type { Browser } from 'playwright-core';
import { NAV_ITEMS } from '../src/app/core/navigation';
import { APP_URL, launch, openPage, screenshot } from './support/browser';

describe('smoke: the app shell in a real browser', () => {
  let browser: Browser;
  beforeAll(async () => (browser = await launch()));
  afterAll(async () => browser?.close());

  it('loads the home page with every feature area, fonts from our own origin, nothing off loopback', async () => {
    const { context, page, requests } = await openPage(browser);
    const consoleErrors: string[] = [];
    page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
    await page.goto(APP_URL, { waitUntil: 'networkidle' });
    await page.evaluate(() => document.fonts.ready);

    await page.locator('.brand').waitFor();
    expect(await page.locator('.brand').innerText()).toContain('Wickwright');
    expect(await page.locator('mat-nav-list a').count()).toBe(NAV_ITEMS.length);

    const fontRequests = requests.filter((r) => r.resourceType() === 'font');
    expect(fontRequests.length).toBeGreaterThan(0);
    for (const r of fontRequests) expect(new URL(r.url()).origin).toBe(new URL(APP_URL).origin);
    // Icon font actually renders (a ligature is narrower than its name in a text font).
    expect(await page.evaluate(() => document.fonts.check('24px "Material Symbols Outlined"'))).toBeTrue();

    for (const r of requests) {
      const host = new URL(r.url()).hostname;
      if (r.url().startsWith('data:') || r.url().startsWith('blob:')) continue;
      expect(['127.0.0.1', 'localhost']).toContain(host);
    }
    expect(consoleErrors).toEqual([]);
    await screenshot(page, 'home');
    await context.close();
  });

  it('navigates to a feature area by keyboard and shows its honest placeholder', async () => {
    const { context, page } = await openPage(browser);
    await page.goto(APP_URL, { waitUntil: 'networkidle' });
    await page.locator('mat-nav-list a', { hasText: 'Lab data' }).focus();
    await page.keyboard.press('Enter');
    await page.waitForURL('**/lab-data');
    expect(await page.locator('h1').innerText()).toBe('Lab data');
    expect(await page.title()).toContain('Lab data');
    await context.close();
  });

  it('answers an unknown API path with a JSON 404, not the app shell', async () => {
    const { context, page } = await openPage(browser);
    const res = await page.goto(`${APP_URL}/api/nothing-here`);
    expect(res?.status()).toBe(404);
    expect(JSON.parse(await res!.text()).error.code).toBe('not-found');
    await context.close();
  });
});
