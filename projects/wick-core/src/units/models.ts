import type { ModelSpec } from '../api/model-spec';
import { convertQuantity, type ConvertQuantityInput } from './convert';
import { DIMENSIONS } from './dimensions';

export const unitsModels: ModelSpec[] = [
  {
    id: 'convert-quantity',
    family: 'units',
    title: 'Unit conversion',
    summary:
      'Converts a quantity typed with its unit (12 µm, 1.7 dtex, 45 gsm, 1 cP, 25 °C, 2 darcy …) to SI or to another unit of the same kind, using exact unit definitions (SI Brochure, textile and Darcy definitions).',
    parameters: [
      {
        name: 'quantity',
        label: 'Quantity',
        unit: '',
        kind: 'string',
        description: 'A number with its unit, e.g. "1.7 dtex", "25 °C", "50 %RH".',
      },
      {
        name: 'to',
        label: 'Target unit',
        unit: '',
        kind: 'string',
        optional: true,
        description: 'Unit to convert to, e.g. "denier"; the SI unit of the quantity when omitted.',
      },
      {
        name: 'expected',
        label: 'Expected kind of quantity',
        unit: '',
        kind: 'string',
        optional: true,
        choices: DIMENSIONS,
        description: 'Refuse the quantity unless it is of this kind (e.g. "length").',
      },
    ],
    run: (input) => convertQuantity(input as unknown as ConvertQuantityInput),
  },
];
