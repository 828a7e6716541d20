import type { ResultBase } from '../api/model-spec';
import type { DistributionForm } from '../pore-size/distribution';

/**
 * Input and result types of the layered-stack unsaturated-flow model (Richards equation).
 *
 * Conventions (SI throughout):
 * - x (m) runs along the stack axis from the inlet face (x = 0, where liquid arrives) into the stack.
 * - Pressures are liquid gauge pressures p (Pa); capillary pressure Pc = −p ≥ 0 in unsaturated media.
 *   Inside the solver they become pressure heads ψ = p/(ρ g) in metres of the simulated liquid.
 * - Saturation S = θ/θs (fraction of the pore volume filled); θ is the volumetric liquid content.
 * - Volumes are per unit area of the inlet face (m³/m² = m); rates per area are m/s.
 */

/** Retention curve of a layer, as a function of capillary pressure Pc (Pa). */
export type RetentionInput = VanGenuchtenInput | BrooksCoreyInput | PoreSizeRetentionInput;

/** van Genuchten (1980): Se = [1 + (α Pc)^n]^(−m), m = 1 − 1/n; Mualem (1976) relative permeability. */
export interface VanGenuchtenInput {
  readonly kind: 'van-genuchten';
  /** α, 1/Pa (> 0): the inverse of a characteristic capillary pressure. */
  readonly alpha: number;
  /** n (> 1), dimensionless. */
  readonly n: number;
  /** Mualem pore-connectivity exponent L, dimensionless; 0.5 (Mualem 1976) when omitted. */
  readonly poreConnectivity?: number;
}

/** Brooks & Corey (1964): Se = (Pb/Pc)^λ for Pc > Pb, else 1; Burdine relative permeability Se^(3 + 2/λ). */
export interface BrooksCoreyInput {
  readonly kind: 'brooks-corey';
  /** Entry (bubbling) pressure Pb, Pa (> 0). */
  readonly entryPressure: number;
  /** Pore-size distribution index λ (> 0), dimensionless. */
  readonly lambda: number;
}

/**
 * Capillary-bundle retention from a pore-size distribution: at capillary pressure Pc the pores with
 * diameter d ≤ 4 γ cos θ / Pc are filled. The resulting points are fitted with a van Genuchten curve
 * (Mualem relative permeability). Needs the liquid's surface tension.
 */
export interface PoreSizeRetentionInput {
  readonly kind: 'pore-size';
  /** Class diameters, m, strictly increasing. */
  readonly diameters: readonly number[];
  /** Pore-volume fractions in the given form. */
  readonly fractions: readonly number[];
  /** How `fractions` is written; 'differential' when omitted. */
  readonly form?: DistributionForm;
  /** Contact angle of the liquid on the pore walls, rad, 0 ≤ θ < π/2; 0 when omitted. */
  readonly contactAngle?: number;
}

export interface StackLayerInput {
  /** Label used in results, e.g. "topsheet". */
  readonly name?: string;
  /** Layer thickness along the axis, m (> 0). For the in-plane geometry: length of the zone along the core. */
  readonly thickness: number;
  /** Porosity = saturated liquid content θs, dimensionless, 0 < θs < 1. */
  readonly porosity: number;
  /** Residual liquid content θr, dimensionless, 0 ≤ θr < θs; 0 when omitted. */
  readonly residualContent?: number;
  readonly retention: RetentionInput;
  /** Intrinsic permeability along the stack axis (through-plane), m². Give this or `conductivity`. */
  readonly permeability?: number;
  /** Saturated hydraulic conductivity for the simulated liquid, m/s. Give this or `permeability`. */
  readonly conductivity?: number;
  /** In-plane permeability, m², used by the in-plane geometry; `permeability` when omitted. */
  readonly inPlanePermeability?: number;
  /** Number of cells in this layer (integer ≥ 1); shared out from `cells` when omitted. */
  readonly cells?: number;
  /**
   * Ratio of successive cell widths going away from the inlet (> 0); 1 (uniform) when omitted.
   * Values above 1 refine the layer near its inlet side.
   */
  readonly grading?: number;
  /** Initial saturation S = θ/θs, θr/θs < S ≤ 1. Overrides `initialPressure` for this layer. */
  readonly initialSaturation?: number;
}

