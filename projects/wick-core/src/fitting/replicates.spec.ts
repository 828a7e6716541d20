import { DomainError } from '../errors';
import { replicateStatistics } from './replicates';

describe('replicate statistics and outlier runs', () => {
  it('mean, sample sd and CV of a small set', () => {
    // 10, 12, 14: mean 12, sd √((4 + 0 + 4)/2) = 2, CV = 2/12 (exact arithmetic).
    const r = replicateStatistics({ values: [10, 12, 14] });
    expect(r.mean).toBe(12);
    expect(r.sd).toBeCloseTo(2, 14);
    expect(r.cv ?? 0).toBeCloseTo(1 / 6, 14);
    expect(r.outliers).toEqual([]);
  });

  it('flags a wild run by the modified z-score (Iglewicz & Hoaglin 1993, |M| > 3.5)', () => {
    // 1, 2, 3, 4, 100: median 3, |x − 3| = 2, 1, 0, 1, 97 → MAD = 1;
    // M = 0.6745·(x − 3)/1 → −1.349, −0.6745, 0, 0.6745, 65.43.
    const r = replicateStatistics({ values: [1, 2, 3, 4, 100], labels: ['A', 'B', 'C', 'D', 'E'] });
    expect(r.median).toBe(3);
    expect(r.mad).toBe(1);
    expect(r.modifiedZ[0] ?? 0).toBeCloseTo(-1.349, 12);
    expect(r.modifiedZ[4] ?? 0).toBeCloseTo(65.4265, 12);
    expect(r.outliers).toEqual([4]);
    expect(r.warnings[0].message).toContain('E (100)');
    // Without run E: 1, 2, 3, 4 → mean 2.5, sd √(5/3).
    expect(r.withoutOutliers.mean).toBe(2.5);
    expect(r.withoutOutliers.sd).toBeCloseTo(Math.sqrt(5 / 3), 14);
  });

  it('applies the cut-off to |M| on both sides', () => {
    // −10, 0, 10, 20: median 5, |x − 5| = 15, 5, 5, 15 → MAD 10; M = ∓0.6745·15/10 = ∓1.01 at the ends:
    // nothing above 3.5, both ends above a cut-off of 1.
    const r = replicateStatistics({ values: [-10, 0, 10, 20] });
    expect(r.outliers).toEqual([]);
    const strict = replicateStatistics({ values: [-10, 0, 10, 20], threshold: 1 });
    expect(strict.outliers).toEqual([0, 3]);
  });

  it('warns when the test cannot be applied', () => {
    expect(replicateStatistics({ values: [5, 5, 5, 9] }).warnings[0].code).toBe('outlier-test-undefined');
    expect(replicateStatistics({ values: [5, 6] }).warnings[0].code).toBe('too-few-replicates');
    expect(() => replicateStatistics({ values: [] })).toThrowError(DomainError);
    expect(() => replicateStatistics({ values: [1, Number.NaN, 2] })).toThrowError(DomainError);
  });
});
