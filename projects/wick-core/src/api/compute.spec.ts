import { execFileSync, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { listModels, runBatch, runModel } from './compute';
import { MODEL_EXAMPLES } from './examples';

describe('model registry (runModel / runBatch)', () => {
  it('lists every model once; a numeric parameter has a unit, or says it takes SI values as given', () => {
    const models = listModels();
    const ids = models.map((m) => m.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const m of models) {
      expect(m.summary.length).toBeGreaterThan(20);
      for (const p of m.parameters) {
        if ((p.kind === 'number' || p.kind === 'number[]') && p.unit === '') {
          expect(p.description).withContext(`${m.id}.${p.name}`).toMatch(/\bSI\b/);
        }
      }
    }
  });

  it('reads bare numbers in the parameter unit and strings in their own, giving the same SI result', () => {
    // IAPWS R1-76(2014), Table 1: 71.97 mN/m at 25 °C.
    const a = runModel({ model: 'water-properties', inputs: { temperature: 25 } });
    const b = runModel({ model: 'water-properties', inputs: { temperature: '298.15 K' } });
    expect(a.ok && b.ok).toBeTrue();
    const ra = (a as { result: { surfaceTension: number } }).result;
    const rb = (b as { result: { surfaceTension: number } }).result;
    expect(ra.surfaceTension).toBeCloseTo(0.07197, 5);
    expect(rb.surfaceTension).toBeCloseTo(ra.surfaceTension, 12);
  });

  it('answers an unknown model, an unknown parameter or a wrong dimension with ok:false and the field', () => {
    expect(runModel({ model: 'nope', inputs: {} })).toEqual(jasmine.objectContaining({ ok: false }));
    const unknownParam = runModel({ model: 'water-properties', inputs: { colour: 'blue' } });
    expect(unknownParam.ok).toBeFalse();
    expect(!unknownParam.ok && unknownParam.error.field).toBe('colour');
    const wrongDim = runModel({ model: 'water-properties', inputs: { temperature: '3 mm' } });
    expect(!wrongDim.ok && wrongDim.error.code).toBe('wrong-dimension');
  });

  it('runs a batch request by request, one failure not stopping the others', () => {
    const out = runBatch({ requests: [{ model: 'water-properties', inputs: { temperature: 20 } }, { model: 'nope', inputs: {} }] });
    expect(out.results.map((r) => r.ok)).toEqual([true, false]);
  });
});

describe('wick CLI', () => {
  const bin = join(process.cwd(), 'projects', 'wick-core', 'bin', 'wick.mjs');

  it('`wick list --json` lists the same models as the registry', () => {
    const out = JSON.parse(execFileSync(process.execPath, [bin, 'list', '--json'], { encoding: 'utf8' }));
    expect(out.map((m: { id: string }) => m.id)).toEqual(listModels().map((m) => m.id));
  });

  it('`wick run <model> --json` reads the request on stdin and writes the same response as runModel', () => {
    const request = { inputs: { temperature: '50 degC' } };
    const r = spawnSync(process.execPath, [bin, 'run', 'water-properties', '--json'], { input: JSON.stringify(request), encoding: 'utf8' });
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout)).toEqual(JSON.parse(JSON.stringify(runModel({ model: 'water-properties', inputs: request.inputs }))));
  });

  it('exits non-zero with a readable message on bad JSON or a domain error', () => {
    const bad = spawnSync(process.execPath, [bin, 'run', 'water-properties'], { input: '{oops', encoding: 'utf8' });
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('not valid JSON');
    const domain = spawnSync(process.execPath, [bin, 'run', 'water-properties'], { input: '{"temperature":"3 kg"}', encoding: 'utf8' });
    expect(domain.status).toBe(1);
  });
});

describe('every model answers its example request', () => {
  /** No NaN or Infinity anywhere in a result (null stands for "not reached"). */
  function badNumbers(value: unknown, path = 'result'): string[] {
    if (typeof value === 'number') return Number.isFinite(value) ? [] : [path];
    if (Array.isArray(value)) return value.flatMap((v, i) => badNumbers(v, `${path}[${i}]`));
    if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => badNumbers(v, `${path}.${k}`));
    return [];
  }

  it('has an example for each registered model and no example for a model that does not exist', () => {
    const ids = listModels().map((m) => m.id).sort();
    expect(Object.keys(MODEL_EXAMPLES).sort()).toEqual(ids);
  });

  for (const [model, inputs] of Object.entries(MODEL_EXAMPLES)) {
    it(`${model}: ok, JSON-safe, no NaN or Infinity`, () => {
      const response = runModel({ model, inputs });
      if (!response.ok) fail(`${model}: ${response.error.message}`);
      expect(badNumbers(JSON.parse(JSON.stringify(response)))).toEqual([]);
    });
  }
});
