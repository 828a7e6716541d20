import { NonNullableFormBuilder, Validators, type AbstractControl } from '@angular/forms';
import type { Quantity } from '../../../shared/unit-input/unit-input';
import { q, si } from '../variant-form';
import {
  STACK_DEFAULTS,
  type Dimension,
  type PermeabilityCorrelationId,
  type PinnedMaterial,
  type StackLayerFromLibrary,
  type StackLayerInputs,
  type StackRetentionMode,
  type StackVariantInputs,
  type StructureInputs,
  type UserLiquidDefinition,
} from 'wick-core';

const deg = (d: number) => (d * Math.PI) / 180;

/** One layer of the stack form, numbers as quantities (SI + unit shown). The van Genuchten α is typed as 1/α, a pressure. */
export function layerGroup(fb: NonNullableFormBuilder) {
  const n = (v: number | null, dimension: Dimension, unit?: string) => fb.control<Quantity | null>(q(v, dimension, unit));
  return fb.group({
    name: fb.control('Layer', [Validators.required, Validators.maxLength(80)]),
    web: fb.control<PinnedMaterial | null>(null),
    sources: fb.control<Readonly<Record<string, string>>>({}),
    poreSize: fb.control<StructureInputs['poreSize'] | null>(null),
    notes: fb.control<readonly string[]>([]),
    sizeBy: fb.control<'diameter' | 'linearDensity'>('diameter'),
    fibreDiameter: n(20e-6, 'length', 'um'),
    linearDensity: n(null, 'linearDensity'),
    fibreDensity: n(1380, 'density', 'g/cm^3'),
    basisWeight: n(0.05, 'basisWeight'),
    thickness: n(1e-3, 'length', 'mm'),
    porosityMeasured: fb.control(false),
    porosity: n(0.9, 'fraction'),
    contactAngle: n(deg(50), 'angle'),
    permeabilityMode: fb.control<'measured' | 'correlation'>('correlation'),
    permeability: n(1e-10, 'permeability'),
    correlation: fb.control<PermeabilityCorrelationId>('tomadakis-robertson-2d-through-plane'),
    retentionMode: fb.control<StackRetentionMode>('van-genuchten'),
    vgPressure: n(1000, 'pressure'),
    vgN: n(3, 'dimensionless'),
    entryPressure: n(500, 'pressure'),
    lambda: n(2, 'dimensionless'),
    initialSaturation: n(STACK_DEFAULTS.initialSaturation, 'fraction'),
    residualContent: n(null, 'fraction'),
  });
}

export type LayerGroup = ReturnType<typeof layerGroup>;
export type LayerValue = ReturnType<LayerGroup['getRawValue']>;

/** The stack form, numbers as quantities (SI + unit shown). */
export function stackForm(fb: NonNullableFormBuilder) {
  const n = (v: number | null, dimension: Dimension, unit?: string) => fb.control<Quantity | null>(q(v, dimension, unit));
  return fb.group({
    name: fb.control('', [Validators.required, Validators.maxLength(200)]),
    notes: fb.control('', Validators.maxLength(5000)),
    layers: fb.array<LayerGroup>([]),
    liquid: fb.group({
      source: fb.control<'built-in' | 'library'>('built-in'),
      builtIn: fb.control('saline-0.9'),
      libraryId: fb.control<number | null>(null),
      definition: fb.control<UserLiquidDefinition | null>(null),
      pinned: fb.control<PinnedMaterial | null>(null),
      temperature: n(296.15, 'temperature', 'degC'),
    }),
    insult: fb.group({
      volume: n(15e-6, 'volume', 'mL'),
      rate: n(5e-6, 'volumeFlowRate', 'mL/s'),
      area: n(80e-4, 'area', 'cm^2'),
      count: n(3, 'dimensionless'),
      interval: n(300, 'time', 'min'),
    }),
    duration: n(900, 'time', 'min'),
    inclination: n(0, 'angle', 'deg'),
    bottom: fb.control<'no-flow' | 'free-drainage'>('no-flow'),
    cells: n(STACK_DEFAULTS.cells, 'dimensionless'),
    upperLayers: n(STACK_DEFAULTS.upperLayers, 'dimensionless'),
  });
}

export type StackForm = ReturnType<typeof stackForm>;
export type StackFormValue = ReturnType<StackForm['getRawValue']>;

/** An SI value for the inputs: an empty field goes through as null for the evaluator to name. */
const v = (x: Quantity | null): number => si(x) as number;
const num = (x: Quantity | null): number | undefined => (x === null ? undefined : x.si);

