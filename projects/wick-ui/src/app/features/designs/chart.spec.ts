import { Component, ElementRef, inject, signal } from '@angular/core';
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

describe('Chart', () => {
  it('redraws a chart beside the live one after it, once, with the newest data', async () => {
    TestBed.configureTestingModule({ imports: [TwoCharts] });
    const fixture = TestBed.createComponent(TwoCharts);
    const host = fixture.nativeElement as HTMLElement;
    const page = fixture.componentInstance;
    fixture.detectChanges();
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
});
