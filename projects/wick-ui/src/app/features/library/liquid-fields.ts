import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { DISPLAY_UNITS, type Dimension, PROPERTY_SOURCE_LABELS, PROPERTY_SOURCES, unitLabel } from 'wick-core';
import { UnitInput } from '../../shared/unit-input/unit-input';
import { type LiquidForm, type LiquidPropertyGroup, addTableRow } from './entry-form-model';
import { errorText } from './form-errors';
import { PropertyField } from './property-field';

/** A liquid's surface tension, viscosity and density, each a constant or a table over temperature. */
@Component({
  selector: 'wick-liquid-fields',
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    PropertyField,
    ReactiveFormsModule,
    UnitInput,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div [formGroup]="form()" class="fields">
      @for (p of properties(); track p.key) {
        <section [formGroup]="p.group" class="property" [attr.aria-label]="p.label">
          <div class="head">
            <h3>{{ p.label }}</h3>
            <mat-button-toggle-group formControlName="mode" [attr.aria-label]="p.label + ' given as'">
              <mat-button-toggle value="constant">One value</mat-button-toggle>
              <mat-button-toggle value="table">Table over temperature</mat-button-toggle>
            </mat-button-toggle-group>
          </div>
          @if (p.group.controls.mode.value === 'constant') {
            <wick-property-field [group]="p.group.controls.value" [dimension]="p.dimension" [label]="p.label" />
            <wick-unit-input formControlName="temperature" dimension="temperature" label="At temperature" defaultUnit="degC" />
          } @else {
            <div class="table-head">
              <mat-form-field subscriptSizing="dynamic">
                <mat-label>Temperature unit</mat-label>
                <mat-select formControlName="temperatureUnit">
                  @for (u of temperatureUnits; track u) {
                    <mat-option [value]="u">{{ label(u) }}</mat-option>
                  }
                </mat-select>
              </mat-form-field>
              <mat-form-field subscriptSizing="dynamic">
                <mat-label>Value unit</mat-label>
                <mat-select formControlName="unit">
                  @for (u of unitsOf(p.dimension); track u) {
                    <mat-option [value]="u">{{ label(u) }}</mat-option>
                  }
                </mat-select>
              </mat-form-field>
              <mat-form-field subscriptSizing="dynamic">
                <mat-label>Source</mat-label>
                <mat-select formControlName="source">
                  @for (s of sources; track s) {
                    <mat-option [value]="s">{{ sourceLabels[s] }}</mat-option>
                  }
                </mat-select>
              </mat-form-field>
            </div>
            @for (row of p.group.controls.points.controls; track row; let i = $index) {
              <div class="row" [formGroup]="row">
                <mat-form-field subscriptSizing="dynamic">
                  <mat-label>Temperature ({{ label(p.group.controls.temperatureUnit.value) }})</mat-label>
                  <input matInput type="number" step="any" formControlName="temperature" />
                </mat-form-field>
                <mat-form-field subscriptSizing="dynamic">
                  <mat-label>{{ p.label }} ({{ label(p.group.controls.unit.value) }})</mat-label>
                  <input matInput type="number" step="any" formControlName="value" />
                </mat-form-field>
                <button mat-icon-button type="button" (click)="p.group.controls.points.removeAt(i)" [attr.aria-label]="'Remove row ' + (i + 1)">
                  <mat-icon>delete</mat-icon>
                </button>
              </div>
            }
            <button mat-stroked-button type="button" class="add" (click)="addRow(p.group)"><mat-icon>add</mat-icon>Add a temperature</button>
          }
          @if (p.group.errors && (p.group.touched || p.group.dirty)) {
            <p class="group-error" role="alert">{{ errorText(p.group.errors) }}</p>
          }
        </section>
      }
      <mat-form-field>
        <mat-label>Composition</mat-label>
        <input matInput formControlName="composition" placeholder="9 g/L NaCl in deionised water" />
      </mat-form-field>
      <mat-checkbox formControlName="flammable">Flammable</mat-checkbox>
      @if (form().controls.flammable.value) {
        <p class="wick-caution"><mat-icon aria-hidden="true">warning</mat-icon>
          Flammable: use small quantities in a fume hood away from ignition sources, follow the safety data sheet and local regulations.
        </p>
      }
    </div>
  `,
  styles: `
    .fields {
      display: grid;
      gap: 12px;
    }
    .property {
      display: grid;
      gap: 8px;
      padding: 8px 0 16px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .head,
    .table-head,
    .row {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 12px;
      align-items: center;
    }
    h3 {
      font: var(--mat-sys-title-small);
      margin: 0;
      min-width: 140px;
    }
    .add {
      justify-self: start;
    }
    .group-error {
      color: var(--mat-sys-error);
      margin: 0;
    }
  `,
})
export class LiquidFields {
  private readonly fb = inject(NonNullableFormBuilder);
  readonly form = input.required<LiquidForm>();
  protected readonly sources = PROPERTY_SOURCES;
  protected readonly sourceLabels = PROPERTY_SOURCE_LABELS;
  protected readonly temperatureUnits = DISPLAY_UNITS.temperature;
  protected readonly errorText = errorText;

  protected properties(): { key: string; label: string; dimension: Dimension; group: LiquidPropertyGroup }[] {
    const c = this.form().controls;
    return [
      { key: 'surfaceTension', label: 'Surface tension', dimension: 'surfaceTension', group: c.surfaceTension },
      { key: 'viscosity', label: 'Viscosity', dimension: 'viscosity', group: c.viscosity },
      { key: 'density', label: 'Density', dimension: 'density', group: c.density },
    ];
  }

  protected unitsOf(d: Dimension): readonly string[] {
    return DISPLAY_UNITS[d];
  }

  protected label(unit: string): string {
    return unitLabel(unit);
  }

  protected addRow(g: LiquidPropertyGroup): void {
    addTableRow(this.fb, g);
  }
}
