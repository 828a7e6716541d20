/**
 * The variant evaluator: one call turns a variant's inputs into everything the design workspace shows —
 * curves with and without gravity, checkpoints, uptake mass and rate, capacity, the capillary pressure and
 * permeability used (with the correlation's validity), the pore-size saturation profile, the Kelvin radius,
 * and P10/P50/P90 bands with a tornado ranking from the tolerances.
 *
 * It composes the model families (liquids, fibre-bed, permeability, washburn, pore-size, kelvin, tolerance);
 * it adds no physics of its own. Same inputs and options → same numbers in the browser, on the server and
 * in the CLI (the shared fixture checks it).
 */
import { DomainError, isDomainError, type ModelWarning } from '../errors';
import { liquidAt, type LiquidProperties } from '../liquids/liquid-at';
import { kelvinRadius } from '../kelvin/kelvin';
import { poreSizeEquilibrium } from '../pore-size/equilibrium';
import { tornado } from '../tolerance/sensitivity';
import type { Tolerance } from '../tolerance/distributions';
import { requireInRange } from '../validate';
import { WICK_CORE_VERSION } from '../version';
import { capillaryUptake } from '../washburn/capillary';
import { gravityCurve, gravityHeightUnchecked, gravityTimeUnchecked } from '../washburn/gravity';
import { porousStripUptake } from '../washburn/porous-strip';
import { radialRadiusUnchecked, radialSpreading } from '../washburn/radial';
import { bandPart, mergeBandParts, percentileBands, type BandModel, type BandPart, type BandResult, type PointwiseCurves } from './band';
import { GRAVITY_ROW_WIDTH, gravityRowInto, gravityRowValue } from '../pore-size/gravity-table';
import { gravityCurveCoefficients, gravityCurveFast, radialCurveFast, saturatedFrom } from './curve-tables';
import { VARIANT_EQUATIONS, permeabilityEquation } from './equations';
import { TOLERANCE_FIELDS } from './fields';
import { readVariantInputs } from './read-inputs';
import { resolveVariant, VARIANT_GRAVITY, withVariantField, type ResolveContext, type Resolved, type VariantParameters } from './resolve';
import type {
  CheckpointAtTime,
  CheckpointToHeight,
  EquationUsed,
  EvaluateVariantOptions,
  ScalarBand,
  ToleranceParameter,
  VariantInputs,
  VariantResults,
  VariantResultsOk,
} from './variant';

function intOption(name: string, value: number, min: number, max: number): number {
  if (!Number.isInteger(value)) throw new DomainError('invalid-input', `${name} must be an integer (got ${value}).`, name);
  return requireInRange(name, value, min, max);
}

/** Runs a liquid lookup and points its errors at the liquid fields. */
function readLiquid(inputs: VariantInputs): LiquidProperties {
  try {
    return liquidAt(inputs.liquid.ref, inputs.liquid.temperature);
  } catch (e) {
    if (!isDomainError(e)) throw e;
    const field = e.field === 'temperature' ? 'liquid.temperature' : 'liquid.ref';
    throw new DomainError(e.code, e.message, field, e.details);
  }
}

