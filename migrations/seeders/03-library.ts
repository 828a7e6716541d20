import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { QueryTypes, type QueryInterface, type Transaction } from 'sequelize';
import {
  blendFibres,
  type FibreData,
  type FileRef,
  type LabCurve,
  type LibraryData,
  type LibraryKind,
  type LiquidData,
  type PoreSizeDistributionData,
  type PropertySource,
  type PropertyValue,
  type RevisionState,
  toSI,
  type WebData,
  webPorosity,
} from 'wick-core';
import type { Migration } from '../umzug';

/**
 * The invented demo library of Brightwell Hygiene Ltd.: fibres, webs and test liquids from the fictional
 * suppliers of 01-demo-company, with plausible values for the trade (invented, not any real product's data).
 * Some entries are approved, some wait in review, one was returned with a comment, a few are drafts; one approved
 * web has a newer revision in review, so history and diff have something to show.
 */

const here = dirname(fileURLToPath(import.meta.url));

interface Person {
  readonly sub: string;
  readonly name: string;
  readonly email: string;
  readonly roles: readonly string[];
}

const ACCOUNTS = JSON.parse(readFileSync(join(here, '..', '..', 'idp-fake', 'accounts.json'), 'utf8')) as Person[];
const person = (sub: string): Person => ACCOUNTS.find((a) => a.sub === sub)!;
/** Tomás (materials scientist), Lena (materials scientist + reviewer), Grace (reviewer). */
const AUTHORS = { tomas: person('bwh-1002'), lena: person('bwh-1006'), grace: person('bwh-1003') };
type Who = keyof typeof AUTHORS;

/** The issuer the app will see for these people, as server/src/auth/auth-config.ts derives it. */
function issuer(): string {
  const appPort = Number(process.env['WICK_PORT'] ?? 4610);
  return process.env['WICK_OIDC_ISSUER'] || `http://127.0.0.1:${process.env['WICK_IDP_PORT'] ?? appPort + 1}`;
}

// ——— values ———

/** A value typed in `unit` (converted with wick-core's units module). */
function q(value: number, unit: string, source: PropertySource, note?: string): PropertyValue {
  return { si: toSI(value, unit), unit, source, ...(note ? { note } : {}) };
}
const deg = (value: number, source: PropertySource = 'measured') => q(value, 'deg', source);

interface Seeded {
  readonly key: string;
  readonly kind: LibraryKind;
  readonly supplier: string | null;
  readonly notes?: string;
  /** Oldest first. */
  readonly revisions: readonly SeedRevision[];
}

interface SeedRevision {
  readonly name: string;
  readonly state: RevisionState;
  readonly by: Who;
  readonly reviewer?: Who;
  readonly comment?: string;
  /** Days before today. */
  readonly daysAgo: number;
  readonly data: LibraryData | ((ctx: SeedContext) => LibraryData);
}

interface SeedContext {
  readonly fibreIds: ReadonlyMap<string, number>;
  readonly fibreData: ReadonlyMap<string, FibreData>;
  readonly files: ReadonlyMap<string, FileRef>;
}

