import type { ModelSpec, ParameterSpec } from '../api/model-spec';
import { toPlain } from '../api/plain';
import { poreSizeEquilibrium, type PoreSizeEquilibriumInput } from './equilibrium';
import { poreSizeStatistics } from './statistics';
import { poreSizeUptake, type PoreSizeUptakeInput } from './uptake';
import type { PoreSizeDistributionInput } from './distribution';

const psd: ParameterSpec[] = [
  {
    name: 'diameters',
    label: 'Pore diameters',
    unit: 'um',
    kind: 'number[]',
    description: 'Class diameters, strictly increasing.',
  },
  {
    name: 'fractions',
    label: 'Pore-volume fractions',
    unit: '1',
    kind: 'number[]',
    description: 'One value per class, as fractions of the pore volume (0–1) in the form chosen below.',
  },
  {
    name: 'form',
    label: 'Form of the fractions',
    unit: '',
    kind: 'string',
    choices: ['differential', 'cumulative-finer', 'cumulative-coarser'],
    description:
      'differential: share of each class; cumulative-finer: share in pores of this diameter or smaller (rises to 1); ' +
      'cumulative-coarser: share in pores of this diameter or larger (falls from 1). A total within 5 % of 1 is rescaled with a warning.',
  },
];
const liquid: ParameterSpec[] = [
  { name: 'surfaceTension', label: 'Surface tension', unit: 'mN/m', kind: 'number', description: 'Liquid–air surface tension.' },
  {
    name: 'contactAngle',
    label: 'Contact angle',
    unit: 'deg',
    kind: 'number',
    description: 'Static contact angle on the pore walls; must be below 90°.',
  },
  { name: 'density', label: 'Liquid density', unit: 'kg/m^3', kind: 'number', description: 'Density of the liquid.' },
  {
    name: 'gravity',
    label: 'Gravity',
    unit: 'm/s^2',
    kind: 'number',
    optional: true,
    default: 9.80665,
    description: 'Gravitational acceleration.',
  },
];

export const poreSizeModels: ModelSpec[] = [
  {
    id: 'pore-size-equilibrium',
    family: 'pore-size',
    title: 'Pore-size bundle: equilibrium saturation and retention curve',
    summary:
      'Equilibrium saturation versus height and capillary pressure versus saturation of a layer treated as a bundle of ' +
      'independent capillaries with the given pore-size distribution, each class at its own Jurin height (Jurin 1718).',
    parameters: [
      ...psd,
      ...liquid,
      {
        name: 'heights',
        label: 'Heights',
        unit: 'mm',
        kind: 'number[]',
        optional: true,
        description: 'Heights above the liquid level at which to report the saturation.',
      },
    ],
    run: (input) => toPlain(poreSizeEquilibrium(input as unknown as PoreSizeEquilibriumInput)),
  },
  {
    id: 'pore-size-uptake',
    family: 'pore-size',
    title: 'Pore-size bundle: uptake versus time',
    summary:
      'Saturation and liquid mass versus time of a layer treated as a bundle of independent capillaries (no ' +
      'interconnection), each pore class rising by the gravity-restrained Lucas–Washburn law (Washburn 1921; Fries & Dreyer 2008).',
    parameters: [
      ...psd,
      ...liquid,
      { name: 'viscosity', label: 'Viscosity', unit: 'mPa s', kind: 'number', description: 'Dynamic viscosity of the liquid.' },
      { name: 'porosity', label: 'Porosity', unit: '1', kind: 'number', description: 'Void volume fraction of the layer.' },
      { name: 'thickness', label: 'Layer thickness', unit: 'mm', kind: 'number', description: 'Thickness of the layer.' },
      {
        name: 'tilt',
        label: 'Tilt from horizontal',
        unit: 'deg',
        kind: 'number',
        optional: true,
        default: 90,
        description: '90° for vertical rise, 0° for horizontal wicking.',
      },
      { name: 'times', label: 'Times', unit: 's', kind: 'number[]', description: 'Times at which to compute the uptake.' },
      {
        name: 'includeClassHeights',
        label: 'Per-class heights',
        unit: '',
        kind: 'boolean',
        optional: true,
        default: false,
        description: 'Also return the wetted length of every class at every time.',
      },
    ],
    run: (input) => toPlain(poreSizeUptake(input as unknown as PoreSizeUptakeInput)),
  },
  {
    id: 'pore-size-statistics',
    family: 'pore-size',
    title: 'Pore-size distribution: mean, median and mode',
    summary:
      'Volume-weighted mean, geometric mean, median (D50, log-interpolated) and mode diameter of a pore-size distribution.',
    parameters: psd,
    run: (input) => toPlain(poreSizeStatistics(input as unknown as PoreSizeDistributionInput)),
  },
];
