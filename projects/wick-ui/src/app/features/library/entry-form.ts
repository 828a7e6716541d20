import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { type AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { catchError, firstValueFrom, map, of } from 'rxjs';
import type { EntryDetail, FibreData, LibraryData, LibraryKind, LiquidData, RevisionInput, SupplierRef, WebData } from 'wick-core';
import { apiProblem, fieldIssues } from './api-error';
import {
  type FibreForm,
  type LiquidForm,
  type WebForm,
  applyServerIssues,
  fibreForm,
  liquidForm,
  toFibreData,
  toLiquidData,
  toWebData,
  webForm,
} from './entry-form-model';
import { FibreFields } from './fibre-fields';
import { errorText } from './form-errors';
import { LibraryApi } from './library-api';
import { KIND_LABELS, entryLink, kindOfCollection, listLink } from './library-format';
import { LiquidFields } from './liquid-fields';
import { WebFields } from './web-fields';

/**
 * Create an entry, or edit one: a draft or returned revision is changed in place, an approved one gets a new
 * draft revision. Save keeps a draft; "Save and submit" sends it to the reviewers. Stale edits are refused by
 * the server (409) and nothing of them is stored.
 */
@Component({
  selector: 'wick-entry-form',
  imports: [
    FibreFields,
    LiquidFields,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    ReactiveFormsModule,
    RouterLink,
    WebFields,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <a class="back" [routerLink]="backLink()"><mat-icon>arrow_back</mat-icon>Back</a>
      <h1>{{ title() }}</h1>
      @if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading" />
      }
      @if (blocked()) {
        <p class="problem" role="alert">{{ blocked() }}</p>
      } @else if (ready()) {
        @if (existing()?.head?.state === 'approved') {
          <p class="notice">Revision {{ existing()!.head.number }} is approved and stays as it is: saving starts revision {{ existing()!.head.number + 1 }} as a draft.</p>
        }
        <form [formGroup]="common" (ngSubmit)="save(false)" novalidate>
          <div class="common">
            <mat-form-field class="name">
              <mat-label>Name</mat-label>
              <input matInput formControlName="name" required />
              <mat-error>{{ errorText(common.controls.name.errors) }}</mat-error>
            </mat-form-field>
            <mat-form-field class="supplier">
              <mat-label>Supplier</mat-label>
              <mat-select formControlName="supplierId">
                <mat-option [value]="null">— none —</mat-option>
                @for (s of suppliers(); track s.id) {
                  <mat-option [value]="s.id">{{ s.name }}</mat-option>
                }
              </mat-select>
            </mat-form-field>
          </div>

          @switch (resolvedKind()) {
            @case ('fibre') {
              <wick-fibre-fields [form]="fibre()!" />
            }
            @case ('web') {
              <wick-web-fields [form]="web()!" [fibres]="fibres()" />
            }
            @case ('liquid') {
              <wick-liquid-fields [form]="liquid()!" />
            }
          }

          <mat-form-field class="notes">
            <mat-label>Notes</mat-label>
            <textarea matInput rows="3" formControlName="notes"></textarea>
          </mat-form-field>

          @if (problem()) {
            <div class="problem" role="alert">
              <p>{{ problem() }}</p>
              @if (unplaced().length) {
                <ul>
                  @for (u of unplaced(); track $index) {
                    <li>{{ u }}</li>
                  }
                </ul>
              }
              @if (conflict()) {
                <button mat-stroked-button type="button" (click)="reloadCurrent()">Load the current version (your changes are dropped)</button>
              }
            </div>
          }
          <div class="buttons">
            <button mat-flat-button type="submit" [disabled]="saving()"><mat-icon>save</mat-icon>Save draft</button>
            <button mat-stroked-button type="button" (click)="save(true)" [disabled]="saving()"><mat-icon>send</mat-icon>Save and submit for review</button>
            <a mat-button [routerLink]="backLink()">Cancel</a>
          </div>
        </form>
      }
    </section>
  `,
  styles: `
    .back {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      text-decoration: none;
    }
    h1 {
      font: var(--mat-sys-headline-small);
    }
    form {
      display: grid;
      gap: 12px;
    }
    .common {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
    }
    .name {
      flex: 2 1 320px;
    }
    .supplier {
      flex: 1 1 240px;
    }
    .notes {
      width: 100%;
    }
    .buttons {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .problem {
      color: var(--mat-sys-error);
    }
    .notice {
      padding: 8px 12px;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-surface-container);
    }
  `,
})
export class EntryForm {
  private readonly api = inject(LibraryApi);
  private readonly router = inject(Router);
  private readonly fb = inject(NonNullableFormBuilder);

  readonly collection = input<string | undefined>(undefined);
  readonly kind = input<LibraryKind | undefined>(undefined);
  /** Absent when creating. */
  readonly id = input<string | undefined>(undefined);

  protected readonly resolvedKind = computed<LibraryKind>(() => this.kind() ?? kindOfCollection(this.collection()) ?? 'web');
  protected readonly existing = signal<EntryDetail | null>(null);
  protected readonly loading = signal(false);
  protected readonly ready = signal(false);
  protected readonly saving = signal(false);
  protected readonly blocked = signal('');
  protected readonly problem = signal('');
  protected readonly unplaced = signal<string[]>([]);
  protected readonly conflict = signal(false);
  protected readonly errorText = errorText;

  protected readonly common = this.fb.group({
    name: this.fb.control('', [Validators.required, Validators.maxLength(200)]),
    supplierId: this.fb.control<number | null>(null),
    notes: this.fb.control('', Validators.maxLength(5000)),
  });
  protected readonly fibre = signal<FibreForm | null>(null);
  protected readonly web = signal<WebForm | null>(null);
  protected readonly liquid = signal<LiquidForm | null>(null);

  protected readonly suppliers = toSignal(this.api.suppliers().pipe(catchError(() => of([] as SupplierRef[]))), { initialValue: [] as SupplierRef[] });
  protected readonly fibres = toSignal(
    this.api.list('fibre', { pageSize: 200, sort: 'name' }).pipe(
      map((p) => p.items.map((f) => ({ id: f.id, name: f.name }))),
      catchError(() => of([])),
    ),
    { initialValue: [] },
  );

  protected readonly title = computed(() => {
    const words = KIND_LABELS[this.resolvedKind()].one;
    const e = this.existing();
    return e ? `Edit ${words}: ${e.head.name}` : `New ${words}`;
  });
  protected readonly backLink = computed(() => {
    const id = Number(this.id());
    return id ? entryLink(this.resolvedKind(), id) : listLink(this.resolvedKind());
  });

  constructor() {
    effect(() => {
      const id = Number(this.id());
      const kind = this.resolvedKind();
      untracked(() => void this.start(kind, Number.isInteger(id) && id > 0 ? id : null));
    });
  }

  private async start(kind: LibraryKind, id: number | null): Promise<void> {
    this.ready.set(false);
    this.blocked.set('');
    let entry: EntryDetail | null = null;
    if (id !== null) {
      this.loading.set(true);
      try {
        entry = await firstValueFrom(this.api.get(kind, id));
      } catch (e) {
        this.blocked.set(apiProblem(e).message);
        return;
      } finally {
        this.loading.set(false);
      }
      if (!entry.actions.edit) {
        this.blocked.set(
          entry.head.state === 'in-review'
            ? 'This entry is in review: it can be changed again once a reviewer approves or returns it.'
            : 'You may not edit this entry.',
        );
        return;
      }
    }
    this.fill(kind, entry);
  }

  private fill(kind: LibraryKind, entry: EntryDetail | null): void {
    this.existing.set(entry);
    this.common.reset({ name: entry?.head.name ?? '', supplierId: entry?.head.supplier?.id ?? null, notes: entry?.head.notes ?? '' });
    const data = entry?.head.data;
    this.fibre.set(kind === 'fibre' ? fibreForm(this.fb, data as FibreData | undefined) : null);
    this.web.set(kind === 'web' ? webForm(this.fb, data as WebData | undefined) : null);
    this.liquid.set(kind === 'liquid' ? liquidForm(this.fb, data as LiquidData | undefined) : null);
    this.problem.set('');
    this.unplaced.set([]);
    this.conflict.set(false);
    this.ready.set(true);
  }

  private dataGroup(): AbstractControl {
    return (this.fibre() ?? this.web() ?? this.liquid())!;
  }

  private data(): LibraryData {
    const head = this.existing()?.head.data as WebData | undefined;
    if (this.fibre()) return toFibreData(this.fibre()!);
    if (this.web()) return toWebData(this.web()!, { poreSizeDistribution: head?.poreSizeDistribution, curves: head?.curves ?? [] });
    return toLiquidData(this.liquid()!);
  }

  protected async save(submit: boolean): Promise<void> {
    const dataGroup = this.dataGroup();
    this.common.markAllAsTouched();
    dataGroup.markAllAsTouched();
    if (this.common.invalid || dataGroup.invalid) {
      this.problem.set('Some values are missing or not valid: see the marked fields.');
      this.unplaced.set([]);
      return;
    }
    const kind = this.resolvedKind();
    const input: RevisionInput = { name: this.common.controls.name.value.trim(), supplierId: this.common.controls.supplierId.value, notes: this.common.controls.notes.value, data: this.data() };
    this.saving.set(true);
    this.problem.set('');
    this.conflict.set(false);
    try {
      const current = this.existing();
      let saved = current ? await firstValueFrom(this.api.update(kind, current.id, input, current.version)) : await firstValueFrom(this.api.create(kind, input));
      // Saved: a failed submit below must not create the entry a second time on the next try.
      this.existing.set(saved);
      if (submit) saved = await firstValueFrom(this.api.transition(kind, saved.id, 'submit', saved.version));
      await this.router.navigate(entryLink(kind, saved.id));
    } catch (e) {
      const p = apiProblem(e);
      this.problem.set(p.message);
      this.conflict.set(p.code === 'version-conflict');
      this.unplaced.set(p.status === 422 ? applyServerIssues(this.common, dataGroup, fieldIssues(p)) : []);
    } finally {
      this.saving.set(false);
    }
  }

  protected async reloadCurrent(): Promise<void> {
    const current = this.existing();
    if (current) await this.start(this.resolvedKind(), current.id);
  }
}
