import type { Browser, Page } from 'playwright-core';
import type { MailboxMessage } from 'wick-core';
import { APP_URL, launch, openPage, screenshot } from './support/browser';
import { signIn, signOut } from './support/sign-in';

/** Three people sign in through the provider's pages; the suite's default 5 s is far too short. */
const JOURNEY_MS = 180_000;
const MAIL_API = process.env['WICK_E2E_MAIL_API'] ?? 'http://127.0.0.1:4726';

/** A cumulative pore-size distribution as a porometer exports it: largest pores first, a comment line. */
const PSD_CSV = [
  '# capillary flow porometry, specimen 3',
  'diameter (µm);cumulative finer (%)',
  '300;100',
  '200;88',
  '120;61',
  '80;34',
  '40;9',
  '20;2',
  '',
].join('\n');

function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && errors.push(`${page.url()}: ${m.text()}`));
  page.on('pageerror', (e) => errors.push(`${page.url()}: ${e.message}`));
  return errors;
}

/** Messages the mail fake holds for a subject part, waiting a little: mail goes out after the commit. */
async function mailFor(subjectPart: string, count: number): Promise<MailboxMessage[]> {
  const end = Date.now() + 15_000;
  for (;;) {
    const all = (await (await fetch(`${MAIL_API}/messages`)).json()) as MailboxMessage[];
    const hits = all.filter((m) => m.subject.includes(subjectPart));
    if (hits.length >= count || Date.now() > end) return hits;
    await new Promise((r) => setTimeout(r, 250));
  }
}

async function chooseOption(page: Page, combobox: string, option: string | RegExp): Promise<void> {
  await page.getByRole('combobox', { name: combobox }).click();
  await page.getByRole('option', { name: option }).click();
}

describe('material library: a web from draft to approval', () => {
  let browser: Browser;
  beforeAll(async () => (browser = await launch()), JOURNEY_MS);
  afterAll(async () => browser?.close());

  it(
    'when a materials scientist creates a web, uploads its pore-size distribution and submits it, and a reviewer approves it, then the e-mails arrive in the dev mailbox',
    async () => {
      const name = `Trial airlaid AL-130 ${Date.now().toString(36)}`;
      const { context, page } = await openPage(browser);
      const errors = watchErrors(page);

      // — Tomás, materials scientist: create the web —
      await signIn(page, 'tomas', '/materials/webs');
      // The demo library is there, server-paged.
      await page.locator('wick-entry-table tr.row', { hasText: 'Calloway TAB-40 acquisition layer' }).waitFor();
      await screenshot(page, 'library-webs');
      await page.getByRole('link', { name: /New web/ }).click();
      await page.waitForURL('**/materials/webs/new');
      await page.getByRole('textbox', { name: 'Name', exact: true }).fill(name);
      await chooseOption(page, 'Supplier', 'Pinecrest Pulp Co.');
      await chooseOption(page, 'Kind of web', 'Airlaid');
      await chooseOption(page, 'Library fibre', 'Pinecrest fluff pulp, southern softwood');
      await page.getByRole('spinbutton', { name: 'Share' }).fill('100');
      await page.getByRole('textbox', { name: 'Basis weight', exact: true }).fill('130');
      await page.getByRole('textbox', { name: 'Thickness', exact: true }).fill('1.8');
      await page.getByRole('textbox', { name: 'Thickness measured under', exact: true }).fill('0.5');
      await screenshot(page, 'library-new-web');
      await page.getByRole('button', { name: /Save draft/ }).click();
      await page.waitForURL(/\/materials\/webs\/\d+$/);
      const entryUrl = page.url();
      await page.locator('h1', { hasText: name }).waitFor();
      const props = await page.locator('wick-entry-properties').innerText();
      expect(props).toContain('130 g/m²');
      expect(props).toContain('Porosity (computed)');

      // — upload the distribution: preview first, then apply —
      await page
        .locator('wick-upload-panel[purpose="psd"] input[type=file]')
        .setInputFiles({ name: 'al-130-porometry.csv', mimeType: 'text/csv', buffer: Buffer.from(PSD_CSV, 'utf8') });
      const panel = page.locator('wick-upload-panel[purpose="psd"]');
      await panel.getByText('Read 6 rows from al-130-porometry.csv').waitFor();
      expect(await panel.innerText()).toContain('largest diameter down');
      await panel.getByRole('button', { name: 'Apply' }).click();
      await page.getByText('The distribution was added to the draft.').waitFor();
      // The plot loads (with plotly) when its section scrolls into view.
      await page.locator('section[aria-label="Pore-size distribution"]').scrollIntoViewIfNeeded();
      await page.locator('wick-plot .main-svg').first().waitFor({ timeout: 30_000 });
      expect(await page.locator('.file a').innerText()).toBe('al-130-porometry.csv');
      await screenshot(page, 'library-web-with-psd');

      await page.getByRole('button', { name: /Submit for review/ }).click();
      await page.getByText('Submitted for review.').waitFor();
      expect(await page.locator('.meta .state').innerText()).toBe('In review');
      await signOut(page);

      // — Grace, reviewer: the queue, then approve —
      await signIn(page, 'grace', '/reviews');
      await page.getByRole('link', { name }).click();
      await page.waitForURL(entryUrl);
      await page.getByRole('textbox', { name: /Comment/ }).fill('Distribution and datasheet agree.');
      await page.getByRole('button', { name: /Approve/ }).click();
      await page.getByText('Approved: this revision is now in force.').waitFor();
      expect(await page.locator('.meta .state').innerText()).toBe('Approved');
      await screenshot(page, 'library-approved');
      await signOut(page);

      // — the messages, in the fake's store and on the admin's dev mailbox page —
      const requests = await mailFor(`Review requested: web "${name}"`, 2);
      expect(requests.flatMap((m) => m.to).sort()).toEqual(['grace.adebayo@brightwell.example', 'lena.moreau@brightwell.example']);
      expect(requests[0].text).toContain(new URL(entryUrl).pathname);
      const approvals = await mailFor(`Approved: web "${name}"`, 1);
      expect(approvals.map((m) => m.to)).toEqual([['tomas.lindqvist@brightwell.example']]);
      expect(approvals[0].text).toContain('Distribution and datasheet agree.');

      await signIn(page, 'ada', '/dev-mailbox');
      const panels = page.locator('mat-expansion-panel', { hasText: name });
      await panels.first().waitFor();
      const titles = await panels.locator('mat-panel-title').allInnerTexts();
      expect(titles.filter((t) => t.startsWith('Review requested')).length).toBe(2);
      expect(titles.filter((t) => t.startsWith('Approved')).length).toBe(1);
      await screenshot(page, 'library-dev-mailbox');

      expect(errors).toEqual([]);
      await context.close();
    },
    JOURNEY_MS,
  );

  it('when the API documentation is fetched, then it describes the library routes', async () => {
    const doc = (await (await fetch(`${APP_URL}/api/docs`)).json()) as { paths: Record<string, unknown> };
    expect(Object.keys(doc.paths)).toContain('/api/library/webs/{id}/approve');
  });
});
