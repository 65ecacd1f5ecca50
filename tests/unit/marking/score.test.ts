/**
 * markReport on curve exercises: partial credit at the tolerance boundaries, every curve model
 * family, column pairing, unit handling, the relative convention, late penalties, and that bad
 * data gives 0 with a reason instead of an exception.
 * Reference values come from the engine itself (computeReference): a curve equal to the reference
 * must get full marks — computed (regression) unless a source is named.
 */
import { describe, expect, it } from 'vitest';
import { curve } from '@shared/chemistry/curves';
import { energyToHartree, HARTREE_EV } from '@shared/chemistry/units';
import { zonedWallTimeToInstant } from '@shared/exercises/late';
import { computeReference, ENGINE_VERSION, type CurveReference } from '@shared/exercises/reference';
import { z } from 'zod';
import { latePolicySchema, markingSchemeSchema, modelSpecSchema, type MarkingScheme } from '@shared/exercises/spec';
import { drawVariant } from '@shared/exercises/variants';
import {
  creditFraction,
  curveReferenceAt,
  defaultCurveScheme,
  markReport,
  MARKING_VERSION,
  referenceEnergiesAt,
  type MarkableReading,
} from '@shared/marking/score';
import { gaussian } from '../../fixtures/marking/make-fixtures';

type ModelInput = Extract<z.input<typeof modelSpecSchema>, { family: 'one-electron' | 'two-electron' }>;

function referenceOf(model: ModelInput): CurveReference {
  const spec = modelSpecSchema.parse(model);
  const reference = computeReference(spec, drawVariant(spec, 'seed', 'student'));
  if (reference.kind !== 'curve') throw new Error('curve reference expected');
  return reference;
}

const lcaoModel: ModelInput = {
  family: 'one-electron',
  method: 'lcao',
  za: { kind: 'fixed', value: 1 },
  zb: { kind: 'fixed', value: 1 },
  zeta: { kind: 'fixed', value: 1 },
  states: ['bonding', 'antibonding'],
  grid: { unit: 'bohr', start: 0.8, end: 12, step: 0.1 },
};
const lcao = referenceOf(lcaoModel);

/** A reading with the reference's own curves (plus any change), in bohr/hartree unless units are given. */
function readingOf(
  reference: CurveReference,
  options: {
    columns?: Record<string, number[]>;
    transform?: (e: number[], state: string) => number[];
    units?: MarkableReading['units'];
    convention?: 'total' | 'relative';
    distance?: number[];
  } = {},
): MarkableReading {
  const energies: Record<string, number[]> = {};
  if (options.columns) Object.assign(energies, options.columns);
  else for (const c of reference.curves) energies[c.state === 'bonding' ? 'E bonding' : 'E antibonding'] = options.transform ? options.transform(c.energyHartree, c.state) : c.energyHartree;
  return {
    points: { distance: options.distance ?? reference.grid.bohr, energies },
    units: options.units ?? { distance: 'bohr', energy: 'hartree' },
    convention: options.convention ?? 'total',
  };
}

const scheme = (checks: unknown[]): MarkingScheme => markingSchemeSchema.parse({ checks });
const rms = (full: number, zero: number, extra: Record<string, unknown> = {}) => ({ kind: 'curve-rms', id: 'rms', label: 'RMS', weight: 4, full, zero, ...extra });

describe('creditFraction', () => {
  it('gives full points up to and at the full tolerance, none at and beyond the zero tolerance, linear between', () => {
    const rule = { full: 0.01, zero: 0.1 };
    expect(creditFraction(0, rule)).toBe(1);
    expect(creditFraction(0.01, rule)).toBe(1);
    expect(creditFraction(-0.01, rule)).toBe(1); // deviations count by size
    expect(creditFraction(0.0100001, rule)).toBeLessThan(1);
    expect(creditFraction(0.055, rule)).toBeCloseTo(0.5, 12);
    expect(creditFraction(0.1, rule)).toBe(0);
    expect(creditFraction(0.2, rule)).toBe(0);
    expect(creditFraction(Number.NaN, rule)).toBe(0);
  });
  it('all-or-nothing gives full points up to the full tolerance and nothing beyond it', () => {
    const rule = { full: 0.01, zero: 0.1, credit: 'all-or-nothing' as const };
    expect(creditFraction(0.01, rule)).toBe(1);
    expect(creditFraction(0.0101, rule)).toBe(0);
    expect(creditFraction(0.05, rule)).toBe(0);
  });
  it('absorbs unit-conversion round-off at the boundary (0.005 Å there and back through bohr)', () => {
    const fullBohr = 0.005 / 0.529177210903; // CODATA 2018 bohr in Å
    const deviationBohr = (1.325 - 1.32) / 0.529177210903; // 0.00499999… Å after subtraction
    expect(creditFraction(deviationBohr, { full: fullBohr, zero: 2 * fullBohr })).toBe(1);
  });
});