const FIBRES: Seeded[] = [
  {
    key: 'pp17',
    kind: 'fibre',
    supplier: 'Northmoor Fibre Works',
    notes: 'Staple for carded topsheets and ADL blends.',
    revisions: [
      {
        name: 'Northmoor PP staple 1.7 dtex, hydrophilic',
        state: 'approved',
        by: 'tomas',
        reviewer: 'grace',
        daysAgo: 58,
        data: {
          polymer: 'polypropylene',
          density: q(0.91, 'g/cm^3', 'handbook'),
          linearDensity: q(1.7, 'dtex', 'supplier-datasheet'),
          shapeFactor: q(1, '1', 'estimate'),
          finish: 'durable hydrophilic spin finish',
          contactAngles: [{ liquid: 'Water', angle: deg(64), method: 'Wilhelmy, single fibre, advancing' }],
        },
      },
    ],
  },
  {
    key: 'pp22',
    kind: 'fibre',
    supplier: 'Northmoor Fibre Works',
    revisions: [
      {
        name: 'Northmoor PP staple 2.2 dtex, untreated',
        state: 'approved',
        by: 'tomas',
        reviewer: 'grace',
        daysAgo: 57,
        data: {
          polymer: 'polypropylene',
          density: q(0.91, 'g/cm^3', 'handbook'),
          linearDensity: q(2.2, 'dtex', 'supplier-datasheet'),
          finish: 'none (hydrophobic)',
          contactAngles: [{ liquid: 'Water', angle: deg(104), method: 'Wilhelmy, single fibre, advancing' }],
        },
      },
    ],
  },
  {
    key: 'pet67',
    kind: 'fibre',
    supplier: 'Northmoor Fibre Works',
    notes: 'Hollow conjugate crimp; gives loft to acquisition layers.',
    revisions: [
      {
        name: 'Northmoor PET staple 6.7 dtex, hollow conjugate',
        state: 'approved',
        by: 'tomas',
        reviewer: 'lena',
        daysAgo: 55,
        data: {
          polymer: 'PET',
          density: q(1.38, 'g/cm^3', 'handbook'),
          linearDensity: q(6.7, 'dtex', 'supplier-datasheet'),
          shapeFactor: q(1.15, '1', 'estimate'),
          finish: 'hydrophilic, semi-durable',
          contactAngles: [{ liquid: 'Water', angle: deg(71), method: 'Wilhelmy, single fibre, advancing' }],
        },
      },
    ],
  },
  {
    key: 'bico22',
    kind: 'fibre',
    supplier: 'Northmoor Fibre Works',
    notes: 'PE sheath / PET core 50/50 by volume; density from the volume balance.',
    revisions: [
      {
        name: 'Northmoor PE/PET bicomponent 2.2 dtex',
        state: 'approved',
        by: 'tomas',
        reviewer: 'grace',
        daysAgo: 54,
        data: {
          polymer: 'PE/PET bicomponent (sheath/core)',
          density: q(1.165, 'g/cm^3', 'estimate', '0.5 × 0.95 + 0.5 × 1.38 g/cm³'),
          linearDensity: q(2.2, 'dtex', 'supplier-datasheet'),
          finish: 'hydrophilic',
          contactAngles: [{ liquid: 'Water', angle: deg(68), method: 'Wilhelmy, single fibre, advancing' }],
        },
      },
    ],
  },
  {
    key: 'pulp',
    kind: 'fibre',
    supplier: 'Pinecrest Pulp Co.',
    notes: 'Coarseness 0.20 mg/m from the mill certificate.',
    revisions: [
      {
        name: 'Pinecrest fluff pulp, southern softwood',
        state: 'approved',
        by: 'lena',
        reviewer: 'grace',
        daysAgo: 52,
        data: {
          polymer: 'cellulose (fluff pulp)',
          density: q(1.52, 'g/cm^3', 'handbook'),
          linearDensity: q(2.0, 'dtex', 'supplier-datasheet', 'coarseness 0.20 mg/m'),
          shapeFactor: q(1.6, '1', 'estimate', 'collapsed ribbon-like fibres'),
          finish: 'untreated, debonded',
          contactAngles: [{ liquid: 'Water', angle: deg(25, 'estimate'), method: 'sessile drop on pad, advancing (indicative)' }],
        },
      },
    ],
  },
  {
    key: 'mbpp',
    kind: 'fibre',
    supplier: 'Calloway Nonwovens',
    revisions: [
      {
        name: 'Calloway meltblown PP fibre, nominal 2 µm',
        state: 'approved',
        by: 'tomas',
        reviewer: 'grace',
        daysAgo: 50,
        data: {
          polymer: 'polypropylene',
          density: q(0.91, 'g/cm^3', 'handbook'),
          diameter: q(2.0, 'um', 'supplier-datasheet', 'median of SEM count'),
          finish: 'none (hydrophobic)',
          contactAngles: [{ liquid: 'Water', angle: deg(112), method: 'sessile drop on film, advancing' }],
        },
      },
    ],
  },
  {
    key: 'cotton',
    kind: 'fibre',
    supplier: null,
    notes: 'Bleached, for knit panels; micronaire 4.2.',
    revisions: [
      {
        name: 'Bleached cotton, micronaire 4.2',
        state: 'approved',
        by: 'lena',
        reviewer: 'grace',
        daysAgo: 40,
        data: {
          polymer: 'cellulose (cotton)',
          density: q(1.54, 'g/cm^3', 'handbook'),
          linearDensity: q(1.65, 'dtex', 'estimate', 'micronaire 4.2 ≈ 1.65 dtex'),
          shapeFactor: q(1.3, '1', 'estimate', 'kidney-shaped section'),
          finish: 'scoured and bleached',
          contactAngles: [{ liquid: 'Water', angle: deg(30, 'estimate'), method: 'Washburn uptake with n-hexane reference' }],
        },
      },
    ],
  },
  {
    key: 'viscose',
    kind: 'fibre',
    supplier: 'Northmoor Fibre Works',
    revisions: [
      {
        name: 'Northmoor viscose 1.7 dtex, trilobal',
        state: 'in-review',
        by: 'lena',
        daysAgo: 6,
        data: {
          polymer: 'viscose (regenerated cellulose)',
          density: q(1.52, 'g/cm^3', 'handbook'),
          linearDensity: q(1.7, 'dtex', 'supplier-datasheet'),
          shapeFactor: q(1.4, '1', 'estimate', 'trilobal section, perimeter ratio from micrographs'),
          finish: 'none (inherently hydrophilic)',
          contactAngles: [{ liquid: 'Water', angle: deg(20), method: 'Wilhelmy, single fibre, advancing' }],
        },
      },
    ],
  },
  {
    key: 'lyocell',
    kind: 'fibre',
    supplier: null,
    revisions: [
      {
        name: 'Lyocell 1.3 dtex (trial lot)',
        state: 'draft',
        by: 'tomas',
        daysAgo: 2,
        data: {
          polymer: 'lyocell',
          density: q(1.52, 'g/cm^3', 'handbook'),
          linearDensity: q(1.3, 'dtex', 'supplier-datasheet'),
          contactAngles: [],
        },
      },
    ],
  },
];

