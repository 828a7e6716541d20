import { TestBed } from '@angular/core/testing';
import { evaluateVariant, fixtureKeys, fixtureMismatches, type VariantFixture, type VariantInputs } from 'wick-core';
import fixtureJson from '../../../../../wick-core/src/design/fixture/variants.json';
import { BAND_THREADS, BAND_WORKER, evaluateLive, LiveEvaluator, type LiveResult } from './live-evaluation';

const fixture = fixtureJson as unknown as VariantFixture;
const toleranced = fixture.cases.filter((c) => c.inputs.tolerances && Object.keys(c.inputs.tolerances).length > 0);
const OPTIONS = { curvePoints: 400, samples: 1000, seed: 1 };

function evaluator(threads: number, worker?: (() => Worker) | null): LiveEvaluator {
  TestBed.configureTestingModule({
    providers: [LiveEvaluator, { provide: BAND_THREADS, useValue: threads }, ...(worker === undefined ? [] : [{ provide: BAND_WORKER, useValue: worker }])],
  });
  return TestBed.inject(LiveEvaluator);
}

function withoutTiming(l: LiveResult): unknown {
  const { computeMs: _ms, ...rest } = l;
  return rest;
}

/** A worker that breaks as soon as it is asked anything. */
class BrokenWorker {
  onmessage: ((e: MessageEvent) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  postMessage(): void {
    setTimeout(() => this.onerror?.(new ErrorEvent('error', { message: 'boom' })));
  }
  terminate(): void {}
}

describe('LiveEvaluator', () => {
  it('has toleranced fixture variants to share', () => expect(toleranced.length).toBeGreaterThanOrEqual(2));

  for (const threads of [2, 3]) {
    for (const c of toleranced) {
      it(`shares the band across ${threads} threads in real Web Workers and still matches the fixture to round-off: ${c.name}`, async () => {
        const ev = evaluator(threads);
        const options = { ...OPTIONS, ...c.options } as typeof OPTIONS;
        const single = evaluateVariant(c.inputs, options);
        // Three runs: after the first, the split follows each thread's speed, and the numbers must not move.
        for (let run = 0; run < 3; run++) {
          const live = await ev.evaluate(c.inputs, options);
          expect(live.kind).toBe('results');
          if (live.kind !== 'results') return;
          expect(live.threads).toBe(threads);
          expect(fixtureMismatches(c.expected, fixtureKeys(live.results))).toEqual([]);
          // And exactly the page's own single-thread evaluation, not merely close to it.
          expect(live.results).toEqual(single);
        }
      });
    }
  }

  it('answers at once, on the page’s thread, for a variant without tolerances', () => {
    const plain = fixture.cases.find((c) => !c.inputs.tolerances)!;
    const live = evaluator(2).evaluate(plain.inputs, OPTIONS);
    expect(live instanceof Promise).toBeFalse();
    expect((live as LiveResult).kind).toBe('results');
  });

  it('gives the single-thread message, naming the field, for invalid inputs with tolerances', async () => {
    const c = toleranced[0];
    const bad: VariantInputs = { ...c.inputs, dimensions: { ...c.inputs.dimensions, duration: -5 } };
    const live = await evaluator(2).evaluate(bad, OPTIONS);
    expect(live.kind).toBe('invalid');
    expect(withoutTiming(live)).toEqual(withoutTiming(evaluateLive(bad, OPTIONS)));
  });

  it('falls back to the page’s thread when a worker breaks, with the same results', async () => {
    const c = toleranced[0];
    const ev = evaluator(2, () => new BrokenWorker() as unknown as Worker);
    const first = await ev.evaluate(c.inputs, OPTIONS);
    expect(first.kind).toBe('results');
    if (first.kind !== 'results') return;
    expect(first.threads).toBe(1);
    expect(first.results).toEqual(evaluateVariant(c.inputs, OPTIONS));
    // After a failure it stops asking workers.
    expect(ev.evaluate(c.inputs, OPTIONS) instanceof Promise).toBeFalse();
  });

  it('computes alone where the browser has no workers or a single core', () => {
    const c = toleranced[0];
    expect(evaluator(4, null).evaluate(c.inputs, OPTIONS) instanceof Promise).toBeFalse();
    TestBed.resetTestingModule();
    expect(evaluator(1).evaluate(c.inputs, OPTIONS) instanceof Promise).toBeFalse();
  });
});
