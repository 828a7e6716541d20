import {
  type BlendPart,
  type Dimension,
  PROPERTY_SOURCES,
  type PropertySource,
  type PropertyValue,
  type RevisionInput,
  type UploadIssue,
  WEB_KIND_LABELS,
  WEB_KINDS,
  type WebData,
  type WebImportRow,
  type WebKind,
} from 'wick-core';
import { revisionInputSchema } from '../schemas/library';
import { fieldIssues } from '../routes/validate';
import { type CsvTable, type HeaderCell, cellToSI, headerUnitIssue, normalUnit, parseNumber } from './csv-table';

interface NumericColumn {
  readonly field: 'basisWeight' | 'thickness' | 'thicknessPressure' | 'porosity' | 'meanFlowPoreSize' | 'permeabilityInPlane' | 'permeabilityThroughPlane';
  readonly names: readonly string[];
  readonly dimension: Dimension;
  /** Unit assumed when the header has none (only for pure numbers). */
  readonly defaultUnit?: string;
}

const NUMERIC: readonly NumericColumn[] = [
  { field: 'basisWeight', names: ['basis weight', 'grammage', 'bw'], dimension: 'basisWeight' },
  { field: 'thickness', names: ['thickness', 'caliper'], dimension: 'length' },
  { field: 'thicknessPressure', names: ['thickness pressure', 'pressure', 'caliper pressure'], dimension: 'pressure' },
  { field: 'porosity', names: ['porosity'], dimension: 'fraction', defaultUnit: '1' },
  { field: 'meanFlowPoreSize', names: ['mean flow pore size', 'mean flow pore', 'mfp', 'mean pore size'], dimension: 'length' },
  { field: 'permeabilityInPlane', names: ['permeability in plane', 'in plane permeability'], dimension: 'permeability' },
  { field: 'permeabilityThroughPlane', names: ['permeability through plane', 'through plane permeability'], dimension: 'permeability' },
];

const TEXT_COLUMNS = {
  name: ['name', 'web', 'material'],
  supplier: ['supplier', 'vendor'],
  kind: ['kind', 'web kind', 'type', 'process'],
  blend: ['fibres', 'fibers', 'blend', 'fibre blend', 'fiber blend'],
  source: ['source', 'data source'],
  notes: ['notes', 'note', 'comment', 'comments'],
} as const;

export interface ImportLookups {
  /** Supplier ids by lower-case name. */
  readonly suppliers: ReadonlyMap<string, number>;
  /** Library fibre ids by lower-case name (head revision). */
  readonly fibres: ReadonlyMap<string, number>;
}

export interface WebImportParse {
  readonly webs: WebImportRow[];
  readonly issues: UploadIssue[];
  readonly warnings: UploadIssue[];
}

function kindOf(text: string): WebKind | null {
  const k = text.trim().toLowerCase().replace(/[\s_]+/g, '-');
  if ((WEB_KINDS as readonly string[]).includes(k)) return k as WebKind;
  const byLabel = WEB_KINDS.find((w) => WEB_KIND_LABELS[w].toLowerCase() === text.trim().toLowerCase());
  return byLabel ?? null;
}

function sourceOf(text: string): PropertySource | null {
  const k = text.trim().toLowerCase().replace(/[\s_]+/g, '-');
  if (k === '') return null;
  if (k === 'datasheet' || k === 'supplier') return 'supplier-datasheet';
  return (PROPERTY_SOURCES as readonly string[]).includes(k) ? (k as PropertySource) : null;
}

/**
 * "PP staple 1.7 dtex 70% + PET 6.7 dtex 30%" → parts; a single fibre without a share is 100 %.
 * Shares may also be written "70 %" or as a fraction "0.7"; the part names are matched to library fibres.
 */
export function parseBlend(cell: string, fibres: ReadonlyMap<string, number>): { parts: BlendPart[] } | { error: string } {
  const pieces = cell.split('+').map((p) => p.trim()).filter((p) => p !== '');
  if (pieces.length === 0) return { error: 'Name the fibres, e.g. "PP 1.7 dtex 70% + PET 6.7 dtex 30%".' };
  const parts: BlendPart[] = [];
  for (const piece of pieces) {
    const m = /^(.*?)\s+(\d+(?:[.,]\d+)?)\s*%$/.exec(piece);
    let name = piece;
    let fraction: number | null = null;
    if (m) {
      name = m[1].trim();
      fraction = Number(m[2].replace(',', '.')) / 100;
    } else if (pieces.length === 1) {
      fraction = 1;
    } else {
      return { error: `Give the share of "${piece}" in %, e.g. "${piece} 30%".` };
    }
    const fibreId = fibres.get(name.toLowerCase());
    parts.push({ fibreName: name, massFraction: fraction, ...(fibreId !== undefined ? { fibreId } : {}) });
  }
  return { parts };
}

function find(header: readonly HeaderCell[], names: readonly string[]): number {
  return header.findIndex((h) => names.includes(h.key));
}

/**
 * Bulk import of webs: one web per row, a draft revision each. Columns (any order, case-insensitive):
 * name, supplier, kind, fibres, basis weight (unit), thickness (unit), thickness pressure (unit), porosity
 * (% or 0–1), mean flow pore size (unit), permeability in plane / through plane (unit), source, notes.
 * Every row is checked with the same schema as the API; any problem in any row rejects the whole file.
 */
