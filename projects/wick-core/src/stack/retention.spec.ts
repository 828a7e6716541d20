import { BrooksCoreyBurdine, VanGenuchtenMualem, type HydraulicFunctions } from './retention';

/** θ, C, K, dK/dψ at one head through the solver's evaluate(). */
function evaluateAt(m: HydraulicFunctions, psi: number): { theta: number; cap: number; k: number; dk: number } {
  const a = new Float64Array(1);
  const b = new Float64Array(1);
  const c = new Float64Array(1);
  const d = new Float64Array(1);
  m.evaluate(psi, 0, a, b, c, d);
  return { theta: a[0], cap: b[0], k: c[0], dk: d[0] };
}

describe('stack retention: van Genuchten–Mualem', () => {
  // α in 1/m of head, n = 3 (m = 2/3); θs = 0.9, θr = 0.05; Ks = 1e-4 m/s.
  const vg = new VanGenuchtenMualem(0.9, 0.05, 10, 3, 1e-4);
  const m = 1 - 1 / 3;

  it('gives Se = 2^(−m) at α h = 1', () => {
    // van Genuchten (1980) Eq. 3: Se = [1 + (αh)^n]^(−m); at αh = 1 this is 2^(−m) (identity).
    expect(vg.effectiveSaturation(-0.1)).toBeCloseTo(Math.pow(2, -m), 14);
    expect(evaluateAt(vg, -0.1).theta).toBeCloseTo(0.05 + 0.85 * Math.pow(2, -m), 14);
  });

  it('has C = dθ/dψ and dK/dψ equal to central differences of θ(ψ) and K(ψ)', () => {
    // Definition of the specific capacity and of the conductivity slope (mathematical identity).
    for (const psi of [-0.01, -0.08, -0.3, -2]) {
      const e = evaluateAt(vg, psi);
      const h = 1e-6 * Math.abs(psi);
      expect(e.cap).toBeCloseTo((vg.theta(psi + h) - vg.theta(psi - h)) / (2 * h), 6);
      const fd = (vg.conductivity(psi + h) - vg.conductivity(psi - h)) / (2 * h);
      expect(Math.abs(e.dk - fd)).toBeLessThan(1e-6 * Math.abs(fd) + 1e-20);
    }
  });

  it('has K/C equal to the closed-form diffusivity of van Genuchten (1980) Eq. 11', () => {
    // D(Se) = (1−m) Ks Se^(1/2 − 1/m) / (α m (θs − θr)) · [(1 − Se^(1/m))^(−m) + (1 − Se^(1/m))^m − 2]
    // (van Genuchten 1980, Eq. 11, Mualem L = 1/2): an independent expression of the same model.
    for (const psi of [-0.03, -0.1, -0.5, -1.5]) {
      const e = evaluateAt(vg, psi);
      const se = vg.effectiveSaturation(psi);
      const y = 1 - Math.pow(se, 1 / m);
      const d =
        (((1 - m) * 1e-4 * Math.pow(se, 0.5 - 1 / m)) / (10 * m * 0.85)) * (Math.pow(y, -m) + Math.pow(y, m) - 2);
      // (The closed form loses digits to cancellation in dry media, hence 1e-6.)
      expect((e.k / e.cap) / d).toBeCloseTo(1, 6);
    }
  });

  it('follows Mualem: kr(1) = 1, kr = Se^½ [1 − (1 − Se^(1/m))^m]², and K(ψ) = Ks kr(Se(ψ))', () => {
    // Mualem (1976) with van Genuchten (1980) Eq. 8.
    expect(vg.relativePermeability(1)).toBe(1);
    for (const se of [0.05, 0.3, 0.7, 0.95]) {
      const kr = Math.sqrt(se) * (1 - Math.pow(1 - Math.pow(se, 1 / m), m)) ** 2;
      expect(vg.relativePermeability(se)).toBeCloseTo(kr, 14);
      const psi = vg.headAtEffectiveSaturation(se);
      expect(vg.effectiveSaturation(psi)).toBeCloseTo(se, 12);
      expect(vg.conductivity(psi) / 1e-4).toBeCloseTo(kr, 12);
      expect(evaluateAt(vg, psi).k).toBeCloseTo(vg.conductivity(psi), 18);
    }
  });

  it('is saturated, with zero capacity, at and above zero pressure head', () => {
    // Se = 1 for ψ ≥ 0 (van Genuchten 1980, definition of the curve).
    const e = evaluateAt(vg, 0.02);
    expect(e.theta).toBe(0.9);
    expect(e.cap).toBe(0);
    expect(e.k).toBe(1e-4);
    expect(vg.headAtEffectiveSaturation(1)).toBe(0);
  });

  it('keeps θ in [θr, θs] and θ, K non-decreasing in ψ (property)', () => {
    let prevT = 0;
    let prevK = 0;
    for (let lg = 3; lg >= -6; lg -= 0.05) {
      const e = evaluateAt(vg, -Math.pow(10, lg));
      expect(e.theta).toBeGreaterThanOrEqual(0.05);
      expect(e.theta).toBeLessThanOrEqual(0.9);
      expect(e.theta).toBeGreaterThanOrEqual(prevT);
      expect(e.k).toBeGreaterThanOrEqual(prevK);
      expect(Number.isFinite(e.dk)).toBeTrue();
      prevT = e.theta;
      prevK = e.k;
    }
  });

  it('inverts θ(ψ) through headAtContent', () => {
    for (const th of [0.06, 0.2, 0.6, 0.89]) expect(vg.theta(vg.headAtContent(th))).toBeCloseTo(th, 12);
  });
});

