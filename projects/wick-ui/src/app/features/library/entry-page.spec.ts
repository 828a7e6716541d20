import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { DeferBlockBehavior, TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';
import { EntryPage } from './entry-page';
import { GRACE, revision, settle, summaryOf, TOMAS, webData, webEntry } from './testing';

describe('EntryPage', () => {
  let http: HttpTestingController;

  async function open(entry = webEntry()) {
    TestBed.configureTestingModule({
      imports: [EntryPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
      // Plots stay placeholders: plotly is not what these specs are about.
      deferBlockBehavior: DeferBlockBehavior.Manual,
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(EntryPage);
    fixture.componentRef.setInput('collection', 'webs');
    fixture.componentRef.setInput('id', String(entry.id));
    fixture.detectChanges();
    http.expectOne('/api/library/webs/7').flush(entry);
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), el: fixture.nativeElement as HTMLElement };
  }

  afterEach(() => http.verify());

  it('shows the properties with their units and sources, and the draft actions', async () => {
    const { el, loader } = await open();
    expect(el.querySelector('h1')?.textContent).toContain('AL-150 airlaid core');
    const props = el.querySelector('wick-entry-properties')!.textContent!;
    expect(props).toContain('150 g/m²');
    expect(props).toContain('Supplier datasheet');
    expect(props).toContain('1.9 mm');
    expect(props).toContain('Porosity (computed)');
    expect(await loader.getHarness(MatButtonHarness.with({ text: /Submit for review/ }))).toBeTruthy();
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Approve/ }))).toEqual([]);
  });

  it('submits with the version it shows and reports that the reviewers are told', async () => {
    const { loader, el, fixture } = await open();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Submit for review/ }))).click();
    const req = http.expectOne('/api/library/webs/7/submit');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ version: 4 });
    req.flush(webEntry({ version: 5, actions: { edit: false, submit: false, approve: false, return: false, deleteDraft: false } }, { state: 'in-review', submittedBy: TOMAS }));
    await settle(fixture);
    expect(el.querySelector('[role=status]')?.textContent).toContain('Every reviewer gets an e-mail');
    expect(el.querySelector('.state')?.textContent).toContain('In review');
  });

  it('lets a reviewer return with a comment (required) or approve', async () => {
    const inReview = webEntry({ actions: { edit: false, submit: false, approve: true, return: true, deleteDraft: false } }, { state: 'in-review', submittedBy: TOMAS });
    const { loader, fixture } = await open(inReview);
    const back = await loader.getHarness(MatButtonHarness.with({ text: /Return/ }));
    expect(await back.isDisabled()).toBeTrue();
    await (await loader.getHarness(MatInputHarness.with({ selector: 'textarea' }))).setValue('Add the pressure of the thickness.');
    expect(await back.isDisabled()).toBeFalse();
    await back.click();
    const req = http.expectOne('/api/library/webs/7/return');
    expect(req.request.body).toEqual({ version: 4, comment: 'Add the pressure of the thickness.' });
    req.flush(webEntry({ version: 5 }, { state: 'returned', reviewedBy: GRACE, reviewComment: 'Add the pressure of the thickness.' }));
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).querySelector('.returned')?.textContent).toContain('Add the pressure of the thickness.');
  });

  it('when the entry changed meanwhile, shows the current version and says nothing was decided', async () => {
    const inReview = webEntry({ actions: { edit: false, submit: false, approve: true, return: true, deleteDraft: false } }, { state: 'in-review', submittedBy: TOMAS });
    const { loader, fixture, el } = await open(inReview);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Approve/ }))).click();
    const current = webEntry({ version: 6 }, { state: 'returned', name: 'AL-150 airlaid core (renamed)', reviewedBy: GRACE, reviewComment: 'x' });
    http.expectOne('/api/library/webs/7/approve').flush(
      { error: { code: 'version-conflict', message: 'This entry changed since you opened it.', details: { current } } },
      { status: 409, statusText: 'Conflict' },
    );
    await settle(fixture);
    expect(el.querySelector('[role=alert]')?.textContent).toContain('This entry changed since you opened it.');
    expect(el.querySelector('h1')?.textContent).toContain('(renamed)');
  });

  it('explains four-eyes instead of offering a decision on one’s own submission', async () => {
    const own = webEntry(
      { actions: { edit: false, submit: false, approve: false, return: false, deleteDraft: false, reviewBlockedReason: 'You created, edited or submitted this revision: a second reviewer must decide on it.' } },
      { state: 'in-review', submittedBy: TOMAS },
    );
    const { loader, el } = await open(own);
    expect(el.querySelector('.review')?.textContent).toContain('a second reviewer must decide');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Approve/ }))).toEqual([]);
  });

  it('shows the approved revision in force, the distribution file and the history with a diff', async () => {
    const approved = revision({ number: 1, state: 'approved', reviewedBy: GRACE, reviewedAt: '2026-11-02T10:00:00.000Z' });
    const head = revision({
      number: 2,
      data: webData({ poreSizeDistribution: { form: 'cumulative-finer', diameterUnit: 'um', diameters: [2e-5, 4e-5], fractions: [0.4, 1], source: 'measured', file: { fileId: 9, fileName: 'run.csv', sha256: 'a'.repeat(64) } } }),
    });
    const { loader, el, fixture } = await open(webEntry({ approved, revisions: [summaryOf(head), summaryOf(approved)] }, head));
    expect(el.querySelector('.in-force')?.textContent).toContain('Revision 1');
    expect(el.querySelector('.file a')?.getAttribute('href')).toBe('/api/library/files/9');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Show changes' }))).click();
    const diff = http.expectOne((r) => r.url === '/api/library/webs/7/diff');
    expect(diff.request.params.get('from')).toBe('1');
    expect(diff.request.params.get('to')).toBe('2');
    diff.flush({ from: 1, to: 2, changes: [{ path: 'data.basisWeight.si', before: 0.12, after: 0.15 }] });
    await settle(fixture);
    expect(el.querySelector('.diff')?.textContent).toContain('data.basisWeight.si');
  });
});
