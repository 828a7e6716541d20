import type { ModelSpec, ParameterSpec } from '../api/model-spec';
import {
  kelvinDroplet,
  type KelvinDropletInput,
  kelvinMeniscus,
  type KelvinMeniscusInput,
  kelvinRadius,
  type KelvinRadiusInput,
} from './kelvin';

const liquidParameters: readonly ParameterSpec[] = [
  {
    name: 'temperature',
    label: 'Temperature',
    unit: 'degC',
    kind: 'number',
    default: 25,
    description: 'Temperature of liquid and vapour.',
  },
  {
    name: 'surfaceTension',
    label: 'Surface tension',
    unit: 'mN/m',
    kind: 'number',
    optional: true,
    description: 'Liquid surface tension γ; water at the temperature (IAPWS R1-76) when omitted.',
  },
  {
    name: 'molarVolume',
    label: 'Molar volume',
    unit: 'm^3/mol',
    kind: 'number',
    optional: true,
    description: 'Liquid molar volume Vm; otherwise molar mass / density.',
  },
  {
    name: 'molarMass',
    label: 'Molar mass',
    unit: 'kg/mol',
    kind: 'number',
    optional: true,
    description: 'Molar mass M of the liquid; water (0.01801528 kg/mol) when omitted.',
  },
  {
    name: 'density',
    label: 'Density',
    unit: 'kg/m^3',
    kind: 'number',
    optional: true,
    description: 'Liquid density ρ; water at the temperature (Tanaka 2001) when omitted.',
  },
];

const contactAngle: ParameterSpec = {
  name: 'contactAngle',
  label: 'Contact angle',
  unit: 'deg',
  kind: 'number',
  default: 0,
  description: 'Contact angle θ of the liquid on the pore wall (0–180°).',
};

export const kelvinModels: ModelSpec[] = [
  {
    id: 'kelvin-droplet',
    family: 'kelvin',
    title: 'Kelvin equation: droplet',
    summary: 'Vapour pressure over a droplet of radius r relative to a flat surface, ln(p/p0) = 2γVm/(rRT) (Thomson 1871).',
    parameters: [
      { name: 'radius', label: 'Droplet radius', unit: 'nm', kind: 'number', description: 'Droplet radius r.' },
      ...liquidParameters,
    ],
    run: (input) => kelvinDroplet(input as unknown as KelvinDropletInput),
  },
  {
    id: 'kelvin-meniscus',
    family: 'kelvin',
    title: 'Kelvin equation: pore meniscus',
    summary: 'Vapour pressure over the meniscus in a pore of radius r, ln(p/p0) = −2γVm cos θ/(rRT) (Thomson 1871).',
    parameters: [
      { name: 'radius', label: 'Pore radius', unit: 'nm', kind: 'number', description: 'Cylindrical pore radius r.' },
      contactAngle,
      ...liquidParameters,
    ],
    run: (input) => kelvinMeniscus(input as unknown as KelvinMeniscusInput),
  },
  {
    id: 'kelvin-radius',
    family: 'kelvin',
    title: 'Kelvin radius at a relative humidity',
    summary:
      'Largest pore radius filled by capillary condensation at a relative humidity, r_K = −2γVm cos θ/(RT ln RH) (Kelvin equation).',
    parameters: [
      {
        name: 'relativeHumidity',
        label: 'Relative humidity',
        unit: '%',
        kind: 'number',
        description: 'Relative humidity p/p0, strictly between 0 and 100 %.',
      },
      contactAngle,
      ...liquidParameters,
    ],
    run: (input) => kelvinRadius(input as unknown as KelvinRadiusInput),
  },
];
