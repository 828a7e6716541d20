import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { ROLE_LABELS, ROLES, type AdminUser, type Role } from 'wick-core';
import { AdminApi } from './admin-api';

/**
 * Everyone who has signed in, with the roles the provider sent and the roles in force. An administrator ticks the
 * roles a person should have; the difference from the provider's roles is stored as grants and revocations.
 */
@Component({
  selector: 'wick-people-list',
  imports: [DatePipe, MatButtonModule, MatCheckboxModule, MatIconModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (error()) {
      <p class="wick-caution" role="alert"><span>{{ error() }}</span></p>
    }
    <table mat-table [dataSource]="users()" class="people">
      <ng-container matColumnDef="name">
        <th mat-header-cell *matHeaderCellDef>Person</th>
        <td mat-cell *matCellDef="let u">
          <strong>{{ u.name }}</strong><br /><small>{{ u.email }}</small>
        </td>
      </ng-container>
      <ng-container matColumnDef="provider">
        <th mat-header-cell *matHeaderCellDef>From sign-on</th>
        <td mat-cell *matCellDef="let u">{{ labels(u.idpRoles) || '—' }}</td>
      </ng-container>
      <ng-container matColumnDef="roles">
        <th mat-header-cell *matHeaderCellDef>Roles in force</th>
        <td mat-cell *matCellDef="let u">
          {{ labels(u.roles) || 'none' }}
          @if (u.grantedRoles.length || u.revokedRoles.length) {
            <small class="override">(changed by an administrator)</small>
          }
        </td>
      </ng-container>
      <ng-container matColumnDef="last">
        <th mat-header-cell *matHeaderCellDef>Last sign-in</th>
        <td mat-cell *matCellDef="let u">{{ u.lastSignInAt | date: 'medium' }}</td>
      </ng-container>
      <ng-container matColumnDef="edit">
        <th mat-header-cell *matHeaderCellDef></th>
        <td mat-cell *matCellDef="let u">
          <button mat-button type="button" (click)="edit(u)" [attr.aria-label]="'Change roles of ' + u.name">Change roles</button>
        </td>
      </ng-container>
      <tr mat-header-row *matHeaderRowDef="columns"></tr>
      <tr mat-row *matRowDef="let row; columns: columns"></tr>
    </table>

    @if (editing(); as u) {
      <section class="editor" aria-label="Change roles">
        <h2>Roles of {{ u.name }}</h2>
        <p>Ticked roles apply from the next request. Roles from sign-on: {{ labels(u.idpRoles) || 'none' }}.</p>
        @for (role of roles; track role) {
          <mat-checkbox [checked]="chosen().has(role)" (change)="toggle(role, $event.checked)">
            {{ roleLabels[role] }}
            @if (u.idpRoles.includes(role)) {
              <small>(from sign-on)</small>
            }
          </mat-checkbox>
        }
        <div class="actions">
          <button mat-flat-button type="button" (click)="save(u)" [disabled]="saving()">Save roles</button>
          <button mat-button type="button" (click)="editing.set(null)">Cancel</button>
        </div>
      </section>
    }
  `,
  styles: `
    .people { width: 100%; }
    .override { display: block; color: var(--mat-sys-on-surface-variant); }
    .editor { margin-top: 24px; padding: 16px; border: 1px solid var(--mat-sys-outline-variant); border-radius: var(--mat-sys-corner-medium); }
    .editor h2 { font: var(--mat-sys-title-medium); margin: 0 0 8px; }
    mat-checkbox { display: block; }
    .actions { display: flex; gap: 8px; margin-top: 12px; }
  `,
})
export class PeopleList {
  private readonly api = inject(AdminApi);
  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly columns = ['name', 'provider', 'roles', 'last', 'edit'];
  protected readonly users = signal<AdminUser[]>([]);
  protected readonly editing = signal<AdminUser | null>(null);
  protected readonly chosen = signal(new Set<Role>());
  protected readonly saving = signal(false);
  protected readonly error = signal('');
  protected readonly count = computed(() => this.users().length);

  constructor() {
    this.api.users().subscribe({ next: (u) => this.users.set(u), error: (e: unknown) => this.error.set(message(e)) });
  }

  protected labels(roles: readonly Role[]): string {
    return roles.map((r) => ROLE_LABELS[r]).join(', ');
  }

  protected edit(user: AdminUser): void {
    this.error.set('');
    this.chosen.set(new Set(user.roles));
    this.editing.set(user);
  }

  protected toggle(role: Role, on: boolean): void {
    const next = new Set(this.chosen());
    if (on) next.add(role);
    else next.delete(role);
    this.chosen.set(next);
  }

  protected save(user: AdminUser): void {
    const wanted = this.chosen();
    const granted = ROLES.filter((r) => wanted.has(r) && !user.idpRoles.includes(r));
    const revoked = ROLES.filter((r) => !wanted.has(r) && user.idpRoles.includes(r));
    this.saving.set(true);
    this.api.setRoles(user.id, { granted, revoked }).subscribe({
      next: (updated) => {
        this.users.update((list) => list.map((u) => (u.id === updated.id ? updated : u)));
        this.editing.set(null);
        this.saving.set(false);
      },
      error: (e: unknown) => {
        this.error.set(message(e));
        this.saving.set(false);
      },
    });
  }
}

function message(e: unknown): string {
  if (e instanceof HttpErrorResponse) return (e.error as { error?: { message?: string } } | null)?.error?.message ?? e.message;
  return 'Something went wrong.';
}
