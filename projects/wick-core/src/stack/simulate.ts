import { STANDARD_GRAVITY } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { requireFinite, requireInRange, requireNonNegative, requirePositive } from '../validate';
import { buildGrid, shareCells, type StackGrid } from './grid';
import { checkLiquid, layerHydraulics } from './materials';
import type { HydraulicFunctions } from './retention';
import { solveRichards, type BottomCondition, type InsultWindow, type RichardsSettings, type TopPhase } from './solver';
import type {
  InsultInput,
  InsultResult,
  LayerLiquidResult,
  StackInput,
  StackResult,
  StackRunOptions,
  StackSolverOptions,
} from './types';

const MAX_CELLS = 20_000;
const MAX_SNAPSHOT_VALUES = 20_000_000;

function requireInteger(field: string, value: number, min: number, max: number): number {
  requireInRange(field, value, min, max);
  if (!Number.isInteger(value)) {
    throw new DomainError('invalid-input', `${field} must be a whole number (got ${value}).`, field);
  }
  return value;
}

function requireObject(field: string, value: unknown, what: string): void {
  if (value === null || typeof value !== 'object') {
    throw new DomainError('invalid-input', `${field} is missing: ${what}.`, field);
  }
}

interface Checked {
  readonly inputs: StackInput;
  readonly grid: StackGrid;
  readonly materials: HydraulicFunctions[];
  readonly names: string[];
  readonly cosBeta: number;
  readonly psiInitial: Float64Array;
  readonly topPhases: TopPhase[];
  readonly insults: InsultInput[];
  readonly windows: InsultWindow[];
  readonly bottom: BottomCondition;
  readonly settings: RichardsSettings;
  readonly snapshots: number;
  readonly upperLayers: number;
  readonly frontThreshold: number;
  readonly warnings: ModelWarning[];
}

