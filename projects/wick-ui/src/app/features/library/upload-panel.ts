import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { type Observable, firstValueFrom } from 'rxjs';
import type { HttpEvent } from '@angular/common/http';
import { type UploadCommitResult, type UploadIssue, type UploadPreview, type UploadPurpose, WEB_KIND_LABELS } from 'wick-core';
import { apiProblem } from './api-error';
import { LibraryApi } from './library-api';
import { formatProperty, formatValue } from './library-format';

const WHAT: Record<UploadPurpose, { title: string; help: string }> = {
  psd: {
    title: 'Pore-size distribution',
    help: 'CSV with the class diameter and its unit in the first column ("diameter (µm)") and the fraction in % or 0–1 in the second, named "differential", "cumulative finer" or "cumulative coarser". Lines starting with # are comments.',
  },
  curve: {
    title: 'Lab wicking curve',
    help: 'CSV with time and its unit ("time (s)") and height or mass with its unit ("height (mm)", "mass (g)").',
  },
  'web-import': {
    title: 'Webs',
    help: 'CSV with the columns name, kind, fibres ("PP 1.7 dtex 70% + PET 30%") and basis weight (g/m²); optional supplier, thickness (mm), thickness pressure (kPa), porosity (%), mean flow pore size (µm), source and notes. Each row becomes a draft.',
  },
};

/**
 * Upload a CSV: choose the file, watch it go up, see what the server read (or every problem with its line), then
 * commit or discard. Nothing changes until "Apply"; a file with any bad row is refused whole.
 */
