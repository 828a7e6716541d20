/**
 * Reads a stack variant's inputs from untrusted JSON (the wire, the database, a form). Each layer's structure
 * and the liquid go through the single-layer reader, so both kinds of variant accept exactly the same structure
 * fields with the same messages; a problem throws a DomainError whose `field` is the input path
 * (`layers[1].structure.thickness`, `insult.interval`).
 */
import { DomainError, isDomainError } from '../errors';
import { requireFraction, requireInRange, requirePositive } from '../validate';
import { readVariantInputs } from './read-inputs';
import {
  STACK_CONFIGURATION,
  STACK_DEFAULTS,
  STACK_RETENTION_MODES,
  type StackInsultInputs,
  type StackLayerInputs,
  type StackRetentionChoice,
  type StackVariantInputs,
} from './stack-variant';
import type { LiquidInputs, StructureInputs } from './variant';

type Obj = Record<string, unknown>;

function invalid(path: string, message: string): DomainError {
  return new DomainError('invalid-input', message, path);
}

function object(value: unknown, path: string, what: string): Obj {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) throw invalid(path, `${what} must be an object.`);
  return value as Obj;
}

/** A required or optional number checked by `guard(label, value)`; the error's field is `path`. */
function num(o: Obj, key: string, path: string, label: string, guard: (label: string, v: number) => number): number;
function num(o: Obj, key: string, path: string, label: string, guard: (label: string, v: number) => number, optional: true): number | undefined;
function num(o: Obj, key: string, path: string, label: string, guard: (label: string, v: number) => number, optional = false): number | undefined {
  const v = o[key];
  if (v === undefined || v === null) {
    if (optional) return undefined;
    throw invalid(path, `${label} is required.`);
  }
  if (typeof v !== 'number') throw invalid(path, `${label} must be a number.`);
  try {
    return guard(label, v);
  } catch (e) {
    if (isDomainError(e)) throw new DomainError(e.code, e.message, path, e.details);
    throw e;
  }
}

/** Drops keys whose value is undefined, so stored JSON and re-read inputs compare equal. */
function dropUndefined<T extends object>(o: T): T {
  for (const k of Object.keys(o) as (keyof T)[]) if (o[k] === undefined) delete o[k];
  return o;
}

function integer(label: string, v: number, min: number, max: number): number {
  requireInRange(label, v, min, max);
  if (!Number.isInteger(v)) throw new DomainError('invalid-input', `${label} must be a whole number (got ${v}).`);
  return v;
}

/**
 * The structure and the liquid of one layer through the single-layer reader (as a horizontal strip, whose
 * remaining fields are fixed here), with the reader's `structure.*` paths moved under `layers[j]`.
 */
function readLayerStructure(structure: unknown, liquid: unknown, j: number, name: string): { structure: StructureInputs; liquid: LiquidInputs } {
  try {
    const read = readVariantInputs({
      configuration: 'horizontal-strip',
      structure,
      liquid,
      dimensions: { width: 1, duration: 1 },
      checkpoints: { heights: [], times: [] },
    });
    return { structure: read.structure!, liquid: read.liquid };
  } catch (e) {
    if (isDomainError(e) && e.field?.startsWith('structure')) {
      throw new DomainError(e.code, `${name}: ${e.message}`, `layers[${j}].${e.field}`, e.details);
    }
    throw e;
  }
}

function readRetention(value: unknown, path: string, structure: StructureInputs, name: string): StackRetentionChoice {
  const o = object(value, path, `${name}: the retention curve`);
  const mode = o['mode'];
  if (typeof mode !== 'string' || !(STACK_RETENTION_MODES as readonly string[]).includes(mode)) {
    throw invalid(`${path}.mode`, `${name}: the retention curve must be one of: ${STACK_RETENTION_MODES.join(', ')}.`);
  }
  switch (mode) {
    case 'van-genuchten': {
      const alpha = num(o, 'alpha', `${path}.alpha`, `${name}: van Genuchten α`, requirePositive);
      const n = num(o, 'n', `${path}.n`, `${name}: van Genuchten n`, (l, v) => requireInRange(l, v, 1, 50, { min: true }));
      const poreConnectivity = num(o, 'poreConnectivity', `${path}.poreConnectivity`, `${name}: Mualem L`, (l, v) => requireInRange(l, v, -5, 10), true);
      return poreConnectivity === undefined ? { mode, alpha, n } : { mode, alpha, n, poreConnectivity };
    }
    case 'brooks-corey':
      return {
        mode,
        entryPressure: num(o, 'entryPressure', `${path}.entryPressure`, `${name}: entry pressure`, requirePositive),
        lambda: num(o, 'lambda', `${path}.lambda`, `${name}: Brooks–Corey λ`, (l, v) => requireInRange(l, v, 0, 100, { min: true })),
      };
    default:
      if (!structure.poreSize) {
        throw new DomainError(
          'insufficient-data',
          `${name} has no pore-size distribution: enter van Genuchten or Brooks–Corey parameters instead.`,
          `${path}.mode`,
        );
      }
      return { mode: 'pore-size' };
  }
}

