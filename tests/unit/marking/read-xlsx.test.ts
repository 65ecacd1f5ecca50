import { readFileSync } from 'node:fs';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { readReport, readReportWithChoice, type ReadResult, type ReadSuccess } from '@shared/marking/read';
import { openXlsx } from '@shared/marking/read/read-xlsx';
import { readZipDirectory } from '@shared/marking/read/zip-directory';
import { isDateFormatCode, serialToIsoDate } from '@shared/marking/read/read-xlsx';
import type { GridCell } from '@shared/marking/read/types';
import { distanceFromBohr, energyFromHartree, energyToHartree } from '@shared/chemistry/units';
import {
  H2_LIKE,
  TEMPLATE_HEADER_ROW,
  antiMorseEnergyHartree,
  buildRawWorkbook,
  buildTemplateWorkbook,
  buildWorkbook,
  grid,
  morseEnergyHartree,
} from '../../fixtures/reports/make-fixtures';

const fixtureDir = new URL('../../fixtures/reports/', import.meta.url);
const fixture = (name: string) => new Uint8Array(readFileSync(new URL(name, fixtureDir)));

function ok(result: ReadResult): ReadSuccess {
  if (!result.ok) throw new Error(`expected ok, got ${result.error.code}: ${result.error.message}`);
  return result;
}
function failed(result: ReadResult) {
  if (result.ok) throw new Error('expected a refusal');
  return result;
}

const LIMITS = { maxRows: 100_000, maxCells: 1_000_000, maxUncompressedBytes: 50 * 1024 * 1024 };

async function sheetCells(bytes: Uint8Array, sheet: string) {
  const directory = readZipDirectory(bytes);
  if (!directory.ok) throw new Error(directory.reason);
  const book = await openXlsx(bytes, directory.entries, LIMITS);
  return book.readSheet(sheet);
}

