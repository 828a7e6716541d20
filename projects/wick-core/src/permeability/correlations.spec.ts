import { DomainError } from '../errors';
import {
  gebartWith,
  happelWith,
  tomadakisRobertsonWith,
  compareCorrelations,
  davies,
  gebart,
  GEBART_CONSTANTS,
  happel,
  jacksonJames,
  kozenyCarman,
  tomadakisRobertson,
  type PermeabilityResult,
} from './correlations';
import { permeabilityModels } from './models';

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}
function k(r: PermeabilityResult): number {
  if (r.permeability === null) throw new Error(`${r.correlation}: no value`);
  return r.permeability;
}

describe('fibre-bed permeability correlations at stated points', () => {
  it('Kozeny–Carman: K = d²ε³/(16 k (1 − ε)²)', () => {
    // Carman (1937) with S = 4/d: d = 20 µm, ε = 0.6, k = 5 → 4e-10·0.216/(16·5·0.16) = 6.75e-12 m².
    expect(rel(k(kozenyCarman({ fibreDiameter: 20e-6, porosity: 0.6 })), 6.75e-12)).toBeLessThan(1e-14);
    // Doubling the Kozeny constant halves K.
    expect(rel(k(kozenyCarman({ fibreDiameter: 20e-6, porosity: 0.6, kozenyConstant: 10 })), 3.375e-12)).toBeLessThan(
      1e-14,
    );
  });

  it('Davies: K = d²/(64 c^1.5 (1 + 56 c³))', () => {
    // Davies (1952), formula as in REFERENCES [M]: d = 20 µm, c = 0.1 → 64·0.031623·1.056 = 2.137194,
    // K = 4e-10/2.137194 = 1.871613e-10 m².
    expect(rel(k(davies({ fibreDiameter: 20e-6, porosity: 0.9 })), 1.871613e-10)).toBeLessThan(1e-6);
  });

  it('Happel: across (r²/8c)[−ln c − (1 − c²)/(1 + c²)], along (r²/4c)[−ln c − 3/2 + 2c − c²/2]', () => {
    // Happel (1959), formulas from memory: r = 10 µm, c = 0.1.
    // across: 1.25e-10·(2.302585 − 0.980198) = 1.25e-10·1.322387 = 1.652984e-10 m².
    expect(rel(k(happel({ fibreDiameter: 20e-6, porosity: 0.9, direction: 'across' })), 1.652984e-10)).toBeLessThan(
      1e-6,
    );
    // along: 2.5e-10·(2.302585 − 1.5 + 0.2 − 0.005) = 2.5e-10·0.997585 = 2.493963e-10 m².
    expect(rel(k(happel({ fibreDiameter: 20e-6, porosity: 0.9, direction: 'along' })), 2.493963e-10)).toBeLessThan(
      1e-6,
    );
  });

  it('Jackson & James: K = (3r²/(20c))(−ln c − 0.931)', () => {
    // Jackson & James (1986), REFERENCES [M]: r = 10 µm, c = 0.1 → 1.5e-10·1.371585 = 2.057378e-10 m².
    expect(rel(k(jacksonJames({ fibreDiameter: 20e-6, porosity: 0.9 })), 2.057378e-10)).toBeLessThan(1e-6);
    // No physical value once the bracket turns negative, c ≥ e^−0.931 ≈ 0.394.
    const dense = jacksonJames({ fibreDiameter: 20e-6, porosity: 0.55 });
    expect(dense.permeability).toBeNull();
    expect(dense.warnings.map((w) => w.code)).toContain('not-applicable');
  });

  it('Gebart: matches an independent implementation at V_f = 0.5, r = 17 µm', () => {
    // Gebart, J. Compos. Mater. 26 (1992) 1100; values from the doctest of pyLCM (binyang424/pyLCM,
    // pyLCM/perm/Gebart.py), an independent open-source implementation.
    const base = { fibreDiameter: 34e-6, porosity: 0.5 };
    expect(rel(k(gebart({ ...base, direction: 'along', packing: 'quadratic' })), 2.0280701754385963e-11)).toBeLessThan(
      1e-13,
    );
    expect(rel(k(gebart({ ...base, direction: 'across', packing: 'quadratic' })), 3.734728329018035e-12)).toBeLessThan(
      1e-13,
    );
    expect(rel(k(gebart({ ...base, direction: 'along', packing: 'hexagonal' })), 2.181132075471698e-11)).toBeLessThan(
      1e-13,
    );
    expect(rel(k(gebart({ ...base, direction: 'across', packing: 'hexagonal' })), 4.727865993574315e-12)).toBeLessThan(
      1e-13,
    );
  });

  it('Gebart along equals Kozeny–Carman with k = C/32 (same functional form)', () => {
    // Algebra: (8r²/C)ε³/c² = d²ε³/(16 (C/32) c²).
    for (const packing of ['quadratic', 'hexagonal'] as const) {
      const along = k(gebart({ fibreDiameter: 10e-6, porosity: 0.45, direction: 'along', packing }));
      const kc = k(kozenyCarman({ fibreDiameter: 10e-6, porosity: 0.45, kozenyConstant: GEBART_CONSTANTS[packing].c / 32 }));
      expect(rel(along, kc)).toBeLessThan(1e-14);
    }
  });

  it('Tomadakis & Robertson: percolation form with (ε_p, α) per structure', () => {
    // Tomadakis & Robertson (2005), parameters from memory. r = 5 µm, ε = 0.9:
    // ε/(8 ln²ε) = 10.134370; in-plane (0.11, 0.521): 0.79^2.521 = 0.551973, 0.89^0.521 = 0.941092,
    // (1.521·0.9 − 0.11)² = 1.584829 → K = 25e-12·10.134370·0.551973/(0.941092·1.584829) = 9.376483e-11 m².
    expect(rel(k(tomadakisRobertson({ fibreDiameter: 10e-6, porosity: 0.9, structure: '2d-in-plane' })), 9.376483e-11))
      .toBeLessThan(1e-6);
    // through-plane (0.11, 0.785): 0.79^2.785 = 0.518670, 0.89^0.785 = 0.912580, (1.785·0.9 − 0.11)² = 2.239512
    // → K = 6.429891e-11 m².
    expect(
      rel(k(tomadakisRobertson({ fibreDiameter: 10e-6, porosity: 0.9, structure: '2d-through-plane' })), 6.429891e-11),
    ).toBeLessThan(1e-6);
    // No flow path at or below the percolation porosity.
    expect(tomadakisRobertson({ fibreDiameter: 10e-6, porosity: 0.1, structure: '2d-in-plane' }).permeability).toBeNull();
  });
});

