import { requireNonNegative, requirePositive } from '../validate';

/**
 * Early-time inertial regime of capillary uptake.
 *
 * Momentum balance of the liquid column (Bosanquet 1923), horizontal, starting from rest at h = 0:
 *   d/dt(h·dh/dt) = 2γ cos θ/(ρ r) − (8η/(ρ r²))·h·dh/dt.
 * With τ = ρ r²/(8η) its solution is
 *   h² = (γ r cos θ/(2η))·[t − τ(1 − e^{−t/τ})],
 * i.e. the Washburn law h² = (γ r cos θ/(2η))·t times the factor 1 − (τ/t)(1 − e^{−t/τ}). For t ≪ τ it gives
 * the inertial rise at constant speed V = √(2γ cos θ/(ρ r)) (Quéré 1997); for t ≫ τ it tends to Washburn with
 * relative error in h of about τ/(2t).
 *
 * Sources: C. H. Bosanquet, Phil. Mag. (Ser. 6) 45 (1923) 525–531; D. Quéré, Europhys. Lett. 39 (1997)
 * 533–538 ("Inertial capillarity"). Entrance losses and the dynamic contact angle are neglected.
 */

/**
 * Bosanquet's viscous–inertial time τ = ρ r²/(8η), s.
 * @param density ρ, kg/m³ (> 0). @param radius r, m (> 0). @param viscosity η, Pa·s (> 0).
 */
export function bosanquetTime(density: number, radius: number, viscosity: number): number {
  requirePositive('density', density);
  requirePositive('radius', radius);
  requirePositive('viscosity', viscosity);
  return (density * radius * radius) / (8 * viscosity);
}

/**
 * Ratio h_Bosanquet(t)/h_Washburn(t) = √(1 − (τ/t)(1 − e^{−t/τ})) for a liquid starting from rest (Bosanquet 1923).
 * Tends to 1 as t/τ → ∞ and to √(t/(2τ)) as t/τ → 0. Dimensionless, in (0, 1].
 * @param t time, s (≥ 0). @param tau Bosanquet time, s (> 0).
 */
export function bosanquetRatio(t: number, tau: number): number {
  requireNonNegative('t', t);
  requirePositive('tau', tau);
  if (t === 0) return 0;
  const x = t / tau;
  return Math.sqrt(1 + Math.expm1(-x) / x);
}

/**
 * Inertial (Quéré 1997) meniscus speed V = √(2γ cos θ/(ρ r)), m/s: the early-time limit of Bosanquet's solution.
 * @param surfaceTension γ, N/m. @param cosTheta cos θ (> 0). @param density ρ, kg/m³. @param radius r, m.
 */
export function inertialVelocity(surfaceTension: number, cosTheta: number, density: number, radius: number): number {
  requirePositive('surfaceTension', surfaceTension);
  requirePositive('cosTheta', cosTheta);
  requirePositive('density', density);
  requirePositive('radius', radius);
  return Math.sqrt((2 * surfaceTension * cosTheta) / (density * radius));
}