describe('markReport: curve deviation and partial credit', () => {
  it('a curve equal to the reference gets every point of the default scheme, in the result shape', () => {
    const result = markReport({ spec: { scheme: defaultCurveScheme({ antibonding: true }) }, reference: lcao, reading: readingOf(lcao) });
    expect(result.checks.map((c) => [c.id, c.points, c.max])).toEqual([
      ['curve-rms', 4, 4],
      ['re', 3, 3],
      ['de', 3, 3],
      ['antibonding-repulsive', 2, 2],
    ]);
    expect(result).toMatchObject({ points: 12, max: 12, total: 12, latePenaltyPercent: 0, late: null, engineVersion: ENGINE_VERSION, markingVersion: MARKING_VERSION });
    for (const c of result.checks) {
      expect(c.message).toMatch(/: \d+(\.\d+)? of \d+ points?\.$/);
      expect(c.message.split(/\.\s/).length).toBe(1); // one sentence
      expect(c.evaluated).toBe(true);
    }
    expect(result.curve?.state).toBe('bonding');
    expect(result.curve?.rmsdHartree).toBe(0);
    expect(result.curve?.reBohr).toBeCloseTo(lcao.minimum!.reBohr, 4);
  });

  it('a constant shift equal to the full tolerance still gets full points; 1 % more loses a little, linearly', () => {
    const shift = 1e-3;
    const at = (c: number) => markReport({ spec: { scheme: scheme([rms(shift, 1e-2)]) }, reference: lcao, reading: readingOf(lcao, { transform: (e) => e.map((v) => v + c) }) }).checks[0];
    expect(at(shift).points).toBe(4);
    expect(at(shift).deviation).toBeCloseTo(shift, 14);
    const over = at(shift * 1.5); // (1e-2 − 1.5e-3)/(1e-2 − 1e-3) × 4 = 3.777…
    expect(over.points).toBe(3.78);
    expect(at(0.0055).points).toBe(2); // half way between the tolerances
    expect(at(1e-2).points).toBe(0);
    expect(at(0.5).points).toBe(0);
  });

  it('removeShift subtracts the mean difference first, so a shifted exact curve gets full points', () => {
    const reading = readingOf(lcao, { transform: (e) => e.map((v) => v + 0.02) });
    const result = markReport({ spec: { scheme: scheme([rms(1e-4, 1e-2, { removeShift: true }), { ...rms(1e-4, 1e-2), id: 'plain' }]) }, reference: lcao, reading });
    expect(result.checks[0].points).toBe(4);
    expect(result.checks[0].message).toContain('after removing a constant shift of 0.02 Eₕ');
    expect(result.checks[1].points).toBe(0);
  });

  it('curve-max takes the largest deviation; all-or-nothing gives 0 just outside', () => {
    const bump = (e: number[]) => e.map((v, i) => (i === 20 ? v + 3e-3 : v));
    const reading = readingOf(lcao, { transform: (e, s) => (s === 'bonding' ? bump(e) : e) });
    const result = markReport({
      spec: { scheme: scheme([{ kind: 'curve-max', id: 'max', label: 'max', weight: 2, full: 2.9e-3, zero: 1e-2, credit: 'all-or-nothing' }, { kind: 'curve-max', id: 'max2', label: 'max', weight: 2, full: 3e-3, zero: 1e-2 }]) },
      reference: lcao,
      reading,
    });
    expect(result.checks[0].points).toBe(0);
    expect(result.checks[0].message).toContain('all or nothing');
    expect(result.checks[1].points).toBe(2);
    expect(result.checks[1].deviation).toBeCloseTo(3e-3, 12);
  });

  it('speaks in the student’s units: Å and eV, tolerances converted', () => {
    const reading = readingOf(lcao, { units: { distance: 'angstrom', energy: 'ev' }, transform: (e) => e.map((v) => v + energyToHartree(0.05, 'ev')) });
    const result = markReport({ spec: { scheme: defaultCurveScheme() }, reference: lcao, reading });
    const [curveCheck, re] = result.checks;
    expect(curveCheck.unit).toBe('eV');
    expect(curveCheck.found).toBeCloseTo(0.05, 10);
    expect(curveCheck.message).toMatch(/^RMS deviation from the reference 0\.05 eV over 226 points \(0\.42–6\.35 Å\), expected at most 0\.00272 eV for full points and none from 0\.272 eV: /);
    expect(re.message).toMatch(/^Re found 1\.3191 Å, expected 1\.3191 Å \(±0\.00529 Å for full points\): 3 of 3 points\.$/);
    expect(re.unit).toBe('Å');
  });

  it('relative energies get the model dissociation limit added, said so in the sentence; De comes from the tail', () => {
    const limit = lcao.dissociationLimitHartree;
    const reading = readingOf(lcao, { convention: 'relative', transform: (e) => e.map((v) => v - limit) });
    const result = markReport({ spec: { scheme: defaultCurveScheme({ antibonding: true }) }, reference: lcao, reading });
    expect(result.total).toBe(12);
    expect(result.checks[0].message).toContain("), relative energies with the model's dissociation limit −0.500000 Eₕ added to each, expected at most");
    expect(result.checks[2].message).toContain('from the tail of your relative energies');
  });

  it('pairs columns by header words (σu first), or by the smaller deviation when unlabelled', () => {
    const [bonding, antibonding] = lcao.curves.map((c) => c.energyHartree);
    const byWords = readingOf(lcao, { columns: { 'E(σu*)': antibonding, 'E(σg)': bonding } });
    const unlabelled = readingOf(lcao, { columns: { E1: antibonding, E2: bonding } });
    for (const reading of [byWords, unlabelled]) {
      const result = markReport({ spec: { scheme: defaultCurveScheme({ antibonding: true }) }, reference: lcao, reading });
      expect(result.total).toBe(12);
      expect(result.curves.map((c) => [c.state, c.column])).toEqual([
        ['bonding', Object.keys(reading.points.energies)[1]],
        ['antibonding', Object.keys(reading.points.energies)[0]],
      ]);
    }
    const notes = markReport({ spec: { scheme: defaultCurveScheme() }, reference: lcao, reading: unlabelled }).notes;
    expect(notes.join(' ')).toContain('"E2" was read as the bonding curve');
  });

  it('compares only the common range and says how many points lay outside', () => {
    const extra = [...lcao.grid.bohr, 14, 16];
    const reading = readingOf(lcao, { distance: extra, columns: { 'E bonding': [...lcao.curves[0].energyHartree, 99, 99] } });
    const check = markReport({ spec: { scheme: scheme([rms(1e-4, 1e-2)]) }, reference: { ...lcao, curves: [lcao.curves[0]] }, reading }).checks[0];
    expect(check.points).toBe(4);
    expect(check.message).toContain("over 113 points (0.80–12.00 a₀; 2 outside the reference's range not compared)");
  });
});

