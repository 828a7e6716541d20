import type { ResultBase } from '../api/model-spec';
import { ZERO_CELSIUS } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { requirePositive } from '../validate';

/** Critical temperature of water, K (IAPWS R1-76(2014) and R12-08). */
export const WATER_CRITICAL_TEMPERATURE = 647.096;
/** Triple-point temperature of water, K. */
export const WATER_TRIPLE_POINT = 273.16;

// IAPWS R1-76(2014), Eq. (1).
const SIGMA_B = 235.8e-3; // N/m
const SIGMA_b = -0.625;
const SIGMA_MU = 1.256;

/**
 * Surface tension of ordinary water against its vapour (air in practice).
 *
 * σ = B τ^μ (1 + b τ), τ = 1 − T/Tc, B = 235.8 mN/m, b = −0.625, μ = 1.256, Tc = 647.096 K.
 *
 * - T: temperature, K (ITS-90). Returns σ in N/m.
 * - Validity: triple point (273.16 K) to Tc; the release says it also extrapolates sensibly into the
 *   supercooled liquid down to about −25 °C (use {@link waterProperties} for the warnings).
 * - Source: IAPWS R1-76(2014), Revised Release on Surface Tension of Ordinary Water Substance.
 *
 * @throws DomainError when T ≤ 0 or T ≥ Tc (no liquid–vapour interface).
 */
export function iapwsSurfaceTension(temperatureK: number): number {
  requirePositive('temperature', temperatureK);
  if (temperatureK >= WATER_CRITICAL_TEMPERATURE) {
    throw new DomainError(
      'out-of-range',
      `Water has no surface tension at or above its critical temperature 647.096 K (got ${temperatureK} K).`,
      'temperature',
    );
  }
  const tau = 1 - temperatureK / WATER_CRITICAL_TEMPERATURE;
  return SIGMA_B * Math.pow(tau, SIGMA_MU) * (1 + SIGMA_b * tau);
}

// IAPWS R12-08, Table 1 (H_i) and Table 2 (H_ij, i = 0..5 rows, j = 0..6 columns).
const T_STAR = 647.096; // K
const RHO_STAR = 322; // kg/m³
const MU_STAR = 1e-6; // Pa s
const H0 = [1.67752, 2.20462, 0.6366564, -0.241605];
const HIJ: readonly (readonly number[])[] = [
  [5.20094e-1, 2.22531e-1, -2.81378e-1, 1.61913e-1, -3.25372e-2, 0, 0],
  [8.50895e-2, 9.99115e-1, -9.06851e-1, 2.57399e-1, 0, 0, 0],
  [-1.08374, 1.88797, -7.72479e-1, 0, 0, 0, 0],
  [-2.89555e-1, 1.26613, -4.89837e-1, 0, 6.98452e-2, 0, -4.35673e-3],
  [0, 0, -2.5704e-1, 0, 0, 8.72102e-3, 0],
  [0, 1.20573e-1, 0, 0, 0, 0, -5.93264e-4],
];

/**
 * Dynamic viscosity of water at a given temperature and density, without the critical enhancement
 * (μ̄2 = 1), as recommended for ordinary use away from the critical point.
 *
 * μ = μ* · μ̄0(T̄) · μ̄1(T̄, ρ̄), T̄ = T/647.096 K, ρ̄ = ρ/322 kg m⁻³, μ* = 1 µPa·s,
 * μ̄0 = 100 √T̄ / Σ_{i=0..3} H_i T̄^−i,
 * μ̄1 = exp[ρ̄ Σ_{i=0..5} (1/T̄ − 1)^i Σ_{j=0..6} H_ij (ρ̄ − 1)^j].
 *
 * - T: temperature, K; ρ: density, kg/m³. Returns μ in Pa·s.
 * - Validity: the stable fluid from 273.16 K to 1173.15 K up to 1000 MPa (narrower at high
 *   pressure); the critical term is negligible more than a few kelvin from the critical point.
 * - Source: IAPWS R12-08, Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary Water
 *   Substance; Huber et al., J. Phys. Chem. Ref. Data 38 (2009) 101.
 */
export function iapwsViscosity(temperatureK: number, density: number): number {
  requirePositive('temperature', temperatureK);
  requirePositive('density', density);
  const t = temperatureK / T_STAR;
  const r = density / RHO_STAR;
  const inv = 1 / t;
  const mu0 = (100 * Math.sqrt(t)) / (H0[0] + H0[1] * inv + H0[2] * inv * inv + H0[3] * inv * inv * inv);
  const x = inv - 1;
  const y = r - 1;
  let sum = 0;
  let xi = 1;
  for (let i = 0; i < 6; i++) {
    const row = HIJ[i];
    // Horner in (ρ̄ − 1).
    let inner = row[6];
    for (let j = 5; j >= 0; j--) inner = inner * y + row[j];
    sum += xi * inner;
    xi *= x;
  }
  const mu1 = Math.exp(r * sum);
  const mu = MU_STAR * mu0 * mu1;
  if (!Number.isFinite(mu)) {
    throw new DomainError('out-of-range', `Water viscosity is undefined at T = ${temperatureK} K, ρ = ${density} kg/m³.`);
  }
  return mu;
}

