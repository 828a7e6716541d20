import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { LabSetDetail, ReplicateFigure } from 'wick-core';
import { apiProblem } from '../library/api-error';
import { LabDataApi } from './lab-data-api';
import { LAB_UNITS, displayUnit, orientationLabel, show } from './lab-format';

/**
 * A replicate set: its runs, the mean and spread of each fitted figure with outlier runs flagged, and proposing
 * the fitted values to the library (a new revision of the web that goes through review).
 */
@Component({
  selector: 'wick-set-page',
  imports: [DatePipe, FormsModule, MatButtonModule, MatCheckboxModule, MatIconModule, MatTableModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <p><a routerLink="/lab-data">← Lab data</a></p>
      @if (problem()) {
        <p class="wick-caution" role="alert">{{ problem() }}</p>
      }
      @if (notice()) {
        <p class="notice" role="status">{{ notice() }}</p>
      }
      @if (set(); as s) {
        <h1>{{ s.name }}</h1>
        <p class="facts">
          <a [routerLink]="['/materials/webs', s.webId]">{{ s.webName }}</a> · {{ s.liquidName }} · {{ orientationLabel(s.orientation) }},
          {{ s.measurement }} · {{ s.runCount }} run(s) ·
          <a routerLink="/lab-data/contact-angle" [queryParams]="{ reference: s.id }" data-test="contact-angle-link">contact angle with this set as the reference</a>
        </p>
        @if (s.notes) {
          <p>{{ s.notes }}</p>
        }

        <h2>Runs</h2>
        <table mat-table [dataSource]="s.runs" class="table" aria-label="Runs of the set">
          <ng-container matColumnDef="name">
            <th mat-header-cell *matHeaderCellDef>Run</th>
            <td mat-cell *matCellDef="let r">
              <a [routerLink]="['/lab-data/runs', r.id]">{{ r.name }}</a>
              @if (outlierIn(r.id).length) {
                <span class="outlier" [attr.data-outlier]="r.id">outlier: {{ outlierIn(r.id).join(', ') }}</span>
              }
            </td>
          </ng-container>
          <ng-container matColumnDef="slope">
            <th mat-header-cell *matHeaderCellDef>Washburn slope</th>
            <td mat-cell *matCellDef="let r">{{ show(r.figures.washburnSlope, units().slope) }}</td>
          </ng-container>
          <ng-container matColumnDef="equilibrium">
            <th mat-header-cell *matHeaderCellDef>Equilibrium</th>
            <td mat-cell *matCellDef="let r">{{ show(r.figures.equilibrium, units().value) }}</td>
          </ng-container>
          <ng-container matColumnDef="permeability">
            <th mat-header-cell *matHeaderCellDef>Permeability</th>
            <td mat-cell *matCellDef="let r">{{ show(r.figures.permeability, 'um^2') }}</td>
          </ng-container>
          <ng-container matColumnDef="created">
            <th mat-header-cell *matHeaderCellDef>Uploaded</th>
            <td mat-cell *matCellDef="let r">{{ r.createdAt | date: 'mediumDate' }}</td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="runColumns"></tr>
          <tr mat-row *matRowDef="let row; columns: runColumns"></tr>
        </table>

        <h2>Replicate statistics</h2>
        <table mat-table [dataSource]="s.figures" class="table" aria-label="Replicate statistics">
          <ng-container matColumnDef="label">
            <th mat-header-cell *matHeaderCellDef>Figure</th>
            <td mat-cell *matCellDef="let f">{{ f.label }}</td>
          </ng-container>
          <ng-container matColumnDef="mean">
            <th mat-header-cell *matHeaderCellDef>Mean ± sd (n)</th>
            <td mat-cell *matCellDef="let f">{{ spread(f.statistics, unitOf(f)) }}</td>
          </ng-container>
          <ng-container matColumnDef="cv">
            <th mat-header-cell *matHeaderCellDef>CV</th>
            <td mat-cell *matCellDef="let f">{{ f.statistics.cv === null || f.statistics.n < 2 ? '—' : (f.statistics.cv * 100).toFixed(1) + ' %' }}</td>
          </ng-container>
          <ng-container matColumnDef="outliers">
            <th mat-header-cell *matHeaderCellDef>Outlier runs</th>
            <td mat-cell *matCellDef="let f">{{ runNames(f.outlierRunIds) || '—' }}</td>
          </ng-container>
          <ng-container matColumnDef="kept">
            <th mat-header-cell *matHeaderCellDef>Without outliers</th>
            <td mat-cell *matCellDef="let f">{{ spread(f.statistics.withoutOutliers, unitOf(f)) }}</td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="figureColumns"></tr>
          <tr mat-row *matRowDef="let row; columns: figureColumns"></tr>
        </table>
        @for (w of s.warnings; track $index) {
          <p class="warning">{{ w.message }}</p>
        }
        <p class="note">Outliers: modified z-score above 3.5 (Iglewicz &amp; Hoaglin), judged from 3 runs on.</p>

        <h2>Library</h2>
        @for (p of s.proposals; track p.revision) {
          <p class="proposal">
            Proposed as <a [routerLink]="['/materials/webs', p.entryId]">revision {{ p.revision }} of {{ p.webName }}</a> by {{ p.proposedBy.name }},
            {{ p.proposedAt | date: 'medium' }} — {{ p.submitted ? 'submitted for review' : 'left as a draft' }}.
          </p>
        }
        @if (s.actions.propose) {
          <section class="propose" aria-label="Propose to the library">
            <p>
              Writes the fitted values into a new revision of the web — the in-plane permeability (mean of the runs that are not outliers) and
              each run's curve with its file — with a note that links here. A reviewer then approves or returns it.
            </p>
            <mat-checkbox [(ngModel)]="withPermeability">In-plane permeability</mat-checkbox>
            <mat-checkbox [(ngModel)]="withCurves">The runs' curves and files</mat-checkbox>
            <mat-checkbox [(ngModel)]="submit">Submit for review now</mat-checkbox>
            <div>
              <button mat-flat-button type="button" (click)="propose(s)" [disabled]="busy()"><mat-icon>publish</mat-icon> Propose to library</button>
            </div>
          </section>
        }
      }
    </section>
  `,
  styles: `
    h1 { font: var(--mat-sys-headline-small); }
    h2 { font: var(--mat-sys-title-large); margin-top: 32px; }
    .facts, .note { color: var(--mat-sys-on-surface-variant); }
    .note { font: var(--mat-sys-body-small); }
    .table { width: 100%; }
    .outlier { margin-left: 8px; padding: 2px 8px; border-radius: 8px; background: var(--mat-sys-error-container); color: var(--mat-sys-on-error-container); font: var(--mat-sys-label-small); }
    .warning { color: var(--mat-sys-tertiary); font: var(--mat-sys-body-small); }
    .notice { color: var(--mat-sys-primary); }
    .propose { display: grid; gap: 4px; padding: 16px; border: 1px solid var(--mat-sys-outline-variant); border-radius: var(--mat-sys-corner-medium); }
  `,
})
export class SetPage {
  private readonly api = inject(LabDataApi);
  /** Route parameter. */
  readonly id = input.required<string>();

  protected readonly set = signal<LabSetDetail | null>(null);
  protected readonly busy = signal(false);
  protected readonly problem = signal('');
  protected readonly notice = signal('');
  protected withPermeability = true;
  protected withCurves = true;
  protected submit = true;
  protected readonly runColumns = ['name', 'slope', 'equilibrium', 'permeability', 'created'];
  protected readonly figureColumns = ['label', 'mean', 'cv', 'outliers', 'kept'];
  protected readonly show = show;
  protected readonly orientationLabel = orientationLabel;
  protected readonly units = computed(() => LAB_UNITS[this.set()?.measurement ?? 'height']);

  /** Figures for which each run is an outlier. */
  private readonly outliers = computed(() => {
    const map = new Map<number, string[]>();
    for (const f of this.set()?.figures ?? []) for (const id of f.outlierRunIds) map.set(id, [...(map.get(id) ?? []), f.label]);
    return map;
  });

  constructor() {
    effect(() => {
      const id = Number(this.id());
      untracked(() => void this.load(id));
    });
  }

  protected outlierIn(runId: number): string[] {
    return this.outliers().get(runId) ?? [];
  }

  protected unitOf(f: ReplicateFigure): string {
    return f.key === 'staticRadius' || f.key === 'dynamicRadius' ? 'um' : displayUnit(f.unit);
  }

  /** "mean ± sd (n)", or "value (one run)". */
  protected spread(s: { mean: number; sd: number; n: number }, unit: string): string {
    return s.n > 1 ? `${show(s.mean, unit)} ± ${show(s.sd, unit, 2)} (${s.n})` : `${show(s.mean, unit)} (one run)`;
  }

  protected runNames(ids: readonly number[]): string {
    const runs = this.set()?.runs ?? [];
    return ids.map((id) => runs.find((r) => r.id === id)?.name ?? `#${id}`).join(', ');
  }

  protected async propose(s: LabSetDetail): Promise<void> {
    this.busy.set(true);
    this.problem.set('');
    this.notice.set('');
    try {
      // The proposal names the web version it builds on: the library refuses it if someone changed the web meanwhile.
      const web = await firstValueFrom(this.api.web(s.webId));
      const next = await firstValueFrom(
        this.api.propose(s.id, { webVersion: web.version, submit: this.submit, permeability: this.withPermeability, curves: this.withCurves }),
      );
      this.set.set(next);
      const p = next.proposals[next.proposals.length - 1];
      this.notice.set(
        `Revision ${p.revision} of ${p.webName} created${p.submitted ? ' and submitted for review: every reviewer gets an e-mail' : ' as a draft'}.`,
      );
    } catch (e) {
      this.problem.set(apiProblem(e).message);
    } finally {
      this.busy.set(false);
    }
  }

  private async load(id: number): Promise<void> {
    try {
      this.set.set(await firstValueFrom(this.api.set(id)));
    } catch (e) {
      this.problem.set(apiProblem(e).message);
    }
  }
}
