import { FormControl, FormGroup, NonNullableFormBuilder, Validators } from '@angular/forms';
import type { Quantity } from '../../shared/unit-input/unit-input';
import {
  DISPLAY_UNITS,
  TOLERANCE_FIELDS,
  type Dimension,
  type PermeabilityCorrelationId,
  type PinnedMaterial,
  type StructureInputs,
  type Tolerance,
  type ToleranceParameter,
  type UserLiquidDefinition,
  type VariantConfiguration,
  type VariantInputs,
} from 'wick-core';

const deg = (d: number) => (d * Math.PI) / 180;
const C = (c: number) => c + 273.15;

/** An SI value as the unit-aware control holds it, in the given or the dimension's usual unit. */
export function q(si: number | null | undefined, dimension: Dimension, unit?: string): Quantity | null {
  return si === null || si === undefined ? null : { si, unit: unit ?? DISPLAY_UNITS[dimension][0] };
}

/** The SI value of a control (null when empty). */
export const si = (x: Quantity | null): number | null => (x === null ? null : x.si);

/** One tolerance row of the form: ± in SI about the field's nominal value. */
export type ToleranceRow = FormGroup<{
  parameter: FormControl<ToleranceParameter>;
  kind: FormControl<Tolerance['kind']>;
  plusMinus: FormControl<Quantity | null>;
  /** The tolerance as saved, kept exactly while the row and the nominal value are unchanged. */
  original: FormControl<Tolerance | null>;
}>;

/**
 * The variant form, values in SI. Choices that are not plain fields (the pinned web and liquid, a library
 * liquid's definition, a pore-size distribution and value sources) live beside it in the editor.
 */
export function variantForm(fb: NonNullableFormBuilder) {
  const n = (v: number | null, dimension: Dimension, unit?: string) => fb.control<Quantity | null>(q(v, dimension, unit));
  return fb.group({
    name: fb.control('', [Validators.required, Validators.maxLength(200)]),
    notes: fb.control('', Validators.maxLength(5000)),
    configuration: fb.control<VariantConfiguration>('vertical-strip'),
    structure: fb.group({
      sizeBy: fb.control<'diameter' | 'linearDensity'>('linearDensity'),
      fibreDiameter: n(20e-6, 'length', 'um'),
      linearDensity: n(1.7e-7, 'linearDensity'),
      fibreDensity: n(1380, 'density', 'g/cm^3'),
      shapeFactor: n(1, 'dimensionless'),
      basisWeight: n(0.05, 'basisWeight'),
      thickness: n(0.001, 'length', 'mm'),
      porosityMeasured: fb.control(false),
      porosity: n(0.95, 'fraction', '1'),
      contactAngle: n(deg(50), 'angle'),
      pcFrom: fb.control<'hydraulic-radius' | 'pore-diameter'>('hydraulic-radius'),
      poreDiameter: n(null, 'length', 'um'),
      permeabilityMode: fb.control<'correlation' | 'measured'>('correlation'),
      correlation: fb.control<PermeabilityCorrelationId>('tomadakis-robertson-2d-in-plane'),
      kozenyConstant: n(5, 'dimensionless'),
      permeability: n(1e-10, 'permeability'),
    }),
    capillary: fb.group({ radius: n(0.0003, 'length', 'mm'), contactAngle: n(0, 'angle'), tilt: n(deg(90), 'angle') }),
    liquid: fb.group({
      source: fb.control<'built-in' | 'library'>('built-in'),
      builtIn: fb.control('water'),
      libraryId: fb.control<number | null>(null),
      temperature: n(C(23), 'temperature'),
    }),
    dimensions: fb.group({
      width: n(0.025, 'length', 'mm'),
      length: n(null, 'length', 'mm'),
      tilt: n(deg(45), 'angle'),
      sourceRadius: n(0.01, 'length', 'mm'),
      duration: n(600, 'time'),
    }),
    checkpoints: fb.group({
      heights: fb.control<number[]>([0.01, 0.02, 0.03]),
      times: fb.control<number[]>([10, 30, 60, 300, 600]),
    }),
    tolerances: fb.array<ToleranceRow>([]),
    humidity: n(null, 'fraction', '%'),
  });
}

export type VariantForm = ReturnType<typeof variantForm>;
export type VariantFormValue = ReturnType<VariantForm['getRawValue']>;

