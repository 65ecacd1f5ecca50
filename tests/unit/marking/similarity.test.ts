/**
 * Similarity flags on planted copies and none on honest data. The reports are marked first with
 * markReport, whose curve summary (distances, energies as read, deviations from the report's own
 * reference) is exactly what findSimilarReports takes.
 */
import { describe, expect, it } from 'vitest';
import { energyFromHartree, energyToHartree } from '@shared/chemistry/units';
import { computeReference, type CurveReference } from '@shared/exercises/reference';
import { markingSchemeSchema, modelSpecSchema } from '@shared/exercises/spec';
import { drawVariant } from '@shared/exercises/variants';
import { markReport, type MarkableReading } from '@shared/marking/score';
import { findSimilarReports, significantDigits, typedPrecision, type SimilarityReport } from '@shared/marking/similarity';
import { gaussian } from '../../fixtures/marking/make-fixtures';

const model = modelSpecSchema.parse({
  family: 'one-electron',
  method: 'lcao',
  za: { kind: 'fixed', value: 1 },
  zb: { kind: 'fixed', value: 1 },
  zeta: { kind: 'range', min: 0.9, max: 1.5, step: 0.005 },
  states: ['bonding'],
  grid: { unit: 'bohr', start: 0.8, end: 8, step: 0.1 },
});
const scheme = markingSchemeSchema.parse({ checks: [{ kind: 'curve-rms', id: 'rms', label: 'rms', weight: 1, full: 1e-4, zero: 1e-2 }] });

const references = new Map<string, CurveReference>();
function referenceFor(zeta: number): CurveReference {
  const key = zeta.toFixed(3);
  let reference = references.get(key);
  if (!reference) {
    reference = computeReference(model, { family: 'one-electron', key: `zeta=${key}`, za: 1, zb: 1, zeta }) as CurveReference;
    references.set(key, reference);
  }
  return reference;
}
const zetaOf = (student: string) => {
  const v = drawVariant(model, 'term-1', student);
  if (v.family !== 'one-electron' || v.zeta === 'optimized') throw new Error('unexpected variant');
  return v.zeta;
};

/** Marks energies against a reference and returns the similarity input. */
function report(reportId: string, studentKey: string, reference: CurveReference, energyHartree: number[], unit: 'hartree' | 'ev' = 'hartree'): SimilarityReport {
  const reading: MarkableReading = { points: { distance: reference.grid.bohr, energies: { E: energyHartree } }, units: { distance: 'bohr', energy: unit }, convention: 'total' };
  const summary = markReport({ spec: { scheme }, reference, reading }).curve!;
  return { reportId, studentKey, distanceBohr: summary.distanceBohr, energyHartree: summary.energyHartree, deviationsFromReference: summary.deviationHartree };
}

/** An honest report: the student's reference plus independent seeded noise, typed with 8 decimals. */
function honest(k: number): { input: SimilarityReport; reference: CurveReference } {
  const student = `s${String(k).padStart(3, '0')}`;
  const reference = referenceFor(zetaOf(student));
  const normal = gaussian(`honest-${k}`);
  const energies = reference.curves[0].energyHartree.map((e) => Number((e + 5e-5 * normal()).toFixed(8)));
  return { input: report(`r-${student}`, student, reference, energies), reference };
}

const honestReports = Array.from({ length: 60 }, (_, k) => honest(k));

describe('typed precision', () => {
  it('recovers the digits a value was typed with, in the unit it was typed in', () => {
    expect(significantDigits(-0.56483)).toBe(5);
    expect(significantDigits(Math.PI)).toBeGreaterThanOrEqual(12); // a full double: 1e−12 relative needs 12 digits
    const typedEv = [-15.37, -14.2, -13.905, -12.5].map((v) => energyToHartree(v, 'ev'));
    const precision = typedPrecision(typedEv);
    expect(precision.unit).toBe('ev');
    expect(precision.halfStepHartree[0]).toBeCloseTo(energyToHartree(0.005, 'ev'), 15); // −15.37: last digit 0.01 eV
  });
});

