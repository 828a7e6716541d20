import { DomainError } from '../errors';
import { gravityCurve } from '../washburn/gravity';
import { bandPart, mergeBandParts, percentileBands, type BandModel, type BandPart, type BandResult } from './band';
import { curveTimes, evaluateVariant, variantBandModel, variantBandPart } from './evaluate';
import { FIXTURE_INPUTS } from './fixture/cases';
import type { EvaluateVariantOptions, VariantInputs } from './variant';

/*
 * A band computed in parts (one per thread) must give the numbers of the band computed in one go. The check is a
 * mathematical identity: the order statistics of a set do not depend on how the set is split, and each part
 * draws from the run's one random sequence. percentileBands itself is checked against the tolerance family's
 * monteCarloCurve in evaluate.spec.ts.
 */

type P = 'a' | 'b';
const NOMINAL = { a: 1e-4, b: 2e-3 };
const TOL = { a: { kind: 'normal' as const, sd: 3e-5, lower: 0 }, b: { kind: 'uniform' as const, min: 1e-3, max: 3e-3 } };

/** Washburn curves with gravity, clamped at a strip length and held flat over a stretch: many tied values. */
function clampedModel(points: number, refuse?: (p: Readonly<Record<P, number>>) => 'throw' | 'nan' | null): BandModel<P> {
  const times = curveTimes(200, points);
  const L = 0.05;
  return {
    points,
    scalars: 2,
    evaluate(p, out, scalars) {
      const why = refuse?.(p);
      if (why === 'throw') throw new DomainError('out-of-range', `a = ${p.a.toExponential(2)} is refused`, 'a');
      gravityCurve(p.a, p.b, times, out);
      for (let i = Math.floor(points / 3); i < Math.floor(points / 2); i++) out[i] = out[Math.floor(points / 3) - 1];
      for (let i = 0; i < points; i++) out[i] = Math.min(out[i], L);
      if (why === 'nan') out[points - 1] = Number.NaN;
      scalars[0] = p.a / p.b;
      scalars[1] = Math.round(p.a * 1e5);
    },
  };
}

function split(samples: number, cuts: readonly number[]): [number, number][] {
  const edges = [0, ...cuts, samples];
  return edges.slice(1).map((to, k) => [edges[k], to]);
}

function inParts(model: BandModel<P>, samples: number, seed: number, cuts: readonly number[]): BandPart[] {
  return split(samples, cuts).map(([from, to]) => bandPart(model, NOMINAL, TOL, samples, seed, from, to));
}

function expectSameBand(merged: BandResult, whole: BandResult): void {
  expect(Array.from(merged.curve.p10)).toEqual(Array.from(whole.curve.p10));
  expect(Array.from(merged.curve.p50)).toEqual(Array.from(whole.curve.p50));
  expect(Array.from(merged.curve.p90)).toEqual(Array.from(whole.curve.p90));
  expect(merged.scalars).toEqual(whole.scalars);
  expect(merged.valid).toBe(whole.valid);
  expect(merged.failures).toEqual(whole.failures);
  expect(merged.warnings).toEqual(whole.warnings);
}