export interface StackLiquidInput {
  /** Density ρ, kg/m³ (> 0). */
  readonly density: number;
  /** Dynamic viscosity η, Pa·s (> 0). */
  readonly viscosity: number;
  /** Surface tension γ, N/m (> 0); needed only by pore-size retention curves. */
  readonly surfaceTension?: number;
}

/** One gush: `volume` per inlet area delivered at a constant `rate` from `start` on. */
export interface InsultInput {
  /** Start time, s (≥ 0). */
  readonly start: number;
  /** Volume per inlet area, m (> 0). 1 mL/cm² = 0.01 m. */
  readonly volume: number;
  /** Delivery rate per inlet area, m/s (> 0). 1 mL/(cm²·s) = 0.01 m/s. */
  readonly rate: number;
}

/** Condition at the inlet face x = 0. */
export type TopBoundaryInput =
  | {
      /** Flux sources with ponding: liquid that cannot enter is stored on the surface. */
      readonly kind: 'insults';
      readonly insults: readonly InsultInput[];
    }
  | {
      /** Constant liquid pressure at the face (0 = free liquid/reservoir, > 0 ponded, < 0 tension), Pa. */
      readonly kind: 'pressure';
      readonly pressure: number;
      /** Time the source is removed, s; the face is then closed (no flow). Whole run when omitted. */
      readonly until?: number;
    }
  | { readonly kind: 'no-flow' };

/** Condition at the far face x = L. */
export type BottomBoundaryInput =
  | { readonly kind: 'no-flow' }
  | { readonly kind: 'free-drainage' }
  | { readonly kind: 'pressure'; readonly pressure: number };

/** Face conductivity between two cells. See docs/models/stack.md for the reasoning. */
export type FaceConductivity = 'upstream' | 'arithmetic' | 'harmonic';

export interface StackSolverOptions {
  /** First time step and step after each change of the inlet condition, s; 1e-3 when omitted. */
  readonly initialStep?: number;
  /** Smallest step before giving up, s; 1e-9 when omitted. */
  readonly minStep?: number;
  /** Largest step, s; endTime/20 when omitted. */
  readonly maxStep?: number;
  /** Picard iterations per step before the step is cut; 25 when omitted. */
  readonly maxIterations?: number;
  /** Largest change of saturation in any cell per step (step-size control); 0.1 when omitted. */
  readonly maxSaturationChange?: number;
  /** Face conductivity rule; 'arithmetic' when omitted. */
  readonly faceConductivity?: FaceConductivity;
}

export interface StackInput {
  /**
   * 'through-plane' (default): layers stacked along the thickness, liquid arriving on the top sheet.
   * 'in-plane': zones along a strip or core fed at one edge; uses `inPlanePermeability` and a
   * horizontal axis unless `inclination` says otherwise.
   */
  readonly geometry?: 'through-plane' | 'in-plane';
  /** Layers from the inlet face inwards. */
  readonly layers: readonly StackLayerInput[];
  readonly liquid: StackLiquidInput;
  /**
   * Angle β between the stack axis (pointing from the inlet into the stack) and the downward vertical,
   * rad, 0 ≤ β ≤ π: 0 = liquid poured on a product lying flat, π/2 = horizontal, π = wicking upwards.
   * 0 for 'through-plane' and π/2 for 'in-plane' when omitted.
   */
  readonly inclination?: number;
  readonly top: TopBoundaryInput;
  /** 'no-flow' when omitted. */
  readonly bottom?: BottomBoundaryInput;
  /** Simulated time, s (> 0). */
  readonly endTime: number;
  /** Initial liquid pressure, Pa (≤ 0 typical), for layers without `initialSaturation`. */
  readonly initialPressure?: number;
  /** Total number of cells shared out over layers without their own `cells`; 100 when omitted. */
  readonly cells?: number;
  /** Number of saturation snapshots, evenly spaced over [0, endTime], ≥ 2; 61 when omitted. */
  readonly snapshots?: number;
  /** How many layers from the inlet count as "upper" for the rewet indicator; 1 when omitted. */
  readonly upperLayers?: number;
  /** Increase of saturation that marks the wetting front, 0 < ΔS < 1; 0.05 when omitted. */
  readonly frontThreshold?: number;
  readonly solver?: StackSolverOptions;
}