describe('markReport: Re, De, ωe and the repulsive check on the student’s own curve', () => {
  it('a minimum moved out by 0.05 a0 costs Re points linearly and nothing on De', () => {
    const moved = curve({ ...lcao.params, state: 'bonding' }, lcao.grid.bohr.map((r) => r - 0.05)).energyHartree;
    const reading = readingOf(lcao, { columns: { 'E bonding': moved, 'E antibonding': lcao.curves[1].energyHartree } });
    const result = markReport({ spec: { scheme: defaultCurveScheme({ antibonding: true }) }, reference: lcao, reading });
    const byId = Object.fromEntries(result.checks.map((c) => [c.id, c]));
    expect(byId.re.deviation).toBeCloseTo(0.05, 4);
    expect(byId.re.points).toBe(1.67); // 3 × (0.1 − 0.05)/(0.1 − 0.01)
    expect(byId.de.points).toBe(3);
    expect(byId['antibonding-repulsive'].points).toBe(2);
  });

  it('ωe with other isotopes scales as 1/√μ; the student’s own curvature is used', () => {
    const checks = [
      { kind: 'vibrational-wavenumber', id: 'w-hh', label: 'ωe', weight: 2, full: 5, zero: 50 },
      { kind: 'vibrational-wavenumber', id: 'w-dd', label: 'ωe', weight: 2, full: 5, zero: 50, isotopes: ['2H', '2H'] },
    ];
    const result = markReport({ spec: { scheme: scheme(checks) }, reference: lcao, reading: readingOf(lcao) });
    const [hh, dd] = result.checks;
    expect(hh.points).toBe(2);
    expect(dd.points).toBe(2);
    expect(hh.expected).toBeCloseTo(lcao.harmonicWavenumberCm1!, 9);
    // bare nuclei: ωe(D2+)/ωe(H2+) = √(m_p/m_d) = √(1836.15267343/3670.48296788) = 0.707282
    // (CODATA 2018 proton and deuteron masses in me; the deuteron mass from memory)
    expect((dd.expected as number) / (hh.expected as number)).toBeCloseTo(0.707282, 5);
    expect(dd.message).toContain('for 2H–2H');
  });

  it('an antibonding curve with a minimum gets 0 and the sentence names where the minimum is', () => {
    const bound = lcao.curves[0].energyHartree.map((e) => e + 0.2);
    const reading = readingOf(lcao, { columns: { 'E bonding': lcao.curves[0].energyHartree, 'E antibonding': bound } });
    const check = markReport({ spec: { scheme: defaultCurveScheme({ antibonding: true }) }, reference: lcao, reading }).checks[3];
    expect(check.points).toBe(0);
    expect(check.found).toBe('bound');
    expect(check.message).toMatch(/^Your antibonding curve has a minimum near R = 2\.49 a₀, expected a repulsive curve with no minimum: 0 of 2 points\.$/);
  });

  it('a noisy but falling antibonding curve counts as repulsive', () => {
    const normal = gaussian('antibonding-noise');
    const reading = readingOf(lcao, { transform: (e, s) => (s === 'antibonding' ? e.map((v) => v + 2e-5 * normal()) : e) });
    expect(markReport({ spec: { scheme: defaultCurveScheme({ antibonding: true }) }, reference: lcao, reading }).checks[3].points).toBe(2);
  });
});

