import { STANDARD_GRAVITY } from '../constants';
import { DomainError } from '../errors';
import { gravityCurve } from '../washburn/gravity';
import { monteCarloCurve } from '../tolerance/monte-carlo';
import { evaluateVariant, curveTimes } from './evaluate';
import { percentileBands } from './band';
import { fixtureKeys, fixtureMismatches, type VariantFixture } from './fixture';
import fixtureJson from './fixture/variants.json';
import type { VariantInputs, VariantResults, VariantResultsOk } from './variant';

const deg = (d: number) => (d * Math.PI) / 180;
const C = (c: number) => c + 273.15;

function ok(r: VariantResults): VariantResultsOk {
  if (r.status !== 'ok') throw new Error(`expected results, got ${r.status}`);
  return r;
}

/** A plain vertical strip: PET staple-fibre web in water, values typical of an acquisition layer (invented). */
function strip(overrides: Partial<VariantInputs> = {}): VariantInputs {
  return {
    configuration: 'vertical-strip',
    structure: {
      fibreDiameter: 20e-6,
      fibreDensity: 1390,
      basisWeight: 0.05,
      thickness: 0.001,
      contactAngle: deg(50),
      permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' },
    },
    liquid: { ref: 'water', temperature: C(20) },
    dimensions: { width: 0.025, duration: 600 },
    checkpoints: { heights: [0.01, 0.02], times: [10, 60, 600] },
    ...overrides,
  };
}

/** Textbook water of Çengel & Cimbala, Example 2-6: σ = 0.073 N/m, ρ = 1000 kg/m³. */
const TEXTBOOK_WATER = { name: 'textbook water', surfaceTension: 0.073, viscosity: 0.001, density: 1000 };

describe('evaluateVariant: single capillary', () => {
  it('reproduces a worked capillary-rise example', () => {
    const r = ok(
      evaluateVariant({
        configuration: 'capillary',
        capillary: { radius: 0.0003, contactAngle: 0 },
        liquid: { ref: TEXTBOOK_WATER, temperature: C(20) },
        dimensions: { duration: 60 },
        checkpoints: { heights: [0.01], times: [60] },
      }),
    );
    // Çengel & Cimbala, Fluid Mechanics, Example 2-6: D = 0.6 mm, σ = 0.073 N/m, θ = 0 → h ≈ 5.0 cm (0.0496 m
    // with g = 9.81; standard gravity 9.80665 changes the fourth digit only).
    expect(r.equilibriumHeight!).toBeCloseTo(0.0496, 3);
    // Young–Laplace for a tube, 2σ/r (Adamson & Gast §II-2): 2 × 0.073 / 0.0003 Pa.
    expect(r.capillaryPressure.value).toBeCloseTo(486.667, 2);
  });

  it('follows the dimensionless Lucas–Washburn solution at T = 0.01, 1 and 5', () => {
    const base = ok(
      evaluateVariant({
        configuration: 'capillary',
        capillary: { radius: 0.0001, contactAngle: deg(20) },
        liquid: { ref: TEXTBOOK_WATER, temperature: C(20) },
        dimensions: { duration: 10 },
        checkpoints: { heights: [0.01], times: [1] },
      }),
    );
    const tStar = base.characteristicTime!;
    const heq = base.equilibriumLength!;
    const r = ok(
      evaluateVariant({
        configuration: 'capillary',
        capillary: { radius: 0.0001, contactAngle: deg(20) },
        liquid: { ref: TEXTBOOK_WATER, temperature: C(20) },
        dimensions: { duration: 10 * tStar },
        checkpoints: { heights: [0.5 * heq], times: [0.01 * tStar, tStar, 5 * tStar] },
      }),
    );
    // REFERENCES "Lucas–Washburn with gravity": H(T) check rows [C, 30-digit arithmetic] after Fries & Dreyer (2008).
    expect(r.atTimes[0].height / heq).toBeCloseTo(0.134834751067, 10);
    expect(r.atTimes[1].height / heq).toBeCloseTo(0.841405660437, 10);
    expect(r.atTimes[2].height / heq).toBeCloseTo(0.997515080665, 10);
    // Inverse: T(H) = −H − ln(1 − H) (Washburn 1921 implicit solution) at H = 0.5.
    expect(r.toHeights[0].time! / tStar).toBeCloseTo(-0.5 - Math.log(0.5), 10);
  });
});

