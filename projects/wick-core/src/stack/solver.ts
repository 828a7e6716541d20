import { DomainError } from '../errors';
import type { StackGrid } from './grid';
import type { HydraulicFunctions } from './retention';
import type { FaceConductivity } from './types';

/**
 * One-dimensional Richards equation on a cell-centred finite-volume grid, mixed form, backward Euler
 * (Celia, Bouloutas & Zarba, Water Resour. Res. 26 (1990) 1483–1496):
 *
 *   ∂θ/∂t + ∂q/∂x = 0,   q = −K(ψ) (∂ψ/∂x − cos β)
 *
 * x (m) along the axis from the inlet, ψ (m) pressure head, θ liquid content, K (m/s) conductivity,
 * β the angle of the axis to the downward vertical. Per cell i (width Δx_i) and iterate m:
 *
 *   Δx_i [θ_i^m + C_i^m δ_i − θ_i^n]/Δt + q_{i+½}^{m+1} − q_{i−½}^{m+1} = 0,  q^{m+1} ≈ q^m + (∂q/∂ψ) δ.
 *
 * Each step first tries Newton's method (∂q/∂ψ includes dK/dψ of the face conductivity, which keeps
 * the matrix tridiagonal) and, if that fails, the modified Picard iteration of Celia et al. (K lagged at
 * ψ^m); only if both fail is the step cut. Storage is written in θ (not C·∂ψ/∂t), so a converged step
 * conserves mass; the convergence test includes the step's global balance
 * Σ Δx_i (θ_i^{n+1} − θ_i^n) − Δt (q_in − q_out), which is therefore what the run reports.
 *
 * Two safeguards make infiltration into dry media converge (a known weakness of plain Picard, where a
 * tiny C makes δ overshoot to saturation): the iteration matrix uses max(C, 1e-6·C_scale), and in
 * cells unsaturated at iterate m the new head is taken from the predicted content,
 * ψ^{m+1} = ψ(θ^m + C δ), rather than ψ^m + δ (an update in θ as in Kirkland, Hills & Wierenga,
 * Water Resour. Res. 28 (1992) 2049). Neither changes the converged solution, only the path to it.
 *
 * Inlet surface (Signorini condition): the face is either in flux mode — the medium takes the whole
 * supply Q + V_s/Δt and the surface stays dry, allowed while that does not exceed what a saturated
 * face could pass — or ponded, when surface liquid V_s > 0 is stored with pressure head ψ_s = c V_s
 * (c = max(cos β, 0.01)) and the face conductivity is that of a saturated face. The mode is chosen
 * inside the iteration (ponded → flux when V_s would turn negative, flux → ponded when the supply
 * exceeds the saturated-face capacity), so acquisition with and without ponding needs no input from
 * the user. With a pressure condition the face pressure is fixed instead.
 */

export interface TopPhase {
  readonly start: number;
  readonly end: number;
  /** 'flux': surface store fed at `rate` (m/s); 'pressure': ψ fixed at `psi` (m). */
  readonly kind: 'flux' | 'pressure';
  readonly rate: number;
  readonly psi: number;
}

export type BottomCondition =
  | { readonly kind: 'no-flow' }
  | { readonly kind: 'free-drainage' }
  | { readonly kind: 'pressure'; readonly psi: number };

export interface InsultWindow {
  readonly start: number;
  readonly end: number;
  readonly volume: number;
}

export interface RichardsSettings {
  readonly initialStep: number;
  readonly minStep: number;
  readonly maxStep: number;
  readonly maxIterations: number;
  readonly maxSaturationChange: number;
  readonly faceConductivity: FaceConductivity;
}

