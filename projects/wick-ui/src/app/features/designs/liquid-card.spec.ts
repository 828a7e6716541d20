import { TestBed } from '@angular/core/testing';
import { NonNullableFormBuilder } from '@angular/forms';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { q } from './variant-form';
import { LiquidCard, type LiquidSource } from './liquid-card';

describe('LiquidCard', () => {
  async function setup() {
    TestBed.configureTestingModule({ imports: [LiquidCard] });
    const fb = TestBed.inject(NonNullableFormBuilder);
    const group = fb.group({
      source: fb.control<LiquidSource>('built-in'),
      builtIn: fb.control('water'),
      libraryId: fb.control<number | null>(null),
      temperature: fb.control(q(296.15, 'temperature')),
    });
    const fixture = TestBed.createComponent(LiquidCard);
    fixture.componentRef.setInput('group', group);
    const chosen: number[] = [];
    const sources: LiquidSource[] = [];
    fixture.componentInstance.libraryChosen.subscribe((id) => chosen.push(id));
    fixture.componentInstance.sourceChosen.subscribe((s) => sources.push(s));
    fixture.detectChanges();
    return { fixture, group, chosen, sources, loader: TestbedHarnessEnvironment.loader(fixture), el: fixture.nativeElement as HTMLElement };
  }

  it('offers the built-in liquids, then library liquids once loaded, marking the unapproved and reporting the choice', async () => {
    const { fixture, group, chosen, sources, loader, el } = await setup();
    expect(el.querySelector('[data-field="liquid.ref"]')).not.toBeNull();
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'From the library' }))).check();
    expect(group.controls.source.value).toBe('library');
    expect(sources).toEqual(['library']);
    expect(el.textContent).toContain('Loading the library…');

    fixture.componentRef.setInput('choices', [
      { id: 3, name: 'Saline batch 7', revision: 2, state: 'approved', approved: true },
      { id: 4, name: 'Synthetic urine', revision: 1, state: 'draft', approved: false },
    ]);
    const select = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="liquid-select"]' }));
    await select.open();
    const options = await select.getOptions();
    expect(await Promise.all(options.map((o) => o.getText()))).toEqual(['Saline batch 7 · rev 2', 'Synthetic urine · rev 1 · draft, not approved']);
    await options[1].click();
    expect(chosen).toEqual([4]);
    expect(group.controls.libraryId.value).toBe(4);
  });

  it('shows the evaluator’s message about the liquid in place of the loading hint', async () => {
    const { fixture, group, el } = await setup();
    group.controls.source.setValue('library');
    fixture.componentRef.setInput('choices', []);
    fixture.componentRef.setInput('error', 'Choose a liquid from the library.');
    fixture.detectChanges();
    expect(el.querySelector('.error-text')?.textContent).toContain('Choose a liquid from the library.');
    expect(el.textContent).not.toContain('Loading the library');
  });
});
