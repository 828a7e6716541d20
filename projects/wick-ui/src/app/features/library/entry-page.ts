import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { type LibraryKind, type Revision, type WebData } from 'wick-core';
import { Plot, type PlotTrace } from '../../shared/plot/plot';
import { EntryProperties } from './entry-properties';
import { EntryStore } from './entry-store';
import { KIND_LABELS, kindOfCollection, listLink, stateLabel, when } from './library-format';
import { RevisionHistory } from './revision-history';
import { UploadPanel } from './upload-panel';

/** Cumulative fraction finer (0–1) from any of the three stored forms, for plotting. */
function cumulativeFiner(form: string, fractions: readonly number[]): number[] {
  if (form === 'cumulative-finer') return [...fractions];
  if (form === 'cumulative-coarser') return fractions.map((g) => 1 - g);
  let sum = 0;
  return fractions.map((f) => (sum += f));
}

/**
 * One library entry: its newest revision's properties with their sources, the pore-size distribution and lab
 * curves as plots, what a reviewer decided, the revision history with differences, and the actions the person
 * may take now (the server checks each of them again).
 */
@Component({
  selector: 'wick-entry-page',
  imports: [
    EntryProperties,
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    Plot,
    RevisionHistory,
    RouterLink,
    UploadPanel,
  ],
  providers: [EntryStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <a class="back" [routerLink]="listLink(resolvedKind())"><mat-icon>arrow_back</mat-icon>{{ kindWords().many }}</a>
      @if (store.loading() && !store.entry()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading" />
      }
      @if (store.deleted()) {
        <p role="status">{{ store.notice() }}</p>
      } @else if (store.entry(); as e) {
        <header>
          <div>
            <h1>{{ e.head.name }}</h1>
            <p class="meta">
              {{ kindWords().one }} · revision {{ e.head.number }} ·
              <span class="state" [attr.data-state]="e.head.state">{{ stateLabel(e.head.state) }}</span>
              @if (e.head.supplier) {
                · {{ e.head.supplier.name }}
              }
              · changed {{ when(e.head.updatedAt) }} by {{ e.head.updatedBy.name }}
            </p>
          </div>
          <div class="actions">
            @if (e.actions.edit) {
              <a mat-stroked-button [routerLink]="['edit']"><mat-icon>edit</mat-icon>{{ e.head.state === 'approved' ? 'Start a new revision' : 'Edit' }}</a>
            }
            @if (e.actions.submit) {
              <button mat-flat-button type="button" (click)="store.submit()" [disabled]="store.busy()"><mat-icon>send</mat-icon>Submit for review</button>
            }
            @if (e.actions.deleteDraft) {
              <button mat-button type="button" (click)="confirmDelete.set(true)" [disabled]="store.busy()"><mat-icon>delete</mat-icon>Delete draft</button>
            }
          </div>
        </header>

        @if (confirmDelete()) {
          <div class="confirm" role="alertdialog" aria-label="Delete the draft?">
            <span>Delete revision {{ e.head.number }}? {{ e.revisions.length === 1 ? 'The entry goes with it.' : 'The approved revision stays.' }}</span>
            <button mat-flat-button type="button" (click)="confirmDelete.set(false); store.deleteDraft()">Delete</button>
            <button mat-button type="button" (click)="confirmDelete.set(false)">Keep</button>
          </div>
        }
        @if (store.notice()) {
          <p class="notice" role="status">{{ store.notice() }}</p>
        }
        @if (store.problem(); as p) {
          <p class="problem" role="alert">{{ p.message }}</p>
        }
        @if (e.head.state === 'returned' || (e.head.state === 'draft' && e.head.reviewComment)) {
          <p class="returned"><mat-icon aria-hidden="true">undo</mat-icon>
            Returned by {{ e.head.reviewedBy?.name }} {{ when(e.head.reviewedAt) }}: “{{ e.head.reviewComment }}”
          </p>
        }
        @if (e.approved) {
          <p class="in-force">Revision {{ e.approved.number }} (approved {{ when(e.approved.reviewedAt) }}) stays in force until this one is approved.</p>
        }

        @if (e.head.state === 'in-review' && (e.actions.approve || e.actions.return || e.actions.reviewBlockedReason)) {
          <section class="review" aria-label="Review">
            <h2>Review</h2>
            @if (e.actions.reviewBlockedReason) {
              <p>{{ e.actions.reviewBlockedReason }}</p>
            } @else {
              <p>Submitted by {{ e.head.submittedBy?.name }} {{ when(e.head.submittedAt) }}. Check each value and its source.</p>
              <mat-form-field class="comment">
                <mat-label>Comment (needed to return)</mat-label>
                <textarea matInput rows="3" [(ngModel)]="comment" name="comment"></textarea>
              </mat-form-field>
              <div class="actions">
                <button mat-flat-button type="button" (click)="store.approve(comment.trim() || undefined)" [disabled]="store.busy()"><mat-icon>check</mat-icon>Approve</button>
                <button mat-stroked-button type="button" (click)="store.returnWith(comment.trim())" [disabled]="store.busy() || !comment.trim()"><mat-icon>undo</mat-icon>Return</button>
              </div>
            }
          </section>
        }

        <section aria-label="Properties">
          <h2>Properties</h2>
          <wick-entry-properties [kind]="e.kind" [revision]="e.head" />
          @if (e.head.notes) {
            <p class="notes">{{ e.head.notes }}</p>
          }
        </section>

        @if (e.kind === 'web') {
          <section aria-label="Pore-size distribution">
            <h2>Pore-size distribution</h2>
            @if (psd(); as trace) {
              @defer (on viewport) {
                <wick-plot [traces]="[trace]" [x]="{ title: 'Pore diameter (µm)', type: 'log' }" [y]="{ title: 'Cumulative fraction finer (%)' }" ariaLabel="Cumulative pore-size distribution" />
              } @placeholder {
                <div class="plot-placeholder">Plot</div>
              }
              @if (psdFile(); as f) {
                <p class="file">From <a [href]="'/api/library/files/' + f.fileId">{{ f.fileName }}</a> (SHA-256 {{ f.sha256.slice(0, 12) }}…)</p>
              }
            } @else {
              <p class="none">No distribution yet.</p>
            }
            @if (e.actions.edit) {
              <wick-upload-panel purpose="psd" [entryId]="e.id" [version]="e.version" (committed)="store.reload('The distribution was added to the draft.')" />
            }
          </section>

          <section aria-label="Lab curves">
            <h2>Lab curves</h2>
            @if (curves().length) {
              @defer (on viewport) {
                <wick-plot [traces]="curves()" [x]="{ title: 'Time (s)' }" [y]="{ title: curveAxis() }" ariaLabel="Measured wicking curves" />
              } @placeholder {
                <div class="plot-placeholder">Plot</div>
              }
            } @else {
              <p class="none">No curves yet.</p>
            }
            @if (e.actions.edit) {
              <wick-upload-panel purpose="curve" [entryId]="e.id" [version]="e.version" (committed)="store.reload('The curve was added to the draft.')" />
            }
          </section>
        }

        <section aria-label="History">
          <h2>History</h2>
          <wick-revision-history [kind]="e.kind" [entryId]="e.id" [revisions]="e.revisions" />
        </section>
        <p class="wick-caution"><mat-icon aria-hidden="true">info</mat-icon>
          Library values feed engineering estimates. For products worn on skin, confirm them with the applicable standard tests,
          local regulations and qualified review.
        </p>
      } @else if (store.problem(); as p) {
        <p class="problem" role="alert">{{ p.message }}</p>
      }
    </section>
  `,
  styles: `
    .back {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      text-decoration: none;
    }
    header {
      display: flex;
      flex-wrap: wrap;
      justify-content: space-between;
      gap: 12px;
      align-items: flex-start;
    }
    h1 {
      font: var(--mat-sys-headline-small);
      margin-bottom: 4px;
    }
    h2 {
      font: var(--mat-sys-title-medium);
      margin-top: 28px;
    }
    .meta {
      color: var(--mat-sys-on-surface-variant);
      margin-top: 0;
    }
    .state[data-state='approved'] {
      color: var(--mat-sys-primary);
    }
    .state[data-state='returned'] {
      color: var(--mat-sys-error);
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .confirm,
    .returned,
    .in-force,
    .notice {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      align-items: center;
      padding: 8px 12px;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-surface-container);
    }
    .returned {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    .problem {
      color: var(--mat-sys-error);
    }
    .review {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
      padding: 0 16px 16px;
    }
    .comment {
      width: 100%;
    }
    .notes,
    .none,
    .file {
      color: var(--mat-sys-on-surface-variant);
    }
    .plot-placeholder {
      height: 320px;
    }
    wick-upload-panel {
      display: block;
      margin-top: 12px;
    }
    .wick-caution {
      margin-top: 32px;
    }
  `,
})
export class EntryPage {
  protected readonly store = inject(EntryStore);
  /** Route parameter of the materials pages: `fibres` or `webs`. */
  readonly collection = input<string | undefined>(undefined);
  /** Route data of the liquids pages. */
  readonly kind = input<LibraryKind | undefined>(undefined);
  readonly id = input.required<string>();

  protected readonly resolvedKind = computed<LibraryKind>(() => this.kind() ?? kindOfCollection(this.collection()) ?? 'web');
  protected readonly kindWords = computed(() => KIND_LABELS[this.resolvedKind()]);
  protected readonly confirmDelete = signal(false);
  protected comment = '';
  protected readonly stateLabel = stateLabel;
  protected readonly when = when;
  protected readonly listLink = listLink;

  private readonly web = computed(() => {
    const e = this.store.entry();
    return e?.kind === 'web' ? (e.head as Revision<WebData>).data : null;
  });
  protected readonly psd = computed<PlotTrace | null>(() => {
    const p = this.web()?.poreSizeDistribution;
    if (!p) return null;
    return {
      name: 'Cumulative finer',
      x: p.diameters.map((d) => d * 1e6),
      y: cumulativeFiner(p.form, p.fractions).map((f) => f * 100),
      mode: 'lines+markers',
    };
  });
  protected readonly psdFile = computed(() => this.web()?.poreSizeDistribution?.file ?? null);
  protected readonly curves = computed<PlotTrace[]>(() =>
    (this.web()?.curves ?? []).map((c) => ({
      name: c.name,
      x: [...c.times],
      // m → mm for heights, kg → g for masses.
      y: c.values.map((v) => v * 1000),
      mode: 'lines+markers',
    })),
  );
  protected readonly curveAxis = computed(() => {
    const kinds = new Set((this.web()?.curves ?? []).map((c) => c.measurement));
    return kinds.size === 1 && kinds.has('mass') ? 'Mass (g)' : kinds.has('mass') ? 'Height (mm) or mass (g)' : 'Height (mm)';
  });

  constructor() {
    effect(() => {
      const id = Number(this.id());
      const kind = this.resolvedKind();
      // The store reads its own state while loading: keep that out of this effect's dependencies.
      if (Number.isInteger(id) && id > 0) untracked(() => void this.store.load(kind, id));
    });
  }
}
