import type { ResultBase } from '../api/model-spec';
import { DomainError, type ModelWarning } from '../errors';
import { requireFraction, requirePositive } from '../validate';

/**
 * Permeability correlations for beds of cylindrical fibres of diameter d (radius r = d/2) at porosity ε,
 * solid fraction c = 1 − ε. All return the Darcy permeability K in m².
 *
 * Kozeny–Carman (Carman 1937), with the fibre specific surface S = 4/d per fibre volume:
 *   K = ε³/(k_K S²(1 − ε)²) = d² ε³/(16 k_K (1 − ε)²),  k_K = 5.
 * Davies (1952), air filters:
 *   K = d²/(64 c^{3/2}(1 + 56 c³)),  0.006 ≤ c ≤ 0.3.
 * Happel (1959) free-surface cell model:
 *   across the fibres  K = (r²/(8c))·[−ln c − (1 − c²)/(1 + c²)]
 *   along the fibres   K = (r²/(4c))·[−ln c − 3/2 + 2c − c²/2]
 * Jackson & James (1986), 3-D isotropic random fibres (dilute):
 *   K = (3r²/(20c))·(−ln c − 0.931)
 * Gebart (1992), ordered unidirectional arrays:
 *   along   K = (8r²/C)·ε³/c²,  C = 57 (quadratic), 53 (hexagonal)
 *   across  K = C₁·(√(c_max/c) − 1)^{5/2}·r²,  C₁ = 16/(9π√2), c_max = π/4 (quadratic);
 *                                               C₁ = 16/(9π√6), c_max = π/(2√3) (hexagonal)
 * Tomadakis & Robertson (2005), random fibre structures (percolation form):
 *   K = r²·ε/(8 (ln ε)²)·(ε − ε_p)^{α+2}/((1 − ε_p)^α·((α + 1)ε − ε_p)²)
 *   with (ε_p, α) per structure and flow direction (table below, from memory).
 *
 * Sources: P. C. Carman, Trans. Inst. Chem. Eng. 15 (1937) 150–166; C. N. Davies, Proc. Inst. Mech. Eng. 1B
 * (1952) 185–213; J. Happel, AIChE J. 5 (1959) 174–177; G. W. Jackson & D. F. James, Can. J. Chem. Eng. 64
 * (1986) 364–374; B. R. Gebart, J. Compos. Mater. 26 (1992) 1100–1133; M. M. Tomadakis & T. J. Robertson,
 * J. Compos. Mater. 39 (2005) 163–188 (parameters after M. M. Tomadakis & S. V. Sotirchos, AIChE J. 39 (1993)
 * 397). Equations as commonly quoted; the validity ranges marked "from memory" should be read as guidance.
 */

export type FlowDirection = 'isotropic' | 'across' | 'along' | 'in-plane' | 'through-plane';

export interface PermeabilityInput {
  /** Fibre diameter d, m (for blends, the surface-equivalent diameter 4/S_v). */
  readonly fibreDiameter: number;
  /** Porosity ε, 0 < ε < 1. */
  readonly porosity: number;
}

export interface PermeabilityResult extends ResultBase<PermeabilityInput & Record<string, unknown>> {
  /** Correlation id, e.g. 'gebart-across-hexagonal'. */
  readonly correlation: string;
  readonly label: string;
  readonly direction: FlowDirection;
  /** K, m²; null where the formula has no physical value (e.g. beyond maximum packing). */
  readonly permeability: number | null;
  readonly solidFraction: number;
  /** Solid-fraction range the source supports. */
  readonly validSolidFraction: { readonly min: number; readonly max: number };
  readonly inValidityRange: boolean;
  readonly source: string;
}

interface Descriptor {
  readonly id: string;
  readonly label: string;
  readonly direction: FlowDirection;
  readonly source: string;
  readonly min: number;
  readonly max: number;
  /** K/d² from c and ε = 1 − c; null where undefined. */
  readonly k: (c: number, eps: number) => number | null;
}

function check(input: PermeabilityInput): { d: number; eps: number; c: number } {
  const d = requirePositive('fibreDiameter', input.fibreDiameter);
  const eps = requireFraction('porosity', input.porosity);
  return { d, eps, c: 1 - eps };
}

