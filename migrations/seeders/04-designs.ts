import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import {
  anyKeyFigures,
  compareKeyFigures,
  evaluateAnyVariant,
  liquidFromLibrary,
  pinnedMaterials,
  STACK_VARIANT_EXAMPLE,
  stackLayerFromLibrary,
  structureFromLibrary,
  WICK_CORE_VERSION,
  type AnyVariantInputs,
  type AnyVariantResults,
  type PinnedMaterial,
  type StackLayerInputs,
  type StackVariantInputs,
  type FibreData,
  type LibraryFibre,
  type LiquidData,
  type StructureInputs,
  type VariantInputs,
  type WebData,
} from 'wick-core';
import { loadAuthConfig } from '../../server/src/auth/auth-config';
import { loadConfig } from '../../server/src/config';
import type { Migration } from '../umzug';

/**
 * Invented demo scenario for the design workspace: Brightwell Hygiene's night incontinence pad programme, with
 * an acquisition-layer design, a core-density design, a layered-stack design (nine variants) and one recorded decision. Webs come
 * from the demo library when it has approved ones of the right kind; otherwise the variants use ad-hoc
 * structures with plausible, invented values. All names and numbers are fictional.
 */
export const DEMO_PROJECT = 'Night pad 2027 (demo)';

const deg = (d: number) => (d * Math.PI) / 180;
const C = (c: number) => c + 273.15;

interface DemoPerson {
  readonly sub: string;
  readonly name: string;
  readonly email: string;
  readonly roles: readonly string[];
}
const ENGINEER: DemoPerson = { sub: 'bwh-1001', name: 'Priya Raman', email: 'priya.raman@brightwell.example', roles: ['engineer'] };
const MANAGER: DemoPerson = { sub: 'bwh-1004', name: 'Martin Kessler', email: 'martin.kessler@brightwell.example', roles: ['program-manager'] };

/** The demo person's user row (created as the identity provider would, if they have not signed in yet). */
async function userId(sequelize: Sequelize, p: DemoPerson, transaction: Transaction): Promise<number> {
  const found = await sequelize.query<{ id: number }>('SELECT id FROM users WHERE subject = :sub ORDER BY id LIMIT 1', {
    replacements: { sub: p.sub },
    type: QueryTypes.SELECT,
    transaction,
  });
  if (found[0]) return found[0].id;
  const issuer = loadAuthConfig(loadConfig()).issuer;
  const [rows] = (await sequelize.query(
    `INSERT INTO users (issuer, subject, name, email, idp_roles, created_at, updated_at)
     VALUES (:issuer, :sub, :name, :email, ARRAY[:roles]::varchar[], now(), now()) RETURNING id`,
    { replacements: { issuer, sub: p.sub, name: p.name, email: p.email, roles: [...p.roles] }, transaction },
  )) as [{ id: number }[], unknown];
  return rows[0].id;
}

interface LibraryRow {
  readonly entry_id: number;
  readonly number: number;
  readonly name: string;
  readonly state: string;
  readonly data: unknown;
}

/**
 * The revision to pin of the library entry whose name contains `name`: its approved revision, else its newest
 * (an exploratory variant may use a draft — it is then marked as unapproved everywhere). Null when absent.
 */
async function libraryRevision(sequelize: Sequelize, kind: string, name: string, transaction: Transaction): Promise<LibraryRow | null> {
  const rows = await sequelize.query<LibraryRow>(
    `SELECT r.entry_id, r.number, r.name, r.state, r.data
       FROM library_entries e JOIN library_revisions r ON r.entry_id = e.id
      WHERE e.kind = :kind AND r.name ILIKE :name
      ORDER BY (r.id = e.approved_revision_id) DESC, r.number DESC
      LIMIT 1`,
    { replacements: { kind, name: `%${name}%` }, type: QueryTypes.SELECT, transaction },
  );
  return rows[0] ?? null;
}