describe('stack retention: Brooks–Corey–Burdine', () => {
  // hb = 0.05 m, λ = 2, θs = 0.8, θr = 0; Ks = 2e-4 m/s.
  const bc = new BrooksCoreyBurdine(0.8, 0, 0.05, 2, 2e-4);

  it('gives Se = (hb/h)^λ and kr = Se^(3 + 2/λ) (Brooks & Corey 1964)', () => {
    // At h = 2 hb with λ = 2: Se = 1/4 and kr = (1/4)^4 = 1/256 (Brooks & Corey 1964 with Burdine).
    expect(bc.effectiveSaturation(-0.1)).toBeCloseTo(0.25, 14);
    expect(bc.conductivity(-0.1)).toBeCloseTo(2e-4 / 256, 18);
    expect(bc.relativePermeability(0.25)).toBeCloseTo(1 / 256, 14);
    const e = evaluateAt(bc, -0.1);
    expect(e.theta).toBeCloseTo(0.2, 14);
    // C = (θs − θr) λ Se / h = 0.8·2·0.25/0.1 = 4 1/m (derivative of the power law).
    expect(e.cap).toBeCloseTo(4, 12);
    // dK/dψ = (2 + 3λ) K/h = 8·(2e-4/256)/0.1.
    expect(e.dk).toBeCloseTo((8 * (2e-4 / 256)) / 0.1, 14);
  });

  it('is saturated for suction below the entry head', () => {
    // Se = 1 for h ≤ hb (Brooks & Corey 1964).
    const e = evaluateAt(bc, -0.04);
    expect(e.theta).toBe(0.8);
    expect(e.cap).toBe(0);
    expect(e.k).toBe(2e-4);
    expect(bc.saturationHead).toBe(-0.05);
    expect(bc.headAtEffectiveSaturation(1)).toBe(-0.05);
  });

  it('inverts θ(ψ) and matches central differences of θ and K', () => {
    for (const psi of [-0.06, -0.2, -1]) {
      expect(bc.headAtContent(bc.theta(psi))).toBeCloseTo(psi, 12);
      const h = 1e-6 * Math.abs(psi);
      const e = evaluateAt(bc, psi);
      expect(e.cap).toBeCloseTo((bc.theta(psi + h) - bc.theta(psi - h)) / (2 * h), 6);
      const fd = (bc.conductivity(psi + h) - bc.conductivity(psi - h)) / (2 * h);
      expect(Math.abs(e.dk - fd)).toBeLessThan(1e-6 * fd);
    }
  });
});
