import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { FitSettings, LabRunDetail } from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { apiProblem } from '../library/api-error';
import { FitView } from './fit-view';
import { LabDataApi } from './lab-data-api';
import { celsius, orientationLabel, show } from './lab-format';
import { PredictionPanel } from './prediction-panel';

/** One lab run: its specimen, liquid and conditions, the fit view, and prediction versus measurement. */
@Component({
  selector: 'wick-run-page',
  imports: [DatePipe, FitView, MatButtonModule, MatIconModule, PredictionPanel, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <p><a routerLink="/lab-data">← Lab data</a></p>
      @if (problem()) {
        <p class="wick-caution" role="alert">{{ problem() }}</p>
      }
      @if (notice()) {
        <p class="notice" role="status">{{ notice() }}</p>
      }
      @if (run(); as r) {
        <header class="head">
          <h1>{{ r.name }}</h1>
          <span class="spacer"></span>
          <a mat-button [href]="fileUrl()" download><mat-icon>download</mat-icon> {{ r.file.fileName }}</a>
          @if (r.actions.delete) {
            <button mat-button type="button" (click)="remove(r)" [disabled]="busy()"><mat-icon>delete</mat-icon> Delete run</button>
          }
        </header>
        <dl class="facts">
          <dt>Set</dt>
          <dd><a [routerLink]="['/lab-data/sets', r.set.id]">{{ r.set.name }}</a></dd>
          <dt>Web</dt>
          <dd>
            <a [routerLink]="['/materials/webs', r.web.entryId]">{{ r.web.name }}</a>, revision {{ r.web.revision }} ({{ r.web.state }})
            · porosity {{ r.web.porosity === null ? 'not in the library' : show(r.web.porosity, '%') }}
          </dd>
          <dt>Liquid</dt>
          <dd>
            {{ r.liquid.name }} at {{ celsius(r.temperature) }}: γ {{ show(r.liquid.surfaceTension, 'mN/m') }}, η {{ show(r.liquid.viscosity, 'mPa s') }},
            ρ {{ show(r.liquid.density, 'kg/m^3', 4) }}
          </dd>
          <dt>Specimen</dt>
          <dd>
            {{ orientation() }}{{ r.width !== null ? ', width ' + show(r.width, 'mm') : '' }}{{ r.thickness !== null ? ', thickness ' + show(r.thickness, 'mm') : '' }}
            · {{ r.points }} readings of {{ r.measurement }}
          </dd>
          @if (r.conditions) {
            <dt>Conditions</dt>
            <dd>{{ r.conditions }}</dd>
          }
          @if (r.notes) {
            <dt>Operator notes</dt>
            <dd>{{ r.notes }}</dd>
          }
          <dt>Uploaded</dt>
          <dd>{{ r.createdAt | date: 'medium' }} by {{ r.createdBy.name }}{{ r.measuredAt ? ' · tested ' + r.measuredAt : '' }}</dd>
        </dl>
        @if (r.liquid.flammable) {
          <p class="wick-caution" role="note">
            {{ r.liquid.name }} is flammable: handle it in a fume hood, away from ignition sources, following the safety data sheet and local rules.
          </p>
        }
        @for (m of r.liquid.remarks; track $index) {
          <p class="note">{{ m }}</p>
        }

        <h2>Fit</h2>
        <wick-fit-view [run]="r" [editable]="r.actions.edit" [busy]="busy()" (save)="saveFit(r, $event)" />

        @if (canCompare()) {
          <h2>Prediction versus measurement</h2>
          <wick-prediction-panel [runId]="r.id" />
        }
        <p class="wick-caution">
          Fitted figures are engineering estimates from idealised models (Washburn; gravity-restrained Washburn with Darcy flow). Confirm
          decisions with the standard test methods and qualified review.
        </p>
      }
    </section>
  `,
  styles: `
    .head { display: flex; align-items: center; gap: 8px; }
    .spacer { flex: 1; }
    h1 { font: var(--mat-sys-headline-small); }
    h2 { font: var(--mat-sys-title-large); margin-top: 32px; }
    .facts { display: grid; grid-template-columns: max-content 1fr; gap: 4px 16px; }
    dt { color: var(--mat-sys-on-surface-variant); }
    dd { margin: 0; }
    .note { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); }
    .notice { color: var(--mat-sys-primary); }
  `,
})
export class RunPage {
  private readonly api = inject(LabDataApi);
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  /** Route parameter. */
  readonly id = input.required<string>();

  protected readonly run = signal<LabRunDetail | null>(null);
  protected readonly busy = signal(false);
  protected readonly problem = signal('');
  protected readonly notice = signal('');
  protected readonly canCompare = computed(() => this.auth.can('designs:read'));
  protected readonly fileUrl = computed(() => this.api.fileUrl(this.run()?.id ?? 0));
  protected readonly orientation = computed(() => {
    const r = this.run();
    if (!r) return '';
    return r.orientation === 'inclined' ? `Inclined at ${show(r.tilt, 'deg')}` : orientationLabel(r.orientation);
  });
  protected readonly show = show;
  protected readonly celsius = celsius;

  constructor() {
    effect(() => {
      const id = Number(this.id());
      untracked(() => void this.load(id));
    });
  }

  protected async saveFit(r: LabRunDetail, fit: FitSettings): Promise<void> {
    this.busy.set(true);
    this.problem.set('');
    try {
      this.run.set(await firstValueFrom(this.api.updateRun(r.id, { version: r.version, name: r.name, conditions: r.conditions, notes: r.notes, fit })));
      this.notice.set('Fit settings saved; the set and the list use them now.');
    } catch (e) {
      const p = apiProblem(e);
      const current = (p.details as { current?: LabRunDetail } | undefined)?.current;
      if (p.code === 'version-conflict' && current) this.run.set(current);
      this.problem.set(p.message);
    } finally {
      this.busy.set(false);
    }
  }

  protected async remove(r: LabRunDetail): Promise<void> {
    this.busy.set(true);
    try {
      await firstValueFrom(this.api.deleteRun(r.id, r.version));
      await this.router.navigate(['/lab-data']);
    } catch (e) {
      this.problem.set(apiProblem(e).message);
    } finally {
      this.busy.set(false);
    }
  }

  private async load(id: number): Promise<void> {
    try {
      this.run.set(await firstValueFrom(this.api.run(id)));
    } catch (e) {
      this.problem.set(apiProblem(e).message);
    }
  }
}
