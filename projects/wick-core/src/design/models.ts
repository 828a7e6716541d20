import type { ModelSpec } from '../api/model-spec';
import { evaluateVariant } from './evaluate';
import { DEFAULT_VARIANT_OPTIONS, type VariantInputs } from './variant';

/**
 * An invented acquisition-layer strip in saline with one toleranced input (no real product): the registry's
 * example and the browser's warm-up case for the live band.
 */
export const VARIANT_EXAMPLE: VariantInputs = {
  configuration: 'vertical-strip',
  structure: {
    linearDensity: 6.7e-7,
    fibreDensity: 1390,
    basisWeight: 0.05,
    thickness: 0.0012,
    contactAngle: 0.96,
    permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' },
  },
  liquid: { ref: 'saline-0.9', temperature: 296.15 },
  dimensions: { width: 0.025, duration: 600 },
  checkpoints: { heights: [0.01, 0.02], times: [10, 60, 600] },
  tolerances: { basisWeight: { kind: 'normal', sd: 0.0025, lower: 0 } },
};

/** The design family as the model registry lists it: one model, a whole variant per request. */
export const designModels: ModelSpec[] = [
  {
    id: 'design-variant',
    family: 'design',
    title: 'Design variant: wicking estimate for one layer',
    summary:
      'Curves with and without gravity, checkpoints, uptake, capacity, capillary pressure and permeability used, ' +
      'pore-size profile, Kelvin radius, and P10/P50/P90 bands with a tornado ranking, composed from the ' +
      'fibre-bed, permeability, washburn, pore-size, kelvin and tolerance families.',
    parameters: [
      {
        name: 'variant',
        label: 'Variant inputs',
        unit: '',
        kind: 'object',
        description: 'A VariantInputs object in SI units (configuration, structure or capillary, liquid, dimensions, checkpoints, tolerances).',
      },
      {
        name: 'curvePoints',
        label: 'Curve points',
        unit: '1',
        kind: 'number',
        optional: true,
        default: DEFAULT_VARIANT_OPTIONS.curvePoints,
        description: 'Points of the time curves (2 … 5,000).',
      },
      {
        name: 'samples',
        label: 'Monte Carlo samples',
        unit: '1',
        kind: 'number',
        optional: true,
        default: DEFAULT_VARIANT_OPTIONS.samples,
        description: 'Samples for the tolerance bands (10 … 20,000).',
      },
      {
        name: 'seed',
        label: 'Random seed',
        unit: '1',
        kind: 'number',
        optional: true,
        default: DEFAULT_VARIANT_OPTIONS.seed,
        description: 'Seed of the sampler: same seed, same bands.',
      },
    ],
    run: (input) => {
      const i = input as { variant: unknown; curvePoints: number; samples: number; seed: number };
      return evaluateVariant(i.variant, { curvePoints: i.curvePoints, samples: i.samples, seed: i.seed });
    },
  },
];
