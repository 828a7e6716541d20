import { createRng } from '../tolerance/prng';
import { gravityHeight } from '../washburn/gravity';
import { fitGravityWashburn } from './gravity-fit';
import { analyseLabRun, DEFAULT_FIT_SETTINGS, labRunFigures, type LabRunFitInput, replicateFigures } from './lab-run';
import { fitWashburnSlope } from './washburn-slope';

const G = 9.80665;
// Saline-like liquid at about 23 °C (plausible inputs; the checks are identities of the fits, not the data).
const liquid = { surfaceTension: 0.0725, viscosity: 0.95e-3, density: 1004.6 };
const times = Array.from({ length: 40 }, (_, i) => (i + 1) * 15);

function run(over: Partial<LabRunFitInput> = {}, a = 3e-5, b = 5e-4, seed = 1): LabRunFitInput {
  const rng = createRng(seed);
  return {
    times,
    readings: times.map((t) => gravityHeight(a, b, t) + 3e-4 * rng.nextNormal()),
    measurement: 'height',
    orientation: 'vertical',
    tilt: Math.PI / 2,
    liquid,
    porosity: 0.9,
    fit: DEFAULT_FIT_SETTINGS,
    ...over,
  };
}

describe('lab run analysis (both fits of a run, replicate figures)', () => {
  it('gives the same numbers as the two fits called directly, in plain arrays', () => {
    const r = run();
    const a = analyseLabRun(r);
    const w = fitWashburnSlope({ time: r.times, values: r.readings });
    const g = fitGravityWashburn({ time: r.times, values: r.readings, ...liquid, porosity: 0.9 });
    expect(a.washburn!.slope).toBe(w.slope);
    expect(a.gravity!.b.value).toBe(g.b.value);
    expect(Array.isArray(a.gravity!.residuals)).toBeTrue();
    expect(a.gravity!.porousLayer!.permeability.value).toBe(g.porousLayer!.permeability.value);
    // k = ε η b/(ρ g) (Darcy behind the front; fitting/gravity-fit.ts).
    expect(a.gravity!.porousLayer!.permeability.value / ((0.9 * liquid.viscosity * g.b.value) / (liquid.density * G))).toBeCloseTo(1, 12);
    const f = labRunFigures(a);
    expect(f.equilibrium).toBe(g.equilibrium!.value);
    expect(f.washburnSlope).toBe(w.slope);
  });

  it('horizontal runs get no gravity fit; mass runs no radii or permeability; a failing fit is reported, not thrown', () => {
    const flat = analyseLabRun(run({ orientation: 'horizontal', tilt: 0 }));
    expect(flat.gravity).toBeNull();
    expect(flat.gravityError?.code).toBe('no-gravity-term');
    const mass = analyseLabRun(run({ measurement: 'mass' }));
    expect(mass.gravity!.capillary).toBeNull();
    expect(mass.gravity!.porousLayer).toBeNull();
    const narrow = analyseLabRun(run({ fit: { ...DEFAULT_FIT_SETTINGS, window: { start: 15, end: 20 } } }));
    expect(narrow.washburn).toBeNull();
    expect(narrow.washburnError?.code).toBe('insufficient-data');
    expect(narrow.gravity).not.toBeNull();
  });

  it('the inclined tilt enters the gravity term: b = k ρ g sin α/(ε η) gives the same k as a vertical run', () => {
    const alpha = Math.PI / 6;
    // Same layer inclined at 30°: gravity along the strip is g sin α, so b halves (sin 30° = 0.5).
    const incl = analyseLabRun(run({ orientation: 'inclined', tilt: alpha }, 3e-5, 2.5e-4));
    const vert = analyseLabRun(run({}, 3e-5, 5e-4));
    const kIncl = incl.gravity!.porousLayer!.permeability;
    const kVert = vert.gravity!.porousLayer!.permeability;
    expect(Math.abs(kIncl.value - kVert.value)).toBeLessThan(3 * Math.hypot(kIncl.stdError, kVert.stdError));
  });

  it('replicate figures: per-figure mean and outliers, named by run', () => {
    const runs = [1, 2, 3, 4].map((seed) => ({ id: seed, name: `R${seed}`, analysis: analyseLabRun(run({}, seed === 4 ? 1.5e-5 : 3e-5, 5e-4, seed)) }));
    const { figures, warnings } = replicateFigures(runs, 'height');
    const a = figures.find((f) => f.key === 'a')!;
    expect(a.runIds).toEqual([1, 2, 3, 4]);
    expect(a.unit).toBe('m^2/s');
    expect(a.outlierRunIds).toEqual([4]);
    expect(warnings.some((w) => w.code === 'outlier-run' && w.message.includes('R4'))).toBeTrue();
  });
});
