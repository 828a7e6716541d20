/**
 * Exports: CSV of a variant (inputs with their sources, key figures, warnings), of its curves, and of a
 * comparison; the data of the printable report pages. Every export is written to the audit log.
 */
import {
  anyKeyFigures,
  describeAnyInputs,
  isStackResults,
  SAFETY_NOTE,
  type AnyVariantInputs,
  type AnyVariantResults,
  type ComparisonReport,
  type VariantDetail,
  type VariantReport,
} from 'wick-core';
import type { SessionUser } from '../auth/authorize';
import { audit } from './audit';
import { compareVariants } from './compare';
import { getVariant, type DesignsContext } from './designs';

type Cell = string | number | boolean | null | undefined;

/** Text that a spreadsheet would run as a formula gets a leading apostrophe (CSV injection). */
function safeText(s: string): string {
  return /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
}

/** One RFC 4180 line: fields with a comma, quote or line break are quoted, quotes doubled. */
function csvLine(cells: readonly Cell[]): string {
  return cells
    .map((c) => {
      if (c === null || c === undefined) return '';
      if (typeof c === 'number') return Number.isFinite(c) ? String(c) : '';
      const s = typeof c === 'boolean' ? (c ? 'yes' : 'no') : safeText(c);
      return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
    })
    .join(',');
}

export function toCsv(rows: readonly (readonly Cell[])[]): string {
  return rows.map(csvLine).join('\r\n') + '\r\n';
}

