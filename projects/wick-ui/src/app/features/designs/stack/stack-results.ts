import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { formatQuantity, SAFETY_NOTE, STACK_RETENTION_LABELS, type StackLayerSummary, type StackVariantResults } from 'wick-core';
import { Chart } from '../chart';
import { show } from '../format';
import { frontLayout, frontTraces, heatMapLayout, heatMapTraces, volumeLayout, volumeTraces } from './stack-plots';

/** mL for volumes over the insult area (SI m³ inside). */
export function showVolume(si: number | null): string {
  return si === null || !Number.isFinite(si) ? '—' : formatQuantity(si, 'mL', 3);
}

/** The retention curve of a layer in words: its parameters as simulated. */
export function retentionText(r: StackLayerSummary['retention']): string {
  if (r.mode === 'brooks-corey') return `Brooks–Corey, Pb ${show(r.entryPressure, 'Pa', 3)}, λ ${show(r.lambda, '1', 3)}`;
  const vg = `1/α ${show(r.alpha === null ? null : 1 / r.alpha, 'Pa', 3)}, n ${show(r.n, '1', 3)}`;
  return r.mode === 'pore-size' ? `van Genuchten fitted to the pore sizes, ${vg}` : `van Genuchten, ${vg}`;
}

/**
 * What a stack run gives: acquisition of each gush, liquid left on the surface and near it (rewet indicator),
 * capacity used, the mass balance, the saturation heat map over depth and time, uptake and front curves, and the
 * layers as simulated.
 */
