import type { ModelSpec, ParameterSpec } from '../api/model-spec';
import { fibreBed, webPorosity, type FibreBedInput, type WebPorosityInput } from './bed';
import { blendFibres, type BlendComponent } from './blend';
import { fibreGeometry, type FibreGeometryInput } from './fibre';

const fibreDensity: ParameterSpec = {
  name: 'fibreDensity',
  label: 'Fibre density',
  unit: 'g/cm^3',
  kind: 'number',
  description: 'Density of the fibre polymer (e.g. PP 0.91, PET 1.39, viscose 1.52 g/cm³).',
};
const basisWeight: ParameterSpec = {
  name: 'basisWeight',
  label: 'Basis weight',
  unit: 'g/m^2',
  kind: 'number',
  description: 'Mass per area of the web.',
};
const thickness: ParameterSpec = {
  name: 'thickness',
  label: 'Thickness',
  unit: 'mm',
  kind: 'number',
  description: 'Thickness of the web, measured under a low stated pressure.',
};
const components: ParameterSpec = {
  name: 'fibres',
  label: 'Fibre blend',
  unit: '',
  kind: 'object',
  description:
    'List of components { massFraction, fibreDensity (kg/m³), diameter (m) or linearDensity (kg/m), ' +
    'shapeFactor?, name? } in SI units; mass fractions add up to 1.',
};

export const fibreBedModels: ModelSpec[] = [
  {
    id: 'fibre-diameter',
    family: 'fibre-bed',
    title: 'Fibre diameter from linear density',
    summary:
      'Equivalent round diameter d = √(4λ/(πρ)) and specific surface 4χ/d of a fibre from its linear density ' +
      '(dtex, denier, tex) and density (Morton & Hearle 2008).',
    parameters: [
      {
        name: 'linearDensity',
        label: 'Linear density',
        unit: 'dtex',
        kind: 'number',
        description: 'Fineness of the fibre (dtex, denier or tex).',
      },
      fibreDensity,
      {
        name: 'shapeFactor',
        label: 'Perimeter ratio',
        unit: '1',
        kind: 'number',
        optional: true,
        default: 1,
        description: 'Perimeter of the cross-section over that of a circle of equal area (1 for round fibres).',
      },
    ],
    run: (input) => fibreGeometry(input as unknown as FibreGeometryInput),
  },
  {
    id: 'web-porosity',
    family: 'fibre-bed',
    title: 'Web porosity from basis weight',
    summary: 'Porosity ε = 1 − BW/(ρf t) of a fibre web from basis weight, thickness and fibre density (mass balance).',
    parameters: [basisWeight, thickness, fibreDensity],
    run: (input) => webPorosity(input as unknown as WebPorosityInput),
  },
  {
    id: 'fibre-blend',
    family: 'fibre-bed',
    title: 'Fibre blend density and specific surface',
    summary:
      'Blend density 1/ρf = Σ wᵢ/ρᵢ, volume fractions and specific surface of a fibre blend by mass fraction ' +
      '(exact volume and area balances).',
    parameters: [{ ...components, name: 'components' }],
    run: (input) => blendFibres((input as { components: BlendComponent[] }).components),
  },
  {
    id: 'fibre-bed',
    family: 'fibre-bed',
    title: 'Fibre web: porosity, hydraulic radius, capillary pressure, capacity',
    summary:
      'Porosity, hydraulic radius r_h = ε/((1 − ε)S_v), capillary pressure γ cos θ/r_h and saturated capacity ' +
      '(g/m², g/g) of a fibre web from its basis weight, thickness and fibre blend (Carman 1937).',
    parameters: [
      basisWeight,
      thickness,
      components,
      {
        name: 'surfaceTension',
        label: 'Surface tension',
        unit: 'mN/m',
        kind: 'number',
        optional: true,
        description: 'Surface tension of the liquid; enables the capillary pressure.',
      },
      {
        name: 'contactAngle',
        label: 'Contact angle',
        unit: 'deg',
        kind: 'number',
        optional: true,
        default: 0,
        description: 'Contact angle of the liquid on the fibres.',
      },
      {
        name: 'liquidDensity',
        label: 'Liquid density',
        unit: 'kg/m^3',
        kind: 'number',
        optional: true,
        description: 'Density of the liquid; enables the saturated capacity.',
      },
      {
        name: 'poreDiameter',
        label: 'Measured pore diameter',
        unit: 'um',
        kind: 'number',
        optional: true,
        description: 'Mean-flow or mean pore diameter from porometry; gives Pc = 4γ cos θ/D for comparison.',
      },
    ],
    run: (input) => fibreBed(input as unknown as FibreBedInput),
  },
];