describe('markReport: every curve model family', () => {
  const families: [string, ModelInput][] = [
    ['one-electron LCAO, ζ optimized', { ...lcaoModel, zeta: { kind: 'optimized' }, states: ['bonding'], grid: { unit: 'bohr', start: 1, end: 8, step: 0.05 } }],
    ['one-electron exact', { ...lcaoModel, method: 'exact', states: ['bonding', 'antibonding'], grid: { unit: 'bohr', start: 1, end: 8, step: 0.05 } }],
    ['H2 MO', { family: 'two-electron', method: 'mo', zeta: { kind: 'fixed', value: 1 }, grid: { unit: 'angstrom', start: 0.4, end: 4, step: 0.05 } }],
    ['H2 CI, ζ optimized', { family: 'two-electron', method: 'ci', zeta: { kind: 'optimized' }, grid: { unit: 'bohr', start: 0.8, end: 8, step: 0.05 } }],
    ['H2 VB', { family: 'two-electron', method: 'vb', zeta: { kind: 'fixed', value: 1 }, grid: { unit: 'bohr', start: 0.8, end: 8, step: 0.05 } }],
  ];
  const curveScheme = (reference: CurveReference) =>
    scheme([
      rms(1e-4, 1e-2),
      { kind: 'equilibrium-distance', id: 're', label: 'Re', weight: 3, full: 0.01, zero: 0.1 },
      { kind: 'well-depth', id: 'de', label: 'De', weight: 3, full: 0.02, zero: 0.2 },
      { kind: 'vibrational-wavenumber', id: 'we', label: 'ωe', weight: 2, full: 20, zero: 200 },
      ...(reference.curves.length > 1 ? [{ kind: 'antibonding-repulsive', id: 'rep', label: 'repulsive', weight: 1 }] : []),
    ]);

  it.each(families)('%s: the reference itself gets full marks; a 5 mEh error does not', (_name, model) => {
    const reference = referenceOf(model);
    const full = markReport({ spec: { scheme: curveScheme(reference) }, reference, reading: readingOf(reference) });
    expect(full.checks.filter((c) => c.points !== c.max).map((c) => c.message)).toEqual([]);
    expect(full.total).toBe(full.max);
    const wrong = markReport({ spec: { scheme: curveScheme(reference) }, reference, reading: readingOf(reference, { transform: (e) => e.map((v, i) => v + 5e-3 * Math.cos(i)) }) });
    expect(wrong.checks[0].points).toBeLessThan(4);
    expect(wrong.total).toBeLessThan(wrong.max);
  });

  it('H2 MO: De is measured against two H atoms (−1 Eh), not the curve’s own ionic limit', () => {
    const reference = referenceOf(families.find(([name]) => name === 'H2 MO')![1]);
    expect(reference.dissociationLimitHartree).toBe(-1); // separated atoms in the same basis (curves/CONTEXT.md)
    const de = markReport({ spec: { scheme: curveScheme(reference) }, reference, reading: readingOf(reference) }).checks[2];
    // Levine, Quantum Chemistry, ch. 13 (from memory; science.md §3): simple MO De = 2.70 eV
    expect(Math.abs((de.found as number) * HARTREE_EV - 2.7)).toBeLessThan(0.01);
  });

  it('a heteronuclear LCAO curve without a minimum: the curve is still compared, Re/De/ωe say why they cannot be marked', () => {
    const reference = referenceOf({ ...lcaoModel, zb: { kind: 'fixed', value: 2 }, states: ['bonding'], grid: { unit: 'bohr', start: 1, end: 8, step: 0.25 } });
    expect(reference.minimum).toBeNull(); // ζ = 1 on both centres: the lower HeH²⁺ curve is repulsive — computed (regression)
    const result = markReport({ spec: { scheme: curveScheme(reference) }, reference, reading: readingOf(reference) });
    expect(result.checks.map((c) => c.points)).toEqual([4, 0, 0, 0]);
    expect(result.checks[1].message).toBe('The reference bonding curve has no minimum, so Re cannot be marked: 0 of 3 points.');
    expect(result.checks[1].evaluated).toBe(false);
  });
});

