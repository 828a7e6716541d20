import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { type AbstractControl, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTabsModule } from '@angular/material/tabs';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink } from '@angular/router';
import { debounceTime, firstValueFrom, merge, Subject } from 'rxjs';
import {
  BUILT_IN_LIQUIDS,
  CONFIGURATION_LABELS,
  DEFAULT_VARIANT_OPTIONS,
  SAFETY_NOTE,
  TOLERANCE_FIELDS,
  VARIANT_CONFIGURATIONS,
  VARIANT_CORRELATIONS,
  VARIANT_CORRELATION_LABELS,
  type ApiErrorBody,
  type PinnedMaterial,
  type ToleranceParameter,
  type VariantDetail,
  type VariantResultsOk,
} from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { Chart } from './chart';
import { DesignsApi } from './designs-api';
import { show } from './format';
import { LibraryLookup, type LibraryChoice } from './library-lookup';
import { LiveEvaluator, type LiveResult } from './live-evaluation';
import { MASS_LAYOUT, PSD_LAYOUT, massTraces, psdTraces, tornadoLayout, tornadoTraces, uptakeLayout, uptakeTraces } from './plots';
import { LiquidCard } from './liquid-card';
import { QuantityListField } from './quantity-list-field';
import { UnitInput } from '../../shared/unit-input/unit-input';
import {
  fromInputs,
  NO_EXTRAS,
  q,
  tolerableParameters,
  toInputs,
  toleranceRow,
  variantForm,
  type VariantExtras,
} from './variant-form';

/** Wait after the last keystroke before recomputing: long enough to skip intermediate digits, short enough to feel live. */
export const RECOMPUTE_DEBOUNCE_MS = 120;
/** Pause after which the secondary charts (uptake, pore sizes, sensitivity) catch up. */
const SETTLE_MS = 400;

const AQUEOUS = /water|saline|nacl|urine|aqueous|exudate|serum/i;

const STRUCTURE_FIELDS = [
  'fibreDiameter',
  'linearDensity',
  'fibreDensity',
  'shapeFactor',
  'basisWeight',
  'thickness',
  'porosity',
  'contactAngle',
  'poreDiameter',
  'permeability',
] as const;

/**
 * The design workspace for one variant: inputs on the left, results on the right, recomputed in the browser on
 * every change (no server round trip); saving stores the inputs and the server's own recomputation.
 */
@Component({
  selector: 'wick-variant-editor',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatCardModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTabsModule,
    MatTooltipModule,
    Chart,
    QuantityListField,
    LiquidCard,
    UnitInput,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [LiveEvaluator],
  templateUrl: './variant-editor.html',
  styleUrl: './variant-editor.scss',
})
export class VariantEditor {
  /** Route parameters: a new variant in a design, or a saved one. */
  readonly designId = input<string>();
  readonly variantId = input<string>();

  private readonly api = inject(DesignsApi);
  private readonly library = inject(LibraryLookup);
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly evaluator = inject(LiveEvaluator);

  protected readonly form = variantForm(this.fb);
  protected readonly configurations = VARIANT_CONFIGURATIONS;
  protected readonly configurationLabels = CONFIGURATION_LABELS;
  protected readonly correlations = VARIANT_CORRELATIONS;
  protected readonly correlationLabels = VARIANT_CORRELATION_LABELS;
  protected readonly toleranceFields = TOLERANCE_FIELDS;
  protected readonly safetyNote = SAFETY_NOTE;
  protected readonly show = show;

  protected readonly canEdit = computed(() => this.auth.can('designs:edit'));
  protected readonly canExport = computed(() => this.auth.can('designs:export'));
  protected readonly saved = signal<VariantDetail | null>(null);
  protected readonly designName = signal('');
  protected readonly projectId = signal<number | null>(null);
  protected readonly extras = signal<VariantExtras>(NO_EXTRAS);
  /** Library values of the structure as loaded, to mark fields edited away from them. */
  private libraryBaseline: Partial<Record<(typeof STRUCTURE_FIELDS)[number], number>> = {};
  private librarySources: Record<string, string> = {};
  protected readonly libraryNotes = signal<readonly string[]>([]);
  protected readonly structureSource = signal<'library' | 'ad-hoc'>('ad-hoc');
  protected readonly webChoices = signal<LibraryChoice[] | null>(null);
  protected readonly liquidChoices = signal<LibraryChoice[] | null>(null);
  protected readonly loadingLibrary = signal(false);
  protected readonly libraryError = signal<string | null>(null);

