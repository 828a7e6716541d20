import type { ModelSpec, ParameterSpec } from '../api/model-spec';
import {
  compareCorrelations,
  davies,
  gebart,
  happel,
  jacksonJames,
  kozenyCarman,
  tomadakisRobertson,
  TOMADAKIS_PARAMETERS,
  type CompareCorrelationsInput,
  type GebartPacking,
  type PermeabilityInput,
  type TomadakisStructure,
} from './correlations';

const fibreDiameter: ParameterSpec = {
  name: 'fibreDiameter',
  label: 'Fibre diameter',
  unit: 'um',
  kind: 'number',
  description: 'Fibre diameter (for a blend, the surface-equivalent diameter 4/S_v).',
};
const porosity: ParameterSpec = {
  name: 'porosity',
  label: 'Porosity',
  unit: '1',
  kind: 'number',
  description: 'Void fraction of the bed, between 0 and 1.',
};
const direction: ParameterSpec = {
  name: 'direction',
  label: 'Flow direction',
  unit: '',
  kind: 'string',
  choices: ['across', 'along'],
  description: 'Flow across (perpendicular to) or along (parallel to) aligned fibres.',
};

type Dir = { direction: 'across' | 'along' };

export const permeabilityModels: ModelSpec[] = [
  {
    id: 'permeability-compare',
    family: 'permeability',
    title: 'Fibre-bed permeability: all correlations side by side',
    summary:
      'Darcy permeability of a fibre bed from Kozeny–Carman, Davies, Happel, Jackson & James, Gebart and ' +
      'Tomadakis & Robertson, each flagged inside or outside its validity range.',
    parameters: [
      fibreDiameter,
      porosity,
      {
        name: 'kozenyConstant',
        label: 'Kozeny constant',
        unit: '1',
        kind: 'number',
        optional: true,
        default: 5,
        description: 'Constant of the Kozeny–Carman row (Carman: 5).',
      },
    ],
    run: (input) => compareCorrelations(input as unknown as CompareCorrelationsInput),
  },
  {
    id: 'permeability-kozeny-carman',
    family: 'permeability',
    title: 'Kozeny–Carman permeability',
    summary: 'K = d²ε³/(16 k (1 − ε)²) for a bed of round fibres (Carman 1937), k = 5 by default.',
    parameters: [
      fibreDiameter,
      porosity,
      { name: 'kozenyConstant', label: 'Kozeny constant', unit: '1', kind: 'number', optional: true, default: 5, description: 'Kozeny constant.' },
    ],
    run: (input) => kozenyCarman(input as unknown as PermeabilityInput & { kozenyConstant?: number }),
  },
  {
    id: 'permeability-davies',
    family: 'permeability',
    title: 'Davies permeability',
    summary: 'K = d²/(64 c^1.5 (1 + 56 c³)) for fibrous filters, 0.006 ≤ c ≤ 0.3 (Davies 1952).',
    parameters: [fibreDiameter, porosity],
    run: (input) => davies(input as unknown as PermeabilityInput),
  },
  {
    id: 'permeability-happel',
    family: 'permeability',
    title: 'Happel cell-model permeability',
    summary: 'Free-surface cell model for flow across or along fibre arrays (Happel 1959).',
    parameters: [fibreDiameter, porosity, direction],
    run: (input) => happel(input as unknown as PermeabilityInput & Dir),
  },
  {
    id: 'permeability-jackson-james',
    family: 'permeability',
    title: 'Jackson & James permeability',
    summary: 'K = (3r²/20c)(−ln c − 0.931) for 3-D random fibre networks (Jackson & James 1986).',
    parameters: [fibreDiameter, porosity],
    run: (input) => jacksonJames(input as unknown as PermeabilityInput),
  },
  {
    id: 'permeability-gebart',
    family: 'permeability',
    title: 'Gebart permeability',
    summary: 'Flow along or across ordered unidirectional fibres, quadratic or hexagonal packing (Gebart 1992).',
    parameters: [
      fibreDiameter,
      porosity,
      direction,
      {
        name: 'packing',
        label: 'Packing',
        unit: '',
        kind: 'string',
        optional: true,
        default: 'quadratic',
        choices: ['quadratic', 'hexagonal'],
        description: 'Arrangement of the fibres.',
      },
    ],
    run: (input) => gebart(input as unknown as PermeabilityInput & Dir & { packing?: GebartPacking }),
  },
  {
    id: 'permeability-tomadakis-robertson',
    family: 'permeability',
    title: 'Tomadakis & Robertson permeability',
    summary:
      'Percolation-type correlation for random fibre structures, in-plane and through-plane for 2-D mats ' +
      '(Tomadakis & Robertson 2005).',
    parameters: [
      fibreDiameter,
      porosity,
      {
        name: 'structure',
        label: 'Structure',
        unit: '',
        kind: 'string',
        optional: true,
        default: '2d-in-plane',
        choices: Object.keys(TOMADAKIS_PARAMETERS),
        description: 'Fibre arrangement and flow direction.',
      },
    ],
    run: (input) => tomadakisRobertson(input as unknown as PermeabilityInput & { structure?: TomadakisStructure }),
  },
];
