import {
  type AbstractControl,
  type FormArray,
  type FormControl,
  type FormGroup,
  type NonNullableFormBuilder,
  type ValidationErrors,
  type ValidatorFn,
  Validators,
} from '@angular/forms';
import {
  type BlendPart,
  type ContactAngle,
  DISPLAY_UNITS,
  type Dimension,
  type FibreData,
  type LiquidData,
  type LiquidPropertyData,
  type PermeabilityCorrelation,
  type PermeabilityData,
  type PropertySource,
  type WebData,
  type WebKind,
  fromSI,
  toSI,
} from 'wick-core';
import type { Quantity } from '../../shared/unit-input/unit-input';
import { type PropertyGroup, propertyGroup, toPropertyValue } from './property-field';

// Plausible SI ranges, as the server's schemas have them: they catch unit slips, not unusual materials.
export const RANGES = {
  fibreDensity: [100, 5000],
  linearDensity: [1e-9, 1e-3],
  fibreDiameter: [1e-8, 2e-3],
  shapeFactor: [1, 20],
  angle: [0, Math.PI],
  basisWeight: [1e-3, 10],
  thickness: [1e-6, 0.2],
  pressure: [0, 1e7],
  fraction: [0, 1],
  poreSize: [1e-9, 1e-2],
  permeability: [1e-20, 1e-5],
  capacity: [0, 2000],
  surfaceTension: [1e-3, 1],
  viscosity: [1e-6, 1e5],
  liquidDensity: [100, 25000],
  temperature: [150, 700],
} as const satisfies Record<string, readonly [number, number]>;

const message = (key: string, text: string): ValidationErrors => ({ [key]: { message: text } });

// ——— fibres ———

export type ContactAngleGroup = FormGroup<{ liquid: FormControl<string>; angle: PropertyGroup; method: FormControl<string> }>;

export function contactAngleGroup(fb: NonNullableFormBuilder, c?: ContactAngle): ContactAngleGroup {
  return fb.group({
    liquid: fb.control(c?.liquid ?? 'Water', [Validators.required, Validators.maxLength(120)]),
    angle: propertyGroup(fb, c?.angle, { required: true, range: RANGES.angle }),
    method: fb.control(c?.method ?? '', [Validators.required, Validators.maxLength(200)]),
  });
}

/** A fibre needs its size: the linear density or the diameter. */
export const fibreSizeRequired: ValidatorFn = (g) => {
  const form = g as FibreForm;
  return form.controls.linearDensity.controls.value.value || form.controls.diameter.controls.value.value
    ? null
    : message('sizeRequired', 'Give the linear density (dtex, denier) or the fibre diameter.');
};

export function fibreForm(fb: NonNullableFormBuilder, d?: FibreData) {
  return fb.group(
    {
      polymer: fb.control(d?.polymer ?? '', [Validators.required, Validators.maxLength(120)]),
      density: propertyGroup(fb, d?.density, { required: true, source: 'handbook', range: RANGES.fibreDensity }),
      linearDensity: propertyGroup(fb, d?.linearDensity, { source: 'supplier-datasheet', range: RANGES.linearDensity }),
      diameter: propertyGroup(fb, d?.diameter, { range: RANGES.fibreDiameter }),
      shapeFactor: propertyGroup(fb, d?.shapeFactor, { source: 'estimate', range: RANGES.shapeFactor }),
      finish: fb.control(d?.finish ?? '', Validators.maxLength(200)),
      contactAngles: fb.array((d?.contactAngles ?? []).map((c) => contactAngleGroup(fb, c))),
    },
    { validators: [fibreSizeRequired] },
  );
}
export type FibreForm = ReturnType<typeof fibreForm>;

export function toFibreData(f: FibreForm): FibreData {
  const c = f.controls;
  const opt = (g: PropertyGroup) => toPropertyValue(g);
  return {
    polymer: c.polymer.value.trim(),
    density: toPropertyValue(c.density)!,
    ...(opt(c.linearDensity) ? { linearDensity: opt(c.linearDensity) } : {}),
    ...(opt(c.diameter) ? { diameter: opt(c.diameter) } : {}),
    ...(opt(c.shapeFactor) ? { shapeFactor: opt(c.shapeFactor) } : {}),
    ...(c.finish.value.trim() ? { finish: c.finish.value.trim() } : {}),
    contactAngles: c.contactAngles.controls.map((a) => ({
      liquid: a.controls.liquid.value.trim(),
      angle: toPropertyValue(a.controls.angle)!,
      method: a.controls.method.value.trim(),
    })),
  };
}

// ——— webs ———

export type BlendGroup = FormGroup<{ fibreId: FormControl<number | null>; fibreName: FormControl<string>; percent: FormControl<number | null> }>;

