/**
 * From a variant's numeric parameters to the coefficients of its uptake law, by composing the model
 * families: fibre-bed (porosity, hydraulic radius, capillary pressure, capacity), permeability (the chosen
 * correlation), washburn (a and b of dh/dt = a/h − b for a capillary, a strip or a radial sheet).
 * No physics is written here; this is the wiring the evaluator and its Monte Carlo loop share.
 */
import { STANDARD_GRAVITY } from '../constants';
import { DomainError, isDomainError, type ModelWarning } from '../errors';
import {
  capillaryPressureFromHydraulicRadius,
  capillaryPressureFromPoreDiameter,
  hydraulicRadius,
  saturatedCapacity,
  webPorosity,
} from '../fibre-bed/bed';
import { diameterFromLinearDensity } from '../fibre-bed/fibre';
import {
  davies,
  gebartWith,
  happelWith,
  jacksonJames,
  kozenyCarman,
  tomadakisRobertsonWith,
  type PermeabilityInput,
  type PermeabilityResult,
} from '../permeability/correlations';
import { capillaryCoefficients, isWetting, sinTilt } from '../washburn/capillary';
import { porousCoefficients } from '../washburn/porous-strip';
import type { PermeabilityCorrelationId, ToleranceParameter, VariantConfiguration } from './variant';

/** The numeric parameters a variant resolves from (SI); tolerances vary these. */
export type VariantParameters = Partial<Record<ToleranceParameter, number>>;

/** Non-numeric choices that stay fixed while parameters vary. */
export interface ResolveContext {
  readonly configuration: VariantConfiguration;
  readonly permeabilityMode: 'measured' | 'correlation';
  readonly correlation?: PermeabilityCorrelationId;
  readonly kozenyConstant?: number;
  readonly capillaryPressureFrom: 'hydraulic-radius' | 'pore-diameter';
  readonly shapeFactor: number;
  readonly gravity: number;
}

export interface Resolved {
  readonly wetting: boolean;
  /** Capillary pressure, Pa (≤ 0 when not wetting). */
  readonly capillaryPressure: number;
  readonly permeability: number;
  readonly permeabilityResult: PermeabilityResult | null;
  readonly porosity: number | null;
  readonly solidFraction: number | null;
  readonly fibreDiameter: number | null;
  readonly hydraulicRadius: number | null;
  /** dh/dt = a/h − b. */
  readonly a: number;
  readonly b: number;
  /** Same a, no gravity along the flow. */
  readonly bNoGravity: 0;
  /** Liquid held per metre of wetted strip (kg/m) or per m² of wetted sheet (kg/m²); null when unknown. */
  readonly massPerLength: number | null;
  /** Vertical equilibrium height Pc/(ρ g), m. */
  readonly equilibriumHeight: number | null;
  readonly capacity: { readonly perArea: number; readonly perMass: number } | null;
}

type CorrelationFn = (input: PermeabilityInput, kozenyConstant?: number) => PermeabilityResult;

const CORRELATIONS: Readonly<Record<PermeabilityCorrelationId, CorrelationFn>> = {
  'tomadakis-robertson-2d-in-plane': tomadakisRobertsonWith('2d-in-plane'),
  'tomadakis-robertson-2d-through-plane': tomadakisRobertsonWith('2d-through-plane'),
  'tomadakis-robertson-3d': tomadakisRobertsonWith('3d'),
  'kozeny-carman': (i, k) => kozenyCarman({ ...i, kozenyConstant: k }),
  davies: (i) => davies(i),
  'happel-across': happelWith('across'),
  'happel-along': happelWith('along'),
  'jackson-james': (i) => jacksonJames(i),
  'gebart-across-quadratic': gebartWith('across', 'quadratic'),
  'gebart-across-hexagonal': gebartWith('across', 'hexagonal'),
  'gebart-along-quadratic': gebartWith('along', 'quadratic'),
  'gebart-along-hexagonal': gebartWith('along', 'hexagonal'),
};

/** Family field names → variant input paths, so a family's complaint points at the right form field. */
const FIELD_PATHS: Readonly<Record<string, string>> = {
  thickness: 'structure.thickness',
  basisWeight: 'structure.basisWeight',
  fibreDensity: 'structure.fibreDensity',
  porosity: 'structure.porosity',
  contactAngle: 'structure.contactAngle',
  diameter: 'structure.fibreDiameter',
  fibreDiameter: 'structure.fibreDiameter',
  poreDiameter: 'structure.poreDiameter',
  shapeFactor: 'structure.shapeFactor',
  kozenyConstant: 'structure.permeability.kozenyConstant',
};

/** Re-throws a family's DomainError with the variant's field path. */
export function withVariantField<T>(run: () => T): T {
  try {
    return run();
  } catch (e) {
    if (isDomainError(e) && e.field && FIELD_PATHS[e.field]) {
      throw new DomainError(e.code, e.message, FIELD_PATHS[e.field], e.details);
    }
    throw e;
  }
}

function need(p: VariantParameters, key: ToleranceParameter): number {
  const v = p[key];
  if (v === undefined) throw new DomainError('invalid-input', `${key} is required for this configuration.`, key);
  return v;
}

/** Strip tilt: vertical π/2, horizontal 0, inclined as given. */
function tiltOf(configuration: VariantConfiguration, p: VariantParameters): number {
  switch (configuration) {
    case 'vertical-strip':
      return Math.PI / 2;
    case 'horizontal-strip':
    case 'radial-spread':
      return 0;
    default:
      return p.tilt ?? Math.PI / 2;
  }
}