@Component({
  selector: 'wick-upload-panel',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="panel" [attr.aria-label]="what().title + ' upload'">
      <h3>{{ what().title }} from a CSV file</h3>
      <p class="help">{{ what().help }}</p>

      @if (purpose() === 'curve') {
        <div class="fields">
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>Curve name</mat-label>
            <input matInput required [(ngModel)]="curveName" name="curveName" />
          </mat-form-field>
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>Liquid (optional)</mat-label>
            <input matInput [(ngModel)]="curveLiquid" name="curveLiquid" />
          </mat-form-field>
        </div>
      }

      <div class="choose">
        <input #file type="file" accept=".csv,.tsv,.txt,text/csv,text/plain" hidden (change)="chosen(file.files)" />
        <button mat-stroked-button type="button" (click)="file.click()" [disabled]="busy() || (purpose() === 'curve' && !curveName.trim())">
          <mat-icon>upload_file</mat-icon>Choose CSV file…
        </button>
        @if (fileName()) {
          <span class="file-name">{{ fileName() }}</span>
        }
      </div>

      @if (progress() !== null) {
        <mat-progress-bar mode="determinate" [value]="progress()" aria-label="Upload progress" />
        <span class="progress-text">{{ progress() }} %</span>
      }

      @if (problem()) {
        <div class="problem" role="alert">
          <p>{{ problem() }}</p>
          @if (issues().length) {
            <ul class="issues">
              @for (i of issues(); track $index) {
                <li><strong>{{ i.line ? 'Line ' + i.line : 'File' }}</strong>{{ i.column ? ' (' + i.column + ')' : '' }}: {{ i.message }}</li>
              }
            </ul>
          }
        </div>
      }

      @if (preview(); as p) {
        <div class="preview">
          <p>
            Read <strong>{{ p.file.rows }}</strong> rows from <strong>{{ p.file.fileName }}</strong>
            ({{ p.file.encoding }}, separated by "{{ p.file.delimiter }}"; SHA-256 {{ p.file.sha256.slice(0, 12) }}…).
          </p>
          @if (p.warnings.length) {
            <ul class="warnings">
              @for (w of p.warnings; track $index) {
                <li>
                  @if (w.line) {
                    Line {{ w.line }}:
                  }
                  {{ w.message }}
                </li>
              }
            </ul>
          }
          <table class="rows">
            <thead>
              <tr>
                @for (h of previewHeader(); track $index) {
                  <th>{{ h }}</th>
                }
              </tr>
            </thead>
            <tbody>
              @for (row of previewRows(); track $index) {
                <tr>
                  @for (cell of row; track $index) {
                    <td>{{ cell }}</td>
                  }
                </tr>
              }
            </tbody>
          </table>
          @if (previewMore() > 0) {
            <p class="more">… and {{ previewMore() }} more rows.</p>
          }
          <div class="buttons">
            <button mat-flat-button type="button" (click)="commit()" [disabled]="busy()">Apply</button>
            <button mat-button type="button" (click)="discard()" [disabled]="busy()">Discard</button>
          </div>
        </div>
      }
      @if (done()) {
        <p class="done" role="status">{{ done() }}</p>
      }
    </section>
  `,
  styles: `
    .panel {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
      padding: 16px;
      display: grid;
      gap: 12px;
    }
    h3 {
      margin: 0;
      font: var(--mat-sys-title-small);
    }
    .help {
      margin: 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .fields,
    .choose,
    .buttons {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
      align-items: center;
    }
    .problem {
      color: var(--mat-sys-error);
    }
    .issues {
      margin: 4px 0 0;
      padding-left: 20px;
    }
    .rows {
      border-collapse: collapse;
      font: var(--mat-sys-body-small);
    }
    .rows th,
    .rows td {
      text-align: left;
      padding: 2px 12px 2px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .warnings {
      color: var(--mat-sys-tertiary);
    }
    .more,
    .progress-text {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .done {
      color: var(--mat-sys-primary);
    }
  `,
})
export class UploadPanel {
  private readonly api = inject(LibraryApi);

  readonly purpose = input.required<UploadPurpose>();
  /** The web the distribution or curve belongs to. */
  readonly entryId = input<number | null>(null);
  /** The entry version the person is looking at (optimistic locking on commit). */
  readonly version = input<number | null>(null);
  readonly committed = output<UploadCommitResult>();

  protected curveName = '';
  protected curveLiquid = '';
  protected readonly fileName = signal('');
  protected readonly progress = signal<number | null>(null);
  protected readonly busy = signal(false);
  protected readonly problem = signal('');
  protected readonly issues = signal<UploadIssue[]>([]);
  protected readonly preview = signal<UploadPreview | null>(null);
  protected readonly done = signal('');

  protected readonly what = computed(() => WHAT[this.purpose()]);

  protected readonly previewTable = computed<{ header: string[]; rows: string[][] }>(() => {
    const p = this.preview()?.preview;
    if (!p) return { header: [], rows: [] };
    if (p.purpose === 'psd') {
      const label = p.psd.form === 'differential' ? 'Fraction' : p.psd.form === 'cumulative-finer' ? 'Cumulative finer' : 'Cumulative coarser';
      return {
        header: ['Diameter', label],
        rows: p.psd.diameters.map((d, i) => [formatValue(d, p.psd.diameterUnit), formatValue(p.psd.fractions[i], '%', 4)]),
      };
    }
    if (p.purpose === 'curve') {
      return {
        header: ['Time', p.curve.measurement === 'height' ? 'Height' : 'Mass'],
        rows: p.curve.times.map((t, i) => [formatValue(t, p.curve.timeUnit), formatValue(p.curve.values[i], p.curve.valueUnit)]),
      };
    }
    return {
      header: ['Line', 'Name', 'Kind', 'Basis weight', 'Thickness', 'Porosity'],
      rows: p.webs.map((w) => [
        String(w.line),
        w.input.name,
        WEB_KIND_LABELS[w.input.data.webKind],
        formatProperty(w.input.data.basisWeight),
        formatProperty(w.input.data.thickness),
        w.input.data.porosity ? formatProperty(w.input.data.porosity) : w.input.data.porosityMode,
      ]),
    };
  });
  protected readonly previewHeader = computed(() => this.previewTable().header);
  protected readonly previewRows = computed(() => this.previewTable().rows.slice(0, 12));
  protected readonly previewMore = computed(() => Math.max(0, this.previewTable().rows.length - 12));

  protected async chosen(files: FileList | null): Promise<void> {
    const file = files?.[0];
    if (!file) return;
    await this.send(file);
  }

  /** Sends `file` (also called by tests with a File made in memory). */
  async send(file: File): Promise<void> {
    this.fileName.set(file.name);
    this.problem.set('');
    this.issues.set([]);
    this.preview.set(null);
    this.done.set('');
    this.busy.set(true);
    this.progress.set(0);
    const id = this.entryId();
    let call: Observable<HttpEvent<UploadPreview>>;
    if (this.purpose() === 'psd') call = this.api.uploadPsd(id!, file);
    else if (this.purpose() === 'curve') call = this.api.uploadCurve(id!, file, { name: this.curveName.trim(), liquid: this.curveLiquid.trim() || undefined });
    else call = this.api.importWebs(file);
    try {
      await new Promise<void>((resolve, reject) =>
        call.subscribe({
          next: (event) => {
            if (event.type === HttpEventType.UploadProgress && event.total) this.progress.set(Math.round((100 * event.loaded) / event.total));
            if (event.type === HttpEventType.Response && event.body) this.preview.set(event.body);
          },
          error: reject,
          complete: resolve,
        }),
      );
      this.progress.set(100);
    } catch (e) {
      const p = apiProblem(e);
      this.progress.set(null);
      this.problem.set(p.message);
      this.issues.set(((p.details as { issues?: UploadIssue[] } | undefined)?.issues ?? []).filter((i) => typeof i.message === 'string'));
    } finally {
      this.busy.set(false);
    }
  }

  protected async commit(): Promise<void> {
    const p = this.preview();
    if (!p) return;
    this.busy.set(true);
    this.problem.set('');
    try {
      const result = await firstValueFrom(this.api.commitUpload(p.uploadId, p.preview.purpose === 'web-import' ? undefined : (this.version() ?? undefined)));
      this.preview.set(null);
      this.progress.set(null);
      this.done.set(
        result.purpose === 'web-import'
          ? `Imported ${result.entryIds.length} web${result.entryIds.length === 1 ? '' : 's'} as drafts.`
          : 'Applied to the draft revision.',
      );
      this.committed.emit(result);
    } catch (e) {
      this.problem.set(apiProblem(e).message);
    } finally {
      this.busy.set(false);
    }
  }

  protected async discard(): Promise<void> {
    const p = this.preview();
    if (!p) return;
    this.busy.set(true);
    try {
      await firstValueFrom(this.api.discardUpload(p.uploadId));
    } catch {
      // Gone already (expired): nothing to keep either way.
    } finally {
      this.preview.set(null);
      this.progress.set(null);
      this.fileName.set('');
      this.busy.set(false);
    }
  }
}