describe('personal template workbooks', () => {
  it('the committed template: units, ids and answers from the hidden sheet, formula cells by cached value', async () => {
    const result = ok(await readReport(fixture('template-filled.xlsx'), { fileName: 'template-filled.xlsx' }));
    expect(result.template).toEqual({
      exerciseId: 'ex-h2-curve',
      variantKey: 'v07',
      studentNumber: 's1234567',
      templateToken: 'tok-3f9a2c',
      version: 1,
      answers: { bondOrder: { cell: 'F2', value: 1 }, groundTerm: { cell: 'F3', value: '1Σg+' } },
    });
    expect(result.units).toEqual({ distance: 'bohr', energy: 'hartree', distanceSource: 'template', energySource: 'template' });
    expect(result.table).toMatchObject({ kind: 'xlsx', sheet: 'Data', headerRow: TEMPLATE_HEADER_ROW, firstDataRow: 6, rows: 75 });
    expect(result.choice).toEqual({ sheet: 'Data', distanceColumn: 'A', energyColumns: ['B', 'C'] });
    expect(result.table.columns.map((c) => c.roleSource)).toEqual(['template', 'template', 'template']);
    expect(result.table.columns.map((c) => c.curve)).toEqual([null, 'bonding', 'antibonding']);
    const distances = grid(0.6, 0.1, 75);
    expect(result.points.distance).toEqual(distances);
    // stored as doubles: the Morse values (make-fixtures.ts) come back to the last bit
    result.points.energies['E(σg)'].forEach((e, i) => expect(e).toBe(morseEnergyHartree(distances[i], H2_LIKE)));
    result.points.energies['E(σu)'].forEach((e, i) => expect(e).toBe(antiMorseEnergyHartree(distances[i], H2_LIKE)));
    expect(result.points.rowNumbers[3]).toBe(9); // a formula row, read by its cached result
    expect(result.warnings).toEqual([]);
  });

  it('Å / eV template: values converted with the template units', async () => {
    const result = ok(await readReport(fixture('template-angstrom-ev.xlsx')));
    expect(result.units).toMatchObject({ distance: 'angstrom', energy: 'ev', distanceSource: 'template', energySource: 'template' });
    const distances = grid(0.6, 0.2, 28);
    result.points.distance.forEach((r, i) => expect(r).toBeCloseTo(distances[i], 12));
    result.points.energies['E(σg)'].forEach((e, i) => expect(e).toBeCloseTo(morseEnergyHartree(distances[i], H2_LIKE), 12));
  });

  it('an unfilled tail of the R grid is left out with a warning naming the rows', async () => {
    const bytes = await buildTemplateWorkbook({ distances: grid(0.6, 0.2, 20), unfilledTail: 4 });
    const result = ok(await readReport(bytes));
    expect(result.points.distance).toHaveLength(16);
    expect(result.warnings).toContain('Rows 22–25 have a distance but no energy on sheet "Data"; they were left out.');
  });

  it('a hole inside the grid is refused as missing_value at its cell', async () => {
    const bytes = await buildTemplateWorkbook({ distances: grid(0.6, 0.2, 20), overrides: { 7: { 1: null } } });
    const error = failed(await readReport(bytes)).error;
    expect(error).toMatchObject({ code: 'missing_value', sheet: 'Data', row: 13, column: 'B' });
    expect(error.message).toContain('Sheet "Data", row 13, column B is empty');
    expect(error.expected).toBe('an energy (a number in Eₕ)');
  });

  it('a header unit that differs from the template wins, with a warning', async () => {
    const bytes = await buildTemplateWorkbook({ distances: grid(0.6, 0.2, 20), headerTexts: ['R / a₀', 'E(σg) / eV', 'E(σu) / eV'] });
    const result = ok(await readReport(bytes));
    expect(result.units).toMatchObject({ energy: 'ev', energySource: 'header', distance: 'bohr', distanceSource: 'template' });
    expect(result.warnings.some((w) => w.includes('header says eV but the template asked for Eₕ'))).toBe(true);
    // the numbers are hartree values read as eV: the conversion follows the header
    expect(result.points.energies['E(σg)'][0]).toBeCloseTo(energyToHartree(morseEnergyHartree(0.6, H2_LIKE), 'ev'), 12);
  });

  it('a template whose data sheet was renamed is bad_template', async () => {
    const bytes = await buildTemplateWorkbook({ distances: grid(0.6, 0.2, 10), dataSheetName: 'Sheet1' });
    const result = failed(await readReport(bytes));
    expect(result.error).toMatchObject({ code: 'bad_template', sheet: 'Data' });
    expect(result.template?.studentNumber).toBe('s1234567');
  });

  it('a formula without a saved result is not_a_number at its cell', async () => {
    const bytes = await buildTemplateWorkbook({ distances: grid(0.6, 0.2, 10), formulaWithoutResultRows: [2] });
    const error = failed(await readReport(bytes)).error;
    expect(error).toMatchObject({ code: 'not_a_number', sheet: 'Data', row: 8, column: 'B' });
    expect(error.message).toContain('no saved result');
  });

  it('text in an energy cell names the sheet, row and column', async () => {
    const bytes = await buildTemplateWorkbook({ distances: grid(0.6, 0.2, 10), overrides: { 4: { 2: 'see notes' } } });
    const error = failed(await readReport(bytes)).error;
    expect(error).toMatchObject({ code: 'not_a_number', sheet: 'Data', row: 10, column: 'C' });
    expect(error.message).toBe('Sheet "Data", row 10, column C holds "see notes"; expected an energy (a number in Eₕ).');
  });
});

