import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { type FibreForm, contactAngleGroup } from './entry-form-model';
import { PropertyField } from './property-field';
import { errorText } from './form-errors';

/** The fibre's own fields. */
@Component({
  selector: 'wick-fibre-fields',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, PropertyField, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div [formGroup]="form()" class="fields">
      <mat-form-field>
        <mat-label>Polymer or material</mat-label>
        <input matInput formControlName="polymer" required placeholder="polypropylene, PET, viscose, fluff pulp …" />
        <mat-error>{{ errorText(form().controls.polymer.errors) }}</mat-error>
      </mat-form-field>
      <wick-property-field [group]="form().controls.density" dimension="density" label="Fibre density" defaultUnit="g/cm^3" />
      <wick-property-field [group]="form().controls.linearDensity" dimension="linearDensity" label="Linear density" />
      <wick-property-field [group]="form().controls.diameter" dimension="length" label="Diameter" />
      @if (form().errors?.['sizeRequired'] && form().touched) {
        <p class="group-error" role="alert">{{ form().errors?.['sizeRequired'].message }}</p>
      }
      <wick-property-field [group]="form().controls.shapeFactor" dimension="dimensionless" label="Shape factor (perimeter ratio, 1 = round)" />
      <mat-form-field>
        <mat-label>Finish</mat-label>
        <input matInput formControlName="finish" placeholder="durable hydrophilic, none …" />
      </mat-form-field>

      <h3>Contact angles (advancing)</h3>
      @for (a of form().controls.contactAngles.controls; track a; let i = $index) {
        <div class="angle" [formGroup]="a">
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>Liquid</mat-label>
            <input matInput formControlName="liquid" required />
          </mat-form-field>
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>Method</mat-label>
            <input matInput formControlName="method" required placeholder="Wilhelmy, single fibre" />
          </mat-form-field>
          <button mat-icon-button type="button" (click)="form().controls.contactAngles.removeAt(i)" [attr.aria-label]="'Remove contact angle ' + (i + 1)">
            <mat-icon>delete</mat-icon>
          </button>
          <wick-property-field [group]="a.controls.angle" dimension="angle" label="Contact angle" defaultUnit="deg" />
        </div>
      }
      <button mat-stroked-button type="button" (click)="form().controls.contactAngles.push(newAngle())"><mat-icon>add</mat-icon>Add a contact angle</button>
    </div>
  `,
  styles: `
    .fields {
      display: grid;
      gap: 8px;
    }
    .angle {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 12px;
      align-items: center;
      padding: 8px;
      border-left: 3px solid var(--mat-sys-outline-variant);
    }
    h3 {
      font: var(--mat-sys-title-small);
    }
    .group-error {
      color: var(--mat-sys-error);
      margin: 0;
    }
  `,
})
export class FibreFields {
  private readonly fb = inject(NonNullableFormBuilder);
  readonly form = input.required<FibreForm>();
  protected readonly errorText = errorText;
  protected newAngle() {
    return contactAngleGroup(this.fb);
  }
}