// Tanaka et al. (2001), Eq. (1) and Table 5 (t in °C, ITS-90).
const A1 = -3.983035; // °C
const A2 = 301.797; // °C
const A3 = 522528.9; // °C²
const A4 = 69.34881; // °C
const A5 = 999.97495; // kg/m³

/** Temperature range of the Tanaka density formula, K. */
export const TANAKA_RANGE = { min: ZERO_CELSIUS, max: ZERO_CELSIUS + 40 } as const;

/**
 * Density of air-free ordinary water (SMOW isotopic composition) at 101 325 Pa.
 *
 * ρ = a5 [1 − (t + a1)² (t + a2) / (a3 (t + a4))], t in °C,
 * a1 = −3.983035 °C, a2 = 301.797 °C, a3 = 522528.9 °C², a4 = 69.34881 °C, a5 = 999.97495 kg/m³.
 *
 * - T: temperature, K. Returns ρ in kg/m³.
 * - Validity: 0–40 °C (stated uncertainty about 1 ppm there); outside it the formula is an
 *   extrapolation ({@link waterProperties} warns).
 * - Source: Tanaka, Girard, Davis, Peuto & Bignell, Metrologia 38 (2001) 301, the CIPM recommended table.
 */
export function tanakaDensity(temperatureK: number): number {
  requirePositive('temperature', temperatureK);
  const t = temperatureK - ZERO_CELSIUS;
  const d = A3 * (t + A4);
  if (d <= 0) {
    throw new DomainError('out-of-range', `The water density formula does not apply at ${temperatureK} K.`, 'temperature');
  }
  const rho = A5 * (1 - ((t + A1) * (t + A1) * (t + A2)) / d);
  if (!(rho > 0)) {
    throw new DomainError('out-of-range', `The water density formula does not apply at ${temperatureK} K.`, 'temperature');
  }
  return rho;
}

/** Temperatures at which {@link waterProperties} computes at all, K (−20 °C to 150 °C). */
export const WATER_HARD_RANGE = { min: ZERO_CELSIUS - 20, max: ZERO_CELSIUS + 150 } as const;
/** Range without warnings: liquid water at 1 atm, K. */
export const WATER_RANGE = { min: ZERO_CELSIUS, max: ZERO_CELSIUS + 100 } as const;

export interface WaterPropertiesInput {
  /** K */
  readonly temperature: number;
  /** kg/m³; the Tanaka density at `temperature` when omitted. */
  readonly density?: number;
}

export interface WaterPropertiesResult extends ResultBase<WaterPropertiesInput> {
  /** N/m, IAPWS R1-76(2014). */
  readonly surfaceTension: number;
  /** Pa·s, IAPWS R12-08 with μ̄2 = 1. */
  readonly viscosity: number;
  /** kg/m³: the given density, or Tanaka (2001). */
  readonly density: number;
}

/**
 * Surface tension, viscosity and density of liquid water at temperature T, with validity warnings.
 *
 * σ from {@link iapwsSurfaceTension}, μ from {@link iapwsViscosity} at the density ρ, ρ from
 * {@link tanakaDensity} unless the caller gives it.
 *
 * - Validity without warnings: 0–100 °C (liquid at 1 atm), density 0–40 °C. Computes with warnings
 *   from −20 °C to 150 °C; refuses beyond.
 * - Sources: IAPWS R1-76(2014); IAPWS R12-08 (Huber et al. 2009); Tanaka et al., Metrologia 38 (2001) 301.
 */
export function waterProperties(input: WaterPropertiesInput): WaterPropertiesResult {
  const T = requirePositive('temperature', input.temperature);
  if (T < WATER_HARD_RANGE.min || T > WATER_HARD_RANGE.max) {
    throw new DomainError(
      'out-of-range',
      `Water properties are available from −20 °C to 150 °C (got ${(T - ZERO_CELSIUS).toFixed(2)} °C).`,
      'temperature',
      { min: WATER_HARD_RANGE.min, max: WATER_HARD_RANGE.max },
    );
  }
  const warnings: ModelWarning[] = [];
  const tC = (T - ZERO_CELSIUS).toFixed(1);
  if (T < WATER_TRIPLE_POINT) {
    warnings.push({
      code: 'supercooled',
      message: `At ${tC} °C water is supercooled: surface tension and viscosity are extrapolations of the IAPWS formulas below the triple point.`,
    });
  }
  if (T > WATER_RANGE.max) {
    warnings.push({
      code: 'above-boiling',
      message: `At ${tC} °C water boils at 1 atm: values are for liquid water kept under pressure.`,
    });
  }
  let density: number;
  if (input.density === undefined) {
    density = tanakaDensity(T);
    if (T < TANAKA_RANGE.min || T > TANAKA_RANGE.max) {
      warnings.push({
        code: 'density-extrapolated',
        message: `The water density formula (Tanaka et al. 2001) holds from 0 to 40 °C; at ${tC} °C it is extrapolated. Pass a measured or tabulated density for better accuracy.`,
      });
    }
  } else {
    density = requirePositive('density', input.density);
  }
  return {
    inputs: input,
    warnings,
    surfaceTension: iapwsSurfaceTension(T),
    viscosity: iapwsViscosity(T, density),
    density,
  };
}