// ——— pore-size distributions and a lab curve, kept as uploaded files ———

interface SeedFile {
  readonly key: string;
  readonly purpose: 'psd' | 'curve';
  readonly fileName: string;
  readonly csv: string;
  readonly by: Who;
}

const PSD_AIRLAID = {
  d: [20, 40, 60, 80, 100, 125, 150, 200, 250, 300, 400],
  F: [2, 8, 18, 32, 46, 61, 73, 87, 94, 98, 100],
};
const PSD_SPUNBOND = { d: [10, 15, 20, 30, 40, 50, 60, 80, 100], F: [3, 10, 22, 45, 65, 80, 90, 97, 100] };
const CURVE_ADL = {
  t: [0, 5, 10, 20, 30, 60, 120, 180, 300, 600],
  h: [0, 5.4, 7.6, 10.6, 12.8, 17.6, 23.5, 27.2, 31.8, 36.5],
};

const FILES: SeedFile[] = [
  {
    key: 'psd-al150',
    purpose: 'psd',
    fileName: 'AL-150 porometry 2024-05-14.csv',
    by: 'lena',
    csv: '# liquid extrusion porometry, 3 specimens pooled\ndiameter (µm),cumulative finer (%)\n' + PSD_AIRLAID.d.map((d, i) => `${d},${PSD_AIRLAID.F[i]}`).join('\n') + '\n',
  },
  {
    key: 'psd-sb12',
    purpose: 'psd',
    fileName: 'SB-12 capillary flow porometry.csv',
    by: 'tomas',
    csv: 'diameter (µm);cumulative finer (%)\n' + PSD_SPUNBOND.d.map((d, i) => `${d};${PSD_SPUNBOND.F[i]}`).join('\n') + '\n',
  },
  {
    key: 'curve-adl',
    purpose: 'curve',
    fileName: 'TAB-40 vertical wicking saline 23C.csv',
    by: 'tomas',
    csv: 'time (s),height (mm)\n' + CURVE_ADL.t.map((t, i) => `${t},${CURVE_ADL.h[i]}`).join('\n') + '\n',
  },
];

function psd(data: { d: number[]; F: number[] }, file: FileRef): PoreSizeDistributionData {
  return {
    form: 'cumulative-finer',
    diameterUnit: 'um',
    diameters: data.d.map((d) => toSI(d, 'um')),
    fractions: data.F.map((f) => f / 100),
    source: 'measured',
    file,
  };
}

function adlCurve(file: FileRef): LabCurve {
  return {
    key: 'vertical-wicking-saline',
    name: 'Vertical wicking, 0.9 % saline, 23 °C',
    measurement: 'height',
    liquid: '0.9 % NaCl saline',
    timeUnit: 's',
    valueUnit: 'mm',
    times: CURVE_ADL.t,
    values: CURVE_ADL.h.map((h) => toSI(h, 'mm')),
    file,
  };
}

// ——— webs ———

type Blend = readonly [fibreKey: string, fraction: number][];

