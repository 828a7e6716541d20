import { STANDARD_GRAVITY } from '../constants';
import { porousStripUptake, type PorousStripOk } from '../washburn/porous-strip';
import { simulateStack } from './simulate';
import type { StackInput } from './types';

/*
 * One layer of the stack model against the library's own closed-form Darcy wicking (washburn/porous-strip:
 * sharp front, dh/dt = a/h − b, a = k Pc/(ε η), b = k ρ g sin α/(ε η), Green & Ampt 1911, Fries & Dreyer 2008),
 * for a strip lying flat, tilted and vertical. The Richards solution approaches the sharp-front one as the
 * Brooks–Corey curve sharpens (λ → ∞); the front's capillary pressure is Neuman's (1976) drive
 * Pc = ρ g ∫_ψi^0 kr dψ, which for Brooks–Corey–Burdine (kr = (hb/|ψ|)^(3λ+2) below −hb, 1 above) is
 *   ψ_f = hb [1 + (1 − (hb/H)^(3λ+1))/(3λ + 1)],  H = |ψi|   (integral in closed form).
 */

const RHO = 1000;
const ETA = 1e-3;
const RHO_G = RHO * STANDARD_GRAVITY;
const K = 1e-11;
const EPS = 0.9;
const PB = 490;
const LAMBDA = 60;
const HB = PB / RHO_G;
const H_INITIAL = 3 * HB;
const DRIVE = HB * (1 + (1 - (HB / H_INITIAL) ** (3 * LAMBDA + 1)) / (3 * LAMBDA + 1));
// Se(ψi) = (hb/H)^λ = 3^−60: the strip starts dry for every practical purpose (Δθ = ε to 1e-28).
const S0 = (HB / H_INITIAL) ** LAMBDA;

/** Wetted length along the strip from the stack model (I/ε) and from the closed form, at the same times. */
function compare(tilt: number, length: number, times: readonly number[]) {
  const input: StackInput = {
    geometry: 'in-plane',
    // The stack axis points from the reservoir into the strip: β = π/2 + tilt from the downward vertical.
    inclination: Math.PI / 2 + tilt,
    layers: [{ thickness: length, porosity: EPS, retention: { kind: 'brooks-corey', entryPressure: PB, lambda: LAMBDA }, permeability: K, initialSaturation: S0, cells: 150 }],
    liquid: { density: RHO, viscosity: ETA },
    top: { kind: 'pressure', pressure: 0 },
    endTime: times[times.length - 1],
    snapshots: 2,
  };
  const strip = porousStripUptake({
    permeability: K,
    porosity: EPS,
    capillaryPressure: RHO_G * DRIVE,
    viscosity: ETA,
    density: RHO,
    width: 0.01,
    thickness: 0.001,
    tilt,
    times,
  }) as PorousStripOk;
  expect(strip.status).toBe('ok');
  // Runs ending at each requested time, so no interpolation between snapshots enters the comparison.
  return times.map((t, i) => {
    const at = simulateStack({ ...input, endTime: t });
    expect(at.massBalance.relativeError).toBeLessThan(1e-6);
    return { richards: at.totals.absorbed / EPS, closedForm: strip.atTimes[i].height, massFromClosedForm: strip.atTimes[i].mass };
  });
}

describe('stack model, one layer, against the closed-form Darcy wicking of the washburn family', () => {
  it('lying flat: h² = 2 a t (Washburn 1921) within 1.5 %', () => {
    const a = (K * RHO_G * DRIVE) / (EPS * ETA);
    const tEnd = (0.05 * 0.05) / (2 * a); // front at about 5 cm
    for (const c of compare(0, 0.08, [tEnd / 10, tEnd / 2, tEnd])) {
      // Early on the sharp front has crossed few cells and the arithmetic face mean lags (docs/models/stack.md).
      expect(Math.abs(c.richards / c.closedForm - 1)).toBeLessThan(0.015);
    }
  });

  it('tilted 30° and vertical: dh/dt = a/h − b (Fries & Dreyer 2008) within 1 %, slowing towards h_eq', () => {
    for (const tilt of [Math.PI / 6, Math.PI / 2]) {
      const a = (K * RHO_G * DRIVE) / (EPS * ETA);
      const b = (K * RHO_G * Math.sin(tilt)) / (EPS * ETA);
      const tStar = a / (b * b);
      const hEq = a / b;
      const got = compare(tilt, 1.5 * hEq, [0.3 * tStar, tStar, 3 * tStar]);
      for (const c of got) expect(Math.abs(c.richards / c.closedForm - 1)).toBeLessThan(0.01);
      // Property: below the equilibrium length and rising.
      for (let i = 1; i < got.length; i++) expect(got[i].richards).toBeGreaterThan(got[i - 1].richards);
      expect(got[got.length - 1].richards).toBeLessThan(hEq);
    }
  });

  it('holds the same mass as the strip model: m = ρ ε w δ h (volume balance behind the front)', () => {
    const a = (K * RHO_G * DRIVE) / (EPS * ETA);
    const t = (0.03 * 0.03) / (2 * a);
    const [c] = compare(0, 0.06, [t]);
    const w = 0.01;
    const delta = 0.001;
    expect((RHO * EPS * w * delta * c.richards) / c.massFromClosedForm).toBeCloseTo(1, 1.8);
  });
});
