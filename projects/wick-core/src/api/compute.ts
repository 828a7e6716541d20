/**
 * Model registry and the compute request/response types shared by the CLI (`wick run`), the server's compute
 * routes (single and batch) and the UI. A request names a model and gives its inputs; a bare number is read in the
 * parameter's unit (see `wick list`), a string such as "0.3 mm" is parsed with its own unit.
 */
import { DomainError, isDomainError } from '../errors';
import { parseQuantity, toSI, unitDimension } from '../units';
import { WICK_CORE_VERSION } from '../version';
import type { ModelSpec, ParameterSpec } from './model-spec';
import { MODEL_FAMILIES } from './families';
import { toPlain } from './plain';
import { MODEL_EXAMPLES } from './examples';

export interface ComputeRequest {
  readonly model: string;
  readonly inputs: Readonly<Record<string, unknown>>;
}

export type ComputeResponse =
  | { readonly ok: true; readonly model: string; readonly coreVersion: string; readonly result: unknown }
  | {
      readonly ok: false;
      readonly model: string;
      readonly coreVersion: string;
      readonly error: { readonly code: string; readonly message: string; readonly field?: string };
    };

export interface BatchComputeRequest {
  readonly requests: readonly ComputeRequest[];
}

export interface BatchComputeResponse {
  readonly coreVersion: string;
  readonly results: readonly ComputeResponse[];
}

/** What `wick list` prints and `GET /api/compute/models` answers: every model without its function. */
export type ModelDescription = Omit<ModelSpec, 'run'> & { readonly example?: Readonly<Record<string, unknown>> };

const REGISTRY: ReadonlyMap<string, ModelSpec> = new Map(
  MODEL_FAMILIES.flat().map((spec) => [spec.id, spec as ModelSpec]),
);

export function listModels(): ModelDescription[] {
  return [...REGISTRY.values()].map(({ run: _run, ...description }) => ({ ...description, example: MODEL_EXAMPLES[description.id] }));
}

export function findModel(id: string): ModelSpec {
  const spec = REGISTRY.get(id);
  if (!spec) {
    throw new DomainError('unknown-model', `There is no model "${id}". \`wick list\` shows the models.`, 'model');
  }
  return spec;
}

/** Converts one parameter value to SI: numbers are read in the parameter's unit, strings parsed with theirs. */
function toSiValue(param: ParameterSpec, raw: unknown): unknown {
  const unit = param.unit;
  const one = (v: unknown, index?: number): number => {
    const field = index === undefined ? param.name : `${param.name}[${index}]`;
    if (typeof v === 'number') {
      if (!Number.isFinite(v)) throw new DomainError('not-finite', `${param.label} must be a finite number.`, field);
      return unit && unit !== '1' ? toSI(v, unit) : v;
    }
    if (typeof v === 'string') {
      const expected = unit && unit !== '1' ? unitDimension(unit) : undefined;
      try {
        return parseQuantity(v, expected).si;
      } catch (e) {
        if (isDomainError(e)) throw new DomainError(e.code, `${param.label}: ${e.message}`, field, e.details);
        throw e;
      }
    }
    throw new DomainError('invalid-input', `${param.label} must be a number or a quantity such as "1 ${unit}".`, field);
  };
  switch (param.kind) {
    case 'number':
      return one(raw);
    case 'number[]':
      if (!Array.isArray(raw)) throw new DomainError('invalid-input', `${param.label} must be a list of numbers.`, param.name);
      return raw.map((v, i) => one(v, i));
    case 'string':
      if (typeof raw !== 'string' || (param.choices && !param.choices.includes(raw))) {
        const allowed = param.choices ? ` (one of: ${param.choices.join(', ')})` : '';
        throw new DomainError('invalid-input', `${param.label} must be a text value${allowed}.`, param.name);
      }
      return raw;
    case 'boolean':
      if (typeof raw !== 'boolean') throw new DomainError('invalid-input', `${param.label} must be true or false.`, param.name);
      return raw;
    case 'object':
      // Structured JSON (an object, a list, or a keyword such as "auto"); the model validates its shape.
      if (typeof raw === 'number' || typeof raw === 'boolean') {
        throw new DomainError('invalid-input', `${param.label}: ${param.description}`, param.name);
      }
      return raw;
  }
}

/** Reads a request's inputs into the SI object a model's `run` expects, checking required and unknown names. */
export function prepareInputs(spec: ModelSpec, inputs: Readonly<Record<string, unknown>>): Record<string, unknown> {
  if (typeof inputs !== 'object' || inputs === null || Array.isArray(inputs)) {
    throw new DomainError('invalid-input', 'inputs must be an object of parameter names to values.', 'inputs');
  }
  const known = new Set(spec.parameters.map((p) => p.name));
  for (const name of Object.keys(inputs)) {
    if (!known.has(name)) {
      throw new DomainError('invalid-input', `Model "${spec.id}" has no parameter "${name}". Known: ${[...known].join(', ')}.`, name);
    }
  }
  const out: Record<string, unknown> = {};
  for (const param of spec.parameters) {
    const raw = inputs[param.name];
    if (raw === undefined || raw === null) {
      if (param.default !== undefined) out[param.name] = toSiValue(param, param.default);
      else if (!param.optional) throw new DomainError('invalid-input', `${param.label} (${param.name}) is required.`, param.name);
      continue;
    }
    out[param.name] = toSiValue(param, raw);
  }
  return out;
}

/** Runs one request. Domain errors become an `ok: false` response; anything else is a bug and is rethrown. */
export function runModel(request: ComputeRequest): ComputeResponse {
  const model = typeof request?.model === 'string' ? request.model : '';
  try {
    const spec = findModel(model);
    const result = spec.run(prepareInputs(spec, request.inputs ?? {}));
    return { ok: true, model, coreVersion: WICK_CORE_VERSION, result: toPlain(result) };
  } catch (e) {
    if (!isDomainError(e)) throw e;
    return { ok: false, model, coreVersion: WICK_CORE_VERSION, error: { code: e.code, message: e.message, field: e.field } };
  }
}

export function runBatch(batch: BatchComputeRequest): BatchComputeResponse {
  if (!batch || !Array.isArray(batch.requests)) {
    throw new DomainError('invalid-input', 'A batch needs a "requests" list.', 'requests');
  }
  return { coreVersion: WICK_CORE_VERSION, results: batch.requests.map(runModel) };
}
