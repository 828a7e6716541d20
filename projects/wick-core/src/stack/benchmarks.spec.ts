import { STANDARD_GRAVITY } from '../constants';
import { gravityHeight } from '../washburn/gravity';
import { BrooksCoreyBurdine, VanGenuchtenMualem, type HydraulicFunctions } from './retention';
import { simulateStack } from './simulate';
import type { StackInput, StackLayerInput, StackSolverOptions } from './types';

/*
 * The Richards solver against solutions obtained independently of it:
 * - horizontal absorption: the Boltzmann similarity solution (I ∝ √t exactly) and its sorptivity,
 *   computed here by iterating the flux–concentration relation (a separate, quasi-analytical method);
 * - the sharp-front limit: Green–Ampt / Washburn (horizontal), Fries & Dreyer (upward wicking against
 *   gravity), Mein & Larson (ponding time under constant supply);
 * - Philip's (1957) infiltration series and the Celia, Bouloutas & Zarba (1990) test problem.
 */

const RHO = 1000;
const ETA = 1e-3;
const RHO_G = RHO * STANDARD_GRAVITY;

/**
 * Sorptivity of horizontal absorption from ψ_i (initial) to 0 (inlet), by iterating the flux–concentration
 * relation of the Boltzmann similarity solution (Philip & Knight, Soil Sci. 117 (1974) 1; Parlange,
 * Soil Sci. 119 (1975) 158; citations from memory):
 *
 *   S² = 2 ∫ (θ − θi) D/F dθ,  λ(θ) = (2/S) ∫_θ^θs D/F dθ',  F(θ) = ∫_θi^θ λ dθ' / ∫_θi^θs λ dθ'
 *
 * with x = λ √t the Boltzmann variable and F the normalised flux. D dθ = K dψ, so every integral is
 * taken over ψ on a logarithmic grid, which avoids the singular D of van Genuchten curves at θs.
 * Also returns the rigorous bounds 2∫(θ−θi)D dθ ≤ S² ≤ 2(θs−θi)∫D dθ (from Θ ≤ F ≤ 1); the upper
 * bound is the Green–Ampt sorptivity.
 */
function philipSorptivity(m: HydraulicFunctions, psiI: number): { s: number; lower: number; greenAmpt: number } {
  const n = 8000;
  const psi: number[] = [];
  const lo = Math.log(-psiI);
  const hi = Math.log(1e-7 * -psiI);
  for (let j = 0; j < n; j++) psi.push(-Math.exp(lo + ((hi - lo) * j) / (n - 1)));
  psi.push(0);
  const th = psi.map((p) => m.theta(p));
  const k = psi.map((p) => m.conductivity(p));
  const thI = th[0];
  const thS = th[th.length - 1];
  let f = th.map((t) => (t - thI) / (thS - thI));
  let s = 0;
  for (let iter = 0; iter < 40; iter++) {
    let s2 = 0;
    for (let j = 2; j < psi.length; j++) {
      const a = ((th[j] - thI) * k[j]) / f[j];
      const b = ((th[j - 1] - thI) * k[j - 1]) / f[j - 1];
      s2 += 0.5 * (a + b) * (psi[j] - psi[j - 1]);
    }
    s = Math.sqrt(2 * s2);
    const lam = new Array<number>(psi.length).fill(0);
    for (let j = psi.length - 2; j >= 1; j--) {
      lam[j] = lam[j + 1] + (2 / s) * 0.5 * (k[j] / f[j] + k[j + 1] / f[j + 1]) * (psi[j + 1] - psi[j]);
    }
    lam[0] = lam[1];
    const cum = new Array<number>(psi.length).fill(0);
    for (let j = 1; j < psi.length; j++) cum[j] = cum[j - 1] + 0.5 * (lam[j] + lam[j - 1]) * (th[j] - th[j - 1]);
    f = cum.map((c) => c / cum[cum.length - 1]);
    f[0] = f[1] * 1e-3;
  }
  let lower = 0;
  let ga = 0;
  for (let j = 1; j < psi.length; j++) {
    const dpsi = psi[j] - psi[j - 1];
    lower += 0.5 * ((th[j] - thI) * k[j] + (th[j - 1] - thI) * k[j - 1]) * dpsi;
    ga += 0.5 * (k[j] + k[j - 1]) * dpsi;
  }
  return { s, lower: Math.sqrt(2 * lower), greenAmpt: Math.sqrt(2 * (thS - thI) * ga) };
}