/** A web whose porosity is computed as the service does it: ε = 1 − BW/(ρf t) with the blend density. */
function web(ctx: SeedContext, blend: Blend, extra: Omit<WebData, 'blend' | 'porosityMode' | 'curves'> & { curves?: LabCurve[] }): WebData {
  const parts = blend.map(([key, massFraction]) => ({ fibreId: ctx.fibreIds.get(key)!, fibreName: FIBRES.find((f) => f.key === key)!.revisions.at(-1)!.name, massFraction }));
  const components = blend.map(([key, massFraction]) => {
    const f = ctx.fibreData.get(key)!;
    return { massFraction, fibreDensity: f.density.si, diameter: f.diameter?.si, linearDensity: f.linearDensity?.si, shapeFactor: f.shapeFactor?.si };
  });
  const porosity = extra.thickness
    ? webPorosity({ basisWeight: extra.basisWeight.si, thickness: extra.thickness.si, fibreDensity: blendFibres(components).fibreDensity }).porosity
    : undefined;
  return {
    ...extra,
    blend: parts,
    porosityMode: 'computed',
    ...(porosity !== undefined
      ? { porosity: { si: porosity, unit: '%', source: 'estimate', note: 'Computed: ε = 1 − BW/(ρf·t) from basis weight, thickness and the blend fibre density (wick-core fibre-bed).' } }
      : {}),
    curves: extra.curves ?? [],
  };
}

const halfKPa = () => q(0.5, 'kPa', 'measured');