/**
 * Resolves the parameters of one variant (nominal or one Monte Carlo sample). Family warnings are pushed to
 * `warnings` when given. Throws the families' DomainErrors (with the variant's field paths).
 */
export function resolveVariant(p: VariantParameters, ctx: ResolveContext, warnings?: ModelWarning[]): Resolved {
  return withVariantField(() => resolveUnmapped(p, ctx, warnings));
}

function resolveUnmapped(p: VariantParameters, ctx: ResolveContext, warnings?: ModelWarning[]): Resolved {
  const gamma = need(p, 'surfaceTension');
  const eta = need(p, 'viscosity');
  const rho = need(p, 'liquidDensity');
  const g = ctx.gravity;
  const tilt = tiltOf(ctx.configuration, p);
  const s = sinTilt(tilt);

  if (ctx.configuration === 'capillary') {
    const r = need(p, 'capillaryRadius');
    const theta = need(p, 'contactAngle');
    const wetting = isWetting(theta);
    // Young–Laplace for a round tube, 2γ cos θ / r, as the capillary model reports it.
    const pc = capillaryPressureFromHydraulicRadius(gamma, theta, r / 2);
    const { a, b } = capillaryCoefficients({ radius: r, surfaceTension: gamma, viscosity: eta, contactAngle: theta, density: rho, gravity: g, tilt });
    return {
      wetting,
      capillaryPressure: pc,
      // Poiseuille: a round tube behaves as a medium of permeability r²/8 (porous-strip model comment).
      permeability: (r * r) / 8,
      permeabilityResult: null,
      porosity: null,
      solidFraction: null,
      fibreDiameter: null,
      hydraulicRadius: r / 2,
      a,
      b,
      bNoGravity: 0,
      massPerLength: rho * Math.PI * r * r,
      equilibriumHeight: g > 0 && wetting && s > 0 ? (pc / (rho * g)) : null,
      capacity: null,
    };
  }

  const fibreDensity = need(p, 'fibreDensity');
  const basisWeight = need(p, 'basisWeight');
  const thickness = need(p, 'thickness');
  const theta = need(p, 'contactAngle');
  const diameter =
    p.fibreDiameter ?? diameterFromLinearDensity(need(p, 'linearDensity'), fibreDensity);
  let porosity: number;
  let solidFraction: number;
  if (p.porosity !== undefined) {
    porosity = p.porosity;
    solidFraction = 1 - porosity;
  } else {
    const web = webPorosity({ basisWeight, thickness, fibreDensity });
    warnings?.push(...web.warnings);
    porosity = web.porosity;
    solidFraction = web.solidFraction;
  }
  const rh = hydraulicRadius(porosity, diameter, ctx.shapeFactor);
  const pc =
    ctx.capillaryPressureFrom === 'pore-diameter'
      ? capillaryPressureFromPoreDiameter(gamma, theta, need(p, 'poreDiameter'))
      : capillaryPressureFromHydraulicRadius(gamma, theta, rh);

  let permeability: number;
  let permeabilityResult: PermeabilityResult | null = null;
  if (ctx.permeabilityMode === 'measured') {
    permeability = need(p, 'permeability');
  } else {
    const id = ctx.correlation ?? 'tomadakis-robertson-2d-in-plane';
    // Correlations take the surface-equivalent diameter d/χ (permeability family comment).
    permeabilityResult = CORRELATIONS[id]({ fibreDiameter: diameter / ctx.shapeFactor, porosity }, ctx.kozenyConstant);
    warnings?.push(...permeabilityResult.warnings);
    if (permeabilityResult.permeability === null || !(permeabilityResult.permeability > 0)) {
      throw new DomainError(
        'out-of-range',
        `${permeabilityResult.label} gives no permeability at a solid fraction of ${solidFraction.toPrecision(3)}: ` +
          'choose another correlation or enter a measured permeability.',
        'structure.permeability',
      );
    }
    permeability = permeabilityResult.permeability;
  }

  const wetting = pc > 0;
  const { a, b } = porousCoefficients({
    permeability,
    porosity,
    capillaryPressure: Math.max(pc, 0),
    viscosity: eta,
    density: rho,
    gravity: g,
    tilt,
  });
  const width = p.width;
  const massPerLength =
    ctx.configuration === 'radial-spread'
      ? rho * porosity * thickness
      : width === undefined
        ? null
        : rho * porosity * width * thickness;
  const cap = saturatedCapacity(porosity, thickness, fibreDensity, rho);
  // Per dry mass from the basis weight actually given: C_A / BW (fibre-bed: C_m = C_A/BW when ε is computed).
  const capacity = { perArea: cap.perArea, perMass: p.porosity === undefined ? cap.perMass : cap.perArea / basisWeight };
  return {
    wetting,
    capillaryPressure: pc,
    permeability,
    permeabilityResult,
    porosity,
    solidFraction,
    fibreDiameter: diameter,
    hydraulicRadius: rh,
    a,
    b,
    bNoGravity: 0,
    massPerLength,
    equilibriumHeight: g > 0 && wetting && s > 0 ? pc / (rho * g) : null,
    capacity,
  };
}

/** Gravity used by every variant: standard gravity. */
export const VARIANT_GRAVITY = STANDARD_GRAVITY;
