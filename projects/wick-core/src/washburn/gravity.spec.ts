import { all, create } from 'mathjs';
import { DomainError } from '../errors';
import { gravityCurve, gravityDimensionlessTime, gravityHeight, gravityTime } from './gravity';

/** mathjs 15 ships solveODE but its type declarations do not list it. */
type SolveOde = (
  f: (t: number, y: number[]) => number[],
  tspan: [number, number],
  y0: number[],
  options: { tol: number },
) => { t: number[]; y: number[][] };
const solveODE = (create(all) as unknown as { solveODE: SolveOde }).solveODE;

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

// Water at 20 °C in a 0.3 mm radius glass capillary, the inputs of Çengel & Cimbala, Fluid Mechanics, Example 2-6
// (σ = 0.073 N/m, ρ = 1000 kg/m³, g = 9.81 m/s², θ = 0); η = 1.0 mPa·s (ISO/TR 3666 gives 1.0016 mPa·s, from memory).
const R = 0.3e-3;
const GAMMA = 0.073;
const RHO = 1000;
const G = 9.81;
const ETA = 1.0e-3;
const A = (GAMMA * R) / (4 * ETA); // Washburn (1921): a = γ r cos θ/(4η)
const B = (RHO * G * R * R) / (8 * ETA); // Fries & Dreyer (2008): b = ρ g r²/(8η)

