import type { ModelSpec } from '../api/model-spec';
import { evaluateStackVariant } from './stack-evaluate';
import { DEFAULT_STACK_OPTIONS, type StackVariantInputs } from './stack-variant';

const deg = (d: number) => (d * Math.PI) / 180;

/**
 * An invented three-layer stack (top sheet, through-air-bonded acquisition layer, airlaid core; none of them a
 * real product) with three 15 mL gushes of saline spreading over 80 cm², delivered at 5 mL/s, 5 minutes apart: the registry's
 * example, the form's starting point and the browser benchmark's case.
 */
export const STACK_VARIANT_EXAMPLE: StackVariantInputs = {
  configuration: 'stack',
  layers: [
    {
      name: 'Topsheet',
      structure: {
        fibreDiameter: 18e-6,
        fibreDensity: 910,
        basisWeight: 0.012,
        thickness: 0.25e-3,
        contactAngle: deg(60),
        permeability: { mode: 'measured', value: 5e-11 },
      },
      retention: { mode: 'brooks-corey', entryPressure: 150, lambda: 2 },
    },
    {
      name: 'Acquisition layer',
      structure: {
        fibreDiameter: 25e-6,
        fibreDensity: 1380,
        basisWeight: 0.04,
        thickness: 1.5e-3,
        contactAngle: deg(55),
        permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-through-plane' },
      },
      retention: { mode: 'van-genuchten', alpha: 1 / 400, n: 3 },
    },
    {
      name: 'Core',
      structure: {
        fibreDiameter: 30e-6,
        fibreDensity: 1500,
        basisWeight: 0.3,
        thickness: 6e-3,
        contactAngle: deg(30),
        permeability: { mode: 'measured', value: 2e-11 },
        poreSize: {
          form: 'differential',
          diameters: [20e-6, 40e-6, 60e-6, 90e-6, 130e-6, 180e-6, 250e-6],
          fractions: [0.05, 0.15, 0.25, 0.25, 0.15, 0.1, 0.05],
        },
      },
      retention: { mode: 'pore-size' },
      residualContent: 0.01,
    },
  ],
  liquid: { ref: 'saline-0.9', temperature: 296.15 },
  insult: { volume: 15e-6, rate: 5e-6, area: 80e-4, count: 3, interval: 300 },
  duration: 900,
};

/**
 * The stack variant as the model registry lists it: a whole stack variant per request, evaluated by the same
 * code as the design workspace's Web Worker and the server's saved variants.
 */
export const stackVariantModels: ModelSpec[] = [
  {
    id: 'stack-variant',
    family: 'design',
    title: 'Design variant: layered stack with repeated insults',
    summary:
      'Acquisition time of each gush, liquid left on the surface and in the top layer (rewet indicator), capacity used, ' +
      'mass balance, saturation heat map and uptake curves of a stack of library layers, by the Richards equation ' +
      '(stack-flow) with each layer resolved as a single-layer variant.',
    parameters: [
      {
        name: 'variant',
        label: 'Stack variant inputs',
        unit: '',
        kind: 'object',
        description:
          "A StackVariantInputs object in SI units: configuration 'stack', layers [{name, structure, retention {mode: van-genuchten " +
          '(alpha 1/Pa, n) | brooks-corey (entryPressure Pa, lambda) | pore-size}, residualContent, initialSaturation, cells}], ' +
          'liquid {ref, temperature K}, insult {volume m³, rate m³/s, area m², count, interval s}, duration s, inclination rad, bottom, cells, upperLayers.',
      },
      {
        name: 'snapshots',
        label: 'Snapshots',
        unit: '1',
        kind: 'number',
        optional: true,
        default: DEFAULT_STACK_OPTIONS.snapshots,
        description: 'Saturation profiles stored over the run (11 … 401).',
      },
    ],
    run: (input) => {
      const i = input as { variant: unknown; snapshots: number };
      return evaluateStackVariant(i.variant, { snapshots: i.snapshots });
    },
  },
];
