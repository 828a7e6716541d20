import { Component, ElementRef, inject, signal, type Type } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Chart, type ChartTrace } from './chart';

/** A live chart and a chart beside it, as the variant editor has them, with real plotly. */
@Component({
  imports: [Chart],
  template: `
    <wick-chart class="live" [data]="data()" label="live" (rendered)="log.push('live ' + shown('.live'))" />
    <wick-chart class="beside" [data]="data()" label="beside" [deferRedraw]="true" (rendered)="log.push('beside ' + shown('.beside'))" />
  `,
})
class TwoCharts {
  readonly data = signal<readonly ChartTrace[]>(line('first'));
  /** Each chart's draws as they end, with what it then shows. */
  readonly log: string[] = [];
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  shown(selector: string): unknown {
    return drawn(this.host.nativeElement, selector);
  }
}

/** A live chart with its axes in a layer of their own. */
@Component({
  imports: [Chart],
  template: `<wick-chart [data]="data()" [layout]="layout()" [layered]="true" label="layered" (rendered)="draws = draws + 1" />`,
})
class LayeredChart {
  readonly data = signal<readonly ChartTrace[]>(line('first'));
  readonly layout = signal<Record<string, unknown>>(axesUpTo(10));
  draws = 0;
}

function axesUpTo(top: number): Record<string, unknown> {
  return { xaxis: { type: 'linear', range: [0, 2] }, yaxis: { type: 'linear', range: [0, top], title: { text: 'Height (mm)' } } };
}

function line(name: string): ChartTrace[] {
  return [{ x: [0, 1, 2], y: [0, 1, 4], type: 'scatter', mode: 'lines', name }];
}

/** The traces plotly holds for a chart (plotly keeps them on its element). */
function drawn(host: HTMLElement, selector: string): unknown {
  const el = host.querySelector(`${selector} .host`) as (HTMLElement & { data?: { name: string }[] }) | null;
  return el?.data?.[0]?.name;
}

const until = async (ok: () => boolean, ms = 10_000) => {
  const end = Date.now() + ms;
  while (!ok()) {
    if (Date.now() > end) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 5));
  }
};

/** The page under test, rendered once. */
function mount<T>(page: Type<T>) {
  TestBed.configureTestingModule({ imports: [page] });
  const fixture = TestBed.createComponent(page);
  fixture.detectChanges();
  return { fixture, host: fixture.nativeElement as HTMLElement, page: fixture.componentInstance };
}

describe('Chart', () => {
  it('redraws a chart beside the live one after it, once, with the newest data', async () => {
    const { fixture, host, page } = mount(TwoCharts);
    await until(() => drawn(host, '.live') === 'first' && drawn(host, '.beside') === 'first');

    // Two changes in one task (two keystrokes' results): the live chart draws each as it comes, the chart
    // beside it only after the live chart is done, and once, with the newest data.
    page.log.length = 0;
    page.data.set(line('second'));
    fixture.detectChanges();
    page.data.set(line('third'));
    fixture.detectChanges();
    await until(() => drawn(host, '.beside') === 'third');
    await new Promise((r) => setTimeout(r, 50));
    expect(page.log).toEqual(['live second', 'live third', 'beside third']);
  });

  it('draws the axes in a layer under the traces and redraws that layer only when the axes change', async () => {
    const { fixture, host, page } = mount(LayeredChart);
    type Drawn = HTMLElement & { data?: { name: string }[]; layout?: { yaxis: { visible?: boolean; range: number[] } } };
    const axes = host.querySelector('.axes') as Drawn;
    const traces = host.querySelector('.host') as Drawn;
    await until(() => page.draws === 1);
    // The axes layer holds no traces and shows the axes; the traces' layer hides its own (same ranges).
    expect(axes.data).toEqual([]);
    expect(axes.querySelector('.ytitle')?.textContent).toBe('Height (mm)');
    expect(traces.data?.[0].name).toBe('first');
    expect(traces.layout?.yaxis.visible).toBe(false);
    expect(traces.layout?.yaxis.range).toEqual([0, 10]);
    // New data, same axes: the axes layer is left as it was drawn (plotly reports each plot on its element).
    let axesPlots = 0;
    (axes as Drawn & { on(event: string, f: () => void): void }).on('plotly_afterplot', () => axesPlots++);
    page.data.set(line('second'));
    fixture.detectChanges();
    await until(() => page.draws === 2);
    expect(traces.data?.[0].name).toBe('second');
    expect(axesPlots).toBe(0);
    // New axes: both layers follow.
    page.layout.set(axesUpTo(20));
    fixture.detectChanges();
    await until(() => page.draws === 3);
    expect(axesPlots).toBe(1);
    expect(axes.layout?.yaxis.range).toEqual([0, 20]);
    expect(traces.layout?.yaxis.range).toEqual([0, 20]);
  });
});
