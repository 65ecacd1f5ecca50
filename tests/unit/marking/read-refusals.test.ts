import { readFileSync } from 'node:fs';
import JSZip from 'jszip';
import { describe, expect, it } from 'vitest';
import {
  READ_ERROR_CODES,
  READ_ERROR_CODE_LIST,
  detectFileType,
  readReport,
  type ReadErrorCode,
  type ReadResult,
} from '@shared/marking/read';
import {
  H2_LIKE,
  buildCompoundFile,
  buildCsvText,
  buildPdf,
  buildRawWorkbook,
  buildTemplateWorkbook,
  buildWorkbook,
  curveTable,
  editZip,
  grid,
  morseEnergyHartree,
  patchDeclaredSizes,
  utf8Bytes,
  zipText,
} from '../../fixtures/reports/make-fixtures';

const fixtureDir = new URL('../../fixtures/reports/', import.meta.url);
const fixture = (name: string) => new Uint8Array(readFileSync(new URL(name, fixtureDir)));

function refusal(result: ReadResult) {
  if (result.ok) throw new Error('expected a refusal, got ok');
  return result.error;
}

describe('error codes', () => {
  it('every code has a meaning, and the list is the keys', () => {
    expect(READ_ERROR_CODE_LIST).toEqual(Object.keys(READ_ERROR_CODES));
    for (const code of READ_ERROR_CODE_LIST) expect(READ_ERROR_CODES[code].length).toBeGreaterThan(20);
    for (const code of ['empty_file', 'too_few_points', 'not_a_number', 'nonpositive_distance', 'duplicate_distance', 'macro_workbook', 'encrypted_workbook', 'legacy_xls', 'too_large', 'unreadable', 'no_numeric_data', 'date_in_numeric_cell', 'unknown_type']) {
      expect(READ_ERROR_CODE_LIST).toContain(code);
    }
  });
});

describe('committed bad files: code, place and expectation', () => {
  const cases: [string, ReadErrorCode, { row?: number; column?: string; sheet?: string }, string][] = [
    ['empty.csv', 'empty_file', {}, 'The file is empty.'],
    ['only-comments.csv', 'empty_file', {}, 'only blank lines and comments'],
    ['no-numbers.csv', 'no_numeric_data', {}, 'two or more numbers'],
    ['one-column.csv', 'too_few_columns', { row: 2 }, 'one column of numbers'],
    ['text-in-cell.csv', 'not_a_number', { row: 5, column: 'B' }, 'Row 5, column B holds "n/a"; expected an energy (a number in Eₕ).'],
    ['nan-in-cell.csv', 'not_a_number', { row: 4, column: 'B' }, 'Row 4, column B holds "NaN"'],
    ['nonpositive-distance.csv', 'nonpositive_distance', { row: 2, column: 'A' }, 'Row 2, column A gives the distance 0'],
    ['duplicate-distance.csv', 'duplicate_distance', { row: 5, column: 'A' }, 'Rows 3 and 5 (column A) both give the distance 1.2'],
    ['too-few-points.csv', 'too_few_points', { row: 5, column: 'A' }, 'Only 4 points (rows 2–5)'],
    ['missing-energy.csv', 'missing_value', { row: 3, column: 'B' }, 'Row 3, column B is empty'],
    ['unterminated-quote.csv', 'unreadable', { row: 3 }, 'never closed'],
    ['date-in-cell.xlsx', 'date_in_numeric_cell', { sheet: 'Sheet1', row: 5, column: 'A' }, 'holds a date'],
    ['macro.xlsm', 'macro_workbook', {}, 'macro-enabled'],
    ['encrypted.xlsx', 'encrypted_workbook', {}, 'password-protected'],
    ['legacy.xls', 'legacy_xls', {}, 'Save it as .xlsx or CSV'],
    ['write-up.pdf', 'pdf_file', {}, 'PDF'],
  ];
  for (const [name, code, place, text] of cases) {
    it(`${name} → ${code}`, async () => {
      const error = refusal(await readReport(fixture(name), { fileName: name }));
      expect(error.code).toBe(code);
      expect(error).toMatchObject(place);
      expect(error.message).toContain(text);
      expect(error.expected).toBeTruthy();
    });
  }

  it('several bad cells: the first is named and the rest counted', async () => {
    const error = refusal(await readReport(utf8Bytes('R,E\n1,-1\n2,x\n3,y\n4,-1.1\n5,z\n')));
    expect(error).toMatchObject({ code: 'not_a_number', row: 3, column: 'B' });
    expect(error.message).toContain('(2 more cells in the table have the same problem.)');
  });

  it('a decimal point in a decimal-comma file is explained', async () => {
    const error = refusal(await readReport(utf8Bytes('R;E\n1,0;-1,1\n1,5;-1.17\n2,0;-1,15\n2,5;-1,12\n3,0;-1,09\n')));
    expect(error).toMatchObject({ code: 'not_a_number', row: 3, column: 'B' });
    expect(error.message).toContain('decimal comma');
  });

  it('a NaN row at the top of the table is refused in place, not skipped', async () => {
    const error = refusal(await readReport(utf8Bytes('1.0,NaN\n1.2,-1.16\n1.4,-1.17\n1.6,-1.17\n1.8,-1.16\n2.0,-1.14\n')));
    expect(error).toMatchObject({ code: 'not_a_number', row: 1, column: 'B' });
  });

  it('a missing distance with energies present is missing_value in the distance column', async () => {
    const error = refusal(await readReport(utf8Bytes('R,E\n1.0,-1.12\n,-1.16\n1.4,-1.17\n1.6,-1.17\n1.8,-1.16\n')));
    expect(error).toMatchObject({ code: 'missing_value', row: 3, column: 'A' });
  });

  it('a table with distances and no energy column is too_few_columns', async () => {
    const error = refusal(await readReport(utf8Bytes('R / bohr,S\n1,0.8\n2,0.6\n3,0.4\n4,0.2\n5,0.1\n')));
    expect(error).toMatchObject({ code: 'too_few_columns', column: 'A' });
  });
});

