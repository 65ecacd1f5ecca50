/**
 * The marking fixtures (tests/fixtures/marking, made by make-fixtures.ts from the engine's own
 * reference curves) read with the report reader and marked with the default scheme: the expected
 * outcome of each file is written in the fixtures' README and asserted here.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readReport } from '@shared/marking/read';
import { defaultCurveScheme, markReport } from '@shared/marking/score';
import { FIXTURE_DIR, FIXTURE_FILES, fixtureReference } from '../../fixtures/marking/make-fixtures';

const reference = fixtureReference();
const scheme = defaultCurveScheme({ antibonding: true });

async function mark(name: string) {
  const reading = await readReport(new Uint8Array(readFileSync(join(FIXTURE_DIR, name))), { fileName: name });
  if (!reading.ok) throw new Error(`${name}: ${reading.error.message}`);
  return { reading, result: markReport({ spec: { scheme }, reference, reading }) };
}
const pointsOf = (result: ReturnType<typeof markReport>) => Object.fromEntries(result.checks.map((c) => [c.id, c.points]));

describe('marking fixtures', () => {
  it('the files on disk are what make-fixtures.ts builds today (text files)', async () => {
    for (const file of FIXTURE_FILES.filter((f) => !f.name.endsWith('.xlsx'))) {
      expect(readFileSync(join(FIXTURE_DIR, file.name), 'utf8'), file.name).toBe(await file.build());
    }
  });

  it.each([
    ['exact-bohr-hartree.csv', 'bohr', 'hartree'],
    ['exact-angstrom-ev.csv', 'angstrom', 'ev'],
    ['exact-pm-kjmol.csv', 'pm', 'kj/mol'],
    ['exact-angstrom-kcalmol.tsv', 'angstrom', 'kcal/mol'],
    ['exact-bohr-wavenumber.csv', 'bohr', 'cm-1'],
    ['decimal-comma-angstrom-ev.csv', 'angstrom', 'ev'],
  ])('%s: exact reference data in %s / %s gets 12 of 12', async (name, distance, energy) => {
    const { reading, result } = await mark(name);
    expect(reading.units).toMatchObject({ distance, energy });
    expect(result.checks.filter((c) => c.points < c.max).map((c) => c.message)).toEqual([]);
    expect(result.total).toBe(12);
    expect(result.curve!.rmsdHartree!).toBeLessThan(1e-9); // 12 significant figures typed
  });

  it('noisy-bohr-hartree.csv: σ = 2e−5 Eh noise keeps every point', async () => {
    const { result } = await mark('noisy-bohr-hartree.csv');
    expect(result.total).toBe(12);
    expect(result.curve!.rmsdHartree!).toBeGreaterThan(1.5e-5);
    expect(result.curve!.rmsdHartree!).toBeLessThan(2.5e-5);
  });

  it('shifted-minimum-bohr-hartree.csv: Re 1.67 of 3, De 3 of 3, curve 0 of 4', async () => {
    const { result } = await mark('shifted-minimum-bohr-hartree.csv');
    expect(pointsOf(result)).toEqual({ 'curve-rms': 0, re: 1.67, de: 3, 'antibonding-repulsive': 2 });
    expect(result.total).toBe(6.67);
  });

  it('swapped-columns.csv and unlabelled-swapped.csv: columns paired as meant, 12 of 12', async () => {
    for (const name of ['swapped-columns.csv', 'unlabelled-swapped.csv']) {
      const { result } = await mark(name);
      expect(result.total, name).toBe(12);
      expect(result.curves.map((c) => c.state)).toEqual(['bonding', 'antibonding']);
    }
  });

  it('relative-ev.csv: the relative convention is detected and handled, 12 of 12', async () => {
    const { reading, result } = await mark('relative-ev.csv');
    expect(reading.convention).toBe('relative');
    expect(result.total).toBe(12);
  });

  it('wrong-zeta.csv: another variant’s curve gets only the shape point', async () => {
    const { result } = await mark('wrong-zeta.csv');
    expect(pointsOf(result)).toEqual({ 'curve-rms': 0, re: 0, de: 0, 'antibonding-repulsive': 2 });
  });

  it('bonding-only.csv: 8 of 12, the curve points halved and the missing column named', async () => {
    const { result } = await mark('bonding-only.csv');
    expect(pointsOf(result)).toEqual({ 'curve-rms': 2, re: 3, de: 3, 'antibonding-repulsive': 0 });
    expect(result.checks[3].message).toBe('No antibonding column found, so its shape could not be checked: 0 of 2 points.');
  });

  it('not-a-report.csv is refused by the reader', async () => {
    const reading = await readReport(new Uint8Array(readFileSync(join(FIXTURE_DIR, 'not-a-report.csv'))));
    expect(reading.ok).toBe(false);
    if (!reading.ok) expect(reading.error.code).toBe('no_numeric_data');
  });
});
