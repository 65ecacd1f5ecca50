import { describe, expect, it } from 'vitest';
import {
  CONVENTION_THRESHOLD_HARTREE,
  conventionOf,
  parseCellReference,
  readHeader,
  readTemplateMeta,
  templateMetaRows,
  unitFromText,
} from '@shared/marking/read';
import { guessDistanceUnit, guessEnergyUnit } from '@shared/marking/read/guess-units';
import { parseNumberText } from '@shared/marking/read/parse-number';
import { detectDelimiter } from '@shared/marking/read/read-delimited-text';
import type { Grid } from '@shared/marking/read/types';
import { energyFromHartree } from '@shared/chemistry/units';
import { H2_LIKE, grid, morseEnergyHartree } from '../../fixtures/reports/make-fixtures';

describe('units in header spellings', () => {
  const distance: [string, string][] = [
    ['R / Å', 'angstrom'],
    ['R / \u212b', 'angstrom'], // ANGSTROM SIGN
    ['R (A)', 'angstrom'],
    ['r [Ang]', 'angstrom'],
    ['distance (ang.)', 'angstrom'],
    ['R/angstroms', 'angstrom'],
    ['R in Ångström', 'angstrom'],
    ['R_angstrom', 'angstrom'],
    ['bond length [pm]', 'pm'],
    ['R (picometre)', 'pm'],
    ['R / picometers', 'pm'],
    ['R / bohr', 'bohr'],
    ['R (a0)', 'bohr'],
    ['R / a₀', 'bohr'],
    ['R (a.u.)', 'bohr'],
    ['R [au]', 'bohr'],
    ['internuclear distance in bohr', 'bohr'],
  ];
  for (const [header, unit] of distance) {
    it(`"${header}" → ${unit}`, () => {
      const reading = readHeader(header);
      expect(reading.units.distance).toBe(unit);
      expect(reading.role).toBe('distance');
    });
  }
  const energy: [string, string][] = [
    ['E / Eh', 'hartree'],
    ['E (Ha)', 'hartree'],
    ['energy [hartrees]', 'hartree'],
    ['E / Eₕ', 'hartree'],
    ['E (a.u.)', 'hartree'],
    ['E [au]', 'hartree'],
    ['E (eV)', 'ev'],
    ['E / electronvolt', 'ev'],
    ['energy [kJ/mol]', 'kj/mol'],
    ['E (kJ mol-1)', 'kj/mol'],
    ['E / kJ mol^-1', 'kj/mol'],
    ['E / kJ·mol⁻¹', 'kj/mol'],
    ['E [kcal/mol]', 'kcal/mol'],
    ['E (kcal mol-1)', 'kcal/mol'],
    ['E / cm-1', 'cm-1'],
    ['E (cm^-1)', 'cm-1'],
    ['E / cm⁻¹', 'cm-1'],
    ['E (wavenumber)', 'cm-1'],
    ['E_eV', 'ev'],
  ];
  for (const [header, unit] of energy) {
    it(`"${header}" → ${unit}`, () => {
      const reading = readHeader(header);
      expect(reading.units.energy).toBe(unit);
      expect(reading.role).toBe('energy');
    });
  }

  it('a.u. is a distance or an energy by the column, both when alone', () => {
    expect(unitFromText('a.u.')).toEqual({ distance: 'bohr', energy: 'hartree' });
    expect(unitFromText('Å')).toEqual({ distance: 'angstrom', energy: null });
    expect(unitFromText('furlong')).toEqual({ distance: null, energy: null });
  });

  it('the name without its unit, and units Bondmark does not read are named', () => {
    expect(readHeader('E(σg) / Eₕ').name).toBe('E(σg)');
    expect(readHeader('R / nm')).toMatchObject({ unknownUnit: 'nm', units: { distance: null, energy: null } });
    expect(readHeader('E (mEh)').unknownUnit).toBe('mEh');
  });

  it('roles and curves from header words', () => {
    const roles: [string, string | null][] = [
      ['R', 'distance'],
      ['r', 'distance'],
      ['R_AB', 'distance'],
      ['bond length', 'distance'],
      ['Internuclear separation', 'distance'],
      ['E', 'energy'],
      ['Energy', 'energy'],
      ['sigma g', 'energy'],
      ['E+', 'energy'],
      ['antibonding', 'energy'],
      ['E_MO', 'energy'],
      ['S', 'other'],
      ['overlap', 'other'],
      ['J', 'other'],
      ['K', 'other'],
      ['Coulomb integral', 'other'],
      ['zeta', 'other'],
      ['index', 'other'],
      ['dE/dR', 'other'],
      ['comment', null],
    ];
    for (const [header, role] of roles) expect(readHeader(header).role, header).toBe(role);
    const curves: [string, string | null][] = [
      ['E(σg)', 'bonding'],
      ['sigma_g', 'bonding'],
      ['bonding', 'bonding'],
      ['E+', 'bonding'],
      ['E(+)', 'bonding'],
      ['E(σu)', 'antibonding'],
      ['sigma u', 'antibonding'],
      ['σ*', 'antibonding'],
      ['anti-bonding', 'antibonding'],
      ['E-', 'antibonding'],
      ['E−', 'antibonding'],
      ['E - E(inf)', null],
      ['E', null],
    ];
    for (const [header, curve] of curves) expect(readHeader(header).curve, header).toBe(curve);
  });
});

