import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom, Subject, startWith, switchMap } from 'rxjs';
import { AuthStore } from '../../core/auth/auth-store';
import { EmptyState } from '../../shared/empty-state/empty-state';
import { DesignsApi } from './designs-api';
import { errorText } from './variant-editor';

/** Projects (product programmes): the way into designs and variants. */
@Component({
  selector: 'wick-project-list',
  imports: [DatePipe, ReactiveFormsModule, RouterLink, MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, EmptyState],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <h1>Designs</h1>
      <p class="lead">Projects hold designs; a design holds the variants you compare. Every estimate is recomputed live as you type.</p>
      @if (projects(); as list) {
        @if (list.length === 0) {
          <wick-empty-state icon="stacked_line_chart" heading="No projects yet">Create a project for a product programme to start.</wick-empty-state>
        }
        <div class="grid">
          @for (p of list; track p.id) {
            <a class="card" [routerLink]="['/designs/projects', p.id]" [attr.data-testid]="'project-' + p.id">
              <mat-card appearance="outlined">
                <mat-card-header>
                  <mat-card-title>{{ p.name }}</mat-card-title>
                  <mat-card-subtitle>{{ p.designCount }} designs · {{ p.variantCount }} variants · updated {{ p.updatedAt | date: 'mediumDate' }}</mat-card-subtitle>
                </mat-card-header>
                <mat-card-content><p>{{ p.description }}</p></mat-card-content>
              </mat-card>
            </a>
          }
        </div>
      }
      @if (canEdit()) {
        <form class="create" [formGroup]="form" (ngSubmit)="create()">
          <h2>New project</h2>
          <mat-form-field>
            <mat-label>Name</mat-label>
            <input matInput formControlName="name" />
          </mat-form-field>
          <mat-form-field>
            <mat-label>Description</mat-label>
            <input matInput formControlName="description" />
          </mat-form-field>
          <button mat-flat-button type="submit" [disabled]="form.invalid"><mat-icon>add</mat-icon>Create project</button>
          @if (error(); as e) {
            <p class="error" role="alert">{{ e }}</p>
          }
        </form>
      }
    </section>
  `,
  styles: `
    h1 { font: var(--mat-sys-headline-small); }
    .lead { color: var(--mat-sys-on-surface-variant); }
    .grid { display: grid; grid-template-columns: repeat(auto-fill, minmax(320px, 1fr)); gap: 16px; margin: 16px 0 32px; }
    .card { text-decoration: none; color: inherit; }
    .create { display: flex; flex-wrap: wrap; gap: 8px 16px; align-items: baseline; h2 { width: 100%; font: var(--mat-sys-title-medium); } }
    .error { color: var(--mat-sys-error); }
  `,
})
export class ProjectList {
  private readonly api = inject(DesignsApi);
  private readonly router = inject(Router);
  private readonly reload$ = new Subject<void>();
  private readonly auth = inject(AuthStore);
  protected readonly canEdit = computed(() => this.auth.can('designs:edit'));
  protected readonly projects = toSignal(this.reload$.pipe(startWith(undefined), switchMap(() => this.api.projects())));
  protected readonly error = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    description: [''],
  });

  protected async create(): Promise<void> {
    try {
      const p = await firstValueFrom(this.api.createProject(this.form.getRawValue()));
      await this.router.navigate(['/designs/projects', p.id]);
    } catch (e) {
      this.error.set(errorText(e));
    }
  }
}
