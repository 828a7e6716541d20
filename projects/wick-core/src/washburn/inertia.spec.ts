import { DomainError } from '../errors';
import { bosanquetRatio, bosanquetTime, inertialVelocity } from './inertia';

describe('inertial regime (Bosanquet 1923, Quéré 1997)', () => {
  const gamma = 0.072;
  const rho = 1000;
  const eta = 1e-3;
  const r = 0.5e-3;

  it('uses τ = ρ r²/(8η)', () => {
    // Bosanquet, Phil. Mag. 45 (1923) 525: the viscous damping rate of the column is 8η/(ρ r²).
    expect(bosanquetTime(rho, r, eta)).toBeCloseTo((1000 * 0.25e-6) / 8e-3, 15);
  });

  it('rises at Quéré’s inertial speed √(2γ cos θ/(ρ r)) at early times', () => {
    // Quéré, Europhys. Lett. 39 (1997) 533: h ≈ V t for t ≪ τ. Bosanquet's h = h_Washburn·ratio must agree.
    const tau = bosanquetTime(rho, r, eta);
    const v = inertialVelocity(gamma, 1, rho, r);
    for (const t of [1e-6 * tau, 1e-4 * tau]) {
      const hWashburn = Math.sqrt(((gamma * r) / (2 * eta)) * t);
      const hBosanquet = hWashburn * bosanquetRatio(t, tau);
      expect(Math.abs(hBosanquet / (v * t) - 1)).toBeLessThan(t / tau);
    }
  });

  it('tends to Washburn with relative error τ/(2t) at late times', () => {
    // Expansion of Bosanquet's solution: h/h_W = √(1 − τ/t + …) ≈ 1 − τ/(2t).
    const tau = 1;
    for (const t of [100, 1e4]) {
      expect(Math.abs(1 - bosanquetRatio(t, tau) - tau / (2 * t))).toBeLessThan((tau / t) ** 2);
    }
  });

  it('increases monotonically from 0 to 1', () => {
    let previous = bosanquetRatio(0, 1);
    expect(previous).toBe(0);
    for (let i = 1; i <= 500; i++) {
      const value = bosanquetRatio(Math.pow(10, -6 + (i * 12) / 500), 1);
      expect(value).toBeGreaterThan(previous);
      expect(value).toBeLessThanOrEqual(1);
      previous = value;
    }
  });

  it('refuses non-positive scales', () => {
    expect(() => bosanquetTime(0, r, eta)).toThrowError(DomainError);
    expect(() => bosanquetRatio(1, 0)).toThrowError(DomainError);
    expect(() => inertialVelocity(gamma, 0, rho, r)).toThrowError(DomainError);
  });
});
