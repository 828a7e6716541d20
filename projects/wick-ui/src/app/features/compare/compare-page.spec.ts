import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import { provideRouter } from '@angular/router';
import { compareKeyFigures, evaluateVariant, type CompareResponse, type Permission, type VariantInputs } from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { ComparePage } from './compare-page';

const deg = (d: number) => (d * Math.PI) / 180;
function strip(thickness: number): VariantInputs {
  return {
    configuration: 'vertical-strip',
    structure: { fibreDiameter: 20e-6, fibreDensity: 1390, basisWeight: 0.05, thickness, contactAngle: deg(50), permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' } },
    liquid: { ref: 'water', temperature: 293.15 },
    dimensions: { width: 0.025, duration: 600 },
    checkpoints: { heights: [0.01], times: [60] },
  };
}

function comparison(): CompareResponse {
  const rows = [0.0008, 0.001, 0.0012].map((t, i) => ({ id: i + 1, results: evaluateVariant(strip(t), { curvePoints: 50 }) }));
  return {
    baselineId: 2,
    variants: rows.map((r) => ({
      id: r.id, name: `V${r.id}`, designName: 'D', projectId: 1, projectName: 'P', configuration: 'vertical-strip', status: 'ok',
      usesUnapproved: r.id === 3, materials: [], curve: r.results.status === 'ok' ? { time: r.results.curves.time, height: r.results.curves.height } : null,
    })),
    figures: compareKeyFigures(rows, 2),
    decisions: [],
  };
}

async function setup(permissions: Permission[]) {
  TestBed.configureTestingModule({
    imports: [ComparePage],
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      provideRouter([]),
      { provide: AuthStore, useValue: { status: signal('signed-in'), load: () => Promise.resolve(), can: (p: Permission) => permissions.includes(p) } },
    ],
  });
  const fixture = TestBed.createComponent(ComparePage);
  fixture.componentRef.setInput('variants', '1,2,3');
  fixture.componentRef.setInput('baseline', '2');
  fixture.detectChanges();
  const http = TestBed.inject(HttpTestingController);
  http.expectOne((r) => r.url === '/api/compare' && r.params.get('variants') === '1,2,3' && r.params.get('baseline') === '2').flush(comparison());
  await fixture.whenStable();
  fixture.detectChanges();
  return { fixture, http, loader: TestbedHarnessEnvironment.loader(fixture), el: fixture.nativeElement as HTMLElement };
}

describe('ComparePage', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('shows each figure per variant with deltas, marks the best and the unapproved material', async () => {
    const { el } = await setup(['designs:read', 'designs:export']);
    const table = el.querySelector('[data-testid="compare-table"]')!;
    expect(table.querySelectorAll('thead th').length).toBe(4);
    // The thinnest web (highest capillary pressure) has the highest equilibrium height: best, +% against the baseline.
    const eqRow = [...table.querySelectorAll('tbody tr')].find((tr) => tr.querySelector('th')?.textContent?.includes('Equilibrium height'))!;
    expect(eqRow.querySelectorAll('td')[0].classList).toContain('best');
    expect(eqRow.querySelectorAll('td')[0].textContent).toContain('+');
    expect(el.querySelector('[data-testid="unapproved-3"]')).not.toBeNull();
    expect(el.querySelector('[data-testid="compare-csv"]')?.getAttribute('href')).toBe('/api/compare/export.csv?variants=1,2,3&baseline=2');
    expect(el.querySelector('[data-testid="decision-form"]')).toBeNull();
  });

  it('lets a programme manager record the decision with a rationale', async () => {
    const { fixture, http, loader, el } = await setup(['designs:read', 'designs:export', 'decisions:record']);
    const radios = await loader.getHarness(MatRadioGroupHarness);
    await radios.checkRadioButton({ label: 'V1' });
    const rationale = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="rationale"]' }));
    await rationale.setValue('Fastest rise at 60 s.');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Record decision/ }))).click();
    const req = http.expectOne('/api/decisions');
    expect(req.request.body).toEqual({ variantIds: [1, 2, 3], baselineVariantId: 2, chosenVariantId: 1, rationale: 'Fastest rise at 60 s.' });
    req.flush({ id: 9, projectId: 1, variantIds: [1, 2, 3], baselineVariantId: 2, chosenVariantId: 1, chosenVariantName: 'V1', rationale: 'Fastest rise at 60 s.', decidedBy: { id: 4, name: 'M' }, decidedAt: '2026-01-01T00:00:00Z' });
    await fixture.whenStable();
    http.expectOne((r) => r.url === '/api/compare').flush({ ...comparison(), decisions: [] });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[data-testid="decision-message"]')?.textContent).toContain('V1');
  });

  it('without a selection, opens the only project straight away and lists its decisions with a link back to each comparison', async () => {
    TestBed.configureTestingModule({
      imports: [ComparePage],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: AuthStore, useValue: { status: signal('signed-in'), load: () => Promise.resolve(), can: (p: Permission) => p === 'designs:read' } },
      ],
    });
    const fixture = TestBed.createComponent(ComparePage);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    const summary = { id: 5, name: 'Pad', description: '', designCount: 1, variantCount: 2, updatedAt: '2026-01-01T00:00:00Z' };
    http.expectOne('/api/projects').flush([summary]);
    await fixture.whenStable();
    const variant = (id: number, name: string) => ({ id, name, configuration: 'vertical-strip', status: 'ok', usesUnapproved: false, headline: [], updatedAt: '', updatedBy: { id: 1, name: 'P' } });
    http.expectOne('/api/projects/5').flush({
      ...summary,
      designs: [{ id: 7, projectId: 5, name: 'ADL', description: '', variants: [variant(11, 'A'), variant(12, 'B')] }],
      decisions: [{ id: 3, projectId: 5, variantIds: [11, 12], baselineVariantId: 12, chosenVariantId: 11, chosenVariantName: 'A', rationale: 'Faster.', decidedBy: { id: 4, name: 'Martin' }, decidedAt: '2026-01-02T10:00:00Z' }],
    });
    await fixture.whenStable();
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelectorAll('mat-checkbox').length).toBe(2);
    const decisions = el.querySelector('[data-testid="project-decisions"]')!;
    expect(decisions.textContent).toContain('A');
    expect(decisions.textContent).toContain('Martin');
    expect(decisions.textContent).toContain('Faster.');
    expect(decisions.querySelector('a')?.getAttribute('href')).toBe('/compare?variants=11,12&baseline=12');
  });
});