describe('band parts (identity: order statistics do not depend on how the samples are split)', () => {
  const samples = 600;
  const seed = 9;

  for (const cuts of [[], [300], [1], [599], [200, 400], [150, 300, 450], [0, 300], [300, 300, 600], [7, 31, 100, 377]]) {
    it(`merges parts cut at [${cuts.join(', ')}] into exactly the single-run band`, () => {
      const model = clampedModel(150);
      expectSameBand(mergeBandParts(inParts(model, samples, seed, cuts)), percentileBands(model, NOMINAL, TOL, samples, seed));
    });
  }

  it('counts refused and non-finite samples alike and names the run’s first refusal, whichever part met it', () => {
    const model = clampedModel(80, (p) => (p.a < 8e-5 ? 'throw' : p.b > 2.8e-3 ? 'nan' : null));
    const whole = percentileBands(model, NOMINAL, TOL, samples, seed);
    expect(whole.failures.count).toBeGreaterThan(100);
    for (const cuts of [[300], [100, 200, 500]]) expectSameBand(mergeBandParts(inParts(model, samples, seed, cuts)), whole);
    // The first part may refuse nothing: the message still comes from the earliest refused sample of the run.
    const parts = inParts(model, samples, seed, [300]);
    expect(mergeBandParts(parts).failures.firstMessage).toBe(whole.failures.firstMessage);
  });

  it('refuses a merged run with fewer than two valid samples, with the single run’s message', () => {
    const model = clampedModel(20, (p) => (p.a < 1.6e-4 ? 'throw' : null));
    let single: unknown;
    try {
      percentileBands(model, NOMINAL, TOL, 30, 2);
    } catch (e) {
      single = e;
    }
    expect(single).toBeInstanceOf(DomainError);
    expect((single as DomainError).message).toMatch(/^Only [01] of 30 samples/);
    expect(() => mergeBandParts(inParts(model, 30, 2, [10, 20]))).toThrowMatching(
      (e) => e instanceof DomainError && e.message === (single as DomainError).message,
    );
  });

  it('refuses parts that leave a gap, overlap, stop short or come from another run', () => {
    const model = clampedModel(40);
    const part = (from: number, to: number, n = 100) => bandPart(model, NOMINAL, TOL, n, 1, from, to);
    expect(() => mergeBandParts([])).toThrowError(RangeError);
    expect(() => mergeBandParts([part(0, 40), part(50, 100)])).toThrowError(RangeError);
    expect(() => mergeBandParts([part(0, 60), part(50, 100)])).toThrowError(RangeError);
    expect(() => mergeBandParts([part(0, 60)])).toThrowError(RangeError);
    expect(() => mergeBandParts([part(0, 60), part(60, 120, 120)])).toThrowError(RangeError);
    expect(() => part(0, 101)).toThrowError(RangeError);
    expect(() => part(60, 50)).toThrowError(RangeError);
  });
});

describe('evaluateVariant with its band computed in parts', () => {
  const options: EvaluateVariantOptions = { curvePoints: 400, samples: 1000, seed: 1 };
  const withTolerances = FIXTURE_INPUTS.filter((c) => c.inputs.tolerances && Object.keys(c.inputs.tolerances).length > 0);

  it('the shared fixture has toleranced variants to check (strip and radial at least)', () => {
    expect(withTolerances.length).toBeGreaterThanOrEqual(2);
  });

  for (const c of withTolerances) {
    it(`gives the same results as in one go: ${c.name}`, () => {
      const parts = split(1000, [500]).map(([from, to]) => variantBandPart(c.inputs, options, from, to)!);
      expect(parts.every((p) => p !== null)).toBeTrue();
      expect(evaluateVariant(c.inputs, options, parts)).toEqual(evaluateVariant(c.inputs, options));
    });
  }

  it('has no band part for a variant without tolerances or a liquid that does not wet the layer', () => {
    const plain = FIXTURE_INPUTS.find((c) => !c.inputs.tolerances)!.inputs;
    expect(variantBandPart(plain, options, 0, 1000)).toBeNull();
    const toleranced = withTolerances[0].inputs;
    const dry: VariantInputs = { ...toleranced, structure: { ...toleranced.structure!, contactAngle: (100 * Math.PI) / 180 } };
    expect(variantBandPart(dry, options, 0, 1000)).toBeNull();
  });

  it('throws the same input error as evaluateVariant, naming the field', () => {
    const bad: VariantInputs = { ...withTolerances[0].inputs, dimensions: { ...withTolerances[0].inputs.dimensions, duration: -1 } };
    let field: string | undefined;
    try {
      evaluateVariant(bad, options);
    } catch (e) {
      field = (e as DomainError).field;
    }
    expect(field).toBeDefined();
    expect(() => variantBandPart(bad, options, 0, 500)).toThrowMatching((e) => e instanceof DomainError && e.field === field);
  });

  it('refuses parts computed with other options', () => {
    const c = withTolerances[0];
    const parts = [variantBandPart(c.inputs, { ...options, curvePoints: 200 }, 0, 1000)!];
    expect(() => evaluateVariant(c.inputs, options, parts)).toThrowError(RangeError);
  });
});