function checkInput(input: StackInput): Checked {
  requireObject('input', input, 'give layers, liquid, top condition and endTime');
  const warnings: ModelWarning[] = [];
  const geometry = input.geometry ?? 'through-plane';
  if (geometry !== 'through-plane' && geometry !== 'in-plane') {
    throw new DomainError('invalid-input', `geometry must be 'through-plane' or 'in-plane' (got ${String(geometry)}).`, 'geometry');
  }
  const inPlane = geometry === 'in-plane';
  const liquid = checkLiquid(input.liquid);
  const rhoG = liquid.density * STANDARD_GRAVITY;
  const endTime = requirePositive('endTime', input.endTime);
  if (!Array.isArray(input.layers) || input.layers.length === 0) {
    throw new DomainError('insufficient-data', 'Give at least one layer.', 'layers');
  }
  if (input.layers.length > 100) throw new DomainError('out-of-range', 'At most 100 layers are supported.', 'layers');
  const inclination =
    input.inclination === undefined ? (inPlane ? Math.PI / 2 : 0) : requireInRange('inclination', input.inclination, 0, Math.PI);
  // cos(π/2) is 6e-17, not 0: snap so a horizontal axis has no gravity at all.
  const cosBeta = Math.abs(Math.cos(inclination)) < 1e-12 ? 0 : Math.cos(inclination);

  const materials: HydraulicFunctions[] = [];
  const names: string[] = [];
  const fixedCells: (number | undefined)[] = [];
  const gradings: number[] = [];
  input.layers.forEach((layer, j) => {
    const f = `layers[${j}]`;
    requireObject(f, layer, 'a layer needs thickness, porosity, retention and permeability');
    requirePositive(`${f}.thickness`, layer.thickness);
    materials.push(layerHydraulics(layer, liquid, inPlane, f, warnings));
    names.push(layer.name ?? `layer ${j + 1}`);
    fixedCells.push(layer.cells === undefined ? undefined : requireInteger(`${f}.cells`, layer.cells, 1, MAX_CELLS));
    gradings.push(layer.grading === undefined ? 1 : requireInRange(`${f}.grading`, layer.grading, 0.2, 5));
  });
  const total = input.cells === undefined ? 100 : requireInteger('cells', input.cells, 1, MAX_CELLS);
  const thicknesses = input.layers.map((l) => l.thickness);
  const counts = shareCells(thicknesses, fixedCells, total);
  const cellCount = counts.reduce((a, b) => a + b, 0);
  if (cellCount > MAX_CELLS) {
    throw new DomainError('out-of-range', `The grid would have ${cellCount} cells; at most ${MAX_CELLS} are supported.`, 'cells');
  }
  counts.forEach((c, j) => {
    if (Math.abs(Math.log(gradings[j])) * (c - 1) > Math.log(1e6)) {
      throw new DomainError(
        'out-of-range',
        `${names[j]}: grading ${gradings[j]} over ${c} cells makes the largest cell more than 10⁶ times the smallest.`,
        `layers[${j}].grading`,
      );
    }
    if (c < 3) {
      warnings.push({
        code: 'few-cells',
        message: `${names[j]} has only ${c} cell(s); fronts inside it are poorly resolved.`,
      });
    }
  });
  const grid = buildGrid(thicknesses.map((t, j) => ({ thickness: t, cells: counts[j], grading: gradings[j] })));

  // Initial state.
  const initialPressure =
    input.initialPressure === undefined ? undefined : requireFinite('initialPressure', input.initialPressure);
  const layerPsi = input.layers.map((layer, j) => {
    const m = materials[j];
    if (layer.initialSaturation !== undefined) {
      const sMin = m.thetaR / m.thetaS;
      const s = requireInRange(`layers[${j}].initialSaturation`, layer.initialSaturation, sMin, 1, { min: true });
      return m.headAtEffectiveSaturation((s * m.thetaS - m.thetaR) / (m.thetaS - m.thetaR));
    }
    if (initialPressure === undefined) {
      throw new DomainError(
        'insufficient-data',
        `Give ${names[j]} an initial saturation, or give an initial pressure for the whole stack.`,
        `layers[${j}].initialSaturation`,
      );
    }
    return initialPressure / rhoG;
  });
  const psiInitial = new Float64Array(grid.cellCount);
  for (let i = 0; i < grid.cellCount; i++) psiInitial[i] = layerPsi[grid.layerOf[i]];
  if (!psiInitial.every(Number.isFinite)) {
    throw new DomainError('out-of-range', 'An initial saturation is too close to the residual content to be represented.', 'layers');
  }

  // Inlet.
  requireObject('top', input.top, "give the inlet condition ('insults', 'pressure' or 'no-flow')");
  const topPhases: TopPhase[] = [];
  const insults: InsultInput[] = [];
  const windows: InsultWindow[] = [];
  switch (input.top.kind) {
    case 'insults': {
      if (!Array.isArray(input.top.insults)) {
        throw new DomainError('invalid-input', 'top.insults must be a list of insults.', 'top.insults');
      }
      input.top.insults.forEach((ins, k) => {
        const f = `top.insults[${k}]`;
        requireObject(f, ins, 'an insult needs start, volume and rate');
        insults.push({
          start: requireNonNegative(`${f}.start`, ins.start),
          volume: requirePositive(`${f}.volume`, ins.volume),
          rate: requirePositive(`${f}.rate`, ins.rate),
        });
      });
      insults.sort((a, b) => a.start - b.start);
      insults.forEach((ins, k) => {
        const end = ins.start + ins.volume / ins.rate;
        if (k + 1 < insults.length && end > insults[k + 1].start + 1e-12 * endTime) {
          throw new DomainError(
            'invalid-input',
            `Insult ${k + 1} is still being delivered when insult ${k + 2} starts; deliveries must not overlap.`,
            'top.insults',
          );
        }
        if (ins.start >= endTime) {
          warnings.push({ code: 'insult-after-end', message: `Insult ${k + 1} starts at or after the end of the run.` });
        } else if (end > endTime) {
          warnings.push({ code: 'insult-cut', message: `Insult ${k + 1} is still being delivered when the run ends.` });
        }
        topPhases.push({ start: ins.start, end, kind: 'flux', rate: ins.rate, psi: 0 });
        windows.push({ start: ins.start, end, volume: ins.volume });
      });
      break;
    }
    case 'pressure': {
      const pressure = requireFinite('top.pressure', input.top.pressure);
      const until = input.top.until === undefined ? 2 * endTime : requirePositive('top.until', input.top.until);
      topPhases.push({ start: 0, end: until, kind: 'pressure', rate: 0, psi: pressure / rhoG });
      break;
    }
    case 'no-flow':
      break;
    default:
      throw new DomainError('invalid-input', "top.kind must be 'insults', 'pressure' or 'no-flow'.", 'top.kind');
  }

  let bottom: BottomCondition;
  const b = input.bottom ?? { kind: 'no-flow' };
  requireObject('bottom', b, "give the far-face condition ('no-flow', 'free-drainage' or 'pressure')");
  switch (b.kind) {
    case 'no-flow':
    case 'free-drainage':
      bottom = { kind: b.kind };
      break;
    case 'pressure':
      bottom = { kind: 'pressure', psi: requireFinite('bottom.pressure', b.pressure) / rhoG };
      break;
    default:
      throw new DomainError('invalid-input', "bottom.kind must be 'no-flow', 'free-drainage' or 'pressure'.", 'bottom.kind');
  }
  if (bottom.kind === 'free-drainage' && cosBeta <= 0) {
    warnings.push({
      code: 'free-drainage-no-gravity',
      message: 'Free drainage needs gravity along the axis; with this inclination the far face lets nothing out.',
    });
  }

  const s: StackSolverOptions = input.solver ?? {};
  requireObject('solver', s, 'solver options');
  const initialStep = s.initialStep === undefined ? Math.min(1e-3, endTime / 100) : requirePositive('solver.initialStep', s.initialStep);
  const minStep = s.minStep === undefined ? Math.min(1e-9, initialStep / 10) : requirePositive('solver.minStep', s.minStep);
  const maxStep = s.maxStep === undefined ? endTime / 20 : requirePositive('solver.maxStep', s.maxStep);
  if (minStep > initialStep || minStep > maxStep) {
    throw new DomainError('invalid-input', 'solver.minStep must not exceed solver.initialStep or solver.maxStep.', 'solver.minStep');
  }
  const faceConductivity = s.faceConductivity ?? 'arithmetic';
  if (!['upstream', 'arithmetic', 'harmonic'].includes(faceConductivity)) {
    throw new DomainError(
      'invalid-input',
      "solver.faceConductivity must be 'upstream', 'arithmetic' or 'harmonic'.",
      'solver.faceConductivity',
    );
  }
  const settings: RichardsSettings = {
    initialStep,
    minStep,
    maxStep,
    maxIterations: s.maxIterations === undefined ? 25 : requireInteger('solver.maxIterations', s.maxIterations, 2, 1000),
    maxSaturationChange:
      s.maxSaturationChange === undefined
        ? 0.1
        : requireInRange('solver.maxSaturationChange', s.maxSaturationChange, 0, 1, { min: true }),
    faceConductivity,
  };

  const snapshots = input.snapshots === undefined ? 61 : requireInteger('snapshots', input.snapshots, 2, 100_000);
  if (snapshots * grid.cellCount > MAX_SNAPSHOT_VALUES) {
    throw new DomainError(
      'out-of-range',
      `${snapshots} snapshots of ${grid.cellCount} cells are too many values; ask for fewer snapshots.`,
      'snapshots',
    );
  }
  const upperLayers =
    input.upperLayers === undefined ? 1 : requireInteger('upperLayers', input.upperLayers, 1, input.layers.length);
  const frontThreshold =
    input.frontThreshold === undefined
      ? 0.05
      : requireInRange('frontThreshold', input.frontThreshold, 0, 1, { min: true, max: true });

  const inputs: StackInput = {
    ...input,
    geometry,
    inclination,
    bottom: b,
    cells: total,
    snapshots,
    upperLayers,
    frontThreshold,
    solver: { ...settings },
  };
  return {
    inputs,
    grid,
    materials,
    names,
    cosBeta,
    psiInitial,
    topPhases,
    insults,
    windows,
    bottom,
    settings,
    snapshots,
    upperLayers,
    frontThreshold,
    warnings,
  };
}

