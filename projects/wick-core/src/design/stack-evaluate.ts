/**
 * The stack-variant evaluator: from a stack variant's inputs (library layers, liquid, repeated insult) to the
 * summary the design workspace shows, saves and compares. It composes existing code only: each layer's porosity
 * and permeability come from the single-layer resolution (`resolveVariant`, the same code as a layer variant),
 * the retention curve from the stack family (a pore-size distribution is fitted by `fitPoreSizeRetention`), the
 * flow from `simulateStack` (Richards equation). Same inputs and options → same numbers in the Web Worker, on the
 * server and in the CLI.
 */
import { DomainError, isDomainError, type ModelWarning } from '../errors';
import { liquidAt, type LiquidProperties } from '../liquids/liquid-at';
import { fitPoreSizeRetention } from '../stack/pore-size-fit';
import { simulateStack } from '../stack/simulate';
import type { RetentionInput, StackInput, StackLayerInput, StackResult, StackRunOptions } from '../stack/types';
import { requireInRange } from '../validate';
import { WICK_CORE_VERSION } from '../version';
import { VARIANT_EQUATIONS, permeabilityEquation } from './equations';
import { variantParameters } from './evaluate';
import type { KeyFigure } from './key-figures';
import { resolveVariant, type Resolved } from './resolve';
import { readStackVariantInputs } from './stack-read-inputs';
import {
  DEFAULT_STACK_OPTIONS,
  STACK_DEFAULTS,
  type EvaluateStackOptions,
  type StackLayerInputs,
  type StackLayerSummary,
  type StackVariantInputs,
  type StackVariantResults,
} from './stack-variant';
import type { EquationUsed, VariantInputs } from './variant';

/** Equations a stack result rests on (restating the stack family's documentation, docs/models/stack.md). */
export const STACK_EQUATIONS = {
  richards: {
    id: 'richards-mixed-form',
    title: 'Unsaturated flow through the layers (Richards equation, mixed form)',
    equation: '∂θ/∂t + ∂q/∂x = 0, q = −K(ψ)(∂ψ/∂x − cos β), K = k·kr·ρ·g/η',
    source: 'L. A. Richards, Physics 1 (1931) 318; M. A. Celia, E. T. Bouloutas & R. L. Zarba, Water Resour. Res. 26 (1990) 1483',
  },
  vanGenuchten: {
    id: 'van-genuchten-mualem',
    title: 'Retention and relative permeability (van Genuchten–Mualem)',
    equation: 'Se = [1 + (α·Pc)ⁿ]^(−m), m = 1 − 1/n; kr = Se^L·[1 − (1 − Se^(1/m))^m]²',
    source: 'M. Th. van Genuchten, Soil Sci. Soc. Am. J. 44 (1980) 892; Y. Mualem, Water Resour. Res. 12 (1976) 513',
  },
  brooksCorey: {
    id: 'brooks-corey-burdine',
    title: 'Retention and relative permeability (Brooks–Corey–Burdine)',
    equation: 'Se = (Pb/Pc)^λ for Pc > Pb, else 1; kr = Se^(3 + 2/λ)',
    source: 'R. H. Brooks & A. T. Corey, Hydrology Paper 3, Colorado State University (1964)',
  },
  bundle: {
    id: 'capillary-bundle-retention',
    title: 'Retention from the pore-size distribution (capillary bundle, van Genuchten fit)',
    equation: 'Se(Pc_j) = F_j at Pc_j = 4γ·cos θ/d_j; least-squares van Genuchten fit',
    source: 'Capillary-bundle model and Young–Laplace (J. Bear, Dynamics of Fluids in Porous Media, 1972, §9.2)',
  },
  insult: {
    id: 'insult-ponding',
    title: 'Insult with ponding',
    equation: 'flux Q/A into the surface while it can take it; otherwise liquid stands on the surface (V_s > 0) at pressure head c·V_s',
    source: 'Signorini-type inlet condition; R. G. Mein & C. L. Larson, Water Resour. Res. 9 (1973) 384',
  },
} as const satisfies Record<string, EquationUsed>;

/** Each warning once (several layers may raise the same one). */
function dedupe(warnings: readonly ModelWarning[]): ModelWarning[] {
  return [...new Map(warnings.map((w) => [`${w.code}\u0000${w.message}`, w])).values()];
}

function readLiquid(inputs: StackVariantInputs): LiquidProperties {
  try {
    return liquidAt(inputs.liquid.ref, inputs.liquid.temperature);
  } catch (e) {
    if (!isDomainError(e)) throw e;
    throw new DomainError(e.code, e.message, e.field === 'temperature' ? 'liquid.temperature' : 'liquid.ref', e.details);
  }
}