describe('numbers and separators', () => {
  it('number spellings', () => {
    expect(parseNumberText('1.25', false)).toBe(1.25);
    expect(parseNumberText(' -1.2e-3 ', false)).toBe(-0.0012);
    expect(parseNumberText('+.5', false)).toBe(0.5);
    expect(parseNumberText('1.0D-03', false)).toBe(0.001);
    expect(parseNumberText('\u22120.5', false)).toBe(-0.5);
    expect(parseNumberText('1,25', true)).toBe(1.25);
    expect(parseNumberText('1,25', false)).toBeNull();
    expect(parseNumberText('NaN', false)).toBeNull();
    expect(parseNumberText('Infinity', false)).toBeNull();
    expect(parseNumberText('1e400', false)).toBeNull();
    expect(parseNumberText('0x1F', false)).toBeNull();
    expect(parseNumberText('1.2.3', false)).toBeNull();
  });

  it('separator detection ignores title lines and decimal commas', () => {
    expect(detectDelimiter(['My curve, take 2', 'R;E', '1,0;-1,1', '1,5;-1,2'])).toBe(';');
    expect(detectDelimiter(['R\tE', '1.0\t-1.1'])).toBe('\t');
    expect(detectDelimiter(['R,E', '1.0,-1.1', '1.5,-1.2'])).toBe(',');
    expect(detectDelimiter(['1,0   -1,1', '1,5   -1,2'])).toBe('whitespace');
    expect(detectDelimiter(['1.0 -1.1', '1.5 -1.2'])).toBe('whitespace');
    expect(detectDelimiter(['"1,0","-1,1"', '"1,5","-1,2"'])).toBe(',');
  });
});

describe('total or relative, and magnitudes', () => {
  it('the convention threshold sits halfway between 0 and the −½ Eh of a hydrogen atom', () => {
    expect(CONVENTION_THRESHOLD_HARTREE).toBe(-0.25); // H 1s = −½ Eh (textbook); halfway, common practice
    expect(conventionOf(-0.5)).toBe('total');
    expect(conventionOf(-1.0)).toBe('total');
    expect(conventionOf(-0.001)).toBe('relative');
    expect(conventionOf(0.2)).toBe('relative'); // e.g. simple-MO H2 measured from 2 E(H): too high at large R
  });

  it('energy unit guesses for a repulsive curve alone (no well)', () => {
    const distances = grid(0.8, 0.2, 30);
    // a repulsive total curve approaching −1 Eh (computed from the Morse range, shape only)
    const curve = distances.map((r) => -1 + 0.5 * Math.exp(-H2_LIKE.widthPerBohr * (r - 1)));
    for (const unit of ['hartree', 'ev', 'kj/mol'] as const) {
      expect(guessEnergyUnit(curve.map((e) => energyFromHartree(e, unit))).unit, unit).toBe(unit);
    }
  });

  it('numbers that fit no energy unit fall back to hartree, marked implausible', () => {
    expect(guessEnergyUnit([5e9, 4e9, 3e9, 2e9, 1e9])).toEqual({ unit: 'hartree', plausible: false });
  });

  it('distance guesses: pm by range, bohr beyond 5.5, Å or bohr by the well position', () => {
    const energies = (ds: number[], scale: number) => ds.map((d) => morseEnergyHartree(d * scale, H2_LIKE));
    const bohrGrid = grid(0.5, 0.1, 40); // 0.5 … 4.4
    expect(guessDistanceUnit(bohrGrid, energies(bohrGrid, 1), null).unit).toBe('bohr');
    const angstromGrid = bohrGrid.map((r) => r * 0.529177210903);
    expect(guessDistanceUnit(angstromGrid, energies(angstromGrid, 1 / 0.529177210903), null).unit).toBe('angstrom');
    expect(guessDistanceUnit(bohrGrid.map((r) => r * 52.9177210903), energies(bohrGrid, 1), null).unit).toBe('pm');
    expect(guessDistanceUnit(grid(1, 0.5, 12), energies(grid(1, 0.5, 12), 1), null).unit).toBe('bohr');
  });
});

