import type { ModelSpec, ParameterSpec } from '../api/model-spec';
import { toPlain } from '../api/plain';
import { timeToHeightTolerance, uptakeBand, type TimeToHeightToleranceInput, type UptakeBandInput } from './capillary-cases';

const capillaryParameters: ParameterSpec[] = [
  { name: 'radius', label: 'Capillary radius', unit: 'um', kind: 'number', description: 'Nominal tube (or effective pore) radius.' },
  { name: 'surfaceTension', label: 'Surface tension', unit: 'mN/m', kind: 'number', description: 'Nominal liquid–air surface tension.' },
  { name: 'contactAngle', label: 'Contact angle', unit: 'deg', kind: 'number', description: 'Nominal static contact angle.' },
  { name: 'viscosity', label: 'Viscosity', unit: 'mPa s', kind: 'number', description: 'Nominal dynamic viscosity.' },
  { name: 'density', label: 'Liquid density', unit: 'kg/m^3', kind: 'number', description: 'Nominal liquid density.' },
  {
    name: 'tilt',
    label: 'Tilt from horizontal',
    unit: 'deg',
    kind: 'number',
    optional: true,
    default: 90,
    description: '90° for vertical rise, 0° for horizontal wicking.',
  },
  {
    name: 'gravity',
    label: 'Gravity',
    unit: 'm/s^2',
    kind: 'number',
    optional: true,
    default: 9.80665,
    description: 'Gravitational acceleration.',
  },
  {
    name: 'tolerances',
    label: 'Tolerances',
    unit: '',
    kind: 'object',
    description:
      'Per uncertain input (radius, surfaceTension, contactAngle, viscosity, density), in SI units (angles in rad): ' +
      '{kind: "normal", sd, mean?, lower?, upper?} | {kind: "uniform", min, max} | {kind: "triangular", min, mode?, max}. ' +
      'Normal tolerances are truncated at the physical bound 0 unless bounds are given.',
  },
  {
    name: 'samples',
    label: 'Samples',
    unit: '1',
    kind: 'number',
    optional: true,
    description: 'Number of Monte Carlo samples (10 … 1,000,000).',
  },
  { name: 'seed', label: 'Random seed', unit: '1', kind: 'number', optional: true, default: 1, description: 'Same seed, same result.' },
];

export const toleranceModels: ModelSpec[] = [
  {
    id: 'tolerance-time-to-height',
    family: 'tolerance',
    title: 'Time to height: tolerance band and tornado ranking',
    summary:
      'P10/P50/P90 of the time for a liquid to wick to a given height in a capillary, by Monte Carlo propagation of ' +
      'input tolerances through the gravity-restrained Lucas–Washburn solution (Washburn 1921; Fries & Dreyer 2008; ' +
      'JCGM 101:2008), with a one-at-a-time tornado ranking of the inputs.',
    parameters: [
      ...capillaryParameters,
      { name: 'height', label: 'Target height', unit: 'mm', kind: 'number', description: 'Wetted length to reach.' },
    ],
    run: (input) => toPlain(timeToHeightTolerance(input as unknown as TimeToHeightToleranceInput)),
  },
  {
    id: 'tolerance-uptake-band',
    family: 'tolerance',
    title: 'Wicking curve: tolerance band',
    summary:
      'P10/P50/P90 band of the wetted length versus time in a capillary, by Monte Carlo propagation of input ' +
      'tolerances through the gravity-restrained Lucas–Washburn solution (Washburn 1921; Fries & Dreyer 2008).',
    parameters: [
      ...capillaryParameters,
      { name: 'times', label: 'Times', unit: 's', kind: 'number[]', description: 'Times at which to give the band.' },
    ],
    run: (input) => toPlain(uptakeBand(input as unknown as UptakeBandInput)),
  },
];