export function blendGroup(fb: NonNullableFormBuilder, p?: BlendPart): BlendGroup {
  return fb.group({
    fibreId: fb.control<number | null>(p?.fibreId ?? null),
    fibreName: fb.control(p?.fibreName ?? '', [Validators.required, Validators.maxLength(200)]),
    percent: fb.control<number | null>(p ? Number((p.massFraction * 100).toPrecision(6)) : null, [Validators.required, Validators.min(0.01), Validators.max(100)]),
  });
}

/** Mass fractions add up to 100 % (± 0.5 %, rounded percentages). */
export const blendAddsUp: ValidatorFn = (a) => {
  const parts = (a as FormArray<BlendGroup>).controls;
  if (parts.length === 0) return message('blendEmpty', 'Add at least one fibre.');
  const sum = parts.reduce((s, p) => s + (p.controls.percent.value ?? 0), 0);
  return Math.abs(sum - 100) > 0.5 ? message('blendSum', `The shares add up to ${Number(sum.toFixed(2))} %, not 100 %.`) : null;
};

export type PermeabilityMode = 'none' | 'measured' | 'correlation';
export type PermeabilityGroup = FormGroup<{
  mode: FormControl<PermeabilityMode>;
  value: PropertyGroup;
  correlation: FormControl<PermeabilityCorrelation>;
}>;

const permeabilityValid: ValidatorFn = (g) => {
  const p = g as PermeabilityGroup;
  return p.controls.mode.value === 'measured' && !p.controls.value.controls.value.value
    ? message('permeabilityValue', 'Give the measured permeability, or choose a correlation.')
    : null;
};

export function permeabilityGroup(fb: NonNullableFormBuilder, p?: PermeabilityData): PermeabilityGroup {
  return fb.group(
    {
      mode: fb.control<PermeabilityMode>(p?.mode ?? 'none'),
      value: propertyGroup(fb, p?.mode === 'measured' ? p.value : undefined, { range: RANGES.permeability }),
      correlation: fb.control<PermeabilityCorrelation>(p?.mode === 'correlation' ? p.correlation : 'kozeny-carman'),
    },
    { validators: [permeabilityValid] },
  );
}

function toPermeability(g: PermeabilityGroup): PermeabilityData | undefined {
  const mode = g.controls.mode.value;
  if (mode === 'measured') {
    const value = toPropertyValue(g.controls.value);
    return value ? { mode, value } : undefined;
  }
  return mode === 'correlation' ? { mode, correlation: g.controls.correlation.value } : undefined;
}

/** A thickness means little without the pressure it was measured under; a measured porosity needs its value. */
export const webRules: ValidatorFn = (g) => {
  const w = (g as WebForm).controls;
  if (w.thickness.controls.value.value && !w.thicknessPressure.controls.value.value) {
    return message('thicknessPressure', 'Give the pressure at which the thickness was measured.');
  }
  if (w.porosityMode.value === 'measured' && !w.porosity.controls.value.value) {
    return message('porosity', 'Give the measured porosity, or choose "computed".');
  }
  if (w.hasSap.value && !w.sap.controls.content.controls.value.value) {
    return message('sapContent', 'Give the superabsorbent content.');
  }
  return null;
};

export function webForm(fb: NonNullableFormBuilder, d?: WebData) {
  const sap = d?.sap;
  return fb.group(
    {
      webKind: fb.control<WebKind>(d?.webKind ?? 'airlaid', Validators.required),
      blend: fb.array((d?.blend ?? [undefined]).map((p) => blendGroup(fb, p)), [blendAddsUp]),
      basisWeight: propertyGroup(fb, d?.basisWeight, { required: true, range: RANGES.basisWeight }),
      thickness: propertyGroup(fb, d?.thickness, { range: RANGES.thickness }),
      thicknessPressure: propertyGroup(fb, d?.thicknessPressure, { range: RANGES.pressure, exclusive: { min: true } }),
      porosityMode: fb.control<'measured' | 'computed'>(d?.porosityMode ?? 'computed'),
      porosity: propertyGroup(fb, d?.porosityMode === 'measured' ? d.porosity : undefined, { range: RANGES.fraction, exclusive: { min: true, max: true } }),
      meanFlowPoreSize: propertyGroup(fb, d?.meanFlowPoreSize, { range: RANGES.poreSize }),
      permeabilityInPlane: permeabilityGroup(fb, d?.permeabilityInPlane),
      permeabilityThroughPlane: permeabilityGroup(fb, d?.permeabilityThroughPlane),
      hasSap: fb.control(!!sap),
      sap: fb.group({
        content: propertyGroup(fb, sap?.content, { range: RANGES.fraction }),
        freeSwellCapacity: propertyGroup(fb, sap?.freeSwellCapacity, { source: 'supplier-datasheet', range: RANGES.capacity }),
        centrifugeRetentionCapacity: propertyGroup(fb, sap?.centrifugeRetentionCapacity, { source: 'supplier-datasheet', range: RANGES.capacity }),
        absorbencyUnderLoad: propertyGroup(fb, sap?.absorbencyUnderLoad, { source: 'supplier-datasheet', range: RANGES.capacity }),
        absorbencyUnderLoadPressure: propertyGroup(fb, sap?.absorbencyUnderLoadPressure, { source: 'supplier-datasheet', range: RANGES.pressure, exclusive: { min: true } }),
        testLiquid: fb.control(sap?.testLiquid ?? '0.9 % NaCl saline'),
      }),
    },
    { validators: [webRules] },
  );
}
export type WebForm = ReturnType<typeof webForm>;

