import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';
import type { Permission, VariantDetail } from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { RECOMPUTE_DEBOUNCE_MS, VariantEditor } from './variant-editor';

function fakeAuth(permissions: Permission[]) {
  return { status: signal('signed-in'), load: () => Promise.resolve(), can: (p: Permission) => permissions.includes(p), permissions: signal(new Set(permissions)) };
}

const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function setup(permissions: Permission[] = ['designs:read', 'designs:edit', 'designs:export']) {
  TestBed.configureTestingModule({
    imports: [VariantEditor],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: AuthStore, useValue: fakeAuth(permissions) }],
  });
  const fixture = TestBed.createComponent(VariantEditor);
  fixture.componentRef.setInput('designId', '7');
  fixture.detectChanges();
  const http = TestBed.inject(HttpTestingController);
  http.expectOne('/api/designs/7').flush({ id: 7, projectId: 3, projectName: 'Demo', name: 'ADL', description: '', variants: [] });
  await fixture.whenStable();
  fixture.detectChanges();
  return { fixture, http, loader: TestbedHarnessEnvironment.loader(fixture), el: fixture.nativeElement as HTMLElement };
}

/** The text input of a field: the input itself (plain fields) or the one inside a unit-aware control. */
async function inputOf(loader: ReturnType<typeof TestbedHarnessEnvironment.loader>, field: string): Promise<MatInputHarness> {
  const own = await loader.getHarnessOrNull(MatInputHarness.with({ selector: `[data-field="${field}"]` }));
  if (own) return own;
  return (await loader.getChildLoader(`wick-unit-input[data-field="${field}"]`)).getHarness(MatInputHarness);
}

describe('VariantEditor', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('computes a new variant in the browser without asking the server', async () => {
    const { el } = await setup();
    expect(el.querySelector('[data-testid="equilibrium"]')?.textContent).toMatch(/mm/);
    expect(el.querySelector('[data-testid="checkpoints-times"] tbody')?.children.length).toBe(5);
    expect(el.querySelector('.origin')?.textContent).toContain('browser');
  });

  it('replaces the results by a message naming the field when a value is physically impossible, and will not save', async () => {
    const { fixture, loader, el } = await setup();
    const thickness = await inputOf(loader, 'structure.thickness');
    await thickness.setValue('0.001'); // mm: 50 g/m² in 1 µm is denser than the fibre
    await wait(RECOMPUTE_DEBOUNCE_MS + 50);
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="invalid"]')?.textContent).toContain('denser than the fibre');
    expect(el.querySelector('[data-testid="invalid"] .field')?.textContent).toContain('Thickness');
    expect(el.querySelector('[data-testid="equilibrium"]')).toBeNull();
    const save = await loader.getHarness(MatButtonHarness.with({ text: /Save variant/ }));
    expect(await save.isDisabled()).toBeTrue();
  });

  it('saves the inputs and shows the server’s recomputation afterwards', async () => {
    const { fixture, http, loader, el } = await setup();
    const name = await inputOf(loader, 'name');
    await name.setValue('Spec variant');
    await wait(RECOMPUTE_DEBOUNCE_MS + 50);
    const save = await loader.getHarness(MatButtonHarness.with({ text: /Save variant/ }));
    await save.click();
    const req = http.expectOne('/api/designs/7/variants');
    expect(req.request.method).toBe('POST');
    expect(req.request.body.name).toBe('Spec variant');
    expect(req.request.body.inputs.structure.thickness).toBe(0.001);
    const { evaluateVariant, DEFAULT_VARIANT_OPTIONS } = await import('wick-core');
    const results = evaluateVariant(req.request.body.inputs, DEFAULT_VARIANT_OPTIONS);
    const saved: VariantDetail = {
      id: 41, designId: 7, designName: 'ADL', projectId: 3, projectName: 'Demo', name: 'Spec variant', notes: '',
      inputs: req.request.body.inputs, options: DEFAULT_VARIANT_OPTIONS, results, coreVersion: results.coreVersion,
      currentCoreVersion: results.coreVersion, materials: [], usesUnapproved: false, hasNewerMaterials: false, version: 1,
      createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z', createdBy: { id: 1, name: 'P' }, updatedBy: { id: 1, name: 'P' },
    };
    req.flush(saved);
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[data-testid="message"]')?.textContent).toContain('Saved');
    expect(el.querySelector('.origin')?.textContent).toContain('server');
  });

  it('is read-only for a programme manager (no save button, fields disabled)', async () => {
    const { loader } = await setup(['designs:read', 'designs:export']);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Save/ }))).toEqual([]);
    expect(await (await inputOf(loader, 'structure.thickness')).isDisabled()).toBeTrue();
  });
});