/** Neuman's (1976) Green–Ampt capillary drive ψ_f = ∫_ψi^0 kr dψ, m (midpoint rule). */
function capillaryDrive(m: HydraulicFunctions, psiI: number): number {
  const n = 200_000;
  let sum = 0;
  for (let j = 0; j < n; j++) sum += m.conductivity(psiI * (1 - (j + 0.5) / n)) / m.ks;
  return (sum * -psiI) / n;
}

const liquid = { density: RHO, viscosity: ETA };

/** A smooth van Genuchten medium: α = 1e-3 1/Pa, n = 3, θs = 0.9, θr = 0.02, k = 1e-11 m², S0 = 0.05. */
const VG = { alpha: 1e-3, n: 3, thetaS: 0.9, thetaR: 0.02, k: 1e-11, s0: 0.05 };
const vgMaterial = new VanGenuchtenMualem(VG.thetaS, VG.thetaR, VG.alpha * RHO_G, VG.n, (VG.k * RHO_G) / ETA);
const vgPsiI = vgMaterial.headAtContent(VG.s0 * VG.thetaS);
const vgReference = philipSorptivity(vgMaterial, vgPsiI);

function vgLayer(thickness: number, cells: number, grading = 1): StackLayerInput {
  return {
    thickness,
    porosity: VG.thetaS,
    residualContent: VG.thetaR,
    retention: { kind: 'van-genuchten', alpha: VG.alpha, n: VG.n },
    permeability: VG.k,
    initialSaturation: VG.s0,
    cells,
    grading,
  };
}

function horizontalAbsorption(cells: number, solver: StackSolverOptions = {}, grading = 1) {
  const input: StackInput = {
    geometry: 'in-plane',
    layers: [vgLayer(0.1, cells, grading)],
    liquid,
    top: { kind: 'pressure', pressure: 0 },
    endTime: 100,
    snapshots: 11,
    solver,
  };
  return simulateStack(input);
}

/** Brooks–Corey layer with entry pressure 490 Pa (hb ≈ 5 cm of water), k = 1e-11 m², S0 at ψ = −3 hb. */
function bcCase(lambda: number) {
  const pb = 490;
  const hb = pb / RHO_G;
  const material = new BrooksCoreyBurdine(0.9, 0, hb, lambda, (1e-11 * RHO_G) / ETA);
  const psiI = -3 * hb;
  const s0 = material.theta(psiI) / 0.9;
  const layer = (thickness: number, cells: number, grading = 1): StackLayerInput => ({
    thickness,
    porosity: 0.9,
    retention: { kind: 'brooks-corey', entryPressure: pb, lambda },
    permeability: 1e-11,
    initialSaturation: s0,
    cells,
    grading,
  });
  return { material, psiI, hb, layer, dTheta: 0.9 - material.theta(psiI), drive: capillaryDrive(material, psiI) };
}

