/**
 * Reads a variant's inputs from untrusted JSON (the wire, the database, a form) into {@link VariantInputs},
 * checking every field. A problem throws a DomainError whose `field` is the input path
 * (`structure.thickness`, `checkpoints.times[2]`) and whose message names the field as the form labels it.
 */
import { DomainError, isDomainError } from '../errors';
import type { UserLiquidDefinition } from '../liquids/liquid-at';
import type { DistributionForm } from '../pore-size/distribution';
import type { Tolerance } from '../tolerance/distributions';
import {
  requireContactAngle,
  requireFinite,
  requireFraction,
  requireInRange,
  requirePositive,
} from '../validate';
import { variantField } from './fields';
import {
  VARIANT_CORRELATIONS,
  TOLERANCE_PARAMETERS,
  VARIANT_CONFIGURATIONS,
  type CapillaryInputs,
  type CheckpointInputs,
  type DimensionInputs,
  type LiquidInputs,
  type PermeabilityChoice,
  type PermeabilityCorrelationId,
  type PinnedMaterial,
  type StructureInputs,
  type ToleranceParameter,
  type VariantConfiguration,
  type VariantInputs,
} from './variant';

type Obj = Record<string, unknown>;

function labelOf(path: string): string {
  return variantField(path)?.label ?? path;
}

/** Runs a guard with the field's label in its message and re-throws with the path as `field`. */
function at<T>(path: string, check: (label: string) => T): T {
  try {
    return check(labelOf(path));
  } catch (e) {
    if (isDomainError(e)) throw new DomainError(e.code, e.message, path, e.details);
    throw e;
  }
}

function invalid(path: string, message: string): DomainError {
  return new DomainError('invalid-input', message, path);
}

function object(value: unknown, path: string): Obj {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw invalid(path, `${path === '' ? 'The inputs' : labelOf(path)} must be an object.`);
  }
  return value as Obj;
}

function number(o: Obj, key: string, path: string, guard: (label: string, v: number) => number): number {
  const v = o[key];
  if (v === undefined || v === null) throw invalid(path, `${labelOf(path)} is required.`);
  if (typeof v !== 'number') throw invalid(path, `${labelOf(path)} must be a number.`);
  return at(path, (label) => guard(label, v));
}

function optionalNumber(
  o: Obj,
  key: string,
  path: string,
  guard: (label: string, v: number) => number,
): number | undefined {
  return o[key] === undefined || o[key] === null ? undefined : number(o, key, path, guard);
}

function numberList(o: Obj, key: string, path: string, guard: (label: string, v: number) => number): number[] {
  const v = o[key];
  if (!Array.isArray(v)) throw invalid(path, `${labelOf(path)} must be a list of numbers.`);
  if (v.length > 50) throw invalid(path, `${labelOf(path)}: at most 50 values.`);
  return v.map((x, i) => {
    const p = `${path}[${i}]`;
    if (typeof x !== 'number') throw invalid(p, `${labelOf(path)}: value ${i + 1} must be a number.`);
    return at(p, (label) => guard(`${label} (value ${i + 1})`, x));
  });
}

function choice<T extends string>(value: unknown, allowed: readonly T[], path: string, what: string): T {
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    throw invalid(path, `${what} must be one of: ${allowed.join(', ')}.`);
  }
  return value as T;
}

const positive = (label: string, v: number) => requirePositive(label, v);

function readPinned(value: unknown, path: string, kind: PinnedMaterial['kind']): PinnedMaterial | undefined {
  if (value === undefined || value === null) return undefined;
  const o = object(value, path);
  const id = o['id'];
  const revision = o['revision'];
  if (!Number.isSafeInteger(id) || (id as number) <= 0 || !Number.isSafeInteger(revision) || (revision as number) <= 0) {
    throw invalid(path, 'A pinned library entry needs a positive integer id and revision.');
  }
  return {
    kind,
    id: id as number,
    revision: revision as number,
    name: typeof o['name'] === 'string' ? o['name'] : `#${id as number}`,
    state: typeof o['state'] === 'string' ? o['state'] : 'unknown',
  };
}

function readPermeability(value: unknown, path: string): PermeabilityChoice {
  const o = object(value, path);
  const mode = choice(o['mode'], ['measured', 'correlation'] as const, `${path}.mode`, 'Permeability source');
  if (mode === 'measured') return { mode, value: number(o, 'value', `${path}.value`, positive) };
  const correlation = choice<PermeabilityCorrelationId>(
    o['correlation'],
    VARIANT_CORRELATIONS,
    `${path}.correlation`,
    'Permeability correlation',
  );
  const kozenyConstant = optionalNumber(o, 'kozenyConstant', `${path}.kozenyConstant`, positive);
  return kozenyConstant === undefined ? { mode, correlation } : { mode, correlation, kozenyConstant };
}

