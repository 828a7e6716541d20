import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter, Router } from '@angular/router';
import { evaluateStackVariant, isDomainError, STACK_VARIANT_EXAMPLE, type StackVariantInputs, type WebData } from 'wick-core';
import { AuthStore } from '../../../core/auth/auth-store';
import type { StackWorkerMessage, StackWorkerRequest } from './stack-protocol';
import { STACK_WORKER } from './stack-run';
import { StackEditor } from './stack-editor';

const pv = (si: number, unit = '1') => ({ si, unit, source: 'measured' as const });

/** Runs the evaluator on the page's thread, answering like the worker (progress first, then the result). */
class InlineWorker {
  onmessage: ((e: MessageEvent<StackWorkerMessage>) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  readonly requests: StackWorkerRequest[] = [];
  hold = false;
  postMessage(req: StackWorkerRequest): void {
    this.requests.push(req);
    const send = (m: StackWorkerMessage) => this.onmessage?.({ data: m } as MessageEvent<StackWorkerMessage>);
    setTimeout(() => {
      send({ id: req.id, kind: 'progress', fraction: 0.5 });
      if (this.hold) return;
      try {
        send({ id: req.id, kind: 'done', results: evaluateStackVariant(req.inputs, req.options), computeMs: 5 });
      } catch (e) {
        if (!isDomainError(e)) throw e;
        send({ id: req.id, kind: 'invalid', message: e.message, field: e.field ?? null, computeMs: 1 });
      }
    });
  }
  terminate(): void {}
}

const WEB: WebData = {
  webKind: 'carded-through-air-bonded',
  blend: [{ fibreId: 4, fibreName: 'PET', massFraction: 1 }],
  basisWeight: pv(0.04, 'g/m^2'),
  thickness: pv(1.5e-3, 'mm'),
  thicknessPressure: pv(500, 'Pa'),
  porosityMode: 'computed',
  permeabilityThroughPlane: { mode: 'measured', value: pv(3e-10, 'm^2') },
  poreSizeDistribution: {
    form: 'differential',
    diameterUnit: 'um',
    diameters: [40e-6, 80e-6, 120e-6, 160e-6, 240e-6],
    fractions: [0.1, 0.3, 0.3, 0.2, 0.1],
    source: 'measured',
  },
  curves: [],
};
const revision = (number: number, name: string, data: unknown) => ({ number, state: 'approved', name, data });

async function setup(options: { canEdit?: boolean; variantId?: string } = {}) {
  const worker = new InlineWorker();
  const canEdit = signal(options.canEdit ?? true);
  TestBed.configureTestingModule({
    imports: [StackEditor],
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      provideRouter([]),
      { provide: AuthStore, useValue: { can: () => canEdit() } },
      { provide: STACK_WORKER, useValue: () => worker },
    ],
  });
  const http = TestBed.inject(HttpTestingController);
  const fixture = TestBed.createComponent(StackEditor);
  if (options.variantId) fixture.componentRef.setInput('variantId', options.variantId);
  else fixture.componentRef.setInput('designId', '5');
  fixture.detectChanges();
  http.expectOne((r) => r.url === '/api/library/webs').flush({ items: [{ id: 7, name: 'TAB-40 acquisition layer', approvedRevision: 2, headRevision: 2, state: 'approved' }], total: 1, page: 1, pageSize: 200 });
  http.expectOne((r) => r.url === '/api/library/liquids').flush({ items: [], total: 0, page: 1, pageSize: 200 });
  if (!options.variantId) http.expectOne('/api/designs/5').flush({ id: 5, projectId: 2, name: 'Night pad', description: '', variants: [], projectName: 'P' });
  await fixture.whenStable();
  return { fixture, http, worker, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
}

/** Waits (polling) until `check` holds: the worker and the page answer on their own schedule. */
async function until(fixture: { whenStable(): Promise<unknown> }, check: () => boolean, timeoutMs = 15000): Promise<void> {
  const t0 = performance.now();
  while (!check()) {
    if (performance.now() - t0 > timeoutMs) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 20));
    await fixture.whenStable();
  }
}

/** Lets promise continuations and the zoneless change detection they schedule run. */
async function settle(fixture: { whenStable(): Promise<unknown> }, ms = 0): Promise<void> {
  await new Promise((r) => setTimeout(r, ms));
  await fixture.whenStable();
}

async function addLibraryWeb(loader: HarnessLoader, http: HttpTestingController, fixture: { whenStable(): Promise<unknown> }) {
  const select = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="web-select"]' }));
  await select.open();
  await select.clickOptions({ text: /TAB-40/ });
  await (await loader.getHarness(MatButtonHarness.with({ text: /Add this layer/ }))).click();
  http.expectOne('/api/library/webs/7').flush({ id: 7, approved: revision(2, 'TAB-40 acquisition layer', WEB), head: revision(2, 'TAB-40 acquisition layer', WEB) });
  http.expectOne('/api/library/fibres/4').flush({
    id: 4,
    approved: revision(1, 'PET 6.7 dtex', { polymer: 'PET', density: pv(1380), diameter: pv(25e-6), contactAngles: [{ liquid: 'water', angle: pv(1), method: 'Wilhelmy' }] }),
    head: null,
  });
  await settle(fixture);
}

