import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { PERMISSIONS, ROLE_LABELS, type Permission } from 'wick-core';
import { EmptyState } from '../../shared/empty-state/empty-state';
import { AuthStore } from './auth-store';

/** 403: names the role the page needs and the roles the person has. */
@Component({
  selector: 'wick-forbidden',
  imports: [EmptyState, MatButtonModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <h1>{{ area() || 'Not available' }}</h1>
      <wick-empty-state icon="lock" heading="You do not have access to this page">
        @if (needed(); as roles) {
          It needs the <strong class="needed">{{ roles }}</strong> role.
        }
        @if (held(); as roles) {
          You are signed in as {{ name() }} with the {{ roles }} role.
        } @else {
          Your account has no Wickwright role yet.
        }
        Ask an administrator if you need access.
      </wick-empty-state>
      <div class="actions"><a mat-button routerLink="/">Back to the start page</a></div>
    </section>
  `,
  styles: `
    h1 { font: var(--mat-sys-headline-small); }
    .actions { display: flex; justify-content: center; }
  `,
})
export class Forbidden {
  private readonly auth = inject(AuthStore);
  readonly area = input('');
  /** The permission the route needs (wick-core PERMISSIONS key), or 'signed-in'. */
  readonly need = input('');
  protected readonly name = computed(() => this.auth.user()?.name ?? '');
  protected readonly needed = computed(() => {
    const roles = PERMISSIONS[this.need() as Permission] as readonly (keyof typeof ROLE_LABELS)[] | undefined;
    return roles ? roles.map((r) => ROLE_LABELS[r]).join(' or ') : '';
  });
  protected readonly held = computed(() => (this.auth.user()?.roles ?? []).map((r) => ROLE_LABELS[r]).join(', '));
}
