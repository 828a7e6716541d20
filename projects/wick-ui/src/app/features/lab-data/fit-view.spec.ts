import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { DeferBlockBehavior, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { FitSettings } from 'wick-core';
import { FitView } from './fit-view';
import { labRun } from './testing';

describe('FitView', () => {
  async function setup(run = labRun()) {
    TestBed.configureTestingModule({ imports: [FitView], deferBlockBehavior: DeferBlockBehavior.Manual });
    const fixture = TestBed.createComponent(FitView);
    fixture.componentRef.setInput('run', run);
    fixture.componentRef.setInput('editable', true);
    fixture.detectChanges();
    await fixture.whenStable();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), el: fixture.nativeElement as HTMLElement };
  }

  const settle = async (fixture: { detectChanges(): void; whenStable(): Promise<unknown> }) => {
    // The settings are debounced by 200 ms before the browser refits.
    await new Promise((r) => setTimeout(r, 250));
    fixture.detectChanges();
    await fixture.whenStable();
  };

  it('shows the saved fits: the suggested window, h_eq with its interval and the permeability', async () => {
    const { el } = await setup();
    const run = labRun();
    expect(el.querySelector('[data-test=window]')?.textContent).toContain(`${run.analysis.washburn!.window.count} points`);
    // h_eq = a/b = 60 mm for the fixture curve (exact data: the interval collapses on it).
    expect(el.querySelector('[data-test=equilibrium]')?.textContent).toContain('60 mm');
    expect(el.querySelector('[data-test=permeability]')?.textContent).toContain('µm²');
    expect(el.textContent).toContain('Suggested window');
  });

  it('refits in the browser when the window changes, and saves the settings on request', async () => {
    const { fixture, loader, el } = await setup();
    const saved: FitSettings[] = [];
    fixture.componentInstance.save.subscribe((s) => saved.push(s));
    const save = await loader.getHarness(MatButtonHarness.with({ text: 'Save fit settings' }));
    expect(await save.isDisabled()).toBeTrue();
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Custom' }))).check();
    await settle(fixture);
    const [from, to] = await loader.getAllHarnesses(MatInputHarness.with({ selector: '[type=number]' }));
    await from.setValue('40');
    await to.setValue('200');
    await settle(fixture);
    // 40–200 s at 20 s spacing: 9 readings.
    expect(el.querySelector('[data-test=window]')?.textContent).toContain('40–200 s, 9 points');
    expect(el.textContent).toContain('Not saved');
    expect(await save.isDisabled()).toBeFalse();
    await save.click();
    expect(saved).toEqual([{ window: { start: 40, end: 200 }, intercept: false, contactAngle: null }]);
  });

  it('says why the Washburn fit fails for a window with too few points', async () => {
    const { fixture, loader, el } = await setup();
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Custom' }))).check();
    await settle(fixture);
    const [from, to] = await loader.getAllHarnesses(MatInputHarness.with({ selector: '[type=number]' }));
    await from.setValue('40');
    await to.setValue('60');
    await settle(fixture);
    expect(el.querySelector('[role=alert]')?.textContent).toContain('at least 3');
  });
});