/** The web's data from the form; the distribution and curves come from uploads and are kept as they are. */
export function toWebData(f: WebForm, keep: Pick<WebData, 'poreSizeDistribution' | 'curves'> = { curves: [] }): WebData {
  const c = f.controls;
  const opt = (g: PropertyGroup) => toPropertyValue(g);
  const s = c.sap.controls;
  return {
    webKind: c.webKind.value,
    blend: c.blend.controls.map((p) => ({
      ...(p.controls.fibreId.value !== null ? { fibreId: p.controls.fibreId.value } : {}),
      fibreName: p.controls.fibreName.value.trim(),
      massFraction: (p.controls.percent.value ?? 0) / 100,
    })),
    basisWeight: toPropertyValue(c.basisWeight)!,
    ...(opt(c.thickness) ? { thickness: opt(c.thickness) } : {}),
    ...(opt(c.thicknessPressure) ? { thicknessPressure: opt(c.thicknessPressure) } : {}),
    porosityMode: c.porosityMode.value,
    ...(c.porosityMode.value === 'measured' && opt(c.porosity) ? { porosity: opt(c.porosity) } : {}),
    ...(opt(c.meanFlowPoreSize) ? { meanFlowPoreSize: opt(c.meanFlowPoreSize) } : {}),
    ...(toPermeability(c.permeabilityInPlane) ? { permeabilityInPlane: toPermeability(c.permeabilityInPlane) } : {}),
    ...(toPermeability(c.permeabilityThroughPlane) ? { permeabilityThroughPlane: toPermeability(c.permeabilityThroughPlane) } : {}),
    ...(c.hasSap.value && opt(s.content)
      ? {
          sap: {
            content: opt(s.content)!,
            ...(opt(s.freeSwellCapacity) ? { freeSwellCapacity: opt(s.freeSwellCapacity) } : {}),
            ...(opt(s.centrifugeRetentionCapacity) ? { centrifugeRetentionCapacity: opt(s.centrifugeRetentionCapacity) } : {}),
            ...(opt(s.absorbencyUnderLoad) ? { absorbencyUnderLoad: opt(s.absorbencyUnderLoad) } : {}),
            ...(opt(s.absorbencyUnderLoadPressure) ? { absorbencyUnderLoadPressure: opt(s.absorbencyUnderLoadPressure) } : {}),
            ...(s.testLiquid.value.trim() ? { testLiquid: s.testLiquid.value.trim() } : {}),
          },
        }
      : {}),
    ...(keep.poreSizeDistribution ? { poreSizeDistribution: keep.poreSizeDistribution } : {}),
    curves: keep.curves,
  };
}

// ——— liquids ———

export type TableRowGroup = FormGroup<{ temperature: FormControl<number | null>; value: FormControl<number | null> }>;
export type LiquidPropertyGroup = FormGroup<{
  mode: FormControl<'constant' | 'table'>;
  value: PropertyGroup;
  temperature: FormControl<Quantity | null>;
  unit: FormControl<string>;
  temperatureUnit: FormControl<string>;
  source: FormControl<PropertySource>;
  points: FormArray<TableRowGroup>;
}>;

function tableRow(fb: NonNullableFormBuilder, t: number | null, v: number | null): TableRowGroup {
  // Filled-in cells are checked by the property's validator, and only while it is a table.
  return fb.group({ temperature: fb.control<number | null>(t), value: fb.control<number | null>(v, Validators.min(0)) });
}

export function addTableRow(fb: NonNullableFormBuilder, g: LiquidPropertyGroup): void {
  g.controls.points.push(tableRow(fb, null, null));
}

