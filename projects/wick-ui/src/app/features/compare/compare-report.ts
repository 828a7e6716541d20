import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, ViewEncapsulation, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { CONFIGURATION_LABELS, type ComparisonReport } from 'wick-core';
import { Chart } from '../designs/chart';
import { show, showInputValue, showRelative } from '../designs/format';
import { OVERLAY_LAYOUT, overlayTraces, UPTAKE_OVERLAY_LAYOUT, uptakeOverlayTraces } from '../designs/plots';
import { errorText } from '../designs/variant-editor';
import { CompareApi } from './compare-api';
import { parseIds } from './compare-page';

/** The printable comparison: key figures with deltas, curves, decisions, and each variant's inputs and sources. */
@Component({
  selector: 'wick-compare-report',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, Chart],
  changeDetection: ChangeDetectionStrategy.OnPush,
  encapsulation: ViewEncapsulation.None,
  styleUrl: '../designs/report-print.scss',
  template: `
    @if (report(); as r) {
      <article class="wick-report" data-testid="compare-report-page">
        <div class="toolbar wick-no-print">
          <a mat-stroked-button routerLink="/compare" [queryParams]="{ variants: variants(), baseline: r.comparison.baselineId }"><mat-icon>arrow_back</mat-icon>Back to the comparison</a>
          <button mat-flat-button type="button" (click)="print()"><mat-icon>print</mat-icon>Print or save as PDF</button>
        </div>
        <h1>Comparison of {{ r.comparison.variants.length }} variants</h1>
        <p class="meta">Generated {{ r.generatedAt | date: 'medium' }} · baseline: {{ baselineName() }}</p>
        <p class="wick-caution wick-report-block" data-testid="safety-note"><strong>Safety note.</strong>&nbsp;{{ r.safetyNote }}</p>

        <h2>Key figures</h2>
        <table>
          <thead>
            <tr>
              <th>Figure</th>
              @for (v of r.comparison.variants; track v.id) {
                <th>{{ v.name }}@if (v.usesUnapproved) {<br /><span class="flag">unapproved material</span>}</th>
              }
            </tr>
          </thead>
          <tbody>
            @for (f of r.comparison.figures; track f.key) {
              <tr>
                <td>{{ f.label }}</td>
                @for (x of f.values; track x.variantId) {
                  <td class="num" [class.best]="x.best">{{ x.note ?? show(x.value, f.unit) }}{{ x.best ? ' ★' : '' }} {{ showRelative(x.relativeDelta) }}</td>
                }
              </tr>
            }
          </tbody>
        </table>

        <h2>Curves</h2>
        @if (overlay().length) {
          <div class="wick-report-block"><wick-chart [data]="overlay()" [layout]="overlayLayout" label="Wetted length against time for the compared variants" /></div>
        }
        @if (uptakeOverlay().length) {
          <div class="wick-report-block"><wick-chart [data]="uptakeOverlay()" [layout]="uptakeLayout" label="Liquid absorbed and standing on the surface against time for the compared stacks" /></div>
        }

        <h2>Decisions</h2>
        @for (d of r.comparison.decisions; track d.id) {
          <p><strong>{{ d.chosenVariantName }}</strong> — {{ d.rationale }} <span class="meta">({{ d.decidedBy.name }}, {{ d.decidedAt | date: 'medium' }})</span></p>
        } @empty {
          <p class="meta">None recorded.</p>
        }

        @for (vr of r.variants; track vr.variant.id) {
          <section class="wick-report-block">
            <h2>{{ vr.variant.name }} — inputs and sources</h2>
            <p class="meta">{{ vr.variant.designName }} · {{ labels[vr.variant.inputs.configuration] }} · wick-core {{ vr.variant.coreVersion }}</p>
            <table>
              <tbody>
                @for (row of vr.inputRows; track row.path) {
                  <tr><td>{{ row.label }}</td><td class="num">{{ value(row.value, row.unit) }}</td><td>{{ row.source }}</td></tr>
                }
              </tbody>
            </table>
            <p class="meta">Equations: @for (e of vr.equations; track e.id; let last = $last) {{{ e.title }} ({{ e.source }}){{ last ? '' : '; ' }}}</p>
            @for (w of vr.warnings; track w.code + w.message) {
              <p>⚠ {{ w.message }}</p>
            }
          </section>
        }
      </article>
    } @else if (error(); as e) {
      <p class="wick-page" role="alert">{{ e }}</p>
    }
  `,
})
export class CompareReportPage {
  readonly variants = input<string>();
  readonly baseline = input<string>();
  private readonly api = inject(CompareApi);
  protected readonly report = signal<ComparisonReport | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly labels = CONFIGURATION_LABELS;
  protected readonly show = show;
  protected readonly showRelative = showRelative;
  protected readonly overlayLayout = OVERLAY_LAYOUT;
  protected readonly overlay = computed(() => overlayTraces(this.report()?.comparison.variants ?? []));
  protected readonly uptakeLayout = UPTAKE_OVERLAY_LAYOUT;
  protected readonly uptakeOverlay = computed(() => uptakeOverlayTraces(this.report()?.comparison.variants ?? []));
  protected readonly baselineName = computed(() => {
    const c = this.report()?.comparison;
    return c?.variants.find((v) => v.id === c.baselineId)?.name ?? '';
  });

  constructor() {
    effect(() => {
      const ids = parseIds(this.variants());
      const b = Number(this.baseline());
      firstValueFrom(this.api.report(ids, Number.isSafeInteger(b) && b > 0 ? b : null)).then(
        (r) => this.report.set(r),
        (e) => this.error.set(errorText(e)),
      );
    });
  }

  protected readonly value = showInputValue;

  protected print(): void {
    window.print();
  }
}
