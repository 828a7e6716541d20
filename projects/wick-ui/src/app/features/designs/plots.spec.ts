import { evaluateVariant, VARIANT_EXAMPLE, type VariantResultsOk } from 'wick-core';
import { massTraces, uptakeTraces } from './plots';

describe('massTraces', () => {
  it('draws the uptake rate down to 1/10,000 of its peak, not the round-off tail of a levelled-off front', () => {
    // A vertical strip that levels off well within its duration: the rate falls to round-off values.
    const r = evaluateVariant({ ...VARIANT_EXAMPLE, tolerances: {} }, { curvePoints: 400 }) as VariantResultsOk;
    expect(r.status).toBe('ok');
    const rates = r.curves.massRate!.filter((x): x is number => x !== null && x > 0);
    const peak = Math.max(...rates);
    expect(Math.min(...rates)).toBeLessThan(peak * 1e-4); // the case has a tail to leave out

    const [uptake, rate] = massTraces(r);
    const drawn = (rate['y'] as (number | null)[]).filter((y): y is number => y !== null);
    expect(Math.max(...drawn)).toBeCloseTo(peak * 1000, 9); // g/s
    expect(Math.min(...drawn)).toBeGreaterThanOrEqual(peak * 1000 * 1e-4);
    // The uptake itself is drawn whole.
    expect((uptake['y'] as (number | null)[]).every((y) => y !== null)).toBeTrue();
  });
});

describe('uptakeTraces', () => {
  it('hovers the curves and checkpoints with units, and not the band', () => {
    const r = evaluateVariant(VARIANT_EXAMPLE, { curvePoints: 200, samples: 200 }) as VariantResultsOk;
    const traces = uptakeTraces(r);
    for (const t of traces) {
      if (t['hoverinfo'] === 'skip') continue;
      expect(t['hovertemplate']).toContain(' s · ');
      expect(t['hovertemplate']).toContain(' mm');
    }
    expect(traces.filter((t) => t['hoverinfo'] === 'skip').length).toBe(2); // P10 and P90 of the band
  });
});
