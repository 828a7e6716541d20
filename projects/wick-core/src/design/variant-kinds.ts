/**
 * Both kinds of design variant behind one door: a single layer (`VariantInputs`, `evaluateVariant`) and a
 * layered stack (`StackVariantInputs`, `evaluateStackVariant`), told apart by `configuration === 'stack'`.
 * The server saves, re-runs, lists, compares and reports variants through these functions, so a stack is
 * computed by exactly the evaluator the browser's worker runs.
 */
import { SI_UNIT } from '../units/dimensions';
import { describeInputs, type VariantInputRow } from './describe';
import { evaluateVariant } from './evaluate';
import { keyFigures, type KeyFigure } from './key-figures';
import { readVariantInputs } from './read-inputs';
import { evaluateStackVariant, stackKeyFigures } from './stack-evaluate';
import { readStackVariantInputs } from './stack-read-inputs';
import {
  DEFAULT_STACK_OPTIONS,
  STACK_CONFIGURATION,
  STACK_DEFAULTS,
  STACK_RETENTION_LABELS,
  type EvaluateStackOptions,
  type StackVariantInputs,
  type StackVariantResults,
} from './stack-variant';
import {
  CONFIGURATION_LABELS,
  DEFAULT_VARIANT_OPTIONS,
  type EvaluateVariantOptions,
  type PinnedMaterial,
  type VariantConfiguration,
  type VariantInputs,
  type VariantResults,
} from './variant';

export type AnyVariantInputs = VariantInputs | StackVariantInputs;
export type AnyVariantResults = VariantResults | StackVariantResults;
export type AnyVariantConfiguration = VariantConfiguration | typeof STACK_CONFIGURATION;
export type AnyVariantOptions = Required<EvaluateVariantOptions> | Required<EvaluateStackOptions>;

/** Labels of every configuration, the stack included (lists, compare tables, reports). */
export const ANY_CONFIGURATION_LABELS: Readonly<Record<AnyVariantConfiguration, string>> = { ...CONFIGURATION_LABELS, stack: 'Layered stack' };

export function isStackInputs(inputs: AnyVariantInputs): inputs is StackVariantInputs {
  return inputs.configuration === STACK_CONFIGURATION;
}

export function isStackResults(results: AnyVariantResults): results is StackVariantResults {
  return results.configuration === STACK_CONFIGURATION;
}

/** Checks untrusted inputs of either kind. @throws DomainError naming the field path. */
export function readAnyVariantInputs(raw: unknown): AnyVariantInputs {
  const stack = typeof raw === 'object' && raw !== null && (raw as { configuration?: unknown }).configuration === STACK_CONFIGURATION;
  return stack ? readStackVariantInputs(raw) : readVariantInputs(raw);
}

/** Evaluates a saved variant with the options every saved variant of its kind uses (browser and server alike). */
export function evaluateAnyVariant(inputs: AnyVariantInputs): { results: AnyVariantResults; options: AnyVariantOptions } {
  if (isStackInputs(inputs)) return { results: evaluateStackVariant(inputs, DEFAULT_STACK_OPTIONS), options: { ...DEFAULT_STACK_OPTIONS } };
  return { results: evaluateVariant(inputs, DEFAULT_VARIANT_OPTIONS), options: { ...DEFAULT_VARIANT_OPTIONS } };
}

/** Key figures of either kind of result (lists, compare table, CSV, report). */
export function anyKeyFigures(results: AnyVariantResults): KeyFigure[] {
  return isStackResults(results) ? stackKeyFigures(results) : keyFigures(results);
}

/** The library revisions a variant pins: the web of each layer and the liquid. */
export function pinnedMaterials(inputs: AnyVariantInputs): PinnedMaterial[] {
  const webs = isStackInputs(inputs) ? inputs.layers.flatMap((l) => (l.structure.web ? [l.structure.web] : [])) : inputs.structure?.web ? [inputs.structure.web] : [];
  return inputs.liquid.pinned ? [...webs, inputs.liquid.pinned] : webs;
}

