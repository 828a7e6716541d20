import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { EntrySummary, Page } from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { EmptyState } from '../../shared/empty-state/empty-state';
import { apiProblem } from '../library/api-error';
import { LibraryApi } from '../library/library-api';
import { KIND_LABELS, entryLink, when } from '../library/library-format';

/** Entries waiting for a reviewer, oldest change first; one's own submissions are marked (a second reviewer decides). */
@Component({
  selector: 'wick-review-queue',
  imports: [EmptyState, MatButtonModule, MatIconModule, MatPaginatorModule, MatProgressBarModule, MatTableModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <h1>Review queue</h1>
      <p class="lead">Library entries submitted for review. Check each value against its source, then approve or return it with a comment.</p>
      @if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading" />
      }
      @if (problem()) {
        <p class="problem" role="alert">{{ problem() }}</p>
      }
      @if (page(); as p) {
        @if (p.total === 0) {
          <wick-empty-state icon="task_alt" heading="Nothing to review">New submissions appear here, and every reviewer gets an e-mail.</wick-empty-state>
        } @else {
          <table mat-table [dataSource]="p.items">
            <ng-container matColumnDef="name">
              <th mat-header-cell *matHeaderCellDef>Entry</th>
              <td mat-cell *matCellDef="let e"><a [routerLink]="link(e)">{{ e.name }}</a></td>
            </ng-container>
            <ng-container matColumnDef="kind">
              <th mat-header-cell *matHeaderCellDef>Kind</th>
              <td mat-cell *matCellDef="let e">{{ kindWord(e) }}</td>
            </ng-container>
            <ng-container matColumnDef="revision">
              <th mat-header-cell *matHeaderCellDef>Revision</th>
              <td mat-cell *matCellDef="let e">{{ e.headRevision }}{{ e.approvedRevision ? ' (replaces ' + e.approvedRevision + ')' : '' }}</td>
            </ng-container>
            <ng-container matColumnDef="submitted">
              <th mat-header-cell *matHeaderCellDef>Submitted by</th>
              <td mat-cell *matCellDef="let e">
                {{ e.submittedBy?.name }}
                @if (e.submittedBy?.id === me()) {
                  <span class="own">(yours: another reviewer decides)</span>
                }
              </td>
            </ng-container>
            <ng-container matColumnDef="updatedAt">
              <th mat-header-cell *matHeaderCellDef>Last change</th>
              <td mat-cell *matCellDef="let e">{{ when(e.updatedAt) }}</td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="columns"></tr>
            <tr mat-row *matRowDef="let e; columns: columns"></tr>
          </table>
          <mat-paginator [length]="p.total" [pageIndex]="pageIndex()" [pageSize]="pageSize()" [pageSizeOptions]="[10, 25, 50]" (page)="paged($event)" aria-label="Pages of the queue" />
        }
      }
    </section>
  `,
  styles: `
    h1 {
      font: var(--mat-sys-headline-small);
    }
    .lead {
      color: var(--mat-sys-on-surface-variant);
    }
    table {
      width: 100%;
    }
    .own {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .problem {
      color: var(--mat-sys-error);
    }
  `,
})
export class ReviewQueue {
  private readonly api = inject(LibraryApi);
  private readonly auth = inject(AuthStore);
  protected readonly columns = ['name', 'kind', 'revision', 'submitted', 'updatedAt'];
  protected readonly page = signal<Page<EntrySummary> | null>(null);
  protected readonly loading = signal(false);
  protected readonly problem = signal('');
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  protected readonly when = when;

  constructor() {
    void this.load();
  }

  protected me(): number | undefined {
    return this.auth.user()?.id;
  }

  protected link(e: EntrySummary): string[] {
    return entryLink(e.kind, e.id);
  }

  protected kindWord(e: EntrySummary): string {
    return KIND_LABELS[e.kind].one;
  }

  protected paged(e: PageEvent): void {
    this.pageIndex.set(e.pageIndex);
    this.pageSize.set(e.pageSize);
    void this.load();
  }

  private async load(): Promise<void> {
    this.loading.set(true);
    try {
      this.page.set(
        await firstValueFrom(this.api.entries({ state: 'in-review', sort: 'updatedAt', dir: 'asc', page: this.pageIndex() + 1, pageSize: this.pageSize() })),
      );
      this.problem.set('');
    } catch (e) {
      this.problem.set(apiProblem(e).message);
    } finally {
      this.loading.set(false);
    }
  }
}
