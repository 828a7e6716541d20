import { type CurveMeasurement, type LabCurve, type UploadIssue, unitFits } from 'wick-core';
import { type CsvTable, cellToSI, headerUnitIssue, normalUnit } from './csv-table';

export interface CurveParse {
  readonly curve?: Omit<LabCurve, 'key' | 'name' | 'liquid' | 'file'>;
  readonly issues: UploadIssue[];
  readonly warnings: UploadIssue[];
}

/**
 * A lab wicking curve CSV: time with its unit ("time (s)", "t [min]") and either height ("height (mm)") or mass
 * ("mass (g)"). The second column's unit decides which, unless `measurement` is given and then must agree.
 */
export function parseCurveCsv(table: CsvTable, measurement?: CurveMeasurement): CurveParse {
  const issues: UploadIssue[] = [];
  const warnings: UploadIssue[] = [];
  const { header, headerLine, rows, decimalComma } = table;
  if (header.length < 2) {
    return { issues: [{ line: headerLine, message: 'Expected two columns: time and height or mass, each with its unit, e.g. "time (s),height (mm)".' }], warnings };
  }
  if (header.length > 2) warnings.push({ line: headerLine, message: `Only the first two columns are read; ${header.length - 2} more ignored.` });
  const [tCol, yCol] = header;
  const tIssue = headerUnitIssue(tCol, 'time', headerLine);
  if (tIssue) issues.push(tIssue);
  let kind: CurveMeasurement | null = measurement ?? null;
  if (yCol.unit === null) {
    issues.push({ line: headerLine, column: yCol.label, message: `Put the unit in the header, e.g. "${yCol.label} (mm)" for a height or "${yCol.label} (g)" for a mass.` });
  } else if (!kind) {
    kind = unitFits(yCol.unit, 'length') ? 'height' : unitFits(yCol.unit, 'mass') ? 'mass' : null;
    if (!kind) issues.push({ line: headerLine, column: yCol.label, message: `"${yCol.unit}" is neither a length (height) nor a mass.` });
  } else {
    const issue = headerUnitIssue(yCol, kind === 'height' ? 'length' : 'mass', headerLine);
    if (issue) issues.push(issue);
  }
  if (issues.length || !kind) return { issues, warnings };
  const dim = kind === 'height' ? 'length' : 'mass';
  const times: number[] = [];
  const values: number[] = [];
  let lastLine = headerLine;
  for (const row of rows) {
    const t = cellToSI(row.cells[0] ?? '', tCol.unit!, 'time', decimalComma, { line: row.line, column: tCol.label });
    const y = cellToSI(row.cells[1] ?? '', yCol.unit!, dim, decimalComma, { line: row.line, column: yCol.label });
    if ('issue' in t) issues.push(t.issue);
    if ('issue' in y) issues.push(y.issue);
    if ('issue' in t || 'issue' in y) continue;
    if (t.si < 0) issues.push({ line: row.line, column: tCol.label, message: 'Time cannot be negative.' });
    else if (times.length && !(t.si > times[times.length - 1])) {
      issues.push({ line: row.line, column: tCol.label, message: `Times must increase from row to row (line ${lastLine} has a later or equal time).` });
    } else {
      times.push(t.si);
      values.push(y.si);
      lastLine = row.line;
    }
  }
  if (issues.length) return { issues, warnings };
  if (times.length < 2) return { issues: [{ line: null, message: 'A curve needs at least two rows.' }], warnings };
  return {
    curve: { measurement: kind, timeUnit: normalUnit(tCol.unit!, 'time'), valueUnit: normalUnit(yCol.unit!, dim), times, values },
    issues,
    warnings,
  };
}