function evaluate(desc: Descriptor, input: PermeabilityInput, extra: Record<string, unknown> = {}): PermeabilityResult {
  const { d, eps, c } = check(input);
  const kd2 = desc.k(c, eps);
  const warnings: ModelWarning[] = [];
  const inValidityRange = c >= desc.min && c <= desc.max;
  if (!inValidityRange) {
    warnings.push({
      code: 'outside-validity',
      message:
        `${desc.label}: solid fraction ${c.toPrecision(3)} lies outside the range ` +
        `${desc.min}–${desc.max.toPrecision(3)} the correlation was made for; treat the value as an extrapolation.`,
    });
  }
  if (kd2 === null) {
    warnings.push({
      code: 'not-applicable',
      message: `${desc.label}: the formula gives no physical permeability at solid fraction ${c.toPrecision(3)}.`,
    });
  }
  return {
    inputs: { fibreDiameter: d, porosity: eps, ...extra },
    warnings,
    correlation: desc.id,
    label: desc.label,
    direction: desc.direction,
    permeability: kd2 === null ? null : kd2 * d * d,
    solidFraction: c,
    validSolidFraction: { min: desc.min, max: desc.max },
    inValidityRange,
    source: desc.source,
  };
}

// ---- individual formulas, as K/d² (r² = d²/4) ----

/** Kozeny–Carman K/d² = ε³/(16 k_K c²). */
function kozenyCarmanKd2(c: number, eps: number, kozenyConstant: number): number {
  return (eps * eps * eps) / (16 * kozenyConstant * c * c);
}

const KOZENY_CARMAN_SOURCE = 'P. C. Carman, Trans. Inst. Chem. Eng. 15 (1937) 150';

/**
 * Kozeny descriptors by constant, kept: the Monte Carlo band asks for the correlation a thousand times per
 * keystroke with one constant, and building the label and closure each time was a noticeable share of its work.
 * The constants come from input, so the cache is emptied when it grows.
 */
const KOZENY_DESCRIPTORS = new Map<number, Descriptor>();

function kozenyDescriptor(kozenyConstant: number): Descriptor {
  const kept = KOZENY_DESCRIPTORS.get(kozenyConstant);
  if (kept) return kept;
  if (KOZENY_DESCRIPTORS.size >= 64) KOZENY_DESCRIPTORS.clear();
  const desc: Descriptor = {
    id: 'kozeny-carman',
    label: `Kozeny–Carman (k = ${kozenyConstant})`,
    direction: 'isotropic',
    source: KOZENY_CARMAN_SOURCE,
    // Granular beds; for fibre beds the Kozeny "constant" rises steeply above ε ≈ 0.8 (common practice).
    min: 0.2,
    max: 0.7,
    k: (c, eps) => kozenyCarmanKd2(c, eps, kozenyConstant),
  };
  KOZENY_DESCRIPTORS.set(kozenyConstant, desc);
  return desc;
}

const DAVIES: Descriptor = {
  id: 'davies',
  label: 'Davies (1952)',
  direction: 'through-plane',
  source: 'C. N. Davies, Proc. Inst. Mech. Eng. 1B (1952) 185',
  min: 0.006,
  max: 0.3,
  k: (c) => 1 / (64 * Math.pow(c, 1.5) * (1 + 56 * c * c * c)),
};

const HAPPEL_ACROSS: Descriptor = {
  id: 'happel-across',
  label: 'Happel (1959), across fibres',
  direction: 'across',
  source: 'J. Happel, AIChE J. 5 (1959) 174',
  // Cell models are dilute-array approximations (range from memory).
  min: 0,
  max: 0.4,
  k: (c) => (1 / (32 * c)) * (-Math.log(c) - (1 - c * c) / (1 + c * c)),
};

const HAPPEL_ALONG: Descriptor = {
  id: 'happel-along',
  label: 'Happel (1959), along fibres',
  direction: 'along',
  source: 'J. Happel, AIChE J. 5 (1959) 174',
  min: 0,
  max: 0.4,
  k: (c) => (1 / (16 * c)) * (-Math.log(c) - 1.5 + 2 * c - (c * c) / 2),
};

