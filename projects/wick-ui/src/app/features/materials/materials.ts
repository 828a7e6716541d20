import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { EntryTable } from '../library/entry-table';
import { kindOfCollection } from '../library/library-format';

/** The materials library: fibres and webs, each in its own tab with a server-paged table. */
@Component({
  selector: 'wick-materials',
  imports: [EntryTable, MatButtonModule, MatIconModule, MatTabsModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <header>
        <h1>Materials library</h1>
        @if (auth.can('library:edit')) {
          <div class="actions">
            <a mat-flat-button [routerLink]="['/materials', collection(), 'new']"><mat-icon>add</mat-icon>New {{ kind() }}</a>
            @if (kind() === 'web') {
              <a mat-stroked-button routerLink="/materials/webs/import"><mat-icon>upload_file</mat-icon>Import webs (CSV)</a>
            }
          </div>
        }
      </header>
      <p class="lead">Reviewed fibre and web data. Engineers rely on approved revisions; drafts and entries in review are shown with their state.</p>
      @if (imported()) {
        <p class="notice" role="status">Imported {{ imported() }} web(s) as drafts: open each to check and submit it.</p>
      }
      <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Kinds of material">
        <a mat-tab-link routerLink="/materials/webs" [active]="kind() === 'web'">Webs</a>
        <a mat-tab-link routerLink="/materials/fibres" [active]="kind() === 'fibre'">Fibres</a>
      </nav>
      <mat-tab-nav-panel #panel>
        @switch (kind()) {
          @case ('fibre') {
            <wick-entry-table kind="fibre" />
          }
          @default {
            <wick-entry-table kind="web" />
          }
        }
      </mat-tab-nav-panel>
    </section>
  `,
  styles: `
    header {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 12px;
    }
    h1 {
      font: var(--mat-sys-headline-small);
    }
    .actions {
      display: flex;
      gap: 8px;
    }
    .lead {
      color: var(--mat-sys-on-surface-variant);
    }
    .notice {
      padding: 8px 12px;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-surface-container);
    }
    mat-tab-nav-panel {
      display: block;
      padding-top: 16px;
    }
  `,
})
export class Materials {
  protected readonly auth = inject(AuthStore);
  /** Route parameter: `fibres` or `webs`. */
  readonly collection = input<string>('webs');
  /** Query parameter set after a bulk import: how many webs it created. */
  readonly imported = input<string | undefined>(undefined);
  protected readonly kind = computed(() => (kindOfCollection(this.collection()) === 'fibre' ? 'fibre' : 'web'));
}
