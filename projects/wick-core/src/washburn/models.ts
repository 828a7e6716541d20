import type { ModelSpec, ParameterSpec } from '../api/model-spec';
import { capillaryUptake, type CapillaryUptakeInput } from './capillary';
import { porousStripUptake, type PorousStripInput } from './porous-strip';
import { radialSpreading, type RadialSpreadInput } from './radial';

const viscosity: ParameterSpec = {
  name: 'viscosity',
  label: 'Viscosity',
  unit: 'mPa s',
  kind: 'number',
  description: 'Dynamic viscosity of the liquid.',
};
const density: ParameterSpec = {
  name: 'density',
  label: 'Liquid density',
  unit: 'kg/m^3',
  kind: 'number',
  description: 'Density of the liquid.',
};
const gravity: ParameterSpec = {
  name: 'gravity',
  label: 'Gravity',
  unit: 'm/s^2',
  kind: 'number',
  optional: true,
  default: 9.80665,
  description: 'Gravitational acceleration (standard gravity by default; 0 for a gravity-free estimate).',
};
const tilt: ParameterSpec = {
  name: 'tilt',
  label: 'Tilt from horizontal',
  unit: 'deg',
  kind: 'number',
  optional: true,
  default: 90,
  description: '90° for vertical rise, 0° for horizontal wicking, in between for an inclined sample.',
};
const times: ParameterSpec = {
  name: 'times',
  label: 'Reading times',
  unit: 's',
  kind: 'number[]',
  optional: true,
  description: 'Times at which to report the wetted length (default 10, 30, 60, 300, 600 s).',
};
const heights: ParameterSpec = {
  name: 'heights',
  label: 'Target lengths',
  unit: 'mm',
  kind: 'number[]',
  optional: true,
  description: 'Wetted lengths for which to report the time (default 10, 20, 30 mm).',
};
const permeability: ParameterSpec = {
  name: 'permeability',
  label: 'Permeability',
  unit: 'm^2',
  kind: 'number',
  description: 'Darcy permeability of the wetted material in the flow direction.',
};
const porosity: ParameterSpec = {
  name: 'porosity',
  label: 'Porosity',
  unit: '1',
  kind: 'number',
  description: 'Void volume fraction, between 0 and 1.',
};
const capillaryPressure: ParameterSpec = {
  name: 'capillaryPressure',
  label: 'Capillary pressure',
  unit: 'Pa',
  kind: 'number',
  description: 'Capillary suction at the wetting front (e.g. γ cos θ / hydraulic radius).',
};
const saturation: ParameterSpec = {
  name: 'saturation',
  label: 'Saturation behind the front',
  unit: '1',
  kind: 'number',
  optional: true,
  default: 1,
  description: 'Fraction of the pore volume filled behind the front.',
};

export const washburnModels: ModelSpec[] = [
  {
    id: 'washburn-capillary',
    family: 'washburn',
    title: 'Capillary uptake in a tube (Lucas–Washburn with gravity)',
    summary:
      'Wetted length versus time and time to given lengths in a round capillary, from the Lucas–Washburn ' +
      'equation with gravity solved explicitly (Washburn 1921; Fries & Dreyer 2008).',
    parameters: [
      { name: 'radius', label: 'Capillary radius', unit: 'um', kind: 'number', description: 'Inner radius of the tube.' },
      {
        name: 'surfaceTension',
        label: 'Surface tension',
        unit: 'mN/m',
        kind: 'number',
        description: 'Liquid–air surface tension.',
      },
      viscosity,
      {
        name: 'contactAngle',
        label: 'Contact angle',
        unit: 'deg',
        kind: 'number',
        description: 'Static contact angle; 90° or more gives no spontaneous uptake.',
      },
      density,
      gravity,
      tilt,
      times,
      heights,
    ],
    run: (input) => capillaryUptake(input as unknown as CapillaryUptakeInput),
  },
  {
    id: 'washburn-porous-strip',
    family: 'washburn',
    title: 'Wicking in a porous strip (Darcy sharp front)',
    summary:
      'Wetted length, liquid mass and uptake rate of a vertical, inclined or horizontal strip, from Darcy flow ' +
      'behind a sharp front (Green & Ampt 1911) solved explicitly (Fries & Dreyer 2008).',
    parameters: [
      permeability,
      porosity,
      capillaryPressure,
      viscosity,
      density,
      { name: 'width', label: 'Strip width', unit: 'mm', kind: 'number', description: 'Width of the strip.' },
      {
        name: 'thickness',
        label: 'Strip thickness',
        unit: 'mm',
        kind: 'number',
        description: 'Thickness of the strip (measured under the load stated with the material).',
      },
      saturation,
      gravity,
      tilt,
      times,
      heights,
    ],
    run: (input) => porousStripUptake(input as unknown as PorousStripInput),
  },
  {
    id: 'washburn-radial',
    family: 'washburn',
    title: 'Radial spreading from a fed spot',
    summary:
      'Wetted radius versus time in a thin horizontal sheet fed at a spot of given radius, from radial Darcy ' +
      'flow behind a sharp front (Marmur 1988; Danino & Marmur 1994), solved with the Lambert W function.',
    parameters: [
      permeability,
      porosity,
      capillaryPressure,
      viscosity,
      {
        name: 'sourceRadius',
        label: 'Source radius',
        unit: 'mm',
        kind: 'number',
        description: 'Radius of the wetted spot kept supplied with liquid.',
      },
      saturation,
      {
        name: 'thickness',
        label: 'Sheet thickness',
        unit: 'mm',
        kind: 'number',
        optional: true,
        description: 'Thickness of the sheet; with density, gives the liquid mass.',
      },
      { ...density, optional: true },
      times,
      {
        name: 'radii',
        label: 'Target radii',
        unit: 'mm',
        kind: 'number[]',
        optional: true,
        description: 'Wetted radii for which to report the time (default 10, 25, 50 mm).',
      },
    ],
    run: (input) => radialSpreading(input as unknown as RadialSpreadInput),
  },
];