export function toleranceRow(
  fb: NonNullableFormBuilder,
  parameter: ToleranceParameter,
  kind: Tolerance['kind'],
  plusMinus: number | null,
  original: Tolerance | null = null,
): ToleranceRow {
  return fb.group({
    parameter: fb.control(parameter),
    kind: fb.control(kind),
    plusMinus: fb.control<Quantity | null>(q(plusMinus, TOLERANCE_FIELDS[parameter].dimension)),
    original: fb.control<Tolerance | null>(original),
  });
}

/** Whether a saved tolerance still says what the row and the nominal value say (then it is kept bit for bit). */
function stillSays(t: Tolerance, kind: Tolerance['kind'], nominal: number, plusMinus: number): boolean {
  if (t.kind !== kind || plusMinusOf(t) !== plusMinus) return false;
  if (t.kind === 'normal') return t.mean === undefined;
  const centre = t.kind === 'triangular' && t.mode !== undefined ? t.mode : (t.min + t.max) / 2;
  return Math.abs(centre - nominal) <= 1e-12 * Math.abs(nominal);
}

/** Beside the form: what comes from the library and what cannot be typed into a field. */
export interface VariantExtras {
  readonly web: PinnedMaterial | null;
  readonly liquidDefinition: UserLiquidDefinition | null;
  readonly liquidPin: PinnedMaterial | null;
  readonly poreSize: StructureInputs['poreSize'] | null;
  readonly sources: Readonly<Record<string, string>>;
}

export const NO_EXTRAS: VariantExtras = { web: null, liquidDefinition: null, liquidPin: null, poreSize: null, sources: {} };

/** Physical bounds a normal tolerance is truncated to, so samples stay meaningful. */
const BOUNDS: Partial<Record<ToleranceParameter, { lower: number; upper?: number }>> = {
  porosity: { lower: 0, upper: 1 },
  contactAngle: { lower: 0, upper: Math.PI },
  tilt: { lower: 0, upper: Math.PI / 2 },
};

/** The nominal SI value each toleranced parameter has in the form (undefined when the variant does not use it). */
export function nominalOf(v: VariantFormValue, parameter: ToleranceParameter): number | undefined {
  const s = v.structure;
  const cap = v.configuration === 'capillary';
  const table: Record<ToleranceParameter, Quantity | null | undefined> = {
    fibreDiameter: !cap && s.sizeBy === 'diameter' ? s.fibreDiameter : undefined,
    linearDensity: !cap && s.sizeBy === 'linearDensity' ? s.linearDensity : undefined,
    fibreDensity: cap ? undefined : s.fibreDensity,
    basisWeight: cap ? undefined : s.basisWeight,
    thickness: cap ? undefined : s.thickness,
    porosity: !cap && s.porosityMeasured ? s.porosity : undefined,
    contactAngle: cap ? v.capillary.contactAngle : s.contactAngle,
    permeability: !cap && s.permeabilityMode === 'measured' ? s.permeability : undefined,
    poreDiameter: !cap && s.pcFrom === 'pore-diameter' ? s.poreDiameter : undefined,
    capillaryRadius: cap ? v.capillary.radius : undefined,
    surfaceTension: undefined,
    viscosity: undefined,
    liquidDensity: undefined,
    tilt: cap ? v.capillary.tilt : v.configuration === 'inclined-strip' ? v.dimensions.tilt : undefined,
    sourceRadius: v.configuration === 'radial-spread' ? v.dimensions.sourceRadius : undefined,
    width: v.configuration.endsWith('-strip') ? v.dimensions.width : undefined,
  };
  const x = table[parameter];
  return x === null || x === undefined ? undefined : x.si;
}

/** Parameters a tolerance can be put on for this form state (liquid properties need a nominal the form lacks). */
export function tolerableParameters(v: VariantFormValue): ToleranceParameter[] {
  return (Object.keys(TOLERANCE_FIELDS) as ToleranceParameter[]).filter((p) => nominalOf(v, p) !== undefined);
}