  /** Curve resolution of the live view (saved variants are always recorded at the default). */
  protected readonly curvePoints = signal(DEFAULT_VARIANT_OPTIONS.curvePoints);
  protected readonly live = signal<LiveResult | null>(null);
  protected readonly plotMs = signal<number | null>(null);
  /** Which recompute the last finished draw showed, and the time from that recompute's start to the drawn chart. */
  protected readonly plotDrawn = signal(0);
  protected readonly updateMs = signal<number | null>(null);
  private evaluateStartedAt = 0;
  protected readonly recomputes = signal(0);
  protected readonly dirty = signal(false);
  protected readonly saving = signal(false);
  protected readonly message = signal<{ kind: 'error' | 'info'; text: string } | null>(null);

  protected readonly ok = computed<VariantResultsOk | null>(() => {
    const l = this.live();
    return l?.kind === 'results' && l.results.status === 'ok' ? l.results : null;
  });
  /** Where the results shown were computed. */
  protected readonly origin = computed(() => {
    const l = this.live();
    if (l?.kind === 'results' && l.source === 'server') return 'Saved results (computed on the server).';
    const threads = l?.kind === 'results' ? (l.threads ?? 1) : 1;
    return threads > 1 ? `Computed in your browser (the tolerance band on ${threads} threads).` : 'Computed in your browser.';
  });
  /** Time axis of the main chart: early rise reads better on a log axis. */
  protected readonly timeAxis = signal<'linear' | 'log'>('linear');
  protected readonly uptakePlot = computed(() => {
    const r = this.ok();
    return r ? { data: uptakeTraces(r), layout: uptakeLayout(r, this.timeAxis()) } : null;
  });
  /**
   * The results once typing pauses: the secondary charts follow these, so each keystroke redraws only the main
   * chart (two plotly redraws per keystroke would halve its speed).
   */
  private readonly settled = toSignal(toObservable(this.ok).pipe(debounceTime(SETTLE_MS)), { initialValue: null });
  protected readonly massPlot = computed(() => {
    const r = this.settled();
    return r && r.curves.mass ? massTraces(r) : null;
  });
  protected readonly psdPlot = computed(() => {
    const r = this.settled();
    return r?.poreSizeProfile ? psdTraces(r) : null;
  });
  protected readonly tornadoPlot = computed(() => {
    const r = this.settled();
    return r?.tornado ? { data: tornadoTraces(r), layout: tornadoLayout(r) } : null;
  });
  protected readonly massLayout = MASS_LAYOUT;
  protected readonly psdLayout = PSD_LAYOUT;

  /** Library materials of this variant that are not approved (marked everywhere). */
  protected readonly unapproved = computed<PinnedMaterial[]>(() => {
    const e = this.extras();
    return [e.web, e.liquidPin].filter((p): p is PinnedMaterial => p !== null && p.state !== 'approved');
  });
  protected readonly tolerableParameters = signal<ToleranceParameter[]>([]);

  private readonly recompute$ = new Subject<void>();

