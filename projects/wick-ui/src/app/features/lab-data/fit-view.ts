import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { debounceTime } from 'rxjs';
import { analyseLabRun, type FitSettings, fromSI, type LabRunDetail, type RunAnalysis } from 'wick-core';
import { Plot, type PlotTrace } from '../../shared/plot/plot';
import { quantityRange } from '../../shared/unit-input/quantity-validators';
import { type Quantity, UnitInput } from '../../shared/unit-input/unit-input';
import { LAB_UNITS, show, withInterval } from './lab-format';

type WindowMode = 'auto' | 'all' | 'custom';

function settingsOf(mode: WindowMode, start: number | null, end: number | null, intercept: boolean, angle: Quantity | null): FitSettings {
  // Number inputs give numbers, or null when empty.
  const num = (x: number | null) => (x === null || !Number.isFinite(x) ? undefined : x);
  const window = mode === 'custom' ? { start: num(start), end: num(end) } : mode;
  return { window, intercept, contactAngle: angle ? angle.si : null };
}

/**
 * The fit view of one run: measured points with the Washburn and gravity-restrained fits, both residual plots, the
 * window selector and the fitted numbers with their uncertainties. Changing the window, the intercept or the
 * contact angle refits in the browser with wick-core (the same code the server runs); "Save" keeps the settings.
 */
