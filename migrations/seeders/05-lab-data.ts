import { createHash } from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import {
  analyseLabRun,
  createRng,
  DEFAULT_FIT_SETTINGS,
  type FitSettings,
  gravityHeight,
  labRunFigures,
  type LiquidData,
  liquidAt,
  liquidFromLibrary,
  type RunLiquid,
  runLiquidOf,
  type RunWeb,
  STANDARD_GRAVITY,
  type WebData,
  WICK_CORE_VERSION,
} from 'wick-core';
import type { Migration } from '../umzug';

/**
 * Invented demo lab data: three replicate vertical wicking runs of the demo acquisition layer (TAB-40) with the
 * library's 0.9 % saline, and one n-hexane reference run of the same web, uploaded by the demo engineer.
 *
 * The curves are not measurements. They are generated here with wick-core's gravityHeight (dh/dt = a/h − b,
 * Washburn 1921 / Fries & Dreyer 2008) for a porous layer, a = k Pc/(ε η) and b = k ρ g/(ε η) (Darcy behind the
 * front), with invented k = 1.2e-11 m² (±6 % per specimen), saline capillary pressure 900 Pa at θ = 50° and the
 * hexane one scaled by γ cos θ (θ = 0, same pores), plus seeded Gaussian reading noise of 0.3 mm — so the fits,
 * the replicate statistics, the contact angle and the prediction overlay have something plausible to show.
 * Needs the demo library (03) and the demo engineer (04); without them nothing is seeded.
 */
export const DEMO_SET_NAMES = ['TAB-40 vertical wicking, 0.9 % saline (demo)', 'TAB-40 vertical wicking, n-hexane reference (demo)'] as const;

const C = (c: number) => c + 273.15;
// Camera readings every 0.5 s while the front is fast, then sparser: the Washburn window (below 20 % of the
// equilibrium) still holds several points for the quick hexane rise.
const TIMES = [...Array.from({ length: 11 }, (_, i) => i / 2), 6, 7, 8, 10, 12, 15, 20, 25, 30, 45, 60, 90, 120, 180, 240, 300, 420, 600, 900, 1200, 1500, 1800];
export const K_PERM = 1.2e-11;
export const PC_SALINE = 900;
export const THETA_SALINE = (50 * Math.PI) / 180;
const AUTO_FIT: FitSettings = DEFAULT_FIT_SETTINGS;

interface Row {
  readonly entry_id: number;
  readonly number: number;
  readonly name: string;
  readonly state: string;
  readonly data: unknown;
}

/** The approved (else newest) revision of the library entry whose name contains `name`. */
async function revision(sequelize: Sequelize, kind: string, name: string, transaction: Transaction): Promise<Row | null> {
  const rows = await sequelize.query<Row>(
    `SELECT r.entry_id, r.number, r.name, r.state, r.data FROM library_entries e JOIN library_revisions r ON r.entry_id = e.id
      WHERE e.kind = :kind AND r.name ILIKE :name ORDER BY (r.id = e.approved_revision_id) DESC, r.number DESC LIMIT 1`,
    { replacements: { kind, name: `%${name}%` }, type: QueryTypes.SELECT, transaction },
  );
  return rows[0] ?? null;
}