  constructor() {
    merge(this.form.valueChanges, this.recompute$)
      .pipe(debounceTime(RECOMPUTE_DEBOUNCE_MS), takeUntilDestroyed())
      .subscribe(() => this.evaluate());
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
      this.dirty.set(true);
      this.tolerableParameters.set(tolerableParameters(this.form.getRawValue()));
    });
    this.tolerableParameters.set(tolerableParameters(this.form.getRawValue()));

    const arrived = this.router.currentNavigation()?.extras.state?.['savedMessage'];
    if (typeof arrived === 'string') this.message.set({ kind: 'info', text: arrived });
    effect(() => {
      const id = this.variantId();
      const designId = this.designId();
      if (id) void this.open(Number(id));
      else if (designId) void this.startNew(Number(designId));
    });
    effect(() => {
      if (this.canEdit()) this.form.enable({ emitEvent: false });
      else this.form.disable({ emitEvent: false });
    });
  }

  // ── loading ───────────────────────────────────────────────────────────────────────────────────────────────

  private async startNew(designId: number): Promise<void> {
    const design = await firstValueFrom(this.api.design(designId));
    this.designName.set(`${design.projectName} · ${design.name}`);
    this.projectId.set(design.projectId);
    this.form.controls.name.setValue(`Variant ${design.variants.length + 1}`);
    this.dirty.set(false);
    this.evaluate();
  }

  private async open(id: number): Promise<void> {
    const v = await firstValueFrom(this.api.variant(id));
    this.applySaved(v);
  }

  private applySaved(v: VariantDetail): void {
    this.saved.set(v);
    this.designName.set(`${v.projectName} · ${v.designName}`);
    this.projectId.set(v.projectId);
    const { value, extras, tolerances } = fromInputs(v.inputs);
    this.form.controls.tolerances.clear({ emitEvent: false });
    for (const t of tolerances) this.form.controls.tolerances.push(toleranceRow(this.fb, t.parameter, t.kind, t.plusMinus, t.original), { emitEvent: false });
    this.form.patchValue({ ...value, name: v.name, notes: v.notes }, { emitEvent: false });
    this.extras.set(extras);
    this.librarySources = { ...extras.sources };
    this.libraryBaseline = {};
    this.structureSource.set(extras.web ? 'library' : 'ad-hoc');
    if (extras.web || extras.liquidPin) this.loadChoices();
    this.tolerableParameters.set(tolerableParameters(this.form.getRawValue()));
    // Reopening shows the server's record; the first edit switches to the live recomputation.
    this.live.set({ kind: 'results', results: v.results, computeMs: 0, source: 'server' });
    this.dirty.set(false);
    if (!this.canEdit()) this.form.disable({ emitEvent: false });
  }

  // ── library ───────────────────────────────────────────────────────────────────────────────────────────────

  protected chooseStructureSource(source: 'library' | 'ad-hoc'): void {
    this.structureSource.set(source);
    if (source === 'library') this.loadChoices();
    else {
      this.extras.update((e) => ({ ...e, web: null, poreSize: null, sources: {} }));
      this.libraryBaseline = {};
      this.librarySources = {};
      this.libraryNotes.set([]);
      this.recompute$.next();
    }
  }

  protected loadChoices(): void {
    if (this.webChoices() !== null) return;
    this.library.webs().pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (w) => this.webChoices.set(w),
      error: () => this.libraryError.set('The material library could not be read.'),
    });
    this.library.liquids().pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (l) => this.liquidChoices.set(l),
      error: () => this.libraryError.set('The material library could not be read.'),
    });
  }

  private liquidName(): { name: string; aqueous: boolean } {
    const l = this.form.controls.liquid.getRawValue();
    const name =
      l.source === 'library'
        ? (this.extras().liquidPin?.name ?? 'water')
        : (BUILT_IN_LIQUIDS.find((x) => x.id === l.builtIn)?.name ?? l.builtIn);
    return { name, aqueous: AQUEOUS.test(name) || AQUEOUS.test(l.builtIn) };
  }

  protected async chooseWeb(id: number): Promise<void> {
    this.loadingLibrary.set(true);
    this.libraryError.set(null);
    try {
      const { name, aqueous } = this.liquidName();
      const { structure, notes } = await firstValueFrom(this.library.webStructure(id, name, aqueous));
      const s = this.form.controls.structure;
      s.patchValue(
        {
          sizeBy: structure.fibreDiameter !== undefined ? 'diameter' : 'linearDensity',
          fibreDiameter: q(structure.fibreDiameter, 'length', 'um') ?? s.controls.fibreDiameter.value,
          linearDensity: q(structure.linearDensity, 'linearDensity') ?? s.controls.linearDensity.value,
          fibreDensity: q(structure.fibreDensity, 'density', 'g/cm^3'),
          shapeFactor: q(structure.shapeFactor ?? 1, 'dimensionless'),
          basisWeight: q(structure.basisWeight, 'basisWeight'),
          thickness: q(structure.thickness, 'length', 'mm'),
          porosityMeasured: structure.porosity !== undefined,
          porosity: q(structure.porosity, 'fraction', '1') ?? s.controls.porosity.value,
          contactAngle: q(structure.contactAngle, 'angle') ?? s.controls.contactAngle.value,
          poreDiameter: q(structure.poreDiameter, 'length', 'um'),
          permeabilityMode: structure.permeability.mode,
          ...(structure.permeability.mode === 'correlation'
            ? { correlation: structure.permeability.correlation }
            : { permeability: q(structure.permeability.value, 'permeability') }),
        },
        { emitEvent: false },
      );
      const now = s.getRawValue();
      this.libraryBaseline = Object.fromEntries(STRUCTURE_FIELDS.map((f) => [f, now[f]?.si]));
      this.librarySources = { ...(structure.sources ?? {}) };
      this.libraryNotes.set(notes);
      this.extras.update((e) => ({ ...e, web: structure.web ?? null, poreSize: structure.poreSize ?? null, sources: this.librarySources }));
      this.recompute$.next();
      this.dirty.set(true);
    } catch {
      this.libraryError.set('This web could not be loaded from the library.');
    } finally {
      this.loadingLibrary.set(false);
    }
  }

  protected async chooseLibraryLiquid(id: number): Promise<void> {
    this.loadingLibrary.set(true);
    try {
      const { definition, pinned } = await firstValueFrom(this.library.liquid(id));
      this.extras.update((e) => ({ ...e, liquidDefinition: definition, liquidPin: pinned }));
      this.recompute$.next();
      this.dirty.set(true);
    } catch {
      this.libraryError.set('This liquid could not be loaded from the library.');
    } finally {
      this.loadingLibrary.set(false);
    }
  }

  protected chooseLiquidSource(source: 'built-in' | 'library'): void {
    if (source === 'library') this.loadChoices();
    else this.extras.update((e) => ({ ...e, liquidDefinition: null, liquidPin: null }));
    this.recompute$.next();
  }

  /** Sources with library values that were edited marked as such. */
  private currentExtras(): VariantExtras {
    const e = this.extras();
    if (!e.web) return e;
    const s = this.form.controls.structure.getRawValue();
    const sources: Record<string, string> = { ...this.librarySources };
    for (const f of STRUCTURE_FIELDS) {
      const base = this.libraryBaseline[f];
      const now = s[f]?.si;
      if (base !== undefined && now !== undefined && Math.abs(now - base) > 1e-12 * Math.abs(base)) {
        sources[f] = `edited for this variant (library value ${base})`;
      }
    }
    return { ...e, sources };
  }

  // ── tolerances ────────────────────────────────────────────────────────────────────────────────────────────

  protected addTolerance(): void {
    const used = new Set(this.form.controls.tolerances.getRawValue().map((t) => t.parameter));
    const next = this.tolerableParameters().find((p) => !used.has(p));
    if (!next) return;
    this.form.controls.tolerances.push(toleranceRow(this.fb, next, 'normal', null));
  }

  protected removeTolerance(i: number): void {
    this.form.controls.tolerances.removeAt(i);
  }

  // ── evaluation ────────────────────────────────────────────────────────────────────────────────────────────

  protected setCurvePoints(n: number): void {
    this.curvePoints.set(n);
    this.recompute$.next();
  }

  /** The latest recompute started: an older one that finishes later (shared with workers) is not shown. */
  private evaluateRun = 0;

  private evaluate(): void {
    const run = ++this.evaluateRun;
    const startedAt = performance.now();
    const inputs = toInputs(this.form.getRawValue(), this.currentExtras());
    const live = this.evaluator.evaluate(inputs, { ...DEFAULT_VARIANT_OPTIONS, curvePoints: this.curvePoints() });
    if (!(live instanceof Promise)) {
      this.showLive(live, startedAt);
      return;
    }
    live.then(
      (l) => run === this.evaluateRun && this.showLive(l, startedAt),
      (e: unknown) => run === this.evaluateRun && this.message.set({ kind: 'error', text: `The live computation failed: ${e instanceof Error ? e.message : String(e)}` }),
    );
  }

  private showLive(live: LiveResult, startedAt: number): void {
    this.evaluateStartedAt = startedAt;
    this.live.set(live);
    this.recomputes.update((n) => n + 1);
    this.showFieldError(live.kind === 'invalid' ? live : null);
  }

  /** The control an input path belongs to, for showing the evaluator's message on it. */
  private controlFor(path: string): AbstractControl | null {
    const f = this.form.controls;
    const base = path.replace(/\[\d+\]$/, '');
    if (base.startsWith('tolerances.')) {
      const p = base.split('.')[1];
      return f.tolerances.controls.find((r) => r.controls.parameter.value === p)?.controls.plusMinus ?? null;
    }
    const table: Record<string, AbstractControl> = {
      'structure.permeability.value': f.structure.controls.permeability,
      'structure.permeability.kozenyConstant': f.structure.controls.kozenyConstant,
      'structure.fibreDiameter':
        f.structure.controls.sizeBy.value === 'diameter' ? f.structure.controls.fibreDiameter : f.structure.controls.linearDensity,
      'dimensions.tilt': f.configuration.value === 'capillary' ? f.capillary.controls.tilt : f.dimensions.controls.tilt,
    };
    if (table[base]) return table[base];
    const [group, field] = base.split('.');
    const g = (f as Record<string, AbstractControl>)[group];
    if (field === undefined) return g ?? null;
    return g?.get(field) ?? null;
  }

  private errored: AbstractControl | null = null;

  /** Puts the evaluator's message on the field it names (and clears the previous one). */
  private showFieldError(invalid: { field: string | null; message: string } | null): void {
    const next = invalid?.field ? this.controlFor(invalid.field) : null;
    if (this.errored && this.errored !== next) this.errored.updateValueAndValidity({ emitEvent: false });
    this.errored = next;
    if (next && invalid) {
      next.setErrors({ ...(next.errors ?? {}), server: { message: invalid.message } }, { emitEvent: false });
      next.markAsTouched();
    }
  }

  protected plotted(ms: number): void {
    this.plotMs.set(ms);
    this.plotDrawn.set(this.recomputes());
    this.updateMs.set(performance.now() - this.evaluateStartedAt);
  }

  /** The message for a field when the last evaluation refused it. */
  protected error(path: string): string | null {
    const l = this.live();
    if (l?.kind !== 'invalid' || !l.field) return null;
    return l.field === path || l.field.startsWith(`${path}[`) || l.field.startsWith(`${path}.`) ? l.message : null;
  }

  protected toleranceError(i: number): string | null {
    const row = this.form.controls.tolerances.at(i)?.getRawValue();
    return row ? this.error(`tolerances.${row.parameter}`) : null;
  }

  // ── saving ────────────────────────────────────────────────────────────────────────────────────────────────

  protected readonly canSave = computed(() => this.canEdit() && this.live()?.kind === 'results' && !this.saving());

  protected async save(): Promise<void> {
    this.form.controls.name.markAsTouched();
    if (this.form.controls.name.invalid) {
      this.message.set({ kind: 'error', text: 'Give the variant a name.' });
      return;
    }
    this.evaluate();
    if (this.live()?.kind !== 'results') {
      this.message.set({ kind: 'error', text: 'Fix the inputs first: nothing is saved while a value is invalid.' });
      return;
    }
    const inputs = toInputs(this.form.getRawValue(), this.currentExtras());
    const { name, notes } = this.form.getRawValue();
    this.saving.set(true);
    this.message.set(null);
    try {
      const v = this.saved();
      const result = v
        ? await firstValueFrom(this.api.updateVariant(v.id, { name, notes, inputs, version: v.version }))
        : await firstValueFrom(this.api.createVariant(Number(this.designId()), { name, notes, inputs }));
      const text = `Saved. The server recomputed it with wick-core ${result.coreVersion}.`;
      this.applySaved(result);
      this.message.set({ kind: 'info', text });
      // A new variant moves to its own address (a new page instance): the message goes along.
      if (!v) await this.router.navigate(['/designs/variants', result.id], { replaceUrl: true, state: { savedMessage: text } });
    } catch (e) {
      this.message.set({ kind: 'error', text: errorText(e) });
    } finally {
      this.saving.set(false);
    }
  }

  protected async rerun(repin: boolean): Promise<void> {
    const v = this.saved();
    if (!v) return;
    this.saving.set(true);
    try {
      const result = await firstValueFrom(this.api.rerun(v.id, { version: v.version, repin }));
      this.applySaved(result);
      this.message.set({ kind: 'info', text: repin ? 'Re-run with the newest approved revisions.' : 'Recomputed with the running wick-core.' });
    } catch (e) {
      this.message.set({ kind: 'error', text: errorText(e) });
    } finally {
      this.saving.set(false);
    }
  }

  protected csvUrl(what: 'summary' | 'curve'): string | null {
    const v = this.saved();
    return v ? this.api.csvUrl(v.id, what) : null;
  }
}

/** A server error as a sentence. */
export function errorText(e: unknown): string {
  if (e instanceof HttpErrorResponse) {
    const body = e.error as ApiErrorBody | null;
    if (body?.error?.message) return body.error.message;
    return `The server answered ${e.status}.`;
  }
  return 'Something went wrong.';
}
