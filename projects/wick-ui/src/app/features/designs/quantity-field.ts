import { ChangeDetectionStrategy, Component, computed, forwardRef, input, signal } from '@angular/core';
import { type ControlValueAccessor, NG_VALUE_ACCESSOR } from '@angular/forms';
import type { ErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { DIMENSION_INFO, fromSI, toSI, unitLabel, type Dimension } from 'wick-core';

/** Text of a number for editing: up to 6 significant digits, no exponent clutter for everyday values. */
export function editText(value: number): string {
  return Number(value.toPrecision(6)).toString();
}

/** A typed number: decimal comma accepted; '' → null; anything else unreadable → NaN (the evaluator says why). */
export function readNumber(text: string): number | null {
  const t = text.trim().replace(/\s+/g, '').replace(',', '.');
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

/**
 * A number with a switchable unit whose form value is a plain SI number (null when empty, NaN when unreadable),
 * with an `error` message supplied from outside (the evaluator's, for the path it names). For controls whose
 * value should carry the unit as well, and validators, use shared/unit-input.
 */
@Component({
  selector: 'wick-quantity-field',
  imports: [MatFormFieldModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [{ provide: NG_VALUE_ACCESSOR, useExisting: forwardRef(() => QuantityField), multi: true }],
  template: `
    <mat-form-field class="value" subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        inputmode="decimal"
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
      } @else if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
    </mat-form-field>
    @if (units().length > 1) {
      <mat-form-field class="unit" subscriptSizing="dynamic">
        <mat-select [value]="unit()" (valueChange)="switchUnit($event)" [disabled]="disabled()" [aria-label]="label() + ' unit'">
          @for (u of units(); track u) {
            <mat-option [value]="u">{{ labelOf(u) }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
    } @else {
      <span class="fixed-unit">{{ labelOf(unit()) }}</span>
    }
  `,
  styles: `
    :host { display: flex; gap: 8px; align-items: flex-start; }
    .value { flex: 1 1 auto; min-width: 0; }
    .unit { flex: 0 0 104px; }
    .fixed-unit { padding-top: 16px; min-width: 40px; color: var(--mat-sys-on-surface-variant); }
  `,
})
export class QuantityField implements ControlValueAccessor {
  readonly label = input.required<string>();
  readonly dimension = input.required<Dimension>();
  /** Input path for messages and tests, e.g. 'structure.thickness'. */
  readonly path = input('');
  /** Unit shown first (default: the dimension's most common display unit). */
  readonly initialUnit = input<string | undefined>(undefined);
  readonly error = input<string | null>(null);
  readonly hint = input('');

  protected readonly units = computed(() => DIMENSION_INFO.find((d) => d.dimension === this.dimension())?.display ?? ['1']);
  private readonly chosenUnit = signal<string | null>(null);
  protected readonly unit = computed(() => this.chosenUnit() ?? this.initialUnit() ?? this.units()[0]);
  protected readonly text = signal('');
  protected readonly disabled = signal(false);
  private si: number | null = null;
  private onChange: (v: number | null) => void = () => {};
  protected onTouched: () => void = () => {};
  protected readonly matcher: ErrorStateMatcher = { isErrorState: () => this.error() !== null };

  protected labelOf(unit: string): string {
    return unit === '1' ? '' : unitLabel(unit);
  }

  writeValue(value: number | null): void {
    this.si = value;
    this.text.set(this.format(value, this.unit()));
  }

  registerOnChange(fn: (v: number | null) => void): void {
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
    const n = readNumber(text);
    this.si = n === null || Number.isNaN(n) ? n : toSI(n, this.unit());
    this.onChange(this.si);
  }

  protected switchUnit(unit: string): void {
    this.chosenUnit.set(unit);
    this.text.set(this.format(this.si, unit));
  }

  private format(si: number | null, unit: string): string {
    if (si === null) return '';
    if (Number.isNaN(si)) return this.text();
    return editText(fromSI(si, unit));
  }
}