const WEBS: Seeded[] = [
  {
    key: 'sb12',
    kind: 'web',
    supplier: 'Calloway Nonwovens',
    notes: 'Topsheet for baby diapers; hydrophilic finish applied inline.',
    revisions: [
      {
        name: 'Calloway SB-12 hydrophilic spunbond topsheet',
        state: 'approved',
        by: 'tomas',
        reviewer: 'grace',
        daysAgo: 45,
        data: (ctx) =>
          web(ctx, [['pp17', 1]], {
            webKind: 'spunbond',
            basisWeight: q(12, 'g/m^2', 'supplier-datasheet'),
            thickness: q(0.15, 'mm', 'measured'),
            thicknessPressure: halfKPa(),
            meanFlowPoreSize: q(34, 'um', 'measured'),
            poreSizeDistribution: psd(PSD_SPUNBOND, ctx.files.get('psd-sb12')!),
            permeabilityThroughPlane: { mode: 'measured', value: q(5.2e-11, 'm^2', 'measured', 'air permeability, 125 Pa') },
            permeabilityInPlane: { mode: 'correlation', correlation: 'davies' },
          }),
      },
    ],
  },
  {
    key: 'sms15',
    kind: 'web',
    supplier: 'Calloway Nonwovens',
    notes: 'Barrier leg cuffs; meltblown layer 20 % by mass.',
    revisions: [
      {
        name: 'Calloway SMS-15 barrier cuff',
        state: 'approved',
        by: 'tomas',
        reviewer: 'lena',
        daysAgo: 44,
        data: (ctx) =>
          web(ctx, [['pp22', 0.8], ['mbpp', 0.2]], {
            webKind: 'sms',
            basisWeight: q(15, 'g/m^2', 'supplier-datasheet'),
            thickness: q(0.18, 'mm', 'measured'),
            thicknessPressure: halfKPa(),
            meanFlowPoreSize: q(14, 'um', 'measured'),
          }),
      },
    ],
  },
  {
    key: 'tab40',
    kind: 'web',
    supplier: 'Calloway Nonwovens',
    notes: 'Acquisition-distribution layer under the topsheet.',
    revisions: [
      {
        name: 'Calloway TAB-40 acquisition layer',
        state: 'approved',
        by: 'tomas',
        reviewer: 'grace',
        comment: 'Values match the datasheet; wicking curve attached.',
        daysAgo: 42,
        data: (ctx) =>
          web(ctx, [['pet67', 0.6], ['bico22', 0.4]], {
            webKind: 'carded-through-air-bonded',
            basisWeight: q(40, 'g/m^2', 'supplier-datasheet'),
            thickness: q(1.0, 'mm', 'measured'),
            thicknessPressure: halfKPa(),
            meanFlowPoreSize: q(118, 'um', 'measured'),
            permeabilityInPlane: { mode: 'correlation', correlation: 'kozeny-carman' },
            curves: [adlCurve(ctx.files.get('curve-adl')!)],
          }),
      },
      {
        name: 'Calloway TAB-40 acquisition layer',
        state: 'in-review',
        by: 'tomas',
        daysAgo: 3,
        data: (ctx) =>
          web(ctx, [['pet67', 0.6], ['bico22', 0.4]], {
            webKind: 'carded-through-air-bonded',
            basisWeight: q(42, 'g/m^2', 'measured', 'mean of 10 specimens, lot 24-118'),
            thickness: q(1.05, 'mm', 'measured'),
            thicknessPressure: halfKPa(),
            meanFlowPoreSize: q(118, 'um', 'measured'),
            permeabilityInPlane: { mode: 'correlation', correlation: 'kozeny-carman' },
            curves: [adlCurve(ctx.files.get('curve-adl')!)],
          }),
      },
    ],
  },
  {
    key: 'tab60',
    kind: 'web',
    supplier: 'Calloway Nonwovens',
    revisions: [
      {
        name: 'Calloway TAB-60 high-loft ADL',
        state: 'in-review',
        by: 'tomas',
        daysAgo: 5,
        data: (ctx) =>
          web(ctx, [['pet67', 0.7], ['bico22', 0.3]], {
            webKind: 'carded-through-air-bonded',
            basisWeight: q(60, 'g/m^2', 'supplier-datasheet'),
            thickness: q(1.6, 'mm', 'supplier-datasheet'),
            thicknessPressure: halfKPa(),
          }),
      },
    ],
  },
  {
    key: 'al150',
    kind: 'web',
    supplier: 'Pinecrest Pulp Co.',
    notes: 'Airlaid storage layer for incontinence pads.',
    revisions: [
      {
        name: 'Pinecrest AL-150 airlaid core',
        state: 'approved',
        by: 'lena',
        reviewer: 'grace',
        daysAgo: 38,
        data: (ctx) =>
          web(ctx, [['pulp', 0.85], ['bico22', 0.15]], {
            webKind: 'airlaid',
            basisWeight: q(150, 'g/m^2', 'supplier-datasheet'),
            thickness: q(1.9, 'mm', 'measured'),
            thicknessPressure: halfKPa(),
            meanFlowPoreSize: q(105, 'um', 'measured'),
            poreSizeDistribution: psd(PSD_AIRLAID, ctx.files.get('psd-al150')!),
          }),
      },
    ],
  },
  {
    key: 'core40',
    kind: 'web',
    supplier: 'Pinecrest Pulp Co.',
    notes: 'Baby diaper core, size 4; superabsorbent from Aquasorb Polymers.',
    revisions: [
      {
        name: 'Fluff/superabsorbent core, 40 % SAP',
        state: 'approved',
        by: 'tomas',
        reviewer: 'grace',
        daysAgo: 30,
        data: {
          webKind: 'fluff-sap-core',
          blend: [
            { fibreName: 'Pinecrest fluff pulp, southern softwood', massFraction: 0.6 },
            { fibreName: 'Aquasorb superabsorbent granules', massFraction: 0.4 },
          ],
          basisWeight: q(520, 'g/m^2', 'measured'),
          thickness: q(4.6, 'mm', 'measured'),
          thicknessPressure: halfKPa(),
          porosityMode: 'measured',
          porosity: q(88, '%', 'estimate', 'dry core, from bulk density'),
          sap: {
            content: q(40, '%', 'measured'),
            freeSwellCapacity: q(46, 'g/g', 'supplier-datasheet'),
            centrifugeRetentionCapacity: q(31, 'g/g', 'supplier-datasheet'),
            absorbencyUnderLoad: q(20, 'g/g', 'supplier-datasheet'),
            absorbencyUnderLoadPressure: q(4.83, 'kPa', 'supplier-datasheet'),
            testLiquid: '0.9 % NaCl saline',
          },
          curves: [],
        },
      },
    ],
  },
  {
    key: 'spunlace50',
    kind: 'web',
    supplier: 'Calloway Nonwovens',
    notes: 'Wound-pad contact layer.',
    revisions: [
      {
        name: 'Calloway SL-50 viscose/PET spunlace',
        state: 'in-review',
        by: 'lena',
        daysAgo: 4,
        data: (ctx) =>
          web(ctx, [['viscose', 0.7], ['pet67', 0.3]], {
            webKind: 'spunlace',
            basisWeight: q(50, 'g/m^2', 'supplier-datasheet'),
            thickness: q(0.45, 'mm', 'measured'),
            thicknessPressure: halfKPa(),
            meanFlowPoreSize: q(42, 'um', 'measured'),
          }),
      },
    ],
  },
  {
    key: 'mb25',
    kind: 'web',
    supplier: 'Calloway Nonwovens',
    revisions: [
      {
        name: 'Calloway MB-25 meltblown wipe substrate',
        state: 'approved',
        by: 'tomas',
        reviewer: 'grace',
        daysAgo: 35,
        data: (ctx) =>
          web(ctx, [['mbpp', 1]], {
            webKind: 'meltblown',
            basisWeight: q(25, 'g/m^2', 'supplier-datasheet'),
            thickness: q(0.3, 'mm', 'measured'),
            thicknessPressure: halfKPa(),
            meanFlowPoreSize: q(11, 'um', 'measured'),
            permeabilityInPlane: { mode: 'correlation', correlation: 'davies' },
            permeabilityThroughPlane: { mode: 'correlation', correlation: 'davies' },
          }),
      },
    ],
  },
  {
    key: 'wetlaid18',
    kind: 'web',
    supplier: 'Pinecrest Pulp Co.',
    notes: 'Core wrap tissue.',
    revisions: [
      {
        name: 'Pinecrest WL-18 wet-laid core wrap',
        state: 'returned',
        by: 'tomas',
        reviewer: 'grace',
        comment: 'The datasheet gives the thickness at 2 kPa, not 0.5 kPa: correct the pressure or measure it again at 0.5 kPa.',
        daysAgo: 9,
        data: (ctx) =>
          web(ctx, [['pulp', 1]], {
            webKind: 'wet-laid',
            basisWeight: q(18, 'g/m^2', 'supplier-datasheet'),
            thickness: q(0.09, 'mm', 'supplier-datasheet'),
            thicknessPressure: halfKPa(),
          }),
      },
    ],
  },
  {
    key: 'needle200',
    kind: 'web',
    supplier: 'Northmoor Fibre Works',
    revisions: [
      {
        name: 'Needlepunched PET felt 200 g/m² (dressing secondary layer)',
        state: 'draft',
        by: 'lena',
        daysAgo: 1,
        data: (ctx) =>
          web(ctx, [['pet67', 1]], {
            webKind: 'needlepunched',
            basisWeight: q(200, 'g/m^2', 'measured'),
            thickness: q(2.8, 'mm', 'measured'),
            thicknessPressure: q(0.5, 'kPa', 'measured'),
          }),
      },
    ],
  },
  {
    key: 'knit140',
    kind: 'web',
    supplier: null,
    revisions: [
      {
        name: 'Cotton jersey knit 140 g/m² (moisture panel)',
        state: 'draft',
        by: 'lena',
        daysAgo: 1,
        data: (ctx) =>
          web(ctx, [['cotton', 1]], {
            webKind: 'knit',
            basisWeight: q(140, 'g/m^2', 'measured'),
            thickness: q(0.62, 'mm', 'measured'),
            thicknessPressure: q(1, 'kPa', 'measured'),
          }),
      },
    ],
  },
];