function liquidPropertyValid(): ValidatorFn {
  return (g: AbstractControl) => {
    const p = (g as LiquidPropertyGroup).controls;
    if (p.mode.value === 'constant') {
      if (!p.value.controls.value.value) return message('constant', 'Give the value.');
      if (!p.temperature.value) return message('temperature', 'Give the temperature the value is for.');
      return null;
    }
    const rows = p.points.controls;
    if (rows.length < 2) return message('tableRows', 'A table needs at least two temperatures.');
    const ts = rows.map((r) => r.controls.temperature.value);
    if (ts.some((t) => t === null) || rows.some((r) => r.controls.value.value === null)) return message('tableCells', 'Fill every cell of the table.');
    for (let i = 1; i < ts.length; i++) if (!(ts[i]! > ts[i - 1]!)) return message('tableOrder', 'Temperatures must increase from row to row.');
    return null;
  };
}

export function liquidPropertyGroup(fb: NonNullableFormBuilder, dimension: Dimension, range: readonly [number, number], p?: LiquidPropertyData): LiquidPropertyGroup {
  const table = p?.mode === 'table' ? p : undefined;
  const constant = p?.mode === 'constant' ? p : undefined;
  const unit = table?.unit ?? DISPLAY_UNITS[dimension][0];
  const temperatureUnit = table?.temperatureUnit ?? 'degC';
  return fb.group(
    {
      mode: fb.control<'constant' | 'table'>(p?.mode ?? 'constant'),
      value: propertyGroup(fb, constant?.value, { range }),
      temperature: fb.control<Quantity | null>(constant ? { si: constant.temperature.si, unit: constant.temperature.unit } : { si: 293.15, unit: 'degC' }),
      unit: fb.control(unit),
      temperatureUnit: fb.control(temperatureUnit),
      source: fb.control<PropertySource>(table?.source ?? 'measured'),
      points: fb.array(
        table
          ? table.points.map((q) => tableRow(fb, Number(fromSI(q.temperature, temperatureUnit).toPrecision(6)), Number(fromSI(q.value, unit).toPrecision(6))))
          : [tableRow(fb, null, null), tableRow(fb, null, null)],
      ),
    },
    { validators: [liquidPropertyValid()] },
  );
}

function toLiquidProperty(g: LiquidPropertyGroup): LiquidPropertyData {
  const p = g.controls;
  if (p.mode.value === 'constant') {
    const t = p.temperature.value!;
    return { mode: 'constant', value: toPropertyValue(p.value)!, temperature: { si: t.si, unit: t.unit, source: 'measured' } };
  }
  return {
    mode: 'table',
    unit: p.unit.value,
    temperatureUnit: p.temperatureUnit.value,
    source: p.source.value,
    points: p.points.controls.map((r) => ({
      temperature: toSI(r.controls.temperature.value!, p.temperatureUnit.value),
      value: toSI(r.controls.value.value!, p.unit.value),
    })),
  };
}

export function liquidForm(fb: NonNullableFormBuilder, d?: LiquidData) {
  return fb.group({
    surfaceTension: liquidPropertyGroup(fb, 'surfaceTension', RANGES.surfaceTension, d?.surfaceTension),
    viscosity: liquidPropertyGroup(fb, 'viscosity', RANGES.viscosity, d?.viscosity),
    density: liquidPropertyGroup(fb, 'density', RANGES.liquidDensity, d?.density),
    flammable: fb.control(d?.flammable ?? false),
    composition: fb.control(d?.composition ?? '', Validators.maxLength(300)),
  });
}
export type LiquidForm = ReturnType<typeof liquidForm>;

export function toLiquidData(f: LiquidForm): LiquidData {
  const c = f.controls;
  return {
    surfaceTension: toLiquidProperty(c.surfaceTension),
    viscosity: toLiquidProperty(c.viscosity),
    density: toLiquidProperty(c.density),
    flammable: c.flammable.value,
    ...(c.composition.value.trim() ? { composition: c.composition.value.trim() } : {}),
  };
}

// ——— server errors on the form ———

/**
 * Puts a 422's issues on the controls they name (`data.basisWeight.si` → `basisWeight.value`); returns the
 * issues no control was found for, to show in a list.
 */
export function applyServerIssues(root: AbstractControl, dataGroup: AbstractControl, issues: readonly { field: string; message: string }[]): string[] {
  const unplaced: string[] = [];
  for (const issue of issues) {
    const inData = issue.field.startsWith('data.');
    let parts = (inData ? issue.field.slice(5) : issue.field).split('.');
    if (['si', 'unit'].includes(parts[parts.length - 1])) parts = [...parts.slice(0, -1), 'value'];
    const base = inData ? dataGroup : root;
    let control: AbstractControl | null = null;
    for (let n = parts.length; n > 0 && !control; n--) control = base.get(parts.slice(0, n).join('.'));
    if (control && control !== base) {
      control.setErrors({ ...(control.errors ?? {}), server: { message: issue.message } });
      control.markAsTouched();
    } else {
      unplaced.push(`${issue.field}: ${issue.message}`);
    }
  }
  return unplaced;
}
