import { DomainError } from '../errors';
import { createRng } from '../tolerance/prng';
import { gravityHeight } from '../washburn/gravity';
import { fitWashburnSlope } from './washburn-slope';

describe('Washburn slope fit', () => {
  const K = 4e-5; // m²/s, h² = K t (Washburn 1921, horizontal)

  it('recovers the slope of exact Washburn data with R² = 1 and keeps every point', () => {
    const t = Array.from({ length: 40 }, (_, i) => (i + 1) * 3);
    const h = t.map((x) => Math.sqrt(K * x));
    const r = fitWashburnSlope({ time: t, values: h });
    expect(r.slope).toBeCloseTo(K, 18);
    expect(r.sqrtSlope).toBeCloseTo(Math.sqrt(K), 15);
    expect(r.rSquared).toBeCloseTo(1, 12);
    expect(r.window.count).toBe(40);
    expect(r.suggestedWindow.droppedLate).toBe(0);
    expect(r.unit).toBe('m^2/s');
  });

  it('95 % intervals cover the true slope about 95 % of the time (seeded noise)', () => {
    // Coverage over 40 independent seeded data sets: the count inside is binomial(40, 0.95); fewer than
    // 33 inside has probability 0.07 % for a correct interval (binomial distribution, computed).
    let inside = 0;
    for (let seed = 1; seed <= 40; seed++) {
      const rng = createRng(seed);
      const t = Array.from({ length: 25 }, (_, i) => (i + 1) * 4);
      const m = t.map((x) => Math.sqrt(K * x + 2e-5 * rng.nextNormal()));
      const r = fitWashburnSlope({ time: t, values: m, window: 'all' });
      if (r.slopeCI95[0] <= K && K <= r.slopeCI95[1]) inside++;
    }
    expect(inside).toBeGreaterThanOrEqual(33);
  });

  it('with an intercept absorbs a contact jump that biases the origin fit', () => {
    const t = Array.from({ length: 30 }, (_, i) => (i + 1) * 2);
    // y² = K t + y₀²: a jump y₀ = 3 mm when the strip touches the liquid.
    const h = t.map((x) => Math.sqrt(K * x + 9e-6));
    const free = fitWashburnSlope({ time: t, values: h, intercept: true, window: 'all' });
    expect(free.slope).toBeCloseTo(K, 16);
    expect(free.intercept).toBeCloseTo(9e-6, 16);
    const origin = fitWashburnSlope({ time: t, values: h, window: 'all' });
    expect(Math.abs(origin.slope - K)).toBeGreaterThan(1e-7);
  });

  it('auto window drops inertial start points and gravity-affected late points', () => {
    const a = 2e-5;
    const b = 2e-4; // h_eq = a/b = 0.1 m
    const ti = 2;
    const t = Array.from({ length: 80 }, (_, i) => 0.5 * 4000 ** (i / 79));
    // Inertia-limited rise h ∝ t up to ti (Quéré 1997), then the gravity-restrained Washburn solution.
    const h = t.map((x) => (x < ti ? gravityHeight(a, b, ti) * (x / ti) : gravityHeight(a, b, x)));
    const r = fitWashburnSlope({ time: t, values: h });
    expect(r.window.start).toBeGreaterThanOrEqual(ti);
    expect(r.window.start).toBeLessThan(2 * ti);
    // Late cut at 20 % of h_eq = 0.02 m (rule documented in washburn-slope.ts).
    expect(h[r.window.endIndex]).toBeLessThanOrEqual(0.2 * 0.1 * 1.01);
    expect(h[r.window.endIndex + 1]).toBeGreaterThan(0.2 * 0.1 * 0.99);
    // In the window d(h²)/dt lies between 2a(1 − h_end/h_eq) and 2a (dh/dt = a/h − b), so must the slope.
    const hEnd = h[r.window.endIndex];
    expect(r.slope).toBeGreaterThan(2 * a * (1 - hEnd / 0.1) * 0.999);
    expect(r.slope).toBeLessThan(2 * a);
    expect(r.warnings.map((w) => w.code)).toContain('gravity-bias');
    expect(r.suggestedWindow.equilibriumEstimate).toBeCloseTo(0.1, 2);
  });

  it('honours an explicit time window and reports it', () => {
    const t = Array.from({ length: 20 }, (_, i) => i + 1);
    const h = t.map((x) => Math.sqrt(K * x));
    const r = fitWashburnSlope({ time: t, values: h, window: { start: 5, end: 12 } });
    expect(r.window).toEqual({ startIndex: 4, endIndex: 11, start: 5, end: 12, count: 8 });
    expect(r.degreesOfFreedom).toBe(7);
    expect(() => fitWashburnSlope({ time: t, values: h, window: { start: 5, end: 6 } })).toThrowError(DomainError, /at least 3/);
  });

  it('refuses bad data with clear DomainErrors', () => {
    const fit = (time: number[], values: number[]) => () => fitWashburnSlope({ time, values });
    expect(fit([1, 2], [0.01, 0.02])).toThrowMatching((e) => e instanceof DomainError && e.code === 'insufficient-data');
    expect(fit([1, 3, 2, 4], [0.01, 0.02, 0.03, 0.04])).toThrowError(DomainError, /increase strictly/);
    expect(fit([-1, 1, 2], [0.01, 0.02, 0.03])).toThrowError(DomainError, /Time must not be negative/);
    expect(fit([1, 2, 3], [0.01, -0.02, 0.03])).toThrowError(DomainError, /must not be negative/);
    expect(fit([1, 2, 3, 4], [0.02, 0.02, 0.02, 0.02])).toThrowError(DomainError, /flat curve/);
    expect(fit([1, 2, 3], [0.01, 0.02])).toThrowError(DomainError, /one height per time/);
    expect(fit([1, 2, Number.NaN], [0.01, 0.02, 0.03])).toThrowError(DomainError);
  });
});