const JACKSON_JAMES: Descriptor = {
  id: 'jackson-james',
  label: 'Jackson & James (1986), 3-D random',
  direction: 'isotropic',
  source: 'G. W. Jackson & D. F. James, Can. J. Chem. Eng. 64 (1986) 364',
  // Dilute theory; the bracket vanishes at c = e^−0.931 ≈ 0.394 (range from memory).
  min: 0,
  max: 0.3,
  k: (c) => {
    const bracket = -Math.log(c) - 0.931;
    return bracket > 0 ? ((3 / (80 * c)) * bracket) : null;
  },
};

export type GebartPacking = 'quadratic' | 'hexagonal';

/** Gebart (1992) constants per packing. */
export const GEBART_CONSTANTS: Readonly<Record<GebartPacking, { c: number; c1: number; maxSolidFraction: number }>> = {
  quadratic: { c: 57, c1: 16 / (9 * Math.PI * Math.SQRT2), maxSolidFraction: Math.PI / 4 },
  hexagonal: { c: 53, c1: 16 / (9 * Math.PI * Math.sqrt(6)), maxSolidFraction: Math.PI / (2 * Math.sqrt(3)) },
};

const GEBART_SOURCE = 'B. R. Gebart, J. Compos. Mater. 26 (1992) 1100';
/** Lower end of Gebart's intended range: fibre volume fractions of composite preforms (from memory). */
const GEBART_MIN = 0.35;

function gebartAlong(packing: GebartPacking): Descriptor {
  const { c: cg, maxSolidFraction } = GEBART_CONSTANTS[packing];
  return {
    id: `gebart-along-${packing}`,
    label: `Gebart (1992), along fibres, ${packing}`,
    direction: 'along',
    source: GEBART_SOURCE,
    min: GEBART_MIN,
    max: maxSolidFraction,
    k: (c, eps) => (c > maxSolidFraction ? null : (2 / cg) * ((eps * eps * eps) / (c * c))),
  };
}

function gebartAcross(packing: GebartPacking): Descriptor {
  const { c1, maxSolidFraction } = GEBART_CONSTANTS[packing];
  return {
    id: `gebart-across-${packing}`,
    label: `Gebart (1992), across fibres, ${packing}`,
    direction: 'across',
    source: GEBART_SOURCE,
    min: GEBART_MIN,
    max: maxSolidFraction,
    k: (c) => {
      if (c > maxSolidFraction) return null;
      const gap = Math.max(Math.sqrt(maxSolidFraction / c) - 1, 0);
      return (c1 / 4) * Math.pow(gap, 2.5);
    },
  };
}

export type TomadakisStructure = '1d-parallel' | '1d-perpendicular' | '2d-in-plane' | '2d-through-plane' | '3d';

/**
 * Percolation threshold ε_p and exponent α of the Tomadakis–Robertson form, per structure and flow direction
 * (Tomadakis & Robertson 2005, after Tomadakis & Sotirchos 1993) — values from memory: 1-D parallel (0, 0),
 * 1-D perpendicular (0.33, 0.707), 2-D in-plane (0.11, 0.521), 2-D through-plane (0.11, 0.785), 3-D (0.037, 0.661).
 */
export const TOMADAKIS_PARAMETERS: Readonly<
  Record<TomadakisStructure, { epsP: number; alpha: number; direction: FlowDirection; label: string }>
> = {
  '1d-parallel': { epsP: 0, alpha: 0, direction: 'along', label: 'unidirectional random, along fibres' },
  '1d-perpendicular': { epsP: 0.33, alpha: 0.707, direction: 'across', label: 'unidirectional random, across fibres' },
  '2d-in-plane': { epsP: 0.11, alpha: 0.521, direction: 'in-plane', label: '2-D random mat, in-plane' },
  '2d-through-plane': { epsP: 0.11, alpha: 0.785, direction: 'through-plane', label: '2-D random mat, through-plane' },
  '3d': { epsP: 0.037, alpha: 0.661, direction: 'isotropic', label: '3-D random' },
};

