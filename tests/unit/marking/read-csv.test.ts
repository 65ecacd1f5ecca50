import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readReport, readReportWithChoice, type ReadResult, type ReadSuccess } from '@shared/marking/read';
import { distanceToBohr, energyToHartree, type DistanceUnit, type EnergyUnit } from '@shared/chemistry/units';
import {
  H2_LIKE,
  H2_PLUS_LIKE,
  antiMorseEnergyHartree,
  buildCsvText,
  curveTable,
  grid,
  morseEnergyHartree,
  utf8Bytes,
} from '../../fixtures/reports/make-fixtures';

const fixtureDir = new URL('../../fixtures/reports/', import.meta.url);
const fixture = (name: string) => new Uint8Array(readFileSync(new URL(name, fixtureDir)));

function ok(result: ReadResult): ReadSuccess {
  if (!result.ok) throw new Error(`expected ok, got ${result.error.code}: ${result.error.message}`);
  return result;
}

const SMALL_GRID = grid(0.6, 0.2, 28); // the committed fixtures' grid, 0.6 … 6.0 bohr

/** half a unit in the last written decimal, converted to atomic units */
const distanceTolerance = (decimals: number, unit: DistanceUnit) => distanceToBohr(0.5 * 10 ** -decimals, unit) * 1.0001;
const energyTolerance = (decimals: number, unit: EnergyUnit) => energyToHartree(0.5 * 10 ** -decimals, unit) * 1.0001;

function expectCurve(result: ReadSuccess, key: string, reference: (r: number) => number, tolerances: { distance: number; energy: number }, shift = 0) {
  expect(result.points.distance).toHaveLength(SMALL_GRID.length);
  result.points.distance.forEach((r, i) => expect(Math.abs(r - SMALL_GRID[i])).toBeLessThanOrEqual(tolerances.distance));
  // the energies were computed at the exact grid distances, so compare at those
  result.points.energies[key].forEach((e, i) => expect(Math.abs(e - (reference(SMALL_GRID[i]) - shift))).toBeLessThanOrEqual(tolerances.energy));
}