@Component({
  selector: 'wick-stack-results',
  imports: [MatIconModule, MatTabsModule, Chart],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let r = results();
    @if (r.run === 'cancelled') {
      <p class="banner" role="status" data-testid="partial">
        <mat-icon aria-hidden="true">pause_circle</mat-icon>
        Cancelled at {{ show(r.timeReached, 's') }} of the run: the figures cover that part only and cannot be saved.
      </p>
    }
    <p class="origin" data-testid="origin">{{ origin() }}</p>

    <table class="insults" data-testid="insults">
      <caption>Gushes of {{ volume(r.insult.volumePerArea * r.insult.area) }} over {{ area() }}</caption>
      <thead>
        <tr><th>Gush</th><th>Starts</th><th>Delivered in</th><th>Acquisition time</th><th>Liquid stands from</th><th>Most on the surface</th></tr>
      </thead>
      <tbody>
        @for (g of r.insults; track g.start; let k = $index) {
          <tr>
            <td>{{ k + 1 }}</td>
            <td>{{ show(g.start, 's') }}</td>
            <td>{{ show(g.deliveryTime, 's', 3) }}</td>
            <td data-testid="acquisition">{{ g.acquisitionTime === null ? 'not reached' : show(g.acquisitionTime, 's', 3) }}</td>
            <td>{{ g.pondingTime === null ? 'never' : g.pondingTime === 0 ? 'on arrival' : show(g.pondingTime, 's', 3) }}</td>
            <td>{{ volume(g.peakSurfaceLiquid) }}</td>
          </tr>
        }
      </tbody>
    </table>

    <dl class="figures" data-testid="stack-figures">
      <div><dt>Liquid on the surface at the end</dt><dd data-testid="surface-liquid">{{ volume(r.totals.surfaceLiquid) }}</dd></div>
      <div><dt>{{ upperLabel() }} (rewet indicator)</dt><dd data-testid="rewet">{{ volume(r.totals.upperLayerLiquid) }}</dd></div>
      <div><dt>Capacity used</dt><dd data-testid="capacity-used">{{ show(r.capacityUsed * 100, '1', 3) }} % of {{ volume(r.totals.poreVolume) }}</dd></div>
      <div><dt>Absorbed / supplied</dt><dd>{{ volume(r.totals.absorbed) }} / {{ volume(r.totals.supplied) }}</dd></div>
      @if (r.totals.drained > 0) {
        <div><dt>Drained through the far face</dt><dd>{{ volume(r.totals.drained) }}</dd></div>
      }
      <div><dt>Mass-balance error</dt><dd data-testid="mass-balance">{{ r.massBalance.relativeError.toExponential(1) }} of the volume absorbed</dd></div>
    </dl>

    <mat-tab-group animationDuration="0ms" class="plots">
      <mat-tab label="Saturation map">
        <ng-template matTabContent>
          <wick-chart [data]="heatMap().data" [layout]="heatMap().layout" label="Saturation over depth and time" data-testid="heat-map" (rendered)="plotted.emit($event)" />
        </ng-template>
      </mat-tab>
      <mat-tab label="Uptake">
        <ng-template matTabContent>
          <wick-chart [data]="volumes().data" [layout]="volumes().layout" [deferRedraw]="true" label="Liquid supplied, absorbed and on the surface against time" data-testid="volume-plot" />
        </ng-template>
      </mat-tab>
      <mat-tab label="Wetting front">
        <ng-template matTabContent>
          <wick-chart [data]="front().data" [layout]="front().layout" [deferRedraw]="true" label="Depth of the wetting front against time" data-testid="front-plot" />
        </ng-template>
      </mat-tab>
    </mat-tab-group>

    <table class="layers" data-testid="layers-table">
      <caption>Layers as simulated</caption>
      <thead>
        <tr><th>Layer</th><th>Thickness</th><th>Porosity</th><th>Permeability</th><th>Retention</th><th>Saturation at the end</th></tr>
      </thead>
      <tbody>
        @for (l of r.layers; track $index) {
          <tr>
            <td>
              {{ l.name }}
              @if (l.web; as w) {
                <small class="pin" [class.unapproved]="w.state !== 'approved'">rev {{ w.revision }} · {{ w.state }}</small>
              }
            </td>
            <td>{{ show(l.thickness, 'm', 3) }}</td>
            <td>{{ show(l.porosity, '1', 3) }} <small>{{ l.porositySource }}</small></td>
            <td>
              {{ show(l.permeability, 'm^2', 3) }} <small>{{ l.permeabilityLabel }}</small>
              @if (l.permeabilityInRange === false) {
                <span class="flag">outside validity</span>
              }
            </td>
            <td><small>{{ retentionLabels[l.retention.mode] }}:</small> {{ retentionText(l.retention) }}</td>
            <td>{{ show(l.saturationEnd * 100, '1', 3) }} %</td>
          </tr>
        }
      </tbody>
    </table>

    @if (r.warnings.length) {
      <ul class="warnings" data-testid="warnings">
        @for (w of r.warnings; track w.code + w.message) {
          <li><mat-icon aria-hidden="true">warning</mat-icon>{{ w.message }}</li>
        }
      </ul>
    }
    <details class="equations">
      <summary>Equations used</summary>
      <ul>
        @for (e of r.equations; track e.id) {
          <li><strong>{{ e.title }}</strong>: <code>{{ e.equation }}</code> <small>{{ e.source }}</small></li>
        }
      </ul>
    </details>
    <p class="safety">{{ safetyNote }}</p>
  `,
  styles: `
    :host {
      display: block;
    }
    table {
      border-collapse: collapse;
      width: 100%;
      margin: 8px 0 16px;
      font: var(--mat-sys-body-medium);
    }
    caption {
      text-align: left;
      font: var(--mat-sys-title-small);
      padding-bottom: 4px;
    }
    th,
    td {
      text-align: left;
      padding: 4px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      vertical-align: top;
    }
    small {
      color: var(--mat-sys-on-surface-variant);
    }
    .figures {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(220px, 1fr));
      gap: 8px 16px;
      margin: 0 0 16px;
    }
    .figures dt {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .figures dd {
      margin: 0;
      font: var(--mat-sys-title-medium);
    }
    .banner,
    .warnings li {
      display: flex;
      gap: 8px;
      align-items: center;
    }
    .banner {
      padding: 8px 12px;
      border-radius: 8px;
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    .warnings {
      list-style: none;
      padding: 0;
      color: var(--mat-sys-on-surface-variant);
    }
    .flag,
    .unapproved {
      color: var(--mat-sys-error);
    }
    .origin,
    .safety {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class StackResults {
  readonly results = input.required<StackVariantResults>();
  /** Where the numbers come from: this browser (with the time it took) or the server's saved record. */
  readonly source = input<'browser' | 'server'>('browser');
  readonly computeMs = input<number | null>(null);
  /** Milliseconds the heat map took to draw. */
  readonly plotted = output<number>();

  protected readonly show = show;
  protected readonly volume = showVolume;
  protected readonly retentionText = retentionText;
  protected readonly retentionLabels = STACK_RETENTION_LABELS;
  protected readonly safetyNote = SAFETY_NOTE;

  protected readonly origin = computed(() => {
    const r = this.results();
    if (this.source() === 'server') return `Saved results, computed on the server with wick-core ${r.coreVersion}.`;
    const ms = this.computeMs();
    return `Computed in your browser (${r.stats.cells} cells, ${r.stats.steps} time steps${ms === null ? '' : `, ${Math.round(ms)} ms`}).`;
  });
  protected readonly area = computed(() => formatQuantity(this.results().insult.area, 'cm^2', 3));
  protected readonly upperLabel = computed(() => {
    const r = this.results();
    return r.upperLayers === 1 ? `Liquid left in ${r.layers[0]?.name ?? 'the top layer'}` : `Liquid left in the top ${r.upperLayers} layers`;
  });
  protected readonly heatMap = computed(() => ({ data: heatMapTraces(this.results()), layout: heatMapLayout(this.results()) }));
  protected readonly volumes = computed(() => ({ data: volumeTraces(this.results()), layout: volumeLayout(this.results()) }));
  protected readonly front = computed(() => ({ data: frontTraces(this.results()), layout: frontLayout(this.results()) }));
}
