import { DomainError } from '../errors';
import {
  capillaryPressureFromHydraulicRadius,
  capillaryPressureFromPoreDiameter,
  fibreBed,
  hydraulicRadius,
  hydraulicRadiusFromSurface,
  saturatedCapacity,
  webPorosity,
} from './bed';
import { blendFibres } from './blend';
import { fibreGeometry, linearDensityFromSI, linearDensityToSI } from './fibre';
import { fibreBedModels } from './models';

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}
const deg = (d: number): number => (d * Math.PI) / 180;

// Morton & Hearle, Physical Properties of Textile Fibres, 4th ed. (2008), Table 5.1, dry densities in g/cm³.
const MORTON_HEARLE: Record<string, number> = {
  cotton: 1.55,
  viscose: 1.52,
  acetate: 1.31,
  wool: 1.3,
  silk: 1.34,
  nylon: 1.14,
  PET: 1.39,
  acrylic: 1.19,
  HDPE: 0.95,
  PP: 0.91,
  PLA: 1.25,
  glass: 2.5,
};

describe('fibre geometry from linear density', () => {
  it('gives about 30.6 µm for a 6 denier polypropylene fibre', () => {
    // REFERENCES.md, "Fibres and webs" [P]: PP 6 den (6.7 dtex), ρ = 0.91 g/cm³ → about 30.6 µm (± 0.1 µm).
    const d = fibreGeometry({ linearDensity: linearDensityToSI(6, 'denier'), fibreDensity: 910 }).diameter;
    expect(Math.abs(d * 1e6 - 30.6)).toBeLessThanOrEqual(0.1);
  });

  it('gives about 10 µm for 1 denier polyester', () => {
    // Rule of thumb [P in REFERENCES]: "a 1-denier polyester fibre is about 10 µm"; PET 1.39 g/cm³ (Morton & Hearle).
    const d = fibreGeometry({ linearDensity: linearDensityToSI(1, 'denier'), fibreDensity: 1390 }).diameter;
    expect(Math.abs(d * 1e6 - 10)).toBeLessThan(0.5);
  });

  it('matches d(µm) = 11.284·√(dtex/ρ[g/cm³]) for every fibre of Morton & Hearle Table 5.1', () => {
    // REFERENCES.md [P]: 11.284 = 20/√π, printed to 5 digits.
    for (const rho of Object.values(MORTON_HEARLE)) {
      for (const dtex of [0.5, 1.7, 3.3, 6.7, 17]) {
        const d = fibreGeometry({ linearDensity: linearDensityToSI(dtex, 'dtex'), fibreDensity: rho * 1000 }).diameter;
        expect(rel(d * 1e6, 11.284 * Math.sqrt(dtex / rho))).toBeLessThan(5e-5);
      }
    }
  });

  it('converts tex, dtex and denier by their definitions', () => {
    // tex = g per 1000 m, dtex = g per 10 000 m, denier = g per 9000 m; 1 den = 1.1111 dtex (REFERENCES [P]).
    expect(linearDensityToSI(1, 'tex')).toBe(1e-6);
    expect(rel(linearDensityToSI(1, 'dtex'), 1e-3 / 10000)).toBeLessThan(1e-15);
    expect(rel(linearDensityToSI(9, 'denier'), 1e-6)).toBeLessThan(1e-15);
    expect(Math.abs(linearDensityFromSI(linearDensityToSI(1, 'denier'), 'dtex') - 1.1111)).toBeLessThan(1e-4);
  });

  it('gives S_v = 4/d for round fibres and P/A for a flat ribbon described by its perimeter ratio', () => {
    // Geometry: a circle has perimeter/area = 4/d. A 25:1 ribbon of width 25b and thickness b has P = 52b and
    // A = 25b²; its equal-area diameter is √(100/π)·b, so χ = 52/(π√(100/π)) and S_v must come out as 52/(25b).
    const round = fibreGeometry({ linearDensity: 1.7e-7, fibreDensity: 1390 });
    expect(rel(round.specificSurfaceVolume, 4 / round.diameter)).toBeLessThan(1e-15);
    expect(rel(round.specificSurfaceMass, 4 / (round.diameter * 1390))).toBeLessThan(1e-15);
    const b = 4e-6;
    const chi = 52 / (Math.PI * Math.sqrt(100 / Math.PI));
    const ribbon = fibreGeometry({ linearDensity: 25 * b * b * 1390, fibreDensity: 1390, shapeFactor: chi });
    expect(rel(ribbon.specificSurfaceVolume, 52 / (25 * b))).toBeLessThan(1e-14);
    expect(rel(ribbon.perimeter, 52 * b)).toBeLessThan(1e-14);
  });

  it('refuses a perimeter ratio below 1 (isoperimetric inequality) and non-positive inputs', () => {
    expect(() => fibreGeometry({ linearDensity: 1.7e-7, fibreDensity: 1390, shapeFactor: 0.9 })).toThrowError(
      DomainError,
    );
    expect(() => fibreGeometry({ linearDensity: 0, fibreDensity: 1390 })).toThrowError(DomainError);
  });

  it('warns when the fibre density looks like a unit mistake', () => {
    // 1.39 typed as kg/m³ instead of g/cm³ (Morton & Hearle densities lie in 0.9–2.5 g/cm³).
    const r = fibreGeometry({ linearDensity: 1.7e-7, fibreDensity: 1.39 });
    expect(r.warnings.map((w) => w.code)).toContain('unusual-fibre-density');
  });
});