/** A ± row as a tolerance of the tolerance family: normal sd = ±, uniform and triangular nominal ± (mode nominal). */
export function toleranceFrom(kind: Tolerance['kind'], nominal: number, plusMinus: number, parameter: ToleranceParameter): Tolerance {
  const b = BOUNDS[parameter] ?? { lower: 0 };
  if (kind === 'normal') return { kind, sd: plusMinus, lower: b.lower, ...(b.upper !== undefined ? { upper: b.upper } : {}) };
  if (kind === 'uniform') return { kind, min: nominal - plusMinus, max: nominal + plusMinus };
  return { kind, min: nominal - plusMinus, max: nominal + plusMinus, mode: nominal };
}

/** ± of a stored tolerance, for showing it again in the form. */
export function plusMinusOf(t: Tolerance): number {
  return t.kind === 'normal' ? t.sd : (t.max - t.min) / 2;
}

const num = (x: Quantity | null): number | undefined => (x === null ? undefined : x.si);
/** A required SI number: null goes through so the evaluator says "… is required". */
const req = (x: Quantity | null): number => (x === null ? (null as unknown as number) : x.si);

/**
 * The form (plus extras) as variant inputs. Not checked here: the evaluator checks everything and names the
 * field, so the form shows one kind of message for every problem.
 */
export function toInputs(v: VariantFormValue, extras: VariantExtras): VariantInputs {
  const s = v.structure;
  const cap = v.configuration === 'capillary';
  const tolerances: Partial<Record<ToleranceParameter, Tolerance>> = {};
  for (const row of v.tolerances) {
    const nominal = nominalOf(v, row.parameter);
    if (nominal === undefined || row.plusMinus === null) continue;
    tolerances[row.parameter] =
      row.original && stillSays(row.original, row.kind, nominal, row.plusMinus.si)
        ? row.original
        : toleranceFrom(row.kind, nominal, row.plusMinus.si, row.parameter);
  }
  const structure: StructureInputs | undefined = cap
    ? undefined
    : ({
        ...(extras.web ? { web: extras.web } : {}),
        ...(s.sizeBy === 'diameter' ? { fibreDiameter: num(s.fibreDiameter) } : { linearDensity: num(s.linearDensity) }),
        fibreDensity: req(s.fibreDensity),
        ...(s.shapeFactor !== null && s.shapeFactor.si !== 1 ? { shapeFactor: s.shapeFactor.si } : {}),
        basisWeight: req(s.basisWeight),
        thickness: req(s.thickness),
        ...(s.porosityMeasured ? { porosity: req(s.porosity) } : {}),
        contactAngle: req(s.contactAngle),
        capillaryPressureFrom: s.pcFrom,
        ...(s.pcFrom === 'pore-diameter' || s.poreDiameter !== null ? { poreDiameter: num(s.poreDiameter) } : {}),
        permeability:
          s.permeabilityMode === 'measured'
            ? { mode: 'measured', value: req(s.permeability) }
            : { mode: 'correlation', correlation: s.correlation, ...(s.correlation === 'kozeny-carman' ? { kozenyConstant: num(s.kozenyConstant) } : {}) },
        ...(extras.poreSize ? { poreSize: extras.poreSize } : {}),
        ...(Object.keys(extras.sources).length ? { sources: extras.sources } : {}),
      } as StructureInputs);
  const d = v.dimensions;
  const libraryLiquid = v.liquid.source === 'library' && extras.liquidDefinition !== null;
  return {
    configuration: v.configuration,
    ...(structure ? { structure } : {}),
    ...(cap ? { capillary: { radius: req(v.capillary.radius), contactAngle: req(v.capillary.contactAngle) } } : {}),
    liquid: {
      ref: libraryLiquid ? extras.liquidDefinition! : v.liquid.builtIn,
      ...(libraryLiquid && extras.liquidPin ? { pinned: extras.liquidPin } : {}),
      temperature: req(v.liquid.temperature),
    } as VariantInputs['liquid'],
    dimensions: {
      ...(v.configuration.endsWith('-strip') ? { width: num(d.width), ...(d.length !== null ? { length: d.length.si } : {}) } : {}),
      ...(v.configuration === 'inclined-strip' ? { tilt: num(d.tilt) } : {}),
      ...(cap && v.capillary.tilt !== null && v.capillary.tilt.si !== Math.PI / 2 ? { tilt: v.capillary.tilt.si } : {}),
      ...(v.configuration === 'radial-spread' ? { sourceRadius: num(d.sourceRadius) } : {}),
      duration: req(d.duration),
    } as VariantInputs['dimensions'],
    checkpoints: { heights: v.checkpoints.heights, times: v.checkpoints.times },
    ...(Object.keys(tolerances).length ? { tolerances } : {}),
    ...(v.humidity !== null ? { humidity: v.humidity.si } : {}),
  };
}

