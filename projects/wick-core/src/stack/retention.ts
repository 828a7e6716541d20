/**
 * Hydraulic functions of one layer in pressure-head form, as the Richards solver uses them.
 *
 * ψ is the pressure head in metres of the simulated liquid (ψ = p/(ρ g), p the gauge liquid pressure in
 * Pa; ψ < 0 unsaturated). h = −ψ is the suction head. θ is the volumetric liquid content, θr ≤ θ ≤ θs,
 * Se = (θ − θr)/(θs − θr) the effective saturation, C = dθ/dψ (1/m) the specific liquid capacity and
 * K = Ks·kr(Se) (m/s) the hydraulic conductivity.
 */

/** Smallest relative permeability used, to keep the linear systems regular in bone-dry cells. */
const KR_FLOOR = 1e-30;

export interface HydraulicFunctions {
  /** Saturated liquid content θs (= porosity), dimensionless. */
  readonly thetaS: number;
  /** Residual liquid content θr, dimensionless. */
  readonly thetaR: number;
  /** Saturated hydraulic conductivity Ks, m/s. */
  readonly ks: number;
  /** Writes θ(ψ), C(ψ), K(ψ) and dK/dψ at index i of the given arrays (the solver's hot loop). */
  evaluate(
    psi: number,
    i: number,
    theta: Float64Array,
    capacity: Float64Array,
    conductivity: Float64Array,
    slope: Float64Array,
  ): void;
  /** θ(ψ). */
  theta(psi: number): number;
  /** K(ψ), m/s. */
  conductivity(psi: number): number;
  /** ψ (m) at effective saturation Se, 0 < Se < 1; at Se = 1 the saturation head. */
  headAtEffectiveSaturation(se: number): number;
  /** Effective saturation Se(ψ). */
  effectiveSaturation(psi: number): number;
  /** Relative permeability kr(Se). */
  relativePermeability(se: number): number;
  /** Largest ψ (m) below which the medium is unsaturated: 0 (van Genuchten) or −hb (Brooks–Corey). */
  readonly saturationHead: number;
  /** Typical specific capacity, 1/m: (θs − θr) over the characteristic suction head. */
  readonly capacityScale: number;
  /** ψ (m) at liquid content θ, θr < θ < θs (inverse of θ(ψ)). */
  headAtContent(theta: number): number;
}

/**
 * van Genuchten retention with Mualem relative permeability.
 *
 * Se = [1 + (α h)^n]^(−m), m = 1 − 1/n (h = −ψ > 0; Se = 1 for ψ ≥ 0),
 * C = (θs − θr)·m n α (α h)^(n−1) [1 + (α h)^n]^(−m−1),
 * kr = Se^L [1 − (1 − Se^(1/m))^m]².
 *
 * α (1/m of head), n > 1, L pore connectivity (0.5). Sources: M. Th. van Genuchten, Soil Sci. Soc. Am. J.
 * 44 (1980) 892–898, Eqs. 3 and 8; Y. Mualem, Water Resour. Res. 12 (1976) 513–522.
 * Validity: wetting (or drying) along one branch, no hysteresis; rigid pores.
 */
export class VanGenuchtenMualem implements HydraulicFunctions {
  private readonly m: number;
  private readonly dTheta: number;
  readonly saturationHead = 0;
  readonly capacityScale: number;

  constructor(
    readonly thetaS: number,
    readonly thetaR: number,
    /** α in 1/m of pressure head. */
    readonly alpha: number,
    readonly n: number,
    readonly ks: number,
    readonly poreConnectivity = 0.5,
  ) {
    this.m = 1 - 1 / n;
    this.dTheta = thetaS - thetaR;
    this.capacityScale = this.dTheta * alpha;
  }

  headAtContent(theta: number): number {
    return this.headAtEffectiveSaturation((theta - this.thetaR) / this.dTheta);
  }

  evaluate(
    psi: number,
    i: number,
    theta: Float64Array,
    capacity: Float64Array,
    conductivity: Float64Array,
    slope: Float64Array,
  ): void {
    if (psi >= 0) {
      theta[i] = this.thetaS;
      capacity[i] = 0;
      conductivity[i] = this.ks;
      slope[i] = 0;
      return;
    }
    // In logarithms: fewer transcendental calls than with pow, and no cancellation in dry media.
    const h = -psi;
    const lnAhn = this.n * Math.log(this.alpha * h); // ln (αh)^n
    const ahn = Math.exp(lnAhn);
    const lnBase = Math.log1p(ahn); // ln [1 + (αh)^n]
    const se = Math.exp(-this.m * lnBase);
    theta[i] = this.thetaR + this.dTheta * se;
    // dSe/dψ = m n (αh)^n / h · Se / (1 + (αh)^n)
    const dSe = (this.m * this.n * ahn * se) / (h * (1 + ahn));
    capacity[i] = this.dTheta * dSe;
    // y = 1 − Se^(1/m) = (αh)^n / (1 + (αh)^n); inner = 1 − y^m without cancellation.
    const lnY = lnAhn - lnBase;
    const ym = Math.exp(this.m * lnY);
    const inner = -Math.expm1(this.m * lnY);
    const seL = this.poreConnectivity === 0.5 ? Math.sqrt(se) : Math.exp(-this.poreConnectivity * this.m * lnBase);
    const kr = seL * inner * inner;
    if (kr > KR_FLOOR) {
      conductivity[i] = this.ks * kr;
      // dkr/dSe = L kr/Se + 2 Se^L inner y^(m−1) Se^(1/m − 1), with Se^(1/m) = 1/(1 + (αh)^n)
      const dkr = (this.poreConnectivity * kr) / se + (2 * seL * inner * ym) / (ahn * se);
      const v = this.ks * dkr * dSe;
      // dK/dψ is unbounded as Se → 1 for n < 2 (Mualem); the solver then falls back to Picard terms.
      slope[i] = Number.isFinite(v) ? v : 0;
    } else {
      conductivity[i] = this.ks * KR_FLOOR;
      slope[i] = 0;
    }
  }