function tomadakis(structure: TomadakisStructure): Descriptor {
  const { epsP, alpha, direction, label } = TOMADAKIS_PARAMETERS[structure];
  return {
    id: `tomadakis-robertson-${structure}`,
    label: `Tomadakis & Robertson (2005), ${label}`,
    direction,
    source: 'M. M. Tomadakis & T. J. Robertson, J. Compos. Mater. 39 (2005) 163',
    // Above ε_p, and never beyond the densest packing of parallel cylinders, π/(2√3).
    min: 0,
    max: Math.min(1 - epsP, Math.PI / (2 * Math.sqrt(3))),
    k: (c, eps) => {
      if (eps <= epsP) return null;
      const lnEps = Math.log1p(-c);
      return (
        (eps / (32 * lnEps * lnEps)) *
        (Math.pow(eps - epsP, alpha + 2) / (Math.pow(1 - epsP, alpha) * Math.pow((alpha + 1) * eps - epsP, 2)))
      );
    },
  };
}

// ---- public functions ----

/**
 * Kozeny–Carman: K = d² ε³/(16 k_K (1 − ε)²), m² (Carman 1937), k_K = 5 by default.
 * Validity (common practice): 0.2 ≤ c ≤ 0.7; fibre beds above ε ≈ 0.8 need a larger constant.
 */
export function kozenyCarman(input: PermeabilityInput & { readonly kozenyConstant?: number }): PermeabilityResult {
  const kozenyConstant = requirePositive('kozenyConstant', input.kozenyConstant ?? 5);
  return evaluate(kozenyDescriptor(kozenyConstant), input, { kozenyConstant });
}

/** Davies (1952): K = d²/(64 c^{1.5}(1 + 56c³)), m²; fitted for 0.006 ≤ c ≤ 0.3 (filter media). */
export function davies(input: PermeabilityInput): PermeabilityResult {
  return evaluate(DAVIES, input);
}

/**
 * Happel (1959) cell model: across K = (r²/8c)[−ln c − (1 − c²)/(1 + c²)]; along K = (r²/4c)[−ln c − 3/2 + 2c − c²/2].
 * Both → ∞ as c → 0 and → 0 as c → 1; intended for dilute arrays (c ≲ 0.4, from memory).
 */
export function happel(input: PermeabilityInput & { readonly direction: 'across' | 'along' }): PermeabilityResult {
  const direction = checkDirection(input.direction);
  return evaluate(direction === 'across' ? HAPPEL_ACROSS : HAPPEL_ALONG, input, { direction });
}

function checkDirection(direction: unknown): 'across' | 'along' {
  if (direction !== 'across' && direction !== 'along') {
    throw new DomainError('invalid-input', `direction must be "across" or "along" (got ${String(direction)}).`, 'direction');
  }
  return direction;
}

/**
 * Jackson & James (1986): K = (3r²/(20c))(−ln c − 0.931), m², 3-D isotropic random fibres, dilute
 * (c ≲ 0.3, from memory); no value for c ≥ e^{−0.931} ≈ 0.394.
 */
export function jacksonJames(input: PermeabilityInput): PermeabilityResult {
  return evaluate(JACKSON_JAMES, input);
}

/**
 * Gebart (1992), ordered unidirectional fibres: along K = (8r²/C) ε³/c²; across
 * K = C₁(√(c_max/c) − 1)^{5/2} r² (→ 0 at maximum packing c_max; null beyond).
 */
export function gebart(
  input: PermeabilityInput & { readonly direction: 'across' | 'along'; readonly packing?: GebartPacking },
): PermeabilityResult {
  const packing = checkPacking(input.packing ?? 'quadratic');
  const direction = checkDirection(input.direction);
  const desc = direction === 'along' ? gebartAlong(packing) : gebartAcross(packing);
  return evaluate(desc, input, { direction, packing });
}

function checkPacking(packing: unknown): GebartPacking {
  if (typeof packing !== 'string' || !Object.hasOwn(GEBART_CONSTANTS, packing)) {
    throw new DomainError('invalid-input', `packing must be "quadratic" or "hexagonal" (got ${String(packing)}).`, 'packing');
  }
  return packing as GebartPacking;
}

/**
 * Tomadakis & Robertson (2005): K = r² ε/(8 ln²ε)·(ε − ε_p)^{α+2}/((1 − ε_p)^α((α+1)ε − ε_p)²), m², for random
 * fibre structures; (ε_p, α) per structure from {@link TOMADAKIS_PARAMETERS}. No value for ε ≤ ε_p.
 */
