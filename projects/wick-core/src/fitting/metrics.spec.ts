import { DomainError } from '../errors';
import { firstCrossingTime, predictionError } from './metrics';

describe('prediction error metrics', () => {
  const t = Array.from({ length: 11 }, (_, i) => i);
  const line = (k: number, c = 0) => t.map((x) => k * x + c);

  it('a constant offset δ gives RMSE = bias = max deviation = δ (identity)', () => {
    const r = predictionError({ measured: { time: t, values: line(2) }, predicted: { time: t, values: line(2, 0.1) } });
    expect(r.rmse).toBeCloseTo(0.1, 14);
    expect(r.meanBias).toBeCloseTo(0.1, 14);
    expect(r.maxDeviation.value).toBeCloseTo(0.1, 14);
    expect(r.n).toBe(11);
    expect(r.normalizedRmse).toBeCloseTo(0.1 / 20, 14);
  });

  it('time-to-height errors for straight lines are exact: t = H/k', () => {
    // Measured y = 2t, predicted y = 2.5t: t_meas(H) = H/2, t_pred(H) = H/2.5, relative error 2/2.5 − 1 = −0.2.
    const r = predictionError({
      measured: { time: t, values: line(2) },
      predicted: { time: t, values: line(2.5) },
      heights: [5, 15, 30],
    });
    expect(r.timeToHeight[0].measured).toBeCloseTo(2.5, 14);
    expect(r.timeToHeight[0].predicted).toBeCloseTo(2, 14);
    expect(r.timeToHeight[0].relativeError ?? 0).toBeCloseTo(-0.2, 14);
    expect(r.timeToHeight[1].error ?? 0).toBeCloseTo(15 / 2.5 - 15 / 2, 14);
    // 30 is beyond both records (20 and 25): null with a warning.
    expect(r.timeToHeight[2].measured).toBeNull();
    expect(r.warnings.map((w) => w.code)).toContain('height-not-reached');
    // Max deviation at the last point: 0.5·10 = 5.
    expect(r.maxDeviation).toEqual({ value: 5, time: 10 });
  });

  it('interpolates the prediction at measured times and skips points outside its range', () => {
    const r = predictionError({
      measured: { time: [0.5, 1.5, 2.5, 3.5, 20], values: [1, 3, 5, 7, 9] },
      predicted: { time: [0, 1, 2, 3, 4], values: [0, 2, 4, 6, 8] },
    });
    expect(r.n).toBe(4);
    expect(r.rmse).toBeCloseTo(0, 14);
    expect(r.warnings.map((w) => w.code)).toEqual(['outside-prediction']);
  });

  it('RMSE lies between |bias| and |max deviation| (property)', () => {
    const meas = t.map((x) => Math.sqrt(x));
    const pred = t.map((x) => Math.sqrt(1.1 * x) - 0.05 * Math.sin(x));
    const r = predictionError({ measured: { time: t, values: meas }, predicted: { time: t, values: pred.map((v) => Math.max(v, 0)) } });
    expect(r.rmse).toBeGreaterThanOrEqual(Math.abs(r.meanBias));
    expect(r.rmse).toBeLessThanOrEqual(Math.abs(r.maxDeviation.value));
  });

  it('first crossing uses linear interpolation and ignores later dips', () => {
    expect(firstCrossingTime([0, 1, 2, 3], [0, 1, 0.5, 2], 0.75)).toBeCloseTo(0.75, 14);
    expect(firstCrossingTime([0, 1], [0, 1], 2)).toBeNull();
  });

  it('refuses too few comparable points', () => {
    expect(() =>
      predictionError({ measured: { time: [10, 11, 12], values: [1, 2, 3] }, predicted: { time: [0, 1], values: [0, 1] } }),
    ).toThrowError(DomainError, /within the predicted time range/);
  });
});
