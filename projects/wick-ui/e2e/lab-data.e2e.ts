import type { Browser, Page } from 'playwright-core';
import { createRng, gravityHeight, type MailboxMessage } from 'wick-core';
import { launch, openPage, screenshot } from './support/browser';
import { signIn, signOut } from './support/sign-in';

/** Two people sign in through the provider's pages and a run is fitted twice: far beyond the suite's 5 s default. */
const JOURNEY_MS = 180_000;
const MAIL_API = process.env['WICK_E2E_MAIL_API'] ?? 'http://127.0.0.1:4726';
/** An approved web of the demo library with a computed porosity, that no other journey changes. */
const WEB = 'Calloway SMS-15 barrier cuff';

/**
 * A vertical wicking record as a camera rig exports it (invented, not measured): generated with wick-core's
 * dh/dt = a/h − b solution for a = 2e-5 m²/s, b = 2.5e-4 m/s (h_eq 80 mm), with 0.3 mm seeded reading noise.
 */
function runCsv(): string {
  const rng = createRng(2024);
  const times = Array.from({ length: 36 }, (_, i) => (i + 1) * 10);
  const rows = times.map((t) => `${t},${((gravityHeight(2e-5, 2.5e-4, t) + 3e-4 * rng.nextNormal()) * 1000).toFixed(2)}`);
  return ['# rig 2, camera read-out', 'time (s),height (mm)', ...rows, ''].join('\n');
}

function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`${page.url()}: ${e.message}`));
  page.on('console', (m) => {
    // A refused upload is an HTTP 422 the page explains; the browser logs the failed request itself.
    if (m.type() === 'error' && !m.text().includes('422')) errors.push(`${page.url()}: ${m.text()}`);
  });
  return errors;
}

async function mailFor(subjectPart: string): Promise<MailboxMessage[]> {
  const end = Date.now() + 15_000;
  for (;;) {
    const hits = ((await (await fetch(`${MAIL_API}/messages`)).json()) as MailboxMessage[]).filter((m) => m.subject.includes(subjectPart));
    if (hits.length || Date.now() > end) return hits;
    await new Promise((r) => setTimeout(r, 250));
  }
}

async function fillUpload(page: Page, name: string, setName: string, csv: string, fileName: string): Promise<void> {
  await page.locator('input[data-test=file]').setInputFiles({ name: fileName, mimeType: 'text/csv', buffer: Buffer.from(csv, 'utf8') });
  await page.getByRole('textbox', { name: 'Run name' }).fill(name);
  await page.getByRole('combobox', { name: 'Web (library)' }).click();
  await page.getByRole('option', { name: new RegExp(WEB) }).click();
  await page.getByRole('textbox', { name: 'New set name' }).fill(setName);
  await page.getByRole('textbox', { name: 'Test conditions' }).fill('Strip 25 mm × 250 mm, conditioned 24 h at 23 °C / 50 % RH.');
}

describe('lab data: upload a run, fit it, propose the values, a reviewer approves', () => {
  let browser: Browser;
  beforeAll(async () => (browser = await launch()), JOURNEY_MS);
  afterAll(async () => browser?.close());

  it(
    'when an engineer uploads a wicking run, adjusts the fit and proposes it, and a reviewer approves the web revision, then the library holds the fitted permeability',
    async () => {
      const setName = `SMS-15 saline ${Date.now().toString(36)}`;
      const { context, page } = await openPage(browser);
      const errors = watchErrors(page);

      // — Priya, engineer: a bad file is refused with its line, nothing is stored —
      await signIn(page, 'priya', '/lab-data');
      await page.getByRole('link', { name: /Upload a run/ }).click();
      await page.waitForURL('**/lab-data/runs/new');
      const flat = ['time (s),height (mm)', '10,12', '20,12', '30,12', '40,12', '50,12', ''].join('\n');
      await fillUpload(page, 'Specimen 1', setName, flat, 'flat.csv');
      await page.getByRole('button', { name: 'Upload and fit' }).click();
      await page.getByRole('alert').getByRole('listitem').filter({ hasText: /flat curve/ }).waitFor();
      expect(await page.getByRole('alert').innerText()).toContain('Nothing was changed');
      expect(page.url()).toContain('/lab-data/runs/new');

      // — the real record: stored, fitted, plotted —
      await page.locator('input[data-test=file]').setInputFiles({ name: 'sms15-specimen-1.csv', mimeType: 'text/csv', buffer: Buffer.from(runCsv(), 'utf8') });
      await page.getByRole('button', { name: 'Upload and fit' }).click();
      await page.waitForURL(/\/lab-data\/runs\/\d+$/);
      await page.locator('h1', { hasText: 'Specimen 1' }).waitFor();
      // plotly (a large lazy chunk) parses slowly on a busy two-core machine.
      await page.locator('wick-plot .main-svg').first().waitFor({ timeout: 60_000 });
      const equilibrium = await page.locator('[data-test=equilibrium]').innerText();
      expect(equilibrium).toMatch(/mm \(95 %: .* mm\)/);
      expect(await page.locator('[data-test=permeability]').innerText()).toContain('µm²');
      await screenshot(page, 'lab-run-fit');

      // — a window of her own, refitted in the browser, then saved —
      await page.locator('mat-button-toggle', { hasText: 'All points' }).locator('button').click();
      await page.getByText('Not saved').waitFor();
      expect(await page.locator('[data-test=window]').innerText()).toContain('36 points');
      await page.getByRole('button', { name: 'Save fit settings' }).click();
      await page.getByText('Fit settings saved').waitFor();

      // — the set: propose its values to the library —
      await page.getByRole('link', { name: setName }).click();
      await page.waitForURL(/\/lab-data\/sets\/\d+$/);
      await page.locator('h1', { hasText: setName }).waitFor();
      await page.getByRole('button', { name: /Propose to library/ }).click();
      await page.getByRole('status').getByText(/created and submitted for review/).waitFor();
      await screenshot(page, 'lab-set-proposed');
      await signOut(page);

      // — Grace, reviewer: the proposed revision in her queue, approved —
      await signIn(page, 'grace', '/reviews');
      await page.getByRole('link', { name: WEB }).first().click();
      await page.waitForURL(/\/materials\/webs\/\d+$/);
      // The revision's note names the set and links to it.
      await page.locator('.notes', { hasText: setName }).waitFor();
      await page.getByRole('textbox', { name: /Comment/ }).fill('Fitted permeability and curves checked against the runs.');
      await page.getByRole('button', { name: /Approve/ }).click();
      await page.getByText('Approved: this revision is now in force.').waitFor();
      await screenshot(page, 'lab-proposal-approved');

      const requests = await mailFor(`Review requested: web "${WEB}"`);
      expect(requests.length).toBeGreaterThan(0);
      expect(errors).toEqual([]);
      await context.close();
    },
    JOURNEY_MS,
  );
});
