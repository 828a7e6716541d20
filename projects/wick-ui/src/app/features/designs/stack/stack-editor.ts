import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, type AbstractControl } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import {
  BUILT_IN_LIQUIDS,
  STACK_DEFAULTS,
  type PinnedMaterial,
  type StackVariantInputs,
  type StackVariantResults,
  type VariantDetail,
  type VariantInputs,
} from 'wick-core';
import { AuthStore } from '../../../core/auth/auth-store';
import { DesignsApi } from '../designs-api';
import { LibraryLookup, type LibraryChoice } from '../library-lookup';
import { LiquidCard } from '../liquid-card';
import { errorText } from '../variant-editor';
import { UnitInput } from '../../../shared/unit-input/unit-input';
import { controlAt, layerGroup, layerValueFromLibrary, patchStackForm, stackForm, toStackInputs } from './stack-form';
import { StackLayerCard } from './stack-layer-card';
import { StackLibrary } from './stack-library';
import { StackResults } from './stack-results';
import { StackRun } from './stack-run';

const AQUEOUS = /water|saline|nacl|urine|aqueous|exudate|serum/i;

/** A saved variant as the stack editor reads it (the server keeps stack inputs and results beside layer ones). */
type SavedStack = Omit<VariantDetail, 'inputs' | 'results'> & { inputs: StackVariantInputs; results: StackVariantResults };

/**
 * The design workspace for a layered stack: layers picked from the library (pinned revisions) or typed in, the
 * liquid and the insult; a run in a Web Worker with progress and cancel; the heat map and curves; saving stores
 * the inputs and the server's own run of the same evaluator (the record).
 */
@Component({
  selector: 'wick-stack-editor',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatCardModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    StackLayerCard,
    LiquidCard,
    StackResults,
    UnitInput,
  ],
  providers: [StackRun],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './stack-editor.html',
  styleUrl: './stack-editor.scss',
})
export class StackEditor {
  /** Route parameters: a new stack in a design, or a saved one. */
  readonly designId = input<string>();
  readonly variantId = input<string>();

  private readonly api = inject(DesignsApi);
  private readonly library = inject(LibraryLookup);
  private readonly stackLibrary = inject(StackLibrary);
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly runner = inject(StackRun);

  protected readonly form = stackForm(this.fb);
  protected readonly maxLayers = STACK_DEFAULTS.maxLayers;
  protected readonly canEdit = computed(() => this.auth.can('designs:edit'));

  protected readonly saved = signal<SavedStack | null>(null);
  protected readonly designName = signal('');
  protected readonly projectId = signal<number | null>(null);
  protected readonly webChoices = signal<LibraryChoice[] | null>(null);
  protected readonly liquidChoices = signal<LibraryChoice[] | null>(null);
  protected readonly webToAdd = signal<number | null>(null);
  protected readonly adding = signal(false);
  protected readonly saving = signal(false);
  protected readonly message = signal<{ kind: 'error' | 'info'; text: string } | null>(null);
  /** Whether the inputs changed since the results shown were computed. */
  protected readonly stale = signal(false);
  protected readonly layerCount = signal(0);

  /** The browser's run while it is newer than the saved record, else the record. */
  protected readonly shown = computed<{ results: StackVariantResults; source: 'browser' | 'server'; computeMs: number | null } | null>(() => {
    const s = this.runner.state();
    if (s.status === 'done') return { results: s.results, source: 'browser', computeMs: s.computeMs };
    const v = this.saved();
    return v ? { results: v.results, source: 'server', computeMs: null } : null;
  });
  protected readonly invalid = computed(() => {
    const s = this.runner.state();
    return s.status === 'invalid' ? s : null;
  });
  protected readonly percent = computed(() => Math.round(this.runner.progress() * 100));
  protected readonly unapproved = computed<PinnedMaterial[]>(() => {
    this.layerCount();
    return this.form.controls.layers.getRawValue().flatMap((l) => (l.web && l.web.state !== 'approved' ? [l.web] : []));
  });
  protected readonly canSave = computed(() => {
    const s = this.runner.state();
    return this.canEdit() && !this.saving() && this.layerCount() > 0 && !(s.status === 'done' && s.results.run === 'cancelled');
  });

  /** Message of the evaluator for an input path, for the field that shows it. */
  protected readonly errorAt = (path: string): string | null => {
    const i = this.invalid();
    return i && i.field === path ? i.message : null;
  };