function readPoreSize(value: unknown, path: string): StructureInputs['poreSize'] {
  if (value === undefined || value === null) return undefined;
  const o = object(value, path);
  const form = choice<DistributionForm>(
    o['form'],
    ['differential', 'cumulative-finer', 'cumulative-coarser'],
    `${path}.form`,
    'Pore-size distribution form',
  );
  const diameters = o['diameters'];
  const fractions = o['fractions'];
  const numbers = (v: unknown, p: string): number[] => {
    if (!Array.isArray(v) || v.length === 0 || v.length > 500 || v.some((x) => typeof x !== 'number' || !Number.isFinite(x))) {
      throw invalid(p, 'The pore-size distribution needs 1 to 500 finite numbers per column.');
    }
    return v as number[];
  };
  return { form, diameters: numbers(diameters, `${path}.diameters`), fractions: numbers(fractions, `${path}.fractions`) };
}

function readSources(value: unknown, path: string): Record<string, string> | undefined {
  if (value === undefined || value === null) return undefined;
  const o = object(value, path);
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(o)) {
    if (typeof v !== 'string') throw invalid(`${path}.${k}`, 'A value source must be text.');
    out[k] = v.slice(0, 500);
  }
  return out;
}

function readStructure(value: unknown): StructureInputs {
  const p = 'structure';
  const o = object(value, p);
  const fibreDiameter = optionalNumber(o, 'fibreDiameter', `${p}.fibreDiameter`, positive);
  const linearDensity = optionalNumber(o, 'linearDensity', `${p}.linearDensity`, positive);
  if (fibreDiameter === undefined && linearDensity === undefined) {
    throw invalid(`${p}.fibreDiameter`, 'Give the fibre diameter or the fibre linear density.');
  }
  const capillaryPressureFrom =
    o['capillaryPressureFrom'] === undefined || o['capillaryPressureFrom'] === null
      ? undefined
      : choice(o['capillaryPressureFrom'], ['hydraulic-radius', 'pore-diameter'] as const, `${p}.capillaryPressureFrom`, 'Capillary pressure from');
  const poreDiameter = optionalNumber(o, 'poreDiameter', `${p}.poreDiameter`, positive);
  if (capillaryPressureFrom === 'pore-diameter' && poreDiameter === undefined) {
    throw invalid(`${p}.poreDiameter`, 'Give the mean pore diameter to take the capillary pressure from it.');
  }
  const s: StructureInputs = {
    web: readPinned(o['web'], `${p}.web`, 'web'),
    fibreDiameter,
    linearDensity,
    fibreDensity: number(o, 'fibreDensity', `${p}.fibreDensity`, positive),
    shapeFactor: optionalNumber(o, 'shapeFactor', `${p}.shapeFactor`, (l, v) => requireInRange(l, v, 1, 10)),
    basisWeight: number(o, 'basisWeight', `${p}.basisWeight`, positive),
    thickness: number(o, 'thickness', `${p}.thickness`, positive),
    porosity: optionalNumber(o, 'porosity', `${p}.porosity`, (l, v) => requireFraction(l, v)),
    contactAngle: number(o, 'contactAngle', `${p}.contactAngle`, (l, v) => requireContactAngle(l, v)),
    capillaryPressureFrom,
    poreDiameter,
    permeability: readPermeability(o['permeability'], `${p}.permeability`),
    poreSize: readPoreSize(o['poreSize'], `${p}.poreSize`),
    sources: readSources(o['sources'], `${p}.sources`),
  };
  return dropUndefined(s);
}

function readCapillary(value: unknown): CapillaryInputs {
  const o = object(value, 'capillary');
  return {
    radius: number(o, 'radius', 'capillary.radius', positive),
    contactAngle: number(o, 'contactAngle', 'capillary.contactAngle', (l, v) => requireContactAngle(l, v)),
  };
}

function readLiquid(value: unknown): LiquidInputs {
  const o = object(value, 'liquid');
  const ref = o['ref'];
  let parsed: string | UserLiquidDefinition;
  if (typeof ref === 'string' && ref.trim() !== '') parsed = ref;
  else if (typeof ref === 'object' && ref !== null && !Array.isArray(ref)) parsed = ref as UserLiquidDefinition;
  else throw invalid('liquid.ref', 'Choose a liquid.');
  const temperature = number(o, 'temperature', 'liquid.temperature', (l, v) => requireInRange(l, v, 173.15, 473.15));
  return dropUndefined({ ref: parsed, pinned: readPinned(o['pinned'], 'liquid.pinned', 'liquid'), temperature });
}