/**
 * Deepest position where the saturation rose by at least `threshold` over its initial value, m;
 * linear interpolation between the cell centres on either side of the crossing, 0 when nowhere.
 */
export function frontPosition(
  saturation: ArrayLike<number>,
  initial: ArrayLike<number>,
  centres: ArrayLike<number>,
  length: number,
  threshold: number,
  offset = 0,
): number {
  const n = centres.length;
  for (let i = n - 1; i >= 0; i--) {
    const d = saturation[offset + i] - initial[i];
    if (d >= threshold) {
      if (i === n - 1) return length;
      const dNext = saturation[offset + i + 1] - initial[i + 1];
      const a = (d - threshold) / (d - dNext);
      return centres[i] + a * (centres[i + 1] - centres[i]);
    }
  }
  return 0;
}

/**
 * Liquid uptake and redistribution in a layered absorbent stack: one-dimensional Richards equation.
 *
 *   ∂θ/∂t = ∂/∂x [K(ψ) (∂ψ/∂x − cos β)],   ψ = p/(ρ g)
 *
 * θ liquid content (−), ψ pressure head (m), K = Ks kr (m/s), Ks = k ρ g/η, x (m) from the inlet face,
 * β (rad) the axis angle to the downward vertical. Retention per layer: van Genuchten–Mualem,
 * Brooks–Corey–Burdine or a capillary-bundle pore-size distribution (see retention.ts, pore-size-fit.ts).
 * Numerics: cell-centred finite volumes, mixed-form modified Picard, backward Euler with adaptive steps
 * (Celia, Bouloutas & Zarba, Water Resour. Res. 26 (1990) 1483); inlet surface store with automatic
 * switching between flux and ponded conditions (solver.ts).
 *
 * Validity: rigid, non-swelling layers (no superabsorbent gel kinetics), no hysteresis, no air
 * entrapment, isothermal, Darcy flow. Results are engineering estimates: confirm with standard
 * acquisition/rewet tests, local regulations and qualified review before decisions on skin-worn products.
 *
 * @param input layers, liquid, inlet/outlet conditions and run settings (see {@link StackInput}).
 * @param options progress callback and cancellation check for Web Workers.
 * @throws DomainError on invalid input or when the solver cannot converge.
 */
