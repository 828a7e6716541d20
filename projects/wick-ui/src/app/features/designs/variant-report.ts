import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, ViewEncapsulation, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { CONFIGURATION_LABELS, type VariantReport } from 'wick-core';
import { Chart } from './chart';
import { DesignsApi } from './designs-api';
import { show, showFigure, showInputValue } from './format';
import { uptakeLayout, uptakeTraces } from './plots';
import { errorText } from './variant-editor';

/**
 * The printable report of one variant: inputs with the source of every value, key figures, checkpoints, the
 * curve, equations used, warnings and the safety note. The browser's "Save as PDF" gives a clean document.
 */
@Component({
  selector: 'wick-variant-report',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, Chart],
  changeDetection: ChangeDetectionStrategy.OnPush,
  // The print rules reach the app shell around the page, so they are global.
  encapsulation: ViewEncapsulation.None,
  styleUrl: './report-print.scss',
  template: `
    @if (report(); as r) {
      <article class="wick-report" data-testid="variant-report">
        <div class="toolbar wick-no-print">
          <a mat-stroked-button [routerLink]="['/designs/variants', r.variant.id]"><mat-icon>arrow_back</mat-icon>Back to the variant</a>
          <button mat-flat-button type="button" (click)="print()"><mat-icon>print</mat-icon>Print or save as PDF</button>
        </div>
        <header>
          <h1>Wicking estimate: {{ r.variant.name }}</h1>
          <p class="meta">{{ r.variant.projectName }} · {{ r.variant.designName }} · {{ labels[r.variant.inputs.configuration] }}</p>
          <p class="meta">
            Saved {{ r.variant.updatedAt | date: 'medium' }} by {{ r.variant.updatedBy.name }} · computed with wick-core {{ r.variant.coreVersion }} ·
            report generated {{ r.generatedAt | date: 'medium' }}
          </p>
          @if (r.variant.usesUnapproved) {
            <p class="flag" data-testid="report-unapproved">Uses library material that is not approved:
              @for (m of r.variant.materials; track m.kind + m.id) {
                @if (!m.approved) { {{ m.name }} (revision {{ m.revision }}, {{ m.state }}) }
              }
            </p>
          }
        </header>
        <p class="wick-caution wick-report-block" data-testid="safety-note"><strong>Safety note.</strong>&nbsp;{{ r.safetyNote }}</p>

        <h2>Inputs and their sources</h2>
        <table data-testid="report-inputs">
          <thead><tr><th>Input</th><th>Value</th><th>Source</th></tr></thead>
          <tbody>
            @for (row of r.inputRows; track row.path) {
              <tr><td>{{ row.label }}</td><td class="num">{{ value(row.value, row.unit) }}</td><td>{{ row.source }}</td></tr>
            }
          </tbody>
        </table>

        <h2>Key figures</h2>
        <table data-testid="report-figures">
          <tbody>
            @for (f of r.keyFigures; track f.key) {
              <tr><td>{{ f.label }}</td><td class="num">{{ showFigure(f) }}</td></tr>
            }
          </tbody>
        </table>

        @if (curve(); as c) {
          <h2>Wetted length against time</h2>
          <div class="wick-report-block"><wick-chart [data]="c.data" [layout]="c.layout" label="Wetted length against time" /></div>
        }

        <h2>Equations used</h2>
        <table data-testid="report-equations">
          <tbody>
            @for (e of r.equations; track e.id) {
              <tr><td><strong>{{ e.title }}</strong><br />{{ e.equation }}</td><td>{{ e.source }}</td></tr>
            }
          </tbody>
        </table>

        <h2>Warnings</h2>
        @for (w of r.warnings; track w.code + w.message) {
          <p>⚠ {{ w.message }}</p>
        } @empty {
          <p class="meta">None.</p>
        }
      </article>
    } @else if (error(); as e) {
      <p class="wick-page" role="alert">{{ e }}</p>
    }
  `,
})
export class VariantReportPage {
  readonly variantId = input.required<string>();
  private readonly api = inject(DesignsApi);
  protected readonly report = signal<VariantReport | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly labels = CONFIGURATION_LABELS;
  protected readonly show = show;
  protected readonly showFigure = showFigure;
  protected readonly curve = computed(() => {
    const r = this.report()?.variant.results;
    return r?.status === 'ok' ? { data: uptakeTraces(r), layout: uptakeLayout(r) } : null;
  });

  constructor() {
    effect(() => {
      const id = Number(this.variantId());
      firstValueFrom(this.api.report(id)).then(
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