// ——— liquids ———

function constant(value: number, unit: string, source: PropertySource, celsius: number, note?: string) {
  return { mode: 'constant' as const, value: q(value, unit, source, note), temperature: q(celsius, 'degC', 'measured') };
}
function table(unit: string, source: PropertySource, rows: [celsius: number, value: number][], note?: string) {
  return {
    mode: 'table' as const,
    unit,
    temperatureUnit: 'degC',
    source,
    ...(note ? { note } : {}),
    points: rows.map(([c, v]) => ({ temperature: toSI(c, 'degC'), value: toSI(v, unit) })),
  };
}

const LIQUIDS: Seeded[] = [
  {
    key: 'urine',
    kind: 'liquid',
    supplier: 'Meridian Lab Chemicals',
    revisions: [
      {
        name: 'Simulated urine, lot SU-2407 (70 mN/m)',
        state: 'approved',
        by: 'tomas',
        reviewer: 'grace',
        daysAgo: 48,
        data: {
          surfaceTension: constant(70.2, 'mN/m', 'measured', 23, 'Wilhelmy plate, mean of 3'),
          viscosity: constant(1.02, 'mPa s', 'handbook', 20, 'as 0.9 % NaCl'),
          density: constant(1.005, 'g/cm^3', 'measured', 23),
          flammable: false,
          composition: '9 g/L NaCl in deionised water with a non-ionic surfactant to 70 ± 2 mN/m',
        } satisfies LiquidData,
      },
    ],
  },
  {
    key: 'saline',
    kind: 'liquid',
    supplier: 'Meridian Lab Chemicals',
    notes: 'In-house batch; values approximate water + NaCl corrections.',
    revisions: [
      {
        name: '0.9 % NaCl saline, in-house batch',
        state: 'approved',
        by: 'lena',
        reviewer: 'grace',
        daysAgo: 47,
        data: {
          surfaceTension: table('mN/m', 'estimate', [[20, 72.99], [25, 72.22], [30, 71.43], [37, 70.30]], 'water (IAPWS) + 0.25 mN/m'),
          viscosity: table('mPa s', 'estimate', [[20, 1.02], [25, 0.905], [30, 0.811], [37, 0.707]]),
          density: constant(1.0046, 'g/cm^3', 'handbook', 20),
          flammable: false,
          composition: '9 g/L NaCl in deionised water',
        } satisfies LiquidData,
      },
    ],
  },
  {
    key: 'rinse',
    kind: 'liquid',
    supplier: 'Meridian Lab Chemicals',
    revisions: [
      {
        name: 'Surfactant run-off liquid (50 mN/m)',
        state: 'approved',
        by: 'tomas',
        reviewer: 'lena',
        daysAgo: 33,
        data: {
          surfaceTension: constant(50.1, 'mN/m', 'measured', 23),
          viscosity: constant(1.0, 'mPa s', 'estimate', 23),
          density: constant(0.998, 'g/cm^3', 'estimate', 23),
          flammable: false,
          composition: 'deionised water with a non-ionic surfactant',
        } satisfies LiquidData,
      },
    ],
  },
  {
    key: 'lotion',
    kind: 'liquid',
    supplier: null,
    revisions: [
      {
        name: 'Baby-wipe lotion, lab batch W-3',
        state: 'approved',
        by: 'lena',
        reviewer: 'grace',
        daysAgo: 28,
        data: {
          surfaceTension: constant(31.5, 'mN/m', 'measured', 22),
          viscosity: constant(3.4, 'mPa s', 'measured', 22),
          density: constant(1.002, 'g/cm^3', 'measured', 22),
          flammable: false,
          composition: 'aqueous, 0.6 % surfactant blend, preservative',
        } satisfies LiquidData,
      },
    ],
  },
  {
    key: 'exudate',
    kind: 'liquid',
    supplier: 'Meridian Lab Chemicals',
    revisions: [
      {
        name: 'Simulated wound exudate (serum substitute)',
        state: 'in-review',
        by: 'lena',
        daysAgo: 5,
        data: {
          surfaceTension: constant(52, 'mN/m', 'estimate', 25, 'protein solutions are typically 50–55 mN/m'),
          viscosity: constant(1.5, 'mPa s', 'estimate', 25),
          density: constant(1.025, 'g/cm^3', 'estimate', 25),
          flammable: false,
          composition: 'bovine-serum-albumin free substitute: salts and a polymer thickener',
        } satisfies LiquidData,
      },
    ],
  },
  {
    key: 'ipa70',
    kind: 'liquid',
    supplier: 'Meridian Lab Chemicals',
    notes: 'Cleaning solution; flammable.',
    revisions: [
      {
        name: 'Isopropanol 70 % (v/v) cleaning solution',
        state: 'draft',
        by: 'tomas',
        daysAgo: 2,
        data: {
          surfaceTension: constant(24.5, 'mN/m', 'estimate', 20),
          viscosity: constant(2.4, 'mPa s', 'estimate', 20),
          density: constant(0.877, 'g/cm^3', 'estimate', 20),
          flammable: true,
          composition: 'isopropanol and water, 70:30 by volume',
        } satisfies LiquidData,
      },
    ],
  },
];

