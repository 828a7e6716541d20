import { DomainError } from '../errors';
import { fitLine } from './linear-regression';

describe('straight-line least squares against NIST StRD', () => {
  it('Norris (with intercept): certified estimates, standard deviations, residual sd and R²', () => {
    // NIST/ITL Statistical Reference Datasets, linear regression "Norris" (36 observations, lower
    // difficulty), data and certified values from itl.nist.gov/div898/strd/lls/data/Norris.shtml.
    const x = [
      0.2, 337.4, 118.2, 884.6, 10.1, 226.5, 666.3, 996.3, 448.6, 777.0, 558.2, 0.4, 0.6, 775.5, 666.9, 338.0, 447.5,
      11.6, 556.0, 228.1, 995.8, 887.6, 120.2, 0.3, 0.3, 556.8, 339.1, 887.2, 999.0, 779.0, 11.1, 118.3, 229.2, 669.1,
      448.9, 0.5,
    ];
    const y = [
      0.1, 338.8, 118.1, 888.0, 9.2, 228.1, 668.5, 998.5, 449.1, 778.9, 559.2, 0.3, 0.1, 778.1, 668.8, 339.3, 448.9,
      10.8, 557.7, 228.3, 998.0, 888.8, 119.6, 0.3, 0.6, 557.6, 339.3, 888.0, 998.5, 778.9, 10.2, 117.6, 228.9, 668.4,
      449.2, 0.2,
    ];
    const f = fitLine(x, y, { intercept: true });
    expect(f.slope).toBeCloseTo(1.00211681802045, 12);
    expect(f.intercept).toBeCloseTo(-0.262323073774029, 11);
    expect(f.slopeStdError).toBeCloseTo(0.429796848199937e-3, 13);
    expect(f.interceptStdError).toBeCloseTo(0.232818234301152, 11);
    expect(f.residualStdDev).toBeCloseTo(0.884796396144373, 11);
    expect(f.rSquared).toBeCloseTo(0.999993745883712, 13);
    expect(f.degreesOfFreedom).toBe(34);
    // 95 % interval = slope ± t(0.975, 34)·se; t(0.975, 34) = 2.032 (t tables, from memory).
    expect((f.slopeCI95[1] - f.slope) / f.slopeStdError).toBeCloseTo(2.032, 3);
  });

  it('NoInt1 (through the origin): certified estimate, its sd, residual sd and R²', () => {
    // NIST StRD "NoInt1": x = 60 … 70, y = 130 … 140, model y = B1·x; certified B1 = 2.07438016528926,
    // sd(B1) = 0.165289256198347E-01, residual sd 3.56753034006338, R² 0.999365492298663 (uncentred,
    // as NIST defines it without an intercept).
    const x = Array.from({ length: 11 }, (_, i) => 60 + i);
    const y = x.map((v) => v + 70);
    const f = fitLine(x, y, { intercept: false });
    expect(f.slope).toBeCloseTo(2.07438016528926, 13);
    expect(f.slopeStdError).toBeCloseTo(0.0165289256198347, 14);
    expect(f.residualStdDev).toBeCloseTo(3.56753034006338, 12);
    expect(f.rSquaredUncentered).toBeCloseTo(0.999365492298663, 13);
    expect(f.degreesOfFreedom).toBe(10);
    expect(f.intercept).toBe(0);
  });

  it('hand example through the origin: b = Σxy/Σx²', () => {
    // x = 1, 2, 3; y = 2, 4, 7: Σxy = 31, Σx² = 14 → b = 31/14; residuals 2 − 31/14, 4 − 62/14, 7 − 93/14.
    const f = fitLine([1, 2, 3], [2, 4, 7], { intercept: false });
    expect(f.slope).toBeCloseTo(31 / 14, 14);
    expect(f.residuals[2]).toBeCloseTo(7 - 93 / 14, 14);
  });

  it('refuses degenerate input', () => {
    expect(() => fitLine([1, 1, 1], [1, 2, 3])).toThrowError(DomainError);
    expect(() => fitLine([1, 2], [1, 2])).toThrowError(DomainError, /at least 3/);
  });
});
