import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { PERMEABILITY_CORRELATIONS, PERMEABILITY_CORRELATION_LABELS, WEB_KIND_LABELS, WEB_KINDS } from 'wick-core';
import { type BlendGroup, type PermeabilityGroup, type WebForm, blendGroup } from './entry-form-model';
import { errorText } from './form-errors';
import { PropertyField } from './property-field';

/** The web's own fields: kind, blend, structure, permeability and superabsorbent figures. */
@Component({
  selector: 'wick-web-fields',
  imports: [
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatRadioModule,
    MatSelectModule,
    PropertyField,
    ReactiveFormsModule,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div [formGroup]="form()" class="fields">
      <mat-form-field>
        <mat-label>Kind of web</mat-label>
        <mat-select formControlName="webKind" required>
          @for (k of webKinds; track k) {
            <mat-option [value]="k">{{ webKindLabels[k] }}</mat-option>
          }
        </mat-select>
      </mat-form-field>

      <h3>Fibre blend (by mass)</h3>
      @for (p of form().controls.blend.controls; track p; let i = $index) {
        <div class="blend" [formGroup]="p">
          <mat-form-field subscriptSizing="dynamic" class="fibre">
            <mat-label>Library fibre</mat-label>
            <mat-select formControlName="fibreId" (selectionChange)="pickFibre(p, $event.value)">
              <mat-option [value]="null">— not in the library —</mat-option>
              @for (f of fibres(); track f.id) {
                <mat-option [value]="f.id">{{ f.name }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
          <mat-form-field subscriptSizing="dynamic" class="name">
            <mat-label>Fibre name</mat-label>
            <input matInput formControlName="fibreName" required />
            <mat-error>{{ errorText(p.controls.fibreName.errors) }}</mat-error>
          </mat-form-field>
          <mat-form-field subscriptSizing="dynamic" class="percent">
            <mat-label>Share</mat-label>
            <input matInput type="number" formControlName="percent" required min="0" max="100" step="any" />
            <span matTextSuffix>%</span>
            <mat-error>{{ errorText(p.controls.percent.errors) }}</mat-error>
          </mat-form-field>
          <button mat-icon-button type="button" (click)="removePart(i)" [disabled]="form().controls.blend.length === 1" [attr.aria-label]="'Remove fibre ' + (i + 1)">
            <mat-icon>delete</mat-icon>
          </button>
        </div>
      }
      @if (form().controls.blend.errors && form().controls.blend.touched) {
        <p class="group-error" role="alert">{{ errorText(form().controls.blend.errors) }}</p>
      }
      <button mat-stroked-button type="button" class="add" (click)="addPart()"><mat-icon>add</mat-icon>Add a fibre</button>

      <h3>Structure</h3>
      <wick-property-field [group]="form().controls.basisWeight" dimension="basisWeight" label="Basis weight" />
      <wick-property-field [group]="form().controls.thickness" dimension="length" label="Thickness" defaultUnit="mm" />
      <wick-property-field [group]="form().controls.thicknessPressure" dimension="pressure" label="Thickness measured under" defaultUnit="kPa" />
      <mat-radio-group formControlName="porosityMode" aria-label="Porosity" class="mode">
        <mat-radio-button value="computed">Compute porosity from basis weight, thickness and fibre density</mat-radio-button>
        <mat-radio-button value="measured">Measured porosity</mat-radio-button>
      </mat-radio-group>
      @if (form().controls.porosityMode.value === 'measured') {
        <wick-property-field [group]="form().controls.porosity" dimension="fraction" label="Porosity" defaultUnit="%" />
      }
      <wick-property-field [group]="form().controls.meanFlowPoreSize" dimension="length" label="Mean-flow pore size" />
      @if (form().errors && form().touched) {
        <p class="group-error" role="alert">{{ errorText(form().errors) }}</p>
      }

      <h3>Permeability</h3>
      @for (p of permeabilities(); track p.label) {
        <div class="permeability" [formGroup]="p.group">
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>{{ p.label }}</mat-label>
            <mat-select formControlName="mode">
              <mat-option value="none">Not given</mat-option>
              <mat-option value="measured">Measured value</mat-option>
              <mat-option value="correlation">Estimate with a correlation</mat-option>
            </mat-select>
          </mat-form-field>
          @if (p.group.controls.mode.value === 'correlation') {
            <mat-form-field subscriptSizing="dynamic">
              <mat-label>Correlation</mat-label>
              <mat-select formControlName="correlation">
                @for (c of correlations; track c) {
                  <mat-option [value]="c">{{ correlationLabels[c] }}</mat-option>
                }
              </mat-select>
            </mat-form-field>
          }
          @if (p.group.controls.mode.value === 'measured') {
            <wick-property-field [group]="p.group.controls.value" dimension="permeability" [label]="p.label" defaultUnit="darcy" />
          }
        </div>
      }

      <mat-checkbox formControlName="hasSap">Contains superabsorbent</mat-checkbox>
      @if (form().controls.hasSap.value) {
        <div [formGroup]="form().controls.sap" class="sap">
          <wick-property-field [group]="form().controls.sap.controls.content" dimension="fraction" label="Superabsorbent content" defaultUnit="%" />
          <wick-property-field [group]="form().controls.sap.controls.freeSwellCapacity" dimension="massPerMass" label="Free swell capacity" />
          <wick-property-field [group]="form().controls.sap.controls.centrifugeRetentionCapacity" dimension="massPerMass" label="Centrifuge retention capacity" />
          <wick-property-field [group]="form().controls.sap.controls.absorbencyUnderLoad" dimension="massPerMass" label="Absorbency under load" />
          <wick-property-field [group]="form().controls.sap.controls.absorbencyUnderLoadPressure" dimension="pressure" label="Load of that test" defaultUnit="kPa" />
          <mat-form-field>
            <mat-label>Test liquid of the capacity figures</mat-label>
            <input matInput formControlName="testLiquid" />
          </mat-form-field>
        </div>
      }
    </div>
  `,
  styles: `
    .fields,
    .sap {
      display: grid;
      gap: 8px;
    }
    h3 {
      font: var(--mat-sys-title-small);
      margin: 16px 0 4px;
    }
    .blend,
    .permeability {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 12px;
      align-items: center;
    }
    .fibre {
      flex: 2 1 260px;
    }
    .name {
      flex: 2 1 200px;
    }
    .percent {
      flex: 0 1 120px;
    }
    .add {
      justify-self: start;
    }
    .mode {
      display: flex;
      flex-direction: column;
    }
    .group-error {
      color: var(--mat-sys-error);
      margin: 0;
    }
  `,
})
export class WebFields {
  private readonly fb = inject(NonNullableFormBuilder);
  readonly form = input.required<WebForm>();
  /** Library fibres to pick from. */
  readonly fibres = input<readonly { id: number; name: string }[]>([]);

  protected readonly webKinds = WEB_KINDS;
  protected readonly webKindLabels = WEB_KIND_LABELS;
  protected readonly correlations = PERMEABILITY_CORRELATIONS;
  protected readonly correlationLabels = PERMEABILITY_CORRELATION_LABELS;
  protected readonly errorText = errorText;

  protected permeabilities(): { label: string; group: PermeabilityGroup }[] {
    return [
      { label: 'In plane', group: this.form().controls.permeabilityInPlane },
      { label: 'Through plane', group: this.form().controls.permeabilityThroughPlane },
    ];
  }

  protected pickFibre(part: BlendGroup, id: number | null): void {
    const f = this.fibres().find((x) => x.id === id);
    if (f) part.controls.fibreName.setValue(f.name);
  }

  protected addPart(): void {
    this.form().controls.blend.push(blendGroup(this.fb));
  }

  protected removePart(i: number): void {
    this.form().controls.blend.removeAt(i);
  }
}