describe('StackEditor', () => {
  // Compiling the editor with its Material modules and running stacks on the page's thread take seconds.
  let timeout: number;
  beforeAll(() => {
    timeout = jasmine.DEFAULT_TIMEOUT_INTERVAL;
    jasmine.DEFAULT_TIMEOUT_INTERVAL = 30000;
  });
  afterAll(() => (jasmine.DEFAULT_TIMEOUT_INTERVAL = timeout));
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('builds a stack from a library web (pinned revision, through-plane permeability, pore-size retention)', async () => {
    const { el, loader, http, fixture } = await setup();
    expect(el.querySelector('h1')!.textContent).toContain('Stack 1');
    await addLibraryWeb(loader, http, fixture);
    expect(el.querySelectorAll('wick-stack-layer-card').length).toBe(1);
    expect(el.querySelector('[data-testid="layer-pin"]')!.textContent).toContain('revision 2');
    const retention = await loader.getHarness(MatSelectHarness.with({ selector: '[data-field="layers[0].retention.mode"]' }));
    expect(await retention.getValueText()).toBe('From the pore-size distribution');
    const k = await loader.getHarness(MatInputHarness.with({ ancestor: '[data-field="layers[0].structure.permeability.value"]' }));
    expect(Number(await k.getValue())).toBeCloseTo(3e-10, 15);
  });

  it('runs the stack with a progress bar and shows the results with the heat map', async () => {
    const { el, loader, http, fixture, worker } = await setup();
    await addLibraryWeb(loader, http, fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a layer by hand/ }))).click();
    worker.hold = true;
    await (await loader.getHarness(MatButtonHarness.with({ text: /Run/ }))).click();
    await until(fixture, () => el.querySelector('[data-testid="percent"]')?.textContent?.includes('50 %') === true);
    const bar = await loader.getHarness(MatProgressBarHarness);
    expect(await bar.getValue()).toBe(50);
    expect(el.querySelector('[data-testid="percent"]')!.textContent).toContain('50 %');
    // Cancel without a shared flag ends the run with nothing to show.
    await (await loader.getHarness(MatButtonHarness.with({ text: /Cancel/ }))).click();
    expect(el.querySelector('[data-testid="run-status"]')!.textContent).toContain('Cancelled');

    worker.hold = false;
    await (await loader.getHarness(MatButtonHarness.with({ text: /Run/ }))).click();
    await until(fixture, () => el.querySelector('[data-testid="results"]') !== null);
    const sent = worker.requests[worker.requests.length - 1].inputs as StackVariantInputs;
    expect(sent.layers.map((l) => l.name)).toEqual(['TAB-40 acquisition layer', 'Layer 2']);
    expect(sent.layers[0].structure.web).toEqual({ kind: 'web', id: 7, revision: 2, name: 'TAB-40 acquisition layer', state: 'approved' });
    expect(el.querySelector('[data-testid="results"]')!.getAttribute('data-source')).toBe('browser');
    expect(el.querySelectorAll('[data-testid="insults"] tbody tr').length).toBe(3);
    expect(el.querySelector('[data-testid="heat-map"]')).not.toBeNull();
  });

  it('puts the evaluator’s message on the field it names', async () => {
    const { el, loader, fixture } = await setup();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a layer by hand/ }))).click();
    const interval = await loader.getHarness(MatInputHarness.with({ ancestor: '[data-field="insult.interval"]' }));
    // 0.01 min = 0.6 s, shorter than the 3 s it takes to deliver one gush.
    await interval.setValue('0.01');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Run/ }))).click();
    await until(fixture, () => el.querySelector('[data-testid="invalid"]') !== null);
    expect(el.querySelector('[data-testid="invalid"]')!.textContent).toContain('must not overlap');
    expect(el.querySelector('[data-field="insult.interval"] mat-error')!.textContent).toContain('must not overlap');
  });

  it('saves the stack as a variant of its design and shows the server’s record', async () => {
    const { loader, http, fixture, el } = await setup();
    const router = TestBed.inject(Router);
    spyOn(router, 'navigate').and.resolveTo(true);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a layer by hand/ }))).click();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save stack/ }))).click();
    const req = http.expectOne('/api/designs/5/variants');
    expect(req.request.method).toBe('POST');
    const body = req.request.body as { name: string; inputs: StackVariantInputs };
    expect(body.name).toBe('Stack 1');
    expect(body.inputs.configuration).toBe('stack');
    const results = evaluateStackVariant({ ...body.inputs, cells: 40 });
    req.flush({ id: 31, designId: 5, designName: 'Night pad', projectId: 2, name: 'Stack 1', notes: '', inputs: body.inputs, results, version: 1 });
    await settle(fixture);
    expect(router.navigate).toHaveBeenCalledWith(['/designs/stacks', 31], { replaceUrl: true, state: { message: jasmine.objectContaining({ kind: 'info' }) } });
    expect(el.querySelector('[data-testid="results"]')!.getAttribute('data-source')).toBe('server');
    expect(el.querySelector('[data-testid="message"]')!.textContent).toContain('Saved');
  });

  it('opens a saved stack read-only for a person who may not edit', async () => {
    const { el, http, fixture, loader } = await setup({ canEdit: false, variantId: '31' });
    const results = evaluateStackVariant({ ...STACK_VARIANT_EXAMPLE, cells: 40 });
    http.expectOne('/api/variants/31').flush({ id: 31, designId: 5, designName: 'Night pad', projectId: 2, name: 'Three gushes', notes: '', inputs: STACK_VARIANT_EXAMPLE, results, version: 3 });
    await settle(fixture);
    expect(el.querySelectorAll('wick-stack-layer-card').length).toBe(3);
    expect(el.querySelector('[data-testid="save"]')).toBeNull();
    expect(el.querySelector('[data-testid="add-web"]')).toBeNull();
    const name = await loader.getHarness(MatInputHarness.with({ selector: '[data-field="name"]' }));
    expect(await name.isDisabled()).toBeTrue();
    expect(await name.getValue()).toBe('Three gushes');
  });
});
