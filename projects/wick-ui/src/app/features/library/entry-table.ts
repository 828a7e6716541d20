import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router } from '@angular/router';
import { catchError, debounceTime, distinctUntilChanged, map, of, switchMap, tap } from 'rxjs';
import {
  type EntrySummary,
  FIGURE_COLUMNS,
  type LibraryKind,
  type ListQuery,
  type Page,
  REVISION_STATES,
  type RevisionState,
  WEB_KIND_LABELS,
  WEB_KINDS,
} from 'wick-core';
import { apiProblem } from './api-error';
import { LibraryApi } from './library-api';
import { entryLink, figureText, stateLabel, when } from './library-format';

interface Column {
  readonly key: string;
  readonly label: string;
  /** Server sort key, when the column can be sorted. */
  readonly sort?: string;
}

const BASE_COLUMNS: readonly Column[] = [
  { key: 'name', label: 'Name', sort: 'name' },
  { key: 'supplier', label: 'Supplier', sort: 'supplier' },
  { key: 'state', label: 'State', sort: 'state' },
];
const TAIL_COLUMNS: readonly Column[] = [
  { key: 'revision', label: 'Rev.' },
  { key: 'updatedAt', label: 'Changed', sort: 'updatedAt' },
  { key: 'updatedBy', label: 'By' },
];

const EMPTY: Page<EntrySummary> = { items: [], total: 0, page: 1, pageSize: 25 };

/**
 * A library table for one kind: server-side paging, sorting and filtering (text, state, web kind), and a choice of
 * columns. A row opens its entry.
 */