function structureOf(l: LayerValue): StructureInputs {
  return {
    ...(l.web ? { web: l.web } : {}),
    ...(l.sizeBy === 'diameter' ? { fibreDiameter: num(l.fibreDiameter) } : { linearDensity: num(l.linearDensity) }),
    fibreDensity: v(l.fibreDensity),
    basisWeight: v(l.basisWeight),
    thickness: v(l.thickness),
    ...(l.porosityMeasured ? { porosity: v(l.porosity) } : {}),
    contactAngle: v(l.contactAngle),
    permeability: l.permeabilityMode === 'measured' ? { mode: 'measured', value: v(l.permeability) } : { mode: 'correlation', correlation: l.correlation },
    ...(l.poreSize ? { poreSize: l.poreSize } : {}),
    ...(Object.keys(l.sources).length ? { sources: l.sources } : {}),
  } as StructureInputs;
}

function retentionOf(l: LayerValue): StackLayerInputs['retention'] {
  switch (l.retentionMode) {
    case 'van-genuchten':
      // 1/α typed as a pressure; a missing or zero value goes through as NaN for the evaluator to name.
      return { mode: 'van-genuchten', alpha: l.vgPressure?.si ? 1 / l.vgPressure.si : Number.NaN, n: v(l.vgN) };
    case 'brooks-corey':
      return { mode: 'brooks-corey', entryPressure: v(l.entryPressure), lambda: v(l.lambda) };
    default:
      return { mode: 'pore-size' };
  }
}

/**
 * The form as stack-variant inputs. Not checked here: the evaluator checks everything and names the field
 * (`layers[1].structure.thickness`), so the form shows one kind of message for every problem.
 */
export function toStackInputs(f: StackFormValue): StackVariantInputs {
  const library = f.liquid.source === 'library' && f.liquid.definition !== null;
  const count = si(f.insult.count);
  return {
    configuration: 'stack',
    layers: f.layers.map((l) => ({
      name: l.name,
      structure: structureOf(l),
      retention: retentionOf(l),
      ...(l.residualContent !== null ? { residualContent: l.residualContent.si } : {}),
      ...(l.initialSaturation !== null && l.initialSaturation.si !== STACK_DEFAULTS.initialSaturation ? { initialSaturation: l.initialSaturation.si } : {}),
    })),
    liquid: {
      ref: library ? f.liquid.definition! : f.liquid.builtIn,
      ...(library && f.liquid.pinned ? { pinned: f.liquid.pinned } : {}),
      temperature: v(f.liquid.temperature),
    },
    insult: {
      volume: v(f.insult.volume),
      rate: v(f.insult.rate),
      area: v(f.insult.area),
      count: v(f.insult.count),
      ...(count !== null && count > 1 ? { interval: v(f.insult.interval) } : {}),
    },
    duration: v(f.duration),
    ...(f.inclination !== null && f.inclination.si !== 0 ? { inclination: f.inclination.si } : {}),
    ...(f.bottom !== 'no-flow' ? { bottom: f.bottom } : {}),
    // Defaults stay implicit, so saved inputs list only what the person chose.
    ...(f.cells !== null && f.cells.si !== STACK_DEFAULTS.cells ? { cells: f.cells.si } : {}),
    ...(f.upperLayers !== null && f.upperLayers.si !== STACK_DEFAULTS.upperLayers ? { upperLayers: f.upperLayers.si } : {}),
  };
}

/** One saved layer back into the form's shape. */
export function layerValue(layer: StackLayerInputs): Partial<LayerValue> {
  const s = layer.structure;
  const r = layer.retention;
  return {
    name: layer.name,
    web: s.web ?? null,
    sources: s.sources ?? {},
    poreSize: s.poreSize ?? null,
    sizeBy: s.fibreDiameter !== undefined ? 'diameter' : 'linearDensity',
    fibreDiameter: q(s.fibreDiameter, 'length', 'um'),
    linearDensity: q(s.linearDensity, 'linearDensity'),
    fibreDensity: q(s.fibreDensity, 'density', 'g/cm^3'),
    basisWeight: q(s.basisWeight, 'basisWeight'),
    thickness: q(s.thickness, 'length', 'mm'),
    porosityMeasured: s.porosity !== undefined,
    porosity: q(s.porosity ?? 0.9, 'fraction'),
    contactAngle: q(s.contactAngle, 'angle'),
    permeabilityMode: s.permeability.mode,
    permeability: q(s.permeability.mode === 'measured' ? s.permeability.value : 1e-10, 'permeability'),
    correlation: s.permeability.mode === 'correlation' ? s.permeability.correlation : 'tomadakis-robertson-2d-through-plane',
    retentionMode: r.mode,
    ...(r.mode === 'van-genuchten' ? { vgPressure: q(1 / r.alpha, 'pressure'), vgN: q(r.n, 'dimensionless') } : {}),
    ...(r.mode === 'brooks-corey' ? { entryPressure: q(r.entryPressure, 'pressure'), lambda: q(r.lambda, 'dimensionless') } : {}),
    initialSaturation: q(layer.initialSaturation ?? STACK_DEFAULTS.initialSaturation, 'fraction'),
    residualContent: q(layer.residualContent, 'fraction'),
  };
}

