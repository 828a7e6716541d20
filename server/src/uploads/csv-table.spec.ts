import { decodeText, detectDelimiter, parseHeaderCell, parseNumber, readCsvTable } from './csv-table';
import { formFromHeader } from './psd-csv';
import { parseBlend } from './web-import-csv';

const file = (bytes: Buffer, fileName = 'x.csv') => ({ fileName, mediaType: 'text/csv', bytes });

describe('reading uploaded CSV', () => {
  it('when bytes carry a BOM or are not valid UTF-8, then the encoding is recognised and µ survives', () => {
    const text = 'diameter (µm),x\n';
    expect(decodeText(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(text)]))).toEqual({ text, encoding: 'utf-8' });
    expect(decodeText(Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]))).toEqual({ text, encoding: 'utf-16le' });
    expect(decodeText(Buffer.from(text, 'latin1'))).toEqual({ text, encoding: 'windows-1252' });
    expect(decodeText(Buffer.from(text, 'utf8'))).toEqual({ text, encoding: 'utf-8' });
  });

  it('when a line is split by commas, semicolons, tabs or bars, then that delimiter is chosen (quoted ones do not count)', () => {
    expect(detectDelimiter('a,b,c\n1,2,3')).toBe(',');
    expect(detectDelimiter('# note; with; semicolons\na;b\n1,5;2')).toBe(';');
    expect(detectDelimiter('a\tb\n')).toBe('\t');
    expect(detectDelimiter('"x;y;z",b\n')).toBe(',');
    expect(detectDelimiter('a|b|c\n')).toBe('|');
  });

  it('when a header names a unit in brackets, then name and unit are separated', () => {
    expect(parseHeaderCell('Basis weight (g/m²)')).toEqual({ label: 'Basis weight (g/m²)', key: 'basis weight', unit: 'g/m²' });
    expect(parseHeaderCell('mean_flow-pore  size [µm]')).toEqual({ label: 'mean_flow-pore  size [µm]', key: 'mean flow pore size', unit: 'µm' });
    expect(parseHeaderCell('name')).toEqual({ label: 'name', key: 'name', unit: null });
  });

  it('when numbers use a decimal comma, then it is read only where the delimiter is not a comma', () => {
    expect(parseNumber('12,5', true)).toBe(12.5);
    expect(parseNumber('12,5', false)).toBeNull();
    expect(parseNumber(' 1.5e-3 ', false)).toBe(0.0015);
    expect(parseNumber('−2', false)).toBe(-2);
    expect(parseNumber('12 µm', false)).toBeNull();
    expect(parseNumber('', false)).toBeNull();
    expect(parseNumber('Infinity', false)).toBeNull();
  });

  it('when rows span comment lines, blank lines and quoted line breaks, then each row keeps the line it starts on', () => {
    const t = readCsvTable(file(Buffer.from('# run 3\r\nd (um),f\r\n\r\n1,0.2\r\n"2\r\n",0.5\r\n3,0.3\r\n')), 100);
    expect(t.headerLine).toBe(2);
    expect(t.rows.map((r) => r.line)).toEqual([4, 5, 7]);
    expect(t.info.rows).toBe(3);
  });

  it('when the CSV has an unclosed quote, then 422 names the line', () => {
    try {
      readCsvTable(file(Buffer.from('a,b\n1,2\n"3,4\n')), 100);
      fail('expected a rejection');
    } catch (e) {
      expect((e as { status: number }).status).toBe(422);
      expect((e as { details: { issues: { line: number }[] } }).details.issues[0].line).toBe(3);
    }
  });

  it('when a fraction column is named, then its form follows from the words', () => {
    expect(formFromHeader('cumulative finer')).toBe('cumulative-finer');
    expect(formFromHeader('% coarser')).toBe('cumulative-coarser');
    expect(formFromHeader('differential volume')).toBe('differential');
    expect(formFromHeader('x')).toBeNull();
  });

  it('when a blend is written "A 70% + B 30%", then parts, shares and library links come out', () => {
    const fibres = new Map([['pp 1.7 dtex', 7]]);
    expect(parseBlend('PP 1.7 dtex 70% + PET 30 %', fibres)).toEqual({
      parts: [
        { fibreName: 'PP 1.7 dtex', massFraction: 0.7, fibreId: 7 },
        { fibreName: 'PET', massFraction: 0.3 },
      ],
    });
    expect(parseBlend('Fluff pulp', fibres)).toEqual({ parts: [{ fibreName: 'Fluff pulp', massFraction: 1 }] });
    expect('error' in parseBlend('PP + PET', fibres)).toBeTrue();
  });
});