  constructor() {
    const passed = this.router.currentNavigation()?.extras.state?.['message'] as { kind: 'info'; text: string } | undefined;
    if (passed) this.message.set(passed);
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
      this.stale.set(true);
      this.layerCount.set(this.form.controls.layers.length);
    });
    effect(() => {
      const id = this.variantId();
      const designId = this.designId();
      if (id) void this.open(Number(id));
      else if (designId) void this.startNew(Number(designId));
    });
    effect(() => {
      const invalid = this.invalid();
      untracked(() => this.showFieldError(invalid));
    });
    effect(() => {
      if (this.canEdit()) this.form.enable({ emitEvent: false });
      else this.form.disable({ emitEvent: false });
    });
    this.library.webs().pipe(takeUntilDestroyed()).subscribe({ next: (w) => this.webChoices.set(w), error: () => this.webChoices.set([]) });
    this.library.liquids().pipe(takeUntilDestroyed()).subscribe({ next: (l) => this.liquidChoices.set(l), error: () => this.liquidChoices.set([]) });
  }

  // ── loading ──────────────────────────────────────────────────────────────────────────────────────────────

  private async startNew(designId: number): Promise<void> {
    const design = await firstValueFrom(this.api.design(designId));
    this.designName.set(design.name);
    this.projectId.set(design.projectId);
    this.form.controls.name.setValue(`Stack ${design.variants.length + 1}`);
  }

  private async open(id: number): Promise<void> {
    const v = (await firstValueFrom(this.api.variant(id))) as unknown as SavedStack;
    this.take(v);
  }

  private take(v: SavedStack): void {
    this.saved.set(v);
    this.designName.set(v.designName);
    this.projectId.set(v.projectId);
    patchStackForm(this.form, this.fb, v.inputs, v.name, v.notes);
    this.layerCount.set(this.form.controls.layers.length);
    this.stale.set(false);
  }

  // ── layers ───────────────────────────────────────────────────────────────────────────────────────────────

  protected async addFromLibrary(): Promise<void> {
    const id = this.webToAdd();
    if (id === null) return;
    this.adding.set(true);
    this.message.set(null);
    try {
      const liquidName = this.liquidName();
      const mapped = await firstValueFrom(this.stackLibrary.webLayer(id, liquidName, AQUEOUS.test(liquidName)));
      const g = layerGroup(this.fb);
      g.patchValue(layerValueFromLibrary(mapped));
      this.form.controls.layers.push(g);
      this.webToAdd.set(null);
    } catch (e) {
      this.message.set({ kind: 'error', text: errorText(e) });
    } finally {
      this.adding.set(false);
    }
  }

  protected addEmpty(): void {
    const g = layerGroup(this.fb);
    g.controls.name.setValue(`Layer ${this.form.controls.layers.length + 1}`);
    this.form.controls.layers.push(g);
  }

  protected move(i: number, by: -1 | 1): void {
    const layers = this.form.controls.layers;
    const g = layers.at(i);
    layers.removeAt(i, { emitEvent: false });
    layers.insert(i + by, g);
  }

  protected removeLayer(i: number): void {
    this.form.controls.layers.removeAt(i);
  }

  private liquidName(): string {
    const l = this.form.controls.liquid.getRawValue();
    if (l.source === 'library') return l.definition?.name ?? '';
    return BUILT_IN_LIQUIDS.find((b) => b.id === l.builtIn)?.name ?? l.builtIn;
  }

  protected async chooseLibraryLiquid(id: number): Promise<void> {
    try {
      const { definition, pinned } = await firstValueFrom(this.library.liquid(id));
      this.form.controls.liquid.patchValue({ definition, pinned });
    } catch (e) {
      this.form.controls.liquid.patchValue({ libraryId: null, definition: null, pinned: null });
      this.message.set({ kind: 'error', text: `This liquid could not be loaded from the library: ${errorText(e)}` });
    }
  }

  // ── run and save ─────────────────────────────────────────────────────────────────────────────────────────

  protected inputs(): StackVariantInputs {
    return toStackInputs(this.form.getRawValue());
  }

  protected run(): void {
    this.message.set(null);
    this.stale.set(false);
    this.runner.run(this.inputs());
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.controls.name.invalid) {
      this.message.set({ kind: 'error', text: 'Give the stack a name.' });
      return;
    }
    this.saving.set(true);
    this.message.set(null);
    const v = this.form.getRawValue();
    // The wire type of a variant's inputs is the single-layer one until the stack joins its union.
    const write = { name: v.name, notes: v.notes, inputs: this.inputs() as unknown as VariantInputs };
    try {
      const current = this.saved();
      const detail = current
        ? await firstValueFrom(this.api.updateVariant(current.id, { ...write, version: current.version }))
        : await firstValueFrom(this.api.createVariant(Number(this.designId()), write));
      const stack = detail as unknown as SavedStack;
      this.take(stack);
      const saved = { kind: 'info' as const, text: 'Saved. The results shown are the server’s own run.' };
      this.message.set(saved);
      // A new stack moves to its own address (a new page instance): the message travels with the navigation.
      if (!current) await this.router.navigate(['/designs/stacks', stack.id], { replaceUrl: true, state: { message: saved } });
    } catch (e) {
      this.message.set({ kind: 'error', text: errorText(e) });
    } finally {
      this.saving.set(false);
    }
  }

  private errored: AbstractControl | null = null;

  /** Puts the evaluator's message on the field it names (and clears the previous one). */
  private showFieldError(invalid: { field: string | null; message: string } | null): void {
    const next = invalid?.field ? controlAt(this.form, invalid.field) : null;
    if (this.errored && this.errored !== next) this.errored.updateValueAndValidity({ emitEvent: false });
    this.errored = next;
    if (next && invalid) {
      next.setErrors({ ...(next.errors ?? {}), server: { message: invalid.message } }, { emitEvent: false });
      next.markAsTouched();
    }
  }
}
