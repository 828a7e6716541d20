import type { ModelSpec } from '../api/model-spec';
import { evaluateVariant } from './evaluate';
import { DEFAULT_VARIANT_OPTIONS } from './variant';

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