describe('gravity-restrained Washburn solution (dh/dt = a/h − b)', () => {
  it('reproduces the dimensionless check rows computed in 30-digit arithmetic', () => {
    // REFERENCES.md, "Lucas–Washburn with gravity" [C]: H = 1 + W0(−exp(−1 − T)), printed to 12 decimals.
    // With a = b = 1: h_eq = a/b = 1 and t* = a/b² = 1, so h = H and t = T.
    expect(Math.abs(gravityHeight(1, 1, 0.01) - 0.134834751067)).toBeLessThan(6e-13);
    expect(Math.abs(gravityHeight(1, 1, 1) - 0.841405660437)).toBeLessThan(6e-13);
    expect(Math.abs(gravityHeight(1, 1, 5) - 0.997515080665)).toBeLessThan(6e-13);
    // Same rows in dimensional form: h = (a/b)·H at t = (a/b²)·T.
    const a = 2e-4;
    const b = 1e-4;
    expect(rel(gravityHeight(a, b, (a / (b * b)) * 1), (a / b) * 0.841405660437)).toBeLessThan(1e-12);
  });

  it('reduces to the horizontal Washburn law h = √(2at) when b = 0, so h² ∝ t', () => {
    // Washburn (1921), Eq. for a horizontal tube: h² = (γ r cos θ/(2η))·t = 2a·t.
    for (const t of [1e-6, 0.1, 1, 60, 3600]) {
      expect(gravityHeight(A, 0, t)).toBe(Math.sqrt(2 * A * t));
    }
    const h1 = gravityHeight(A, 0, 10);
    expect(rel(gravityHeight(A, 0, 40), 2 * h1)).toBeLessThan(1e-15);
  });

  it('follows the Washburn law at early times, with the first gravity correction −√(2T)/3', () => {
    // Early-time limit of Fries & Dreyer (2008): H ≈ √(2T) − 2T/3 (branch-point series of Corless et al. 1996),
    // so h/√(2at) = 1 − √(2T)/3 + O(T).
    const tStar = A / (B * B);
    for (const T of [1e-12, 1e-9, 1e-6, 1e-4]) {
      const t = T * tStar;
      const ratio = gravityHeight(A, B, t) / Math.sqrt(2 * A * t);
      expect(Math.abs(1 - ratio - Math.sqrt(2 * T) / 3)).toBeLessThan(2 * T + 1e-15);
    }
  });

  it('tends to the Jurin height 2γ cos θ/(ρ g r) at late times', () => {
    // Jurin (1718); Çengel & Cimbala, Example 2-6: D = 0.6 mm water column rises ≈ 0.0496 m (5.0 cm).
    const jurin = (2 * GAMMA) / (RHO * G * R);
    expect(rel(A / B, jurin)).toBeLessThan(1e-15);
    expect(Math.abs(jurin - 0.0496)).toBeLessThan(0.00005);
    const tStar = A / (B * B);
    // 1 − H ≈ e^{−1−T} for large T (W0(x) ≈ x near 0).
    expect(rel(gravityHeight(A, B, 30 * tStar), jurin)).toBeLessThan(1e-13);
    expect(rel(gravityHeight(A, B, 1e6 * tStar), jurin)).toBeLessThan(3e-16);
    expect(gravityHeight(A, B, 30 * tStar)).toBeLessThan(jurin);
  });

  it('satisfies the differential equation dh/dt = a/h − b (central differences)', () => {
    // Definition of the model (Washburn 1921 with gravity): residual of the ODE at several dimensionless times.
    const tStar = A / (B * B);
    for (const T of [0.01, 0.1, 0.5, 1, 2, 4]) {
      const t = T * tStar;
      const dt = t * 1e-5;
      const slope = (gravityHeight(A, B, t + dt) - gravityHeight(A, B, t - dt)) / (2 * dt);
      const h = gravityHeight(A, B, t);
      expect(rel(slope, A / h - B)).toBeLessThan(1e-6);
    }
  });

  it('agrees with an independent numerical integration (mathjs solveODE, Dormand–Prince RK45)', () => {
    // Integrate y = h², dy/dt = 2a − 2b√y from y(0) = 0 (regular at t = 0, unlike dh/dt) with a = b = 1.
    const sol = solveODE((_t, y) => [2 - 2 * Math.sqrt(Math.max(y[0], 0))], [0, 3], [0], { tol: 1e-10 });
    expect(sol.t.length).toBeGreaterThan(20);
    for (let i = 5; i < sol.t.length; i++) {
      expect(rel(gravityHeight(1, 1, sol.t[i]), Math.sqrt(sol.y[i][0]))).toBeLessThan(1e-7);
    }
  });

  it('is increasing in time, below both √(2at) and h_eq', () => {
    // Property: gravity only slows the rise (b > 0), and the front never passes equilibrium.
    const tStar = A / (B * B);
    let previous = 0;
    for (let i = 1; i <= 3000; i++) {
      const t = tStar * Math.pow(10, -8 + (i * 9) / 3000);
      const h = gravityHeight(A, B, t);
      expect(h).toBeGreaterThanOrEqual(previous);
      expect(h).toBeLessThanOrEqual(Math.sqrt(2 * A * t));
      expect(h).toBeLessThanOrEqual(A / B);
      previous = h;
    }
  });

  it('inverts exactly: t(h(t)) = t and h(t(h)) = h', () => {
    // Washburn (1921) implicit solution T = −H − ln(1 − H) is the inverse of the explicit form.
    const tStar = A / (B * B);
    for (const T of [1e-14, 1e-8, 1e-3, 0.02, 0.3, 0.99, 1.01, 3]) {
      const t = T * tStar;
      const back = gravityTime(A, B, gravityHeight(A, B, t));
      expect(back).not.toBeNull();
      expect(rel(back as number, t)).toBeLessThan(2e-13);
    }
    for (const H of [1e-10, 1e-4, 0.1, 0.5, 0.79, 0.81, 0.9, 0.999]) {
      const h = H * (A / B);
      expect(rel(gravityHeight(A, B, gravityTime(A, B, h) as number), h)).toBeLessThan(1e-13);
    }
  });

  it('evaluates T(H) = −H − ln(1 − H) without cancellation for small H', () => {
    // Series −H − ln(1 − H) = Σ Hⁿ/n (n ≥ 2): at H = 1e-6, T = 5.000003333335e-13 to 13 digits.
    expect(rel(gravityDimensionlessTime(1e-6), 0.5e-12 + 1e-18 / 3 + 1e-24 / 4)).toBeLessThan(1e-15);
  });

  it('reports heights at or above equilibrium as never reached, and h = 0 at t = 0', () => {
    expect(gravityTime(A, B, A / B)).toBeNull();
    expect(gravityTime(A, B, 2 * (A / B))).toBeNull();
    expect(gravityTime(A, B, 0)).toBe(0);
    expect(gravityHeight(A, B, 0)).toBe(0);
    // Horizontal (b = 0): every length is reached, t = h²/(2a).
    expect(rel(gravityTime(A, 0, 0.1) as number, 0.01 / (2 * A))).toBeLessThan(1e-15);
  });

  it('stays finite and accurate when b is tiny (no overflow of a/b)', () => {
    // b → 0 must approach the horizontal law continuously.
    expect(rel(gravityHeight(1e-4, 1e-300, 10), Math.sqrt(2e-3))).toBeLessThan(1e-15);
    expect(rel(gravityTime(1e-4, 1e-300, 0.04) as number, 8)).toBeLessThan(1e-15);
  });

  it('computes a curve equal to the pointwise values, into a caller buffer', () => {
    const tStar = A / (B * B);
    const times = new Float64Array(500);
    for (let i = 0; i < times.length; i++) times[i] = (i / 100) * tStar;
    const out = new Float64Array(times.length);
    const returned = gravityCurve(A, B, times, out);
    expect(returned).toBe(out);
    for (let i = 0; i < times.length; i++) expect(out[i]).toBe(gravityHeight(A, B, times[i]));
    expect(gravityCurve(A, 0, [0, 2]).length).toBe(2);
  });

  it('refuses invalid coefficients, times and a short output buffer', () => {
    expect(() => gravityHeight(0, B, 1)).toThrowError(DomainError);
    expect(() => gravityHeight(A, -B, 1)).toThrowError(DomainError);
    expect(() => gravityHeight(A, B, -1)).toThrowError(DomainError);
    expect(() => gravityTime(A, B, Number.NaN)).toThrowError(DomainError);
    expect(() => gravityCurve(A, B, [1, -1])).toThrowError(DomainError, /times\[1\]/);
    expect(() => gravityCurve(A, B, [1, Number.NaN])).toThrowError(DomainError);
    expect(() => gravityCurve(A, B, [1, 2, 3], new Float64Array(2))).toThrowError(DomainError);
  });
});