function readDimensions(value: unknown, configuration: VariantConfiguration): DimensionInputs {
  const p = 'dimensions';
  const o = object(value, p);
  const strip = configuration.endsWith('-strip');
  const width = strip
    ? number(o, 'width', `${p}.width`, positive)
    : optionalNumber(o, 'width', `${p}.width`, positive);
  const tilt =
    configuration === 'inclined-strip'
      ? number(o, 'tilt', `${p}.tilt`, (l, v) => requireInRange(l, v, 0, Math.PI / 2, { min: true, max: true }))
      : configuration === 'capillary'
        ? optionalNumber(o, 'tilt', `${p}.tilt`, (l, v) => requireInRange(l, v, 0, Math.PI / 2))
        : undefined;
  const sourceRadius =
    configuration === 'radial-spread' ? number(o, 'sourceRadius', `${p}.sourceRadius`, positive) : undefined;
  return dropUndefined({
    width,
    length: strip ? optionalNumber(o, 'length', `${p}.length`, positive) : undefined,
    tilt,
    sourceRadius,
    duration: number(o, 'duration', `${p}.duration`, (l, v) => requireInRange(l, v, 0, 1e7, { min: true })),
  });
}

function readCheckpoints(value: unknown): CheckpointInputs {
  const o = object(value, 'checkpoints');
  return {
    heights: numberList(o, 'heights', 'checkpoints.heights', positive),
    times: numberList(o, 'times', 'checkpoints.times', positive),
  };
}

function readTolerance(value: unknown, path: string): Tolerance {
  const o = object(value, path);
  const kind = choice(o['kind'], ['normal', 'uniform', 'triangular'] as const, `${path}.kind`, 'Tolerance kind');
  const fin = (k: string) => {
    const v = o[k];
    if (typeof v !== 'number') throw invalid(`${path}.${k}`, `Tolerance ${k} must be a number.`);
    return at(`${path}.${k}`, (l) => requireFinite(`${l} ${k}`, v));
  };
  const opt = (k: string) => (o[k] === undefined || o[k] === null ? undefined : fin(k));
  if (kind === 'normal') return dropUndefined({ kind, sd: fin('sd'), mean: opt('mean'), lower: opt('lower'), upper: opt('upper') });
  if (kind === 'uniform') return { kind, min: fin('min'), max: fin('max') };
  return dropUndefined({ kind, min: fin('min'), max: fin('max'), mode: opt('mode') });
}

function readTolerances(value: unknown): VariantInputs['tolerances'] {
  if (value === undefined || value === null) return undefined;
  const o = object(value, 'tolerances');
  const out: Partial<Record<ToleranceParameter, Tolerance>> = {};
  for (const [k, v] of Object.entries(o)) {
    if (v === undefined || v === null) continue;
    const name = choice<ToleranceParameter>(k, TOLERANCE_PARAMETERS, `tolerances.${k}`, 'A toleranced input');
    out[name] = readTolerance(v, `tolerances.${k}`);
  }
  return out;
}

/** Drops keys whose value is undefined, so stored JSON and recomputed inputs compare equal. */
function dropUndefined<T extends object>(o: T): T {
  for (const k of Object.keys(o) as (keyof T)[]) if (o[k] === undefined) delete o[k];
  return o;
}

/**
 * Checks untrusted inputs and returns them typed. Fields that the configuration does not use are dropped.
 * @throws DomainError naming the field path.
 */
export function readVariantInputs(raw: unknown): VariantInputs {
  const o = object(raw, '');
  const configuration = choice(o['configuration'], VARIANT_CONFIGURATIONS, 'configuration', 'Configuration');
  const capillary = configuration === 'capillary';
  return dropUndefined({
    configuration,
    structure: capillary ? undefined : readStructure(o['structure']),
    capillary: capillary ? readCapillary(o['capillary']) : undefined,
    liquid: readLiquid(o['liquid']),
    dimensions: readDimensions(o['dimensions'], configuration),
    checkpoints: readCheckpoints(o['checkpoints']),
    tolerances: readTolerances(o['tolerances']),
    humidity: optionalNumber(o, 'humidity', 'humidity', (l, v) => requireFraction(l, v)),
  });
}