describe('web porosity and fibre blends', () => {
  it('computes ε = 1 − BW/(ρf t)', () => {
    // Mass balance (REFERENCES [exact]): 40 g/m² of PP (0.91 g/cm³) in 0.5 mm: c = 0.04/(910·0.0005).
    const r = webPorosity({ basisWeight: 0.04, thickness: 0.5e-3, fibreDensity: 910 });
    expect(rel(r.solidFraction, 0.04 / 0.455)).toBeLessThan(1e-15);
    expect(rel(r.porosity, 1 - 0.04 / 0.455)).toBeLessThan(1e-15);
    expect(r.warnings).toEqual([]);
  });

  it('refuses a web denser than its fibres and warns on a very dense one', () => {
    expect(() => webPorosity({ basisWeight: 0.5, thickness: 0.3e-3, fibreDensity: 910 })).toThrowError(
      DomainError,
      /denser than the fibre/,
    );
    const dense = webPorosity({ basisWeight: 0.2, thickness: 0.3e-3, fibreDensity: 910 });
    expect(dense.warnings.map((w) => w.code)).toContain('dense-web');
  });

  it('blends densities by 1/ρf = Σ wᵢ/ρᵢ and keeps volume fractions summing to 1', () => {
    // REFERENCES [exact]; PET 1.39 and viscose 1.52 g/cm³ from Morton & Hearle Table 5.1.
    const r = blendFibres([
      { massFraction: 0.6, fibreDensity: 1390, diameter: 12e-6 },
      { massFraction: 0.4, fibreDensity: 1520, diameter: 11e-6 },
    ]);
    expect(rel(r.fibreDensity, 1 / (0.6 / 1390 + 0.4 / 1520))).toBeLessThan(1e-15);
    expect(Math.abs(r.volumeFractions[0] + r.volumeFractions[1] - 1)).toBeLessThan(1e-15);
    expect(rel(r.volumeFractions[0], (0.6 * r.fibreDensity) / 1390)).toBeLessThan(1e-15);
    // Surface per mass is additive by mass fraction: S_m = Σ wᵢ·4/(ρᵢ dᵢ).
    expect(rel(r.specificSurfaceMass, 0.6 * (4 / (1390 * 12e-6)) + 0.4 * (4 / (1520 * 11e-6)))).toBeLessThan(1e-14);
    // The blend density lies between its components (weighted harmonic mean).
    expect(r.fibreDensity).toBeGreaterThan(1390);
    expect(r.fibreDensity).toBeLessThan(1520);
  });

  it('reduces to the single fibre for a one-component blend, using linear density when no diameter is given', () => {
    const single = fibreGeometry({ linearDensity: 1.7e-7, fibreDensity: 910 });
    const r = blendFibres([{ massFraction: 1, fibreDensity: 910, linearDensity: 1.7e-7 }]);
    expect(r.fibreDensity).toBe(910);
    expect(rel(r.equivalentDiameter, single.diameter)).toBeLessThan(1e-15);
  });

  it('normalises fractions that add up to 1 within rounding and refuses the others', () => {
    const r = blendFibres([
      { massFraction: 0.333, fibreDensity: 910, diameter: 20e-6 },
      { massFraction: 0.667 + 0.002, fibreDensity: 1390, diameter: 12e-6 },
    ]);
    expect(r.warnings.map((w) => w.code)).toContain('mass-fractions-normalised');
    expect(() =>
      blendFibres([
        { massFraction: 0.5, fibreDensity: 910, diameter: 20e-6 },
        { massFraction: 0.4, fibreDensity: 1390, diameter: 12e-6 },
      ]),
    ).toThrowError(DomainError, /add up/);
    expect(() => blendFibres([{ massFraction: 1, fibreDensity: 910 }])).toThrowError(DomainError);
    expect(() => blendFibres([])).toThrowError(DomainError);
  });

  it('warns when a given diameter contradicts the linear density', () => {
    const r = blendFibres([{ massFraction: 1, fibreDensity: 910, diameter: 30e-6, linearDensity: 1.7e-7 }]);
    expect(r.warnings.map((w) => w.code)).toContain('diameter-mismatch');
  });
});

