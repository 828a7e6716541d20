import type { Migration } from '../umzug';

/**
 * Invented demo scenario: Brightwell Hygiene Ltd., a fictional maker of baby diapers, incontinence pads
 * and wound-care dressings, and its fictional suppliers. Any likeness to a real company is accidental.
 */
export const DEMO_SUPPLIERS = [
  { name: 'Northmoor Fibre Works', country: 'Fictland', supplies: 'PP and PET staple fibres, bicomponent fibres' },
  { name: 'Calloway Nonwovens', country: 'Fictland', supplies: 'spunbond and SMS topsheets, through-air bonded ADL' },
  { name: 'Pinecrest Pulp Co.', country: 'Nordvale', supplies: 'fluff pulp, airlaid cores' },
  { name: 'Aquasorb Polymers', country: 'Nordvale', supplies: 'superabsorbent polymer granules' },
  { name: 'Meridian Lab Chemicals', country: 'Fictland', supplies: 'test liquids, saline, reference solvents' },
];

export const up: Migration = async ({ context: { queryInterface } }) => {
  const now = new Date();
  await queryInterface.bulkInsert(
    'suppliers',
    DEMO_SUPPLIERS.map((s) => ({ ...s, created_at: now, updated_at: now })),
  );
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.bulkDelete('suppliers', { name: DEMO_SUPPLIERS.map((s) => s.name) });
};
