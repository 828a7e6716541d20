import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatTabGroupHarness } from '@angular/material/tabs/testing';
import { evaluateStackVariant, STACK_VARIANT_EXAMPLE, type StackVariantResults } from 'wick-core';
import { retentionText, StackResults, showVolume } from './stack-results';

let completed: StackVariantResults;

function setup(results: StackVariantResults, source: 'browser' | 'server' = 'browser') {
  TestBed.configureTestingModule({ imports: [StackResults] });
  const fixture = TestBed.createComponent(StackResults);
  fixture.componentRef.setInput('results', results);
  fixture.componentRef.setInput('source', source);
  fixture.componentRef.setInput('computeMs', 123.4);
  fixture.detectChanges();
  return { fixture, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
}

describe('StackResults', () => {
  beforeAll(() => (completed = evaluateStackVariant({ ...STACK_VARIANT_EXAMPLE, cells: 60 })));

  it('lists every gush with its acquisition time, and the surface, rewet, capacity and balance figures', () => {
    const { el } = setup(completed);
    const rows = el.querySelectorAll('[data-testid="insults"] tbody tr');
    expect(rows.length).toBe(3);
    expect(rows[0].querySelector('[data-testid="acquisition"]')!.textContent).toContain('s');
    expect(el.querySelector('[data-testid="rewet"]')!.textContent).toContain('mL');
    expect(el.querySelector('[data-testid="capacity-used"]')!.textContent).toContain('%');
    expect(el.querySelector('[data-testid="mass-balance"]')!.textContent).toContain('of the volume absorbed');
    expect(el.querySelector('[data-testid="origin"]')!.textContent).toContain('123 ms');
    expect(el.querySelectorAll('[data-testid="layers-table"] tbody tr').length).toBe(3);
    expect(el.querySelector('[data-testid="partial"]')).toBeNull();
  });

  it('shows the heat map first and the curves on their tabs', async () => {
    const { el, loader } = setup(completed);
    expect(el.querySelector('[data-testid="heat-map"]')).not.toBeNull();
    const tabs = await loader.getHarness(MatTabGroupHarness);
    await tabs.selectTab({ label: 'Uptake' });
    expect(el.querySelector('[data-testid="volume-plot"]')).not.toBeNull();
    await tabs.selectTab({ label: 'Wetting front' });
    expect(el.querySelector('[data-testid="front-plot"]')).not.toBeNull();
  });

  it('says when a run was cancelled and where the record comes from', () => {
    const partial = { ...completed, run: 'cancelled' as const, timeReached: 120 };
    const { el } = setup(partial, 'server');
    expect(el.querySelector('[data-testid="partial"]')!.textContent).toContain('120 s');
    expect(el.querySelector('[data-testid="origin"]')!.textContent).toContain('server');
  });

  it('writes volumes in mL and retention curves with their parameters', () => {
    expect(showVolume(15e-6)).toBe('15 mL');
    expect(showVolume(null)).toBe('—');
    expect(retentionText({ mode: 'van-genuchten', alpha: 1 / 400, n: 3, entryPressure: null, lambda: null })).toContain('400 Pa');
    expect(retentionText({ mode: 'brooks-corey', alpha: null, n: null, entryPressure: 150, lambda: 2 })).toContain('λ 2');
  });
});
