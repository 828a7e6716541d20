import { type PoreSizeDistributionData, type PropertySource, type PsdForm, type UploadIssue, unitFits } from 'wick-core';
import { type CsvTable, cellToSI, headerUnitIssue, normalUnit, parseNumber } from './csv-table';

/** Totals within this of 1 are accepted (with a warning when not exact); beyond, the file is refused. */
const TOTAL_TOLERANCE = 0.05;

/** The form a fraction column's name announces, if any. */
export function formFromHeader(key: string): PsdForm | null {
  if (/coarser|larger|greater|above|oversize/.test(key)) return 'cumulative-coarser';
  if (/finer|smaller|below|undersize|passing|cumulative|cum\b/.test(key)) return 'cumulative-finer';
  if (/differential|frequency|fraction|volume|share|percent|%/.test(key)) return 'differential';
  return null;
}

export interface PsdParse {
  readonly psd?: Omit<PoreSizeDistributionData, 'file'>;
  readonly issues: UploadIssue[];
  readonly warnings: UploadIssue[];
}

/**
 * A pore-size distribution CSV: first column the class diameter with its unit in the header ("diameter (µm)"),
 * second the fraction, as a fraction (0–1, header unit "1" or none) or in % ("(%)"). The second header names the
 * form (differential, cumulative finer, cumulative coarser) unless `form` is given. Rows may come largest first.
 */
export function parsePsdCsv(table: CsvTable, options: { form?: PsdForm; source: PropertySource }): PsdParse {
  const issues: UploadIssue[] = [];
  const warnings: UploadIssue[] = [];
  const { header, headerLine, rows, decimalComma } = table;
  if (header.length < 2) {
    return { issues: [{ line: headerLine, message: 'Expected two columns: diameter (with unit) and fraction, e.g. "diameter (µm),cumulative finer (%)".' }], warnings };
  }
  if (header.length > 2) warnings.push({ line: headerLine, message: `Only the first two columns are read; ${header.length - 2} more ignored.` });
  const [dCol, fCol] = header;
  const dIssue = headerUnitIssue(dCol, 'length', headerLine);
  if (dIssue) issues.push(dIssue);
  const fUnit = fCol.unit ?? '1';
  if (!unitFits(fUnit, 'fraction')) {
    issues.push({ line: headerLine, column: fCol.label, message: `"${fUnit}" is not a unit of a fraction: use (%) or no unit for 0–1.` });
  }
  const form = options.form ?? formFromHeader(fCol.key);
  if (!form) {
    issues.push({
      line: headerLine,
      column: fCol.label,
      message: 'Say which form the fractions are in: name the column "differential", "cumulative finer" or "cumulative coarser", or choose the form.',
    });
  }
  if (issues.length) return { issues, warnings };

  const points: { d: number; f: number; line: number }[] = [];
  for (const row of rows) {
    const d = cellToSI(row.cells[0] ?? '', dCol.unit!, 'length', decimalComma, { line: row.line, column: dCol.label });
    const f = cellToSI(row.cells[1] ?? '', fUnit, 'fraction', decimalComma, { line: row.line, column: fCol.label });
    if ('issue' in d) issues.push(d.issue);
    if ('issue' in f) issues.push(f.issue);
    if ('issue' in d || 'issue' in f) continue;
    if (!(d.si > 0)) issues.push({ line: row.line, column: dCol.label, message: 'A pore diameter must be greater than zero.' });
    else if (f.si < 0 || f.si > 1 + 1e-9) {
      const raw = parseNumber(row.cells[1], decimalComma);
      issues.push({
        line: row.line,
        column: fCol.label,
        message: `Fraction ${raw} is outside 0–1${fCol.unit === null && raw !== null && raw > 1 && raw <= 100 ? ': if these are percentages, write (%) in the header' : ''}.`,
      });
    } else points.push({ d: d.si, f: Math.min(1, f.si), line: row.line });
  }
  if (issues.length) return { issues, warnings };
  if (points.length < 2) return { issues: [{ line: null, message: 'A distribution needs at least two rows.' }], warnings };

  const decreasing = points.every((p, i) => i === 0 || p.d < points[i - 1].d);
  if (decreasing) {
    points.reverse();
    warnings.push({ line: null, message: 'Rows were listed from the largest diameter down; they are stored smallest first.' });
  }
  for (let i = 1; i < points.length; i++) {
    if (!(points[i].d > points[i - 1].d)) {
      issues.push({ line: points[i].line, column: dCol.label, message: 'Diameters must increase (or decrease) strictly from row to row.' });
    }
  }
  if (form === 'cumulative-finer' || form === 'cumulative-coarser') {
    const sign = form === 'cumulative-finer' ? 1 : -1;
    for (let i = 1; i < points.length; i++) {
      if (sign * (points[i].f - points[i - 1].f) < -1e-9) {
        issues.push({
          line: points[i].line,
          column: fCol.label,
          message: `A cumulative ${form === 'cumulative-finer' ? 'finer' : 'coarser'} fraction cannot ${sign > 0 ? 'fall' : 'rise'} with diameter.`,
        });
      }
    }
  }
  const total = form === 'differential' ? points.reduce((s, p) => s + p.f, 0) : form === 'cumulative-finer' ? points[points.length - 1].f : points[0].f;
  const what = form === 'differential' ? 'The fractions add up to' : form === 'cumulative-finer' ? 'The largest class reaches' : 'The smallest class reaches';
  if (Math.abs(total - 1) > TOTAL_TOLERANCE) {
    issues.push({ line: null, column: fCol.label, message: `${what} ${(total * 100).toFixed(1)} %, not 100 %: check the column and its unit.` });
  } else if (Math.abs(total - 1) > 1e-6) {
    warnings.push({ line: null, column: fCol.label, message: `${what} ${(total * 100).toFixed(2)} %; models rescale it to 100 %.` });
  }
  if (issues.length) return { issues, warnings };
  return {
    psd: { form: form!, diameterUnit: normalUnit(dCol.unit!, 'length'), diameters: points.map((p) => p.d), fractions: points.map((p) => p.f), source: options.source },
    issues,
    warnings,
  };
}
