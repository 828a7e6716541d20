import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { type FormControl, type FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { BUILT_IN_LIQUIDS } from 'wick-core';
import { type Quantity, UnitInput } from '../../shared/unit-input/unit-input';
import type { LibraryChoice } from './library-lookup';

export type LiquidSource = 'built-in' | 'library';

/**
 * The liquid group a card edits: controls `source` ('built-in' | 'library'), `builtIn` (id), `libraryId` and
 * `temperature` (a Quantity); the form may hold more beside them (the library definition, its pin).
 */
export type LiquidControls = FormGroup<{
  source: FormControl<LiquidSource>;
  builtIn: FormControl<string>;
  libraryId: FormControl<number | null>;
  temperature: FormControl<Quantity | null>;
}>;

/**
 * The liquid of a variant or a stack: a built-in liquid or a library entry (pinned at its approved or newest
 * revision, unapproved ones said so), and the temperature. The editor owns what a library choice loads.
 */
@Component({
  selector: 'wick-liquid-card',
  imports: [ReactiveFormsModule, MatButtonToggleModule, MatCardModule, MatFormFieldModule, MatSelectModule, UnitInput],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card appearance="outlined" [formGroup]="group()">
      <mat-card-header><mat-card-title>Liquid</mat-card-title></mat-card-header>
      <mat-card-content class="fields">
        <mat-button-toggle-group formControlName="source" (change)="sourceChosen.emit($event.value)" aria-label="Where the liquid comes from">
          <mat-button-toggle value="built-in">Built in</mat-button-toggle>
          <mat-button-toggle value="library" data-testid="liquid-from-library">From the library</mat-button-toggle>
        </mat-button-toggle-group>
        @if (group().controls.source.value === 'built-in') {
          <mat-form-field>
            <mat-label>Liquid</mat-label>
            <mat-select formControlName="builtIn" data-field="liquid.ref">
              @for (l of builtInLiquids; track l.id) {
                <mat-option [value]="l.id">{{ l.name }}{{ l.flammable ? ' (flammable)' : '' }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
        } @else {
          <mat-form-field>
            <mat-label>Library liquid</mat-label>
            <mat-select formControlName="libraryId" (valueChange)="libraryChosen.emit($event)" data-testid="liquid-select">
              @for (l of choices() ?? []; track l.id) {
                <mat-option [value]="l.id">{{ l.name }} · rev {{ l.revision }}{{ l.approved ? '' : ' · ' + l.state + ', not approved' }}</mat-option>
              }
            </mat-select>
            @if (error(); as e) {
              <mat-hint class="error-text">{{ e }}</mat-hint>
            } @else if (choices() === null) {
              <mat-hint>Loading the library…</mat-hint>
            } @else if (choices()!.length === 0) {
              <mat-hint>The library holds no liquids yet.</mat-hint>
            }
          </mat-form-field>
        }
        <wick-unit-input formControlName="temperature" label="Temperature" dimension="temperature" data-field="liquid.temperature" />
      </mat-card-content>
    </mat-card>
  `,
  styles: `
    :host { display: block; }
    .fields { display: flex; flex-wrap: wrap; gap: 4px 16px; align-items: flex-start; }
    .fields mat-form-field { min-width: 260px; }
    mat-button-toggle-group { margin-top: 8px; }
    .error-text { color: var(--mat-sys-error); }
  `,
})
export class LiquidCard {
  /** Any form group with the controls of {@link LiquidControls} (and possibly more). */
  readonly group = input.required<LiquidControls, FormGroup>({ transform: (g: FormGroup) => g as unknown as LiquidControls });
  /** Library liquids to choose from; null while they load. */
  readonly choices = input<readonly LibraryChoice[] | null>(null);
  /** The evaluator's or the library's message about the liquid, shown under the library choice. */
  readonly error = input<string | null>(null);
  readonly libraryChosen = output<number>();
  readonly sourceChosen = output<LiquidSource>();
  protected readonly builtInLiquids = BUILT_IN_LIQUIDS;
}