describe('containers', () => {
  const csv = buildCsvText(curveTable(grid(0.6, 0.2, 28)), { header: ['R / bohr', 'E / Eh'] });

  it('detectFileType decides by content, and notes a misleading extension', async () => {
    expect(detectFileType(fixture('template-filled.xlsx'), 'report.xlsx')).toMatchObject({ kind: 'xlsx' });
    expect(detectFileType(fixture('macro.xlsm'))).toMatchObject({ kind: 'xlsm' });
    expect(detectFileType(fixture('encrypted.xlsx'))).toMatchObject({ kind: 'encrypted' });
    expect(detectFileType(fixture('legacy.xls'))).toMatchObject({ kind: 'xls' });
    expect(detectFileType(buildPdf())).toMatchObject({ kind: 'pdf' });
    expect(detectFileType(new Uint8Array(0))).toMatchObject({ kind: 'empty' });
    expect(detectFileType(utf8Bytes(csv), 'report.xlsx')).toMatchObject({ kind: 'text', encoding: 'utf-8', bom: false, nameSuggests: 'xlsx' });
    expect(detectFileType(fixture('semicolon-decimal-comma.csv'))).toMatchObject({ kind: 'text', bom: true });
    expect(detectFileType(fixture('utf16-unicode-text.txt'))).toMatchObject({ kind: 'text', encoding: 'utf-16le' });
    expect(detectFileType(Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]))).toMatchObject({ kind: 'unknown' });
    const docx = await editZip(await new JSZip().file('word/document.xml', '<w/>').generateAsync({ type: 'uint8array' }), { '[Content_Types].xml': '<Types/>' });
    expect(detectFileType(docx)).toMatchObject({ kind: 'unknown', description: 'a Word document (.docx)' });
    expect(detectFileType(buildCompoundFile(['WordDocument']))).toMatchObject({ kind: 'unknown' });
  });

  it('a Uint8Array view at an offset into a larger buffer reads like the plain bytes', async () => {
    for (const name of ['template-filled.xlsx', 'encrypted.xlsx', 'h2-bohr-hartree.csv']) {
      const plain = fixture(name);
      const larger = new Uint8Array(plain.length + 40);
      larger.fill(0x50); // "P": a stray zip signature byte around the view
      larger.set(plain, 17);
      const view = larger.subarray(17, 17 + plain.length);
      const [a, b] = [await readReport(plain), await readReport(view)];
      expect(b.ok, name).toBe(a.ok);
      if (a.ok && b.ok) expect(b.points).toEqual(a.points);
      if (!a.ok && !b.ok) expect(b.error.code).toBe(a.error.code);
    }
  });

  it('a CSV named .xlsx is read as CSV, with a warning', async () => {
    const result = await readReport(utf8Bytes(csv), { fileName: 'report.xlsx' });
    expect(result.ok).toBe(true);
    expect(result.warnings[0]).toContain('named ".xlsx" but holds text');
  });

  it('a compound file whose directory cannot be followed is still recognised by its stream names', () => {
    const broken = buildCompoundFile(['EncryptionInfo', 'EncryptedPackage']);
    new DataView(broken.buffer).setUint32(0x30, 0x7fffffff, true); // directory sector out of range
    expect(detectFileType(broken).kind).toBe('encrypted');
  });

  it('a workbook whose content type is macro-enabled (no VBA part) is macro_workbook', async () => {
    const plain = fixture('plain-two-sheets.xlsx');
    const types = await zipText(plain, '[Content_Types].xml');
    const bytes = await editZip(plain, {
      '[Content_Types].xml': types.replace('spreadsheetml.sheet.main+xml', 'ms-excel.sheet.macroEnabled.main+xml'),
    });
    expect(detectFileType(bytes).kind).toBe('xlsx');
    expect(refusal(await readReport(bytes)).code).toBe('macro_workbook');
  });

  it('.ods, a zip without a workbook, a truncated zip and broken XML are refused cleanly', async () => {
    const ods = await new JSZip().file('mimetype', 'application/vnd.oasis.opendocument.spreadsheet').file('content.xml', '<x/>').generateAsync({ type: 'uint8array' });
    expect(refusal(await readReport(ods))).toMatchObject({ code: 'unknown_type' });
    expect(refusal(await readReport(ods)).message).toContain('OpenDocument');
    const other = await new JSZip().file('a.txt', 'hello').generateAsync({ type: 'uint8array' });
    expect(refusal(await readReport(other)).code).toBe('unknown_type');
    const template = fixture('template-filled.xlsx');
    expect(refusal(await readReport(template.slice(0, template.length - 200))).code).toBe('unreadable');
    const badXml = await editZip(template, { 'xl/worksheets/sheet1.xml': '<worksheet><sheetData><row r="1"><c r="A1"' });
    const error = refusal(await readReport(badXml));
    expect(error.code).toBe('unreadable');
    expect(error.message).toContain('xl/worksheets/sheet1.xml');
  });

  it('damaged compressed data is unreadable', async () => {
    const bytes = fixture('template-filled.xlsx').slice();
    // flip bytes in the middle of the file (inside compressed part data, not the directory)
    for (let i = 2000; i < 2400; i++) bytes[i] ^= 0xa5;
    const error = refusal(await readReport(bytes));
    expect(['unreadable', 'too_large', 'no_numeric_data', 'bad_template']).toContain(error.code);
  });
});

