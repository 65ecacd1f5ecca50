/**
 * `mark` on the command line, run as a child process: the JSON shape, the default scheme (with and
 * without the antibonding curve), a scheme file, --units, and status 2 with one stderr line for an
 * unreadable report (the reader's own message) and for bad flags.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { distanceFromBohr, energyFromHartree } from '@shared/chemistry/units';
import { readReport } from '@shared/marking/read';
import { FIXTURE_DIR, fixtureReference } from '../fixtures/marking/make-fixtures';
import { runCases, type Run } from '../support/cli';


const fixture = (name: string) => join(FIXTURE_DIR, name);
const dir = mkdtempSync(join(tmpdir(), 'bondmark-mark-'));
const schemeFile = join(dir, 'scheme.json');
writeFileSync(
  schemeFile,
  JSON.stringify({
    checks: [
      { kind: 'equilibrium-distance', id: 're-strict', label: 'Re', weight: 5, full: 0.001, zero: 0.1 },
      { kind: 'vibrational-wavenumber', id: 'we', label: 'ωe', weight: 2, full: 30, zero: 300, isotopes: ['1H', '1H'] },
      { kind: 'manual', id: 'write-up', label: 'Write-up', weight: 3 },
    ],
  }),
);
const wrongScheme = join(dir, 'wrong-scheme.json');
writeFileSync(wrongScheme, JSON.stringify([{ kind: 'term-symbol', id: 'term', label: 'term', weight: 1 }]));
const badJson = join(dir, 'bad.json');
writeFileSync(badJson, '{ "checks": [ ');
// a file whose headers name no units: R in Å and E in eV, from the fixture reference
const reference = fixtureReference();
const noUnits = join(dir, 'no-units.csv');
writeFileSync(
  noUnits,
  ['R,E', ...reference.grid.bohr.map((r, i) => `${distanceFromBohr(r, 'angstrom').toPrecision(12)},${energyFromHartree(reference.curves[0].energyHartree[i], 'ev').toPrecision(12)}`)].join('\n'),
);

const cases = {
  exact: ['mark', '--model', 'lcao', '--report', fixture('exact-angstrom-ev.csv')],
  antibonding: ['mark', '--model', 'lcao', '--state', 'antibonding', '--report', fixture('swapped-columns.csv')],
  shiftedWithScheme: ['mark', '--model', 'lcao', '--report', fixture('shifted-minimum-bohr-hartree.csv'), '--scheme', schemeFile],
  units: ['mark', '--model', 'lcao', '--report', noUnits, '--units', 'angstrom,ev'],
  unreadable: ['mark', '--model', 'lcao', '--report', fixture('not-a-report.csv')],
  missingFile: ['mark', '--model', 'lcao', '--report', join(dir, 'nowhere.csv')],
  noReport: ['mark', '--model', 'lcao'],
  wrongScheme: ['mark', '--model', 'lcao', '--report', fixture('exact-bohr-hartree.csv'), '--scheme', wrongScheme],
  badJson: ['mark', '--model', 'lcao', '--report', fixture('exact-bohr-hartree.csv'), '--scheme', badJson],
  badUnits: ['mark', '--model', 'lcao', '--report', noUnits, '--units', 'furlong,ev'],
} satisfies Record<string, string[]>;

let results = {} as Record<keyof typeof cases, Run>;

beforeAll(async () => {
  results = await runCases(cases);
}, 300_000);

const json = (run: Run) => JSON.parse(run.stdout) as Record<string, any>;

describe('cli mark', () => {
  it('prints the JSON contract for an exact Å/eV report with the default scheme', () => {
    const run = results.exact;
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    const out = json(run);
    expect(Object.keys(out)).toEqual(['units', 'points', 're_bohr', 'de_ev', 'rmsd_hartree', 'checks', 'total', 'max']);
    expect(out.units).toEqual({ distance: 'angstrom', energy: 'ev' });
    expect(out.points).toBe(115);
    // LCAO ζ = 1: Re = 2.493 a0, De = 1.764 eV (science.md §1; classic LCAO result, from memory)
    expect(out.re_bohr).toBeCloseTo(2.493, 3);
    expect(out.de_ev).toBeCloseTo(1.764, 3);
    expect(out.rmsd_hartree).toBeLessThan(1e-9);
    expect(out.checks.map((c: any) => Object.keys(c))).toEqual(Array(3).fill(['id', 'points', 'max', 'message']));
    expect(out.checks.map((c: any) => [c.id, c.points, c.max])).toEqual([
      ['curve-rms', 4, 4],
      ['re', 3, 3],
      ['de', 3, 3],
    ]);
    expect(out.checks[1].message).toBe('Re found 1.3191 Å, expected 1.3191 Å (±0.00529 Å for full points): 3 of 3 points.');
    expect(out).toMatchObject({ total: 10, max: 10 });
  });

  it('--state antibonding adds the repulsive check and pairs swapped columns by their headers', () => {
    const out = json(results.antibonding);
    expect(out.checks.map((c: any) => c.id)).toEqual(['curve-rms', 're', 'de', 'antibonding-repulsive']);
    expect(out).toMatchObject({ total: 12, max: 12 });
  });

  it('--scheme reads a scheme file; a manual check counts 0 until marked by hand', () => {
    const out = json(results.shiftedWithScheme);
    expect(out.checks).toEqual([
      expect.objectContaining({ id: 're-strict', points: 2.53, max: 5 }), // Re 0.05 a0 out: 5 × (0.1 − 0.05)/(0.1 − 0.001)
      expect.objectContaining({ id: 'we', max: 2 }),
      { id: 'write-up', points: 0, max: 3, message: 'marked by hand' },
    ]);
    expect(out.max).toBe(10);
  });

  it('--units gives the units a header does not', () => {
    const out = json(results.units);
    expect(results.units.code).toBe(0);
    expect(out.units).toEqual({ distance: 'angstrom', energy: 'ev' });
    expect(out).toMatchObject({ total: 10, max: 10 });
  });

  it('an unreadable report exits 2 with the reader’s message on one stderr line', async () => {
    const run = results.unreadable;
    expect(run.code).toBe(2);
    expect(run.stdout).toBe('');
    const reading = await readReport(new Uint8Array(readFileSync(fixture('not-a-report.csv'))), { fileName: 'not-a-report.csv' });
    expect(reading.ok).toBe(false);
    if (!reading.ok) expect(run.stderr).toBe(`error: ${reading.error.message}\n`);
  });

  it.each([
    ['missingFile', /^error: cannot read --report file '.*nowhere\.csv' \(ENOENT\)\n$/],
    ['noReport', /^error: --report FILE is required/],
    ['wrongScheme', /^error: --scheme file '.*': a term-symbol check does not apply to a one-electron curve model\n$/],
    ['badJson', /^error: --scheme file '.*' is not JSON/],
    ['badUnits', /^error: --units: 'furlong' is not a distance unit/],
  ] as const)('%s exits 2 with one line', (name, pattern) => {
    const run = results[name];
    expect(run.code).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toMatch(pattern);
    expect(run.stderr.trimEnd().split('\n')).toHaveLength(1);
  });
});