@Component({
  selector: 'wick-fit-view',
  imports: [MatButtonModule, MatButtonToggleModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, Plot, ReactiveFormsModule, UnitInput],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="controls" aria-label="Fit settings" [formGroup]="form">
      <div class="row">
        <span class="label">Washburn window</span>
        <mat-button-toggle-group formControlName="mode" aria-label="Washburn window" hideSingleSelectionIndicator>
          <mat-button-toggle value="auto">Suggested</mat-button-toggle>
          <mat-button-toggle value="all">All points</mat-button-toggle>
          <mat-button-toggle value="custom">Custom</mat-button-toggle>
        </mat-button-toggle-group>
        @if (values().mode === 'custom') {
          <mat-form-field class="time" subscriptSizing="dynamic">
            <mat-label>From (s)</mat-label>
            <input matInput type="number" min="0" formControlName="start" />
          </mat-form-field>
          <mat-form-field class="time" subscriptSizing="dynamic">
            <mat-label>To (s)</mat-label>
            <input matInput type="number" min="0" formControlName="end" />
          </mat-form-field>
        }
        <mat-checkbox formControlName="intercept">Intercept (time-zero offset)</mat-checkbox>
      </div>
      <div class="row">
        <wick-unit-input
          formControlName="contactAngle"
          dimension="angle"
          defaultUnit="deg"
          label="Contact angle θ"
          hint="For the radii; empty: r·cos θ"
        />
        @if (editable()) {
          <button mat-flat-button type="button" [disabled]="!changed() || busy()" (click)="save.emit(settings())">Save fit settings</button>
          @if (changed()) {
            <span class="unsaved">Not saved: the list and the set still use the saved settings.</span>
          }
        }
      </div>
      @if (analysis().washburn?.suggestedWindow; as s) {
        <p class="rule">Suggested window: {{ s.rule }}</p>
      }
    </section>

    <!-- The plots are what this view is for: fetched once the page is idle (plotly stays out of the initial bundle). -->
    @defer (on idle) {
      <wick-plot [traces]="curveTraces()" [x]="{ title: 'Time (s)' }" [y]="{ title: valueTitle() }" ariaLabel="Measured points with the fitted curves" />
      <div class="residuals">
        <wick-plot
          [traces]="gravityResiduals()"
          [x]="{ title: 'Time (s)' }"
          [y]="{ title: 'Residual, gravity fit (' + units().label + ')' }"
          ariaLabel="Residuals of the gravity-restrained fit"
        />
        <wick-plot
          [traces]="washburnResiduals()"
          [x]="{ title: 'Time (s)' }"
          [y]="{ title: 'Residual of ' + (run().measurement === 'height' ? 'h²' : 'm²') + ' (' + units().square + ')' }"
          ariaLabel="Residuals of the Washburn slope fit"
        />
      </div>
    } @placeholder {
      <p class="placeholder">Loading the plots…</p>
    }

    <div class="numbers">
      <section aria-label="Washburn slope">
        <h3>Washburn slope ({{ run().measurement === 'height' ? 'h²' : 'm²' }} against t)</h3>
        @if (analysis().washburn; as w) {
          <dl>
            <dt>Slope K</dt>
            <dd data-test="slope">{{ interval({ value: w.slope, ci95: w.slopeCI95 }, units().slope) }}</dd>
            <dt>Standard error</dt>
            <dd>{{ show(w.slopeStdError, units().slope) }}</dd>
            @if (w.intercept !== 0) {
              <dt>Intercept</dt>
              <dd>{{ interval({ value: w.intercept, ci95: w.interceptCI95 }, units().squareUnit) }}</dd>
            }
            <dt>R²</dt>
            <dd>{{ w.rSquared.toFixed(4) }}</dd>
            <dt>Window</dt>
            <dd data-test="window">{{ w.window.start }}–{{ w.window.end }} s, {{ w.window.count }} points ({{ w.degreesOfFreedom }} degrees of freedom)</dd>
          </dl>
          @for (m of w.warnings; track m.code) {
            <p class="warning">{{ m.message }}</p>
          }
        } @else {
          <p class="warning" role="alert">{{ analysis().washburnError?.message }}</p>
        }
      </section>
      <section aria-label="Gravity-restrained fit">
        <h3>Gravity-restrained fit (dh/dt = a/h − b)</h3>
        @if (analysis().gravity; as g) {
          <dl>
            <dt>a (capillary term)</dt>
            <dd>{{ interval(g.a, units().slope) }}</dd>
            <dt>b (gravity term)</dt>
            <dd>{{ interval(g.b, units().b) }}</dd>
            <dt>Equilibrium</dt>
            <dd data-test="equilibrium">{{ interval(g.equilibrium, units().value) }}</dd>
            <dt>Characteristic time t*</dt>
            <dd>{{ show(g.characteristicTime, 's') }}</dd>
            @if (g.capillary; as c) {
              <dt>Static effective radius</dt>
              <dd>{{ interval(c.staticRadius, 'um') }}</dd>
              <dt>Dynamic effective radius</dt>
              <dd>{{ interval(c.dynamicRadius, 'um') }}</dd>
              <dd class="hint">
                Static from the equilibrium (r = 2γ cos θ / ρ g h_eq, vertical), dynamic from the rate (r = 4ηa / γ cos θ). In a
                fibrous layer the dynamic one is usually far smaller: it carries the flow resistance of the pore
                network (tortuosity, porosity), not only the pore size.
              </dd>
            }
            @if (g.porousLayer; as p) {
              <dt>Permeability (in-plane)</dt>
              <dd data-test="permeability">{{ interval(p.permeability, 'um^2') }}</dd>
              <dt>Capillary pressure</dt>
              <dd>{{ interval(p.capillaryPressure, 'Pa') }}</dd>
            }
            <dt>R² · RMSE</dt>
            <dd>{{ g.rSquared.toFixed(4) }} · {{ show(g.rmse, units().value) }}</dd>
            @if (g.approachToEquilibrium !== null) {
              <dt>Last reading / equilibrium</dt>
              <dd>{{ (g.approachToEquilibrium * 100).toFixed(0) }} %</dd>
            }
            <dt>Correlation of a and b</dt>
            <dd>{{ g.correlation.toFixed(3) }}</dd>
          </dl>
          @for (m of g.warnings; track m.code) {
            <p class="warning">{{ m.message }}</p>
          }
        } @else {
          <p class="note">{{ analysis().gravityError?.message }}</p>
        }
      </section>
    </div>
  `,
  styles: `
    .controls { display: grid; gap: 8px; margin-bottom: 16px; }
    .row { display: flex; flex-wrap: wrap; align-items: center; gap: 12px; }
    .label { font: var(--mat-sys-title-small); }
    .time { width: 110px; }
    .rule, .placeholder, .note { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); }
    .unsaved { color: var(--mat-sys-tertiary); font: var(--mat-sys-body-small); }
    .residuals { display: grid; grid-template-columns: 1fr 1fr; gap: 16px; --wick-plot-height: 220px; }
    .numbers { display: grid; grid-template-columns: 1fr 1fr; gap: 24px; margin-top: 16px; }
    h3 { font: var(--mat-sys-title-medium); }
    dl { display: grid; grid-template-columns: max-content 1fr; gap: 4px 16px; margin: 0; }
    dt { color: var(--mat-sys-on-surface-variant); }
    dd { margin: 0; }
    dd.hint { grid-column: 1 / -1; color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); }
    .warning { color: var(--mat-sys-tertiary); font: var(--mat-sys-body-small); }
    @media (max-width: 800px) { .numbers, .residuals { grid-template-columns: 1fr; } }
  `,
})
export class FitView {
  private readonly fb = inject(NonNullableFormBuilder);
  readonly run = input.required<LabRunDetail>();
  readonly editable = input(false);
  readonly busy = input(false);
  readonly save = output<FitSettings>();

  protected readonly show = show;
  protected readonly interval = withInterval;

  protected readonly form = this.fb.group({
    mode: this.fb.control<WindowMode>('auto'),
    start: this.fb.control<number | null>(null),
    end: this.fb.control<number | null>(null),
    intercept: this.fb.control(false),
    contactAngle: this.fb.control<Quantity | null>(null, quantityRange(0, Math.PI / 2, { max: true })),
  });
  protected readonly values = toSignal(this.form.valueChanges.pipe(debounceTime(200)), { initialValue: this.form.getRawValue() });

  protected readonly settings = computed<FitSettings>(() => {
    const v = { ...this.form.getRawValue(), ...this.values() };
    // An angle outside 0–90° shows its error at the field and is not used.
    return settingsOf(v.mode, v.start, v.end, v.intercept, this.form.controls.contactAngle.valid ? v.contactAngle : null);
  });
  protected readonly changed = computed(() => JSON.stringify(this.settings()) !== JSON.stringify(this.run().fit));

  /** The run refitted in the browser with the settings on screen (the saved ones until something changes). */
  protected readonly analysis = computed<RunAnalysis>(() => {
    const r = this.run();
    const fit = this.settings();
    if (!this.changed()) return r.analysis;
    return analyseLabRun({
      times: r.times,
      readings: r.values,
      measurement: r.measurement,
      orientation: r.orientation,
      tilt: r.tilt,
      liquid: r.liquid,
      porosity: r.web.porosity,
      fit,
    });
  });

  protected readonly units = computed(() => {
    const u = LAB_UNITS[this.run().measurement];
    const height = this.run().measurement === 'height';
    return { ...u, label: height ? 'mm' : 'g', square: height ? 'mm²' : 'g²', squareUnit: height ? 'mm^2' : 'g^2' };
  });
  protected readonly valueTitle = computed(() => (this.run().measurement === 'height' ? 'Height (mm)' : 'Mass (g)'));

  protected readonly curveTraces = computed<PlotTrace[]>(() => {
    const r = this.run();
    const u = this.units().value;
    const a = this.analysis();
    const y = (si: number) => fromSI(si, u);
    const w = a.washburn?.window;
    const inside = (i: number) => w !== undefined && i >= w.startIndex && i <= w.endIndex;
    const traces: PlotTrace[] = [
      { name: 'Measured, in the window', mode: 'markers', x: r.times.filter((_, i) => inside(i)), y: r.values.filter((_, i) => inside(i)).map(y) },
      { name: 'Measured, outside', mode: 'markers', x: r.times.filter((_, i) => !inside(i)), y: r.values.filter((_, i) => !inside(i)).map(y) },
    ];
    if (a.washburn) {
      const K = a.washburn.slope;
      const c = a.washburn.intercept;
      const tEnd = r.times[r.times.length - 1];
      const t = Array.from({ length: 120 }, (_, i) => (tEnd * i) / 119);
      traces.push({ name: 'Washburn fit', mode: 'lines', line: { dash: 'dash' }, x: t, y: t.map((x) => y(Math.sqrt(Math.max(0, K * x + c)))) });
    }
    if (a.gravity) traces.push({ name: 'Gravity-restrained fit', mode: 'lines', x: [...r.times], y: a.gravity.fitted.map(y) });
    return traces;
  });

  protected readonly gravityResiduals = computed<PlotTrace[]>(() => {
    const g = this.analysis().gravity;
    return g ? [{ name: 'Gravity fit', mode: 'markers', x: [...this.run().times], y: g.residuals.map((v) => fromSI(v, this.units().value)) }] : [];
  });

  protected readonly washburnResiduals = computed<PlotTrace[]>(() => {
    const w = this.analysis().washburn;
    if (!w) return [];
    const t = this.run().times.slice(w.window.startIndex, w.window.endIndex + 1);
    return [{ name: 'Washburn fit', mode: 'markers', x: t, y: w.residuals.map((v) => fromSI(v, this.units().squareUnit)) }];
  });

  constructor() {
    // Show the saved settings whenever another run (or a saved version) arrives.
    effect(() => {
      const fit = this.run().fit;
      untracked(() => {
        const w = typeof fit.window === 'object' ? fit.window : null;
        this.form.setValue({
          mode: w ? 'custom' : (fit.window as 'auto' | 'all'),
          start: w?.start ?? null,
          end: w?.end ?? null,
          intercept: fit.intercept,
          contactAngle: fit.contactAngle === null ? null : { si: fit.contactAngle, unit: 'deg' },
        });
      });
    });
  }
}
