/**
 * The equations a variant's results rest on, in words a report can print beside its numbers. Each entry
 * restates the model family's own documentation (equation and published source); the evaluator lists the
 * ones it used.
 */
import type { EquationUsed } from './variant';

export const VARIANT_EQUATIONS = {
  porosity: {
    id: 'porosity',
    title: 'Porosity from basis weight',
    equation: 'ε = 1 − BW/(ρf·t)',
    source: 'Mass balance (exact); fibre-bed family',
  },
  fibreDiameter: {
    id: 'fibre-diameter',
    title: 'Fibre diameter from linear density',
    equation: 'd = √(4λ/(π·ρf))',
    source: 'Morton & Hearle, Physical Properties of Textile Fibres, 4th ed. (2008), ch. 1',
  },
  hydraulicRadius: {
    id: 'hydraulic-radius',
    title: 'Hydraulic radius of a fibre bed',
    equation: 'r_h = ε·d/(4χ(1 − ε))',
    source: 'P. C. Carman, Trans. Inst. Chem. Eng. 15 (1937) 150',
  },
  pcHydraulic: {
    id: 'capillary-pressure-hydraulic',
    title: 'Capillary pressure (Young–Laplace, hydraulic radius)',
    equation: 'Pc = γ·cos θ / r_h',
    source: 'Young–Laplace; Adamson & Gast, Physical Chemistry of Surfaces, 6th ed. (1997) §II-2',
  },
  pcPore: {
    id: 'capillary-pressure-pore',
    title: 'Capillary pressure from the mean pore diameter',
    equation: 'Pc = 4γ·cos θ / D',
    source: 'Young–Laplace for a cylindrical pore of radius D/2',
  },
  pcTube: {
    id: 'capillary-pressure-tube',
    title: 'Capillary pressure in a round tube',
    equation: 'Pc = 2γ·cos θ / r',
    source: 'Young–Laplace; J. Jurin, Phil. Trans. 30 (1718) 739',
  },
  washburnTube: {
    id: 'washburn-capillary',
    title: 'Lucas–Washburn uptake with gravity (tube)',
    equation: 'dh/dt = a/h − b, a = γ·r·cos θ/(4η), b = ρ·g·r²·sin α/(8η); h = (a/b)[1 + W₀(−e^(−1 − t·b²/a))]',
    source: 'E. W. Washburn, Phys. Rev. 17 (1921) 273; N. Fries & M. Dreyer, J. Colloid Interface Sci. 320 (2008) 259',
  },
  washburnStrip: {
    id: 'washburn-porous-strip',
    title: 'Sharp-front Darcy uptake in a strip (with gravity)',
    equation: 'dh/dt = a/h − b, a = K·Pc/(ε·η), b = K·ρ·g·sin α/(ε·η); h_eq = Pc/(ρ·g)',
    source: 'W. H. Green & G. A. Ampt, J. Agric. Sci. 4 (1911) 1; Fries & Dreyer (2008) explicit solution',
  },
  horizontal: {
    id: 'washburn-horizontal',
    title: 'Uptake without gravity',
    equation: 'h² = 2a·t',
    source: 'E. W. Washburn, Phys. Rev. 17 (1921) 273',
  },
  radial: {
    id: 'washburn-radial',
    title: 'Radial spreading from a fed spot',
    equation: 'R²·ln(R/r0) − (R² − r0²)/2 = 2a·t, a = K·Pc/(ε·η)',
    source: 'A. Marmur, J. Colloid Interface Sci. 124 (1988) 301; D. Danino & A. Marmur, ibid. 166 (1994) 245',
  },
  capacity: {
    id: 'saturated-capacity',
    title: 'Saturated capacity',
    equation: 'C_A = ρ_l·ε·t; C_m = C_A/BW',
    source: 'Pore-volume balance (exact); fibre-bed family',
  },
  uptakeMass: {
    id: 'uptake-mass',
    title: 'Uptake mass and rate',
    equation: 'm = ρ_l·ε·w·t·h, dm/dt = ρ_l·ε·w·t·dh/dt',
    source: 'Volume balance behind a saturated front (Green & Ampt 1911)',
  },
  psd: {
    id: 'pore-size-equilibrium',
    title: 'Equilibrium saturation from the pore-size distribution',
    equation: 'S(z) = Σ fᵢ over classes with 4γ·cos θ/(ρ·g·Dᵢ) ≥ z',
    source: 'Capillary-bundle model; F. A. L. Dullien, Porous Media, 2nd ed. (1992)',
  },
  kelvin: {
    id: 'kelvin-radius',
    title: 'Kelvin radius (capillary condensation of water vapour)',
    equation: 'r_K = −2γ·Vm·cos θ/(R·T·ln RH)',
    source: 'W. Thomson, Phil. Mag. 42 (1871) 448; Adamson & Gast (1997) §XVII-16',
  },
  monteCarlo: {
    id: 'monte-carlo',
    title: 'Tolerance bands (Monte Carlo) and one-at-a-time sensitivity',
    equation: 'P10/P50/P90 of outputs over random draws of the toleranced inputs; tornado swing |y(P90 input) − y(P10 input)|',
    source: 'JCGM 101:2008 §7; A. Saltelli et al., Global Sensitivity Analysis: The Primer (2008) §1.2.3',
  },
} as const satisfies Record<string, EquationUsed>;

export function permeabilityEquation(label: string, source: string): EquationUsed {
  return { id: 'permeability-correlation', title: `Permeability: ${label}`, equation: 'K = f(d, ε) — see the source', source };
}
