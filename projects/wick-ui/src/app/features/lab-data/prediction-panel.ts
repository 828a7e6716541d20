import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { CONFIGURATION_LABELS, fromSI, type PredictionCandidate, type PredictionComparison } from 'wick-core';
import { Plot, type PlotTrace } from '../../shared/plot/plot';
import { apiProblem } from '../library/api-error';
import { LabDataApi } from './lab-data-api';
import { LAB_UNITS, show } from './lab-format';

/**
 * Prediction versus measurement: a saved design variant with the run's web and liquid, re-evaluated over the run's
 * duration, overlaid on the measured points, with RMSE, bias, the largest deviation and time-to-height errors.
 */
@Component({
  selector: 'wick-prediction-panel',
  imports: [MatFormFieldModule, MatSelectModule, MatTableModule, Plot, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (problem()) {
      <p class="wick-caution" role="alert">{{ problem() }}</p>
    }
    @if (candidates().length === 0) {
      <p class="note">No saved design variant uses this web and liquid yet. Create one in <a routerLink="/designs">Designs</a> to compare.</p>
    } @else {
      <mat-form-field class="choose">
        <mat-label>Design variant</mat-label>
        <mat-select [value]="chosen()" (valueChange)="choose($event)">
          @for (c of candidates(); track c.variantId) {
            <mat-option [value]="c.variantId">
              {{ c.projectName }} › {{ c.designName }} › {{ c.variantName }}{{ c.matches.configuration ? '' : ' (other set-up)' }}
            </mat-option>
          }
        </mat-select>
      </mat-form-field>
    }
    @if (comparison(); as c) {
      @defer (on viewport) {
        <wick-plot [traces]="traces()" [x]="{ title: 'Time (s)' }" [y]="{ title: c.quantity === 'height' ? 'Height (mm)' : 'Mass (g)' }" ariaLabel="Prediction and measurement" />
      } @placeholder {
        <p class="note">The plot loads when it comes into view.</p>
      }
      <dl class="metrics" aria-label="Error metrics">
        <dt>RMSE</dt>
        <dd data-test="rmse">{{ show(c.metrics.rmse, unit()) }} ({{ (c.metrics.normalizedRmse * 100).toFixed(1) }} % of the highest reading)</dd>
        <dt>Mean bias (predicted − measured)</dt>
        <dd>{{ show(c.metrics.meanBias, unit()) }}</dd>
        <dt>Largest deviation</dt>
        <dd>{{ show(c.metrics.maxDeviation.value, unit()) }} at {{ show(c.metrics.maxDeviation.time, 's') }}</dd>
        <dt>Points compared</dt>
        <dd>{{ c.metrics.n }}</dd>
      </dl>
      <table mat-table [dataSource]="c.metrics.timeToHeight" class="tth" aria-label="Time to height">
        <ng-container matColumnDef="height">
          <th mat-header-cell *matHeaderCellDef>{{ c.quantity === 'height' ? 'Height' : 'Mass' }}</th>
          <td mat-cell *matCellDef="let r">{{ show(r.height, unit()) }}</td>
        </ng-container>
        <ng-container matColumnDef="measured">
          <th mat-header-cell *matHeaderCellDef>Measured time</th>
          <td mat-cell *matCellDef="let r">{{ show(r.measured, 's') }}</td>
        </ng-container>
        <ng-container matColumnDef="predicted">
          <th mat-header-cell *matHeaderCellDef>Predicted time</th>
          <td mat-cell *matCellDef="let r">{{ show(r.predicted, 's') }}</td>
        </ng-container>
        <ng-container matColumnDef="error">
          <th mat-header-cell *matHeaderCellDef>Time-to-height error</th>
          <td mat-cell *matCellDef="let r">
            {{ show(r.error, 's') }}{{ r.relativeError === null ? '' : ' (' + (r.relativeError * 100).toFixed(0) + ' %)' }}
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
      </table>
      @for (w of c.warnings; track $index) {
        <p class="warning">{{ w.message }}</p>
      }
      <p class="note">Variant: {{ configurationLabel(c.candidate) }}, web revision {{ c.candidate.webRevision }}.</p>
    }
  `,
  styles: `
    .choose { width: 100%; }
    .note { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); }
    .warning { color: var(--mat-sys-tertiary); font: var(--mat-sys-body-small); }
    .metrics { display: grid; grid-template-columns: max-content 1fr; gap: 4px 16px; }
    dt { color: var(--mat-sys-on-surface-variant); }
    dd { margin: 0; }
    .tth { width: 100%; margin-top: 12px; }
  `,
})
export class PredictionPanel {
  private readonly api = inject(LabDataApi);
  readonly runId = input.required<number>();

  protected readonly candidates = signal<readonly PredictionCandidate[]>([]);
  protected readonly chosen = signal<number | null>(null);
  protected readonly comparison = signal<PredictionComparison | null>(null);
  protected readonly problem = signal('');
  protected readonly columns = ['height', 'measured', 'predicted', 'error'];
  protected readonly show = show;
  protected readonly unit = computed(() => LAB_UNITS[this.comparison()?.quantity ?? 'height'].value);

  protected readonly traces = computed<PlotTrace[]>(() => {
    const c = this.comparison();
    if (!c) return [];
    const u = this.unit();
    return [
      { name: 'Measured', mode: 'markers', x: c.measured.time, y: c.measured.values.map((v) => fromSI(v, u)) },
      { name: `Predicted: ${c.candidate.variantName}`, mode: 'lines', x: c.predicted.time, y: c.predicted.values.map((v) => fromSI(v, u)) },
    ];
  });

  constructor() {
    effect(() => {
      const id = this.runId();
      untracked(() => void this.load(id));
    });
  }

  protected configurationLabel(c: PredictionCandidate): string {
    return CONFIGURATION_LABELS[c.configuration];
  }

  protected async choose(variantId: number): Promise<void> {
    this.chosen.set(variantId);
    this.problem.set('');
    try {
      this.comparison.set(await firstValueFrom(this.api.comparison(this.runId(), variantId)));
    } catch (e) {
      this.comparison.set(null);
      this.problem.set(apiProblem(e).message);
    }
  }

  private async load(runId: number): Promise<void> {
    try {
      const list = await firstValueFrom(this.api.predictions(runId));
      this.candidates.set(list);
      const first = list.find((c) => c.matches.configuration) ?? list[0];
      if (first) await this.choose(first.variantId);
    } catch (e) {
      this.problem.set(apiProblem(e).message);
    }
  }
}