describe('stack flow against analytical and semi-analytical solutions', () => {
  it('has a sorptivity reference inside its rigorous bounds', () => {
    // Parlange (1975) / Philip & Knight (1974): Θ ≤ F ≤ 1 bounds S² between 2∫(θ−θi)D dθ and
    // 2(θs−θi)∫D dθ. A check of the test's own reference before it is used.
    expect(vgReference.s).toBeGreaterThan(vgReference.lower);
    expect(vgReference.s).toBeLessThan(vgReference.greenAmpt);
  });

  it('absorbs horizontally as I = S √t (Boltzmann similarity) with the semi-analytical sorptivity', () => {
    // Boltzmann transformation x/√t: for a semi-infinite medium with constant inlet head the uptake
    // is exactly I = S √t (Philip 1957, The theory of infiltration 4); S from the iteration above.
    const r = horizontalAbsorption(100, {}, 1.03);
    const ratios: number[] = [];
    for (let k = 2; k < r.snapshots.times.length; k++) {
      ratios.push(r.snapshots.absorbed[k] / Math.sqrt(r.snapshots.times[k]) / vgReference.s);
    }
    for (const q of ratios) expect(Math.abs(q - 1)).toBeLessThan(0.01);
    expect(Math.max(...ratios) - Math.min(...ratios)).toBeLessThan(0.005);
    // The front has not reached the far end, so the domain acts as semi-infinite.
    expect(r.snapshots.frontPositions[10]).toBeLessThan(0.06);
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
  });

  it('converges on grid refinement towards the similarity solution', () => {
    // Error of I(100 s) against S√t decreases as the cells are halved.
    const errors = [25, 50, 100].map((cells) => {
      const r = horizontalAbsorption(cells);
      expect(r.massBalance.relativeError).toBeLessThan(1e-6);
      return Math.abs(r.snapshots.absorbed[10] / (vgReference.s * 10) - 1);
    });
    expect(errors[1]).toBeLessThan(0.7 * errors[0]);
    expect(errors[2]).toBeLessThan(0.7 * errors[1]);
    expect(errors[2]).toBeLessThan(0.01);
  });

  it('converges on time-step refinement (backward Euler, first order)', () => {
    // Same grid; reference with very small steps. Halving the allowed saturation change per step
    // roughly halves the time-discretisation error.
    const reference = horizontalAbsorption(50, { maxSaturationChange: 0.002, maxStep: 0.5 }).snapshots.absorbed[10];
    const errors = [0.1, 0.05, 0.025].map((c) =>
      Math.abs(horizontalAbsorption(50, { maxSaturationChange: c }).snapshots.absorbed[10] / reference - 1),
    );
    expect(errors[1]).toBeLessThan(0.75 * errors[0]);
    expect(errors[2]).toBeLessThan(0.75 * errors[1]);
  });

  it('approaches the Green–Ampt/Washburn sorptivity as the retention curve sharpens', () => {
    // Richards sorptivity ≤ Green–Ampt's √(2Δθ Ks ψ_f) (upper bound above), with equality for a step
    // curve; for Brooks–Corey λ = 60 the gap is below 1e-4 (computed), and the simulated uptake
    // follows Washburn's I = √(2 Δθ Ks ψ_f t) (Green & Ampt 1911; Washburn 1921) within 1 %.
    const gaps = [2, 20, 60].map((lambda) => {
      const c = bcCase(lambda);
      const ref = philipSorptivity(c.material, c.psiI);
      return 1 - ref.s / ref.greenAmpt;
    });
    expect(gaps[1]).toBeLessThan(gaps[0]);
    expect(gaps[2]).toBeLessThan(1e-4);
    const c = bcCase(60);
    const r = simulateStack({
      geometry: 'in-plane',
      layers: [c.layer(0.1, 200)],
      liquid,
      top: { kind: 'pressure', pressure: 0 },
      endTime: 100,
      snapshots: 11,
    });
    const sWashburn = Math.sqrt(2 * c.dTheta * c.material.ks * c.drive);
    for (const k of [4, 7, 10]) {
      expect(r.snapshots.absorbed[k] / (sWashburn * Math.sqrt(r.snapshots.times[k]))).toBeCloseTo(1, 1.7);
    }
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
  });

  it('wicks upwards like dh/dt = a/h − b (Fries & Dreyer 2008) in the sharp-front limit', () => {
    // Darcy wicking against gravity: a = Ks ψ_f/Δθ (= k Pc/(ε η)), b = Ks/Δθ (= k ρ g/(ε η)),
    // h(t) from gravityHeight (Fries & Dreyer 2008 explicit form). Richards' uptake expressed as
    // h = I/Δθ approaches it as the Brooks–Corey λ grows.
    const hRef = (a: number, b: number, t: number) => gravityHeight(a, b, t);
    // Guard on the reference: T = −H − ln(1 − H) (Washburn 1921 implicit form) at T = 1, H = 0.841405660437.
    expect(hRef(1, 1, 1)).toBeCloseTo(0.841405660437, 10);
    const errorsAt3 = [5, 20, 60].map((lambda) => {
      const c = bcCase(lambda);
      const a = (c.material.ks * c.drive) / c.dTheta;
      const b = c.material.ks / c.dTheta;
      const tStar = a / (b * b);
      const r = simulateStack({
        inclination: Math.PI,
        layers: [c.layer(1.6 * c.hb, 120)],
        liquid,
        top: { kind: 'pressure', pressure: 0 },
        endTime: 3 * tStar,
        snapshots: 31,
      });
      expect(r.massBalance.relativeError).toBeLessThan(1e-6);
      const err = (k: number) => r.snapshots.absorbed[k] / c.dTheta / hRef(a, b, r.snapshots.times[k]) - 1;
      if (lambda === 60) {
        for (const k of [3, 10, 30]) expect(Math.abs(err(k))).toBeLessThan(0.01);
      }
      return Math.abs(err(30));
    });
    expect(errorsAt3[1]).toBeLessThan(errorsAt3[0]);
    expect(errorsAt3[2]).toBeLessThan(errorsAt3[1]);
  });

  it('ponds at the Mein & Larson (1973) time under a constant supply above Ks', () => {
    // Green–Ampt ponding time for a supply rate R > Ks: t_p = Ks ψ_f Δθ / (R (R − Ks)) (Mein & Larson,
    // Water Resour. Res. 9 (1973) 384). Sharp curve (λ = 20), grid refined at the inlet.
    const c = bcCase(20);
    const ks = c.material.ks;
    const rate = 3 * ks;
    const tp = (ks * c.drive * c.dTheta) / (rate * (rate - ks));
    const r = simulateStack({
      layers: [c.layer(0.2, 200, 1.02)],
      liquid,
      top: { kind: 'insults', insults: [{ start: 0, volume: rate * 3 * tp, rate }] },
      endTime: 3 * tp,
      snapshots: 11,
    });
    const ponding = r.insults[0].pondingTime;
    expect(ponding).not.toBeNull();
    expect((ponding as number) / tp).toBeCloseTo(1, 1.7);
    expect(r.insults[0].peakSurfaceLiquid).toBeGreaterThan(0);
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
  });

  it('follows Philip’s infiltration series I = S√t + A t at early times, with Ks/3 ≤ A ≤ 2Ks/3', () => {
    // Philip (1957), The theory of infiltration 4: vertical uptake exceeds horizontal by A t + O(t^1.5);
    // bounds Ks/3 ≤ A ≤ 2Ks/3 (for θi near θr) from memory. t = 10 s is 1 % of the gravity time (S/Ks)².
    const common: StackInput = {
      layers: [vgLayer(0.1, 100, 1.03)],
      liquid,
      top: { kind: 'pressure', pressure: 0 },
      endTime: 10,
      snapshots: 3,
    };
    const down = simulateStack({ ...common, inclination: 0 });
    const side = simulateStack({ ...common, inclination: Math.PI / 2 });
    const ks = vgMaterial.ks;
    expect(((vgReference.s / ks) ** 2 * 0.01) / 10).toBeCloseTo(1, 0);
    const a = (down.totals.absorbed - side.totals.absorbed) / 10;
    expect(a).toBeGreaterThan(ks / 3);
    expect(a).toBeLessThan((2 * ks) / 3);
    // And the horizontal part is the sorptivity term.
    expect(side.totals.absorbed / (vgReference.s * Math.sqrt(10))).toBeCloseTo(1, 1.7);
  });

  it('conserves mass on the Celia, Bouloutas & Zarba (1990) problem even with one-hour steps', () => {
    // Test problem of Celia et al. (1990), parameters from memory: θs = 0.368, θr = 0.102,
    // α = 0.0335 1/cm, n = 2, Ks = 0.00922 cm/s, 100 cm column, ψ = −1000 cm initially and at the
    // bottom, −75 cm at the top, 1 day. Their point (mixed form conserves mass at any step size) is
    // checked, plus the top cell content θ(−75 cm) = 0.102 + 0.266·(1 + 2.5125²)^(−1/2) from Eq. 3.
    const run = (maxStep: number) =>
      simulateStack({
        layers: [
          {
            thickness: 1,
            porosity: 0.368,
            residualContent: 0.102,
            retention: { kind: 'van-genuchten', alpha: 3.35 / RHO_G, n: 2 },
            conductivity: 9.22e-5,
            cells: 100,
          },
        ],
        liquid,
        initialPressure: -10 * RHO_G,
        top: { kind: 'pressure', pressure: -0.75 * RHO_G },
        bottom: { kind: 'pressure', pressure: -10 * RHO_G },
        endTime: 86_400,
        snapshots: 3,
        solver: { maxStep, maxSaturationChange: 1 },
      });
    const coarse = run(3600);
    const fine = run(120);
    expect(coarse.massBalance.relativeError).toBeLessThan(1e-6);
    expect(fine.massBalance.relativeError).toBeLessThan(1e-6);
    expect(coarse.stats.largestStep).toBe(3600);
    const topTheta = 0.102 + 0.266 * Math.pow(1 + 2.5125 ** 2, -0.5);
    expect(coarse.snapshots.saturation[2 * 100] * 0.368).toBeCloseTo(topTheta, 2);
    // Large steps cost accuracy, not mass: the uptake differs from the fine run by a few per cent only.
    expect(coarse.totals.absorbed / fine.totals.absorbed).toBeCloseTo(1, 1.3);
    expect(fine.snapshots.frontPositions[2]).toBeGreaterThan(0.3);
    expect(fine.snapshots.frontPositions[2]).toBeLessThan(0.9);
  });
});