describe('hydraulic radius, capillary pressure and capacity', () => {
  it('uses r_h = ε d/(4(1 − ε)) = ε/((1 − ε) S_v) (Carman 1937 convention)', () => {
    const d = 20e-6;
    expect(rel(hydraulicRadius(0.9, d), (0.9 * d) / (4 * 0.1))).toBeLessThan(1e-15);
    expect(rel(hydraulicRadius(0.9, d), hydraulicRadiusFromSurface(0.9, 4 / d))).toBeLessThan(1e-15);
    // A non-round fibre with perimeter ratio χ wets χ times more surface: r_h falls by χ.
    expect(rel(hydraulicRadius(0.9, d, 1.4), hydraulicRadius(0.9, d) / 1.4)).toBeLessThan(1e-15);
  });

  it('gives 2γ cos θ/r for a round tube in both conventions (Young–Laplace)', () => {
    // Round tube of radius r: flow area πr² over wetted perimeter 2πr gives r_h = r/2; pore diameter D = 2r.
    const r = 50e-6;
    const gamma = 0.072;
    const theta = deg(40);
    const young = (2 * gamma * Math.cos(theta)) / r;
    expect(rel(capillaryPressureFromHydraulicRadius(gamma, theta, r / 2), young)).toBeLessThan(1e-15);
    expect(rel(capillaryPressureFromPoreDiameter(gamma, theta, 2 * r), young)).toBeLessThan(1e-15);
    expect(capillaryPressureFromHydraulicRadius(gamma, deg(120), r / 2)).toBeLessThan(0);
  });

  it('gives saturated capacity ρ_l ε t per area and ρ_l ε/(ρf(1 − ε)) per mass, consistent with BW', () => {
    // Identity: per-mass capacity = per-area capacity / basis weight, with BW = ρf (1 − ε) t.
    const eps = 0.912;
    const t = 0.5e-3;
    const cap = saturatedCapacity(eps, t, 910, 998);
    expect(rel(cap.perArea, 998 * eps * t)).toBeLessThan(1e-15);
    expect(rel(cap.perMass, cap.perArea / (910 * (1 - eps) * t))).toBeLessThan(1e-14);
  });

  it('combines blend, porosity, hydraulic radius, Pc and capacity for a web', () => {
    // Invented airlaid web: 60 % PET 12 µm + 40 % viscose 1.7 dtex, 80 g/m², 1.2 mm; water 72 mN/m, θ = 30°.
    const r = fibreBed({
      basisWeight: 0.08,
      thickness: 1.2e-3,
      fibres: [
        { massFraction: 0.6, fibreDensity: 1390, diameter: 12e-6 },
        { massFraction: 0.4, fibreDensity: 1520, linearDensity: 1.7e-7 },
      ],
      surfaceTension: 0.072,
      contactAngle: deg(30),
      liquidDensity: 998,
      poreDiameter: 60e-6,
    });
    const blend = blendFibres([
      { massFraction: 0.6, fibreDensity: 1390, diameter: 12e-6 },
      { massFraction: 0.4, fibreDensity: 1520, linearDensity: 1.7e-7 },
    ]);
    expect(rel(r.porosity, 1 - 0.08 / (blend.fibreDensity * 1.2e-3))).toBeLessThan(1e-15);
    expect(rel(r.hydraulicRadius, hydraulicRadiusFromSurface(r.porosity, blend.specificSurfaceVolume))).toBeLessThan(
      1e-15,
    );
    expect(rel(r.capillaryPressure as number, (0.072 * Math.cos(deg(30))) / r.hydraulicRadius)).toBeLessThan(1e-15);
    expect(rel(r.capillaryPressureFromPores as number, (4 * 0.072 * Math.cos(deg(30))) / 60e-6)).toBeLessThan(1e-15);
    expect(rel(r.capacityPerMass as number, (r.capacityPerArea as number) / 0.08)).toBeLessThan(1e-14);
    expect(rel(r.bedSpecificSurface, (1 - r.porosity) * blend.specificSurfaceVolume)).toBeLessThan(1e-15);
  });

  it('leaves liquid results empty without liquid data and warns for non-wetting liquids', () => {
    const fibres = [{ massFraction: 1, fibreDensity: 910, diameter: 20e-6 }];
    const dry = fibreBed({ basisWeight: 0.05, thickness: 1e-3, fibres, poreDiameter: 50e-6 });
    expect(dry.capillaryPressure).toBeNull();
    expect(dry.capacityPerArea).toBeNull();
    expect(dry.warnings.map((w) => w.code)).toContain('pc-not-computed');
    const wet = fibreBed({ basisWeight: 0.05, thickness: 1e-3, fibres, surfaceTension: 0.072, contactAngle: deg(105) });
    expect(wet.warnings.map((w) => w.code)).toContain('non-wetting');
    expect(wet.capillaryPressure as number).toBeLessThan(0);
  });

  it('exposes runnable ModelSpecs', () => {
    const ids = fibreBedModels.map((m) => m.id);
    expect(ids).toEqual(['fibre-diameter', 'web-porosity', 'fibre-blend', 'fibre-bed']);
    const r = fibreBedModels[0].run({ linearDensity: 6.7e-7, fibreDensity: 910 }) as { diameter: number };
    expect(Math.abs(r.diameter * 1e6 - 30.6)).toBeLessThanOrEqual(0.1);
  });
});
