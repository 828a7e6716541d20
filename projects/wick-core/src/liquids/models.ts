import type { ModelSpec } from '../api/model-spec';
import { BUILT_IN_LIQUIDS } from './built-in';
import { liquidAt, type UserLiquidDefinition } from './liquid-at';
import { waterProperties } from './water';

export const liquidsModels: ModelSpec[] = [
  {
    id: 'water-properties',
    family: 'liquids',
    title: 'Water properties',
    summary:
      'Surface tension (IAPWS R1-76(2014)), viscosity (IAPWS R12-08, Huber et al. 2009) and density (Tanaka et al. 2001) of liquid water at a temperature.',
    parameters: [
      {
        name: 'temperature',
        label: 'Temperature',
        unit: 'degC',
        kind: 'number',
        default: 20,
        description: 'Water temperature; values are given from 0 to 100 °C without warnings (density formula 0–40 °C).',
      },
      {
        name: 'density',
        label: 'Density',
        unit: 'kg/m^3',
        kind: 'number',
        optional: true,
        description: 'Density used in the viscosity formula; the Tanaka (2001) density at the temperature when omitted.',
      },
    ],
    run: (input) => waterProperties(input as { temperature: number; density?: number }),
  },
  {
    id: 'liquid-properties',
    family: 'liquids',
    title: 'Test-liquid properties',
    summary:
      'Surface tension, viscosity and density of a built-in test liquid (water, saline, simulated urine, alkanes, ethanol, glycerol, diiodomethane, ethylene glycol) or a user-defined one at a temperature, with the source of each value.',
    parameters: [
      {
        name: 'liquid',
        label: 'Liquid',
        unit: '',
        kind: 'string',
        default: 'water',
        choices: BUILT_IN_LIQUIDS.map((l) => l.id),
        description: 'Id of a built-in liquid (a user liquid definition object is also accepted).',
      },
      {
        name: 'temperature',
        label: 'Temperature',
        unit: 'degC',
        kind: 'number',
        default: 20,
        description: 'Liquid temperature.',
      },
    ],
    run: (input) => {
      const i = input as { liquid: string | UserLiquidDefinition; temperature: number };
      return liquidAt(i.liquid, i.temperature);
    },
  },
];
