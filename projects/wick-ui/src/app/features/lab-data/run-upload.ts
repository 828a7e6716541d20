import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import {
  BUILT_IN_LIQUIDS,
  type EntrySummary,
  type LabRunCreate,
  type LabSetSummary,
  RUN_ORIENTATIONS,
  type RunLiquidChoice,
  type RunOrientation,
  ZERO_CELSIUS,
} from 'wick-core';
import { quantityRange } from '../../shared/unit-input/quantity-validators';
import { type Quantity, UnitInput } from '../../shared/unit-input/unit-input';
import { type ApiProblem, apiProblem, fieldIssues } from '../library/api-error';
import { LabDataApi } from './lab-data-api';
import { orientationLabel } from './lab-format';

/** "built-in:saline-0.9" or "library:12" in the liquid select. */
function liquidChoice(key: string): RunLiquidChoice {
  const [kind, id] = key.split(':');
  return kind === 'library' ? { entryId: Number(id) } : { builtInId: id };
}

/**
 * Upload a measured run: the CSV (time and height or mass, units in the header) with the specimen, liquid,
 * temperature, orientation and conditions. The server refuses bad data with each problem and its line; then
 * nothing is stored, and the problems are listed here.
 */
@Component({
  selector: 'wick-run-upload',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, MatSelectModule, ReactiveFormsModule, RouterLink, UnitInput],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <p><a routerLink="/lab-data">← Lab data</a></p>
      <h1>Upload a lab run</h1>
      <p class="help">
        CSV with two columns and their units in the header: time, then height or mass — e.g. <code>time (s),height (mm)</code> or
        <code>time (min);mass (g)</code>. Lines starting with # are comments. At least 5 readings, times increasing.
      </p>
      <form [formGroup]="form" (ngSubmit)="submit()">
        <div class="file">
          <input #picker type="file" accept=".csv,text/csv,text/plain" hidden (change)="pick(picker.files)" data-test="file" />
          <button mat-stroked-button type="button" (click)="picker.click()"><mat-icon>attach_file</mat-icon> Choose CSV file</button>
          <span class="file-name">{{ file()?.name ?? 'No file chosen' }}</span>
        </div>
        <div class="grid">
          <mat-form-field>
            <mat-label>Run name</mat-label>
            <input matInput formControlName="name" required />
          </mat-form-field>
          <mat-form-field>
            <mat-label>Web (library)</mat-label>
            <mat-select formControlName="webId" required>
              @for (w of webs(); track w.id) {
                <mat-option [value]="w.id">{{ w.name }} ({{ w.state }})</mat-option>
              }
            </mat-select>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Liquid</mat-label>
            <mat-select formControlName="liquid" required>
              @for (l of builtIn; track l.id) {
                <mat-option [value]="'built-in:' + l.id">{{ l.name }} (built-in){{ l.flammable ? ' — flammable' : '' }}</mat-option>
              }
              @for (l of liquids(); track l.id) {
                <mat-option [value]="'library:' + l.id">{{ l.name }} (library)</mat-option>
              }
            </mat-select>
          </mat-form-field>
          <wick-unit-input formControlName="temperature" dimension="temperature" label="Temperature" defaultUnit="degC" [required]="true" />
          <mat-form-field>
            <mat-label>Orientation</mat-label>
            <mat-select formControlName="orientation">
              @for (o of orientations; track o) {
                <mat-option [value]="o">{{ orientationLabel(o) }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
          @if (inclined()) {
            <wick-unit-input formControlName="tilt" dimension="angle" label="Tilt from horizontal" defaultUnit="deg" [required]="true" />
          }
          <wick-unit-input formControlName="width" dimension="length" label="Specimen width" defaultUnit="mm" />
          <wick-unit-input formControlName="thickness" dimension="length" label="Specimen thickness" defaultUnit="mm" />
          <mat-form-field>
            <mat-label>Test date</mat-label>
            <input matInput type="date" formControlName="measuredAt" />
          </mat-form-field>
        </div>

        <fieldset class="set">
          <legend>Replicate set</legend>
          <mat-radio-group formControlName="setMode" aria-label="Replicate set">
            <mat-radio-button value="new">New set</mat-radio-button>
            <mat-radio-button value="existing" [disabled]="sets().length === 0">Add to an existing set</mat-radio-button>
          </mat-radio-group>
          @if (form.controls.setMode.value === 'new') {
            <mat-form-field class="wide">
              <mat-label>New set name</mat-label>
              <input matInput formControlName="newSetName" />
              <mat-hint>Replicates share web, liquid, orientation and measured quantity.</mat-hint>
            </mat-form-field>
          } @else {
            <mat-form-field class="wide">
              <mat-label>Set</mat-label>
              <mat-select formControlName="setId">
                @for (s of sets(); track s.id) {
                  <mat-option [value]="s.id">{{ s.name }} — {{ s.webName }}, {{ s.liquidName }}, {{ s.runCount }} run(s)</mat-option>
                }
              </mat-select>
            </mat-form-field>
          }
        </fieldset>

        <mat-form-field class="wide">
          <mat-label>Test conditions</mat-label>
          <textarea matInput formControlName="conditions" rows="2" placeholder="Strip size, conditioning, immersion depth, how the front was read …"></textarea>
        </mat-form-field>
        <mat-form-field class="wide">
          <mat-label>Operator notes</mat-label>
          <textarea matInput formControlName="notes" rows="2"></textarea>
        </mat-form-field>

        @if (flammable()) {
          <p class="wick-caution" role="note">
            This liquid is flammable. Handle it in a fume hood, away from ignition sources and static discharge, with gloves and eye
            protection, following the supplier's safety data sheet and local regulations.
          </p>
        }

        @if (problem(); as p) {
          <div class="problem" role="alert">
            <p>{{ p.message }}</p>
            @if (issues().length) {
              <ul class="issues">
                @for (i of issues(); track $index) {
                  <li>{{ i }}</li>
                }
              </ul>
            }
          </div>
        }
        <div class="actions">
          <button mat-flat-button type="submit" [disabled]="busy()">Upload and fit</button>
          <a mat-button routerLink="/lab-data">Cancel</a>
        </div>
      </form>
    </section>
  `,
  styles: `
    h1 { font: var(--mat-sys-headline-small); }
    .help { color: var(--mat-sys-on-surface-variant); }
    .grid { display: grid; grid-template-columns: repeat(auto-fill, minmax(260px, 1fr)); gap: 0 16px; }
    .file { display: flex; align-items: center; gap: 12px; margin: 16px 0; }
    .file-name { font: var(--mat-sys-body-medium); }
    .wide { width: 100%; }
    .set { border: 1px solid var(--mat-sys-outline-variant); border-radius: var(--mat-sys-corner-medium); margin: 8px 0 16px; padding: 8px 16px; }
    mat-radio-group { display: flex; gap: 16px; margin-bottom: 8px; }
    .problem { color: var(--mat-sys-error); }
    .actions { display: flex; gap: 8px; margin-top: 16px; }
  `,
})
export class RunUpload {
  private readonly api = inject(LabDataApi);
  private readonly router = inject(Router);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly builtIn = BUILT_IN_LIQUIDS;
  protected readonly orientations = RUN_ORIENTATIONS;
  protected readonly orientationLabel = orientationLabel;
  protected readonly webs = signal<readonly EntrySummary[]>([]);
  protected readonly liquids = signal<readonly EntrySummary[]>([]);
  protected readonly sets = signal<readonly LabSetSummary[]>([]);
  protected readonly file = signal<File | null>(null);
  protected readonly busy = signal(false);
  protected readonly problem = signal<ApiProblem | null>(null);

  protected readonly form = this.fb.group({
    name: this.fb.control('', Validators.required),
    webId: this.fb.control<number | null>(null, Validators.required),
    liquid: this.fb.control('built-in:saline-0.9', Validators.required),
    temperature: this.fb.control<Quantity | null>({ si: ZERO_CELSIUS + 23, unit: 'degC' }, [Validators.required, quantityRange(253.15, 373.15)]),
    orientation: this.fb.control<RunOrientation>('vertical'),
    tilt: this.fb.control<Quantity | null>(null, quantityRange(0, Math.PI / 2, { min: true, max: true })),
    width: this.fb.control<Quantity | null>(null, quantityRange(0, 1, { min: true })),
    thickness: this.fb.control<Quantity | null>(null, quantityRange(0, 0.1, { min: true })),
    measuredAt: this.fb.control(''),
    setMode: this.fb.control<'new' | 'existing'>('new'),
    newSetName: this.fb.control(''),
    setId: this.fb.control<number | null>(null),
    conditions: this.fb.control(''),
    notes: this.fb.control(''),
  });

  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly inclined = computed(() => this.values().orientation === 'inclined');
  protected readonly flammable = computed(() => {
    const key = this.values().liquid ?? '';
    return key.startsWith('built-in:') && BUILT_IN_LIQUIDS.some((l) => `built-in:${l.id}` === key && l.flammable);
  });
  protected readonly issues = computed(() => {
    const p = this.problem();
    if (!p) return [];
    const lines = (p.details as { issues?: { line?: number | null; column?: string; message: string }[] } | undefined)?.issues ?? [];
    if (lines.some((i) => 'line' in i)) return lines.map((i) => (i.line ? `Line ${i.line}${i.column ? ` (${i.column})` : ''}: ${i.message}` : i.message));
    return fieldIssues(p).map((i) => `${i.field}: ${i.message}`);
  });

  constructor() {
    void this.loadChoices();
  }

  protected pick(files: FileList | null): void {
    this.file.set(files?.item(0) ?? null);
  }

  protected async submit(): Promise<void> {
    const v = this.form.getRawValue();
    const file = this.file();
    const missing = [
      !file ? 'a CSV file' : null,
      !v.name.trim() ? 'a run name' : null,
      v.webId === null ? 'the web' : null,
      !v.temperature ? 'the temperature' : null,
      v.orientation === 'inclined' && !v.tilt ? 'the tilt' : null,
      v.setMode === 'new' && !v.newSetName.trim() ? 'a name for the new set' : null,
      v.setMode === 'existing' && v.setId === null ? 'the set' : null,
    ].filter((x): x is string => x !== null);
    if (missing.length || this.form.invalid) {
      this.form.markAllAsTouched();
      this.problem.set({ status: 0, code: 'client', message: missing.length ? `Give ${missing.join(', ')}.` : 'Check the highlighted fields.' });
      return;
    }
    const meta: LabRunCreate = {
      name: v.name.trim(),
      webId: v.webId!,
      liquid: liquidChoice(v.liquid),
      temperature: v.temperature!.si,
      orientation: v.orientation,
      ...(v.orientation === 'inclined' && v.tilt ? { tilt: v.tilt.si } : {}),
      ...(v.width ? { width: v.width.si } : {}),
      ...(v.thickness ? { thickness: v.thickness.si } : {}),
      ...(v.measuredAt ? { measuredAt: v.measuredAt } : {}),
      ...(v.setMode === 'new' ? { newSetName: v.newSetName.trim() } : { setId: v.setId! }),
      ...(v.conditions ? { conditions: v.conditions } : {}),
      ...(v.notes ? { notes: v.notes } : {}),
    };
    this.busy.set(true);
    this.problem.set(null);
    try {
      const run = await firstValueFrom(this.api.createRun(meta, file!));
      await this.router.navigate(['/lab-data/runs', run.id]);
    } catch (e) {
      this.problem.set(apiProblem(e));
    } finally {
      this.busy.set(false);
    }
  }

  private async loadChoices(): Promise<void> {
    try {
      const [webs, liquids, sets] = await Promise.all([firstValueFrom(this.api.webs()), firstValueFrom(this.api.liquids()), firstValueFrom(this.api.sets())]);
      this.webs.set(webs.items);
      this.liquids.set(liquids.items);
      this.sets.set(sets);
    } catch (e) {
      this.problem.set(apiProblem(e));
    }
  }
}