describe('limits', () => {
  it('rows over maxRows in a CSV', async () => {
    const text = 'R,E\n' + Array.from({ length: 120 }, (_, i) => `${1 + i * 0.01},-1`).join('\n');
    const error = refusal(await readReport(utf8Bytes(text), { maxRows: 100 }));
    expect(error).toMatchObject({ code: 'too_large', row: 101 });
  });

  it('the default row limit (100 000) holds for a text file', async () => {
    const lines = Array.from({ length: 100_001 }, (_, i) => `${1 + i},-1`);
    const error = refusal(await readReport(utf8Bytes(lines.join('\n'))));
    expect(error).toMatchObject({ code: 'too_large', row: 100_001 });
  });

  it('cells over maxCells, in CSV and XLSX', async () => {
    const text = Array.from({ length: 50 }, (_, i) => `${1 + i},-1,-2,-3`).join('\n');
    expect(refusal(await readReport(utf8Bytes(text), { maxCells: 100 }))).toMatchObject({ code: 'too_large', row: 26 }); // cell 101 is on row 26
    const bytes = await buildWorkbook([{ name: 'Big', rows: Array.from({ length: 50 }, (_, i) => [1 + i, -1, -2, -3]) }]);
    expect(refusal(await readReport(bytes, { maxCells: 100 }))).toMatchObject({ code: 'too_large', sheet: 'Big', row: 26 });
    expect(refusal(await readReport(bytes, { maxRows: 20 }))).toMatchObject({ code: 'too_large', sheet: 'Big', row: 21 });
  });

  it('a file larger than maxUncompressedBytes is refused before reading', async () => {
    const error = refusal(await readReport(utf8Bytes('R,E\n' + '1,-1\n'.repeat(1000)), { maxUncompressedBytes: 1000 }));
    expect(error.code).toBe('too_large');
  });

  it('zip bomb: declared sizes over the limit are refused before inflating', async () => {
    const bytes = patchDeclaredSizes(fixture('template-filled.xlsx'), 0x7fff0000);
    const error = refusal(await readReport(bytes));
    expect(error.code).toBe('too_large');
    expect(error.message).toContain('would inflate to');
  });

  it('zip bomb: a real 12 MB part is refused by a 10 MB limit from its declared size', async () => {
    const padding = ' '.repeat(12 * 1024 * 1024);
    const bytes = await buildRawWorkbook({ sheets: [{ name: 'S', xml: `<row r="1"><c r="A1"><v>1</v></c></row>${padding}` }] });
    expect(bytes.length).toBeLessThan(60_000); // it compresses ~1000:1
    const error = refusal(await readReport(bytes, { maxUncompressedBytes: 10 * 1024 * 1024 }));
    expect(error.code).toBe('too_large');
  });

  it('zip bomb: sizes declared small but inflating large are stopped while inflating', async () => {
    const padding = ' '.repeat(8 * 1024 * 1024);
    const big = await buildRawWorkbook({ sheets: [{ name: 'S', xml: `<row r="1"><c r="A1"><v>1</v></c><c r="B1"><v>2</v></c></row>${padding}` }] });
    const lying = patchDeclaredSizes(big, 4096, (name) => name.startsWith('xl/worksheets/'));
    const started = performance.now();
    const error = refusal(await readReport(lying));
    expect(error.code).toBe('too_large');
    expect(error.message).toContain('beyond its declared size');
    expect(performance.now() - started).toBeLessThan(10_000); // hang guard, not a benchmark
  });

  it('pathological headers and fields stay fast (no quadratic pattern matching)', async () => {
    const body = Array.from({ length: 10 }, (_, i) => `${1 + i},${-1 - i / 100}`).join('\n');
    const headers = ['E' + ' _'.repeat(20000) + 'x' + ' '.repeat(20000) + '!', 'E (' + '('.repeat(50000), 'E / ' + '/'.repeat(50000)];
    for (const header of headers) {
      const started = performance.now();
      const result = await readReport(utf8Bytes(`R,${header}\n${body}`));
      expect(result.ok).toBe(true);
      expect(performance.now() - started).toBeLessThan(10_000); // hang guard, not a benchmark
      if (result.ok) expect(result.table.columns[1].header!.length).toBeLessThanOrEqual(120);
    }
  });

  it('the template built for a 200-point grid is well within the limits and reads completely', async () => {
    const bytes = await buildTemplateWorkbook({ distances: grid(0.5, 0.05, 200) });
    const result = await readReport(bytes);
    expect(result.ok && result.points.distance.length).toBe(200);
    if (result.ok) expect(result.points.energies['E(σg)'][199]).toBe(morseEnergyHartree(grid(0.5, 0.05, 200)[199], H2_LIKE));
  });
});