describe('evaluateVariant: strips', () => {
  it('gives porosity from the mass balance, the Carman hydraulic radius and its capillary pressure', () => {
    const r = ok(evaluateVariant(strip()));
    // ε = 1 − BW/(ρf t) (REFERENCES, fibres and webs [exact]): 1 − 0.05/(1390 × 0.001).
    const eps = 1 - 0.05 / 1.39;
    expect(r.structure!.porosity).toBeCloseTo(eps, 14);
    // r_h = ε d/(4(1 − ε)) (Carman 1937 convention, REFERENCES [exact geometry]).
    expect(r.structure!.hydraulicRadius).toBeCloseTo((eps * 20e-6) / (4 * (1 - eps)), 18);
    // Pc = γ cos θ / r_h; water at 20 °C γ = 72.74 mN/m (IAPWS R1-76(2014) printed table).
    expect(r.capillaryPressure.value).toBeCloseTo((0.07274 * Math.cos(deg(50))) / r.structure!.hydraulicRadius, -1);
  });

  it('takes the fibre diameter from the linear density: PP 6 den is about 30.6 µm', () => {
    const s = strip().structure!;
    const r = ok(
      evaluateVariant(
        strip({ structure: { ...s, fibreDiameter: undefined, linearDensity: (6 / 9) * 1e-6, fibreDensity: 910, thickness: 0.003 } }),
      ),
    );
    // REFERENCES, fibres: PP 6 den (6.7 dtex), ρ = 0.91 g/cm³ → about 30.6 µm [P; to ±0.1 µm].
    expect(Math.abs(r.structure!.fibreDiameter - 30.6e-6)).toBeLessThan(0.1e-6);
  });

  it('levels off at the equilibrium height Pc/(ρ g) and stays below the gravity-free curve', () => {
    const r = ok(evaluateVariant(strip({ dimensions: { width: 0.025, duration: 20000 } }), { curvePoints: 400 }));
    // Green & Ampt sharp front with gravity: h_eq = Pc/(ρ g) (porous-strip model; Jurin's law for a tube).
    expect(r.equilibriumHeight!).toBeCloseTo(r.capillaryPressure.value / (r.liquid.density * STANDARD_GRAVITY), 12);
    const h = r.curves.height;
    const h0 = r.curves.heightNoGravity;
    for (let i = 1; i < h.length; i++) {
      // Property: monotone in time, never above equilibrium, gravity only slows the rise.
      expect(h[i]).toBeGreaterThanOrEqual(h[i - 1]);
      expect(h[i]).toBeLessThanOrEqual(r.equilibriumHeight! * (1 + 1e-12));
      expect(h[i]).toBeLessThanOrEqual(h0[i]);
    }
    expect(h[h.length - 1] / r.equilibriumHeight!).toBeGreaterThan(0.999);
  });

  it('horizontal: h² = 2at (Washburn 1921), no gravity term, and mass m = ρ ε w t h', () => {
    const r = ok(evaluateVariant(strip({ configuration: 'horizontal-strip' })));
    expect(r.coefficients.b).toBe(0);
    expect(r.equilibriumHeight).toBeNull();
    for (const c of r.atTimes) {
      expect((c.height * c.height) / c.time).toBeCloseTo(2 * r.coefficients.a, 15);
      expect(c.heightNoGravity).toBe(c.height);
      // Volume balance behind a saturated front (Green & Ampt 1911).
      expect(c.mass!).toBeCloseTo(r.liquid.density * r.structure!.porosity * 0.025 * 0.001 * c.height, 15);
    }
  });

  it('inclined: the equilibrium length along the strip is the vertical height over sin α', () => {
    const r = ok(evaluateVariant(strip({ configuration: 'inclined-strip', dimensions: { width: 0.025, tilt: deg(30), duration: 600 } })));
    // Geometry of the tilted strip (exact): L_eq = h_eq / sin α.
    expect(r.equilibriumLength!).toBeCloseTo(r.equilibriumHeight! / Math.sin(deg(30)), 12);
  });

  it('stops the front at the top of a short strip and says so', () => {
    const r = ok(evaluateVariant(strip({ configuration: 'horizontal-strip', dimensions: { width: 0.025, length: 0.03, duration: 600 } })));
    expect(Math.max(...r.curves.height)).toBe(0.03);
    expect(r.warnings.map((w) => w.code)).toContain('reaches-top');
  });

  it('saturated capacity: C_A = ρ ε t and C_m = C_A / BW (pore-volume balance)', () => {
    const r = ok(evaluateVariant(strip()));
    expect(r.capacity!.perArea).toBeCloseTo(r.liquid.density * r.structure!.porosity * 0.001, 14);
    expect(r.capacity!.perMass * 0.05).toBeCloseTo(r.capacity!.perArea, 14);
  });

  it('reports the correlation used with its validity range and warns outside it', () => {
    const s = strip().structure!;
    const r = ok(
      evaluateVariant(strip({ structure: { ...s, permeability: { mode: 'correlation', correlation: 'gebart-along-quadratic' } } })),
    );
    expect(r.permeability.correlation).toBe('gebart-along-quadratic');
    // Gebart (1992) was made for composite preforms (solid fraction ≥ 0.35, from memory): a web at c ≈ 0.036 is outside.
    expect(r.permeability.inValidityRange).toBeFalse();
    expect(r.warnings.map((w) => w.code)).toContain('outside-validity');
  });

  it('gives no results, only a status and a reason, when the liquid does not wet (θ ≥ 90°)', () => {
    const s = strip().structure!;
    const r = evaluateVariant(strip({ structure: { ...s, contactAngle: deg(95) } }));
    expect(r.status).toBe('no-spontaneous-uptake');
    expect(r.capillaryPressure.value).toBeLessThan(0);
    expect(r.warnings.map((w) => w.code)).toContain('no-spontaneous-uptake');
  });
});

