import type { ModelSpec, ParameterSpec } from '../api/model-spec';
import { jurinHeight, type JurinHeightInput, surfaceTensionFromRise, type SurfaceTensionFromRiseInput } from './jurin';

const densityParameters: readonly ParameterSpec[] = [
  {
    name: 'liquidDensity',
    label: 'Liquid density',
    unit: 'kg/m^3',
    kind: 'number',
    description: 'Density of the rising liquid.',
  },
  {
    name: 'displacedDensity',
    label: 'Displaced-fluid density',
    unit: 'kg/m^3',
    kind: 'number',
    optional: true,
    default: 1.2,
    description: 'Density of the fluid the liquid displaces (air, 1.2 kg/m³, when omitted).',
  },
  {
    name: 'gravity',
    label: 'Gravity',
    unit: 'm/s^2',
    kind: 'number',
    optional: true,
    default: 9.80665,
    description: 'Acceleration of gravity (standard gravity when omitted).',
  },
];

const radius: ParameterSpec = { name: 'radius', label: 'Tube radius', unit: 'mm', kind: 'number', description: 'Inner radius r of the capillary.' };

export const jurinModels: ModelSpec[] = [
  {
    id: 'jurin-height',
    family: 'jurin',
    title: 'Capillary rise (Jurin)',
    summary:
      'Equilibrium rise h = 2γ cos θ/(Δρ g r) in a tube, with the hemispherical-meniscus correction h − r/3 and the length h/sin α along a tilted tube (Jurin 1718, Rayleigh 1916).',
    parameters: [
      { name: 'surfaceTension', label: 'Surface tension', unit: 'mN/m', kind: 'number', description: 'Liquid surface tension γ.' },
      {
        name: 'contactAngle',
        label: 'Contact angle',
        unit: 'deg',
        kind: 'number',
        default: 0,
        description: 'Contact angle θ on the tube wall; above 90° the liquid is depressed instead of rising.',
      },
      radius,
      {
        name: 'tilt',
        label: 'Tube angle from horizontal',
        unit: 'deg',
        kind: 'number',
        optional: true,
        default: 90,
        description: 'Angle α of the tube from the horizontal (90° = vertical).',
      },
      ...densityParameters,
    ],
    run: (input) => jurinHeight(input as unknown as JurinHeightInput),
  },
  {
    id: 'jurin-surface-tension',
    family: 'jurin',
    title: 'Surface tension from capillary rise',
    summary:
      'Surface tension from a measured rise, γ = ½Δρ g r h/cos θ, and with the meniscus correction γ = ½Δρ g r (h + r/3)/cos θ (Adamson & Gast Ch. II).',
    parameters: [
      { name: 'height', label: 'Measured rise', unit: 'mm', kind: 'number', description: 'Vertical rise h to the bottom of the meniscus.' },
      radius,
      {
        name: 'contactAngle',
        label: 'Contact angle',
        unit: 'deg',
        kind: 'number',
        optional: true,
        default: 0,
        description: 'Contact angle θ on the tube wall, below 90° (0 for a clean glass tube and water).',
      },
      ...densityParameters,
    ],
    run: (input) => surfaceTensionFromRise(input as unknown as SurfaceTensionFromRiseInput),
  },
];
