/**
 * Wire types of a stack variant: layers picked from the library (or entered), a liquid, a repeated insult, and
 * the summary the evaluator returns for the design workspace (acquisition times, surface liquid, rewet
 * indicator, capacity used, mass balance, heat-map and curve data). Every number is SI (m, m², m³, s, Pa,
 * 1/Pa, m², rad); volumes per area are m³/m² = m. Units live only at the edges.
 *
 * A stack layer reuses the single-layer {@link StructureInputs} (the same reader, the same porosity and
 * permeability resolution), so a web gives the same porosity and permeability in a layer variant and in a
 * stack; its `permeability` is read as the through-plane one.
 */
import type { ModelWarning } from '../errors';
import type { EquationUsed, LiquidInputs, PinnedMaterial, StructureInputs, VariantResultsOk } from './variant';

/** The configuration value of a stack variant (beside the single-layer configurations). */
export const STACK_CONFIGURATION = 'stack';

/** How a layer's retention curve is given. */
export type StackRetentionChoice =
  | {
      /** van Genuchten (1980) with Mualem (1976) relative permeability. */
      readonly mode: 'van-genuchten';
      /** α, 1/Pa (1/α is a characteristic capillary pressure). */
      readonly alpha: number;
      /** n > 1. */
      readonly n: number;
      /** Mualem pore connectivity L (default 0.5). */
      readonly poreConnectivity?: number;
    }
  | {
      /** Brooks & Corey (1964) with Burdine relative permeability. */
      readonly mode: 'brooks-corey';
      /** Entry pressure, Pa. */
      readonly entryPressure: number;
      /** Pore-size distribution index λ > 0. */
      readonly lambda: number;
    }
  | {
      /** Capillary bundle from the structure's pore-size distribution and contact angle (van Genuchten fit). */
      readonly mode: 'pore-size';
    };

export const STACK_RETENTION_MODES = ['van-genuchten', 'brooks-corey', 'pore-size'] as const;
export type StackRetentionMode = (typeof STACK_RETENTION_MODES)[number];

export const STACK_RETENTION_LABELS: Readonly<Record<StackRetentionMode, string>> = {
  'van-genuchten': 'van Genuchten–Mualem parameters',
  'brooks-corey': 'Brooks–Corey–Burdine parameters',
  'pore-size': 'From the pore-size distribution',
};

export interface StackLayerInputs {
  /** Label in results and plots, e.g. "Topsheet". */
  readonly name: string;
  /** Structure of the layer (web pin, fibres, basis weight, thickness, porosity, contact angle, PSD). Its
   * `permeability` is the through-plane permeability (measured, or a correlation). */
  readonly structure: StructureInputs;
  readonly retention: StackRetentionChoice;
  /** Residual liquid content θr, 0 ≤ θr < ε (default 0). */
  readonly residualContent?: number;
  /** Saturation at the start, θ/ε (default {@link STACK_DEFAULTS}.initialSaturation). */
  readonly initialSaturation?: number;
  /** Cells in this layer; shared out by thickness from the stack's `cells` when omitted. */
  readonly cells?: number;
}

/** A gush of liquid, repeated `count` times at `interval`. */
export interface StackInsultInputs {
  /** Volume of one gush, m³ (1 mL = 1e-6 m³). */
  readonly volume: number;
  /** Delivery rate, m³/s. */
  readonly rate: number;
  /** Area of the product the gush enters through, m² (the volume per area drives the 1-D model). */
  readonly area: number;
  /** Number of gushes, 1 … 10. */
  readonly count: number;
  /** Time from the start of one gush to the start of the next, s (needed when count > 1). */
  readonly interval?: number;
}

export interface StackVariantInputs {
  readonly configuration: typeof STACK_CONFIGURATION;
  /** Layers from the surface the liquid lands on, inwards (1 … 8). */
  readonly layers: readonly StackLayerInputs[];
  readonly liquid: LiquidInputs;
  readonly insult: StackInsultInputs;
  /** Simulated time, s. */
  readonly duration: number;
  /** Angle of the stack axis to the downward vertical, rad: 0 = product lying flat (default), π/2 = on its side. */
  readonly inclination?: number;
  /** Far face: closed (default) or free drainage. */
  readonly bottom?: 'no-flow' | 'free-drainage';
  /** Cells over the whole stack (default 200). */
  readonly cells?: number;
  /** Layers counted as "upper" for the rewet indicator (default 1: the topsheet). */
  readonly upperLayers?: number;
}

export interface EvaluateStackOptions {
  /** Saturation snapshots over the run (heat-map rows), 11 … 401; default 61. */
  readonly snapshots?: number;
}