describe('evaluateVariant: radial spread, pore sizes, Kelvin radius', () => {
  it('radial: R² ln(R/r0) − (R² − r0²)/2 = 2at at every reading (Marmur 1988, unlimited reservoir)', () => {
    const s = strip().structure!;
    const r = ok(
      evaluateVariant({
        ...strip({ configuration: 'radial-spread' }),
        structure: s,
        dimensions: { sourceRadius: 0.005, duration: 120 },
        checkpoints: { heights: [0.01, 0.02], times: [1, 10, 100] },
      }),
    );
    const r0 = 0.005;
    for (const c of r.atTimes) {
      const R = c.height;
      expect((R * R * Math.log(R / r0) - (R * R - r0 * r0) / 2) / (2 * r.coefficients.a * c.time)).toBeCloseTo(1, 12);
    }
  });

  it('the pore-size profile is the capillary-bundle equilibrium: full at the foot, empty above the largest Jurin height', () => {
    const s = strip().structure!;
    const r = ok(
      evaluateVariant(
        strip({
          structure: {
            ...s,
            poreSize: { form: 'differential', diameters: [20e-6, 40e-6, 80e-6], fractions: [0.2, 0.5, 0.3] },
          },
        }),
      ),
    );
    const p = r.poreSizeProfile!;
    // S(z) = Σ fᵢ over classes whose Jurin height 4γ cos θ/(ρ g Dᵢ) ≥ z (Dullien 1992, capillary bundle).
    expect(p.saturation[0]).toBeCloseTo(1, 12);
    expect(p.saturation[p.saturation.length - 1]).toBeCloseTo(0.2, 12);
    const jurinSmallest = (4 * r.liquid.surfaceTension * Math.cos(deg(50))) / (r.liquid.density * STANDARD_GRAVITY * 20e-6);
    expect(p.height[p.height.length - 1]).toBeCloseTo(jurinSmallest, 10);
  });

  it('Kelvin radius of water at 50 % RH and 25 °C, θ = 0', () => {
    const s = strip().structure!;
    const r = ok(evaluateVariant(strip({ structure: { ...s, contactAngle: 0 }, liquid: { ref: 'water', temperature: C(25) }, humidity: 0.5 })));
    // r_K = −2γVm/(RT ln RH) (Adamson & Gast §XVII-16) with γ = 71.97 mN/m (IAPWS R1-76 table, 25 °C),
    // Vm = 18.01528 g/mol / 997.05 kg/m³ (Tanaka 2001), R = 8.314462618: ≈ 1.515 nm [C].
    const expected = (-2 * 0.07197 * (0.01801528 / 997.05)) / (8.314462618 * 298.15 * Math.log(0.5));
    expect(r.kelvin!.radius! / expected).toBeCloseTo(1, 3);
  });
});