const ALL = [...FIBRES, ...WEBS, ...LIQUIDS];
/** Every name the demo library uses (its `down` and its spec find the rows by them). */
export const DEMO_LIBRARY_NAMES = [...new Set(ALL.flatMap((s) => s.revisions.map((r) => r.name)))];

// ——— writing ———

/** INSERT … RETURNING id (bulkInsert's typings have no `returning`). */
async function insert(qi: QueryInterface, table: string, row: Record<string, unknown>, transaction: Transaction): Promise<number> {
  const cols = Object.keys(row);
  const [[result]] = (await qi.sequelize.query(
    `INSERT INTO ${table} (${cols.join(', ')}) VALUES (${cols.map((c) => `:${c}`).join(', ')}) RETURNING id`,
    { replacements: row, transaction },
  )) as [{ id: number }[], unknown];
  return result.id;
}

async function userIds(qi: QueryInterface, transaction: Transaction): Promise<Record<Who, number>> {
  const out = {} as Record<Who, number>;
  for (const [who, p] of Object.entries(AUTHORS) as [Who, Person][]) {
    const found = await qi.sequelize.query<{ id: number }>('SELECT id FROM users WHERE subject = :sub ORDER BY id LIMIT 1', {
      replacements: { sub: p.sub },
      type: QueryTypes.SELECT,
      transaction,
    });
    if (found[0]) {
      out[who] = found[0].id;
      continue;
    }
    // Known to the app once they sign in; created here so the demo library has its authors.
    out[who] = await insert(
      qi,
      'users',
      { issuer: issuer(), subject: p.sub, name: p.name, email: p.email, idp_roles: `{${p.roles.join(',')}}`, created_at: new Date(), updated_at: new Date() },
      transaction,
    );
  }
  return out;
}

