import { gravityHeight } from '../washburn/gravity';
import { fittingModels } from './models';

describe('fitting model specs', () => {
  const run = (id: string, input: Record<string, unknown>) =>
    fittingModels.find((m) => m.id === id)?.run(input) as Record<string, unknown>;

  it('declares unique ids in the fitting family', () => {
    const ids = fittingModels.map((m) => m.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const m of fittingModels) expect(m.family).toBe('fitting');
  });

  it('every model returns inputs, warnings and JSON-ready arrays', () => {
    const t = Array.from({ length: 30 }, (_, i) => (i + 1) * 10);
    const h = t.map((x) => gravityHeight(4e-5, 4e-4, x));
    const outs = [
      run('fit-washburn-slope', { time: t, values: h }),
      run('fit-gravity-washburn', { time: t, values: h }),
      run('contact-angle-reference-liquid', {
        reference: { surfaceTension: 0.0179, density: 659, viscosity: 3e-4, slopes: [2.6e-7] },
        test: { surfaceTension: 0.0727, density: 998, viscosity: 1e-3, slopes: [3.6e-7] },
      }),
      run('replicate-statistics', { values: [1, 2, 3] }),
      run('prediction-error', { measured: { time: t, values: h }, predicted: { time: t, values: h } }),
    ];
    for (const o of outs) {
      expect(o['inputs']).toBeDefined();
      expect(Array.isArray(o['warnings'])).toBeTrue();
    }
    expect(Array.isArray(outs[0]['residuals'])).toBeTrue();
    expect(Array.isArray(outs[1]['fitted'])).toBeTrue();
    expect(outs[4]['rmse']).toBe(0);
  });
});