describe('CSV fixtures in every unit system give the Morse reference in bohr and hartree', () => {
  // reference data: Morse/anti-Morse curves of make-fixtures.ts (H2-like parameters, documented there)
  const bonding = (r: number) => morseEnergyHartree(r, H2_LIKE);
  const antibonding = (r: number) => antiMorseEnergyHartree(r, H2_LIKE);

  it('bohr / hartree with σg and σu columns', async () => {
    const result = ok(await readReport(fixture('h2-bohr-hartree.csv'), { fileName: 'h2-bohr-hartree.csv' }));
    expect(result.units).toEqual({ distance: 'bohr', energy: 'hartree', distanceSource: 'header', energySource: 'header' });
    expect(result.choice).toEqual({ sheet: null, distanceColumn: 'A', energyColumns: ['B', 'C'] });
    expect(Object.keys(result.points.energies)).toEqual(['E(sigma g)', 'E(sigma u)']);
    expect(result.table.columns.map((c) => c.curve)).toEqual([null, 'bonding', 'antibonding']);
    const tol = { distance: distanceTolerance(4, 'bohr'), energy: energyTolerance(8, 'hartree') };
    expectCurve(result, 'E(sigma g)', bonding, tol);
    expectCurve(result, 'E(sigma u)', antibonding, tol);
    expect(result.convention).toBe('total');
    expect(result.warnings).toEqual([]);
  });

  it('Å / eV with E+ and E− headers', async () => {
    const result = ok(await readReport(fixture('h2-angstrom-ev.csv')));
    expect(result.units).toMatchObject({ distance: 'angstrom', energy: 'ev' });
    expect(result.table.columns.map((c) => c.curve)).toEqual([null, 'bonding', 'antibonding']);
    const tol = { distance: distanceTolerance(6, 'angstrom'), energy: energyTolerance(6, 'ev') };
    expectCurve(result, 'E+', bonding, tol);
    expectCurve(result, 'E-', antibonding, tol);
    // the raw values stay as written
    expect(result.raw.distance[0]).toBe(0.317506);
    expect(result.raw.energies['E+'][0]).toBe(-24.153442);
  });

  it('pm / kJ mol^-1 in bracketed headers', async () => {
    const result = ok(await readReport(fixture('h2-pm-kjmol.csv')));
    expect(result.units).toMatchObject({ distance: 'pm', energy: 'kj/mol', distanceSource: 'header', energySource: 'header' });
    expectCurve(result, 'energy', bonding, { distance: distanceTolerance(3, 'pm'), energy: energyTolerance(4, 'kj/mol') });
  });

  it('Å / kcal·mol⁻¹ in a TSV with slash headers', async () => {
    const result = ok(await readReport(fixture('h2-angstrom-kcalmol.tsv'), { fileName: 'h2-angstrom-kcalmol.tsv' }));
    expect(result.table.delimiter).toBe('\t');
    expect(result.units).toMatchObject({ distance: 'angstrom', energy: 'kcal/mol' });
    expectCurve(result, 'E', bonding, { distance: distanceTolerance(6, 'angstrom'), energy: energyTolerance(5, 'kcal/mol') });
  });

  it('"R in a.u." and cm⁻¹', async () => {
    const result = ok(await readReport(fixture('h2-bohr-wavenumber.csv')));
    expect(result.units).toMatchObject({ distance: 'bohr', energy: 'cm-1' });
    expectCurve(result, 'E', bonding, { distance: distanceTolerance(4, 'bohr'), energy: energyTolerance(2, 'cm-1') });
  });

  it('swapped columns: the header decides which is the distance', async () => {
    const result = ok(await readReport(fixture('swapped-columns.csv')));
    expect(result.choice.distanceColumn).toBe('B');
    expect(result.choice.energyColumns).toEqual(['A']);
    expectCurve(result, 'Energy', bonding, { distance: distanceTolerance(4, 'bohr'), energy: energyTolerance(8, 'hartree') });
  });

  it('semicolons, decimal commas, BOM and Windows line endings', async () => {
    const bytes = fixture('semicolon-decimal-comma.csv');
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const result = ok(await readReport(bytes));
    expect(result.table).toMatchObject({ delimiter: ';', decimalComma: true, headerRow: 1, firstDataRow: 2 });
    expect(result.units).toMatchObject({ distance: 'angstrom', energy: 'ev' });
    expectCurve(result, 'E', bonding, { distance: distanceTolerance(6, 'angstrom'), energy: energyTolerance(6, 'ev') });
  });

  it('no header: columns and units from the numbers, each guess named in a warning', async () => {
    const result = ok(await readReport(fixture('no-header-bohr-hartree.csv')));
    expect(result.table.headerRow).toBeNull();
    expect(result.units).toEqual({ distance: 'bohr', energy: 'hartree', distanceSource: 'magnitude', energySource: 'magnitude' });
    expect(result.warnings.some((w) => w.includes('Column A') && w.includes('a₀'))).toBe(true);
    expect(result.warnings.some((w) => w.includes('column B') && w.includes('Eₕ'))).toBe(true);
    expectCurve(result, 'B', bonding, { distance: distanceTolerance(4, 'bohr'), energy: energyTolerance(8, 'hartree') });
  });

  it('no header, relative energies in eV: unit and convention from the numbers', async () => {
    const result = ok(await readReport(fixture('no-header-relative-ev.csv')));
    expect(result.units.energy).toBe('ev');
    expect(result.convention).toBe('relative');
    expect(result.warnings.some((w) => w.includes('relative'))).toBe(true);
    expectCurve(result, 'B', bonding, { distance: distanceTolerance(4, 'bohr'), energy: energyTolerance(6, 'ev') }, H2_LIKE.limitHartree);
  });

  it('numpy-style whitespace file with a "# R E …" comment header', async () => {
    const result = ok(await readReport(fixture('numpy-comment-header.dat'), { fileName: 'curve.dat' }));
    expect(result.table.delimiter).toBe('whitespace');
    expect(result.table.headerRow).toBe(2);
    expect(Object.keys(result.points.energies)).toEqual(['E_bonding', 'E_antibonding']);
    expect(result.table.columns.map((c) => c.curve)).toEqual([null, 'bonding', 'antibonding']);
    expectCurve(result, 'E_antibonding', antibonding, { distance: distanceTolerance(4, 'bohr'), energy: energyTolerance(8, 'hartree') });
  });

  it('blank lines, quoted numbers, trailing delimiters and CRLF', async () => {
    const result = ok(await readReport(fixture('blank-lines-trailing-delimiters.csv')));
    expect(result.table.columns.map((c) => c.role)).toEqual(['distance', 'energy', 'empty']);
    // 28 points spread over 32 data lines: the row numbers skip the blank lines
    expect(result.points.rowNumbers[7]).toBe(10);
    expectCurve(result, 'E', bonding, { distance: distanceTolerance(4, 'bohr'), energy: energyTolerance(8, 'hartree') });
  });

  it('rows in falling order are sorted, with a warning', async () => {
    const result = ok(await readReport(fixture('descending-rows.csv')));
    expect(result.warnings).toContain('The rows run from large to small distances; the points were sorted.');
    expect(result.points.rowNumbers[0]).toBe(29);
    expectCurve(result, 'E', bonding, { distance: distanceTolerance(4, 'bohr'), energy: energyTolerance(8, 'hartree') });
  });

  it('UTF-16 "Unicode text" with BOM, and Windows-1252 with Å', async () => {
    const utf16 = ok(await readReport(fixture('utf16-unicode-text.txt')));
    expect(utf16.table.encoding).toBe('utf-16le');
    expect(utf16.units).toMatchObject({ distance: 'angstrom', energy: 'ev', distanceSource: 'header' });
    expectCurve(utf16, 'E', bonding, { distance: distanceTolerance(6, 'angstrom'), energy: energyTolerance(6, 'ev') });
    const latin = ok(await readReport(fixture('windows-1252.csv')));
    expect(latin.table.encoding).toBe('windows-1252');
    expect(latin.table.columns[0].header).toBe('R / Å');
    expect(latin.units.distance).toBe('angstrom');
    expect(latin.warnings.some((w) => w.includes('Windows-1252'))).toBe(true);
  });
});