export const up: Migration = async ({ context: { queryInterface: qi, sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    const users = await userIds(qi, transaction);
    const suppliers = new Map(
      (await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM suppliers', { type: QueryTypes.SELECT, transaction })).map((s) => [s.name, s.id]),
    );
    const day = 24 * 3600 * 1000;
    const at = (daysAgo: number, hours = 0) => new Date(Date.now() - daysAgo * day + hours * 3600 * 1000);

    const files = new Map<string, FileRef>();
    for (const f of FILES) {
      const bytes = Buffer.from(f.csv, 'utf8');
      const sha256 = createHash('sha256').update(bytes).digest('hex');
      const fileId = await insert(
        qi,
        'library_files',
        {
          purpose: f.purpose,
          file_name: f.fileName,
          media_type: 'text/csv',
          size: bytes.length,
          sha256,
          encoding: 'utf-8',
          delimiter: f.csv.includes(';') ? ';' : ',',
          content: bytes,
          uploaded_by: users[f.by],
          created_at: at(45),
        },
        transaction,
      );
      files.set(f.key, { fileId, fileName: f.fileName, sha256 });
    }

    const fibreIds = new Map<string, number>();
    const fibreData = new Map<string, FibreData>();
    const ctx: SeedContext = { fibreIds, fibreData, files };
    for (const seeded of ALL) {
      const entryId = await insert(
        qi,
        'library_entries',
        { kind: seeded.kind, version: 1, created_by: users[seeded.revisions[0].by], created_at: at(seeded.revisions[0].daysAgo), updated_at: at(seeded.revisions[0].daysAgo) },
        transaction,
      );
      let head = 0;
      let approved: number | null = null;
      let version = 1;
      for (const [i, r] of seeded.revisions.entries()) {
        const data = typeof r.data === 'function' ? r.data(ctx) : r.data;
        const submitted = r.state !== 'draft';
        const decided = r.state === 'approved' || r.state === 'returned';
        const revId = await insert(
          qi,
          'library_revisions',
          {
            entry_id: entryId,
            number: i + 1,
            state: r.state,
            name: r.name,
            supplier_id: seeded.supplier ? (suppliers.get(seeded.supplier) ?? null) : null,
            notes: seeded.notes ?? '',
            data: JSON.stringify(data),
            created_by: users[r.by],
            updated_by: users[r.by],
            submitted_by: submitted ? users[r.by] : null,
            submitted_at: submitted ? at(r.daysAgo, 2) : null,
            reviewed_by: decided ? users[r.reviewer!] : null,
            reviewed_at: decided ? at(r.daysAgo - 1) : null,
            review_comment: decided ? (r.comment ?? null) : null,
            created_at: at(r.daysAgo),
            updated_at: at(r.daysAgo, 1),
          },
          transaction,
        );
        head = revId;
        if (r.state === 'approved') approved = revId;
        version += submitted ? (decided ? 3 : 2) : 1;
        if (seeded.kind === 'fibre') {
          fibreIds.set(seeded.key, entryId);
          fibreData.set(seeded.key, data as FibreData);
        }
      }
      await qi.bulkUpdate(
        'library_entries',
        { head_revision_id: head, approved_revision_id: approved, version, updated_at: at(seeded.revisions.at(-1)!.daysAgo - 1) },
        { id: entryId },
        { transaction },
      );
    }
  });
};

export const down: Migration = async ({ context: { queryInterface: qi, sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `DELETE FROM library_entries e USING library_revisions r WHERE r.entry_id = e.id AND r.number = 1 AND r.name IN (:names)`,
      { replacements: { names: DEMO_LIBRARY_NAMES }, transaction },
    );
    await qi.bulkDelete('library_files', { file_name: FILES.map((f) => f.fileName) }, { transaction });
    await sequelize.query('DELETE FROM users WHERE subject IN (:subs) AND last_sign_in_at IS NULL', {
      replacements: { subs: Object.values(AUTHORS).map((p) => p.sub) },
      transaction,
    });
  });
};
