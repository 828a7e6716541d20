/**
 * Wire types of a design variant: what an engineer enters for one layer (the inputs) and what the evaluator
 * returns (the results). Shared by the UI (live recompute), the server (the saved snapshot) and reports.
 * Every number is SI (m, s, kg, Pa, N/m, Pa·s, kg/m³, kg/m², rad, K, m²); units live only at the edges.
 */
import type { ModelWarning } from '../errors';
import type { UserLiquidDefinition } from '../liquids/liquid-at';
import type { DistributionForm } from '../pore-size/distribution';
import type { Tolerance } from '../tolerance/distributions';

/** How the layer meets the liquid. The layered stack has its own model. */
export const VARIANT_CONFIGURATIONS = [
  'capillary',
  'vertical-strip',
  'inclined-strip',
  'horizontal-strip',
  'radial-spread',
] as const;
export type VariantConfiguration = (typeof VARIANT_CONFIGURATIONS)[number];

export const CONFIGURATION_LABELS: Readonly<Record<VariantConfiguration, string>> = {
  capillary: 'Single capillary',
  'vertical-strip': 'Vertical strip',
  'inclined-strip': 'Inclined strip',
  'horizontal-strip': 'Horizontal strip',
  'radial-spread': 'Radial spread from a wetted spot',
};

/** Permeability correlations a variant may choose (ids as the permeability family names them). */
export const VARIANT_CORRELATIONS = [
  'tomadakis-robertson-2d-in-plane',
  'tomadakis-robertson-2d-through-plane',
  'tomadakis-robertson-3d',
  'kozeny-carman',
  'davies',
  'happel-across',
  'happel-along',
  'jackson-james',
  'gebart-across-quadratic',
  'gebart-across-hexagonal',
  'gebart-along-quadratic',
  'gebart-along-hexagonal',
] as const;
export type PermeabilityCorrelationId = (typeof VARIANT_CORRELATIONS)[number];

/** How the correlations read in forms, reports and CSV (published names; flow direction relative to the fibres or plane). */
export const VARIANT_CORRELATION_LABELS: Readonly<Record<PermeabilityCorrelationId, string>> = {
  'tomadakis-robertson-2d-in-plane': 'Tomadakis–Robertson, 2-D web, in-plane',
  'tomadakis-robertson-2d-through-plane': 'Tomadakis–Robertson, 2-D web, through-plane',
  'tomadakis-robertson-3d': 'Tomadakis–Robertson, 3-D random',
  'kozeny-carman': 'Kozeny–Carman',
  davies: 'Davies',
  'happel-across': 'Happel, flow across fibres',
  'happel-along': 'Happel, flow along fibres',
  'jackson-james': 'Jackson & James',
  'gebart-across-quadratic': 'Gebart, across fibres, square packing',
  'gebart-across-hexagonal': 'Gebart, across fibres, hexagonal packing',
  'gebart-along-quadratic': 'Gebart, along fibres, square packing',
  'gebart-along-hexagonal': 'Gebart, along fibres, hexagonal packing',
};

/** A library entry pinned at one revision; the variant keeps using that revision until re-pinned. */
export interface PinnedMaterial {
  readonly kind: 'web' | 'fibre' | 'liquid';
  readonly id: number;
  readonly revision: number;
  readonly name: string;
  /** Review state of the pinned revision when the variant was saved: only 'approved' counts as approved. */
  readonly state: string;
}

export type PermeabilityChoice =
  | { readonly mode: 'measured'; /** K, m² (in the flow direction of the configuration). */ readonly value: number }
  | {
      readonly mode: 'correlation';
      readonly correlation: PermeabilityCorrelationId;
      /** Kozeny constant for 'kozeny-carman' (default 5). */
      readonly kozenyConstant?: number;
    };

