import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { ANY_CONFIGURATION_LABELS, COMPARE_MAX, COMPARE_MIN, SAFETY_NOTE, type CompareResponse, type ProjectDetail, type ProjectSummary } from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { Chart } from '../designs/chart';
import { DesignsApi } from '../designs/designs-api';
import { show, showRelative } from '../designs/format';
import { OVERLAY_LAYOUT, overlayTraces, UPTAKE_OVERLAY_LAYOUT, uptakeOverlayTraces } from '../designs/plots';
import { variantRoute } from '../designs/stack/stack-links';
import { errorText } from '../designs/variant-editor';
import { CompareApi } from './compare-api';

/** Parses `variants=3,7,9` from the address (the shareable selection). */
export function parseIds(text: string | undefined): number[] {
  return (text ?? '')
    .split(',')
    .map((s) => Number(s))
    .filter((n) => Number.isSafeInteger(n) && n > 0);
}

/**
 * Compare & decide: 2–8 variants side by side with deltas against a baseline and the best value marked,
 * overlaid curves, the decision record, CSV export and the printable report. The address holds the selection.
 */
@Component({
  selector: 'wick-compare-page',
  imports: [DatePipe, ReactiveFormsModule, RouterLink, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, MatSelectModule, MatTooltipModule, Chart],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './compare-page.html',
  styleUrl: './compare-page.scss',
})
export class ComparePage {
  /** Query parameters (router input binding). */
  readonly variants = input<string>();
  readonly baseline = input<string>();

  private readonly api = inject(CompareApi);
  private readonly designs = inject(DesignsApi);
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  protected readonly ids = computed(() => parseIds(this.variants()));
  protected readonly baselineId = computed(() => {
    const b = Number(this.baseline());
    return Number.isSafeInteger(b) && b > 0 ? b : null;
  });
  protected readonly comparison = signal<CompareResponse | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly message = signal<string | null>(null);
  protected readonly canDecide = computed(() => this.auth.can('decisions:record'));
  protected readonly canExport = computed(() => this.auth.can('designs:export'));
  protected readonly labels: Readonly<Record<string, string>> = ANY_CONFIGURATION_LABELS;
  protected readonly variantRoute = variantRoute;
  protected readonly safetyNote = SAFETY_NOTE;
  protected readonly show = show;
  protected readonly showRelative = showRelative;
  protected readonly compareMin = COMPARE_MIN;
  protected readonly compareMax = COMPARE_MAX;
  protected readonly overlay = computed(() => {
    const c = this.comparison();
    return c ? overlayTraces(c.variants) : [];
  });
  protected readonly overlayLayout = OVERLAY_LAYOUT;
  protected readonly uptakeOverlay = computed(() => {
    const c = this.comparison();
    return c ? uptakeOverlayTraces(c.variants) : [];
  });
  protected readonly uptakeLayout = UPTAKE_OVERLAY_LAYOUT;
  protected readonly csvUrl = computed(() => this.api.csvUrl(this.ids(), this.baselineId()));

  // Picker (when no selection is in the address).
  protected readonly projects = signal<ProjectSummary[] | null>(null);
  protected readonly pickedProject = signal<ProjectDetail | null>(null);
  protected readonly picked = signal<readonly number[]>([]);

  protected readonly decisionForm = inject(NonNullableFormBuilder).group({
    chosenVariantId: [0, [Validators.min(1)]],
    rationale: ['', [Validators.required, Validators.minLength(3), Validators.maxLength(5000)]],
  });

  constructor() {
    effect(() => {
      const ids = this.ids();
      const baseline = this.baselineId();
      if (ids.length >= COMPARE_MIN) void this.load(ids, baseline);
      else {
        this.comparison.set(null);
        if (this.projects() === null) {
          firstValueFrom(this.designs.projects()).then((p) => {
            this.projects.set(p);
            // One project: nothing to choose, show its variants and decisions straight away.
            if (p.length === 1 && !this.pickedProject()) void this.pickProject(p[0].id);
          }, (e: unknown) => this.error.set(errorText(e)));
        }
      }
    });
  }

  private async load(ids: number[], baseline: number | null): Promise<void> {
    this.error.set(null);
    try {
      const c = await firstValueFrom(this.api.compare(ids, baseline));
      this.comparison.set(c);
      if (!ids.includes(this.decisionForm.controls.chosenVariantId.value)) this.decisionForm.controls.chosenVariantId.setValue(c.baselineId);
    } catch (e) {
      this.comparison.set(null);
      this.error.set(errorText(e));
    }
  }

  protected name(id: number): string {
    return this.comparison()?.variants.find((v) => v.id === id)?.name ?? `#${id}`;
  }

  protected setBaseline(id: number): void {
    void this.router.navigate([], { queryParams: { variants: this.ids().join(','), baseline: id }, replaceUrl: true });
  }

  protected async pickProject(id: number): Promise<void> {
    this.pickedProject.set(await firstValueFrom(this.designs.project(id)));
    this.picked.set([]);
  }

  protected togglePick(id: number, on: boolean): void {
    this.picked.update((s) => (on ? [...s, id] : s.filter((x) => x !== id)));
  }

  protected comparePicked(): void {
    const ids = this.picked();
    void this.router.navigate([], { queryParams: { variants: ids.join(','), baseline: ids[0] } });
  }

  protected async decide(): Promise<void> {
    const c = this.comparison();
    if (!c || this.decisionForm.invalid) return;
    const { chosenVariantId, rationale } = this.decisionForm.getRawValue();
    try {
      await firstValueFrom(this.api.decide({ variantIds: c.variants.map((v) => v.id), baselineVariantId: c.baselineId, chosenVariantId, rationale }));
      this.message.set(`Decision recorded: ${this.name(chosenVariantId)}.`);
      this.decisionForm.controls.rationale.reset('');
      await this.load(this.ids(), this.baselineId());
    } catch (e) {
      this.message.set(errorText(e));
    }
  }
}
