import { DatePipe, JsonPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { catchError, combineLatest, debounceTime, map, of, startWith, switchMap } from 'rxjs';
import { AUDIT_ACTIONS, type AuditFilter, type AuditPage } from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { AdminApi } from './admin-api';

const EMPTY: AuditPage = { total: 0, limit: 25, offset: 0, entries: [], entityTypes: [] };

/** The audit log with filters (action, person, record, dates), newest first, paged. */
@Component({
  selector: 'wick-audit-log',
  imports: [DatePipe, JsonPipe, MatFormFieldModule, MatInputModule, MatPaginatorModule, MatSelectModule, MatTableModule, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <form class="filters" [formGroup]="filters" aria-label="Audit log filters">
      <mat-form-field>
        <mat-label>Action</mat-label>
        <mat-select formControlName="action">
          <mat-option value="">Any</mat-option>
          @for (a of actions; track a) {
            <mat-option [value]="a">{{ a }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      @if (people(); as list) {
        <mat-form-field>
          <mat-label>Person</mat-label>
          <mat-select formControlName="actorId">
            <mat-option [value]="0">Anyone</mat-option>
            @for (p of list; track p.id) {
              <mat-option [value]="p.id">{{ p.name }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
      }
      <mat-form-field>
        <mat-label>Record type</mat-label>
        <mat-select formControlName="entityType">
          <mat-option value="">Any</mat-option>
          @for (t of page().entityTypes; track t) {
            <mat-option [value]="t">{{ t }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Record id</mat-label>
        <input matInput formControlName="entityId" />
      </mat-form-field>
      <mat-form-field>
        <mat-label>From</mat-label>
        <input matInput type="date" formControlName="from" />
      </mat-form-field>
      <mat-form-field>
        <mat-label>To</mat-label>
        <input matInput type="date" formControlName="to" />
      </mat-form-field>
    </form>
    @if (error()) {
      <p class="wick-caution" role="alert"><span>{{ error() }}</span></p>
    }
    <table mat-table [dataSource]="page().entries" class="audit">
      <ng-container matColumnDef="at">
        <th mat-header-cell *matHeaderCellDef>When</th>
        <td mat-cell *matCellDef="let e">{{ e.at | date: 'yyyy-MM-dd HH:mm:ss' }}</td>
      </ng-container>
      <ng-container matColumnDef="actor">
        <th mat-header-cell *matHeaderCellDef>Who</th>
        <td mat-cell *matCellDef="let e">{{ e.actor?.name ?? 'system' }}</td>
      </ng-container>
      <ng-container matColumnDef="action">
        <th mat-header-cell *matHeaderCellDef>Did</th>
        <td mat-cell *matCellDef="let e">{{ e.action }}</td>
      </ng-container>
      <ng-container matColumnDef="entity">
        <th mat-header-cell *matHeaderCellDef>Record</th>
        <td mat-cell *matCellDef="let e">{{ e.entityType }}{{ e.entityId ? ' #' + e.entityId : '' }}</td>
      </ng-container>
      <ng-container matColumnDef="details">
        <th mat-header-cell *matHeaderCellDef>Details</th>
        <td mat-cell *matCellDef="let e"><code>{{ e.details ? (e.details | json) : '' }}</code></td>
      </ng-container>
      <tr mat-header-row *matHeaderRowDef="columns"></tr>
      <tr mat-row *matRowDef="let row; columns: columns"></tr>
    </table>
    @if (page().total === 0) {
      <p class="empty">No entries match these filters.</p>
    }
    <mat-paginator
      [length]="page().total"
      [pageSize]="pageSize()"
      [pageIndex]="pageIndex()"
      [pageSizeOptions]="[25, 50, 100]"
      (page)="paged($event)"
      aria-label="Audit log pages"
    />
  `,
  styles: `
    .filters { display: flex; flex-wrap: wrap; gap: 0 12px; margin-top: 16px; }
    .filters mat-form-field { width: 180px; }
    .audit { width: 100%; }
    code { font-size: 12px; white-space: pre-wrap; word-break: break-word; }
    .empty { color: var(--mat-sys-on-surface-variant); }
  `,
})
export class AuditLogView {
  private readonly api = inject(AdminApi);
  private readonly auth = inject(AuthStore);
  protected readonly actions = AUDIT_ACTIONS;
  protected readonly columns = ['at', 'actor', 'action', 'entity', 'details'];
  protected readonly filters = inject(NonNullableFormBuilder).group({
    action: '',
    actorId: 0,
    entityType: '',
    entityId: '',
    from: '',
    to: '',
  });
  protected readonly pageSize = signal(25);
  protected readonly pageIndex = signal(0);
  protected readonly error = signal('');
  private readonly pageChanges = signal(0);
  /** The people list needs users:manage; without it the person filter is left out. */
  protected readonly people = toSignal(this.auth.can('users:manage') ? this.api.users() : of(null), { initialValue: null });
  protected readonly page = signal<AuditPage>(EMPTY);

  constructor() {
    const filterChanges = this.filters.valueChanges.pipe(
      debounceTime(250),
      map(() => {
        this.pageIndex.set(0);
        return 0;
      }),
      startWith(0),
    );
    combineLatest([filterChanges, toObservable(this.pageChanges)])
      .pipe(
        switchMap(() => {
          const v = this.filters.getRawValue();
          const filter: AuditFilter = {
            action: (v.action || undefined) as AuditFilter['action'],
            actorId: v.actorId || undefined,
            entityType: v.entityType || undefined,
            entityId: v.entityId.trim() || undefined,
            from: v.from || undefined,
            to: v.to || undefined,
            limit: this.pageSize(),
            offset: this.pageIndex() * this.pageSize(),
          };
          this.error.set('');
          return this.api.audit(filter).pipe(
            catchError((e: unknown) => {
              this.error.set(e instanceof Error ? e.message : 'The audit log could not be loaded.');
              return of(EMPTY);
            }),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((p) => this.page.set(p));
  }

  protected paged(e: PageEvent): void {
    this.pageSize.set(e.pageSize);
    this.pageIndex.set(e.pageIndex);
    this.pageChanges.update((n) => n + 1);
  }
}