/** A library web pinned at its approved (else newest) revision, with its fibres likewise; null when absent. */
async function libraryWeb(
  sequelize: Sequelize,
  name: string,
  transaction: Transaction,
): Promise<{ web: PinnedMaterial & { readonly data: WebData }; fibres: LibraryFibre[] } | null> {
  const web = await libraryRevision(sequelize, 'web', name, transaction);
  if (!web) return null;
  const fibres: LibraryFibre[] = [];
  for (const part of (web.data as WebData).blend) {
    if (part.fibreId === undefined) continue;
    const f = await sequelize.query<LibraryRow>(
      `SELECT r.entry_id, r.number, r.name, r.state, r.data FROM library_entries e JOIN library_revisions r ON r.entry_id = e.id
        WHERE e.id = :id ORDER BY (r.id = e.approved_revision_id) DESC, r.number DESC LIMIT 1`,
      { replacements: { id: part.fibreId }, type: QueryTypes.SELECT, transaction },
    );
    if (f[0]) fibres.push({ id: f[0].entry_id, name: f[0].name, data: f[0].data as FibreData });
  }
  return { web: { kind: 'web', id: web.entry_id, revision: web.number, name: web.name, state: web.state, data: web.data as WebData }, fibres };
}

/** A library web as a variant structure (its fibres at their approved or newest revision), or null. */
async function libraryStructure(sequelize: Sequelize, name: string, liquidName: string, transaction: Transaction): Promise<StructureInputs | null> {
  const found = await libraryWeb(sequelize, name, transaction);
  if (!found) return null;
  try {
    const { structure } = structureFromLibrary(found.web, found.fibres, liquidName, { aqueous: true });
    return { ...structure, contactAngle: structure.contactAngle ?? deg(55) };
  } catch {
    return null;
  }
}

/**
 * A stack layer from a library web (through-plane permeability, retention from its pore sizes); the invented
 * `fallback` layer when the web is absent, and the fallback's retention parameters when the web has no pore sizes.
 */
async function libraryStackLayer(
  sequelize: Sequelize,
  name: string,
  liquidName: string,
  fallback: StackLayerInputs,
  transaction: Transaction,
): Promise<StackLayerInputs> {
  const found = await libraryWeb(sequelize, name, transaction);
  if (!found) return fallback;
  try {
    const { layer } = stackLayerFromLibrary(found.web, found.fibres, liquidName, { aqueous: true, name: fallback.name });
    const structure = { ...layer.structure, contactAngle: layer.structure.contactAngle ?? fallback.structure.contactAngle };
    return { ...layer, structure, retention: layer.retention ?? fallback.retention, ...(fallback.residualContent ? { residualContent: fallback.residualContent } : {}) };
  } catch {
    return fallback;
  }
}

/** A library liquid pinned at its approved revision, or the built-in liquid when the library has none. */
async function libraryLiquid(sequelize: Sequelize, name: string, builtIn: string, transaction: Transaction): Promise<VariantInputs['liquid']> {
  const row = await libraryRevision(sequelize, 'liquid', name, transaction);
  if (!row) return { ref: builtIn, temperature: C(23) };
  const pinned = { kind: 'liquid' as const, id: row.entry_id, revision: row.number, name: row.name, state: row.state };
  return { ref: liquidFromLibrary({ ...pinned, data: row.data as LiquidData }), pinned, temperature: C(23) };
}

function adl(structure: StructureInputs, liquid: VariantInputs['liquid'], tolerances?: VariantInputs['tolerances']): VariantInputs {
  return {
    configuration: 'vertical-strip',
    structure,
    liquid,
    dimensions: { width: 0.025, length: 0.2, duration: 600 },
    checkpoints: { heights: [0.01, 0.02, 0.03], times: [10, 30, 60, 300, 600] },
    ...(tolerances ? { tolerances } : {}),
    humidity: 0.5,
  };
}

function core(structure: StructureInputs, liquid: VariantInputs['liquid']): VariantInputs {
  return {
    configuration: 'radial-spread',
    structure,
    liquid,
    dimensions: { sourceRadius: 0.01, duration: 120 },
    checkpoints: { heights: [0.02, 0.03, 0.05], times: [5, 30, 120] },
  };
}

/** Invented ad-hoc structures (used when the demo library has no matching approved web). */
const ADHOC = {
  petTab: {
    linearDensity: 6.7e-7,
    fibreDensity: 1390,
    basisWeight: 0.05,
    thickness: 0.0012,
    contactAngle: deg(55),
    permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' },
    sources: { basisWeight: 'invented demo value', thickness: 'invented demo value, 0.5 kPa' },
  },
  blendTab: {
    fibreDiameter: 18e-6,
    fibreDensity: 1250,
    basisWeight: 0.04,
    thickness: 0.0009,
    contactAngle: deg(50),
    permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' },
    sources: { basisWeight: 'invented demo value' },
  },
  spunlace: {
    fibreDiameter: 12e-6,
    fibreDensity: 1520,
    basisWeight: 0.045,
    thickness: 0.0006,
    contactAngle: deg(30),
    permeability: { mode: 'measured', value: 4e-11 },
    sources: { permeability: 'invented demo value, in-plane' },
  },
  airlaid: (thickness: number): StructureInputs => ({
    fibreDiameter: 25e-6,
    fibreDensity: 1520,
    basisWeight: 0.3,
    thickness,
    contactAngle: deg(40),
    permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' },
    sources: { basisWeight: 'invented demo value', thickness: 'invented demo value, 0.5 kPa' },
  }),
} satisfies Record<string, StructureInputs | ((t: number) => StructureInputs)>;