/** A file name from a label: letters, digits and dashes. */
export function fileName(label: string, ext: string): string {
  const base = label.normalize('NFKD').replace(/[^\w-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80) || 'export';
  return `${base}.${ext}`;
}

/** A detail's inputs and results as they are stored: a layer variant's or a stack's. */
const kindsOf = (v: VariantDetail) => ({ inputs: v.inputs as AnyVariantInputs, results: v.results as AnyVariantResults });

function materialCells(v: Pick<VariantDetail, 'materials' | 'usesUnapproved'>): string {
  if (v.materials.length === 0) return 'none (ad-hoc inputs)';
  return v.materials.map((m) => `${m.kind} ${m.name} rev ${m.revision} (${m.approved ? 'approved' : `${m.state}, not approved`})`).join('; ');
}

/** `section,name,value,unit,source` rows: variant, inputs, key figures, warnings, safety note. */
export function variantCsv(v: VariantDetail): string {
  const rows: Cell[][] = [['section', 'name', 'value', 'unit', 'source']];
  rows.push(
    ['variant', 'Name', v.name, '', ''],
    ['variant', 'Project', v.projectName, '', ''],
    ['variant', 'Design', v.designName, '', ''],
    ['variant', 'Library materials', materialCells(v), '', ''],
    ['variant', 'Uses unapproved material', v.usesUnapproved, '', ''],
    ['variant', 'wick-core version', v.coreVersion, '', ''],
    ['variant', 'Saved', v.updatedAt, '', v.updatedBy.name],
  );
  const { inputs, results } = kindsOf(v);
  for (const r of describeAnyInputs(inputs, results)) rows.push(['input', r.label, r.value, r.unit, r.source]);
  for (const f of anyKeyFigures(results)) rows.push(['result', f.label, f.value ?? f.nullMeans ?? null, f.unit, '']);
  if (isStackResults(results)) {
    for (const l of results.layers) rows.push(['result', `${l.name}: permeability from`, l.permeabilityLabel, '', l.permeabilitySource ?? '']);
  } else if (results.status === 'ok') {
    rows.push(['result', 'Capillary pressure method', results.capillaryPressure.method, '', '']);
    rows.push(['result', 'Permeability from', results.permeability.label, '', results.permeability.source ?? '']);
  }
  for (const w of v.results.warnings) rows.push(['warning', w.code, w.message, '', '']);
  rows.push(['note', 'Safety note', SAFETY_NOTE, '', '']);
  return toCsv(rows);
}

/**
 * Curve points: time and height with and without gravity, uptake, rate and the tolerance band; for a stack, the
 * liquid supplied, absorbed and on the surface and the front depth at each snapshot.
 */
export function variantCurveCsv(v: VariantDetail): string {
  const { results: r } = kindsOf(v);
  if (isStackResults(r)) {
    const c = r.curves;
    return toCsv([
      ['time_s', 'supplied_m3', 'absorbed_m3', 'surface_liquid_m3', 'front_depth_m'],
      ...c.time.map((t, i) => [t, c.supplied[i], c.absorbed[i], c.surfaceLiquid[i], c.frontDepth[i]]),
    ]);
  }
  const rows: Cell[][] = [
    ['time_s', 'height_m', 'height_no_gravity_m', 'mass_kg', 'mass_rate_kg_per_s', 'p10_m', 'p50_m', 'p90_m'],
  ];
  if (r.status === 'ok') {
    r.curves.time.forEach((t, i) =>
      rows.push([
        t,
        r.curves.height[i],
        r.curves.heightNoGravity[i],
        r.curves.mass?.[i],
        r.curves.massRate?.[i],
        r.bands?.curve.p10[i],
        r.bands?.curve.p50[i],
        r.bands?.curve.p90[i],
      ]),
    );
  }
  return toCsv(rows);
}

export async function exportVariantCsv(
  ctx: DesignsContext,
  id: number,
  what: 'summary' | 'curve',
  user: SessionUser,
): Promise<{ fileName: string; csv: string }> {
  const v = await getVariant(ctx, id);
  const csv = what === 'summary' ? variantCsv(v) : variantCurveCsv(v);
  await ctx.sequelize.transaction((tx) =>
    audit(tx, { actorId: user.id, action: 'export', entityType: 'variant', entityId: id, details: { name: v.name, format: `csv-${what}` } }),
  );
  return { fileName: fileName(`${v.name}${what === 'curve' ? '-curve' : ''}`, 'csv'), csv };
}

/**
 * Comparison CSV: one row per key figure, for each variant its value, its delta against the baseline and
 * whether it is the best; heading rows name the variants and mark unapproved material.
 */
export async function exportComparisonCsv(
  ctx: DesignsContext,
  ids: readonly number[],
  baselineId: number | undefined,
  user: SessionUser,
): Promise<{ fileName: string; csv: string }> {
  const c = await compareVariants(ctx, ids, baselineId);
  const head: Cell[] = ['figure', 'unit', 'better'];
  for (const v of c.variants) head.push(`${v.name} (#${v.id})`, `${v.name} delta vs baseline`, `${v.name} best`);
  const meta = (label: string, get: (v: (typeof c.variants)[number]) => Cell): Cell[] => [
    label,
    '',
    '',
    ...c.variants.flatMap((v) => [get(v), '', '']),
  ];
  const rows: Cell[][] = [
    head,
    meta('Variant id', (v) => v.id),
    meta('Project', (v) => v.projectName),
    meta('Design', (v) => v.designName),
    meta('Configuration', (v) => v.configuration),
    meta('Baseline', (v) => v.id === c.baselineId),
    meta('Uses unapproved material', (v) => v.usesUnapproved),
  ];
  for (const f of c.figures) {
    rows.push([f.label, f.unit, f.better ?? '', ...f.values.flatMap((x) => [x.value ?? x.note ?? null, x.delta, x.best])]);
  }
  rows.push(['Safety note', SAFETY_NOTE, '', ...c.variants.flatMap(() => ['', '', ''])]);
  await ctx.sequelize.transaction((tx) =>
    audit(tx, { actorId: user.id, action: 'export', entityType: 'comparison', entityId: null, details: { variantIds: ids, baselineVariantId: c.baselineId, format: 'csv' } }),
  );
  return { fileName: fileName(`comparison-${c.variants.map((v) => v.id).join('-')}`, 'csv'), csv: toCsv(rows) };
}

export function variantReport(v: VariantDetail): VariantReport {
  return {
    variant: v,
    inputRows: describeAnyInputs(kindsOf(v).inputs, kindsOf(v).results),
    keyFigures: anyKeyFigures(kindsOf(v).results),
    equations: v.results.equations,
    warnings: v.results.warnings,
    safetyNote: SAFETY_NOTE,
    generatedAt: new Date().toISOString(),
  };
}

export async function getVariantReport(ctx: DesignsContext, id: number, user: SessionUser): Promise<VariantReport> {
  const v = await getVariant(ctx, id);
  await ctx.sequelize.transaction((tx) =>
    audit(tx, { actorId: user.id, action: 'export', entityType: 'variant', entityId: id, details: { name: v.name, format: 'report' } }),
  );
  return variantReport(v);
}

export async function getComparisonReport(
  ctx: DesignsContext,
  ids: readonly number[],
  baselineId: number | undefined,
  user: SessionUser,
): Promise<ComparisonReport> {
  const comparison = await compareVariants(ctx, ids, baselineId);
  const variants = await Promise.all(comparison.variants.map(async (v) => variantReport(await getVariant(ctx, v.id))));
  await ctx.sequelize.transaction((tx) =>
    audit(tx, { actorId: user.id, action: 'export', entityType: 'comparison', entityId: null, details: { variantIds: ids, baselineVariantId: comparison.baselineId, format: 'report' } }),
  );
  return { comparison, variants, safetyNote: SAFETY_NOTE, generatedAt: new Date().toISOString() };
}
