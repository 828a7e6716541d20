import {
  afterRenderEffect,
  ChangeDetectionStrategy,
  Component,
  computed,
  DestroyRef,
  ElementRef,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';

/** A plotly trace or layout as plotly takes it (filled bands, bars and second axes included). */
export type ChartTrace = Readonly<Record<string, unknown>>;
export type ChartLayout = Readonly<Record<string, unknown>>;

type Plotly = (typeof import('plotly.js-dist-min'))['default'];
let plotly: Promise<Plotly> | undefined;

/** plotly.js in its own lazy chunk, shared with the other plots (the same dynamic import). */
function loadPlotly(): Promise<Plotly> {
  plotly ??= import('plotly.js-dist-min').then((m) => ((m as unknown as { default?: Plotly }).default ?? (m as unknown as Plotly)));
  return plotly;
}

/**
 * The page's draws of charts that are not deferred, chained: a deferred chart starts after them (plotly's
 * redraw may end in a later task, so waiting for the current task alone is not enough).
 */
let pageDraws: Promise<unknown> = Promise.resolve();

const CONFIG = { responsive: true, displaylogo: false, topojsonURL: '', modeBarButtonsToRemove: ['lasso2d', 'select2d'] };

/**
 * The design workspace's chart: any plotly traces and layout (bands, bars, two axes), updated IN PLACE with one
 * `Plotly.react` per change, reporting how long each update took (`rendered`, ms) — the live view's replot time.
 * The app's simpler line plot is shared/plot; this one carries what wicking results need beyond it.
 */
@Component({
  selector: 'wick-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="frame" role="img" [attr.aria-label]="label()">
      <div #axes class="axes" [hidden]="!layered()"></div>
      <div #host class="host"></div>
    </div>
    @if (htmlLegend()) {
      <ul class="legend">
        @for (item of legendItems(); track item.name) {
          <li><span class="swatch" [style.border-top-color]="item.color" [style.border-top-style]="item.dash" [style.background]="item.fill"></span>{{ item.name }}</li>
        }
      </ul>
    }
    @if (failed(); as f) {
      <p class="failed">The chart could not be drawn: {{ f }}</p>
    }
  `,
  styles: `
    :host { display: block; }
    /* Containment: plotly measures text (forcing layout) on every redraw; this keeps that layout to the chart. */
    .frame { position: relative; width: 100%; height: var(--wick-plot-height, 340px); contain: strict; }
    .host, .axes { position: absolute; inset: 0; }
    .failed { color: var(--mat-sys-error); }
    .legend { display: flex; flex-wrap: wrap; gap: 4px 16px; list-style: none; margin: 0; padding: 0 0 0 64px; font: var(--mat-sys-body-small); }
    .swatch { display: inline-block; width: 24px; height: 8px; margin-right: 6px; border-top: 2px solid; vertical-align: middle; }
  `,
})
export class Chart {
  readonly data = input.required<readonly ChartTrace[]>();
  readonly layout = input<ChartLayout>({});
  /** What the chart shows, for screen readers. */
  readonly label = input.required<string>();
  /**
   * Draw the legend in HTML instead of inside plotly: the live view replots on every keystroke, and plotly's
   * legend is a noticeable share of each redraw.
   */
  readonly htmlLegend = input(false);
  /**
   * A chart beside a live one: its redraws wait until the page's other charts have drawn, so that the live
   * chart's redraw after a keystroke is not held up behind this one; redraws waiting meanwhile coalesce to the
   * newest.
   */
  readonly deferRedraw = input(false);
  /**
   * Axes in a layer of their own under the traces, redrawn only when they change: a live chart's redraw after
   * a keystroke then draws the traces alone (a third less work for plotly). Zooming is off in this mode, since
   * the two layers would part; hovering works as usual.
   */
  readonly layered = input(false);
  readonly rendered = output<number>();

  protected readonly legendItems = computed(() =>
    this.data()
      .filter((t) => t['showlegend'] !== false && typeof t['name'] === 'string')
      .map((t) => {
        const line = (t['line'] ?? {}) as { color?: string; dash?: string; width?: number };
        const marker = (t['marker'] ?? {}) as { color?: string | string[] };
        const markerColor = Array.isArray(marker.color) ? marker.color[0] : marker.color;
        const dash = line.dash === 'dash' ? 'dashed' : line.dash === 'dot' ? 'dotted' : 'solid';
        const fill = typeof t['fillcolor'] === 'string' ? (t['fillcolor'] as string) : 'transparent';
        return { name: t['name'] as string, color: line.color ?? markerColor ?? 'currentColor', dash, fill };
      }),
  );

  protected readonly failed = signal('');
  private readonly host = viewChild.required<ElementRef<HTMLDivElement>>('host');
  private readonly axes = viewChild.required<ElementRef<HTMLDivElement>>('axes');
  /** The axes layer's layout as last drawn (JSON), to redraw it only when it changes. */
  private axesDrawn = '';
  private queue: Promise<void> = Promise.resolve();
  private destroyed = false;
  private waiting: { data: readonly ChartTrace[]; layout: ChartLayout } | null = null;
  private timer: ReturnType<typeof setTimeout> | undefined;

  constructor() {
    afterRenderEffect(() => {
      const el = this.host().nativeElement;
      const data = this.data();
      const layout = this.htmlLegend() ? { ...this.layout(), showlegend: false } : this.layout();
      if (this.deferRedraw()) {
        const pending = this.waiting !== null;
        this.waiting = { data, layout };
        if (pending) return;
        // After the current task (the live chart's draw is queued by then) and the draws it queued.
        this.timer = setTimeout(() => {
          this.timer = undefined;
          this.queue = Promise.all([this.queue, pageDraws]).then(() => {
            const next = this.waiting;
            this.waiting = null;
            return next ? this.draw(el, next.data, next.layout) : undefined;
          });
        });
        return;
      }
      // One draw at a time, in order: the newest data wins without tearing the chart down.
      this.queue = this.queue.then(() => this.draw(el, data, layout));
      pageDraws = Promise.all([pageDraws, this.queue]);
    });
    inject(DestroyRef).onDestroy(() => {
      this.destroyed = true;
      clearTimeout(this.timer);
      const el = this.host().nativeElement;
      const axes = this.axes().nativeElement;
      void loadPlotly().then((p) => {
        p.purge(el);
        p.purge(axes);
      });
    });
  }

  private async draw(el: HTMLDivElement, data: readonly ChartTrace[], layout: ChartLayout): Promise<void> {
    try {
      const p = await loadPlotly();
      if (this.destroyed) return;
      const style = getComputedStyle(el);
      const text = style.getPropertyValue('--mat-sys-on-surface').trim() || '#1b1b1f';
      const full: ChartLayout = {
        margin: { l: 64, r: 16, t: 16, b: 48 },
        paper_bgcolor: 'rgba(0,0,0,0)',
        plot_bgcolor: 'rgba(0,0,0,0)',
        font: { family: 'Roboto, sans-serif', size: 12, color: text },
        legend: { orientation: 'h', y: -0.22 },
        ...layout,
      };
      const t0 = performance.now();
      if (this.layered()) {
        const { shapes, ...axesLayout } = full;
        const fixed = (axis: unknown) => ({ ...(axis as object), fixedrange: true });
        const axesLayer = { ...axesLayout, xaxis: fixed(full['xaxis']), yaxis: fixed(full['yaxis']), showlegend: false };
        const axesJson = JSON.stringify(axesLayer);
        if (axesJson !== this.axesDrawn) {
          await p.react(this.axes().nativeElement, [], axesLayer, { ...CONFIG, staticPlot: true });
          this.axesDrawn = axesJson;
        }
        const hidden = (axis: unknown) => ({ ...(axis as object), visible: false, fixedrange: true });
        await p.react(
          el,
          data as object[],
          { ...full, shapes: shapes ?? [], xaxis: hidden(full['xaxis']), yaxis: hidden(full['yaxis']), dragmode: false },
          { ...CONFIG, displayModeBar: false },
        );
      } else {
        await p.react(el, data as object[], full, CONFIG);
      }
      this.failed.set('');
      this.rendered.emit(performance.now() - t0);
    } catch (e) {
      this.failed.set(e instanceof Error ? e.message : String(e));
    }
  }
}
