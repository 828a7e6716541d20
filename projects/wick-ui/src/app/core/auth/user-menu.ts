import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDividerModule } from '@angular/material/divider';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { ROLE_LABELS } from 'wick-core';
import { AuthStore } from './auth-store';

/** The toolbar's person slot: "Sign in", or the person's name opening a menu with roles and "Sign out". */
@Component({
  selector: 'wick-user-menu',
  imports: [MatButtonModule, MatDividerModule, MatIconModule, MatMenuModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @switch (auth.status()) {
      @case ('anonymous') {
        <button mat-stroked-button type="button" class="sign-in" (click)="auth.signIn()">
          <mat-icon>login</mat-icon>
          Sign in
        </button>
      }
      @case ('unknown') {}
      @default {
        <button mat-button type="button" class="person" [matMenuTriggerFor]="menu" aria-label="Account menu">
          <mat-icon>account_circle</mat-icon>
          <span class="name">{{ user()?.name ?? 'No Wickwright role' }}</span>
        </button>
        <mat-menu #menu="matMenu" xPosition="before">
          <div class="who" role="presentation">
            <div class="full-name">{{ user()?.name ?? 'Signed in' }}</div>
            @if (user()?.email) {
              <div class="email">{{ user()?.email }}</div>
            }
            <div class="roles">
              @for (role of roles(); track role) {
                <span class="role">{{ role }}</span>
              } @empty {
                <span>No Wickwright role yet</span>
              }
            </div>
          </div>
          <mat-divider />
          <button mat-menu-item type="button" (click)="auth.signOut()">
            <mat-icon>logout</mat-icon>
            <span>Sign out</span>
          </button>
        </mat-menu>
      }
    }
  `,
  styles: `
    .sign-in, .person { color: inherit; }
    .sign-in { border-color: currentColor; }
    .name { max-width: 18ch; overflow: hidden; text-overflow: ellipsis; white-space: nowrap; }
    .who { padding: 12px 16px; display: grid; gap: 4px; }
    .full-name { font: var(--mat-sys-title-small); }
    .email { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    .roles { display: flex; flex-wrap: wrap; gap: 4px; margin-top: 4px; }
    .role {
      font: var(--mat-sys-label-small);
      padding: 2px 8px;
      border-radius: 8px;
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
  `,
})
export class UserMenu {
  protected readonly auth = inject(AuthStore);
  protected readonly user = this.auth.user;
  protected readonly roles = computed(() => (this.user()?.roles ?? []).map((r) => ROLE_LABELS[r]));
}