/** Saved inputs back into the form's shape (and the extras beside it). */
export function fromInputs(inputs: VariantInputs): {
  value: Partial<VariantFormValue>;
  extras: VariantExtras;
  tolerances: { parameter: ToleranceParameter; kind: Tolerance['kind']; plusMinus: number; original: Tolerance }[];
} {
  const s = inputs.structure;
  const libraryLiquid = typeof inputs.liquid.ref !== 'string';
  const value: Partial<VariantFormValue> = {
    configuration: inputs.configuration,
    liquid: {
      source: libraryLiquid ? 'library' : 'built-in',
      builtIn: typeof inputs.liquid.ref === 'string' ? inputs.liquid.ref : 'water',
      libraryId: inputs.liquid.pinned?.id ?? null,
      temperature: q(inputs.liquid.temperature, 'temperature'),
    },
    dimensions: {
      width: q(inputs.dimensions.width ?? 0.025, 'length', 'mm'),
      length: q(inputs.dimensions.length, 'length', 'mm'),
      tilt: q(inputs.configuration === 'inclined-strip' ? inputs.dimensions.tilt : deg(45), 'angle'),
      sourceRadius: q(inputs.dimensions.sourceRadius ?? 0.01, 'length', 'mm'),
      duration: q(inputs.dimensions.duration, 'time'),
    },
    checkpoints: { heights: [...inputs.checkpoints.heights], times: [...inputs.checkpoints.times] },
    humidity: q(inputs.humidity, 'fraction', '%'),
  };
  if (s) {
    value.structure = {
      sizeBy: s.fibreDiameter !== undefined ? 'diameter' : 'linearDensity',
      fibreDiameter: q(s.fibreDiameter ?? 20e-6, 'length', 'um'),
      linearDensity: q(s.linearDensity ?? 1.7e-7, 'linearDensity'),
      fibreDensity: q(s.fibreDensity, 'density', 'g/cm^3'),
      shapeFactor: q(s.shapeFactor ?? 1, 'dimensionless'),
      basisWeight: q(s.basisWeight, 'basisWeight'),
      thickness: q(s.thickness, 'length', 'mm'),
      porosityMeasured: s.porosity !== undefined,
      porosity: q(s.porosity ?? 0.95, 'fraction', '1'),
      contactAngle: q(s.contactAngle, 'angle'),
      pcFrom: s.capillaryPressureFrom ?? 'hydraulic-radius',
      poreDiameter: q(s.poreDiameter, 'length', 'um'),
      permeabilityMode: s.permeability.mode,
      correlation: s.permeability.mode === 'correlation' ? s.permeability.correlation : 'tomadakis-robertson-2d-in-plane',
      kozenyConstant: q(s.permeability.mode === 'correlation' ? (s.permeability.kozenyConstant ?? 5) : 5, 'dimensionless'),
      permeability: q(s.permeability.mode === 'measured' ? s.permeability.value : 1e-10, 'permeability'),
    };
  }
  if (inputs.capillary) {
    value.capillary = {
      radius: q(inputs.capillary.radius, 'length', 'mm'),
      contactAngle: q(inputs.capillary.contactAngle, 'angle'),
      tilt: q(inputs.dimensions.tilt ?? deg(90), 'angle'),
    };
  }
  const tolerances = Object.entries(inputs.tolerances ?? {})
    .filter((e): e is [ToleranceParameter, Tolerance] => e[1] !== undefined)
    .map(([parameter, t]) => ({ parameter, kind: t.kind, plusMinus: plusMinusOf(t), original: t }));
  return {
    value,
    extras: {
      web: s?.web ?? null,
      liquidDefinition: libraryLiquid ? (inputs.liquid.ref as UserLiquidDefinition) : null,
      liquidPin: inputs.liquid.pinned ?? null,
      poreSize: s?.poreSize ?? null,
      sources: s?.sources ?? {},
    },
    tolerances,
  };
}