/** Nominal numeric parameters and the fixed choices of a variant. */
export function variantParameters(
  inputs: VariantInputs,
  liquid: Pick<LiquidProperties, 'surfaceTension' | 'viscosity' | 'density'>,
): { nominal: VariantParameters; ctx: ResolveContext } {
  const nominal: VariantParameters = {
    surfaceTension: liquid.surfaceTension,
    viscosity: liquid.viscosity,
    liquidDensity: liquid.density,
  };
  const d = inputs.dimensions;
  if (inputs.configuration === 'capillary') {
    const c = inputs.capillary!;
    nominal.capillaryRadius = c.radius;
    nominal.contactAngle = c.contactAngle;
    nominal.tilt = d.tilt ?? Math.PI / 2;
    return {
      nominal,
      ctx: {
        configuration: 'capillary',
        permeabilityMode: 'measured',
        capillaryPressureFrom: 'hydraulic-radius',
        shapeFactor: 1,
        gravity: VARIANT_GRAVITY,
      },
    };
  }
  const s = inputs.structure!;
  if (s.fibreDiameter !== undefined) nominal.fibreDiameter = s.fibreDiameter;
  else nominal.linearDensity = s.linearDensity;
  nominal.fibreDensity = s.fibreDensity;
  nominal.basisWeight = s.basisWeight;
  nominal.thickness = s.thickness;
  if (s.porosity !== undefined) nominal.porosity = s.porosity;
  nominal.contactAngle = s.contactAngle;
  if (s.permeability.mode === 'measured') nominal.permeability = s.permeability.value;
  const pcFrom = s.capillaryPressureFrom ?? 'hydraulic-radius';
  if (pcFrom === 'pore-diameter') nominal.poreDiameter = s.poreDiameter;
  if (inputs.configuration === 'inclined-strip') nominal.tilt = d.tilt;
  if (d.width !== undefined) nominal.width = d.width;
  if (inputs.configuration === 'radial-spread') nominal.sourceRadius = d.sourceRadius;
  return {
    nominal,
    ctx: {
      configuration: inputs.configuration,
      permeabilityMode: s.permeability.mode,
      correlation: s.permeability.mode === 'correlation' ? s.permeability.correlation : undefined,
      kozenyConstant: s.permeability.mode === 'correlation' ? s.permeability.kozenyConstant : undefined,
      capillaryPressureFrom: pcFrom,
      shapeFactor: s.shapeFactor ?? 1,
      gravity: VARIANT_GRAVITY,
    },
  };
}

/** Curve times 0 … duration, denser early (t ∝ i²) where the front moves fastest. */
export function curveTimes(duration: number, points: number): Float64Array {
  const t = new Float64Array(points);
  for (let i = 0; i < points; i++) {
    const u = i / (points - 1);
    t[i] = duration * u * u;
  }
  t[points - 1] = duration;
  return t;
}

function equationsFor(inputs: VariantInputs, r: Resolved): EquationUsed[] {
  const out: EquationUsed[] = [];
  const s = inputs.structure;
  if (inputs.configuration === 'capillary') {
    out.push(VARIANT_EQUATIONS.pcTube, VARIANT_EQUATIONS.washburnTube, VARIANT_EQUATIONS.horizontal);
  } else if (s) {
    if (s.fibreDiameter === undefined) out.push(VARIANT_EQUATIONS.fibreDiameter);
    if (s.porosity === undefined) out.push(VARIANT_EQUATIONS.porosity);
    out.push(VARIANT_EQUATIONS.hydraulicRadius);
    out.push(s.capillaryPressureFrom === 'pore-diameter' ? VARIANT_EQUATIONS.pcPore : VARIANT_EQUATIONS.pcHydraulic);
    if (r.permeabilityResult) out.push(permeabilityEquation(r.permeabilityResult.label, r.permeabilityResult.source));
    out.push(inputs.configuration === 'radial-spread' ? VARIANT_EQUATIONS.radial : VARIANT_EQUATIONS.washburnStrip);
    if (inputs.configuration !== 'radial-spread') out.push(VARIANT_EQUATIONS.horizontal);
    out.push(VARIANT_EQUATIONS.uptakeMass, VARIANT_EQUATIONS.capacity);
    if (s.poreSize) out.push(VARIANT_EQUATIONS.psd);
  }
  if (inputs.humidity !== undefined) out.push(VARIANT_EQUATIONS.kelvin);
  if (hasTolerances(inputs)) out.push(VARIANT_EQUATIONS.monteCarlo);
  return out;
}

function hasTolerances(inputs: VariantInputs): boolean {
  return Object.values(inputs.tolerances ?? {}).some((t) => t !== undefined);
}

