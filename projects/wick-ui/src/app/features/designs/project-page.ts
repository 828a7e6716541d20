import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { ANY_CONFIGURATION_LABELS, COMPARE_MAX, COMPARE_MIN, type ProjectDetail } from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { DesignsApi } from './designs-api';
import { showFigure } from './format';
import { variantRoute } from './stack/stack-links';
import { errorText } from './variant-editor';

/** One project: its designs with their variants (marked when they use unapproved material), and its decisions. */
@Component({
  selector: 'wick-project-page',
  imports: [DatePipe, ReactiveFormsModule, RouterLink, MatButtonModule, MatCardModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatTooltipModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './project-page.html',
  styleUrl: './project-page.scss',
})
export class ProjectPage {
  readonly projectId = input.required<string>();
  private readonly api = inject(DesignsApi);
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  protected readonly project = signal<ProjectDetail | null>(null);
  protected readonly selected = signal<readonly number[]>([]);
  protected readonly error = signal<string | null>(null);
  protected readonly canEdit = computed(() => this.auth.can('designs:edit'));
  protected readonly labels: Readonly<Record<string, string>> = ANY_CONFIGURATION_LABELS;
  protected readonly variantRoute = variantRoute;
  protected readonly showFigure = showFigure;
  protected readonly compareMin = COMPARE_MIN;
  protected readonly compareMax = COMPARE_MAX;
  protected readonly variantNames = computed(() => {
    const m = new Map<number, string>();
    for (const d of this.project()?.designs ?? []) for (const v of d.variants) m.set(v.id, v.name);
    return m;
  });
  protected readonly designForm = inject(NonNullableFormBuilder).group({ name: ['', [Validators.required, Validators.maxLength(200)]], description: [''] });

  constructor() {
    effect(() => void this.load(Number(this.projectId())));
  }

  private async load(id: number): Promise<void> {
    this.project.set(await firstValueFrom(this.api.project(id)));
  }

  protected toggle(id: number, on: boolean): void {
    this.selected.update((s) => (on ? [...s, id] : s.filter((x) => x !== id)));
  }

  protected compare(): void {
    void this.router.navigate(['/compare'], { queryParams: { variants: this.selected().join(','), baseline: this.selected()[0] } });
  }

  protected async createDesign(): Promise<void> {
    const p = this.project();
    if (!p) return;
    try {
      await firstValueFrom(this.api.createDesign(p.id, this.designForm.getRawValue()));
      this.designForm.reset();
      await this.load(p.id);
    } catch (e) {
      this.error.set(errorText(e));
    }
  }
}