/** Callbacks for long runs, e.g. in a Web Worker. Not part of the (serialisable) input. */
export interface StackRunOptions {
  /** Called with the simulated fraction done, 0…1, at most about every 1 %. */
  readonly onProgress?: (fractionDone: number) => void;
  /** Checked once per time step; returning true stops the run and returns what was computed so far. */
  readonly shouldCancel?: () => boolean;
}

export interface StackGridResult {
  /** Cell centres, m from the inlet face. */
  readonly centres: Float64Array;
  /** Cell widths, m. */
  readonly widths: Float64Array;
  /** Layer index of each cell. */
  readonly layerIndex: Int32Array;
  /** Positions of the layer boundaries, m (length layers + 1, starting at 0). */
  readonly boundaries: Float64Array;
}

/**
 * Heat-map data and time series at evenly spaced snapshot times. `saturation` is row-major:
 * saturation[k * cells + i] is S in cell i at times[k].
 */
export interface StackSnapshots {
  readonly times: Float64Array;
  readonly cells: number;
  readonly saturation: Float64Array;
  /** Deepest position where S rose by at least `frontThreshold`, m (0 when nowhere). */
  readonly frontPositions: Float64Array;
  /** Net volume that entered through the inlet face, m³/m². */
  readonly absorbed: Float64Array;
  /** Liquid standing on the inlet face, m³/m². */
  readonly surfaceLiquid: Float64Array;
  /** Volume delivered by insults so far, m³/m². */
  readonly supplied: Float64Array;
  /** Volume that left through the far face, m³/m². */
  readonly drained: Float64Array;
}

export interface InsultResult {
  readonly start: number;
  readonly volume: number;
  readonly rate: number;
  /** volume/rate, s. */
  readonly deliveryTime: number;
  /** Time from the start until no liquid stands on the surface, s; null if not reached. */
  readonly acquisitionTime: number | null;
  /** Time from the start until liquid first stood on the surface (ponding), s; 0 when an earlier gush's liquid still stood; null if it never did. */
  readonly pondingTime: number | null;
  /** Largest surface liquid during the insult, m³/m². */
  readonly peakSurfaceLiquid: number;
}

export interface LayerLiquidResult {
  readonly name: string;
  readonly thickness: number;
  /** Liquid held at the start and at the end, m³/m². */
  readonly liquidStart: number;
  readonly liquidEnd: number;
  /** Mean saturation at the end, θ/θs averaged over the layer's pore volume. */
  readonly saturationEnd: number;
}

export interface StackResult extends ResultBase<StackInput> {
  readonly status: 'completed' | 'cancelled';
  /** Simulated time reached, s. */
  readonly timeReached: number;
  readonly geometry: 'through-plane' | 'in-plane';
  readonly grid: StackGridResult;
  readonly snapshots: StackSnapshots;
  readonly insults: readonly InsultResult[];
  readonly layers: readonly LayerLiquidResult[];
  /** Liquid left in the `upperLayers` layers nearest the inlet at the end (rewet indicator), m³/m². */
  readonly upperLayerLiquid: number;
  readonly totals: {
    /** Delivered by insults, m³/m². */
    readonly supplied: number;
    /** Net inflow through the inlet face, m³/m². */
    readonly absorbed: number;
    /** Outflow through the far face, m³/m². */
    readonly drained: number;
    /** Liquid standing on the inlet face at the end, m³/m². */
    readonly surfaceLiquid: number;
    /** Liquid held in the stack at the start and at the end, m³/m². */
    readonly storedStart: number;
    readonly storedEnd: number;
  };
  readonly massBalance: {
    /** (stored + surface)_end − (stored + surface)_start − (inflow − outflow), m³/m². */
    readonly absoluteError: number;
    /** |absoluteError| divided by the volume absorbed (or drained, whichever is larger). */
    readonly relativeError: number;
  };
  readonly stats: {
    readonly steps: number;
    readonly rejectedSteps: number;
    readonly iterations: number;
    readonly maxIterationsInStep: number;
    readonly smallestStep: number;
    readonly largestStep: number;
  };
}