describe('template meta sheet contract', () => {
  const rows = templateMetaRows({
    exerciseId: 'ex-1',
    variantKey: 'A3',
    studentNumber: '20231234',
    templateToken: 'tok',
    dataSheet: 'Data',
    headerRow: 5,
    distanceUnit: 'angstrom',
    energyUnit: 'kj/mol',
    distanceColumn: 'A',
    energyColumns: ['B', 'D'],
    energyConvention: 'relative',
    pointCount: 40,
    answers: { bondOrder: 'F4', groundTerm: "'My answers'!B2" },
  });

  it('rows written by templateMetaRows are read back by readTemplateMeta', () => {
    expect(rows.slice(0, 10).map((r) => r[0])).toEqual(['format', 'version', 'exerciseId', 'variantKey', 'studentNumber', 'templateToken', 'dataSheet', 'headerRow', 'distanceUnit', 'energyUnit']);
    const sheet: Grid = {
      sheet: 'bondmark-meta',
      rows: rows.map(([key, value], i) => ({
        rowNumber: i + 1,
        cells: [{ kind: 'text', text: key }, typeof value === 'number' ? { kind: 'number', value } : { kind: 'text', text: value }],
      })),
    };
    const reading = readTemplateMeta(sheet);
    expect(reading.isTemplate).toBe(true);
    expect(reading.problems).toEqual([]);
    expect(reading.meta).toEqual({
      format: 'bondmark-template',
      version: 1,
      exerciseId: 'ex-1',
      variantKey: 'A3',
      studentNumber: '20231234',
      templateToken: 'tok',
      dataSheet: 'Data',
      headerRow: 5,
      distanceUnit: 'angstrom',
      energyUnit: 'kj/mol',
      distanceColumn: 'A',
      energyColumns: ['B', 'D'],
      energyConvention: 'relative',
      pointCount: 40,
      answers: { bondOrder: 'F4', groundTerm: "'My answers'!B2" },
    });
  });

  it('a sheet without format = bondmark-template is not a template; bad values are reported', () => {
    expect(readTemplateMeta({ sheet: 'x', rows: [{ rowNumber: 1, cells: [{ kind: 'text', text: 'format' }, { kind: 'text', text: 'other' }] }] }).isTemplate).toBe(false);
    const reading = readTemplateMeta({
      sheet: 'x',
      rows: [
        ['format', 'bondmark-template'],
        ['version', '2'],
        ['distanceUnit', 'furlong'],
        ['headerRow', 'five'],
      ].map(([k, v], i) => ({ rowNumber: i + 1, cells: [{ kind: 'text', text: k }, { kind: 'text', text: v }] })),
    });
    expect(reading.isTemplate).toBe(true);
    expect(reading.problems).toHaveLength(3);
  });

  it('cell references', () => {
    expect(parseCellReference('F4')).toEqual({ sheet: null, column: 5, row: 4 });
    expect(parseCellReference('Answers!$B$2')).toEqual({ sheet: 'Answers', column: 1, row: 2 });
    expect(parseCellReference("'It''s mine'!C3")).toEqual({ sheet: "It's mine", column: 2, row: 3 });
    expect(parseCellReference('B')).toBeNull();
  });
});