/** Fibrous layer, ad hoc or copied from a pinned web revision. */
export interface StructureInputs {
  readonly web?: PinnedMaterial;
  /** Equivalent round fibre diameter d, m (give this or linearDensity). */
  readonly fibreDiameter?: number;
  /** Fibre linear density λ, kg/m (1 dtex = 1e-7 kg/m). */
  readonly linearDensity?: number;
  /** Fibre density ρf, kg/m³. */
  readonly fibreDensity: number;
  /** Perimeter ratio χ ≥ 1 of non-round fibres (default 1). */
  readonly shapeFactor?: number;
  /** Basis weight, kg/m². */
  readonly basisWeight: number;
  /** Thickness, m (under the stated measuring pressure). */
  readonly thickness: number;
  /** Measured porosity; computed from basis weight, thickness and fibre density when absent. */
  readonly porosity?: number;
  /** Contact angle of the liquid on the fibres, rad. */
  readonly contactAngle: number;
  /** Capillary pressure from the hydraulic radius (default) or from a measured mean pore diameter. */
  readonly capillaryPressureFrom?: 'hydraulic-radius' | 'pore-diameter';
  /** Mean (flow) pore diameter, m; needed for capillaryPressureFrom 'pore-diameter'. */
  readonly poreDiameter?: number;
  readonly permeability: PermeabilityChoice;
  /** Pore-size distribution (diameters m, volume fractions) for the saturation profile. */
  readonly poreSize?: {
    readonly diameters: readonly number[];
    readonly fractions: readonly number[];
    readonly form: DistributionForm;
  };
  /** Where each value comes from, by field name (e.g. thickness → "measured at 0.5 kPa, lab book 12"). */
  readonly sources?: Readonly<Record<string, string>>;
}

/** The single-capillary configuration. */
export interface CapillaryInputs {
  /** Tube radius, m. */
  readonly radius: number;
  /** Contact angle, rad. */
  readonly contactAngle: number;
}

export interface LiquidInputs {
  /** A built-in wick-core liquid id ('water', 'saline-0.9' …) or a liquid definition (SI values). */
  readonly ref: string | UserLiquidDefinition;
  /** Library revision the definition was copied from. */
  readonly pinned?: PinnedMaterial;
  /** Temperature, K. */
  readonly temperature: number;
}

export interface DimensionInputs {
  /** Strip width, m (strips; also the capillary-free mass for radial uses thickness only). */
  readonly width?: number;
  /** Strip length, m: the front stops at the top of the strip. Optional. */
  readonly length?: number;
  /** Tilt from horizontal, rad, for 'inclined-strip' (0 < α < π/2); also the capillary's tilt. */
  readonly tilt?: number;
  /** Radius of the fed wetted spot, m ('radial-spread'). */
  readonly sourceRadius?: number;
  /** End of the plotted curve, s. */
  readonly duration: number;
}

export interface CheckpointInputs {
  /** Target wetted lengths along the strip (radii for radial spread), m. */
  readonly heights: readonly number[];
  /** Reading times, s (> 0). */
  readonly times: readonly number[];
}

/** Inputs that may carry a tolerance (SI values, same units as the fields they vary). */
export const TOLERANCE_PARAMETERS = [
  'fibreDiameter',
  'linearDensity',
  'fibreDensity',
  'basisWeight',
  'thickness',
  'porosity',
  'contactAngle',
  'permeability',
  'poreDiameter',
  'capillaryRadius',
  'surfaceTension',
  'viscosity',
  'liquidDensity',
  'tilt',
  'sourceRadius',
  'width',
] as const;
export type ToleranceParameter = (typeof TOLERANCE_PARAMETERS)[number];

export interface VariantInputs {
  readonly configuration: VariantConfiguration;
  /** Required for every configuration except 'capillary'. */
  readonly structure?: StructureInputs;
  /** Required for 'capillary'. */
  readonly capillary?: CapillaryInputs;
  readonly liquid: LiquidInputs;
  readonly dimensions: DimensionInputs;
  readonly checkpoints: CheckpointInputs;
  /** Tolerances (uniform, triangular or normal, SI) on the parameters named in TOLERANCE_PARAMETERS. */
  readonly tolerances?: Readonly<Partial<Record<ToleranceParameter, Tolerance>>>;
  /** Relative humidity 0 < RH < 1 for the Kelvin radius (water vapour at the temperature). */
  readonly humidity?: number;
}

export interface EvaluateVariantOptions {
  /** Points of the time curves (2 … 5,000; default 200). */
  readonly curvePoints?: number;
  /** Monte Carlo samples for the bands (10 … 20,000; default 1,000). Ignored without tolerances. */
  readonly samples?: number;
  /** Seed of the sampler (default 1): same seed, same bands. */
  readonly seed?: number;
}

/**
 * Options every saved variant is evaluated with, in the browser and on the server alike, so that reopening a
 * variant shows the numbers it was saved with.
 */
export const DEFAULT_VARIANT_OPTIONS: Required<EvaluateVariantOptions> = { curvePoints: 400, samples: 1000, seed: 1 };

/** A percentile band of one scalar output. */
export interface ScalarBand {
  readonly key: string;
  readonly label: string;
  /** SI unit of the values. */
  readonly unit: string;
  readonly nominal: number | null;
  readonly p10: number;
  readonly p50: number;
  readonly p90: number;
}