describe('CSV layouts built in memory', () => {
  const table = curveTable(SMALL_GRID);

  it('a units row under the names row', async () => {
    const text = 'R,E\nÅ,kJ/mol\n' + buildCsvText(table, { header: null, distanceUnit: 'angstrom', energyUnit: 'kj/mol', distanceDecimals: 6, energyDecimals: 4 });
    const result = ok(await readReport(utf8Bytes(text)));
    expect(result.table.headerRow).toBe(1);
    expect(result.table.firstDataRow).toBe(3);
    expect(result.table.columns[0].header).toBe('R [Å]');
    expect(result.units).toMatchObject({ distance: 'angstrom', energy: 'kj/mol', distanceSource: 'header', energySource: 'header' });
  });

  it('a title line and comments above the header', async () => {
    const text = '# produced by my program\nH2 potential curve\n' + buildCsvText(table, { header: ['R (bohr)', 'E (Eh)'] });
    const result = ok(await readReport(utf8Bytes(text)));
    expect(result.table.headerRow).toBe(3);
    expect(result.points.rowNumbers[0]).toBe(4);
  });

  it('an index column 1, 2, 3 … is not taken as the distance', async () => {
    const body = SMALL_GRID.map((r, i) => `${i + 1},${r.toFixed(4)},${morseEnergyHartree(r, H2_LIKE).toFixed(8)}`).join('\n');
    const result = ok(await readReport(utf8Bytes(body)));
    expect(result.choice.distanceColumn).toBe('B');
    expect(result.choice.energyColumns).toEqual(['C']);
    expect(result.warnings.some((w) => w.includes('row index'))).toBe(true);
  });

  it('overlap and integral columns (S, J, K) are listed but not read as energy curves', async () => {
    const body = SMALL_GRID.map((r) => `${r},${Math.exp(-r).toFixed(6)},${(1 / r).toFixed(6)},${morseEnergyHartree(r, H2_LIKE).toFixed(8)}`).join('\n');
    const result = ok(await readReport(utf8Bytes('R / bohr,S,J,E / Eh\n' + body)));
    expect(result.choice.energyColumns).toEqual(['D']);
    expect(result.table.columns.map((c) => c.role)).toEqual(['distance', 'other', 'other', 'energy']);
    // the student may still pick them
    const chosen = ok(await readReportWithChoice(utf8Bytes('R / bohr,S,J,E / Eh\n' + body), { energyColumns: ['D', 'C'] }));
    expect(chosen.choice.energyColumns).toEqual(['D', 'C']);
    expect(chosen.table.columns[2].roleSource).toBe('user');
  });

  it('pipe-separated and whitespace-separated decimal-comma files', async () => {
    const pipe = ok(await readReport(utf8Bytes(buildCsvText(table, { header: ['R/bohr', 'E/Eh'], delimiter: '|' }))));
    expect(pipe.table.delimiter).toBe('|');
    const spaces = ok(await readReport(utf8Bytes(buildCsvText(table, { header: null, delimiter: '   ', decimalComma: true }))));
    expect(spaces.table).toMatchObject({ delimiter: 'whitespace', decimalComma: true });
    expect(spaces.points.distance[1]).toBeCloseTo(0.8, 12);
  });

  it('Unicode minus signs and Fortran D exponents are numbers', async () => {
    const rows = SMALL_GRID.slice(0, 6).map((r) => `${r}\t${morseEnergyHartree(r, H2_LIKE).toExponential(6).replace('e', 'D').replace('-', '\u2212')}`);
    const result = ok(await readReport(utf8Bytes('R/bohr\tE/Eh\n' + rows.join('\n'))));
    expect(result.points.energies['E'][0]).toBeCloseTo(morseEnergyHartree(SMALL_GRID[0], H2_LIKE), 6);
  });

  it('relative H2+-like energies in kcal/mol are told from kJ/mol by the well depth', async () => {
    const t = curveTable(SMALL_GRID, H2_PLUS_LIKE);
    for (const unit of ['kj/mol', 'kcal/mol', 'ev', 'hartree', 'cm-1'] as const) {
      const text = buildCsvText(t, { header: null, energyUnit: unit, relative: true, energyDecimals: 6 }, H2_PLUS_LIKE);
      const result = ok(await readReport(utf8Bytes(text)));
      expect(result.units.energy, unit).toBe(unit);
      expect(result.convention, unit).toBe('relative');
    }
  });

  it('total energies without units: every unit recognised from the numbers', async () => {
    for (const unit of ['kj/mol', 'kcal/mol', 'ev', 'hartree', 'cm-1'] as const) {
      const text = buildCsvText(table, { header: null, energyUnit: unit, energyDecimals: 6 });
      const result = ok(await readReport(utf8Bytes(text)));
      expect(result.units.energy, unit).toBe(unit);
      expect(result.convention, unit).toBe('total');
    }
  });

  it('distances without units: pm, Å or bohr from range and well position', async () => {
    const shortGrid = grid(0.8, 0.1, 40); // 0.8 … 4.7 bohr: both bohr and Å ranges fit
    const t = curveTable(shortGrid);
    for (const unit of ['pm', 'angstrom', 'bohr'] as const) {
      const text = buildCsvText(t, { header: null, distanceUnit: unit, distanceDecimals: 6 });
      const result = ok(await readReport(utf8Bytes(text)));
      expect(result.units.distance, unit).toBe(unit);
      expect(result.units.distanceSource).toBe('magnitude');
    }
  });

  it('readReportWithChoice overrides units and convention, and keeps the raw values', async () => {
    const bytes = utf8Bytes(buildCsvText(table, { header: null }));
    const result = ok(await readReportWithChoice(bytes, { distanceUnit: 'angstrom', energyUnit: 'ev', convention: 'relative' }));
    expect(result.units).toEqual({ distance: 'angstrom', energy: 'ev', distanceSource: 'user', energySource: 'user' });
    expect(result.conventionSource).toBe('user');
    expect(result.points.distance[0]).toBeCloseTo(distanceToBohr(0.6, 'angstrom'), 12);
    expect(result.raw.distance[0]).toBe(0.6);
    expect(result.points.energies['B'][0]).toBeCloseTo(energyToHartree(result.raw.energies['B'][0], 'ev'), 12);
  });

  it('readReportWithChoice with a column that does not exist is a bad_choice naming the columns', async () => {
    const result = await readReportWithChoice(utf8Bytes(buildCsvText(table, { header: ['R', 'E'] })), { distanceColumn: 'F' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.error).toMatchObject({ code: 'bad_choice', column: 'F' });
    expect(result.error.expected).toBe('one of the columns A, B');
    expect(result.table?.columns).toHaveLength(2);
  });

  it('a choice of a text column is refused', async () => {
    const body = SMALL_GRID.map((r) => `${r},${morseEnergyHartree(r, H2_LIKE)},note`).join('\n');
    const result = await readReportWithChoice(utf8Bytes('R,E,comment\n' + body), { energyColumns: ['C'] });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error).toMatchObject({ code: 'bad_choice', column: 'C' });
  });
});