export function tomadakisRobertson(
  input: PermeabilityInput & { readonly structure?: TomadakisStructure },
): PermeabilityResult {
  const structure = checkStructure(input.structure ?? '2d-in-plane');
  return evaluate(tomadakis(structure), input, { structure });
}

function checkStructure(structure: unknown): TomadakisStructure {
  if (typeof structure !== 'string' || !Object.hasOwn(TOMADAKIS_PARAMETERS, structure)) {
    throw new DomainError(
      'invalid-input',
      `structure must be one of ${Object.keys(TOMADAKIS_PARAMETERS).join(', ')} (got ${String(structure)}).`,
      'structure',
    );
  }
  return structure as TomadakisStructure;
}

/**
 * {@link tomadakisRobertson}, {@link gebart} and {@link happel} with their options fixed and checked once, for a
 * caller that evaluates one many times (the Monte Carlo band: a thousand webs per keystroke); same results.
 */
export function tomadakisRobertsonWith(structure: TomadakisStructure): (input: PermeabilityInput) => PermeabilityResult {
  const desc = tomadakis(checkStructure(structure));
  const extra = { structure };
  return (input) => evaluate(desc, input, extra);
}

export function gebartWith(direction: 'across' | 'along', packing: GebartPacking): (input: PermeabilityInput) => PermeabilityResult {
  const desc = checkDirection(direction) === 'along' ? gebartAlong(checkPacking(packing)) : gebartAcross(checkPacking(packing));
  const extra = { direction, packing };
  return (input) => evaluate(desc, input, extra);
}

export function happelWith(direction: 'across' | 'along'): (input: PermeabilityInput) => PermeabilityResult {
  const desc = checkDirection(direction) === 'across' ? HAPPEL_ACROSS : HAPPEL_ALONG;
  const extra = { direction };
  return (input) => evaluate(desc, input, extra);
}

/** Every correlation variant, in the order {@link compareCorrelations} lists them. */
function allDescriptors(kozenyConstant: number): Descriptor[] {
  return [
    kozenyDescriptor(kozenyConstant),
    DAVIES,
    HAPPEL_ACROSS,
    HAPPEL_ALONG,
    JACKSON_JAMES,
    gebartAlong('quadratic'),
    gebartAlong('hexagonal'),
    gebartAcross('quadratic'),
    gebartAcross('hexagonal'),
    tomadakis('2d-in-plane'),
    tomadakis('2d-through-plane'),
    tomadakis('3d'),
    tomadakis('1d-parallel'),
    tomadakis('1d-perpendicular'),
  ];
}

export interface CompareCorrelationsInput extends PermeabilityInput {
  /** Kozeny constant for the Kozeny–Carman row (default 5). */
  readonly kozenyConstant?: number;
}

export interface CompareCorrelationsResult extends ResultBase<CompareCorrelationsInput> {
  readonly solidFraction: number;
  readonly correlations: readonly PermeabilityResult[];
  /** Largest / smallest K among rows inside their validity range; null with fewer than two such rows. */
  readonly spreadInRange: number | null;
}

/**
 * All correlations side by side for one fibre diameter and porosity, each with its validity flag and warnings.
 * The spread between correlations is itself information: a factor of 2–5 is usual for real webs.
 */
export function compareCorrelations(input: CompareCorrelationsInput): CompareCorrelationsResult {
  const { d, eps, c } = check(input);
  const kozenyConstant = requirePositive('kozenyConstant', input.kozenyConstant ?? 5);
  const base = { fibreDiameter: d, porosity: eps };
  const correlations = allDescriptors(kozenyConstant).map((desc) => evaluate(desc, base));
  const valid = correlations
    .filter((r) => r.inValidityRange && r.permeability !== null && r.permeability > 0)
    .map((r) => r.permeability as number);
  const warnings: ModelWarning[] = [];
  if (valid.length === 0) {
    warnings.push({
      code: 'no-correlation-in-range',
      message: `No correlation was made for a solid fraction of ${c.toPrecision(3)}: all values are extrapolations.`,
    });
  }
  return {
    inputs: { fibreDiameter: d, porosity: eps, kozenyConstant },
    warnings,
    solidFraction: c,
    correlations,
    spreadInRange: valid.length >= 2 ? Math.max(...valid) / Math.min(...valid) : null,
  };
}