describe('permeability limits and properties', () => {
  const d = 15e-6;
  const dilute: Array<(c: number) => number | null> = [
    (c) => kozenyCarman({ fibreDiameter: d, porosity: 1 - c }).permeability,
    (c) => davies({ fibreDiameter: d, porosity: 1 - c }).permeability,
    (c) => happel({ fibreDiameter: d, porosity: 1 - c, direction: 'across' }).permeability,
    (c) => happel({ fibreDiameter: d, porosity: 1 - c, direction: 'along' }).permeability,
    (c) => jacksonJames({ fibreDiameter: d, porosity: 1 - c }).permeability,
    (c) => tomadakisRobertson({ fibreDiameter: d, porosity: 1 - c, structure: '2d-in-plane' }).permeability,
    (c) => tomadakisRobertson({ fibreDiameter: d, porosity: 1 - c, structure: '3d' }).permeability,
  ];

  it('grows without bound as the solid fraction goes to zero', () => {
    // Physical limit: an empty space offers no resistance.
    for (const f of dilute) {
      expect(f(1e-6) as number).toBeGreaterThan(1e3 * (f(1e-2) as number));
    }
  });

  it('decreases monotonically with solid fraction', () => {
    const cs: number[] = [];
    for (let i = 1; i <= 300; i++) cs.push(0.001 + (i * 0.38) / 300);
    for (const f of dilute) {
      let previous = Number.POSITIVE_INFINITY;
      for (const c of cs) {
        const value = f(c);
        if (value === null) break;
        expect(value).toBeLessThan(previous);
        previous = value;
      }
    }
    for (const packing of ['quadratic', 'hexagonal'] as const) {
      for (const direction of ['across', 'along'] as const) {
        let previous = Number.POSITIVE_INFINITY;
        for (let c = 0.3; c < GEBART_CONSTANTS[packing].maxSolidFraction; c += 0.01) {
          const value = k(gebart({ fibreDiameter: d, porosity: 1 - c, direction, packing }));
          expect(value).toBeLessThan(previous);
          previous = value;
        }
      }
    }
  });

  it('closes Gebart’s across-flow channels at maximum packing (π/4 quadratic, π/(2√3) hexagonal)', () => {
    // Gebart (1992): K⊥ ∝ (√(c_max/c) − 1)^{5/2} → 0 as the fibres touch.
    expect(GEBART_CONSTANTS.quadratic.maxSolidFraction).toBe(Math.PI / 4);
    expect(GEBART_CONSTANTS.hexagonal.maxSolidFraction).toBe(Math.PI / (2 * Math.sqrt(3)));
    for (const packing of ['quadratic', 'hexagonal'] as const) {
      const cMax = GEBART_CONSTANTS[packing].maxSolidFraction;
      const near = k(gebart({ fibreDiameter: d, porosity: 1 - cMax * (1 - 1e-6), direction: 'across', packing }));
      const far = k(gebart({ fibreDiameter: d, porosity: 1 - cMax * 0.8, direction: 'across', packing }));
      expect(near / far).toBeLessThan(1e-12);
      expect(gebart({ fibreDiameter: d, porosity: 1 - cMax * 1.01, direction: 'across', packing }).permeability).toBeNull();
    }
  });

  it('sends Happel’s cell-model permeability to zero as c → 1', () => {
    // Happel (1959): both brackets vanish at c = 1 (fully solid cell).
    for (const direction of ['across', 'along'] as const) {
      expect(k(happel({ fibreDiameter: d, porosity: 1e-4, direction }))).toBeLessThan(1e-10 * d * d);
    }
  });

  it('gives more in-plane than through-plane permeability for 2-D random mats', () => {
    // Layered mats: fibres lying in the plane obstruct through-plane flow more (α larger through-plane).
    for (const eps of [0.5, 0.7, 0.9, 0.97]) {
      const inPlane = k(tomadakisRobertson({ fibreDiameter: d, porosity: eps, structure: '2d-in-plane' }));
      const through = k(tomadakisRobertson({ fibreDiameter: d, porosity: eps, structure: '2d-through-plane' }));
      expect(inPlane).toBeGreaterThan(through);
    }
  });

  it('scales every correlation with d² (dimensional analysis)', () => {
    const a = compareCorrelations({ fibreDiameter: 10e-6, porosity: 0.85 });
    const b = compareCorrelations({ fibreDiameter: 30e-6, porosity: 0.85 });
    a.correlations.forEach((row, i) => {
      if (row.permeability !== null) expect(rel(b.correlations[i].permeability as number, 9 * row.permeability)).toBeLessThan(1e-14);
    });
  });
});