/** One layer's porosity and permeability through the single-layer resolution (as a horizontal strip). */
function resolveLayer(layer: StackLayerInputs, j: number, inputs: StackVariantInputs, liquid: LiquidProperties, warnings: ModelWarning[]): Resolved {
  const asLayerVariant: VariantInputs = {
    configuration: 'horizontal-strip',
    structure: layer.structure,
    liquid: inputs.liquid,
    dimensions: { width: 1, duration: 1 },
    checkpoints: { heights: [], times: [] },
  };
  const own: ModelWarning[] = [];
  try {
    const { nominal, ctx } = variantParameters(asLayerVariant, liquid);
    const r = resolveVariant(nominal, ctx, own);
    for (const w of own) warnings.push({ code: w.code, message: `${layer.name}: ${w.message}` });
    return r;
  } catch (e) {
    if (isDomainError(e) && e.field?.startsWith('structure')) {
      throw new DomainError(e.code, `${layer.name}: ${e.message}`, `layers[${j}].${e.field}`, e.details);
    }
    throw e;
  }
}

interface LayerPlan {
  readonly solver: StackLayerInput;
  readonly retention: StackLayerSummary['retention'];
  readonly resolved: Resolved;
}

function planLayer(layer: StackLayerInputs, j: number, inputs: StackVariantInputs, liquid: LiquidProperties, warnings: ModelWarning[]): LayerPlan {
  const r = resolveLayer(layer, j, inputs, liquid, warnings);
  const s = layer.structure;
  let retention: RetentionInput;
  let summary: StackLayerSummary['retention'];
  const c = layer.retention;
  switch (c.mode) {
    case 'van-genuchten':
      retention = { kind: 'van-genuchten', alpha: c.alpha, n: c.n, poreConnectivity: c.poreConnectivity };
      summary = { mode: c.mode, alpha: c.alpha, n: c.n, entryPressure: null, lambda: null };
      break;
    case 'brooks-corey':
      retention = { kind: 'brooks-corey', entryPressure: c.entryPressure, lambda: c.lambda };
      summary = { mode: c.mode, alpha: null, n: null, entryPressure: c.entryPressure, lambda: c.lambda };
      break;
    case 'pore-size': {
      // Fitted once here and handed to the solver as the van Genuchten curve it would fit itself
      // (stack/materials.ts: Mualem L = 0.5), so the summary shows the very α and n that were simulated.
      const psd = s.poreSize!;
      let fit;
      try {
        fit = fitPoreSizeRetention({
          diameters: psd.diameters,
          fractions: psd.fractions,
          form: psd.form,
          surfaceTension: liquid.surfaceTension,
          contactAngle: requireInRange(`${layer.name}: contact angle`, s.contactAngle, 0, Math.PI / 2, { max: true }),
        });
      } catch (e) {
        if (!isDomainError(e)) throw e;
        const field = e.field === 'contactAngle' || e.message.includes('contact angle') ? 'structure.contactAngle' : 'structure.poreSize';
        throw new DomainError(e.code, `${layer.name}: ${e.message}`, `layers[${j}].${field}`, e.details);
      }
      for (const w of fit.warnings) warnings.push({ code: w.code, message: `${layer.name}: ${w.message}` });
      retention = { kind: 'van-genuchten', alpha: fit.alpha, n: fit.n, poreConnectivity: 0.5 };
      summary = { mode: c.mode, alpha: fit.alpha, n: fit.n, entryPressure: null, lambda: null };
      break;
    }
  }
  const solver: StackLayerInput = {
    name: layer.name,
    thickness: s.thickness,
    porosity: r.porosity!,
    residualContent: layer.residualContent,
    retention,
    permeability: r.permeability,
    cells: layer.cells,
    initialSaturation: layer.initialSaturation ?? STACK_DEFAULTS.initialSaturation,
  };
  return { solver, retention: summary, resolved: r };
}

/** The solver's field paths → the stack variant's. */
function variantField(field: string | undefined): string | undefined {
  if (field === undefined) return undefined;
  if (field === 'endTime') return 'duration';
  if (field.startsWith('top')) return 'insult';
  if (field.startsWith('liquid')) return 'liquid.ref';
  const m = /^layers\[(\d+)\]\.(thickness|porosity|permeability)/.exec(field);
  if (m) return `layers[${m[1]}].structure.${m[2]}`;
  return field;
}

