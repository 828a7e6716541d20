import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { type FormControl, type FormGroup, type NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { type Dimension, PROPERTY_SOURCE_LABELS, PROPERTY_SOURCES, type PropertySource, type PropertyValue } from 'wick-core';
import { quantityRange } from '../../shared/unit-input/quantity-validators';
import { type Quantity, UnitInput } from '../../shared/unit-input/unit-input';

/** One numeric property in a form: the value with its unit, its source, an optional uncertainty and note. */
export type PropertyGroup = FormGroup<{
  value: FormControl<Quantity | null>;
  source: FormControl<PropertySource>;
  uncertainty: FormControl<Quantity | null>;
  note: FormControl<string>;
}>;

export interface PropertyOptions {
  readonly required?: boolean;
  readonly source?: PropertySource;
  /** Plausible SI range (the server checks the same kind of limits). */
  readonly range?: readonly [number, number];
  readonly exclusive?: { readonly min?: boolean; readonly max?: boolean };
}

export function propertyGroup(fb: NonNullableFormBuilder, p: PropertyValue | undefined, options: PropertyOptions = {}): PropertyGroup {
  const validators = [
    ...(options.required ? [Validators.required] : []),
    ...(options.range ? [quantityRange(options.range[0], options.range[1], options.exclusive)] : []),
  ];
  return fb.group({
    value: fb.control<Quantity | null>(p ? { si: p.si, unit: p.unit } : null, validators),
    source: fb.control<PropertySource>(p?.source ?? options.source ?? 'measured'),
    uncertainty: fb.control<Quantity | null>(p?.uncertainty !== undefined ? { si: p.uncertainty, unit: p.unit } : null, [quantityRange(0, Number.MAX_VALUE)]),
    note: fb.control(p?.note ?? ''),
  });
}

/** The stored shape, or undefined when no value was given. */
export function toPropertyValue(g: PropertyGroup): PropertyValue | undefined {
  const v = g.controls.value.value;
  if (!v) return undefined;
  const u = g.controls.uncertainty.value;
  const note = g.controls.note.value.trim();
  return { si: v.si, unit: v.unit, source: g.controls.source.value, ...(u ? { uncertainty: u.si } : {}), ...(note ? { note } : {}) };
}

/** Value + unit, source, ± uncertainty and note for one property. */
@Component({
  selector: 'wick-property-field',
  imports: [MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule, UnitInput],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <fieldset [formGroup]="group()">
      <legend class="visually-hidden">{{ label() }}</legend>
      <wick-unit-input class="main" formControlName="value" [dimension]="dimension()" [label]="label()" [defaultUnit]="defaultUnit()" />
      <mat-form-field class="source" subscriptSizing="dynamic">
        <mat-label>Source</mat-label>
        <mat-select formControlName="source" [aria-label]="label() + ' source'">
          @for (s of sources; track s) {
            <mat-option [value]="s">{{ sourceLabels[s] }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <wick-unit-input class="uncertainty" formControlName="uncertainty" [dimension]="dimension()" [label]="'± ' + label()" [defaultUnit]="defaultUnit()" />
      <mat-form-field class="note" subscriptSizing="dynamic">
        <mat-label>Method or reference</mat-label>
        <input matInput formControlName="note" />
      </mat-form-field>
    </fieldset>
  `,
  styles: `
    fieldset {
      border: 0;
      margin: 0;
      padding: 0;
      display: flex;
      flex-wrap: wrap;
      gap: 0 12px;
      align-items: flex-start;
    }
    .main {
      flex: 2 1 300px;
    }
    .source {
      flex: 0 1 190px;
    }
    .uncertainty {
      flex: 1 1 240px;
    }
    .note {
      flex: 1 1 200px;
    }
    .visually-hidden {
      position: absolute;
      width: 1px;
      height: 1px;
      overflow: hidden;
      clip: rect(0 0 0 0);
    }
  `,
})
export class PropertyField {
  readonly group = input.required<PropertyGroup>();
  readonly dimension = input.required<Dimension>();
  readonly label = input.required<string>();
  readonly defaultUnit = input<string | null>(null);
  protected readonly sources = PROPERTY_SOURCES;
  protected readonly sourceLabels = PROPERTY_SOURCE_LABELS;
}