export const up: Migration = async ({ context: { sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    const exists = await sequelize.query('SELECT 1 FROM projects WHERE name = :name', {
      replacements: { name: DEMO_PROJECT },
      type: QueryTypes.SELECT,
      transaction,
    });
    if (exists.length) return;
    const priya = await userId(sequelize, ENGINEER, transaction);
    const martin = await userId(sequelize, MANAGER, transaction);
    const now = new Date();
    const insert = async (table: string, values: Record<string, unknown>): Promise<number> => {
      // Timestamps by hand: the schema's defaults live in the models, not in the tables.
      const stamps: Record<string, Record<string, Date>> = {
        decisions: { decided_at: now },
        audit_log: { at: now },
      };
      const row = { ...values, ...(stamps[table] ?? { created_at: now, updated_at: now }) };
      const cols = Object.keys(row);
      const [rows] = (await sequelize.query(
        `INSERT INTO ${table} (${cols.join(', ')}) VALUES (${cols.map((c) => `:${c}`).join(', ')}) RETURNING id`,
        { replacements: row, transaction },
      )) as [{ id: number }[], unknown];
      return rows[0].id;
    };
    const projectId = await insert('projects', {
      name: DEMO_PROJECT,
      description: 'Heavy-night incontinence pad: faster acquisition without losing core capacity. Invented demo data.',
      created_by: priya,
    });
    const adlDesign = await insert('designs', {
      project_id: projectId,
      name: 'Acquisition layer options',
      description: 'Three candidate acquisition/distribution layers, vertical wicking of 0.9 % saline.',
      created_by: priya,
    });
    const coreDesign = await insert('designs', {
      project_id: projectId,
      name: 'Core density',
      description: 'Airlaid core compressed to three thicknesses: spread from a 10 mm wetted spot.',
      created_by: priya,
    });

    const saline = await libraryLiquid(sequelize, 'NaCl saline', 'saline-0.9', transaction);
    const urine = await libraryLiquid(sequelize, 'Simulated urine', 'simulated-urine', transaction);
    const tab40 = await libraryStructure(sequelize, 'TAB-40', 'saline', transaction);
    const tab60 = await libraryStructure(sequelize, 'TAB-60', 'saline', transaction);
    const spunlace = await libraryStructure(sequelize, 'SL-50', 'saline', transaction);
    const airlaid = (await libraryStructure(sequelize, 'AL-150', 'urine', transaction)) ?? ADHOC.airlaid(0.003);
    const variants: { design: number; name: string; notes: string; inputs: AnyVariantInputs }[] = [
      {
        design: adlDesign,
        name: 'ADL A — through-air bonded, 40 g/m²',
        notes: 'Current production layer (approved library data), with tolerances from the supplier datasheet.',
        inputs: adl(tab40 ?? ADHOC.blendTab, saline, {
          basisWeight: { kind: 'normal', sd: 0.002, lower: 0 },
          thickness: { kind: 'uniform', min: 0.9 * (tab40 ?? ADHOC.blendTab).thickness, max: 1.1 * (tab40 ?? ADHOC.blendTab).thickness },
          contactAngle: { kind: 'triangular', min: (tab40 ?? ADHOC.blendTab).contactAngle - deg(8), max: (tab40 ?? ADHOC.blendTab).contactAngle + deg(8) },
        }),
      },
      {
        design: adlDesign,
        name: 'ADL B — high-loft, 60 g/m²',
        notes: 'Exploratory: library data still in review.',
        inputs: adl(tab60 ?? ADHOC.petTab, saline),
      },
      {
        design: adlDesign,
        name: 'ADL C — viscose/PET spunlace, 50 g/m²',
        notes: 'Cellulosic option; library data still in review.',
        inputs: adl(spunlace ?? ADHOC.spunlace, saline),
      },
    ];
    for (const [label, factor] of [['nominal', 1], ['compressed 15 %', 0.85], ['compressed 30 %', 0.7]] as const) {
      variants.push({
        design: coreDesign,
        name: `Airlaid core, ${label}`,
        notes: 'Same basis weight; thickness after compression, porosity from the mass balance.',
        inputs: core({ ...airlaid, thickness: airlaid.thickness * factor, porosity: undefined }, urine),
      });
    }
    variants.push({
      design: coreDesign,
      name: 'Airlaid core, nominal, horizontal strip',
      notes: 'Strip along the pad length for the distribution check.',
      inputs: { ...core(airlaid, urine), configuration: 'horizontal-strip', dimensions: { width: 0.05, length: 0.25, duration: 120 } },
    });

    // The layered product: topsheet, acquisition layer and core from the library, three gushes of saline.
    const stackDesign = await insert('designs', {
      project_id: projectId,
      name: 'Layered pad: gush intake',
      description: 'Topsheet, acquisition layer and airlaid core under three 15 mL gushes five minutes apart, over a 200 cm² insult zone.',
      created_by: priya,
    });
    const [exTop, exAdl, exCore] = STACK_VARIANT_EXAMPLE.layers;
    const top = await libraryStackLayer(sequelize, 'SB-12', 'saline', exTop, transaction);
    const acq = await libraryStackLayer(sequelize, 'TAB-40', 'saline', exAdl, transaction);
    const pad = await libraryStackLayer(sequelize, 'AL-150', 'saline', exCore, transaction);
    const stack = (layers: StackLayerInputs[]): StackVariantInputs => ({
      ...STACK_VARIANT_EXAMPLE,
      layers,
      liquid: saline,
      // Three 15 mL gushes at 5 mL/s, five minutes apart, entering through the pad's 200 cm² insult zone.
      insult: { volume: 15e-6, rate: 5e-6, area: 200e-4, count: 3, interval: 300 },
      duration: 900,
    });
    variants.push(
      {
        design: stackDesign,
        name: 'Pad stack with TAB-40 acquisition layer',
        notes: 'Current construction; acquisition time of each gush and the liquid left under the topsheet.',
        inputs: stack([top, acq, pad]),
      },
      {
        design: stackDesign,
        name: 'Pad stack without acquisition layer',
        notes: 'Cost-down option: topsheet straight on the core, so less pore volume under the insult zone.',
        inputs: stack([top, pad]),
      },
    );

    const ids: number[] = [];
    const allResults: AnyVariantResults[] = [];
    for (const v of variants) {
      const inputs = JSON.parse(JSON.stringify(v.inputs)) as AnyVariantInputs;
      // Evaluated by the same function the server uses when a variant is saved.
      const { results, options } = evaluateAnyVariant(inputs);
      allResults.push(results);
      ids.push(
        await insert('variants', {
          design_id: v.design,
          name: v.name,
          notes: v.notes,
          configuration: inputs.configuration,
          inputs: JSON.stringify(inputs),
          options: JSON.stringify(options),
          results: JSON.stringify(results),
          core_version: WICK_CORE_VERSION,
          materials: JSON.stringify(pinnedMaterials(inputs)),
          created_by: priya,
          updated_by: priya,
        }),
      );
    }

    const compared = ids.slice(0, 3);
    const decisionId = await insert('decisions', {
      project_id: projectId,
      variant_ids: `{${compared.join(',')}}`,
      baseline_variant_id: compared[0],
      chosen_variant_id: compared[0],
      chosen_variant_name: variants[0].name,
      rationale:
        'Keep ADL A for the pilot run: its data is approved and it holds the rise within tolerance. Revisit ADL B once ' +
        'its library data is approved; confirm either with the standard strip wicking test before release.',
      snapshot: JSON.stringify({
        figures: compareKeyFigures(compared.map((id, i) => ({ id, results: allResults[i] })), compared[0], anyKeyFigures),
        variants: compared.map((id, i) => ({ id, name: variants[i].name })),
      }),
      decided_by: martin,
    });
    await insert('audit_log', {
      actor_id: martin,
      action: 'create',
      entity_type: 'decision',
      entity_id: String(decisionId),
      details: JSON.stringify({ projectId, chosenVariantId: compared[0], chosenVariantName: variants[0].name, seeded: true }),
    });
  });
};

export const down: Migration = async ({ context: { sequelize } }) => {
  await sequelize.query('DELETE FROM projects WHERE name = :name', { replacements: { name: DEMO_PROJECT } });
};