/** The solver input a stack variant maps to (also what the benchmark note and the CLI can run directly). */
export function stackSolverInput(
  inputs: StackVariantInputs,
  liquid: Pick<LiquidProperties, 'density' | 'viscosity' | 'surfaceTension'>,
  layers: readonly StackLayerInput[],
  options: Required<EvaluateStackOptions>,
): StackInput {
  const ins = inputs.insult;
  const volume = ins.volume / ins.area;
  const rate = ins.rate / ins.area;
  return {
    geometry: 'through-plane',
    layers,
    liquid: { density: liquid.density, viscosity: liquid.viscosity, surfaceTension: liquid.surfaceTension },
    inclination: inputs.inclination ?? 0,
    top: {
      kind: 'insults',
      insults: Array.from({ length: ins.count }, (_, k) => ({ start: k * (ins.interval ?? 0), volume, rate })),
    },
    bottom: { kind: inputs.bottom ?? 'no-flow' },
    endTime: inputs.duration,
    cells: inputs.cells ?? STACK_DEFAULTS.cells,
    snapshots: options.snapshots,
    upperLayers: inputs.upperLayers ?? STACK_DEFAULTS.upperLayers,
  };
}

const round4 = (x: number) => Math.round(x * 1e4) / 1e4;

function equationsFor(inputs: StackVariantInputs, plans: readonly LayerPlan[]): EquationUsed[] {
  const out: EquationUsed[] = [STACK_EQUATIONS.richards];
  const modes = new Set(inputs.layers.map((l) => l.retention.mode));
  if (modes.has('van-genuchten') || modes.has('pore-size')) out.push(STACK_EQUATIONS.vanGenuchten);
  if (modes.has('brooks-corey')) out.push(STACK_EQUATIONS.brooksCorey);
  if (modes.has('pore-size')) out.push(STACK_EQUATIONS.bundle);
  if (inputs.layers.some((l) => l.structure.porosity === undefined)) out.push(VARIANT_EQUATIONS.porosity);
  const seen = new Set<string>();
  for (const p of plans) {
    const pr = p.resolved.permeabilityResult;
    if (pr && !seen.has(pr.label)) {
      seen.add(pr.label);
      out.push(permeabilityEquation(pr.label, pr.source));
    }
  }
  out.push(STACK_EQUATIONS.insult);
  return out;
}

/** The design-workspace summary of a solver result. */
function summarise(inputs: StackVariantInputs, liquid: LiquidProperties, plans: readonly LayerPlan[], r: StackResult, warnings: ModelWarning[]): StackVariantResults {
  const area = inputs.insult.area;
  const snap = r.snapshots;
  const cells = snap.cells;
  const rows: number[][] = [];
  for (let k = 0; k < snap.times.length; k++) {
    const row = new Array<number>(cells);
    for (let i = 0; i < cells; i++) row[i] = round4(snap.saturation[k * cells + i]);
    rows.push(row);
  }
  const poreVolumes = inputs.layers.map((l, j) => plans[j].resolved.porosity! * l.structure.thickness);
  const poreVolume = poreVolumes.reduce((a, b) => a + b, 0);
  const solverInput = r.inputs;
  const { name, temperature, surfaceTension, viscosity, density, sources, flammable } = liquid;
  return {
    status: 'ok',
    run: r.status,
    coreVersion: WICK_CORE_VERSION,
    configuration: 'stack',
    liquid: { name, temperature, surfaceTension, viscosity, density, sources, flammable: flammable === true },
    layers: inputs.layers.map((l, j) => {
      const res = plans[j].resolved;
      const pr = res.permeabilityResult;
      const lr = r.layers[j];
      return {
        name: l.name,
        web: l.structure.web ?? null,
        thickness: l.structure.thickness,
        porosity: res.porosity!,
        porositySource: l.structure.porosity === undefined ? 'basis weight' : 'measured',
        permeability: res.permeability,
        permeabilityLabel: pr ? pr.label : 'Measured',
        permeabilitySource: pr ? pr.source : (l.structure.sources?.['permeability'] ?? null),
        permeabilityInRange: pr ? pr.inValidityRange : null,
        retention: plans[j].retention,
        poreVolume: poreVolumes[j],
        liquidStart: lr.liquidStart,
        liquidEnd: lr.liquidEnd,
        saturationEnd: lr.saturationEnd,
      };
    }),
    insult: {
      area,
      volumePerArea: inputs.insult.volume / area,
      ratePerArea: inputs.insult.rate / area,
      starts: solverInput.top.kind === 'insults' ? solverInput.top.insults.map((i) => i.start) : [],
    },
    insults: r.insults.map((i) => ({
      start: i.start,
      deliveryTime: i.deliveryTime,
      acquisitionTime: i.acquisitionTime,
      pondingTime: i.pondingTime,
      peakSurfaceLiquid: i.peakSurfaceLiquid * area,
    })),
    timeReached: r.timeReached,
    totals: {
      supplied: r.totals.supplied * area,
      absorbed: r.totals.absorbed * area,
      drained: r.totals.drained * area,
      surfaceLiquid: r.totals.surfaceLiquid * area,
      stored: r.totals.storedEnd * area,
      poreVolume: poreVolume * area,
      upperLayerLiquid: r.upperLayerLiquid * area,
    },
    capacityUsed: r.totals.storedEnd / poreVolume,
    upperLayers: solverInput.upperLayers ?? STACK_DEFAULTS.upperLayers,
    massBalance: { absoluteError: r.massBalance.absoluteError * area, relativeError: r.massBalance.relativeError },
    heatMap: {
      times: Array.from(snap.times),
      depth: Array.from(r.grid.centres),
      boundaries: Array.from(r.grid.boundaries),
      saturation: rows,
    },
    curves: {
      time: Array.from(snap.times),
      supplied: Array.from(snap.supplied, (v) => v * area),
      absorbed: Array.from(snap.absorbed, (v) => v * area),
      surfaceLiquid: Array.from(snap.surfaceLiquid, (v) => v * area),
      frontDepth: Array.from(snap.frontPositions),
    },
    stats: { cells, steps: r.stats.steps, rejectedSteps: r.stats.rejectedSteps, iterations: r.stats.iterations },
    equations: equationsFor(inputs, plans),
    warnings: dedupe([...warnings, ...r.warnings]),
  };
}

