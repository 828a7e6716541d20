import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatTabsModule } from '@angular/material/tabs';
import { AuthStore } from '../../core/auth/auth-store';
import { AuditLogView } from './audit-log';
import { PeopleList } from './people';

/** Administration: people and their roles, and the audit log. */
@Component({
  selector: 'wick-admin',
  imports: [AuditLogView, MatTabsModule, PeopleList],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <h1>Administration</h1>
      <mat-tab-group mat-stretch-tabs="false" animationDuration="0ms">
        @if (auth.can('users:manage')) {
          <mat-tab label="People and roles"><wick-people-list /></mat-tab>
        }
        @if (auth.can('audit:read')) {
          <mat-tab label="Audit log">
            <ng-template matTabContent><wick-audit-log /></ng-template>
          </mat-tab>
        }
      </mat-tab-group>
    </section>
  `,
  styles: `h1 { font: var(--mat-sys-headline-small); }`,
})
export class Admin {
  protected readonly auth = inject(AuthStore);
}