export const up: Migration = async ({ context: { sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    const exists = await sequelize.query('SELECT 1 FROM lab_sets WHERE name IN (:names)', { replacements: { names: [...DEMO_SET_NAMES] }, type: QueryTypes.SELECT, transaction });
    if (exists.length) return;
    const webRow = await revision(sequelize, 'web', 'TAB-40', transaction);
    const salineRow = await revision(sequelize, 'liquid', 'NaCl saline', transaction);
    const [engineer] = await sequelize.query<{ id: number }>("SELECT id FROM users WHERE subject = 'bwh-1001' ORDER BY id LIMIT 1", { type: QueryTypes.SELECT, transaction });
    if (!webRow || !salineRow || !engineer) return;

    const T = C(23);
    const webData = webRow.data as WebData;
    const web: RunWeb = { entryId: webRow.entry_id, revision: webRow.number, name: webRow.name, state: webRow.state, porosity: webData.porosity?.si ?? null };
    const eps = web.porosity ?? 0.9;
    const pinned = { kind: 'liquid' as const, id: salineRow.entry_id, revision: salineRow.number, name: salineRow.name, state: salineRow.state };
    const saline = runLiquidOf(liquidAt(liquidFromLibrary({ ...pinned, data: salineRow.data as LiquidData }), T), {
      source: 'library',
      builtInId: null,
      entryId: salineRow.entry_id,
      revision: salineRow.number,
    });
    const hexane = runLiquidOf(liquidAt('n-hexane', T), { source: 'built-in', builtInId: 'n-hexane', entryId: null, revision: null });
    // Same pores, θ = 0 for hexane: Pc scales with γ cos θ.
    const pcHexane = (PC_SALINE * hexane.surfaceTension) / (saline.surfaceTension * Math.cos(THETA_SALINE));

    const now = new Date();
    const insert = async (table: string, row: Record<string, unknown>): Promise<number> => {
      const cols = Object.keys(row);
      const [rows] = (await sequelize.query(`INSERT INTO ${table} (${cols.join(', ')}) VALUES (${cols.map((c) => `:${c}`).join(', ')}) RETURNING id`, {
        replacements: row,
        transaction,
      })) as [{ id: number }[], unknown];
      return rows[0].id;
    };
    const makeSet = (name: string, liquid: RunLiquid, key: string, notes: string) =>
      insert('lab_sets', {
        name,
        notes,
        web_entry_id: web.entryId,
        liquid_key: key,
        liquid_name: liquid.name,
        orientation: 'vertical',
        measurement: 'height',
        proposals: '[]',
        created_by: engineer.id,
        updated_by: engineer.id,
        created_at: now,
        updated_at: now,
      });
    const makeRun = async (setId: number, name: string, liquid: RunLiquid, pc: number, kFactor: number, seed: number, notes: string) => {
      const k = K_PERM * kFactor;
      const a = (k * pc) / (eps * liquid.viscosity);
      const b = (k * liquid.density * STANDARD_GRAVITY) / (eps * liquid.viscosity);
      const rng = createRng(seed);
      const heights = TIMES.map((t) => (t === 0 ? 0 : Math.max(0, gravityHeight(a, b, t) + 3e-4 * rng.nextNormal())));
      const csv = `# Invented demo data (generated, not measured): ${name}\ntime (s),height (mm)\n${TIMES.map((t, i) => `${t},${(heights[i] * 1000).toFixed(1)}`).join('\n')}\n`;
      const readings = heights.map((h) => Number((h * 1000).toFixed(1)) / 1000);
      const bytes = Buffer.from(csv, 'utf8');
      const fileName = `${name.replace(/[^A-Za-z0-9 .-]+/g, '').trim()}.csv`;
      const fileId = await insert('library_files', {
        purpose: 'curve',
        file_name: fileName,
        media_type: 'text/csv',
        size: bytes.length,
        sha256: createHash('sha256').update(bytes).digest('hex'),
        encoding: 'utf-8',
        delimiter: ',',
        content: bytes,
        uploaded_by: engineer.id,
        created_at: now,
      });
      const summary = labRunFigures(
        analyseLabRun({ times: TIMES, readings, measurement: 'height', orientation: 'vertical', tilt: Math.PI / 2, liquid, porosity: web.porosity, fit: AUTO_FIT }),
      );
      await insert('lab_runs', {
        set_id: setId,
        name,
        web_entry_id: web.entryId,
        web_revision: web.revision,
        web: JSON.stringify(web),
        liquid: JSON.stringify(liquid),
        temperature: T,
        orientation: 'vertical',
        tilt: Math.PI / 2,
        width: 0.025,
        thickness: null,
        measurement: 'height',
        times: `{${TIMES.join(',')}}`,
        readings: `{${readings.join(',')}}`,
        time_unit: 's',
        value_unit: 'mm',
        file_id: fileId,
        conditions: 'Strip 25 mm × 250 mm, machine direction, conditioned 24 h at 23 °C / 50 % RH; front read by camera.',
        notes,
        measured_at: now.toISOString().slice(0, 10),
        fit: JSON.stringify(AUTO_FIT),
        summary: JSON.stringify(summary),
        core_version: WICK_CORE_VERSION,
        created_by: engineer.id,
        updated_by: engineer.id,
        created_at: now,
        updated_at: now,
      });
    };

    const salineSet = await makeSet(DEMO_SET_NAMES[0], saline, `library:${salineRow.entry_id}`, 'Three specimens from lot 24-118. Invented demo data.');
    for (const [i, f] of [1.04, 0.97, 1.01].entries()) {
      await makeRun(salineSet, `TAB-40 saline, specimen ${i + 1}`, saline, PC_SALINE, f, 701 + i, i === 1 ? 'Edge slightly frayed.' : '');
    }
    const hexaneSet = await makeSet(
      DEMO_SET_NAMES[1],
      hexane,
      'built-in:n-hexane',
      'Fully wetting reference for the contact angle of saline. n-hexane is highly flammable: fume hood, no ignition sources. Invented demo data.',
    );
    await makeRun(hexaneSet, 'TAB-40 n-hexane reference', hexane, pcHexane, 1, 801, 'Run in the fume hood.');
  });
};

export const down: Migration = async ({ context: { sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    const files = await sequelize.query<{ file_id: number }>(
      'SELECT r.file_id FROM lab_runs r JOIN lab_sets s ON s.id = r.set_id WHERE s.name IN (:names)',
      { replacements: { names: [...DEMO_SET_NAMES] }, type: QueryTypes.SELECT, transaction },
    );
    await sequelize.query('DELETE FROM lab_runs r USING lab_sets s WHERE s.id = r.set_id AND s.name IN (:names)', { replacements: { names: [...DEMO_SET_NAMES] }, transaction });
    await sequelize.query('DELETE FROM lab_sets WHERE name IN (:names)', { replacements: { names: [...DEMO_SET_NAMES] }, transaction });
    if (files.length) await sequelize.query('DELETE FROM library_files WHERE id IN (:ids)', { replacements: { ids: files.map((f) => f.file_id) }, transaction });
  });
};