export function simulateStack(input: StackInput, options: StackRunOptions = {}): StackResult {
  const c = checkInput(input);
  const { grid, warnings } = c;
  const n = grid.cellCount;
  const out = solveRichards({
    grid,
    materials: c.materials,
    cosBeta: c.cosBeta,
    psiInitial: c.psiInitial,
    topPhases: c.topPhases,
    insults: c.windows,
    bottom: c.bottom,
    endTime: input.endTime,
    snapshotCount: c.snapshots,
    settings: c.settings,
    onProgress: options.onProgress,
    shouldCancel: options.shouldCancel,
  });

  // Front positions from the snapshot rows.
  const rows = out.snapshotTimes.length;
  const initialS = new Float64Array(n);
  for (let i = 0; i < n; i++) initialS[i] = out.thetaStart[i] / c.materials[grid.layerOf[i]].thetaS;
  const fronts = new Float64Array(rows);
  for (let k = 0; k < rows; k++) {
    fronts[k] = frontPosition(out.saturation, initialS, grid.centres, grid.length, c.frontThreshold, k * n);
  }

  // Liquid per layer.
  const layerStart = new Float64Array(c.materials.length);
  const layerEnd = new Float64Array(c.materials.length);
  const layerPores = new Float64Array(c.materials.length);
  let storedStart = 0;
  let storedEnd = 0;
  let poreVolume = 0;
  for (let i = 0; i < n; i++) {
    const j = grid.layerOf[i];
    const wi = grid.widths[i];
    layerStart[j] += wi * out.thetaStart[i];
    layerEnd[j] += wi * out.thetaEnd[i];
    layerPores[j] += wi * c.materials[j].thetaS;
    storedStart += wi * out.thetaStart[i];
    storedEnd += wi * out.thetaEnd[i];
    poreVolume += wi * c.materials[j].thetaS;
  }
  const layers: LayerLiquidResult[] = c.materials.map((_, j) => ({
    name: c.names[j],
    thickness: input.layers[j].thickness,
    liquidStart: layerStart[j],
    liquidEnd: layerEnd[j],
    saturationEnd: layerEnd[j] / layerPores[j],
  }));
  let upperLayerLiquid = 0;
  for (let j = 0; j < c.upperLayers; j++) upperLayerLiquid += layerEnd[j];

  const absoluteError =
    storedEnd + out.surfaceEnd - (storedStart + out.surfaceStart) - (out.totalExternalIn - out.totalDrained);
  const scale = Math.max(Math.abs(out.totalAbsorbed), Math.abs(out.totalDrained), 1e-9 * poreVolume);
  const relativeError = Math.abs(absoluteError) / scale;

  const insults: InsultResult[] = c.insults.map((ins, k) => ({
    start: ins.start,
    volume: ins.volume,
    rate: ins.rate,
    deliveryTime: ins.volume / ins.rate,
    acquisitionTime: out.acquisitionTimes[k],
    pondingTime: out.pondingTimes[k],
    peakSurfaceLiquid: out.peakSurfaceLiquid[k],
  }));
  insults.forEach((ins, k) => {
    if (ins.acquisitionTime === null && ins.start < out.timeReached) {
      warnings.push({
        code: 'acquisition-not-reached',
        message:
          `Insult ${k + 1}: liquid still stood on the surface ` +
          (k + 1 < insults.length && insults[k + 1].start < out.timeReached ? 'when the next insult started.' : 'at the end of the run.'),
      });
    }
  });
  const freeSpace = poreVolume - storedStart;
  if (out.totalSupplied > freeSpace) {
    warnings.push({
      code: 'capacity-exceeded',
      message:
        `The insults deliver ${(out.totalSupplied * 1e3).toPrecision(3)} mm of liquid per area but the stack has ` +
        `only ${(freeSpace * 1e3).toPrecision(3)} mm of free pore volume; the rest cannot be taken up.`,
    });
  }
  if (relativeError > 1e-6) {
    warnings.push({
      code: 'mass-balance',
      message: `The mass balance closes only to ${relativeError.toExponential(1)} of the absorbed volume.`,
    });
  }
  if (out.status === 'cancelled') {
    warnings.push({ code: 'cancelled', message: `Stopped on request at t = ${out.timeReached.toPrecision(4)} s.` });
  }
  warnings.push({
    code: 'engineering-estimate',
    message:
      'Engineering estimate from an idealised model (rigid layers, no swelling or hysteresis); confirm with standard ' +
      'acquisition and rewet tests, local regulations and qualified review before decisions on skin-worn products.',
  });

  return {
    inputs: c.inputs,
    warnings,
    status: out.status,
    timeReached: out.timeReached,
    geometry: c.inputs.geometry ?? 'through-plane',
    grid: {
      centres: Float64Array.from(grid.centres),
      widths: Float64Array.from(grid.widths),
      layerIndex: Int32Array.from(grid.layerOf),
      boundaries: Float64Array.from(grid.boundaries),
    },
    snapshots: {
      times: out.snapshotTimes,
      cells: n,
      saturation: out.saturation,
      frontPositions: fronts,
      absorbed: out.absorbed,
      surfaceLiquid: out.surfaceLiquid,
      supplied: out.supplied,
      drained: out.drained,
    },
    insults,
    layers,
    upperLayerLiquid,
    totals: {
      supplied: out.totalSupplied,
      absorbed: out.totalAbsorbed,
      drained: out.totalDrained,
      surfaceLiquid: out.surfaceEnd,
      storedStart,
      storedEnd,
    },
    massBalance: { absoluteError, relativeError },
    stats: {
      steps: out.steps,
      rejectedSteps: out.rejectedSteps,
      iterations: out.iterations,
      maxIterationsInStep: out.maxIterationsInStep,
      smallestStep: out.smallestStep,
      largestStep: out.largestStep,
    },
  };
}
