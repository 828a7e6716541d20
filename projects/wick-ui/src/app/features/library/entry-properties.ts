import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import {
  type FibreData,
  type LibraryKind,
  type LiquidData,
  type LiquidPropertyData,
  PERMEABILITY_CORRELATION_LABELS,
  PROPERTY_SOURCE_LABELS,
  type PermeabilityData,
  type PropertyValue,
  type Revision,
  WEB_KIND_LABELS,
  type WebData,
} from 'wick-core';
import { formatProperty, formatValue } from './library-format';

interface Row {
  readonly label: string;
  readonly value: string;
  readonly source?: string;
  readonly note?: string;
}

function prop(label: string, p: PropertyValue | undefined, rows: Row[]): void {
  if (!p) return;
  rows.push({ label, value: formatProperty(p), source: PROPERTY_SOURCE_LABELS[p.source], note: p.note });
}

function permeability(label: string, p: PermeabilityData | undefined, rows: Row[]): void {
  if (!p) return;
  if (p.mode === 'measured') prop(label, p.value, rows);
  else rows.push({ label, value: `estimated with ${PERMEABILITY_CORRELATION_LABELS[p.correlation]}`, source: 'Correlation' });
}

function liquidProperty(label: string, p: LiquidPropertyData, rows: Row[]): void {
  if (p.mode === 'constant') {
    rows.push({
      label,
      value: `${formatProperty(p.value)} at ${formatValue(p.temperature.si, p.temperature.unit)}`,
      source: PROPERTY_SOURCE_LABELS[p.value.source],
      note: p.value.note,
    });
  } else {
    const points = p.points.map((q) => `${formatValue(q.temperature, p.temperatureUnit, 3)}: ${formatValue(q.value, p.unit)}`).join(' · ');
    rows.push({ label, value: `table — ${points}`, source: PROPERTY_SOURCE_LABELS[p.source], note: p.note });
  }
}

/** The properties of one revision, by kind, each with its source. */
export function propertyRows(kind: LibraryKind, r: Revision): Row[] {
  const rows: Row[] = [];
  if (kind === 'fibre') {
    const f = r.data as FibreData;
    rows.push({ label: 'Polymer', value: f.polymer });
    prop('Fibre density', f.density, rows);
    prop('Linear density', f.linearDensity, rows);
    prop('Diameter', f.diameter, rows);
    prop('Shape factor (perimeter ratio)', f.shapeFactor, rows);
    if (f.finish) rows.push({ label: 'Finish', value: f.finish });
    for (const c of f.contactAngles) {
      rows.push({ label: `Contact angle, ${c.liquid}`, value: formatProperty(c.angle), source: PROPERTY_SOURCE_LABELS[c.angle.source], note: c.method });
    }
  } else if (kind === 'web') {
    const w = r.data as WebData;
    rows.push({ label: 'Kind', value: WEB_KIND_LABELS[w.webKind] });
    rows.push({ label: 'Fibre blend', value: w.blend.map((b) => `${b.fibreName} ${formatValue(b.massFraction, '%', 3)}`).join(' + ') });
    prop('Basis weight', w.basisWeight, rows);
    prop('Thickness', w.thickness, rows);
    prop('… measured under', w.thicknessPressure, rows);
    if (w.porosity) prop(w.porosityMode === 'computed' ? 'Porosity (computed)' : 'Porosity', w.porosity, rows);
    else if (w.porosityMode === 'computed') {
      rows.push({ label: 'Porosity (computed)', value: 'not computable: needs the thickness and library fibres with densities for the whole blend' });
    }
    prop('Mean-flow pore size', w.meanFlowPoreSize, rows);
    permeability('Permeability, in plane', w.permeabilityInPlane, rows);
    permeability('Permeability, through plane', w.permeabilityThroughPlane, rows);
    if (w.sap) {
      prop('Superabsorbent content', w.sap.content, rows);
      prop('Free swell capacity', w.sap.freeSwellCapacity, rows);
      prop('Centrifuge retention capacity', w.sap.centrifugeRetentionCapacity, rows);
      prop('Absorbency under load', w.sap.absorbencyUnderLoad, rows);
      prop('… under a load of', w.sap.absorbencyUnderLoadPressure, rows);
      if (w.sap.testLiquid) rows.push({ label: 'Capacity test liquid', value: w.sap.testLiquid });
    }
  } else {
    const l = r.data as LiquidData;
    liquidProperty('Surface tension', l.surfaceTension, rows);
    liquidProperty('Viscosity', l.viscosity, rows);
    liquidProperty('Density', l.density, rows);
    if (l.composition) rows.push({ label: 'Composition', value: l.composition });
    rows.push({ label: 'Flammable', value: l.flammable ? 'yes' : 'no' });
  }
  return rows;
}

@Component({
  selector: 'wick-entry-properties',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <dl>
      @for (row of rows(); track $index) {
        <div class="row">
          <dt>{{ row.label }}</dt>
          <dd>
            <span class="value">{{ row.value }}</span>
            @if (row.source) {
              <span class="source">{{ row.source }}</span>
            }
            @if (row.note) {
              <span class="note">{{ row.note }}</span>
            }
          </dd>
        </div>
      }
    </dl>
  `,
  styles: `
    dl {
      margin: 0;
      display: grid;
      gap: 4px;
    }
    .row {
      display: grid;
      grid-template-columns: minmax(160px, 240px) 1fr;
      gap: 16px;
      padding: 6px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    dt {
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
      display: flex;
      flex-wrap: wrap;
      gap: 4px 12px;
      align-items: baseline;
    }
    .value {
      font-weight: 500;
    }
    .source {
      font: var(--mat-sys-label-small);
      padding: 2px 8px;
      border-radius: 8px;
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    .note {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class EntryProperties {
  readonly kind = input.required<LibraryKind>();
  readonly revision = input.required<Revision>();
  protected readonly rows = computed(() => propertyRows(this.kind(), this.revision()));
}
