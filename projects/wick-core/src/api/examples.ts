/**
 * One example request per model, in the units `wick list` shows (strings carry their own). `wick list` prints
 * them, docs/cli.md quotes them, and a test runs every one through the registry, so the CLI answers every model.
 * The inputs are textbook-like values, not data of any real product.
 */
import { VARIANT_EXAMPLE } from '../design/models';

const pp = { massFraction: 0.6, fibreDensity: 910, linearDensity: 1.7e-7, name: 'PP 1.7 dtex' };
const pet = { massFraction: 0.4, fibreDensity: 1390, linearDensity: 3.3e-7, name: 'PET 3.3 dtex' };
const psd = { diameters: [10, 20, 40, 80, 160], fractions: [0.1, 0.25, 0.35, 0.2, 0.1], form: 'differential' };
const t = [1, 2, 5, 10, 20, 40, 60, 90, 120, 180, 240, 300];
// h(t) of a vertical strip with a = 2e-5 m²/s, b = 1e-4 m/s (h_eq = 200 mm), read to the 0.1 mm.
const heights = [0.0063, 0.0089, 0.0139, 0.0195, 0.0271, 0.0372, 0.0447, 0.0538, 0.0611, 0.0728, 0.0822, 0.0901];

export const MODEL_EXAMPLES: Readonly<Record<string, Readonly<Record<string, unknown>>>> = {
  'convert-quantity': { quantity: '3 denier', to: 'dtex' },
  'water-properties': { temperature: 25 },
  'liquid-properties': { liquid: 'saline-0.9', temperature: 23 },
  'young-laplace': { surfaceTension: 72.8, radius1: 500, radius2: 1000 },
  'laplace-sphere': { surfaceTension: 72.8, radius: 1000 },
  'laplace-bubble': { surfaceTension: 25, radius: 5000 },
  'laplace-cylinder': { surfaceTension: 72.8, radius: 15 },
  'capillary-pressure-tube': { surfaceTension: 72.8, contactAngle: 30, radius: 20 },
  'capillary-pressure-slit': { surfaceTension: 72.8, contactAngle: 30, gap: 40 },
  'kelvin-droplet': { radius: 10, temperature: 25 },
  'kelvin-meniscus': { radius: 5, contactAngle: 20, temperature: 25 },
  'kelvin-radius': { relativeHumidity: 80, contactAngle: 0, temperature: 25 },
  'jurin-height': { surfaceTension: 73, contactAngle: 0, radius: 0.3, liquidDensity: 1000, gravity: 9.81 },
  'jurin-surface-tension': { height: 73.6, radius: 0.2, contactAngle: 0, liquidDensity: 997 },
  'washburn-capillary': { radius: 25, surfaceTension: 72.8, viscosity: 1.0, contactAngle: 40, density: 998, times: [10, 60, 600], heights: [10, 50] },
  'washburn-porous-strip': {
    permeability: 2e-11, porosity: 0.9, capillaryPressure: 1500, viscosity: 1.0, density: 1005, width: 25, thickness: 1.2,
  },
  'washburn-radial': { permeability: 2e-11, porosity: 0.9, capillaryPressure: 1500, viscosity: 1.0, sourceRadius: 5, thickness: 1.2 },
  'fibre-diameter': { linearDensity: '6 denier', fibreDensity: 0.91 },
  'web-porosity': { basisWeight: 45, thickness: 0.8, fibreDensity: 0.91 },
  'fibre-blend': { components: [pp, pet] },
  'fibre-bed': { basisWeight: 40, thickness: 0.9, fibres: [pp, pet], surfaceTension: 70, contactAngle: 50, liquidDensity: 1005 },
  'permeability-compare': { fibreDiameter: 20, porosity: 0.9 },
  'permeability-kozeny-carman': { fibreDiameter: 20, porosity: 0.8 },
  'permeability-davies': { fibreDiameter: 20, porosity: 0.9 },
  'permeability-happel': { fibreDiameter: 20, porosity: 0.8, direction: 'across' },
  'permeability-jackson-james': { fibreDiameter: 20, porosity: 0.85 },
  'permeability-gebart': { fibreDiameter: 20, porosity: 0.5, direction: 'along', packing: 'hexagonal' },
  'permeability-tomadakis-robertson': { fibreDiameter: 20, porosity: 0.9, structure: '2d-in-plane' },
  'pore-size-equilibrium': { ...psd, surfaceTension: 70, contactAngle: 40, density: 1005 },
  'pore-size-uptake': { ...psd, surfaceTension: 70, contactAngle: 40, density: 1005, viscosity: 1.0, porosity: 0.9, thickness: 1, times: [1, 10, 60, 300] },
  'pore-size-statistics': psd,
  'tolerance-time-to-height': {
    radius: 30, surfaceTension: 72, contactAngle: 45, viscosity: 1.0, density: 1000, height: 30, samples: 2000, seed: 7,
    tolerances: { radius: { kind: 'normal', sd: 3e-6 }, contactAngle: { kind: 'uniform', min: 0.6, max: 0.9 } },
  },
  'tolerance-uptake-band': {
    radius: 30, surfaceTension: 72, contactAngle: 45, viscosity: 1.0, density: 1000, times: [10, 60, 300], samples: 1000, seed: 7,
    tolerances: { contactAngle: { kind: 'triangular', min: 0.6, mode: 0.78, max: 0.9 } },
  },
  'fit-washburn-slope': { time: t, values: heights },
  'fit-gravity-washburn': { time: t, values: heights, ...{ surfaceTension: 70, contactAngle: 40, density: 1005, viscosity: 1.0 } },
  'contact-angle-reference-liquid': {
    // C = 1e-14 m⁵: hexane slopes from m² = C ρ² γ t / η; water at θ = 60° gives half the wetting slope.
    reference: { surfaceTension: 0.01789, density: 655, viscosity: 0.0003, slopes: [2.56e-10, 2.5e-10, 2.6e-10] },
    test: { surfaceTension: 0.0728, density: 998, viscosity: 0.00089, slopes: [4.05e-10, 4.1e-10] },
  },
  'replicate-statistics': { values: [0.081, 0.079, 0.084, 0.080, 0.112] },
  'prediction-error': {
    measured: { time: [10, 60, 300], values: [0.019, 0.044, 0.088] },
    predicted: { time: [10, 60, 300], values: [0.0195, 0.0447, 0.0901] },
    heights: [20, 40],
  },
  'stack-flow': {
    layers: [
      { thickness: 3e-4, porosity: 0.85, retention: { kind: 'van-genuchten', alpha: 1 / 300, n: 3 }, permeability: 5e-11, initialSaturation: 0.02 },
      { thickness: 2e-3, porosity: 0.92, retention: { kind: 'van-genuchten', alpha: 1 / 800, n: 2.6 }, permeability: 8e-11, initialSaturation: 0.02 },
      { thickness: 4e-3, porosity: 0.8, retention: { kind: 'van-genuchten', alpha: 1 / 4000, n: 2.2 }, permeability: 5e-12, initialSaturation: 0.05 },
    ],
    liquid: { density: 1005, viscosity: 1e-3, surfaceTension: 0.07 },
    top: { kind: 'insults', insults: [{ start: 0, volume: 1.5e-3, rate: 3e-4 }] },
    endTime: 120,
    cells: 40,
    snapshots: 5,
  },
  'stack-retention-curve': {
    layer: { thickness: 1e-3, porosity: 0.9, retention: { kind: 'brooks-corey', entryPressure: 800, lambda: 2 }, permeability: 1e-11 },
    liquid: { density: 1000, viscosity: 1e-3 },
    pressures: [0, 500, 1000, 2000, 4000],
  },
  'design-variant': {
    variant: VARIANT_EXAMPLE,
    curvePoints: 100,
    samples: 200,
  },
};
