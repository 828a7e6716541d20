import { DomainError } from '../errors';
import { regularizedIncompleteBeta, studentTCdf, studentTQuantile } from './student-t';

describe('Student t distribution', () => {
  it('quantiles match printed t tables', () => {
    // Standard two-sided 95 % t table (e.g. Montgomery & Runger, Applied Statistics and Probability
    // for Engineers, Table V; values from memory, 3 decimals as printed).
    const table: Array<[number, number, number]> = [
      [0.975, 1, 12.706],
      [0.975, 2, 4.303],
      [0.975, 5, 2.571],
      [0.975, 10, 2.228],
      [0.975, 30, 2.042],
      [0.95, 10, 1.812],
      [0.995, 10, 3.169],
    ];
    for (const [p, nu, t] of table) expect(studentTQuantile(p, nu)).toBeCloseTo(t, 3);
  });

  it('agrees with the closed forms for 1 and 2 degrees of freedom', () => {
    // ν = 1 is the Cauchy distribution: t_p = tan(π(p − ½)); ν = 2: t_p = (2p − 1)/√(2p(1 − p))
    // (Johnson, Kotz & Balakrishnan, Continuous Univariate Distributions, vol. 2, ch. 28; exact identities).
    for (const p of [0.6, 0.9, 0.975, 0.999]) {
      expect(studentTQuantile(p, 1)).toBeCloseTo(Math.tan(Math.PI * (p - 0.5)), 8);
      expect(studentTQuantile(p, 2)).toBeCloseTo((2 * p - 1) / Math.sqrt(2 * p * (1 - p)), 9);
    }
  });

  it('tends to the normal quantile for many degrees of freedom and is antisymmetric', () => {
    // z₀.₉₇₅ = 1.959964 (standard normal table); t₀.₉₇₅,ν − z ≈ z(z² + 1)/(4ν) (Cornish–Fisher first term).
    expect(studentTQuantile(0.975, 1e6)).toBeCloseTo(1.959964, 5);
    expect(studentTQuantile(0.025, 7)).toBeCloseTo(-studentTQuantile(0.975, 7), 12);
  });

  it('CDF inverts the quantile and is monotone (property)', () => {
    let prev = 0;
    for (const t of [-5, -1, -0.1, 0, 0.3, 2, 8]) {
      const c = studentTCdf(t, 4.5);
      expect(c).toBeGreaterThan(prev);
      prev = c;
    }
    for (const p of [0.01, 0.3, 0.8, 0.99]) expect(studentTCdf(studentTQuantile(p, 3), 3)).toBeCloseTo(p, 12);
  });

  it('incomplete beta reduces to closed forms', () => {
    // I_x(1, 1) = x; I_x(a, 1) = x^a; I_x(1, b) = 1 − (1 − x)^b (exact identities of the beta integral).
    expect(regularizedIncompleteBeta(0.3, 1, 1)).toBeCloseTo(0.3, 13);
    expect(regularizedIncompleteBeta(0.7, 3.5, 1)).toBeCloseTo(0.7 ** 3.5, 12);
    expect(regularizedIncompleteBeta(0.2, 1, 4)).toBeCloseTo(1 - 0.8 ** 4, 12);
    expect(() => studentTQuantile(1, 5)).toThrowError(DomainError);
    expect(() => studentTQuantile(0.9, 0)).toThrowError(DomainError);
  });
});