describe('evaluateVariant: tolerances', () => {
  const tolerances: VariantInputs['tolerances'] = {
    basisWeight: { kind: 'normal', sd: 0.003, lower: 0 },
    thickness: { kind: 'uniform', min: 0.0009, max: 0.0011 },
    contactAngle: { kind: 'triangular', min: deg(40), max: deg(60) },
  };

  it('bands are ordered P10 ≤ P50 ≤ P90 at every point and bracket the nominal curve', () => {
    const r = ok(evaluateVariant(strip({ tolerances }), { curvePoints: 300, samples: 800, seed: 3 }));
    const b = r.bands!.curve;
    let inside = 0;
    for (let i = 1; i < b.p10.length; i++) {
      expect(b.p10[i]).toBeLessThanOrEqual(b.p50[i]);
      expect(b.p50[i]).toBeLessThanOrEqual(b.p90[i]);
      if (r.curves.height[i] >= b.p10[i] && r.curves.height[i] <= b.p90[i]) inside++;
    }
    expect(inside).toBe(b.p10.length - 1);
    expect(r.bands!.validSamples).toBe(800);
  });

  it('same seed, same bands; another seed, different bands', () => {
    const a = ok(evaluateVariant(strip({ tolerances }), { samples: 200, seed: 11 }));
    const b = ok(evaluateVariant(strip({ tolerances }), { samples: 200, seed: 11 }));
    const c = ok(evaluateVariant(strip({ tolerances }), { samples: 200, seed: 12 }));
    expect(a.bands).toEqual(b.bands);
    expect(a.bands!.curve.p50).not.toEqual(c.bands!.curve.p50);
  });

  it('tornado: bars sorted by swing; thicker web → higher porosity → lower capillary pressure → lower rise', () => {
    const r = ok(evaluateVariant(strip({ tolerances })));
    const bars = r.tornado!.bars;
    expect(bars.length).toBe(3);
    for (let i = 1; i < bars.length; i++) expect(bars[i - 1].swing).toBeGreaterThanOrEqual(bars[i].swing);
    const thickness = bars.find((b) => b.parameter === 'thickness')!;
    // Pc = γ cos θ / r_h with r_h = ε d/(4(1 − ε)) rising with ε (Carman 1937): the rise at 600 s falls.
    expect(thickness.outputHigh!).toBeLessThan(thickness.outputLow!);
  });

  it('refuses a tolerance on an input the variant does not use', () => {
    expect(() => evaluateVariant(strip({ tolerances: { porosity: { kind: 'uniform', min: 0.9, max: 0.95 } } }))).toThrowMatching(
      (e) => e instanceof DomainError && e.field === 'tolerances.porosity',
    );
  });

  it('percentileBands equals the tolerance family’s monteCarloCurve, draw for draw', () => {
    const times = curveTimes(100, 50);
    const nominal = { a: 1e-4, b: 2e-3 };
    const tol = { a: { kind: 'normal' as const, sd: 2e-5, lower: 0 }, b: { kind: 'uniform' as const, min: 1e-3, max: 3e-3 } };
    const mine = percentileBands(
      { points: 50, scalars: 0, evaluate: (p, out) => void gravityCurve(p.a, p.b, times, out) },
      nominal,
      tol,
      400,
      5,
    );
    const ref = monteCarloCurve((p, out) => gravityCurve(p.a, p.b, times, out), nominal, tol, { samples: 400, seed: 5 });
    expect(Array.from(mine.curve.p10)).toEqual(Array.from(ref.p10));
    expect(Array.from(mine.curve.p50)).toEqual(Array.from(ref.p50));
    expect(Array.from(mine.curve.p90)).toEqual(Array.from(ref.p90));
  });

  it('percentileBands equals monteCarloCurve when curves level off at different points, or pause and rise again', () => {
    // Curves clamped at a strip length L (each sample reaches it at its own time) and held flat over a
    // middle stretch: the statistics skip only the points after the last change of any sample.
    const times = curveTimes(200, 120);
    const L = 0.05;
    const evaluate = (p: { a: number; b: number }, out: Float64Array<ArrayBufferLike> = new Float64Array(times.length)) => {
      gravityCurve(p.a, p.b, times, out);
      for (let i = 40; i < 60; i++) out[i] = out[39];
      for (let i = 0; i < out.length; i++) out[i] = Math.min(out[i], L);
      return out;
    };
    const nominal = { a: 1e-4, b: 2e-3 };
    const tol = { a: { kind: 'normal' as const, sd: 3e-5, lower: 0 }, b: { kind: 'uniform' as const, min: 1e-3, max: 3e-3 } };
    const mine = percentileBands({ points: 120, scalars: 0, evaluate: (p, out) => void evaluate(p, out) }, nominal, tol, 500, 9);
    const ref = monteCarloCurve(evaluate, nominal, tol, { samples: 500, seed: 9 });
    expect(Array.from(mine.curve.p10)).toEqual(Array.from(ref.p10));
    expect(Array.from(mine.curve.p50)).toEqual(Array.from(ref.p50));
    expect(Array.from(mine.curve.p90)).toEqual(Array.from(ref.p90));
    // Some samples reach L and some do not within the record (h_eq = a/b straddles it): both kinds are present.
    expect(mine.curve.p90[119]).toBe(L);
    expect(mine.curve.p10[119]).toBeLessThan(L);
  });
});