describe('markReport: reference at distances off the exercise grid', () => {
  const offGrid = lcao.grid.bohr.slice(2, -2).map((r) => r + 0.037);
  it('exact mode computes the model at the student’s R (a curve from the model itself gets deviation 0)', () => {
    const energies = curve({ ...lcao.params, state: 'bonding' }, offGrid).energyHartree;
    const at = referenceEnergiesAt(lcao, 'bonding', offGrid, 'exact');
    expect(at.offGrid).toBe(offGrid.length);
    expect(Array.from(at.energyHartree)).toEqual(energies);
    const result = markReport({ spec: { scheme: scheme([rms(1e-9, 1e-6)]) }, reference: lcao, reading: readingOf(lcao, { distance: offGrid, columns: { 'E bonding': energies } }) });
    expect(result.checks[0].deviation).toBe(0);
  });
  it('interpolate mode stays within the cubic interpolation bound of the 0.1 a0 grid (R ≥ 1 a0)', () => {
    const from1 = offGrid.filter((r) => r >= 1);
    const exact = curve({ ...lcao.params, state: 'bonding' }, from1).energyHartree;
    const interpolated = referenceEnergiesAt(lcao, 'bonding', from1, 'interpolate').energyHartree;
    const worst = Math.max(...exact.map((e, i) => Math.abs(e - interpolated[i])));
    // error bound of 4-point Lagrange interpolation (A&S 25.2.15): (9/16)·h⁴/4!·max|E''''|, with E''''
    // from the model by the 5-point central difference (step 0.02 a0) over 0.9–1.3 a0
    const e = (r: number) => curve({ ...lcao.params, state: 'bonding' }, [r]).energyHartree[0];
    const d = 0.02;
    let fourth = 0;
    for (let r = 0.9; r <= 1.3; r += 0.01) fourth = Math.max(fourth, Math.abs((e(r - 2 * d) - 4 * e(r - d) + 6 * e(r) - 4 * e(r + d) + e(r + 2 * d)) / d ** 4));
    const bound = ((9 / 16) * 0.1 ** 4 * fourth) / 24;
    expect(worst).toBeLessThan(bound);
    expect(worst).toBeGreaterThan(bound / 100); // the bound is the right size, not a loose one
  });
  it('keeps the per-reference work: a second report on the same off-grid distances reuses the computed energies', () => {
    const fresh = referenceOf({ ...lcaoModel, states: ['bonding'], grid: { unit: 'bohr', start: 1, end: 6, step: 0.5 } });
    const distances = [1.1, 1.3, 1.7, 2.2, 2.9, 3.3, 4.1, 5.2];
    const first = referenceEnergiesAt(fresh, 'bonding', distances);
    expect(first.failure).toBeNull();
    // spoil the model parameters: computing again would now fail, reusing does not
    (fresh.params as { zeta: number }).zeta = -1;
    const again = referenceEnergiesAt(fresh, 'bonding', distances);
    expect(again.failure).toBeNull();
    expect(Array.from(again.energyHartree)).toEqual(Array.from(first.energyHartree));
    const other = referenceEnergiesAt(fresh, 'bonding', [1.15, 1.35, 1.75]);
    expect(other.failure).toMatch(/zeta|ζ|exponent/i); // a new distance list is computed (and here fails)
  });
});