function dedupe(warnings: readonly ModelWarning[]): ModelWarning[] {
  const seen = new Set<string>();
  return warnings.filter((w) => {
    const k = `${w.code}\u0000${w.message}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}

const mm = (m: number) => `${(m * 1000).toPrecision(3)} mm`;

/** Height (radius) at time t for resolved coefficients, capped at the strip length; exact family solutions. */
function heightAt(inputs: VariantInputs, r: Resolved, b: number, t: number): number {
  if (inputs.configuration === 'radial-spread') return radialRadiusUnchecked(r.a, inputs.dimensions.sourceRadius!, t);
  const h = gravityHeightUnchecked(r.a, b, t);
  const L = inputs.dimensions.length;
  return L !== undefined && h > L ? L : h;
}

interface Checkpoints {
  readonly atTimes: CheckpointAtTime[];
  readonly toHeights: CheckpointToHeight[];
}

/** Readings at the checkpoints from each configuration's own model, with its validity warnings. */
function checkpoints(
  inputs: VariantInputs,
  p: VariantParameters,
  r: Resolved,
  warnings: ModelWarning[],
): Checkpoints {
  const { times, heights } = inputs.checkpoints;
  const g = VARIANT_GRAVITY;
  const L = inputs.dimensions.length;
  if (inputs.configuration === 'capillary') {
    const common = {
      radius: p.capillaryRadius!,
      surfaceTension: p.surfaceTension!,
      viscosity: p.viscosity!,
      contactAngle: p.contactAngle!,
      density: p.liquidDensity!,
      tilt: p.tilt,
      times,
      heights,
    };
    const withG = capillaryUptake({ ...common, gravity: g });
    const noG = capillaryUptake({ ...common, gravity: 0 });
    if (withG.status !== 'ok' || noG.status !== 'ok') throw new Error('capillary status disagrees with the resolved wetting');
    warnings.push(...withG.warnings);
    const area = r.massPerLength!;
    return {
      atTimes: withG.atTimes.map((x, i) => ({
        time: x.time,
        height: x.height,
        heightNoGravity: noG.atTimes[i].height,
        mass: area * x.height,
        massRate: x.velocity === null ? null : area * x.velocity,
      })),
      toHeights: withG.toHeights.map((x, i) => ({
        height: x.height,
        reached: x.reached,
        time: x.time,
        timeNoGravity: noG.toHeights[i].time,
      })),
    };
  }
  if (inputs.configuration === 'radial-spread') {
    const common = {
      permeability: r.permeability,
      porosity: r.porosity!,
      capillaryPressure: r.capillaryPressure,
      viscosity: p.viscosity!,
      sourceRadius: p.sourceRadius!,
      thickness: p.thickness!,
      density: p.liquidDensity!,
      times,
      radii: heights,
    };
    const res = withCheckpointField(() => radialSpreading(common));
    if (res.status !== 'ok') throw new Error('radial status disagrees with the resolved wetting');
    warnings.push(...res.warnings);
    return {
      atTimes: res.atTimes.map((x) => ({
        time: x.time,
        height: x.radius,
        heightNoGravity: x.radius,
        mass: x.mass,
        massRate: x.mass === null ? null : r.massPerLength! * 2 * Math.PI * x.radius * x.velocity,
      })),
      toHeights: res.toRadii.map((x) => ({ height: x.radius, reached: true, time: x.time, timeNoGravity: x.time })),
    };
  }
  const common = {
    permeability: r.permeability,
    porosity: r.porosity!,
    capillaryPressure: r.capillaryPressure,
    viscosity: p.viscosity!,
    density: p.liquidDensity!,
    width: p.width!,
    thickness: p.thickness!,
    tilt: inputs.configuration === 'vertical-strip' ? Math.PI / 2 : (p.tilt ?? 0),
    times,
    heights,
  };
  const withG = porousStripUptake({ ...common, gravity: g });
  const noG = porousStripUptake({ ...common, gravity: 0 });
  if (withG.status !== 'ok' || noG.status !== 'ok') throw new Error('strip status disagrees with the resolved wetting');
  warnings.push(...withG.warnings);
  const capped = (h: number) => (L !== undefined && h > L ? L : h);
  const beyond = L !== undefined ? heights.filter((h) => h > L) : [];
  if (beyond.length > 0) {
    warnings.push({
      code: 'beyond-strip',
      message: `Targets beyond the strip length (${mm(L!)}) cannot be reached: ${beyond.map(mm).join(', ')}.`,
    });
  }
  return {
    atTimes: withG.atTimes.map((x, i) => {
      const top = L !== undefined && x.height > L;
      return {
        time: x.time,
        height: capped(x.height),
        heightNoGravity: capped(noG.atTimes[i].height),
        mass: top ? r.massPerLength! * L! : x.mass,
        massRate: top ? 0 : x.massRate,
      };
    }),
    toHeights: withG.toHeights.map((x, i) => {
      const out = L !== undefined && x.height > L;
      return {
        height: x.height,
        reached: x.reached && !out,
        time: out ? null : x.time,
        timeNoGravity: out ? null : noG.toHeights[i].time,
      };
    }),
  };
}

function withCheckpointField<T>(run: () => T): T {
  try {
    return run();
  } catch (e) {
    if (isDomainError(e) && e.field?.startsWith('radii')) {
      throw new DomainError(e.code, e.message, e.field.replace('radii', 'checkpoints.heights'), e.details);
    }
    throw e;
  }
}

/** Reads and checks a variant's inputs and options and resolves its nominal parameters. */
function prepareVariant(raw: VariantInputs | unknown, options: EvaluateVariantOptions) {
  const inputs = readVariantInputs(raw);
  const points = intOption('curvePoints', options.curvePoints ?? 200, 2, 5000);
  const samples = intOption('samples', options.samples ?? 1000, 10, 20000);
  const seed = options.seed ?? 1;
  if (!Number.isSafeInteger(seed)) throw new DomainError('invalid-input', 'The seed must be an integer.', 'seed');

  const warnings: ModelWarning[] = [];
  const liquid = readLiquid(inputs);
  warnings.push(...liquid.warnings);
  const { nominal, ctx } = variantParameters(inputs, liquid);
  const tolerances = (inputs.tolerances ?? {}) as Partial<Record<ToleranceParameter, Tolerance>>;
  for (const key of Object.keys(tolerances) as ToleranceParameter[]) {
    if (nominal[key] === undefined) {
      throw new DomainError(
        'invalid-input',
        `A tolerance on ${TOLERANCE_FIELDS[key].label.toLowerCase()} does not apply: this variant does not use that input` +
          (key === 'porosity' ? ' (porosity is computed from basis weight, thickness and fibre density).' : '.'),
        `tolerances.${key}`,
      );
    }
  }

  const r = resolveVariant(nominal, ctx, warnings);
  return { inputs, points, samples, seed, warnings, liquid, nominal, ctx, tolerances, r };
}

/**
 * Samples `from`…`to` of the variant's Monte Carlo band (see {@link bandPart}), for evaluating the band on
 * several threads: {@link evaluateVariant} given the parts of all samples returns exactly what it returns alone.
 * @returns null when the variant has no band (no tolerances, or a liquid that does not wet the layer).
 * @throws DomainError as {@link evaluateVariant} does for the same inputs.
 */
export function variantBandPart(raw: VariantInputs | unknown, options: EvaluateVariantOptions, from: number, to: number): BandPart | null {
  const { inputs, points, samples, seed, nominal, ctx, tolerances, r } = prepareVariant(raw, options);
  if (!r.wetting || !hasTolerances(inputs)) return null;
  const { model } = bandModel(inputs, ctx, r, curveTimes(inputs.dimensions.duration, points));
  return bandPart(model, nominal as Record<ToleranceParameter, number>, tolerances, samples, seed, from, to);
}

/**
 * The band model of a variant with its nominal parameters and tolerances, or null when it has no band (for
 * checks that the model's two forms agree).
 */
export function variantBandModel(
  raw: VariantInputs | unknown,
  options: EvaluateVariantOptions,
): { model: BandModel<ToleranceParameter>; nominal: Record<ToleranceParameter, number>; tolerances: Partial<Record<ToleranceParameter, Tolerance>> } | null {
  const { inputs, points, ctx, r, nominal, tolerances } = prepareVariant(raw, options);
  if (!r.wetting || !hasTolerances(inputs)) return null;
  const { model } = bandModel(inputs, ctx, r, curveTimes(inputs.dimensions.duration, points));
  return { model, nominal: nominal as Record<ToleranceParameter, number>, tolerances };
}

/**
 * Evaluates one design variant.
 *
 * @param raw the variant's inputs (checked by {@link readVariantInputs}; SI values).
 * @param options curve points (default 200), Monte Carlo samples (default 1,000) and seed (default 1).
 * @returns results, or a 'no-spontaneous-uptake' status when the liquid does not wet the layer.
 * @throws DomainError whose `field` is the input path, for inputs that are invalid or physically impossible.
 */
export function evaluateVariant(raw: VariantInputs | unknown, options: EvaluateVariantOptions = {}, bandParts?: readonly BandPart[]): VariantResults {
  const { inputs, points, samples, seed, warnings, liquid, nominal, ctx, tolerances, r } = prepareVariant(raw, options);
  const capillaryPressure = {
    value: r.capillaryPressure,
    method:
      inputs.configuration === 'capillary'
        ? '2γ cos θ / r (round tube)'
        : inputs.structure?.capillaryPressureFrom === 'pore-diameter'
          ? '4γ cos θ / D (mean pore diameter)'
          : 'γ cos θ / r_h (hydraulic radius)',
  };
  const equations = equationsFor(inputs, r);
  if (!r.wetting) {
    warnings.push({
      code: 'no-spontaneous-uptake',
      message: 'The contact angle is 90° or more: the liquid does not enter the layer by itself, so there is no uptake to show.',
    });
    return {
      status: 'no-spontaneous-uptake',
      coreVersion: WICK_CORE_VERSION,
      configuration: inputs.configuration,
      capillaryPressure,
      equations,
      warnings: dedupe(warnings),
    };
  }

  const times = curveTimes(inputs.dimensions.duration, points);
  const radial = inputs.configuration === 'radial-spread';
  const L = inputs.dimensions.length;
  let height: Float64Array;
  let heightNoGravity: Float64Array;
  if (radial) {
    const r0 = inputs.dimensions.sourceRadius!;
    height = times.map((t) => radialRadiusUnchecked(r.a, r0, t));
    heightNoGravity = height;
  } else {
    height = gravityCurve(r.a, r.b, times);
    heightNoGravity = gravityCurve(r.a, 0, times);
    if (L !== undefined) {
      const reachesTop = height[points - 1] > L;
      for (let i = 0; i < points; i++) {
        if (height[i] > L) height[i] = L;
        if (heightNoGravity[i] > L) heightNoGravity[i] = L;
      }
      if (reachesTop) {
        const tTop = gravityTimeUnchecked(r.a, r.b, L);
        warnings.push({
          code: 'reaches-top',
          message:
            `The front reaches the top of the strip (${mm(L)})${tTop === null ? '' : ` after ${tTop.toPrecision(3)} s`}; ` +
            'from then on the strip is shown full (no evaporation, no overflow).',
        });
      }
    }
  }

  const massPer = r.massPerLength;
  let mass: number[] | null = null;
  let massRate: (number | null)[] | null = null;
  if (massPer !== null) {
    const r0 = inputs.dimensions.sourceRadius ?? 0;
    mass = Array.from(height, (h) => (radial ? massPer * Math.PI * (h - r0) * (h + r0) : massPer * h));
    massRate = Array.from(height, (h, i) => {
      if (times[i] === 0) return null;
      if (radial) return massPer * 2 * Math.PI * h * (r.a / (h * Math.log1p((h - r0) / r0)));
      if (L !== undefined && h >= L) return 0;
      return massPer * (r.a / h - r.b);
    });
  }

  const cp = checkpoints(inputs, nominal, r, warnings);

  let poreSizeProfile: VariantResultsOk['poreSizeProfile'] = null;
  const psd = inputs.structure?.poreSize;
  if (psd) {
    const res = withVariantField(() =>
      poreSizeEquilibrium({
        ...psd,
        surfaceTension: liquid.surfaceTension,
        contactAngle: nominal.contactAngle!,
        density: liquid.density,
        gravity: VARIANT_GRAVITY,
      }),
    );
    warnings.push(...res.warnings);
    poreSizeProfile = { height: Array.from(res.profile.stepHeights), saturation: Array.from(res.profile.saturation) };
  }

  let kelvin: VariantResultsOk['kelvin'] = null;
  if (inputs.humidity !== undefined) {
    const k = withVariantField(() =>
      kelvinRadius({
        temperature: inputs.liquid.temperature,
        relativeHumidity: inputs.humidity!,
        contactAngle: nominal.contactAngle!,
      }),
    );
    warnings.push(...k.warnings);
    kelvin = { humidity: inputs.humidity, radius: k.kelvinRadius };
  }

  let bands: VariantResultsOk['bands'] = null;
  let tornadoOut: VariantResultsOk['tornado'] = null;
  if (hasTolerances(inputs)) {
    const built = tolerancesOutputs(inputs, nominal, ctx, r, times, tolerances, samples, seed, warnings, bandParts);
    bands = built.bands;
    tornadoOut = built.tornado;
  }

  return {
    status: 'ok',
    coreVersion: WICK_CORE_VERSION,
    configuration: inputs.configuration,
    liquid: {
      name: liquid.name,
      temperature: liquid.temperature,
      surfaceTension: liquid.surfaceTension,
      viscosity: liquid.viscosity,
      density: liquid.density,
      sources: liquid.sources,
      flammable: liquid.flammable === true,
    },
    structure:
      r.porosity === null
        ? null
        : {
            porosity: r.porosity,
            solidFraction: r.solidFraction!,
            porositySource: inputs.structure?.porosity === undefined ? 'basis weight' : 'measured',
            fibreDiameter: r.fibreDiameter!,
            hydraulicRadius: r.hydraulicRadius!,
          },
    capillaryPressure,
    permeability: r.permeabilityResult
      ? {
          value: r.permeability,
          method: 'correlation',
          correlation: r.permeabilityResult.correlation,
          label: r.permeabilityResult.label,
          source: r.permeabilityResult.source,
          inValidityRange: r.permeabilityResult.inValidityRange,
          validSolidFraction: r.permeabilityResult.validSolidFraction,
        }
      : {
          value: r.permeability,
          method: inputs.configuration === 'capillary' ? 'capillary' : 'measured',
          correlation: null,
          label: inputs.configuration === 'capillary' ? 'r²/8 (Poiseuille tube)' : 'Measured',
          source: inputs.structure?.sources?.['permeability'] ?? null,
          inValidityRange: null,
          validSolidFraction: null,
        },
    coefficients: { a: r.a, b: r.b },
    equilibriumHeight: r.equilibriumHeight,
    equilibriumLength: r.b > 0 ? r.a / r.b : null,
    characteristicTime: r.b > 0 ? r.a / (r.b * r.b) : null,
    curves: {
      time: Array.from(times),
      height: Array.from(height),
      heightNoGravity: Array.from(heightNoGravity),
      mass,
      massRate,
    },
    atTimes: cp.atTimes,
    toHeights: cp.toHeights,
    capacity: r.capacity,
    poreSizeProfile,
    kelvin,
    bands,
    tornado: tornadoOut,
    equations,
    warnings: dedupe(warnings),
  };
}

/** The scalar outputs the band reports beside the curve. */
interface ScalarDef {
  readonly key: string;
  readonly label: string;
  readonly unit: string;
  readonly nominal: number | null;
  readonly get: (x: Resolved) => number;
}

/** The band's model of one variant: its curve (with gravity, clamped at the strip's length) and scalars per parameter set. */
function bandModel(inputs: VariantInputs, ctx: ResolveContext, r: Resolved, times: Float64Array): { model: BandModel<ToleranceParameter>; scalarDefs: ScalarDef[] } {
  const radial = inputs.configuration === 'radial-spread';
  const L = inputs.dimensions.length;
  const r0 = inputs.dimensions.sourceRadius ?? 0;
  const what = radial ? 'Wetted radius' : 'Height';
  const scalarDefs: ScalarDef[] = inputs.checkpoints.times.map((t) => ({
    key: `height@${t}`,
    label: `${what} at ${t} s`,
    unit: 'm',
    nominal: heightAt(inputs, r, r.b, t),
    get: (x: Resolved) => heightAt(inputs, x, x.b, t),
  }));
  if (r.equilibriumHeight !== null) {
    scalarDefs.push({
      key: 'equilibriumHeight',
      label: 'Equilibrium height',
      unit: 'm',
      nominal: r.equilibriumHeight,
      get: (x) => x.equilibriumHeight ?? Number.NaN,
    });
  }
  if (r.capacity !== null) {
    scalarDefs.push(
      { key: 'capacityPerArea', label: 'Saturated capacity per area', unit: 'kg/m^2', nominal: r.capacity.perArea, get: (x) => x.capacity!.perArea },
      { key: 'capacityPerMass', label: 'Saturated capacity per mass', unit: 'kg/kg', nominal: r.capacity.perMass, get: (x) => x.capacity!.perMass },
    );
  }
  const m = times.length;
  const rootTimes = times.map(Math.sqrt);
  // A rising curve that ends below the strip's length never reached it: no clamping.
  const clampAt = (end: number) => (L !== undefined && !(end < L * (1 - 1e-9)) ? L : Number.POSITIVE_INFINITY);
  const model: BandModel<ToleranceParameter> = {
    points: m,
    scalars: scalarDefs.length,
    pointwise: radial ? undefined : gravityPointwise(ctx, times, rootTimes, scalarDefs, clampAt),
    evaluate(params, curve, scalars) {
      const x = resolveVariant(params, ctx);
      if (!x.wetting) throw new DomainError('out-of-range', 'no spontaneous uptake at these input values', 'contactAngle');
      // Tabulated exact solutions (./curve-tables): the same curves to ~1e-12, ten times faster per point.
      if (radial) {
        radialCurveFast(x.a, r0, times, curve);
      } else {
        gravityCurveFast(x.a, x.b, times, rootTimes, curve);
        const clamp = clampAt(curve[m - 1]);
        if (clamp < Number.POSITIVE_INFINITY) for (let i = 0; i < m; i++) curve[i] = Math.min(curve[i], clamp);
      }
      for (let j = 0; j < scalarDefs.length; j++) scalars[j] = scalarDefs[j].get(x);
    },
  };
  return { model, scalarDefs };
}

/**
 * The band's gravity curves point by point (curve-tables keeps the two forms bit for bit equal), so the band
 * reads each point straight into its statistics. Kept per sample: the curve's coefficients and its clamp.
 */
function gravityPointwise(
  ctx: ResolveContext,
  times: Float64Array,
  rootTimes: Float64Array,
  scalarDefs: readonly ScalarDef[],
  clampAt: (end: number) => number,
): PointwiseCurves<ToleranceParameter> {
  const last = times.length - 1;
  return {
    width: GRAVITY_ROW_WIDTH,
    prepare(params, coef, at, scalars) {
      const x = resolveVariant(params, ctx);
      if (!x.wetting) throw new DomainError('out-of-range', 'no spontaneous uptake at these input values', 'contactAngle');
      gravityCurveCoefficients(x.a, x.b, coef, at);
      const end = gravityRowValue(coef, at, times[last], rootTimes[last]);
      // Every point is finite when the last one and the early-time bound √(2a)·√t are (the curve rises).
      if (!Number.isFinite(end) || !Number.isFinite(coef[at] * rootTimes[last])) {
        throw new DomainError('out-of-range', 'the model returned a non-finite value');
      }
      coef[at + 4] = clampAt(end);
      for (let j = 0; j < scalarDefs.length; j++) scalars[j] = scalarDefs[j].get(x);
      // Past the saturation time the curve is h_eq (capped): constant from the first point after it.
      return saturatedFrom(times, coef[at + 3]);
    },
    fill(i, coef, order, count, row) {
      gravityRowInto(coef, order, count, times[i], rootTimes[i], row);
    },
  };
}

/**
 * Bands of the curve and key scalars, and the tornado of the height at the last reading time. The band comes
 * from `parts` when the caller computed it in parts (on other threads), else it is computed here.
 */
function tolerancesOutputs(
  inputs: VariantInputs,
  nominal: VariantParameters,
  ctx: ResolveContext,
  r: Resolved,
  times: Float64Array,
  tolerances: Partial<Record<ToleranceParameter, Tolerance>>,
  samples: number,
  seed: number,
  warnings: ModelWarning[],
  parts: readonly BandPart[] | undefined,
): { bands: NonNullable<VariantResultsOk['bands']>; tornado: VariantResultsOk['tornado'] } {
  const radial = inputs.configuration === 'radial-spread';
  const readTimes = inputs.checkpoints.times;
  const what = radial ? 'Wetted radius' : 'Height';
  const { model, scalarDefs } = bandModel(inputs, ctx, r, times);
  const nominalRecord = nominal as Record<ToleranceParameter, number>;
  let band: BandResult;
  if (parts) {
    band = mergeBandParts(parts);
    if (band.samples !== samples || parts[0].points !== model.points || parts[0].scalars !== model.scalars) {
      throw new RangeError('The band parts were computed for other options or another variant.');
    }
  } else {
    band = percentileBands(model, nominalRecord, tolerances, samples, seed);
  }
  warnings.push(...band.warnings);
  const scalars: ScalarBand[] = scalarDefs.map((d, j) => ({
    key: d.key,
    label: d.label,
    unit: d.unit,
    nominal: d.nominal,
    ...band.scalars[j],
  }));

  let tornadoOut: VariantResultsOk['tornado'] = null;
  const tLast = readTimes.length > 0 ? readTimes[readTimes.length - 1] : inputs.dimensions.duration;
  const t = tornado<ToleranceParameter>(
    (params) => {
      const x = resolveVariant(params, ctx);
      if (!x.wetting) throw new DomainError('out-of-range', 'no spontaneous uptake at these input values', 'contactAngle');
      return heightAt(inputs, x, x.b, tLast);
    },
    nominalRecord,
    tolerances,
  );
  warnings.push(...t.warnings);
  tornadoOut = {
    output: `${what} at ${tLast} s`,
    unit: 'm',
    base: t.baseOutput,
    bars: t.bars.map((b) => ({
      parameter: b.name as ToleranceParameter,
      label: TOLERANCE_FIELDS[b.name as ToleranceParameter].label,
      inputLow: b.inputLow,
      inputHigh: b.inputHigh,
      outputLow: b.outputLow,
      outputHigh: b.outputHigh,
      swing: b.swing,
    })),
  };
  return {
    bands: {
      samples: band.samples,
      validSamples: band.valid,
      seed,
      curve: { p10: Array.from(band.curve.p10), p50: Array.from(band.curve.p50), p90: Array.from(band.curve.p90) },
      scalars,
    },
    tornado: tornadoOut,
  };
}
