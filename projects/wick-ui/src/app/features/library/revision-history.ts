import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';
import type { DiffChange, LibraryKind, RevisionSummary } from 'wick-core';
import { apiProblem } from './api-error';
import { LibraryApi } from './library-api';
import { stateLabel, when } from './library-format';

/** A changed value as text; SI numbers lose their binary noise (0.0010500000000000002 → 0.00105). */
function shown(v: unknown): string {
  if (v === undefined) return '—';
  if (typeof v === 'string') return v;
  if (typeof v === 'number') return String(Number(v.toPrecision(10)));
  return JSON.stringify(v, (_k, x: unknown) => (typeof x === 'number' ? Number(x.toPrecision(10)) : x));
}

/** Every revision of an entry with who did what and when, and what changed between any two. */
@Component({
  selector: 'wick-revision-history',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatSelectModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <table mat-table [dataSource]="revisions()" class="history">
      <ng-container matColumnDef="number">
        <th mat-header-cell *matHeaderCellDef>Rev.</th>
        <td mat-cell *matCellDef="let r">{{ r.number }}</td>
      </ng-container>
      <ng-container matColumnDef="state">
        <th mat-header-cell *matHeaderCellDef>State</th>
        <td mat-cell *matCellDef="let r">{{ stateLabel(r.state) }}{{ r.superseded ? ' (superseded)' : '' }}</td>
      </ng-container>
      <ng-container matColumnDef="created">
        <th mat-header-cell *matHeaderCellDef>Written by</th>
        <td mat-cell *matCellDef="let r">{{ r.createdBy.name }}, {{ when(r.createdAt) }}</td>
      </ng-container>
      <ng-container matColumnDef="submitted">
        <th mat-header-cell *matHeaderCellDef>Submitted</th>
        <td mat-cell *matCellDef="let r">{{ r.submittedBy ? r.submittedBy.name + ', ' + when(r.submittedAt) : '' }}</td>
      </ng-container>
      <ng-container matColumnDef="reviewed">
        <th mat-header-cell *matHeaderCellDef>Review</th>
        <td mat-cell *matCellDef="let r">
          @if (r.reviewedBy) {
            {{ r.reviewedBy.name }}, {{ when(r.reviewedAt) }}
            @if (r.reviewComment) {
              <div class="comment">“{{ r.reviewComment }}”</div>
            }
          }
        </td>
      </ng-container>
      <tr mat-header-row *matHeaderRowDef="columns"></tr>
      <tr mat-row *matRowDef="let r; columns: columns"></tr>
    </table>

    @if (revisions().length > 1) {
      <div class="compare">
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>From revision</mat-label>
          <mat-select [ngModel]="from()" (ngModelChange)="from.set($event)">
            @for (r of revisions(); track r.number) {
              <mat-option [value]="r.number">{{ r.number }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>To revision</mat-label>
          <mat-select [ngModel]="to()" (ngModelChange)="to.set($event)">
            @for (r of revisions(); track r.number) {
              <mat-option [value]="r.number">{{ r.number }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <button mat-stroked-button type="button" (click)="compare()" [disabled]="from() === to()">Show changes</button>
      </div>
      @if (problem()) {
        <p class="problem" role="alert">{{ problem() }}</p>
      }
      @if (changes(); as list) {
        @if (list.length === 0) {
          <p>No differences.</p>
        } @else {
          <table class="diff" aria-label="Changes between the revisions">
            <thead>
              <tr><th>Value</th><th>Revision {{ shownFrom() }}</th><th>Revision {{ shownTo() }}</th></tr>
            </thead>
            <tbody>
              @for (c of list; track c.path) {
                <tr>
                  <td class="path">{{ c.path }}</td>
                  <td class="before">{{ fmt(c.before) }}</td>
                  <td class="after">{{ fmt(c.after) }}</td>
                </tr>
              }
            </tbody>
          </table>
        }
      }
    }
  `,
  styles: `
    .history {
      width: 100%;
    }
    .comment {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .compare {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
      align-items: center;
      margin-top: 16px;
    }
    .diff {
      border-collapse: collapse;
      margin-top: 12px;
      font: var(--mat-sys-body-small);
    }
    .diff th,
    .diff td {
      text-align: left;
      padding: 4px 12px 4px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      vertical-align: top;
    }
    .path {
      font-family: monospace;
    }
    .before {
      color: var(--mat-sys-error);
    }
    .after {
      color: var(--mat-sys-primary);
    }
    .problem {
      color: var(--mat-sys-error);
    }
  `,
})
export class RevisionHistory {
  private readonly api = inject(LibraryApi);
  readonly kind = input.required<LibraryKind>();
  readonly entryId = input.required<number>();
  readonly revisions = input.required<readonly RevisionSummary[]>();

  protected readonly columns = ['number', 'state', 'created', 'submitted', 'reviewed'];
  protected readonly stateLabel = stateLabel;
  protected readonly when = when;
  protected readonly from = signal(1);
  protected readonly to = signal(1);
  protected readonly changes = signal<DiffChange[] | null>(null);
  protected readonly shownFrom = signal(0);
  protected readonly shownTo = signal(0);
  protected readonly problem = signal('');
  protected readonly fmt = shown;

  constructor() {
    // Newest against the one before it, by default.
    effect(() => {
      const list = this.revisions();
      if (list.length > 1) {
        this.to.set(list[0].number);
        this.from.set(list[1].number);
      }
      this.changes.set(null);
    });
  }

  protected async compare(): Promise<void> {
    this.problem.set('');
    try {
      const diff = await firstValueFrom(this.api.diff(this.kind(), this.entryId(), this.from(), this.to()));
      this.shownFrom.set(diff.from);
      this.shownTo.set(diff.to);
      this.changes.set([...diff.changes]);
    } catch (e) {
      this.problem.set(apiProblem(e).message);
    }
  }
}