function readLayer(value: unknown, j: number, liquid: unknown): { layer: StackLayerInputs; liquid: LiquidInputs } {
  const path = `layers[${j}]`;
  const o = object(value, path, `Layer ${j + 1}`);
  const rawName = o['name'];
  const name = typeof rawName === 'string' && rawName.trim() !== '' ? rawName.trim().slice(0, 80) : `Layer ${j + 1}`;
  const read = readLayerStructure(o['structure'], liquid, j, name);
  const layer: StackLayerInputs = {
    name,
    structure: read.structure,
    retention: readRetention(o['retention'], `${path}.retention`, read.structure, name),
    residualContent: num(o, 'residualContent', `${path}.residualContent`, `${name}: residual content`, (l, v) => requireInRange(l, v, 0, 1, { max: true }), true),
    initialSaturation: num(o, 'initialSaturation', `${path}.initialSaturation`, `${name}: initial saturation`, requireFraction, true),
    cells: num(o, 'cells', `${path}.cells`, `${name}: cells`, (l, v) => integer(l, v, 1, 2000), true),
  };
  return { layer: dropUndefined(layer), liquid: read.liquid };
}

function readInsult(value: unknown): StackInsultInputs {
  const o = object(value, 'insult', 'The insult');
  const volume = num(o, 'volume', 'insult.volume', 'Gush volume', requirePositive);
  const rate = num(o, 'rate', 'insult.rate', 'Delivery rate', requirePositive);
  const area = num(o, 'area', 'insult.area', 'Insult area', requirePositive);
  const count = num(o, 'count', 'insult.count', 'Number of gushes', (l, v) => integer(l, v, 1, STACK_DEFAULTS.maxInsults));
  if (count === 1) return { volume, rate, area, count };
  const interval = num(o, 'interval', 'insult.interval', 'Interval between gushes', requirePositive);
  const delivery = volume / rate;
  if (interval < delivery) {
    throw invalid(
      'insult.interval',
      `Interval between gushes (${interval} s) is shorter than the delivery of one gush (${+delivery.toPrecision(4)} s): gushes must not overlap.`,
    );
  }
  return { volume, rate, area, count, interval };
}

/**
 * Checks untrusted stack-variant inputs and returns them typed (unknown fields dropped, defaults not filled).
 * @throws DomainError naming the field path.
 */
export function readStackVariantInputs(raw: unknown): StackVariantInputs {
  const o = object(raw, '', 'The inputs');
  if (o['configuration'] !== STACK_CONFIGURATION) throw invalid('configuration', `Configuration must be '${STACK_CONFIGURATION}'.`);
  const rawLayers = o['layers'];
  if (!Array.isArray(rawLayers) || rawLayers.length === 0) throw invalid('layers', 'Add at least one layer to the stack.');
  if (rawLayers.length > STACK_DEFAULTS.maxLayers) throw invalid('layers', `A stack has at most ${STACK_DEFAULTS.maxLayers} layers.`);
  let liquid: LiquidInputs | undefined;
  const layers = rawLayers.map((l, j) => {
    const read = readLayer(l, j, o['liquid']);
    liquid ??= read.liquid;
    return read.layer;
  });
  const insult = readInsult(o['insult']);
  const duration = num(o, 'duration', 'duration', 'Simulated time', (l, v) => requireInRange(l, v, 0, 1e6, { min: true }));
  const lastStart = (insult.count - 1) * (insult.interval ?? 0);
  if (lastStart >= duration) {
    throw invalid('duration', `The run (${duration} s) ends before gush ${insult.count} starts at ${lastStart} s: simulate longer.`);
  }
  const bottom = o['bottom'];
  if (bottom !== undefined && bottom !== null && bottom !== 'no-flow' && bottom !== 'free-drainage') {
    throw invalid('bottom', "The far face must be 'no-flow' or 'free-drainage'.");
  }
  const out: StackVariantInputs = {
    configuration: STACK_CONFIGURATION,
    layers,
    liquid: liquid!,
    insult,
    duration,
    inclination: num(o, 'inclination', 'inclination', 'Inclination', (l, v) => requireInRange(l, v, 0, Math.PI), true),
    bottom: bottom === 'no-flow' || bottom === 'free-drainage' ? bottom : undefined,
    cells: num(o, 'cells', 'cells', 'Cells', (l, v) => integer(l, v, 10, 4000), true),
    upperLayers: num(o, 'upperLayers', 'upperLayers', 'Upper layers for the rewet indicator', (l, v) => integer(l, v, 1, layers.length), true),
  };
  return dropUndefined(out);
}
