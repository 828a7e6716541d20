import { all, create } from 'mathjs';
import { DomainError } from '../errors';
import { lambertW0, lambertW0PlusOne, lambertW0PlusOneInverse } from './lambert-w';

/** Reference arithmetic: mathjs BigNumber with 50 significant digits (an independent library). */
const big = create(all, { number: 'BigNumber', precision: 50 });

/** q = 1 − (1 − H)·e^H computed in 50-digit arithmetic by mathjs. */
function branchOffsetReference(h: number): number {
  const H = big.bignumber(h);
  return big.number(big.subtract(1, big.multiply(big.subtract(1, H), big.exp(H))) as never) as number;
}

/** Relative error |a − b|/|b|. */
function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

describe('lambertW0 (principal branch)', () => {
  it('reproduces the special values of Corless et al. (1996)', () => {
    // Corless, Gonnet, Hare, Jeffrey & Knuth, Adv. Comput. Math. 5 (1996) 329: W(1) = Ω = 0.5671432904097838.
    expect(rel(lambertW0(1), 0.5671432904097838)).toBeLessThan(2e-16);
    // Same source: W(e) = 1, since 1·e¹ = e.
    expect(rel(lambertW0(Math.E), 1)).toBeLessThan(2e-16);
    // Same source: W(0) = 0.
    expect(lambertW0(0)).toBe(0);
    // Same source: W(−ln2/2) = −ln 2, since −ln2·e^{−ln2} = −ln2/2.
    expect(rel(lambertW0(-Math.LN2 / 2), -Math.LN2)).toBeLessThan(3e-16);
    // Same source: W(10) = 1.7455280027406994.
    expect(rel(lambertW0(10), 1.7455280027406994)).toBeLessThan(3e-16);
  });

  it('returns −1 at the branch point −1/e, read from either double spelling of it', () => {
    // Corless et al. (1996): W(−1/e) = −1; the double nearest −1/e lies 1.2e-17 below it and must be accepted.
    expect(lambertW0(-1 / Math.E)).toBe(-1);
    expect(lambertW0(-Math.exp(-1))).toBe(-1);
  });

  it('satisfies W·e^W = x across eighteen decades (defining identity)', () => {
    // Definition of W: w e^w = x. Rounding of w is amplified by (1 + |w|) in w e^w, hence the scaled tolerance.
    const xs: number[] = [];
    for (let i = 0; i <= 400; i++) xs.push(-0.3678794411714 + Math.pow(10, -12 + (i * 20) / 400));
    for (let i = 0; i <= 400; i++) xs.push(Math.pow(10, -300 + (i * 600) / 400));
    for (const x of xs) {
      const w = lambertW0(x);
      const residual = Math.abs(w * Math.exp(w) - x) / Math.abs(x);
      expect(residual).toBeLessThan(4 * Number.EPSILON * (1 + Math.abs(w)));
    }
  });

  it('is increasing in x (W0 is monotone on its domain)', () => {
    // W0'(x) = W/(x(1 + W)) > 0 for x > −1/e (derivative of the defining identity; Corless et al. 1996).
    let previous = lambertW0(-1 / Math.E);
    for (let i = 1; i <= 2000; i++) {
      const w = lambertW0(-1 / Math.E + Math.pow(10, -15 + (i * 18) / 2000));
      expect(w).toBeGreaterThanOrEqual(previous);
      previous = w;
    }
  });

  it('follows ln x − ln ln x at large x (asymptotic expansion)', () => {
    // Corless et al. (1996), asymptotic expansion: W = L1 − L2 + L2/L1 + O((L2/L1)²) with L1 = ln x, L2 = ln ln x.
    const x = 1e300;
    const l1 = Math.log(x);
    const l2 = Math.log(l1);
    expect(Math.abs(lambertW0(x) - (l1 - l2 + l2 / l1))).toBeLessThan(((l2 / l1) * (l2 / l1)) * 2);
  });

  it('refuses arguments below −1/e and non-finite ones', () => {
    expect(() => lambertW0(-0.37)).toThrowError(DomainError, /−1\/e/);
    expect(() => lambertW0(Number.NaN)).toThrowError(DomainError);
    expect(() => lambertW0(Number.POSITIVE_INFINITY)).toThrowError(DomainError);
  });
});

describe('lambertW0PlusOne (1 + W0 from the branch-point offset)', () => {
  it('agrees with 50-digit arithmetic through the inverse relation q = 1 − (1 − H)e^H', () => {
    // Definition w e^w = x with x = (q − 1)/e and w = H − 1 gives (H − 1)e^H = q − 1, i.e. q = 1 − (1 − H)e^H.
    // dq/q ≈ 2 dH/H near the branch point, so a 4e-15 residual in q means about 2e-15 in H.
    for (let i = 0; i <= 300; i++) {
      const q = Math.pow(10, -30 + (i * 31) / 300);
      const h = lambertW0PlusOne(q);
      expect(rel(branchOffsetReference(h), q)).toBeLessThan(4e-15);
    }
  });

  it('starts as √(2q) − 2q/3 (branch-point series)', () => {
    // Corless et al. (1996), branch-point series (coefficients −1/3, 11/72): W = −1 + p − p²/3 + 11/72 p³ − …, p = √(2q).
    const q = 1e-6;
    const p = Math.sqrt(2 * q);
    expect(rel(lambertW0PlusOne(q), p - (p * p) / 3 + (11 / 72) * p * p * p)).toBeLessThan(1e-9);
    expect(lambertW0PlusOne(0)).toBe(0);
  });

  it('is the inverse of lambertW0PlusOneInverse (round trip)', () => {
    for (const h of [1e-12, 1e-6, 0.01, 0.3, 0.79, 0.81, 1, 2, 5]) {
      expect(rel(lambertW0PlusOne(lambertW0PlusOneInverse(h)), h)).toBeLessThan(4e-15);
    }
  });

  it('matches lambertW0 away from the branch point', () => {
    // Same function, two routes: 1 + W0((q − 1)/e).
    for (const q of [0.6, 1, 3, 50]) {
      expect(rel(lambertW0PlusOne(q), 1 + lambertW0((q - 1) / Math.E))).toBeLessThan(4e-16);
    }
  });

  it('refuses a negative offset', () => {
    expect(() => lambertW0PlusOne(-1e-3)).toThrowError(DomainError);
  });
});