export interface RichardsProblem {
  readonly grid: StackGrid;
  /** One per layer. */
  readonly materials: readonly HydraulicFunctions[];
  readonly cosBeta: number;
  /** Initial pressure head per cell, m. */
  readonly psiInitial: Float64Array;
  /** Inlet phases, non-overlapping; outside them the inlet is a closed surface store (flux 0). */
  readonly topPhases: readonly TopPhase[];
  readonly insults: readonly InsultWindow[];
  readonly bottom: BottomCondition;
  readonly endTime: number;
  readonly snapshotCount: number;
  readonly settings: RichardsSettings;
  readonly onProgress?: (fractionDone: number) => void;
  readonly shouldCancel?: () => boolean;
}

export interface RichardsOutput {
  readonly status: 'completed' | 'cancelled';
  readonly timeReached: number;
  /** Snapshot rows actually filled (all of them unless cancelled). */
  readonly snapshotTimes: Float64Array;
  /** Row-major saturation θ/θs, rows = snapshotTimes.length. */
  readonly saturation: Float64Array;
  readonly absorbed: Float64Array;
  readonly surfaceLiquid: Float64Array;
  readonly supplied: Float64Array;
  readonly drained: Float64Array;
  readonly acquisitionTimes: (number | null)[];
  /** Time from each insult's start until liquid first stood on the surface, s; null if it never did. */
  readonly pondingTimes: (number | null)[];
  readonly peakSurfaceLiquid: number[];
  readonly thetaStart: Float64Array;
  readonly thetaEnd: Float64Array;
  readonly totalSupplied: number;
  /** Inflow from outside: insult deliveries plus inflow during pressure phases, m³/m². */
  readonly totalExternalIn: number;
  readonly totalAbsorbed: number;
  readonly totalDrained: number;
  readonly surfaceStart: number;
  readonly surfaceEnd: number;
  readonly steps: number;
  readonly rejectedSteps: number;
  readonly iterations: number;
  readonly maxIterationsInStep: number;
  readonly smallestStep: number;
  readonly largestStep: number;
}

/** Convergence of the Picard iteration: |δψ| ≤ HEAD_TOL_ABS + HEAD_TOL_REL·|ψ| in every cell. */
const HEAD_TOL_ABS = 1e-5;
const HEAD_TOL_REL = 1e-4;
/** ... and the step's global mass residual below this fraction of the pore volume. */
const MASS_TOL_REL = 1e-13;
/** Floor of the iteration-matrix capacity, relative to the material's capacity scale. */
const CAPACITY_FLOOR = 1e-6;
/** Conductivity floor on faces, relative to the largest Ks. */
const FACE_K_FLOOR = 1e-30;
/** Pond pressure factor floor, so a horizontal or downward-facing inlet still has a finite store. */
const POND_FACTOR_MIN = 0.01;
/** Surface liquid below this fraction of the insult volume counts as gone. */
const POND_EMPTY_FRACTION = 1e-7;
/** The end of acquisition is located to this fraction of the elapsed time since the insult start. */
const EVENT_TOLERANCE = 2e-3;
/** Flux mode is kept while the supply exceeds the saturated-face capacity by less than this (relative). */
const SWITCH_BAND = 1e-6;
const MAX_MODE_SWITCHES = 8;
const MAX_ATTEMPTS = 2_000_000;

/** Tridiagonal solve (Thomas algorithm); the matrix is an M-matrix, so no pivoting is needed. */
function solveTridiagonal(
  n: number,
  lo: Float64Array,
  di: Float64Array,
  up: Float64Array,
  rhs: Float64Array,
  out: Float64Array,
  work: Float64Array,
): void {
  let beta = di[0];
  out[0] = rhs[0] / beta;
  for (let j = 1; j < n; j++) {
    work[j] = up[j - 1] / beta;
    beta = di[j] - lo[j] * work[j];
    out[j] = (rhs[j] - lo[j] * out[j - 1]) / beta;
  }
  for (let j = n - 2; j >= 0; j--) out[j] -= work[j + 1] * out[j + 1];
}

/**
 * Runs the Richards solver described above from t = 0 to p.endTime with adaptive steps: a step grows
 * (×1.2–1.5) after fast convergence and while no cell's saturation changes by more than
 * `maxSaturationChange`, is redone with a quarter of the length when neither iteration converges, and
 * lands exactly on every change of the inlet condition. Inputs are trusted (checked by simulateStack).
 *
 * @throws DomainError 'no-convergence' when the step would fall below `minStep`.
 */