/**
 * A library web, mapped by wick-core for a stack, as form values. A web without a pore-size distribution keeps
 * the form's van Genuchten defaults, which the notes ask the person to replace.
 */
export function layerValueFromLibrary(mapped: StackLayerFromLibrary): Partial<LayerValue> {
  const { layer, notes } = mapped;
  const value = layerValue({
    ...layer,
    structure: { ...layer.structure, contactAngle: layer.structure.contactAngle ?? deg(50) },
    retention: layer.retention ?? { mode: 'van-genuchten', alpha: 1 / 1000, n: 3 },
  });
  return { ...value, notes };
}

/** Saved inputs into the form: its scalar fields patched, its layers rebuilt. */
export function patchStackForm(form: StackForm, fb: NonNullableFormBuilder, inputs: StackVariantInputs, name = '', notes = ''): void {
  form.controls.layers.clear({ emitEvent: false });
  for (const l of inputs.layers) {
    const g = layerGroup(fb);
    g.patchValue(layerValue(l), { emitEvent: false });
    form.controls.layers.push(g, { emitEvent: false });
  }
  const library = typeof inputs.liquid.ref !== 'string';
  form.patchValue({
    name,
    notes,
    liquid: {
      source: library ? 'library' : 'built-in',
      builtIn: typeof inputs.liquid.ref === 'string' ? inputs.liquid.ref : 'saline-0.9',
      libraryId: inputs.liquid.pinned?.id ?? null,
      definition: library ? (inputs.liquid.ref as UserLiquidDefinition) : null,
      pinned: inputs.liquid.pinned ?? null,
      temperature: q(inputs.liquid.temperature, 'temperature', 'degC'),
    },
    insult: {
      volume: q(inputs.insult.volume, 'volume', 'mL'),
      rate: q(inputs.insult.rate, 'volumeFlowRate', 'mL/s'),
      area: q(inputs.insult.area, 'area', 'cm^2'),
      count: q(inputs.insult.count, 'dimensionless'),
      interval: q(inputs.insult.interval ?? 300, 'time', 'min'),
    },
    duration: q(inputs.duration, 'time', 'min'),
    inclination: q(inputs.inclination ?? 0, 'angle', 'deg'),
    bottom: inputs.bottom ?? 'no-flow',
    cells: q(inputs.cells ?? STACK_DEFAULTS.cells, 'dimensionless'),
    upperLayers: q(inputs.upperLayers ?? STACK_DEFAULTS.upperLayers, 'dimensionless'),
  });
}


/** Retention paths of the evaluator → the layer's form control names. */
const RETENTION_CONTROLS: Readonly<Record<string, keyof LayerValue>> = {
  alpha: 'vgPressure',
  n: 'vgN',
  entryPressure: 'entryPressure',
  lambda: 'lambda',
  mode: 'retentionMode',
};

/**
 * The form control an evaluator field path names (`layers[1].structure.thickness`, `layers[0].retention.n`,
 * `insult.interval`, `liquid.temperature`), or null when the path names no single field.
 */
export function controlAt(form: StackForm, path: string): AbstractControl | null {
  const m = /^layers\[(\d+)\]\.(structure|retention)?\.?([A-Za-z]+)/.exec(path);
  if (m) {
    const layer = form.controls.layers.at(Number(m[1]));
    if (!layer) return null;
    const [, , part, name] = m;
    if (part === 'retention') return layer.get(RETENTION_CONTROLS[name] ?? '') ?? null;
    if (name === 'fibreDiameter' && layer.controls.sizeBy.value !== 'diameter') return layer.controls.linearDensity;
    return layer.get(name) ?? null;
  }
  if (path === 'liquid.ref') return form.controls.liquid.controls.source.value === 'library' ? form.controls.liquid.controls.libraryId : form.controls.liquid.controls.builtIn;
  return form.get(path) ?? null;
}