@Component({
  selector: 'wick-entry-table',
  imports: [
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="filters">
      <mat-form-field subscriptSizing="dynamic" class="search">
        <mat-label>Filter by name or notes</mat-label>
        <mat-icon matPrefix>search</mat-icon>
        <input matInput [ngModel]="text()" (ngModelChange)="text.set($event)" />
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>State</mat-label>
        <mat-select [ngModel]="state()" (ngModelChange)="setState($event)">
          <mat-option [value]="null">Any state</mat-option>
          @for (s of states; track s) {
            <mat-option [value]="s">{{ stateLabel(s) }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      @if (kind() === 'web') {
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Kind of web</mat-label>
          <mat-select [ngModel]="type()" (ngModelChange)="setType($event)">
            <mat-option [value]="null">Any kind</mat-option>
            @for (w of webKinds; track w) {
              <mat-option [value]="w">{{ webKindLabels[w] }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
      }
      <mat-form-field subscriptSizing="dynamic" class="columns">
        <mat-label>Columns</mat-label>
        <mat-select multiple [ngModel]="chosen()" (ngModelChange)="shown.set($event)">
          @for (c of optionalColumns(); track c.key) {
            <mat-option [value]="c.key">{{ c.label }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
    </div>

    @if (loading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading" />
    }
    @if (problem()) {
      <p class="problem" role="alert">{{ problem() }}</p>
    }

    <div class="table-wrap">
      <table mat-table [dataSource]="page().items" matSort [matSortActive]="sort().active" [matSortDirection]="sort().direction" (matSortChange)="sorted($event)">
        @for (c of allColumns(); track c.key) {
          <ng-container [matColumnDef]="c.key">
            <th mat-header-cell *matHeaderCellDef [mat-sort-header]="c.sort ?? ''" [disabled]="!c.sort">{{ c.label }}</th>
            <td mat-cell *matCellDef="let e">
              @switch (c.key) {
                @case ('name') {
                  <a class="name" [href]="href(e)" (click)="open($event, e)">{{ e.name }}</a>
                }
                @case ('supplier') {
                  {{ e.supplier?.name ?? '—' }}
                }
                @case ('state') {
                  <span class="state" [attr.data-state]="e.state">{{ stateLabel(e.state) }}</span>
                  @if (e.approvedRevision && e.state !== 'approved') {
                    <span class="in-force"> (rev. {{ e.approvedRevision }} approved)</span>
                  }
                }
                @case ('revision') {
                  {{ e.headRevision }}
                }
                @case ('updatedAt') {
                  {{ when(e.updatedAt) }}
                }
                @case ('updatedBy') {
                  {{ e.updatedBy.name }}
                }
                @default {
                  {{ figure(e, c.key) }}
                }
              }
            </td>
          </ng-container>
        }
        <tr mat-header-row *matHeaderRowDef="displayed()"></tr>
        <tr mat-row *matRowDef="let e; columns: displayed()" (click)="open($event, e)" class="row"></tr>
        <tr class="mat-row" *matNoDataRow>
          <td class="mat-cell empty" [attr.colspan]="displayed().length">{{ loading() ? 'Loading…' : 'No entries match.' }}</td>
        </tr>
      </table>
    </div>
    <mat-paginator
      [length]="page().total"
      [pageIndex]="pageIndex()"
      [pageSize]="pageSize()"
      [pageSizeOptions]="[10, 25, 50, 100]"
      (page)="paged($event)"
      aria-label="Pages of entries"
    />
  `,
  styles: `
    .filters {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
      align-items: center;
      margin-bottom: 12px;
    }
    .search {
      flex: 1 1 240px;
    }
    .columns {
      width: 180px;
    }
    .table-wrap {
      overflow-x: auto;
    }
    table {
      width: 100%;
    }
    .row {
      cursor: pointer;
    }
    .row:hover {
      background: var(--mat-sys-surface-container-high);
    }
    .name {
      font-weight: 500;
    }
    .state[data-state='approved'] {
      color: var(--mat-sys-primary);
    }
    .state[data-state='returned'] {
      color: var(--mat-sys-error);
    }
    .state[data-state='in-review'] {
      color: var(--mat-sys-tertiary);
    }
    .in-force {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    .empty {
      padding: 16px;
      color: var(--mat-sys-on-surface-variant);
    }
    .problem {
      color: var(--mat-sys-error);
    }
  `,
})
export class EntryTable {
  private readonly api = inject(LibraryApi);
  private readonly router = inject(Router);

  readonly kind = input.required<LibraryKind>();

  protected readonly states = REVISION_STATES;
  protected readonly webKinds = WEB_KINDS;
  protected readonly webKindLabels = WEB_KIND_LABELS;
  protected readonly stateLabel = stateLabel;
  protected readonly when = when;

  protected readonly text = signal('');
  protected readonly state = signal<RevisionState | null>(null);
  protected readonly type = signal<string | null>(null);
  protected readonly sort = signal<{ active: string; direction: 'asc' | 'desc' | '' }>({ active: 'name', direction: 'asc' });
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  protected readonly page = signal<Page<EntrySummary>>(EMPTY);
  protected readonly loading = signal(false);
  protected readonly problem = signal('');

  private readonly figureColumns = computed<Column[]>(() => FIGURE_COLUMNS[this.kind()].map((f) => ({ key: f.key, label: f.label, sort: f.key })));
  protected readonly allColumns = computed<Column[]>(() => [...BASE_COLUMNS, ...this.figureColumns(), ...TAIL_COLUMNS]);
  protected readonly optionalColumns = computed(() => this.allColumns().filter((c) => c.key !== 'name'));
  /** Columns chosen by the person (all but "By" at first). */
  protected readonly shown = signal<string[] | null>(null);
  protected readonly chosen = computed(() => this.shown() ?? this.optionalColumns().map((c) => c.key).filter((k) => k !== 'updatedBy'));
  protected readonly displayed = computed(() => ['name', ...this.optionalColumns().map((c) => c.key).filter((k) => this.chosen().includes(k))]);

  private readonly textDebounced = toObservable(this.text).pipe(debounceTime(300), distinctUntilChanged());

  private readonly query = computed<ListQuery>(() => ({
    page: this.pageIndex() + 1,
    pageSize: this.pageSize(),
    sort: this.sort().direction ? this.sort().active : 'name',
    dir: this.sort().direction === 'desc' ? 'desc' : 'asc',
    state: this.state() ?? undefined,
    type: this.type() ?? undefined,
  }));

  constructor() {
    const q = toObservable(this.query);
    this.textDebounced
      .pipe(
        tap(() => this.pageIndex.set(0)),
        switchMap((text) => q.pipe(map((query) => ({ ...query, q: text || undefined })))),
        debounceTime(0),
        tap(() => this.loading.set(true)),
        switchMap((query) =>
          this.api.list(this.kind(), query).pipe(
            tap(() => this.problem.set('')),
            catchError((e: unknown) => {
              this.problem.set(apiProblem(e).message);
              return of(EMPTY);
            }),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((page) => {
        this.page.set(page);
        this.loading.set(false);
      });
  }

  protected setState(s: RevisionState | null): void {
    this.state.set(s);
    this.pageIndex.set(0);
  }

  protected setType(t: string | null): void {
    this.type.set(t);
    this.pageIndex.set(0);
  }

  protected sorted(s: Sort): void {
    this.sort.set({ active: s.active, direction: s.direction });
    this.pageIndex.set(0);
  }

  protected paged(e: PageEvent): void {
    this.pageSize.set(e.pageSize);
    this.pageIndex.set(e.pageIndex);
  }

  protected figure(e: EntrySummary, key: string): string {
    return figureText(e.kind, key, e.figures[key]);
  }

  protected href(e: EntrySummary): string {
    return entryLink(e.kind, e.id).join('/');
  }

  protected open(event: Event, e: EntrySummary): void {
    event.preventDefault();
    event.stopPropagation();
    void this.router.navigate(entryLink(e.kind, e.id));
  }
}