describe('markReport: never throws for bad student data', () => {
  const full = defaultCurveScheme({ antibonding: true });
  it('no reading, too few points, NaN, and no antibonding column each give 0 with a reason', () => {
    const none = markReport({ spec: { scheme: full }, reference: lcao, reading: null });
    expect(none.total).toBe(0);
    expect(none.checks[0].message).toBe('No data file was read, so there is no curve to compare with the reference: 0 of 4 points.');
    expect(none.checks.every((c) => !c.evaluated)).toBe(true);

    const short = readingOf(lcao, { distance: [1, 2, 3], columns: { 'E bonding': [-0.4, -0.5, -0.45] } });
    const shortResult = markReport({ spec: { scheme: full }, reference: lcao, reading: short });
    expect(shortResult.checks[1].message).toMatch(/^Re could not be found: your bonding curve could not be analysed \(Curve has 3 usable points; at least 5 are needed\); expected 2\.493 a₀: 0 of 3 points\.$/);
    expect(shortResult.checks[3].message).toBe('No antibonding column found, so its shape could not be checked: 0 of 2 points.');

    const nan = readingOf(lcao, { transform: (e) => e.map(() => Number.NaN) });
    expect(markReport({ spec: { scheme: full }, reference: lcao, reading: nan }).total).toBe(0);
  });
  it('a check of the wrong family gives 0 with a sentence; manual checks say "marked by hand"', () => {
    const s = scheme([{ kind: 'term-symbol', id: 'term', label: 'term', weight: 1 }, { kind: 'manual', id: 'write-up', label: 'write-up', weight: 5 }]);
    const result = markReport({ spec: { scheme: s }, reference: lcao, reading: readingOf(lcao) });
    expect(result.checks[0]).toMatchObject({ points: 0, evaluated: false, message: "A term-symbol check does not apply to this exercise's reference (a curve): 0 of 1 point." });
    expect(result.checks[1]).toMatchObject({ points: 0, max: 5, message: 'marked by hand' });
  });
});

describe('markReport: late penalty', () => {
  const policy = latePolicySchema.parse({ graceMinutes: 10, penaltyPerDayPercent: 10, capPercent: 30 });
  const spec = { scheme: defaultCurveScheme(), late: policy };
  const reading = readingOf(lcao, { transform: (e) => e.map((v) => v + 5.5e-3) }); // curve 2 of 4 (half way)
  const dueAt = zonedWallTimeToInstant('2026-03-29T12:00', 'Europe/London'); // BST began at 01:00 UTC that day
  const at = (iso: string, extensionMinutes?: number) => markReport({ spec, reference: lcao, reading, dueAt, submittedAt: new Date(iso), extensionMinutes });

  it('takes the penalty off the total, rounded to 0.01, from upload time, due date and extension', () => {
    expect(dueAt.toISOString()).toBe('2026-03-29T11:00:00.000Z');
    const onTime = at('2026-03-29T10:59:00Z');
    expect(onTime.late).toMatchObject({ onTime: true, penaltyPercent: 0 });
    const points = onTime.points;
    expect(onTime.total).toBe(points);
    expect(at('2026-03-29T11:10:00Z').latePenaltyPercent).toBe(0); // inside the 10-minute grace
    const oneDay = at('2026-03-29T11:11:00Z');
    expect(oneDay.late).toMatchObject({ onTime: false, daysLate: 1, penaltyPercent: 10 });
    expect(oneDay.total).toBe(Math.round(points * 0.9 * 100) / 100);
    expect(at('2026-04-05T12:00:00Z').latePenaltyPercent).toBe(30); // capped
    expect(at('2026-03-30T11:00:00Z', 24 * 60).late?.onTime).toBe(true); // a one-day extension
  });
  it('without a due date there is no late outcome', () => {
    expect(markReport({ spec, reference: lcao, reading }).late).toBeNull();
  });
});