/** Defaults of the stack variant, shared by the reader, the form and the docs. */
export const STACK_DEFAULTS = {
  cells: 200,
  upperLayers: 1,
  /** Air-dry fibres: about 2 % of the pore volume filled (common practice for a dry start). */
  initialSaturation: 0.02,
  maxLayers: 8,
  maxInsults: 10,
} as const;

/** Options every saved stack variant is evaluated with, in the browser and on the server alike. */
export const DEFAULT_STACK_OPTIONS: Required<EvaluateStackOptions> = { snapshots: 61 };

export interface StackLayerSummary {
  readonly name: string;
  readonly web: PinnedMaterial | null;
  /** m */
  readonly thickness: number;
  readonly porosity: number;
  readonly porositySource: 'measured' | 'basis weight';
  /** Through-plane permeability used, m². */
  readonly permeability: number;
  /** "Measured" or the correlation's name. */
  readonly permeabilityLabel: string;
  readonly permeabilitySource: string | null;
  /** Whether the correlation is inside its validity range (null when measured). */
  readonly permeabilityInRange: boolean | null;
  readonly retention: {
    readonly mode: StackRetentionMode;
    /** van Genuchten α (1/Pa) and n (given, or fitted to the pore-size distribution); null for Brooks–Corey. */
    readonly alpha: number | null;
    readonly n: number | null;
    readonly entryPressure: number | null;
    readonly lambda: number | null;
  };
  /** Pore volume per area ε·t, m³/m². */
  readonly poreVolume: number;
  /** Liquid held at the start and at the end, m³/m². */
  readonly liquidStart: number;
  readonly liquidEnd: number;
  /** Mean saturation at the end. */
  readonly saturationEnd: number;
}

export interface StackInsultSummary {
  /** Start, s. */
  readonly start: number;
  /** Volume/rate, s. */
  readonly deliveryTime: number;
  /** From the start until no liquid stands on the surface, s; null when not reached before the next gush or the end. */
  readonly acquisitionTime: number | null;
  /** From the start until liquid first stood on the surface, s; null when it never did. */
  readonly pondingTime: number | null;
  /** Largest liquid volume standing on the surface, m³ (over the insult area). */
  readonly peakSurfaceLiquid: number;
}

export interface StackVariantResults {
  readonly status: 'ok';
  /** 'cancelled' only for a run stopped in the browser; saved variants are always completed. */
  readonly run: 'completed' | 'cancelled';
  readonly coreVersion: string;
  readonly configuration: typeof STACK_CONFIGURATION;
  /** The liquid as the single-layer results describe it. */
  readonly liquid: VariantResultsOk['liquid'];
  readonly layers: readonly StackLayerSummary[];
  /** The insult as the 1-D model sees it: per area of the product. */
  readonly insult: {
    readonly area: number;
    /** m³/m² */
    readonly volumePerArea: number;
    /** m/s */
    readonly ratePerArea: number;
    readonly starts: readonly number[];
  };
  readonly insults: readonly StackInsultSummary[];
  /** Simulated time reached, s. */
  readonly timeReached: number;
  /** Volumes over the insult area, m³. */
  readonly totals: {
    readonly supplied: number;
    readonly absorbed: number;
    readonly drained: number;
    /** Liquid standing on the surface at the end. */
    readonly surfaceLiquid: number;
    /** Liquid held in the stack at the end. */
    readonly stored: number;
    /** Pore volume of the whole stack. */
    readonly poreVolume: number;
    /** Liquid left in the upper layers at the end: the rewet indicator. */
    readonly upperLayerLiquid: number;
  };
  /** Liquid held at the end / pore volume of the stack, 0 … 1. */
  readonly capacityUsed: number;
  /** Layers counted for the rewet indicator. */
  readonly upperLayers: number;
  readonly massBalance: { readonly absoluteError: number; readonly relativeError: number };
  /** Saturation over depth and time: saturation[k][i] at times[k] in the cell centred at depth[i]. */
  readonly heatMap: {
    readonly times: readonly number[];
    /** Cell centres, m from the surface. */
    readonly depth: readonly number[];
    /** Layer boundaries, m (layers + 1). */
    readonly boundaries: readonly number[];
    /** Rounded to 1e-4 (display data). */
    readonly saturation: readonly (readonly number[])[];
  };
  /** Time series at the snapshot times; volumes in m³ over the insult area, front depth in m. */
  readonly curves: {
    readonly time: readonly number[];
    readonly supplied: readonly number[];
    readonly absorbed: readonly number[];
    readonly surfaceLiquid: readonly number[];
    readonly frontDepth: readonly number[];
  };
  readonly stats: {
    readonly cells: number;
    readonly steps: number;
    readonly rejectedSteps: number;
    readonly iterations: number;
  };
  readonly equations: readonly EquationUsed[];
  readonly warnings: readonly ModelWarning[];
}