describe('findSimilarReports', () => {
  it('60 honest noisy reports (independent seeded noise, drawn variants) raise no flag', () => {
    const inputs = honestReports.map((h) => h.input);
    expect(new Set(honestReports.map((h) => h.reference)).size).toBeGreaterThan(30); // many different variants
    expect(findSimilarReports(inputs)).toEqual([]);
  });

  it('correct reports of one variant typed to 6 decimals in eV share numbers but raise no flag (the reference explains them)', () => {
    const reference = referenceFor(1.2);
    const typed = reference.curves[0].energyHartree.map((e) => energyToHartree(Number(energyFromHartree(e, 'ev').toFixed(6)), 'ev'));
    const same = Array.from({ length: 5 }, (_, k) => report(`same-${k}`, `same-student-${k}`, reference, typed, 'ev'));
    expect(same[0].energyHartree).toEqual(same[1].energyHartree); // they do share every number
    expect(findSimilarReports([...honestReports.map((h) => h.input), ...same])).toEqual([]);
  });

  it('flags the planted copies: a copied file, a shifted copy, and a neighbour variant’s residuals put on one’s own reference', () => {
    const inputs = honestReports.map((h) => h.input);
    // (a) a copied file: student x hands in s003's numbers (x has another variant)
    const source = honestReports[3];
    const copierA = 'x-copied-file';
    expect(zetaOf(copierA)).not.toBe(zetaOf('s003'));
    inputs.push(report('r-copied-file', copierA, referenceFor(zetaOf(copierA)), Array.from(source.input.energyHartree)));
    // (b) a copy of s005's numbers with a constant 0.0123 Eh added, by a student of the same variant
    const five = honestReports[5];
    inputs.push(report('r-shifted-copy', 'x-shifted', five.reference, Array.from(five.input.energyHartree, (e) => e + 0.0123)));
    // (c) s007's deviations put on a neighbouring variant's reference (ζ + 0.005)
    const seven = honestReports[7];
    const neighbour = referenceFor(zetaOf('s007') + 0.005);
    const residuals = Array.from(seven.input.deviationsFromReference);
    inputs.push(report('r-borrowed-residuals', 'x-residuals', neighbour, neighbour.curves[0].energyHartree.map((e, i) => e + residuals[i])));

    const flags = findSimilarReports(inputs);
    const pairs = flags.map((f) => [f.kind, [f.reportId, f.otherReportId].sort().join(' ~ ')]);
    expect(pairs).toHaveLength(3);
    expect(pairs).toContainEqual(['identical-numbers', 'r-copied-file ~ r-s003']);
    expect(pairs).toContainEqual(['near-identical-deviations', 'r-s005 ~ r-shifted-copy']);
    expect(pairs).toContainEqual(['near-identical-deviations', 'r-borrowed-residuals ~ r-s007']);
    const copied = flags.find((f) => f.kind === 'identical-numbers')!;
    expect(copied.score).toBe(1);
    expect(copied.detail).toBe('73 energies are identical to 10 significant figures (of 73 and 73 points).');
    for (const f of flags.filter((x) => x.kind === 'near-identical-deviations')) expect(f.score).toBeGreaterThan(0.999);
  });

  it('never compares two versions of one student, and needs 5 shared values', () => {
    const a = honestReports[0].input;
    const resubmission = { ...a, reportId: 'r-s000-v2' };
    expect(findSimilarReports([a, resubmission])).toEqual([]);
    const four = { ...a, reportId: 'four', studentKey: 'other', energyHartree: Array.from(a.energyHartree, (e, i) => (i < 4 ? e : e + 1e-3 * (i + 1))), deviationsFromReference: [] };
    expect(findSimilarReports([a, four])).toEqual([]);
    const five = { ...four, energyHartree: Array.from(a.energyHartree, (e, i) => (i < 5 ? e : e + 1e-3 * (i + 1))) };
    expect(findSimilarReports([a, five]).map((f) => f.kind)).toEqual(['identical-numbers']);
  });

  it('500 reports of 200 points are compared within seconds', () => {
    const distanceBohr = Array.from({ length: 200 }, (_, i) => 0.5 + 0.05 * i);
    const reports: SimilarityReport[] = Array.from({ length: 500 }, (_, k) => {
      const normal = gaussian(`speed-${k}`);
      const deviations = distanceBohr.map(() => 1e-4 * normal());
      return { reportId: `r${k}`, studentKey: `s${k}`, distanceBohr, energyHartree: distanceBohr.map((r, i) => -0.5 - Math.exp(-r) * (1 + 0.01 * k) + deviations[i]), deviationsFromReference: deviations };
    });
    const t = performance.now();
    expect(findSimilarReports(reports)).toEqual([]);
    expect(performance.now() - t).toBeLessThan(15_000); // ≈ 0.7 s on an idle 2-core machine; loose for busy CI
  });
});