describe('evaluateVariant: invalid inputs name their field', () => {
  const s = strip().structure!;
  const cases: [string, unknown, string][] = [
    ['negative thickness', strip({ structure: { ...s, thickness: -0.001 } }), 'structure.thickness'],
    ['web denser than its fibres', strip({ structure: { ...s, thickness: 0.00001 } }), 'structure.thickness'],
    ['zero basis weight', strip({ structure: { ...s, basisWeight: 0 } }), 'structure.basisWeight'],
    ['no fibre size', strip({ structure: { ...s, fibreDiameter: undefined } }), 'structure.fibreDiameter'],
    ['text for a number', strip({ structure: { ...s, fibreDensity: '1.38' as unknown as number } }), 'structure.fibreDensity'],
    ['contact angle above 180°', strip({ structure: { ...s, contactAngle: 4 } }), 'structure.contactAngle'],
    ['porosity 1', strip({ structure: { ...s, porosity: 1 } }), 'structure.porosity'],
    ['negative measured permeability', strip({ structure: { ...s, permeability: { mode: 'measured', value: -1 } } }), 'structure.permeability.value'],
    ['unknown correlation', strip({ structure: { ...s, permeability: { mode: 'correlation', correlation: 'nope' as never } } }), 'structure.permeability.correlation'],
    ['unknown liquid', strip({ liquid: { ref: 'mercury', temperature: 293.15 } }), 'liquid.ref'],
    ['temperature in °C by mistake', strip({ liquid: { ref: 'water', temperature: 20 } }), 'liquid.temperature'],
    ['strip without width', strip({ dimensions: { duration: 60 } }), 'dimensions.width'],
    ['zero duration', strip({ dimensions: { width: 0.02, duration: 0 } }), 'dimensions.duration'],
    ['inclined without tilt', strip({ configuration: 'inclined-strip' }), 'dimensions.tilt'],
    ['negative reading time', strip({ checkpoints: { heights: [0.01], times: [10, -5] } }), 'checkpoints.times[1]'],
    ['radial target inside the spot', { ...strip({ configuration: 'radial-spread' }), dimensions: { sourceRadius: 0.01, duration: 60 }, checkpoints: { heights: [0.005], times: [10] } }, 'checkpoints.heights[0]'],
    ['humidity 100 %', strip({ humidity: 1 }), 'humidity'],
    ['unknown configuration', { ...strip(), configuration: 'stack' }, 'configuration'],
    ['capillary without radius', { configuration: 'capillary', capillary: { contactAngle: 0 }, liquid: { ref: 'water', temperature: 293.15 }, dimensions: { duration: 10 }, checkpoints: { heights: [], times: [1] } }, 'capillary.radius'],
  ];
  for (const [what, inputs, field] of cases) {
    it(`${what} → DomainError on ${field} with a message`, () => {
      let caught: unknown;
      try {
        evaluateVariant(inputs);
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(DomainError);
      expect((caught as DomainError).field).toBe(field);
      expect((caught as DomainError).message.length).toBeGreaterThan(10);
    });
  }
});

describe('the shared variant fixture', () => {
  const fixture = fixtureJson as unknown as VariantFixture;
  it('has cases for every configuration', () => {
    const configs = new Set(fixture.cases.map((c) => c.inputs.configuration));
    expect([...configs].sort()).toEqual(['capillary', 'horizontal-strip', 'inclined-strip', 'radial-spread', 'vertical-strip']);
  });
  for (const c of fixture.cases) {
    it(`recomputes "${c.name}" to round-off`, () => {
      expect(fixtureMismatches(c.expected, fixtureKeys(evaluateVariant(c.inputs, c.options)))).toEqual([]);
    });
  }
  it('notices a change beyond round-off', () => {
    const c = fixture.cases[0];
    const tampered = { ...c.expected, a: (c.expected['a'] as number) * (1 + 1e-9) };
    expect(fixtureMismatches(tampered, fixtureKeys(evaluateVariant(c.inputs, c.options))).length).toBe(1);
  });
});
