/**
 * Reading an uploaded CSV file defensively: refuse binaries, detect the text encoding and the delimiter, parse
 * with csv-parse, and keep each row's line number in the file for error messages.
 */
import { createHash } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import { type Dimension, DomainError, dimensionInfo, parseQuantity, toSI, unitFits, type UploadFileInfo, type UploadIssue } from 'wick-core';
import { AppError } from '../errors';

export interface UploadedFile {
  readonly fileName: string;
  readonly mediaType: string;
  readonly bytes: Buffer;
}

export interface HeaderCell {
  /** As written in the file. */
  readonly label: string;
  /** Lower case, units removed, runs of spaces, dashes and underscores made one space: "basis weight". */
  readonly key: string;
  /** Unit in brackets, "(g/m²)" or "[um]"; null when none. */
  readonly unit: string | null;
}

export interface TableRow {
  /** 1-based line in the file where the row starts. */
  readonly line: number;
  readonly cells: readonly string[];
}

export interface CsvTable {
  readonly info: UploadFileInfo;
  readonly header: readonly HeaderCell[];
  readonly headerLine: number;
  readonly rows: readonly TableRow[];
  /** A delimiter other than the comma lets a decimal comma through ("12,5"). */
  readonly decimalComma: boolean;
  readonly sha256: string;
}

/** Signatures of file types people upload by mistake instead of CSV. */
const MAGIC: readonly { readonly bytes: readonly number[]; readonly what: string }[] = [
  { bytes: [0x50, 0x4b, 0x03, 0x04], what: 'a ZIP archive or an Excel/ODS workbook (.xlsx, .ods)' },
  { bytes: [0xd0, 0xcf, 0x11, 0xe0], what: 'an old Excel workbook (.xls)' },
  { bytes: [0x25, 0x50, 0x44, 0x46], what: 'a PDF' },
  { bytes: [0x89, 0x50, 0x4e, 0x47], what: 'a PNG image' },
  { bytes: [0xff, 0xd8, 0xff], what: 'a JPEG image' },
  { bytes: [0x1f, 0x8b], what: 'a gzip archive' },
];

function startsWith(buf: Buffer, bytes: readonly number[]): boolean {
  return buf.length >= bytes.length && bytes.every((b, i) => buf[i] === b);
}

export function sha256Of(bytes: Buffer): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** Refuses a file that is not text (415), naming what it looks like. */
export function refuseBinary(file: UploadedFile): void {
  const magic = MAGIC.find((m) => startsWith(file.bytes, m.bytes));
  const utf16 = startsWith(file.bytes, [0xff, 0xfe]) || startsWith(file.bytes, [0xfe, 0xff]);
  let binary = magic?.what ?? null;
  if (!binary && !utf16) {
    const sample = file.bytes.subarray(0, 8192);
    let control = 0;
    for (const b of sample) {
      if (b === 0) {
        binary = 'a binary file';
        break;
      }
      if (b < 0x09 || (b > 0x0d && b < 0x20)) control++;
    }
    if (!binary && sample.length > 0 && control / sample.length > 0.05) binary = 'a binary file';
  }
  if (binary) {
    throw new AppError(415, 'binary-file', `"${file.fileName}" looks like ${binary}, not a CSV text file. Save it as CSV (comma or semicolon separated) and upload that.`, {
      issues: [{ line: null, message: `Not a text file: looks like ${binary}.` }],
    });
  }
}

/** UTF-8 (with or without BOM), UTF-16 with BOM, else Windows-1252 (what spreadsheet programs write by default). */
export function decodeText(bytes: Buffer): { text: string; encoding: string } {
  if (startsWith(bytes, [0xef, 0xbb, 0xbf])) return { text: new TextDecoder('utf-8').decode(bytes.subarray(3)), encoding: 'utf-8' };
  if (startsWith(bytes, [0xff, 0xfe])) return { text: new TextDecoder('utf-16le').decode(bytes.subarray(2)), encoding: 'utf-16le' };
  if (startsWith(bytes, [0xfe, 0xff])) return { text: new TextDecoder('utf-16be').decode(bytes.subarray(2)), encoding: 'utf-16be' };
  try {
    return { text: new TextDecoder('utf-8', { fatal: true }).decode(bytes), encoding: 'utf-8' };
  } catch {
    return { text: new TextDecoder('windows-1252').decode(bytes), encoding: 'windows-1252' };
  }
}

const DELIMITERS = [',', ';', '\t', '|'] as const;

/** The candidate that splits the first data-looking line into the most fields (quotes respected). */
export function detectDelimiter(text: string): string {
  const line = text.split('\n').find((l) => l.trim() !== '' && !l.trimStart().startsWith('#')) ?? '';
  let best: string = ',';
  let bestCount = 0;
  for (const d of DELIMITERS) {
    let count = 0;
    let quoted = false;
    for (const ch of line) {
      if (ch === '"') quoted = !quoted;
      else if (ch === d && !quoted) count++;
    }
    if (count > bestCount) {
      best = d;
      bestCount = count;
    }
  }
  return best;
}

/** "Basis weight (g/m²)" → { key: 'basis weight', unit: 'g/m²' }. */
export function parseHeaderCell(label: string): HeaderCell {
  const m = /^(.*?)\s*[([]\s*([^)\]]*?)\s*[)\]]\s*$/.exec(label);
  const name = (m ? m[1] : label).trim();
  const unit = m && m[2] !== '' ? m[2] : null;
  const key = name
    .toLowerCase()
    .replace(/[\s_\-–]+/g, ' ')
    .replace(/[.:]+$/, '')
    .trim();
  return { label, key, unit };
}