  theta(psi: number): number {
    return this.thetaR + this.dTheta * this.effectiveSaturation(psi);
  }

  effectiveSaturation(psi: number): number {
    if (psi >= 0) return 1;
    return Math.pow(1 + Math.pow(-this.alpha * psi, this.n), -this.m);
  }

  conductivity(psi: number): number {
    if (psi >= 0) return this.ks;
    const base = 1 + Math.pow(-this.alpha * psi, this.n);
    return this.ks * this.krFromBase(Math.pow(base, -this.m), base);
  }

  relativePermeability(se: number): number {
    if (se >= 1) return 1;
    if (se <= 0) return KR_FLOOR;
    return this.krFromBase(se, Math.pow(se, -1 / this.m));
  }

  headAtEffectiveSaturation(se: number): number {
    if (se >= 1) return 0;
    // h = (Se^(−1/m) − 1)^(1/n) / α; expm1 keeps precision when Se is close to 1.
    const x = Math.expm1(-Math.log(se) / this.m);
    return -Math.exp(Math.log(x) / this.n) / this.alpha;
  }

  /** kr with Se^(1/m) = 1/base; 1 − (1 − 1/base)^m evaluated without cancellation in dry media. */
  private krFromBase(se: number, base: number): number {
    const inner = -Math.expm1(this.m * Math.log1p(-1 / base));
    const kr = Math.pow(se, this.poreConnectivity) * inner * inner;
    return kr > KR_FLOOR ? kr : KR_FLOOR;
  }
}

/**
 * Brooks–Corey retention with Burdine relative permeability.
 *
 * Se = (hb/h)^λ for h > hb, else 1;  C = (θs − θr) λ Se / h;  kr = Se^(3 + 2/λ) = (hb/h)^(2 + 3λ).
 *
 * hb (m) the entry (bubbling) head, λ > 0 the pore-size distribution index. Source: R. H. Brooks &
 * A. T. Corey, Hydraulic properties of porous media, Hydrology Paper 3, Colorado State University (1964).
 * Validity: as for van Genuchten; the curve has a kink at h = hb (C jumps from 0).
 */
export class BrooksCoreyBurdine implements HydraulicFunctions {
  private readonly dTheta: number;
  private readonly krExponent: number;
  readonly saturationHead: number;
  readonly capacityScale: number;

  constructor(
    readonly thetaS: number,
    readonly thetaR: number,
    /** Entry head hb, m. */
    readonly entryHead: number,
    readonly lambda: number,
    readonly ks: number,
  ) {
    this.dTheta = thetaS - thetaR;
    this.krExponent = 2 + 3 * lambda;
    this.saturationHead = -entryHead;
    this.capacityScale = (this.dTheta * lambda) / entryHead;
  }

  headAtContent(theta: number): number {
    return this.headAtEffectiveSaturation((theta - this.thetaR) / this.dTheta);
  }

  evaluate(
    psi: number,
    i: number,
    theta: Float64Array,
    capacity: Float64Array,
    conductivity: Float64Array,
    slope: Float64Array,
  ): void {
    const h = -psi;
    if (h <= this.entryHead) {
      theta[i] = this.thetaS;
      capacity[i] = 0;
      conductivity[i] = this.ks;
      slope[i] = 0;
      return;
    }
    const lnRatio = Math.log(this.entryHead / h);
    const se = Math.exp(this.lambda * lnRatio);
    theta[i] = this.thetaR + this.dTheta * se;
    capacity[i] = (this.dTheta * this.lambda * se) / h;
    const kr = Math.exp(this.krExponent * lnRatio);
    if (kr > KR_FLOOR) {
      conductivity[i] = this.ks * kr;
      slope[i] = (this.ks * kr * this.krExponent) / h;
    } else {
      conductivity[i] = this.ks * KR_FLOOR;
      slope[i] = 0;
    }
  }

  theta(psi: number): number {
    return this.thetaR + this.dTheta * this.effectiveSaturation(psi);
  }

  effectiveSaturation(psi: number): number {
    const h = -psi;
    return h <= this.entryHead ? 1 : Math.pow(this.entryHead / h, this.lambda);
  }

  conductivity(psi: number): number {
    const h = -psi;
    if (h <= this.entryHead) return this.ks;
    const kr = Math.pow(this.entryHead / h, this.krExponent);
    return this.ks * (kr > KR_FLOOR ? kr : KR_FLOOR);
  }

  relativePermeability(se: number): number {
    if (se >= 1) return 1;
    if (se <= 0) return KR_FLOOR;
    const kr = Math.pow(se, this.krExponent / this.lambda);
    return kr > KR_FLOOR ? kr : KR_FLOOR;
  }

  headAtEffectiveSaturation(se: number): number {
    if (se >= 1) return -this.entryHead;
    return -this.entryHead * Math.pow(se, -1 / this.lambda);
  }
}
