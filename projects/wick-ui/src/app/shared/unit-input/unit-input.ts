import {
  type AfterContentInit,
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  type DoCheck,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { type AbstractControl, type ControlValueAccessor, NgControl, type ValidationErrors, type ValidatorFn, Validators } from '@angular/forms';
import type { ErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInput, MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { DISPLAY_UNITS, type Dimension, DomainError, dimensionInfo, fromSI, toSI, unitLabel } from 'wick-core';

/** What a unit-aware control holds: the SI value and the unit it was typed in (null when empty). */
export interface Quantity {
  readonly si: number;
  readonly unit: string;
}

let nextId = 0;

/** "12,5" and "1.2e-3" read as numbers; anything else is not a number. */
function readNumber(text: string): number | null {
  const s = text.trim().replace(/−/g, '-').replace(/^([+-]?\d*),(\d+)$/, '$1.$2');
  if (!/^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/.test(s)) return null;
  const n = Number(s);
  return Number.isFinite(n) ? n : null;
}

/** A value shown in a unit: six significant digits, no trailing noise (0.30000000000000004 → 0.3). */
export function displayNumber(si: number, unit: string): string {
  return String(Number(fromSI(si, unit).toPrecision(6)));
}

/** Messages for the errors a quantity control can carry (its own and the named validators'). */
export function quantityErrorMessage(errors: ValidationErrors | null | undefined): string {
  if (!errors) return '';
  // Text that is not a number also leaves the value empty: say what is wrong with the text first.
  const number = errors['number'] as { message?: string } | undefined;
  if (number?.message) return number.message;
  if (errors['required']) return 'Required.';
  for (const key of ['range', 'server', 'unit']) {
    const e = errors[key] as { message?: string } | undefined;
    if (e?.message) return e.message;
  }
  const first = Object.values(errors)[0] as { message?: string } | undefined;
  return first?.message ?? 'Not valid.';
}

/**
 * A number with its unit, for any dimension the units module knows: the person types a number and picks a unit
 * (the units the trade uses for that dimension), the control's value is `{ si, unit }` — SI for the physics,
 * the unit for showing it back as typed. Changing the unit converts the number shown; the quantity stays.
 *
 * Use it with a form control: `<wick-unit-input dimension="basisWeight" label="Basis weight" formControlName="basisWeight" />`.
 * Put `Validators.required` on the control to make it required (no `required` attribute: Angular's
 * RequiredValidator would attach itself to the control and outlive this element).
 */
@Component({
  selector: 'wick-unit-input',
  imports: [MatFormFieldModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-form-field class="value" [subscriptSizing]="subscriptSizing()">
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        [id]="id"
        inputmode="decimal"
        autocomplete="off"
        [value]="text()"
        [disabled]="disabled()"
        [required]="requiredShown()"
        [placeholder]="placeholder()"
        [errorStateMatcher]="matcher"
        (input)="typed($any($event.target).value)"
        (blur)="blurred()"
      />
      @if (units().length === 1 && labelOf(units()[0]) !== '–') {
        <span matTextSuffix>{{ labelOf(units()[0]) }}</span>
      }
      @if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
      <mat-error>{{ error() }}</mat-error>
    </mat-form-field>
    <!-- A choice of unit only where there is one: counts and other single-unit quantities get none. -->
    @if (units().length > 1) {
      <mat-form-field class="unit" [subscriptSizing]="subscriptSizing()">
        <mat-label>Unit</mat-label>
        <mat-select [value]="unit()" [disabled]="disabled()" (selectionChange)="unitChosen($event.value)" [aria-label]="label() + ' unit'">
          @for (u of units(); track u) {
            <mat-option [value]="u">{{ labelOf(u) }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
    }
  `,
  styles: `
    :host {
      display: inline-flex;
      gap: 8px;
      align-items: flex-start;
      min-width: 260px;
    }
    .value {
      flex: 1 1 auto;
      min-width: 120px;
    }
    .unit {
      flex: 0 0 112px;
      width: 112px;
    }
  `,
})
export class UnitInput implements ControlValueAccessor, AfterContentInit, DoCheck {
  private readonly ngControl = inject(NgControl, { self: true, optional: true });
  private readonly destroyRef = inject(DestroyRef);
  private readonly matInput = viewChild(MatInput);

  /** A units-module dimension: 'length', 'basisWeight', 'surfaceTension' … */
  readonly dimension = input.required<Dimension>();
  readonly label = input('');
  readonly hint = input('');
  readonly placeholder = input('');
  /** Unit offered first when the control is empty; else the dimension's usual unit. */
  readonly defaultUnit = input<string | null>(null);
  readonly subscriptSizing = input<'fixed' | 'dynamic'>('dynamic');

  protected readonly id = `wick-unit-input-${nextId++}`;
  protected readonly text = signal('');
  private readonly chosenUnit = signal<string | null>(null);
  protected readonly disabled = signal(false);
  protected readonly error = signal('');
  /** Marked required when the control has `Validators.required` (as Material does for its own inputs). */
  protected readonly requiredShown = signal(false);
  private readonly invalidShown = signal(false);
  /** The SI value behind the text (null when empty or not a number). */
  private si: number | null = null;
  private parseError: string | null = null;

  protected readonly unit = computed(() => this.chosenUnit() ?? this.defaultUnit() ?? DISPLAY_UNITS[this.dimension()][0]);
  protected readonly units = computed(() => {
    const list = [...DISPLAY_UNITS[this.dimension()]];
    if (!list.includes(this.unit())) list.unshift(this.unit());
    return list;
  });

  /** Shows errors once the person has touched the field or the form was submitted (touched by markAllAsTouched). */
  protected readonly matcher: ErrorStateMatcher = {
    isErrorState: () => this.invalidShown(),
  };

  private onChange: (value: Quantity | null) => void = () => undefined;
  private onTouched: () => void = () => undefined;

  /** Refuses what is not a number, so the form is invalid while the text is. */
  private readonly parseValidator: ValidatorFn = () => (this.parseError ? { number: { message: this.parseError } } : null);

  constructor() {
    if (this.ngControl) this.ngControl.valueAccessor = this;
  }

  // Not ngOnInit: the form directive on this element binds its control only after the component's own init.
  ngAfterContentInit(): void {
    const control = this.ngControl?.control;
    if (!control) return;
    control.addValidators(this.parseValidator);
    control.updateValueAndValidity({ emitEvent: false });
    // A control may outlive this element (a field shown only in one mode): take the parse check away with it.
    this.destroyRef.onDestroy(() => {
      control.removeValidators(this.parseValidator);
      control.updateValueAndValidity({ emitEvent: false });
    });
    this.refreshError(control);
    control.events.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => this.refreshError(control));
  }

  /** The inner input has no form control of its own: Material does not re-evaluate its error state by itself. */
  private refreshError(control: AbstractControl): void {
    this.requiredShown.set(control.hasValidator(Validators.required));
    this.invalidShown.set(control.invalid && (control.touched || control.dirty));
    this.error.set(quantityErrorMessage(control.errors));
    this.matInput()?.updateErrorState();
  }

  /** Catches `markAllAsTouched()` on a parent form, which emits no event on this control. */
  ngDoCheck(): void {
    const control = this.ngControl?.control;
    if (control) this.refreshError(control);
  }

  protected labelOf(unit: string): string {
    try {
      return unitLabel(unit) || '–';
    } catch {
      return unit;
    }
  }

  writeValue(value: Quantity | null | undefined): void {
    this.parseError = null;
    if (value && Number.isFinite(value.si)) {
      this.chosenUnit.set(value.unit);
      this.si = value.si;
      this.text.set(displayNumber(value.si, value.unit));
    } else {
      this.si = null;
      this.text.set('');
    }
  }

  registerOnChange(fn: (value: Quantity | null) => void): void {
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
    this.parseError = null;
    this.si = null;
    if (text.trim() !== '') {
      const n = readNumber(text);
      if (n === null) {
        this.parseError = `"${text.trim()}" is not a number (e.g. ${dimensionInfo(this.dimension()).example.split(' ')[0]}).`;
      } else {
        try {
          this.si = toSI(n, this.unit(), this.dimension());
        } catch (e) {
          this.parseError = e instanceof DomainError ? e.message : String(e);
        }
      }
    }
    this.onChange(this.si === null ? null : { si: this.si, unit: this.unit() });
  }

  protected unitChosen(unit: string): void {
    this.chosenUnit.set(unit);
    if (this.si !== null) {
      this.text.set(displayNumber(this.si, unit));
      this.onChange({ si: this.si, unit });
    } else if (this.text().trim() !== '') {
      this.typed(this.text());
    }
  }

  protected blurred(): void {
    this.onTouched();
  }
}