const NUMBER_RE = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** A plain number ("12.5", "1e-3", and "12,5" when the delimiter allows a decimal comma), else null. */
export function parseNumber(cell: string, decimalComma: boolean): number | null {
  let s = cell.trim().replace(/−/g, '-').replace(/[\u00a0\u202f ]/g, '');
  if (decimalComma && /^[+-]?\d*,\d+(?:[eE][+-]?\d+)?$/.test(s)) s = s.replace(',', '.');
  if (!NUMBER_RE.test(s)) return null;
  const n = Number(s);
  return Number.isFinite(n) ? n : null;
}

/** Converts a cell in `unit` to SI, or returns an issue. */
export function cellToSI(
  cell: string,
  unit: string,
  dimension: Dimension,
  decimalComma: boolean,
  where: { line: number; column: string },
): { si: number } | { issue: UploadIssue } {
  const v = parseNumber(cell, decimalComma);
  if (v === null) {
    return { issue: { line: where.line, column: where.column, message: `"${cell}" is not a number.` } };
  }
  try {
    return { si: toSI(v, unit, dimension) };
  } catch (e) {
    if (e instanceof DomainError) return { issue: { line: where.line, column: where.column, message: e.message } };
    throw e;
  }
}

/** A unit as the units module writes it ('µm' → 'um', '°C' → 'degC'), as stored beside SI values. */
export function normalUnit(unit: string, dimension: Dimension): string {
  return parseQuantity(`1 ${unit}`, dimension).unit;
}

/** Checks that a header unit is a unit of `dimension`; the issue is on the header line. */
export function headerUnitIssue(cell: HeaderCell, dimension: Dimension, headerLine: number): UploadIssue | null {
  const info = dimensionInfo(dimension);
  if (cell.unit === null) {
    return { line: headerLine, column: cell.label, message: `Put the unit in the header, e.g. "${cell.label} (${info.example.split(' ').slice(1).join(' ') || info.si})".` };
  }
  if (!unitFits(cell.unit, dimension)) {
    return { line: headerLine, column: cell.label, message: `"${cell.unit}" is not a unit of ${info.words} (e.g. ${info.example}).` };
  }
  return null;
}

export function reject(info: UploadFileInfo | undefined, issues: readonly UploadIssue[], maxShown = 200): AppError {
  const shown = issues.slice(0, maxShown);
  const more = issues.length > maxShown ? [{ line: null, message: `… and ${issues.length - maxShown} more problems.` }] : [];
  const first = issues[0];
  const where = first?.line ? `line ${first.line}: ` : '';
  return new AppError(
    422,
    'upload-invalid',
    `The file was not imported: ${issues.length} problem${issues.length === 1 ? '' : 's'} (${where}${first?.message ?? 'unreadable'}). Nothing was changed.`,
    { ...(info ? { file: info } : {}), issues: [...shown, ...more] },
  );
}

/**
 * Decodes and parses `file` into a header and rows with line numbers. Lines starting with `#` are comments.
 * @throws AppError 415 for binaries, 422 `upload-invalid` for unreadable CSV, an empty file or too many rows.
 */
export function readCsvTable(file: UploadedFile, maxRows: number): CsvTable {
  refuseBinary(file);
  const { text: raw, encoding } = decodeText(file.bytes);
  const text = raw.replace(/\r\n?/g, '\n');
  const delimiter = detectDelimiter(text);
  const sha256 = sha256Of(file.bytes);
  const baseInfo = { fileName: file.fileName, size: file.bytes.length, sha256, encoding, delimiter: delimiter === '\t' ? 'tab' : delimiter };
  // `info.lines` is the line a record ends on; line breaks inside quoted cells move its start back.
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, {
      delimiter,
      relax_column_count: true,
      skip_empty_lines: true,
      comment: '#',
      comment_no_infix: true,
      trim: true,
      info: true,
    }) as unknown as typeof records;
  } catch (e) {
    const lines = (e as { lines?: number }).lines ?? null;
    throw reject({ ...baseInfo, rows: 0 }, [{ line: lines, message: `The CSV cannot be read: ${e instanceof Error ? e.message : String(e)}` }]);
  }
  const rows: TableRow[] = records
    .filter((r) => r.record.some((c) => c !== ''))
    .map((r) => ({ line: r.info.lines - r.record.reduce((n, c) => n + (c.match(/\n/g)?.length ?? 0), 0), cells: r.record }));
  const info: UploadFileInfo = { ...baseInfo, rows: Math.max(0, rows.length - 1) };
  if (rows.length === 0) throw reject(info, [{ line: null, message: 'The file is empty.' }]);
  if (rows.length - 1 > maxRows) {
    throw reject(info, [{ line: rows[maxRows + 1].line, message: `Too many rows: at most ${maxRows} data rows are accepted, the file has ${rows.length - 1}.` }]);
  }
  const [head, ...data] = rows;
  return {
    info,
    header: head.cells.map(parseHeaderCell),
    headerLine: head.line,
    rows: data,
    decimalComma: delimiter !== ',',
    sha256,
  };
}
