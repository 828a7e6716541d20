import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTooltipModule } from '@angular/material/tooltip';
import { STACK_RETENTION_LABELS, STACK_RETENTION_MODES, VARIANT_CORRELATIONS, VARIANT_CORRELATION_LABELS } from 'wick-core';
import { UnitInput } from '../../../shared/unit-input/unit-input';
import type { LayerGroup } from './stack-form';

/**
 * One layer of a stack: where it comes from (a pinned library revision or typed in), its structure as for a
 * single-layer variant (thickness, porosity, contact angle, through-plane permeability) and its retention curve.
 * Messages from the evaluator reach each field through `errorAt(path)`.
 */
@Component({
  selector: 'wick-stack-layer-card',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatCardModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    MatTooltipModule,
    UnitInput,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card appearance="outlined" [formGroup]="group()" [attr.data-layer]="index()">
      <mat-card-header>
        <mat-card-title>{{ index() + 1 }}. {{ value().name || 'Layer' }}</mat-card-title>
        <mat-card-subtitle>
          @if (value().web; as w) {
            <span [class.unapproved]="w.state !== 'approved'" data-testid="layer-pin">{{ w.name }} · revision {{ w.revision }} · {{ w.state }}</span>
          } @else {
            Entered by hand
          }
        </mat-card-subtitle>
        @if (canEdit()) {
          <span class="tools">
            <button mat-icon-button type="button" (click)="moveUp.emit()" [disabled]="index() === 0" aria-label="Move layer up"><mat-icon>arrow_upward</mat-icon></button>
            <button mat-icon-button type="button" (click)="moveDown.emit()" [disabled]="index() === count() - 1" aria-label="Move layer down"><mat-icon>arrow_downward</mat-icon></button>
            <button mat-icon-button type="button" (click)="remove.emit()" aria-label="Remove layer"><mat-icon>delete</mat-icon></button>
          </span>
        }
      </mat-card-header>
      <mat-card-content>
        @for (n of value().notes; track n) {
          <p class="note">{{ n }}</p>
        }
        <mat-form-field>
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" [attr.data-field]="at('name')" />
        </mat-form-field>
        <wick-unit-input formControlName="thickness" label="Thickness" dimension="length" defaultUnit="mm" [attr.data-field]="at('structure.thickness')" />
        <wick-unit-input formControlName="basisWeight" label="Basis weight" dimension="basisWeight" [attr.data-field]="at('structure.basisWeight')" />
        <wick-unit-input formControlName="fibreDensity" label="Fibre density" dimension="density" defaultUnit="g/cm^3" [attr.data-field]="at('structure.fibreDensity')" />
        @if (value().sizeBy === 'diameter') {
          <wick-unit-input formControlName="fibreDiameter" label="Fibre diameter" dimension="length" [attr.data-field]="at('structure.fibreDiameter')" />
        } @else {
          <wick-unit-input formControlName="linearDensity" label="Fibre linear density" dimension="linearDensity" [attr.data-field]="at('structure.linearDensity')" />
        }
        <mat-checkbox formControlName="porosityMeasured">Porosity measured (otherwise from basis weight)</mat-checkbox>
        @if (value().porosityMeasured) {
          <wick-unit-input formControlName="porosity" label="Porosity" dimension="fraction" [attr.data-field]="at('structure.porosity')" />
        }
        <wick-unit-input formControlName="contactAngle" label="Contact angle" dimension="angle" [attr.data-field]="at('structure.contactAngle')" />

        <mat-form-field>
          <mat-label>Through-plane permeability</mat-label>
          <mat-select formControlName="permeabilityMode" [attr.data-field]="at('structure.permeability.mode')">
            <mat-option value="measured">Measured</mat-option>
            <mat-option value="correlation">From a correlation</mat-option>
          </mat-select>
        </mat-form-field>
        @if (value().permeabilityMode === 'measured') {
          <wick-unit-input formControlName="permeability" label="Permeability" dimension="permeability" [attr.data-field]="at('structure.permeability.value')" />
        } @else {
          <mat-form-field>
            <mat-label>Correlation</mat-label>
            <mat-select formControlName="correlation" [attr.data-field]="at('structure.permeability.correlation')">
              @for (c of correlations; track c) {
                <mat-option [value]="c">{{ correlationLabels[c] }}</mat-option>
              }
            </mat-select>
            @if (err('structure.permeability'); as e) {
              <mat-hint class="error-text">{{ e }}</mat-hint>
            }
          </mat-form-field>
        }

        <mat-form-field>
          <mat-label>Retention curve</mat-label>
          <mat-select formControlName="retentionMode" [attr.data-field]="at('retention.mode')">
            @for (m of retentionModes; track m) {
              <mat-option [value]="m" [disabled]="m === 'pore-size' && !value().poreSize">{{ retentionLabels[m] }}</mat-option>
            }
          </mat-select>
          @if (err('retention.mode'); as e) {
            <mat-hint class="error-text">{{ e }}</mat-hint>
          } @else if (value().poreSize; as psd) {
            <mat-hint>Pore-size distribution: {{ psd.diameters.length }} classes</mat-hint>
          }
        </mat-form-field>
        @switch (value().retentionMode) {
          @case ('van-genuchten') {
            <wick-unit-input formControlName="vgPressure" label="Characteristic pressure 1/α" dimension="pressure" [attr.data-field]="at('retention.alpha')" hint="van Genuchten α = 1 / this" />
            <wick-unit-input formControlName="vgN" label="van Genuchten n" dimension="dimensionless" [attr.data-field]="at('retention.n')" />
          }
          @case ('brooks-corey') {
            <wick-unit-input formControlName="entryPressure" label="Entry pressure" dimension="pressure" [attr.data-field]="at('retention.entryPressure')" />
            <wick-unit-input formControlName="lambda" label="Pore-size index λ" dimension="dimensionless" [attr.data-field]="at('retention.lambda')" />
          }
        }
        <wick-unit-input formControlName="initialSaturation" label="Initial saturation" dimension="fraction" [attr.data-field]="at('initialSaturation')" />
        <wick-unit-input formControlName="residualContent" label="Residual liquid content (optional)" dimension="fraction" [attr.data-field]="at('residualContent')" hint="θr, share of the layer's volume" />
      </mat-card-content>
    </mat-card>
  `,
  styles: `
    mat-card-header {
      align-items: center;
    }
    .tools {
      margin-left: auto;
    }
    mat-card-content {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(260px, 1fr));
      gap: 4px 16px;
      align-items: start;
    }
    .note {
      grid-column: 1 / -1;
      margin: 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .unapproved,
    .error-text {
      color: var(--mat-sys-error);
    }
  `,
})
export class StackLayerCard {
  readonly group = input.required<LayerGroup>();
  readonly index = input.required<number>();
  readonly count = input.required<number>();
  readonly canEdit = input(true);
  /** The evaluator's message for an input path (`layers[1].structure.thickness`), or null. */
  readonly errorAt = input<(path: string) => string | null>(() => null);
  readonly moveUp = output<void>();
  readonly moveDown = output<void>();
  readonly remove = output<void>();

  protected readonly correlations = VARIANT_CORRELATIONS;
  protected readonly correlationLabels = VARIANT_CORRELATION_LABELS;
  protected readonly retentionModes = STACK_RETENTION_MODES;
  protected readonly retentionLabels = STACK_RETENTION_LABELS;

  /** Bumped on every change of the group, so `value` follows the form (OnPush, no template subscriptions). */
  private readonly version = signal(0);
  protected readonly value = computed(() => {
    this.version();
    return this.group().getRawValue();
  });

  constructor() {
    effect((onCleanup) => {
      const sub = this.group().valueChanges.subscribe(() => this.version.update((v) => v + 1));
      onCleanup(() => sub.unsubscribe());
    });
  }

  protected at(path: string): string {
    return `layers[${this.index()}].${path}`;
  }

  protected err(path: string): string | null {
    return this.errorAt()(this.at(path));
  }
}