export function solveRichards(p: RichardsProblem): RichardsOutput {
  const { grid, settings } = p;
  const n = grid.cellCount;
  const w = grid.widths;
  const cosB = p.cosBeta;
  const cosDown = cosB > 0 ? cosB : 0;
  const pondFactor = Math.max(cosB, POND_FACTOR_MIN);
  const cellMat: HydraulicFunctions[] = new Array(n);
  const thetaS = new Float64Array(n);
  const thetaR = new Float64Array(n);
  const psiSat = new Float64Array(n);
  const capFloor = new Float64Array(n);
  let poreVolume = 0;
  let ksMax = 0;
  for (let i = 0; i < n; i++) {
    const m = p.materials[grid.layerOf[i]];
    cellMat[i] = m;
    thetaS[i] = m.thetaS;
    thetaR[i] = m.thetaR;
    psiSat[i] = m.saturationHead;
    capFloor[i] = CAPACITY_FLOOR * m.capacityScale;
    poreVolume += w[i] * m.thetaS;
    ksMax = Math.max(ksMax, m.ks);
  }
  const topMat = cellMat[0];
  const bottomMat = cellMat[n - 1];
  const kFloor = FACE_K_FLOOR * ksMax;
  const massTol = MASS_TOL_REL * poreVolume;
  const scheme = settings.faceConductivity;
  const bottom = p.bottom;
  const kBottomBoundary = bottom.kind === 'pressure' ? bottomMat.conductivity(bottom.psi) : 0;

  // Distance from the node before face f to the node after it (face 0: inlet face to cell 0).
  const dist = new Float64Array(n + 1);
  dist[0] = w[0] / 2;
  for (let f = 1; f < n; f++) dist[f] = grid.centres[f] - grid.centres[f - 1];
  dist[n] = w[n - 1] / 2;

  const psi = Float64Array.from(p.psiInitial);
  const psiOld = new Float64Array(n);
  const theta = new Float64Array(n);
  const cap = new Float64Array(n);
  const kc = new Float64Array(n);
  const dk = new Float64Array(n);
  const thetaOld = new Float64Array(n);
  const lo = new Float64Array(n + 1);
  const di = new Float64Array(n + 1);
  const up = new Float64Array(n + 1);
  const rhs = new Float64Array(n + 1);
  const delta = new Float64Array(n + 1);
  const work = new Float64Array(n + 1);

  const evaluate = (): void => {
    for (let i = 0; i < n; i++) cellMat[i].evaluate(psi[i], i, theta, cap, kc, dk);
  };

  const topPhaseAt = (t: number): TopPhase | null => {
    for (const ph of p.topPhases) if (t >= ph.start && t < ph.end) return ph;
    return null;
  };

  // Event times the stepper must land on.
  const eventSet = new Set<number>([p.endTime]);
  for (const ph of p.topPhases) {
    if (ph.start > 0 && ph.start < p.endTime) eventSet.add(ph.start);
    if (ph.end > 0 && ph.end < p.endTime) eventSet.add(ph.end);
  }
  const events = [...eventSet].sort((a, b) => a - b);

  // --- state -----------------------------------------------------------------------------------
  evaluate();
  const thetaStart = Float64Array.from(theta);
  let pondVol = 0;
  let qTop = 0;
  let qBot = 0;

  // --- snapshots -------------------------------------------------------------------------------
  const ns = p.snapshotCount;
  const snapTimes = new Float64Array(ns);
  for (let k = 0; k < ns; k++) snapTimes[k] = (p.endTime * k) / (ns - 1);
  const satRows = new Float64Array(ns * n);
  const absorbedS = new Float64Array(ns);
  const surfaceS = new Float64Array(ns);
  const suppliedS = new Float64Array(ns);
  const drainedS = new Float64Array(ns);
  for (let i = 0; i < n; i++) satRows[i] = theta[i] / thetaS[i];
  let nextSnap = 1;

  // --- insult bookkeeping ----------------------------------------------------------------------
  const acq: (number | null)[] = p.insults.map(() => null);
  const peak: number[] = p.insults.map(() => 0);
  const pondStart: (number | null)[] = p.insults.map(() => null);
  /** 0 pending, 1 delivering, 2 draining, 3 done. */
  const insultState: number[] = p.insults.map(() => 0);

  let t = 0;
  let dt = Math.min(settings.initialStep, settings.maxStep);
  let supplied = 0;
  let externalIn = 0;
  let absorbed = 0;
  let drained = 0;
  let steps = 0;
  let rejected = 0;
  let iterations = 0;
  let maxIt = 0;
  let smallest = Number.POSITIVE_INFINITY;
  let largest = 0;
  let lastProgress = 0;
  let status: 'completed' | 'cancelled' = 'completed';
  let prevPhase: TopPhase | null = topPhaseAt(0);
  let drainRate = 0;
  let stepPond = 0;

  /**
   * Face flux q = −K_f g and its derivatives dq/dψ_above, dq/dψ_below (into fa, fb), for the face
   * rule in use. With `newton` false the conductivity is treated as fixed (Picard).
   */
  let fa = 0;
  let fb = 0;
  const faceFlux = (
    kA: number,
    dkA: number,
    kB: number,
    dkB: number,
    wA: number,
    wB: number,
    g: number,
    d: number,
    newton: boolean,
  ): number => {
    let k: number;
    let pa = 0;
    let pb = 0;
    if (scheme === 'upstream') {
      if (g < 0) {
        k = kA;
        pa = dkA;
      } else {
        k = kB;
        pb = dkB;
      }
    } else if (scheme === 'arithmetic') {
      k = 0.5 * (kA + kB);
      pa = 0.5 * dkA;
      pb = 0.5 * dkB;
    } else {
      const sum = wA / kA + wB / kB;
      k = (wA + wB) / sum;
      const kk = k / sum;
      pa = (kk * wA * dkA) / (kA * kA);
      pb = (kk * wB * dkB) / (kB * kB);
    }
    if (k < kFloor || !newton) {
      if (k < kFloor) k = kFloor;
      pa = 0;
      pb = 0;
    }
    fa = -pa * g + k / d;
    fb = -pb * g - k / d;
    return -k * g;
  };

  /**
   * One implicit step of length h from the state in psiOld/thetaOld/pondVol; on success returns the
   * iteration count and leaves the new state in psi/theta (and stepPond, qTop, qBot); else −1.
   * `newton` adds the conductivity derivatives to the iteration matrix (Newton's method); without
   * them it is the modified Picard iteration.
   */
  const attempt = (h: number, phase: TopPhase | null, newton: boolean): number => {
    const dirichlet = phase !== null && phase.kind === 'pressure';
    const rate = phase !== null && phase.kind === 'flux' ? phase.rate : 0;
    const psiD = dirichlet ? phase.psi : 0;
    const kD = dirichlet ? topMat.conductivity(psiD) : 0;
    const pondOld = pondVol;
    const supply = rate + pondOld / h;
    let ponded = !dirichlet && pondOld > 0;
    let psiS = pondFactor * pondOld;
    // Physical upper bounds (maximum principle) for the iterates; a clamped iterate never counts as converged.
    let psiMaxOld = Number.NEGATIVE_INFINITY;
    for (let i = 0; i < n; i++) if (psiOld[i] > psiMaxOld) psiMaxOld = psiOld[i];
    let psiHi = Math.max(dirichlet ? psiD : pondFactor * (pondOld + rate * h), psiMaxOld);
    if (bottom.kind === 'pressure') psiHi = Math.max(psiHi, bottom.psi);
    psiHi += 2 * grid.length * Math.abs(cosB) + 1e-9;
    // The surface store holds at most what it had plus the delivery, unless the medium is under
    // positive pressure and can push liquid back out.
    const psiSHi = psiMaxOld > 0 ? psiHi : pondFactor * (pondOld + rate * h);
    let switches = 0;

    for (let it = 1; it <= settings.maxIterations; it++) {
      // Rows: di/lo/up/rhs for the surface node (j = 0) and the cells (j = i + 1); rhs = −R.
      for (let j = 0; j <= n; j++) {
        lo[j] = 0;
        up[j] = 0;
      }
      // Storage terms.
      for (let i = 0; i < n; i++) {
        const cJ = cap[i] > capFloor[i] ? cap[i] : capFloor[i];
        di[i + 1] = (w[i] * cJ) / h;
        rhs[i + 1] = -(w[i] * (theta[i] - thetaOld[i])) / h;
      }
      // Inlet face.
      if (dirichlet || ponded) {
        const psiTop = dirichlet ? psiD : psiS;
        const g0 = (psi[0] - psiTop) / dist[0] - cosB;
        const kTop = dirichlet ? kD : topMat.ks;
        const q0 =
          scheme === 'harmonic'
            ? faceFlux(kc[0], dk[0], kc[0], dk[0], 0, w[0], g0, dist[0], newton)
            : faceFlux(kTop, 0, kc[0], dk[0], 0, w[0], g0, dist[0], newton);
        // q0 enters cell 0: R_0 −= q0.
        rhs[1] += q0;
        di[1] -= fb;
        if (ponded) {
          di[0] = 1 / (pondFactor * h) + fa;
          up[0] = fb;
          lo[1] = -fa;
          rhs[0] = -((psiS / pondFactor - pondOld) / h + q0 - rate);
        } else {
          di[0] = 1;
          rhs[0] = 0;
        }
      } else {
        rhs[1] += supply;
        di[0] = 1;
        rhs[0] = 0;
      }
      // Internal faces: q leaves cell f−1 and enters cell f.
      for (let f = 1; f < n; f++) {
        const g = (psi[f] - psi[f - 1]) / dist[f] - cosB;
        const q = faceFlux(kc[f - 1], dk[f - 1], kc[f], dk[f], w[f - 1], w[f], g, dist[f], newton);
        rhs[f] -= q;
        di[f] += fa;
        up[f] += fb;
        rhs[f + 1] += q;
        di[f + 1] -= fb;
        lo[f + 1] -= fa;
      }
      // Far face.
      if (bottom.kind === 'free-drainage') {
        rhs[n] -= kc[n - 1] * cosDown;
        if (newton) di[n] += dk[n - 1] * cosDown;
      } else if (bottom.kind === 'pressure') {
        const gN = (bottom.psi - psi[n - 1]) / dist[n] - cosB;
        const qN =
          scheme === 'harmonic'
            ? faceFlux(kc[n - 1], dk[n - 1], kc[n - 1], dk[n - 1], w[n - 1], 0, gN, dist[n], newton)
            : faceFlux(kc[n - 1], dk[n - 1], kBottomBoundary, 0, w[n - 1], 0, gN, dist[n], newton);
        rhs[n] -= qN;
        di[n] += fa;
      }
      solveTridiagonal(n + 1, lo, di, up, rhs, delta, work);

      // Update: in unsaturated cells through the predicted content, elsewhere in ψ.
      let clamped = false;
      let norm = 0;
      for (let i = 0; i < n; i++) {
        const d = delta[i + 1];
        const old = psi[i];
        let v = old + d;
        if (old < psiSat[i]) {
          const cJ = cap[i] > capFloor[i] ? cap[i] : capFloor[i];
          const change = cJ * d;
          if (Math.abs(change) > 1e-12 * thetaS[i]) {
            const predicted = theta[i] + change;
            if (predicted >= thetaS[i]) {
              v = Math.min(v, Math.max(psiSat[i], old));
            } else {
              // Never predict below θr: go at most nine tenths of the way there.
              const floor = thetaR[i] + 0.1 * (theta[i] - thetaR[i]);
              v = cellMat[i].headAtContent(predicted > floor ? predicted : floor);
            }
          }
        }
        if (v > psiHi) {
          v = psiHi;
          clamped = true;
        }
        const r = Math.abs(v - old) / (HEAD_TOL_ABS + HEAD_TOL_REL * Math.abs(v));
        if (r > norm) norm = r;
        psi[i] = v;
      }
      let pondNew = 0;
      if (ponded) {
        let v = psiS + delta[0];
        if (v > psiSHi) {
          v = psiSHi;
          clamped = true;
        }
        const r = Math.abs(v - psiS) / (HEAD_TOL_ABS + HEAD_TOL_REL * Math.abs(v));
        if (r > norm) norm = r;
        psiS = v;
        pondNew = psiS / pondFactor;
      }
      if (!Number.isFinite(norm)) return -1;
      evaluate();

      // Boundary fluxes at the new iterate; the global balance of the step, surface store included.
      let qTopNew: number;
      if (dirichlet) {
        const g0 = (psi[0] - psiD) / dist[0] - cosB;
        qTopNew = scheme === 'harmonic' ? -Math.max(kc[0], kFloor) * g0 : faceFlux(kD, 0, kc[0], 0, 0, w[0], g0, dist[0], false);
      } else {
        qTopNew = rate - (pondNew - pondOld) / h;
      }
      let qBotNew = 0;
      if (bottom.kind === 'free-drainage') qBotNew = kc[n - 1] * cosDown;
      else if (bottom.kind === 'pressure') {
        const gN = (bottom.psi - psi[n - 1]) / dist[n] - cosB;
        qBotNew =
          scheme === 'harmonic'
            ? -Math.max(kc[n - 1], kFloor) * gN
            : faceFlux(kc[n - 1], 0, kBottomBoundary, 0, w[n - 1], 0, gN, dist[n], false);
      }
      let massErr = h * (qBotNew - qTopNew);
      for (let i = 0; i < n; i++) massErr += w[i] * (theta[i] - thetaOld[i]);
      if (!Number.isFinite(massErr)) return -1;

      // Signorini switching of the inlet.
      let switched = false;
      if (ponded && pondNew < 0) {
        ponded = false;
        switched = true;
      } else if (!ponded && !dirichlet) {
        // What a saturated face (ψ_s = 0) would pass; negative when the medium pushes liquid back out.
        const gSat = psi[0] / dist[0] - cosB;
        const capacity =
          scheme === 'harmonic'
            ? -Math.max(kc[0], kFloor) * gSat
            : faceFlux(topMat.ks, 0, kc[0], 0, 0, w[0], gSat, dist[0], false);
        if (supply > capacity + SWITCH_BAND * Math.abs(capacity) + 1e-12 * topMat.ks) {
          ponded = true;
          psiS = pondFactor * pondOld;
          switched = true;
        }
      }
      if (switched) {
        if (++switches > MAX_MODE_SWITCHES) return -1;
        continue;
      }
      if (!clamped && norm <= 1 && Math.abs(massErr) <= massTol) {
        qTop = qTopNew;
        qBot = qBotNew;
        stepPond = dirichlet ? 0 : pondNew;
        return it;
      }
    }
    return -1;
  };

  const restore = (): void => {
    psi.set(psiOld);
    evaluate();
  };

  const reportProgress = (fraction: number): void => {
    if (p.onProgress && (fraction - lastProgress >= 0.01 || fraction >= 1)) {
      lastProgress = fraction;
      p.onProgress(Math.min(fraction, 1));
    }
  };

  let eventIndex = 0;
  let attempts = 0;
  while (t < p.endTime) {
    if (p.shouldCancel?.()) {
      status = 'cancelled';
      break;
    }
    if (++attempts > MAX_ATTEMPTS) {
      throw new DomainError('no-convergence', `The flow solver took too many steps (stopped at t = ${t.toPrecision(4)} s).`, undefined, {
        time: t,
      });
    }
    while (events[eventIndex] <= t) eventIndex++;
    const nextEvent = events[eventIndex];
    let h = Math.min(dt, settings.maxStep);
    // While an insult drains, approach the moment the surface empties in steps that can locate it.
    for (let k = 0; k < p.insults.length; k++) {
      if (insultState[k] === 2 && drainRate > 0) {
        const tau = pondVol / drainRate;
        const tol = EVENT_TOLERANCE * Math.max(t - p.insults[k].start, 1e-12);
        h = Math.min(h, Math.max(1.2 * tau, tol));
      }
    }
    if (t + h >= nextEvent - 1e-3 * h) h = nextEvent - t;
    const phase = topPhaseAt(t + h / 2);
    if (phase !== prevPhase) {
      // A new inlet condition starts a fast transient: restart with a small step.
      h = Math.min(h, settings.initialStep);
      if (t + h >= nextEvent - 1e-3 * h) h = nextEvent - t;
      prevPhase = phase;
    }
    const isPressure = phase !== null && phase.kind === 'pressure';
    psiOld.set(psi);
    thetaOld.set(theta);
    const pondBefore = pondVol;

    let its = attempt(h, phase, true);
    if (its < 0) {
      // Newton's method can stall at sharp fronts; the Picard iteration is the slower, sturdier fallback.
      restore();
      its = attempt(h, phase, false);
      iterations += settings.maxIterations;
    }
    if (its < 0) {
      rejected++;
      iterations += settings.maxIterations;
      restore();
      dt = h / 4;
      if (dt < settings.minStep) {
        throw new DomainError(
          'no-convergence',
          `The flow solver did not converge at t = ${t.toPrecision(4)} s even with a ${settings.minStep} s step; ` +
            'check for extreme property contrasts or refine the grid.',
          undefined,
          { time: t },
        );
      }
      continue;
    }
    let dSmax = 0;
    for (let i = 0; i < n; i++) {
      const d = Math.abs(theta[i] - thetaOld[i]) / thetaS[i];
      if (d > dSmax) dSmax = d;
    }
    if (dSmax > 2 * settings.maxSaturationChange && h > 4 * settings.minStep) {
      rejected++;
      iterations += its;
      restore();
      dt = Math.max(h * Math.max((0.8 * settings.maxSaturationChange) / dSmax, 0.1), settings.minStep);
      continue;
    }
    const tNew = t + h;
    const pondNew = stepPond;
    // Event: the surface empties after delivery. Redo the step if it overshot by more than the tolerance.
    let emptied = -1;
    for (let k = 0; k < p.insults.length; k++) {
      const thr = POND_EMPTY_FRACTION * p.insults[k].volume;
      if (insultState[k] === 2 && pondBefore > thr && pondNew <= thr) {
        const tol = EVENT_TOLERANCE * (tNew - p.insults[k].start);
        if (h > tol && h > 4 * settings.minStep) {
          emptied = -2;
          dt = Math.max(tol, h / 4);
          break;
        }
        emptied = k;
      }
    }
    if (emptied === -2) {
      rejected++;
      iterations += its;
      restore();
      continue;
    }

    // Accept.
    pondVol = pondNew;
    steps++;
    iterations += its;
    maxIt = Math.max(maxIt, its);
    smallest = Math.min(smallest, h);
    largest = Math.max(largest, h);
    const rate = phase !== null && phase.kind === 'flux' ? phase.rate : 0;
    const suppliedBefore = supplied;
    const absorbedBefore = absorbed;
    const drainedBefore = drained;
    supplied += rate * h;
    externalIn += isPressure ? qTop * h : rate * h;
    absorbed += qTop * h;
    drained += qBot * h;
    drainRate = pondBefore > pondNew ? (pondBefore - pondNew) / h : 0;

    // Snapshots falling in (t, tNew]: linear interpolation in time.
    while (nextSnap < ns && snapTimes[nextSnap] <= tNew + 1e-12 * p.endTime) {
      const a = Math.min(Math.max((snapTimes[nextSnap] - t) / h, 0), 1);
      const row = nextSnap * n;
      for (let i = 0; i < n; i++) satRows[row + i] = (thetaOld[i] + a * (theta[i] - thetaOld[i])) / thetaS[i];
      absorbedS[nextSnap] = absorbedBefore + a * (absorbed - absorbedBefore);
      suppliedS[nextSnap] = suppliedBefore + a * (supplied - suppliedBefore);
      drainedS[nextSnap] = drainedBefore + a * (drained - drainedBefore);
      surfaceS[nextSnap] = pondBefore + a * (pondNew - pondBefore);
      nextSnap++;
    }

    // Insult states.
    for (let k = 0; k < p.insults.length; k++) {
      const ins = p.insults[k];
      const thr = POND_EMPTY_FRACTION * ins.volume;
      if (insultState[k] === 0 && tNew > ins.start) {
        insultState[k] = 1;
        // Liquid of an earlier gush still stands when this one lands: it stands from the start.
        if (pondBefore > thr) pondStart[k] = 0;
      }
      if (insultState[k] === 1 || insultState[k] === 2) peak[k] = Math.max(peak[k], pondNew);
      if (insultState[k] === 1 && pondStart[k] === null && pondBefore <= thr && pondNew > thr) {
        // The surface flooded during this step: back off by the time the excess supply needed to build it.
        const excess = rate - qTop;
        const back = excess > 0 ? Math.min(pondNew / excess, h) : h;
        pondStart[k] = Math.max(tNew - back - ins.start, 0);
      }
      if (insultState[k] === 1 && tNew >= ins.end - 1e-12 * p.endTime) {
        insultState[k] = 2;
        if (pondNew <= thr) {
          acq[k] = ins.end - ins.start;
          insultState[k] = 3;
        }
      } else if (insultState[k] === 2 && (emptied === k || pondNew <= thr)) {
        acq[k] = tNew - ins.start;
        insultState[k] = 3;
      }
      // A later insult arriving while this one still drains: acquisition not reached.
      if (insultState[k] === 2) {
        for (let l = k + 1; l < p.insults.length; l++) {
          if (tNew >= p.insults[l].start - 1e-12 * p.endTime) insultState[k] = 3;
        }
      }
    }

    t = tNew;
    if (p.endTime - t < 1e-12 * p.endTime) t = p.endTime;

    // Next step size: Picard effort and saturation change.
    const growth = its <= 3 ? 1.5 : its <= 6 ? 1.2 : its <= 12 ? 1 : 0.7;
    const satLimit = dSmax > 0 ? settings.maxSaturationChange / dSmax : Number.POSITIVE_INFINITY;
    dt = Math.min(h * Math.min(growth, Math.max(satLimit, 0.25)), settings.maxStep);
    dt = Math.max(dt, settings.minStep);
    reportProgress(t / p.endTime);
  }

  const filled = status === 'completed' ? ns : nextSnap;
  return {
    status,
    timeReached: t,
    snapshotTimes: snapTimes.slice(0, filled),
    saturation: satRows.slice(0, filled * n),
    absorbed: absorbedS.slice(0, filled),
    surfaceLiquid: surfaceS.slice(0, filled),
    supplied: suppliedS.slice(0, filled),
    drained: drainedS.slice(0, filled),
    acquisitionTimes: acq,
    pondingTimes: pondStart,
    peakSurfaceLiquid: peak,
    thetaStart,
    thetaEnd: Float64Array.from(theta),
    totalSupplied: supplied,
    totalExternalIn: externalIn,
    totalAbsorbed: absorbed,
    totalDrained: drained,
    surfaceStart: 0,
    surfaceEnd: pondVol,
    steps,
    rejectedSteps: rejected,
    iterations,
    maxIterationsInStep: maxIt,
    smallestStep: steps > 0 ? smallest : 0,
    largestStep: largest,
  };
}
