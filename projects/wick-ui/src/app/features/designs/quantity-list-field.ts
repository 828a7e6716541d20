import { ChangeDetectionStrategy, Component, computed, forwardRef, input, signal } from '@angular/core';
import { type ControlValueAccessor, NG_VALUE_ACCESSOR } from '@angular/forms';
import type { ErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { DIMENSION_INFO, fromSI, toSI, unitLabel, type Dimension } from 'wick-core';

import { editText, readNumber } from './quantity-field';

/** A list of numbers in one unit ("10; 30; 60"), kept in SI; unreadable entries become NaN for the evaluator. */
@Component({
  selector: 'wick-quantity-list-field',
  imports: [MatFormFieldModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [{ provide: NG_VALUE_ACCESSOR, useExisting: forwardRef(() => QuantityListField), multi: true }],
  template: `
    <mat-form-field class="value" subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        autocomplete="off"
        [attr.data-field]="path()"
        [value]="text()"
        [disabled]="disabled()"
        [errorStateMatcher]="matcher"
        (input)="typed($any($event.target).value)"
        (blur)="onTouched()"
      />
      @if (error(); as e) {
        <mat-error>{{ e }}</mat-error>
      } @else {
        <mat-hint>Separate values with ";" or spaces</mat-hint>
      }
    </mat-form-field>
    <mat-form-field class="unit" subscriptSizing="dynamic">
      <mat-select [value]="unit()" (valueChange)="switchUnit($event)" [disabled]="disabled()" [aria-label]="label() + ' unit'">
        @for (u of units(); track u) {
          <mat-option [value]="u">{{ labelOf(u) }}</mat-option>
        }
      </mat-select>
    </mat-form-field>
  `,
  styles: `
    :host { display: flex; gap: 8px; align-items: flex-start; }
    .value { flex: 1 1 auto; min-width: 0; }
    .unit { flex: 0 0 104px; }
  `,
})
export class QuantityListField implements ControlValueAccessor {
  readonly label = input.required<string>();
  readonly dimension = input.required<Dimension>();
  readonly path = input('');
  readonly initialUnit = input<string | undefined>(undefined);
  readonly error = input<string | null>(null);

  protected readonly units = computed(() => DIMENSION_INFO.find((d) => d.dimension === this.dimension())?.display ?? ['1']);
  private readonly chosenUnit = signal<string | null>(null);
  protected readonly unit = computed(() => this.chosenUnit() ?? this.initialUnit() ?? this.units()[0]);
  protected readonly text = signal('');
  protected readonly disabled = signal(false);
  private values: number[] = [];
  private onChange: (v: number[]) => void = () => {};
  protected onTouched: () => void = () => {};
  protected readonly matcher: ErrorStateMatcher = { isErrorState: () => this.error() !== null };

  protected labelOf(unit: string): string {
    return unitLabel(unit);
  }

  writeValue(values: number[] | null): void {
    this.values = values ?? [];
    this.text.set(this.format(this.values, this.unit()));
  }

  registerOnChange(fn: (v: number[]) => void): void {
    this.onChange = fn;
  }

  registerOnTouched(fn: () => void): void {
    this.onTouched = fn;
  }

  setDisabledState(disabled: boolean): void {
    this.disabled.set(disabled);
  }

  protected typed(text: string): void {
    this.text.set(text);
    const parts = text.split(/[;\s]+/).filter((p) => p !== '');
    this.values = parts.map((p) => {
      const n = readNumber(p);
      return n === null || Number.isNaN(n) ? Number.NaN : toSI(n, this.unit());
    });
    this.onChange(this.values);
  }

  protected switchUnit(unit: string): void {
    this.chosenUnit.set(unit);
    this.text.set(this.format(this.values, unit));
  }

  private format(values: readonly number[], unit: string): string {
    return values.map((v) => (Number.isFinite(v) ? editText(fromSI(v, unit)) : '?')).join('; ');
  }
}