describe('the variant band read point by point (pointwise) equals the curve-by-curve form', () => {
  const deg = (d: number) => (d * Math.PI) / 180;
  const base = FIXTURE_INPUTS.find((c) => c.inputs.configuration === 'vertical-strip' && c.inputs.tolerances)!.inputs;
  const cases: { name: string; inputs: VariantInputs }[] = [
    ...FIXTURE_INPUTS.filter((c) => c.inputs.tolerances && c.inputs.configuration !== 'radial-spread'),
    // Strip length reached by some samples and not by others: the clamp decides per sample.
    { name: 'a short strip that part of the samples fill', inputs: { ...base, dimensions: { ...base.dimensions, length: 0.03, duration: 900 } } },
    // Without gravity along the flow (b = 0): no equilibrium, no saturated tail.
    { name: 'a horizontal strip', inputs: { ...base, configuration: 'horizontal-strip' } },
    // Contact angles near 90° in the tolerance: some samples do not wet and are refused.
    { name: 'samples that do not wet', inputs: { ...base, tolerances: { contactAngle: { kind: 'uniform', min: deg(80), max: deg(95) } } } },
  ];
  const options: EvaluateVariantOptions = { curvePoints: 300, samples: 400, seed: 4 };

  for (const c of cases) {
    it(`gives the same curve at every point for every sample: ${c.name}`, () => {
      const { model, nominal } = variantBandModel(c.inputs, options)!;
      expect(model.pointwise).toBeDefined();
      const pw = model.pointwise!;
      const params = { ...nominal };
      const curve = new Float64Array(model.points);
      const scal = new Float64Array(model.scalars);
      const coef = new Float64Array(pw.width);
      const scal2 = new Float64Array(model.scalars);
      const row = new Float64Array(1);
      const first = Int32Array.of(0);
      model.evaluate(params, curve, scal);
      const settled = pw.prepare(params, coef, 0, scal2);
      expect(Array.from(scal2)).toEqual(Array.from(scal));
      for (let i = 0; i < model.points; i++) {
        pw.fill(i, coef, first, 1, row);
        expect(row[0]).toBe(curve[i]);
      }
      // The curve is constant from the point prepare names on (the band reads no further).
      expect(settled).toBeGreaterThanOrEqual(0);
      for (let i = settled + 1; i < model.points; i++) expect(curve[i]).toBe(curve[i - 1]);
    });

    it(`gives exactly the same band, whole and in parts: ${c.name}`, () => {
      const { model, nominal, tolerances: tol } = variantBandModel(c.inputs, options)!;
      const stored: typeof model = { points: model.points, scalars: model.scalars, evaluate: (p, o, s) => model.evaluate(p, o, s) };
      const whole = percentileBands(stored, nominal, tol, 400, 4);
      expectSameBand(percentileBands(model, nominal, tol, 400, 4), whole);
      const parts = split(400, [170]).map(([from, to]) => bandPart(model, nominal, tol, 400, 4, from, to));
      expectSameBand(mergeBandParts(parts), whole);
    });
  }

  it('leaves radial spreading to the curve-by-curve form', () => {
    const radial = FIXTURE_INPUTS.find((c) => c.inputs.configuration === 'radial-spread' && c.inputs.tolerances);
    expect(radial).toBeDefined();
    expect(variantBandModel(radial!.inputs, options)!.model.pointwise).toBeUndefined();
  });
});