export function parseWebImportCsv(table: CsvTable, lookups: ImportLookups): WebImportParse {
  const issues: UploadIssue[] = [];
  const warnings: UploadIssue[] = [];
  const { header, headerLine, rows, decimalComma } = table;
  const col = {
    name: find(header, TEXT_COLUMNS.name),
    supplier: find(header, TEXT_COLUMNS.supplier),
    kind: find(header, TEXT_COLUMNS.kind),
    blend: find(header, TEXT_COLUMNS.blend),
    source: find(header, TEXT_COLUMNS.source),
    notes: find(header, TEXT_COLUMNS.notes),
  };
  const numeric = NUMERIC.map((n) => ({ ...n, index: find(header, n.names) }));
  for (const [key, label] of [['name', 'name'], ['kind', 'kind'], ['blend', 'fibres'], ['basisWeight', 'basis weight (g/m²)']] as const) {
    const idx = key === 'basisWeight' ? numeric[0].index : col[key];
    if (idx < 0) issues.push({ line: headerLine, message: `Missing column "${label}".` });
  }
  for (const n of numeric) {
    if (n.index < 0) continue;
    const h = header[n.index];
    if (h.unit === null && n.defaultUnit) continue;
    const issue = headerUnitIssue(h, n.dimension, headerLine);
    if (issue) issues.push(issue);
  }
  const known = new Set([...Object.values(col), ...numeric.map((n) => n.index)]);
  header.forEach((h, i) => {
    if (!known.has(i)) warnings.push({ line: headerLine, column: h.label, message: `Column "${h.label}" is not known and was ignored.` });
  });
  if (issues.length) return { webs: [], issues, warnings };

  const schema = revisionInputSchema('web');
  const webs: WebImportRow[] = [];
  const names = new Map<string, number>();
  for (const row of rows) {
    const cell = (i: number) => (i >= 0 ? (row.cells[i] ?? '').trim() : '');
    const rowIssues: UploadIssue[] = [];
    const at = (column: string, message: string) => rowIssues.push({ line: row.line, column, message });

    const name = cell(col.name);
    const seen = names.get(name.toLowerCase());
    if (name && seen !== undefined) at(header[col.name].label, `"${name}" is also on line ${seen}.`);
    names.set(name.toLowerCase(), row.line);
    const webKind = kindOf(cell(col.kind));
    if (!webKind) at(header[col.kind].label, `Unknown kind "${cell(col.kind)}"; use one of: ${WEB_KINDS.join(', ')}.`);
    let supplierId: number | null = null;
    if (cell(col.supplier)) {
      supplierId = lookups.suppliers.get(cell(col.supplier).toLowerCase()) ?? null;
      if (supplierId === null) at(header[col.supplier].label, `Unknown supplier "${cell(col.supplier)}".`);
    }
    let source: PropertySource = 'measured';
    if (col.source >= 0 && cell(col.source)) {
      const s = sourceOf(cell(col.source));
      if (!s) at(header[col.source].label, `Unknown source "${cell(col.source)}"; use measured, supplier datasheet, handbook or estimate.`);
      else source = s;
    }
    const blend = parseBlend(cell(col.blend), lookups.fibres);
    if ('error' in blend) at(header[col.blend].label, blend.error);

    const values: Partial<Record<NumericColumn['field'], PropertyValue>> = {};
    for (const n of numeric) {
      const text = cell(n.index);
      if (n.index < 0 || text === '') continue;
      const h = header[n.index];
      const unit = h.unit ?? n.defaultUnit!;
      if (n.field === 'porosity' && h.unit === null && (parseNumber(text, decimalComma) ?? 0) > 1) {
        at(h.label, `Porosity ${text} is above 1: if it is in %, write "porosity (%)" in the header.`);
        continue;
      }
      const r = cellToSI(text, unit, n.dimension, decimalComma, { line: row.line, column: h.label });
      if ('issue' in r) rowIssues.push(r.issue);
      else values[n.field] = { si: r.si, unit: normalUnit(unit, n.dimension), source };
    }
    if (rowIssues.length) {
      issues.push(...rowIssues);
      continue;
    }
    const measured = (v: PropertyValue | undefined) => (v ? { mode: 'measured' as const, value: v } : undefined);
    const data: WebData = {
      webKind: webKind!,
      blend: 'parts' in blend ? blend.parts : [],
      basisWeight: values.basisWeight!,
      ...(values.thickness ? { thickness: values.thickness } : {}),
      ...(values.thicknessPressure ? { thicknessPressure: values.thicknessPressure } : {}),
      porosityMode: values.porosity ? 'measured' : 'computed',
      ...(values.porosity ? { porosity: values.porosity } : {}),
      ...(values.meanFlowPoreSize ? { meanFlowPoreSize: values.meanFlowPoreSize } : {}),
      ...(values.permeabilityInPlane ? { permeabilityInPlane: measured(values.permeabilityInPlane) } : {}),
      ...(values.permeabilityThroughPlane ? { permeabilityThroughPlane: measured(values.permeabilityThroughPlane) } : {}),
      curves: [],
    };
    const input: RevisionInput<WebData> = { name, supplierId, notes: cell(col.notes), data };
    const parsed = schema.safeParse(input);
    if (!parsed.success) {
      for (const f of fieldIssues(parsed.error)) issues.push({ line: row.line, column: f.field.replace(/^data\./, ''), message: f.message });
      continue;
    }
    webs.push({ line: row.line, input: parsed.data });
  }
  if (rows.length === 0) issues.push({ line: null, message: 'The file has a header but no webs.' });
  return { webs: issues.length ? [] : webs, issues, warnings };
}