/**
 * Input rows of either kind; a stack lists each layer's structure as a layer variant's rows would (prefixed
 * with the layer's name), its retention curve, then the liquid, the insult and the run settings.
 */
export function describeAnyInputs(inputs: AnyVariantInputs, results?: AnyVariantResults): VariantInputRow[] {
  if (!isStackInputs(inputs)) return describeInputs(inputs, results && !isStackResults(results) ? results : undefined);
  const rows: VariantInputRow[] = [{ path: 'configuration', label: 'Configuration', value: 'Layered stack', unit: '', source: '' }];
  inputs.layers.forEach((l, j) => {
    const asLayer: VariantInputs = { configuration: 'horizontal-strip', structure: l.structure, liquid: inputs.liquid, dimensions: { duration: 1 }, checkpoints: { heights: [], times: [] } };
    for (const r of describeInputs(asLayer)) {
      if (r.path.startsWith('structure.')) rows.push({ ...r, path: `layers[${j}].${r.path}`, label: `${l.name}: ${r.label}` });
    }
    const ret = l.retention;
    const text =
      ret.mode === 'van-genuchten' ? `α ${ret.alpha} 1/Pa, n ${ret.n}` : ret.mode === 'brooks-corey' ? `Pb ${ret.entryPressure} Pa, λ ${ret.lambda}` : 'fitted to the pore-size distribution';
    rows.push({ path: `layers[${j}].retention`, label: `${l.name}: retention curve`, value: `${STACK_RETENTION_LABELS[ret.mode]}: ${text}`, unit: '', source: 'chosen for this variant' });
    rows.push({ path: `layers[${j}].initialSaturation`, label: `${l.name}: initial saturation`, value: l.initialSaturation ?? STACK_DEFAULTS.initialSaturation, unit: SI_UNIT.fraction, source: l.initialSaturation === undefined ? 'default (air-dry)' : 'entered for this variant' });
  });
  const own = 'entered for this variant';
  const liquid = typeof inputs.liquid.ref === 'string' ? inputs.liquid.ref : inputs.liquid.ref.name;
  const ins = inputs.insult;
  rows.push(
    { path: 'liquid.ref', label: 'Liquid', value: liquid, unit: '', source: inputs.liquid.pinned ? 'material library' : 'built in' },
    { path: 'liquid.temperature', label: 'Temperature', value: inputs.liquid.temperature, unit: SI_UNIT.temperature, source: own },
    { path: 'insult.volume', label: 'Gush volume', value: ins.volume, unit: SI_UNIT.volume, source: own },
    { path: 'insult.rate', label: 'Delivery rate', value: ins.rate, unit: SI_UNIT.volumeFlowRate, source: own },
    { path: 'insult.area', label: 'Insult area', value: ins.area, unit: SI_UNIT.area, source: own },
    { path: 'insult.count', label: 'Number of gushes', value: ins.count, unit: '1', source: own },
  );
  if (ins.interval !== undefined) rows.push({ path: 'insult.interval', label: 'Interval between gushes', value: ins.interval, unit: SI_UNIT.time, source: own });
  rows.push(
    { path: 'duration', label: 'Simulated time', value: inputs.duration, unit: SI_UNIT.time, source: own },
    { path: 'inclination', label: 'Axis angle to the downward vertical', value: inputs.inclination ?? 0, unit: SI_UNIT.angle, source: inputs.inclination === undefined ? 'default (lying flat)' : own },
    { path: 'bottom', label: 'Far face', value: inputs.bottom ?? 'no-flow', unit: '', source: inputs.bottom === undefined ? 'default (closed)' : own },
    { path: 'cells', label: 'Cells', value: inputs.cells ?? STACK_DEFAULTS.cells, unit: '1', source: inputs.cells === undefined ? 'default' : own },
  );
  return rows;
}