describe('other workbooks', () => {
  it('the first sheet with numbers is read, and the skipped sheet is named', async () => {
    const result = ok(await readReport(fixture('plain-two-sheets.xlsx')));
    expect(result.table.sheet).toBe('Results');
    expect(result.warnings).toContain('Read sheet "Results"; "Notes" before it holds no table of numbers.');
    expect(result.units).toMatchObject({ distance: 'angstrom', energy: 'ev', distanceSource: 'header' });
    const distances = grid(0.6, 0.2, 28);
    result.points.distance.forEach((r, i) => expect(r).toBeCloseTo(distances[i], 12));
  });

  it('a hidden sheet with numbers is passed over for the visible one', async () => {
    const rows = (scale: number) => [['R / bohr', 'E / Eh'], ...grid(0.6, 0.2, 10).map((r) => [r, scale * morseEnergyHartree(r, H2_LIKE)])];
    const bytes = await buildWorkbook([
      { name: 'Scratch', rows: rows(2), state: 'hidden' },
      { name: 'Curve', rows: rows(1) },
    ]);
    const result = ok(await readReport(bytes));
    expect(result.table.sheet).toBe('Curve');
    // and the student can ask for a sheet
    const chosen = ok(await readReportWithChoice(bytes, { sheet: 'Scratch' }));
    expect(chosen.points.energies['E'][0]).toBeCloseTo(2 * morseEnergyHartree(0.6, H2_LIKE), 12);
    const missing = failed(await readReportWithChoice(bytes, { sheet: 'Nope' }));
    expect(missing.error.code).toBe('bad_choice');
  });

  it('a title block and parameters above the header are skipped', async () => {
    const bytes = await buildWorkbook([
      {
        name: 'Sheet1',
        rows: [
          ['H2 minimal basis'],
          ['zeta', 1.0],
          [],
          ['R (Å)', 'E (kJ/mol)'],
          ...grid(0.6, 0.2, 12).map((r) => [distanceFromBohr(r, 'angstrom'), energyFromHartree(morseEnergyHartree(r, H2_LIKE), 'kj/mol')]),
          [],
          ['Minimum near', 0.74],
        ],
      },
    ]);
    const result = ok(await readReport(bytes));
    expect(result.table).toMatchObject({ headerRow: 4, firstDataRow: 5, lastDataRow: 16 });
    expect(result.units).toMatchObject({ distance: 'angstrom', energy: 'kj/mol' });
    expect(result.warnings.some((w) => w.includes('row 18') && w.includes('not read'))).toBe(true);
  });

  it('a date in a numeric cell is refused at that cell', async () => {
    const error = failed(await readReport(fixture('date-in-cell.xlsx'))).error;
    expect(error).toMatchObject({ code: 'date_in_numeric_cell', sheet: 'Sheet1', row: 5, column: 'A' });
    expect(error.message).toContain('holds a date (2025-05-01)');
  });

  it('numbers stored as text are read, with a warning naming the cells', async () => {
    const bytes = await buildWorkbook([
      { name: 'S', rows: [['R / bohr', 'E / Eh'], ...grid(1, 0.5, 6).map((r, i) => [i === 2 ? String(r) : r, i === 3 ? '-1,1' : -1 - r / 100])] },
    ]);
    const result = ok(await readReport(bytes));
    expect(result.raw.energies['E'][3]).toBe(-1.1);
    expect(result.warnings).toContain('2 cells, such as A4, B5 on sheet "S", hold numbers stored as text; they were read as numbers.');
  });
});

describe('the SpreadsheetML reader agrees with exceljs', () => {
  it('on numbers, strings, rich text, formulas with cached results, booleans, errors and dates', async () => {
    const workbook = new ExcelJS.Workbook();
    const ws = workbook.addWorksheet('Mixed');
    ws.getCell('A1').value = 'R / a₀';
    ws.getCell('B1').value = { richText: [{ text: 'E(' }, { font: { bold: true }, text: 'σg' }, { text: ') / Eₕ' }] };
    ws.getCell('C1').value = ' spaced <&> "quoted" ';
    ws.getCell('A2').value = 0.5;
    ws.getCell('B2').value = -1.234567890123e-12;
    ws.getCell('C2').value = 1.23e300;
    ws.getCell('A3').value = { formula: 'A2*2', result: 1 };
    ws.getCell('B3').value = { formula: 'CONCAT("a","b")', result: 'ab' };
    ws.getCell('C3').value = { formula: '1/0', result: { error: '#DIV/0!' } };
    ws.getCell('A4').value = true;
    ws.getCell('B4').value = { error: '#N/A' };
    ws.getCell('C4').value = new Date(Date.UTC(2024, 1, 29));
    ws.getCell('A5').value = { sharedFormula: 'A3', result: 2 } as unknown as ExcelJS.CellValue;
    ws.getCell('AB7').value = -42;
    const bytes = new Uint8Array((await workbook.xlsx.writeBuffer()) as ArrayBuffer);

    const mine = await sheetCells(bytes, 'Mixed');
    const theirs = new ExcelJS.Workbook();
    await theirs.xlsx.load(bytes as unknown as ArrayBuffer);
    let compared = 0;
    theirs.getWorksheet('Mixed')!.eachRow((row, rowNumber) => {
      row.eachCell((cell, column) => {
        const got = mine.rows.find((r) => r.rowNumber === rowNumber)?.cells[column - 1];
        expect(got, cell.address).toEqual(expectedCell(cell.value));
        compared++;
      });
    });
    expect(compared).toBe(14);
  });
});

function expectedCell(value: ExcelJS.CellValue): GridCell | undefined {
  if (value === null || value === undefined) return undefined;
  if (typeof value === 'number') return { kind: 'number', value };
  if (typeof value === 'boolean') return { kind: 'bool', value };
  if (typeof value === 'string') return { kind: 'text', text: value };
  if (value instanceof Date) return { kind: 'date', display: value.toISOString().slice(0, 10) };
  if ('richText' in value) return { kind: 'text', text: value.richText.map((r) => r.text).join('') };
  if ('error' in value) return { kind: 'error', text: String(value.error) };
  if ('result' in value) {
    const result = (value as { result?: unknown }).result;
    return result === undefined ? { kind: 'formula', formula: String((value as { formula?: string }).formula) } : expectedCell(result as ExcelJS.CellValue);
  }
  throw new Error(`unexpected cell ${JSON.stringify(value)}`);
}