describe('curveReferenceAt (the command line’s reference on a file’s own R values)', () => {
  it('matches computeReference on the same grid', () => {
    const built = curveReferenceAt(lcao.params, ['bonding', 'antibonding'], lcao.grid.bohr);
    expect(built.curves.map((c) => c.energyHartree)).toEqual(lcao.curves.map((c) => c.energyHartree));
    expect(built.minimum).toEqual(lcao.minimum);
    expect(built.dissociationLimitHartree).toBe(lcao.dissociationLimitHartree);
    expect(built.harmonicWavenumberCm1).toBeCloseTo(lcao.harmonicWavenumberCm1!, 9);
    expect(built.antibondingRepulsive).toBe(true);
  });
});

describe('markReport: random data never throws', () => {
  it('300 random readings and answers give points within [0, max] and a sentence for every check', () => {
    const random = gaussian('fuzz');
    const pick = <T>(items: T[]) => items[Math.floor(Math.abs(random() * 1e6)) % items.length];
    const oddNumbers = [Number.NaN, Number.POSITIVE_INFINITY, -1, 0, 1e300, -1e-300, 2.5, -0.5];
    const allChecks = scheme([
      rms(1e-4, 1e-2, { removeShift: true }),
      { kind: 'curve-max', id: 'max', label: 'max', weight: 1, full: 1e-4, zero: 1e-2 },
      { kind: 'equilibrium-distance', id: 're', label: 'Re', weight: 1, full: 0.01, zero: 0.1 },
      { kind: 'well-depth', id: 'de', label: 'De', weight: 1, full: 0.02, zero: 0.2 },
      { kind: 'vibrational-wavenumber', id: 'we', label: 'ωe', weight: 1, full: 20, zero: 200, isotopes: ['9Zz', '1H'] },
      { kind: 'antibonding-repulsive', id: 'rep', label: 'rep', weight: 1 },
      { kind: 'configuration', id: 'configuration', label: 'c', weight: 1 },
      { kind: 'term-symbol', id: 'term', label: 't', weight: 1 },
      { kind: 'huckel-energies', id: 'x', label: 'x', weight: 1, full: 0.01, zero: 0.1 },
    ]);
    for (let k = 0; k < 300; k++) {
      const n = Math.floor(Math.abs(random()) * 12);
      const distance = Array.from({ length: n }, () => (Math.abs(random()) < 0.2 ? pick(oddNumbers) : 0.5 + Math.abs(random()) * 6));
      const columns = Math.floor(Math.abs(random()) * 3);
      const energies: Record<string, number[]> = {};
      for (let c = 0; c < columns; c++) {
        const length = Math.abs(random()) < 0.2 ? Math.max(0, n - 2) : n;
        energies[pick(['E', 'E+', 'E-', 'σu', 'x', `c${c}`])] = Array.from({ length }, () => (Math.abs(random()) < 0.2 ? pick(oddNumbers) : -0.5 + 0.1 * random()));
      }
      const reading: MarkableReading = {
        points: { distance, energies },
        units: { distance: pick(['bohr', 'angstrom', 'pm'] as const), energy: pick(['hartree', 'ev', 'kj/mol', 'kcal/mol', 'cm-1'] as const) },
        convention: pick(['total', 'relative'] as const),
      };
      const answers = { configuration: pick(['', '(1σg)^9', '((((', 'KK', '1σg2 1σg2']), term: pick(['', '3Σ', '∞', 'sigma']), x: pick(['', 'α+β+', '1,2;3', '√']) };
      const result = markReport({ spec: { scheme: allChecks }, reference: lcao, reading, answers });
      for (const c of result.checks) {
        expect(c.points).toBeGreaterThanOrEqual(0);
        expect(c.points).toBeLessThanOrEqual(c.max);
        expect(c.message.length).toBeGreaterThan(5);
      }
      expect(Number.isFinite(result.total)).toBe(true);
    }
  });
});
