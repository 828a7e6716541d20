import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { type ContactAngleAnalysis, formatQuantity, type LabSetSummary, REFERENCE_LIQUID_CAUTION } from 'wick-core';
import { apiProblem } from '../library/api-error';
import { LabDataApi } from './lab-data-api';

/**
 * Contact angle by the reference-liquid (Washburn) method: a set run with a fully wetting liquid (n-hexane) gives the
 * material constant, a set of the same web with the test liquid gives cos θ; replicates pooled with their spread.
 */
@Component({
  selector: 'wick-contact-angle-page',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatSelectModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <p><a routerLink="/lab-data">← Lab data</a></p>
      <h1>Contact angle by the reference-liquid method</h1>
      <p class="wick-caution" role="note" data-test="caution"><strong>Caution.</strong> {{ caution }}</p>
      <p class="help">
        Both sets must be of the same web, packed or cut alike, measuring the same quantity. The Washburn slope of each run is used:
        C = K η/(ρ² γ) from the reference (masses; C = K η/γ for heights), then cos θ = K η/(C ρ² γ) for the test liquid.
      </p>
      <div class="pick">
        <mat-form-field>
          <mat-label>Reference set (fully wetting liquid)</mat-label>
          <mat-select [(ngModel)]="reference">
            @for (s of sets(); track s.id) {
              <mat-option [value]="s.id">{{ s.name }} — {{ s.liquidName }} ({{ s.runCount }})</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Test set (same web)</mat-label>
          <mat-select [(ngModel)]="test">
            @for (s of testChoices(); track s.id) {
              <mat-option [value]="s.id">{{ s.name }} — {{ s.liquidName }} ({{ s.runCount }})</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <button mat-flat-button type="button" (click)="compute()" [disabled]="!reference() || !test() || busy()">Compute contact angle</button>
      </div>
      @if (problem()) {
        <p class="problem" role="alert">{{ problem() }}</p>
      }
      @if (result(); as r) {
        <dl class="result" aria-label="Contact angle">
          <dt>Contact angle θ of {{ r.test.liquidName }}</dt>
          <dd data-test="angle">
            <strong>{{ deg(r.result.contactAngle) }}</strong> (range {{ deg(r.result.contactAngleRange[0]) }} … {{ deg(r.result.contactAngleRange[1]) }} from cos θ ± u)
          </dd>
          <dt>cos θ</dt>
          <dd>{{ r.result.cosTheta.mean.toFixed(3) }} ± {{ r.result.cosTheta.uncertainty.toFixed(3) }} (u of the mean; sd {{ r.result.cosTheta.sd.toFixed(3) }}, n = {{ r.result.cosTheta.n }})</dd>
          <dt>Material constant</dt>
          <dd>{{ r.result.materialConstant.mean.toExponential(3) }} {{ r.quantity === 'mass' ? 'm⁵' : 'm' }} (sd {{ r.result.materialConstant.sd.toExponential(2) }}, n = {{ r.result.materialConstant.n }})</dd>
          <dt>Reference slopes ({{ r.reference.liquidName }})</dt>
          <dd>{{ slopes(r.reference.slopes, r.quantity) }}</dd>
          <dt>Test slopes</dt>
          <dd>{{ slopes(r.test.slopes, r.quantity) }}</dd>
        </dl>
        @for (w of warnings(); track $index) {
          <p class="warning">{{ w }}</p>
        }
      }
    </section>
  `,
  styles: `
    h1 { font: var(--mat-sys-headline-small); }
    .help { color: var(--mat-sys-on-surface-variant); }
    .pick { display: flex; flex-wrap: wrap; gap: 16px; align-items: center; }
    .pick mat-form-field { min-width: 320px; }
    .result { display: grid; grid-template-columns: max-content 1fr; gap: 4px 16px; }
    dt { color: var(--mat-sys-on-surface-variant); }
    dd { margin: 0; }
    .problem { color: var(--mat-sys-error); }
    .warning { color: var(--mat-sys-tertiary); font: var(--mat-sys-body-small); }
  `,
})
export class ContactAnglePage {
  private readonly api = inject(LabDataApi);
  protected readonly caution = REFERENCE_LIQUID_CAUTION;
  protected readonly sets = signal<readonly LabSetSummary[]>([]);
  protected readonly reference = signal<number | null>(null);
  protected readonly test = signal<number | null>(null);
  protected readonly result = signal<ContactAngleAnalysis | null>(null);
  protected readonly busy = signal(false);
  protected readonly problem = signal('');

  /** Sets of the reference set's web and quantity, other than the reference. */
  protected readonly testChoices = computed(() => {
    const ref = this.sets().find((s) => s.id === this.reference());
    return this.sets().filter((s) => !ref || (s.id !== ref.id && s.webId === ref.webId && s.measurement === ref.measurement));
  });
  protected readonly warnings = computed(() => [...(this.result()?.warnings ?? []), ...(this.result()?.result.warnings ?? [])].map((w) => w.message));

  /** Query parameters: the sets to start with (`?reference=3&test=4`), e.g. from a set's page. */
  readonly referenceParam = input<string | undefined>(undefined, { alias: 'reference' });
  readonly testParam = input<string | undefined>(undefined, { alias: 'test' });

  constructor() {
    void firstValueFrom(this.api.sets())
      .then((s) => {
        this.sets.set(s);
        const has = (v: string | undefined) => (v && s.some((x) => x.id === Number(v)) ? Number(v) : null);
        this.reference.set(has(this.referenceParam()));
        const test = has(this.testParam());
        const choices = this.testChoices();
        // A test set named, or the only one of the reference's web and quantity.
        if (test !== null && choices.some((x) => x.id === test)) this.test.set(test);
        else if (this.reference() !== null && choices.length === 1) this.test.set(choices[0].id);
      })
      .catch((e: unknown) => this.problem.set(apiProblem(e).message));
  }

  protected deg(rad: number): string {
    return formatQuantity(rad, 'deg', 3);
  }

  protected slopes(values: readonly number[], quantity: 'height' | 'mass'): string {
    return values.map((k) => formatQuantity(k, quantity === 'height' ? 'mm^2/s' : 'g^2/s', 3)).join(' · ');
  }

  protected async compute(): Promise<void> {
    this.busy.set(true);
    this.problem.set('');
    try {
      this.result.set(await firstValueFrom(this.api.contactAngle(this.reference()!, this.test()!)));
    } catch (e) {
      this.result.set(null);
      this.problem.set(apiProblem(e).message);
    } finally {
      this.busy.set(false);
    }
  }
}
