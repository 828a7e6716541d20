import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  type ElementRef,
  afterRenderEffect,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';

/** One line or set of points, in plotly's terms (x, y, name, mode …). */
export interface PlotTrace {
  readonly x: readonly number[];
  readonly y: readonly number[];
  readonly name?: string;
  readonly mode?: 'lines' | 'markers' | 'lines+markers';
  readonly type?: 'scatter';
  readonly line?: { readonly shape?: 'linear' | 'hv' | 'spline'; readonly dash?: string };
  readonly hovertemplate?: string;
}

export interface PlotAxis {
  readonly title: string;
  readonly type?: 'linear' | 'log';
}

type Plotly = (typeof import('plotly.js-dist-min'))['default'];
let plotly: Promise<Plotly> | undefined;

/** Plotly in its own lazily loaded chunk (≈1 MB): asked for only when a plot is first shown. */
function loadPlotly(): Promise<Plotly> {
  plotly ??= import('plotly.js-dist-min').then((m) => ((m as unknown as { default?: Plotly }).default ?? (m as unknown as Plotly)));
  return plotly;
}

/**
 * A plotly chart of a few traces, drawn with the app's fonts and theme colours. Put it in `@defer` so neither
 * this component nor plotly is in the initial bundle.
 */
@Component({
  selector: 'wick-plot',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div #host class="plot" role="img" [attr.aria-label]="ariaLabel()"></div>
    @if (failed()) {
      <p class="failed">The plot could not be drawn: {{ failed() }}</p>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .plot {
      width: 100%;
      height: var(--wick-plot-height, 320px);
    }
    .failed {
      color: var(--mat-sys-error);
    }
  `,
})
export class Plot {
  readonly traces = input.required<readonly PlotTrace[]>();
  readonly x = input.required<PlotAxis>();
  readonly y = input.required<PlotAxis>();
  /** What the plot shows, for screen readers. */
  readonly ariaLabel = input.required<string>();

  private readonly host = viewChild.required<ElementRef<HTMLDivElement>>('host');
  protected readonly failed = signal('');
  private drawn: HTMLElement | null = null;

  constructor() {
    afterRenderEffect(() => {
      const el = this.host().nativeElement;
      const traces = this.traces();
      const x = this.x();
      const y = this.y();
      const style = getComputedStyle(el);
      const text = style.getPropertyValue('--mat-sys-on-surface').trim() || '#1b1b1f';
      const grid = style.getPropertyValue('--mat-sys-outline-variant').trim() || '#c4c6d0';
      const layout = {
        margin: { l: 64, r: 16, t: 16, b: 56 },
        paper_bgcolor: 'rgba(0,0,0,0)',
        plot_bgcolor: 'rgba(0,0,0,0)',
        font: { family: 'Roboto, sans-serif', size: 12, color: text },
        xaxis: { title: { text: x.title }, type: x.type ?? 'linear', gridcolor: grid, zeroline: false },
        yaxis: { title: { text: y.title }, type: y.type ?? 'linear', gridcolor: grid, zeroline: false },
        showlegend: traces.length > 1,
        legend: { orientation: 'h', y: -0.25 },
      };
      // No CDN: geographic plots would fetch topojson from one; we draw none, so it points nowhere.
      const config = { responsive: true, displaylogo: false, topojsonURL: '', modeBarButtonsToRemove: ['select2d', 'lasso2d'] };
      loadPlotly()
        .then((p) => p.react(el, traces.map((t) => ({ type: 'scatter', mode: 'lines+markers', ...t })), layout, config))
        .then(() => {
          this.drawn = el;
          this.failed.set('');
        })
        .catch((e: unknown) => this.failed.set(e instanceof Error ? e.message : String(e)));
    });
    inject(DestroyRef).onDestroy(() => {
      const el = this.drawn;
      if (el) void loadPlotly().then((p) => p.purge(el));
    });
  }
}