describe('hand-written SpreadsheetML', () => {
  const styles = `<?xml version="1.0"?><styleSheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><numFmts count="2"><numFmt numFmtId="164" formatCode="0.000&quot; bohr&quot;"/><numFmt numFmtId="165" formatCode="[$-409]d\\-mmm;@"/></numFmts><cellXfs count="3"><xf numFmtId="0"/><xf numFmtId="164"/><xf numFmtId="165"/></cellXfs></styleSheet>`;

  it('prefixed namespaces, inline strings, cells without r, str/e/d types and custom formats', async () => {
    const data = grid(1, 0.25, 6)
      .map((r, i) => `<x:row r="${i + 2}"><x:c s="1"><x:v>${r}</x:v></x:c><x:c><x:f>B1</x:f><x:v>${morseEnergyHartree(r, H2_LIKE)}</x:v></x:c><x:c t="str"><x:f>"x"</x:f><x:v>note</x:v></x:c></x:row>`)
      .join('');
    const bytes = await buildRawWorkbook({
      prefix: 'x',
      stylesXml: styles,
      sheets: [
        {
          name: 'Raw',
          xml: `<x:row r="1"><x:c r="A1" t="inlineStr"><x:is><x:t>R / bohr</x:t></x:is></x:c><x:c r="B1" t="inlineStr"><x:is><x:r><x:t>E / </x:t></x:r><x:r><x:t>Eh</x:t></x:r></x:is></x:c></x:row>${data}`,
        },
      ],
    });
    const result = ok(await readReport(bytes));
    expect(result.choice).toMatchObject({ distanceColumn: 'A', energyColumns: ['B'] });
    expect(result.table.columns[2]).toMatchObject({ role: 'text', textCount: 6 });
    expect(result.points.distance).toEqual(grid(1, 0.25, 6));
    // "0.000 bohr" is a number format (quoted text), not a date
    expect(isDateFormatCode('0.000" bohr"')).toBe(false);
    expect(isDateFormatCode('[$-409]d\\-mmm;@')).toBe(true);
    expect(isDateFormatCode('[Red]0.00;[Blue]-0.00')).toBe(false);
    expect(isDateFormatCode('[h]:mm:ss')).toBe(true);
  });

  it('a cell with a custom date format, an error value and the 1904 date system', async () => {
    const bytes = await buildRawWorkbook({
      stylesXml: styles,
      date1904: true,
      sharedStrings: ['<t>R / bohr</t>', '<t>E / Eh</t>', '<r><t>ph</t></r><rPh><t>ignored</t></rPh>'],
      sheets: [
        {
          name: 'D',
          xml:
            '<row r="1"><c r="A1" t="s"><v>0</v></c><c r="B1" t="s"><v>1</v></c><c r="C1" t="s"><v>2</v></c></row>' +
            '<row r="2"><c r="A2"><v>1</v></c><c r="B2"><v>-1.1</v></c></row>' +
            '<row r="3"><c r="A3" s="2"><v>1</v></c><c r="B3"><v>-1.15</v></c></row>' +
            '<row r="4"><c r="A4"><v>2</v></c><c r="B4" t="e"><v>#VALUE!</v></c></row>',
        },
      ],
    });
    const cells = await sheetCells(bytes, 'D');
    expect(cells.rows[0].cells[2]).toEqual({ kind: 'text', text: 'ph' });
    expect(cells.rows[2].cells[0]).toEqual({ kind: 'date', display: '1904-01-02' }); // 1904 system: serial 1 = 2 Jan 1904 (ECMA-376 §18.17.4.1)
    const error = failed(await readReport(bytes)).error;
    expect(error).toMatchObject({ code: 'date_in_numeric_cell', sheet: 'D', row: 3, column: 'A' });
  });

  it('serial day numbers follow the 1900 system with its 29 February 1900', () => {
    expect(serialToIsoDate(1, false)).toBe('1900-01-01'); // ECMA-376 Part 1 §18.17.4.1: serial 1 = 1 Jan 1900
    expect(serialToIsoDate(61, false)).toBe('1900-03-01'); // same section: 60 is the fictitious 29 Feb 1900
    expect(serialToIsoDate(45658, false)).toBe('2025-01-01'); // computed (regression): days from 1899-12-30
    expect(serialToIsoDate(45658.5, false)).toBe('2025-01-01 12:00');
  });
});