/**
 * Evaluates a stack variant: checks the inputs (untrusted JSON is fine), resolves each layer, runs the
 * Richards solver and summarises. `run` passes progress and cancellation through to the solver (Web Worker);
 * a cancelled run returns what was computed so far with `run: 'cancelled'`.
 * @throws DomainError naming the variant's field path.
 */
export function evaluateStackVariant(raw: unknown, options: EvaluateStackOptions = {}, run: StackRunOptions = {}): StackVariantResults {
  const inputs = readStackVariantInputs(raw);
  const snapshots = options.snapshots ?? DEFAULT_STACK_OPTIONS.snapshots;
  if (!Number.isInteger(snapshots)) throw new DomainError('invalid-input', `snapshots must be an integer (got ${snapshots}).`, 'snapshots');
  requireInRange('snapshots', snapshots, 11, 401);
  const liquid = readLiquid(inputs);
  const warnings: ModelWarning[] = [...liquid.warnings];
  const plans = inputs.layers.map((l, j) => planLayer(l, j, inputs, liquid, warnings));
  const input = stackSolverInput(inputs, liquid, plans.map((p) => p.solver), { snapshots });
  let result: StackResult;
  try {
    result = simulateStack(input, run);
  } catch (e) {
    if (!isDomainError(e)) throw e;
    throw new DomainError(e.code, e.message, variantField(e.field), e.details);
  }
  return summarise(inputs, liquid, plans, result, warnings);
}

/**
 * Key figures of a stack result for lists, the compare table and reports (same shape as a layer variant's):
 * acquisition time of each gush (lower is better), liquid left on the surface and in the upper layers
 * (rewet indicator; lower is better), capacity used, absorbed volume and the mass-balance error.
 */
export function stackKeyFigures(results: StackVariantResults): KeyFigure[] {
  const out: KeyFigure[] = results.insults.map((ins, k) => ({
    key: `acquisition@${k + 1}`,
    label: `Acquisition time, gush ${k + 1}`,
    unit: 's',
    value: ins.acquisitionTime,
    better: 'lower',
    nullMeans: 'not reached',
  }));
  const t = results.totals;
  const upper = results.upperLayers === 1 ? (results.layers[0]?.name ?? 'top layer') : `top ${results.upperLayers} layers`;
  out.push(
    { key: 'surfaceLiquidEnd', label: 'Liquid on the surface at the end', unit: 'm^3', value: t.surfaceLiquid, better: 'lower' },
    { key: 'rewetIndicator', label: `Liquid left in ${upper} (rewet indicator)`, unit: 'm^3', value: t.upperLayerLiquid, better: 'lower' },
    // A volume fraction (liquid held / pore volume): shown as a percentage.
    { key: 'capacityUsed', label: 'Capacity used', unit: 'm^3/m^3', value: results.capacityUsed, better: 'lower' },
    { key: 'absorbed', label: 'Liquid absorbed by the end', unit: 'm^3', value: t.absorbed, better: 'higher' },
    { key: 'stackPoreVolume', label: 'Pore volume of the stack', unit: 'm^3', value: t.poreVolume, better: 'higher' },
    { key: 'massBalanceError', label: 'Mass-balance error (relative)', unit: '1', value: results.massBalance.relativeError, better: null },
  );
  return out;
}
