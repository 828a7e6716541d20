import { poreSizeModels } from './models';
import { poreSizeUptake } from './uptake';

describe('pore-size model specs', () => {
  const byId = (id: string) => poreSizeModels.find((m) => m.id === id);
  const psd = { diameters: [10e-6, 30e-6], fractions: [0.4, 0.6], form: 'differential' };
  const liquid = { surfaceTension: 0.072, contactAngle: 0.5, density: 1000 };

  it('declares unique kebab-case ids in the pore-size family with documented parameters', () => {
    const ids = poreSizeModels.map((m) => m.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const m of poreSizeModels) {
      expect(m.family).toBe('pore-size');
      expect(m.id).toMatch(/^[a-z]+(-[a-z]+)*$/);
      for (const p of m.parameters) expect(p.description.length).toBeGreaterThan(5);
    }
  });

  it('run returns JSON-ready results (plain arrays) equal to the library call', () => {
    const input = { ...psd, ...liquid, viscosity: 1e-3, porosity: 0.8, thickness: 1e-3, times: [0, 10, 100] };
    const out = byId('pore-size-uptake')?.run(input) as { massPerWidth: number[]; inputs: unknown; warnings: unknown[] };
    expect(Array.isArray(out.massPerWidth)).toBeTrue();
    expect(out.warnings).toEqual([]);
    const direct = poreSizeUptake({ ...input, form: 'differential' });
    expect(out.massPerWidth).toEqual(Array.from(direct.massPerWidth));
    const back = JSON.parse(JSON.stringify(out)) as { massPerWidth: number[] };
    expect(back.massPerWidth).toEqual(out.massPerWidth);
    const eq = byId('pore-size-equilibrium')?.run({ ...psd, ...liquid }) as { jurinHeights: number[] };
    expect(eq.jurinHeights.length).toBe(2);
    const st = byId('pore-size-statistics')?.run(psd) as { meanDiameter: number };
    // 0.4·10 + 0.6·30 = 22 µm.
    expect(st.meanDiameter).toBeCloseTo(22e-6, 18);
  });
});