export interface TornadoBarOut {
  readonly parameter: ToleranceParameter;
  readonly label: string;
  readonly inputLow: number;
  readonly inputHigh: number;
  readonly outputLow: number | null;
  readonly outputHigh: number | null;
  readonly swing: number;
}

export interface EquationUsed {
  readonly id: string;
  readonly title: string;
  /** Plain-text equation. */
  readonly equation: string;
  readonly source: string;
}

export interface CheckpointAtTime {
  readonly time: number;
  /** Wetted length along the strip (radius for radial spread), m. */
  readonly height: number;
  /** Same without gravity, m. */
  readonly heightNoGravity: number;
  /** Liquid taken up, kg (null when the geometry lacks a width). */
  readonly mass: number | null;
  /** Uptake rate, kg/s. */
  readonly massRate: number | null;
}

export interface CheckpointToHeight {
  readonly height: number;
  readonly reached: boolean;
  /** s; null when not reached. */
  readonly time: number | null;
  /** Without gravity, s (null when the target lies beyond the strip or below the source). */
  readonly timeNoGravity: number | null;
}

export interface VariantResultsOk {
  readonly status: 'ok';
  readonly coreVersion: string;
  readonly configuration: VariantConfiguration;
  readonly liquid: {
    readonly name: string;
    readonly temperature: number;
    readonly surfaceTension: number;
    readonly viscosity: number;
    readonly density: number;
    readonly sources: Readonly<Record<string, string>>;
    readonly flammable: boolean;
  };
  /** Layer structure used (null for a single capillary). */
  readonly structure: {
    readonly porosity: number;
    readonly solidFraction: number;
    readonly porositySource: 'measured' | 'basis weight';
    readonly fibreDiameter: number;
    readonly hydraulicRadius: number;
  } | null;
  readonly capillaryPressure: { readonly value: number; readonly method: string };
  readonly permeability: {
    readonly value: number;
    readonly method: 'measured' | 'correlation' | 'capillary';
    readonly correlation: string | null;
    readonly label: string;
    readonly source: string | null;
    readonly inValidityRange: boolean | null;
    readonly validSolidFraction: { readonly min: number; readonly max: number } | null;
  };
  /** dh/dt = a/h − b: a (m²/s) and b (m/s). */
  readonly coefficients: { readonly a: number; readonly b: number };
  /** Vertical equilibrium height, m (null without gravity along the flow). */
  readonly equilibriumHeight: number | null;
  /** Equilibrium wetted length along the strip, m. */
  readonly equilibriumLength: number | null;
  /** t* = a/b², s. */
  readonly characteristicTime: number | null;
  readonly curves: {
    /** s */
    readonly time: readonly number[];
    /** Wetted length (radius for radial spread), m, with gravity. */
    readonly height: readonly number[];
    /** The same without gravity, m. */
    readonly heightNoGravity: readonly number[];
    /** Liquid taken up, kg (null without a width). */
    readonly mass: readonly number[] | null;
    /** Uptake rate, kg/s (null without a width); null at t = 0, where it is unbounded. */
    readonly massRate: readonly (number | null)[] | null;
  };
  readonly atTimes: readonly CheckpointAtTime[];
  readonly toHeights: readonly CheckpointToHeight[];
  /** Saturated capacity: per area kg/m² (numerically kg/m² = 1000 g/m²) and per dry mass kg/kg (= g/g). */
  readonly capacity: { readonly perArea: number; readonly perMass: number } | null;
  /** Equilibrium saturation against height from the pore-size distribution. */
  readonly poreSizeProfile: { readonly height: readonly number[]; readonly saturation: readonly number[] } | null;
  readonly kelvin: { readonly humidity: number; readonly radius: number | null } | null;
  readonly bands: {
    readonly samples: number;
    readonly validSamples: number;
    readonly seed: number;
    readonly curve: { readonly p10: readonly number[]; readonly p50: readonly number[]; readonly p90: readonly number[] };
    readonly scalars: readonly ScalarBand[];
  } | null;
  readonly tornado: {
    readonly output: string;
    readonly unit: string;
    readonly base: number;
    readonly bars: readonly TornadoBarOut[];
  } | null;
  readonly equations: readonly EquationUsed[];
  readonly warnings: readonly ModelWarning[];
}

export interface VariantResultsNoUptake {
  readonly status: 'no-spontaneous-uptake';
  readonly coreVersion: string;
  readonly configuration: VariantConfiguration;
  readonly capillaryPressure: { readonly value: number; readonly method: string };
  readonly equations: readonly EquationUsed[];
  readonly warnings: readonly ModelWarning[];
}

export type VariantResults = VariantResultsOk | VariantResultsNoUptake;
