import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page, type Request } from 'playwright-core';

/** The app under test, started by `npm test` on its own ports. */
export const APP_URL = process.env['WICK_E2E_URL'] ?? 'http://127.0.0.1:4710';
export const SCREENSHOT_DIR = join(process.cwd(), 'e2e-screenshots');

/** Debian's chromium, never a downloaded browser; flags keep it quiet on a closed network. */
export async function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env['CHROME_BIN'] ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
}

/** A fresh context that records every request the page makes. */
export async function openPage(browser: Browser): Promise<{ context: BrowserContext; page: Page; requests: Request[] }> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 860 } });
  const page = await context.newPage();
  const requests: Request[] = [];
  page.on('request', (r) => requests.push(r));
  return { context, page, requests };
}

export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  await page.screenshot({ path: join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
}