describe('compareCorrelations', () => {
  it('lists every correlation with validity flags and warnings outside the range', () => {
    const r = compareCorrelations({ fibreDiameter: 20e-6, porosity: 0.9 });
    expect(r.correlations.length).toBe(14);
    expect(r.solidFraction).toBeCloseTo(0.1, 15);
    const byId = new Map(r.correlations.map((row) => [row.correlation, row]));
    expect(byId.get('davies')!.inValidityRange).toBeTrue();
    // Gebart is meant for composite preforms (c ≳ 0.35): flagged at c = 0.1.
    const g = byId.get('gebart-across-quadratic')!;
    expect(g.inValidityRange).toBeFalse();
    expect(g.warnings.map((w) => w.code)).toContain('outside-validity');
    expect(r.spreadInRange as number).toBeGreaterThanOrEqual(1);
    expect(rel(k(byId.get('jackson-james')!), k(jacksonJames({ fibreDiameter: 20e-6, porosity: 0.9 })))).toBe(0);
  });

  it('says so when no correlation covers the solid fraction', () => {
    // c = 0.95 exceeds even hexagonal close packing of cylinders, π/(2√3) ≈ 0.907.
    const r = compareCorrelations({ fibreDiameter: 20e-6, porosity: 0.05 });
    expect(r.warnings.map((w) => w.code)).toContain('no-correlation-in-range');
  });

  it('refuses invalid inputs and options', () => {
    expect(() => compareCorrelations({ fibreDiameter: 0, porosity: 0.9 })).toThrowError(DomainError);
    expect(() => kozenyCarman({ fibreDiameter: 1e-5, porosity: 1 })).toThrowError(DomainError);
    expect(() => happel({ fibreDiameter: 1e-5, porosity: 0.9, direction: 'sideways' as never })).toThrowError(DomainError);
    expect(() => tomadakisRobertson({ fibreDiameter: 1e-5, porosity: 0.9, structure: '4d' as never })).toThrowError(
      DomainError,
    );
  });

  it('exposes runnable ModelSpecs', () => {
    const spec = permeabilityModels.find((m) => m.id === 'permeability-compare')!;
    const r = spec.run({ fibreDiameter: 20e-6, porosity: 0.9 }) as { correlations: unknown[] };
    expect(r.correlations.length).toBe(14);
    expect(permeabilityModels.every((m) => m.family === 'permeability')).toBeTrue();
  });
});

describe('correlations with their options fixed once', () => {
  // Identity: the fixed forms are the same formulas as the public functions (no separate reference needed).
  const webs = [0.5, 0.7, 0.85, 0.93, 0.99].map((porosity) => ({ fibreDiameter: 18e-6, porosity }));

  it('give exactly what the public functions give, warnings included', () => {
    for (const input of webs) {
      for (const structure of ['1d-parallel', '1d-perpendicular', '2d-in-plane', '2d-through-plane', '3d'] as const) {
        expect(tomadakisRobertsonWith(structure)(input)).toEqual(tomadakisRobertson({ ...input, structure }));
      }
      for (const direction of ['across', 'along'] as const) {
        expect(happelWith(direction)(input)).toEqual(happel({ ...input, direction }));
        for (const packing of ['quadratic', 'hexagonal'] as const) {
          expect(gebartWith(direction, packing)(input)).toEqual(gebart({ ...input, direction, packing }));
        }
      }
    }
  });

  it('refuse unknown options when made, as the public functions do when called', () => {
    expect(() => tomadakisRobertsonWith('4d' as never)).toThrowMatching((e) => e instanceof DomainError && e.field === 'structure');
    expect(() => happelWith('sideways' as never)).toThrowMatching((e) => e instanceof DomainError && e.field === 'direction');
    expect(() => gebartWith('along', 'cubic' as never)).toThrowMatching((e) => e instanceof DomainError && e.field === 'packing');
  });
});
