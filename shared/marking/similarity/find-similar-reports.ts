/**
 * Similarity flags within one exercise: reports whose numbers are identical, or whose deviations
 * from their own references are near-identical, to another student's. A flag goes to a person; it
 * never changes a mark.
 *
 * 1. identical-numbers — two reports of different students share at least `minIdenticalValues`
 *    energies equal to `significantFigures` significant figures (default 5 and 10). Values that
 *    tell nothing are left out: exact zeros, values shared by more than `maxReportsPerValue`
 *    reports (a value everybody has is not a copy), and values that equal the report's own
 *    reference within half a unit of their last typed digit (typed-precision.ts) — two correct
 *    reports of the same variant rightly share those. Every variant has its own reference, so
 *    different variants should never share a number.
 * 2. near-identical-deviations — the residuals (report − its own reference) of two reports, on at
 *    least `minCommonPoints` common distances (matched to 1e−6 a0), have a Pearson correlation
 *    above `minCorrelation` (0.999) and spreads (standard deviations about their means) within a
 *    factor `maxSpreadRatio` (1.1) of each other — a shifted copy, or someone else's errors put on
 *    one's own reference. Only residuals well above round-off count: a report's residual spread
 *    must exceed `roundOffFactor` (10) × half its typical last typed digit and 1e−10 Eh. A pair
 *    already flagged for identical numbers gets no second flag.
 * Pearson correlation: K. Pearson, Proc. R. Soc. Lond. 58 (1895) 240. O(n²) pairs over an
 * exercise; per report the value keys, the distance keys and the normalized residuals are
 * computed once, and reports on the same distances compare by a dot product.
 */
import { typedPrecision } from './typed-precision';

export interface SimilarityReport {
  reportId: string | number;
  /** reports of the same student (resubmissions) are never compared with each other */
  studentKey: string;
  distanceBohr: ArrayLike<number>;
  /** energies as the reader gave them, in hartree (relative energies stay relative) */
  energyHartree: ArrayLike<number>;
  /** report − its own reference at the same points, hartree (empty when unknown) */
  deviationsFromReference: ArrayLike<number>;
}

export type SimilarityKind = 'identical-numbers' | 'near-identical-deviations';

export interface SimilarityFlag {
  reportId: string | number;
  otherReportId: string | number;
  kind: SimilarityKind;
  /** identical-numbers: shared values / the smaller report's values; near-identical-deviations: the correlation */
  score: number;
  detail: string;
}

export interface SimilarityOptions {
  significantFigures?: number;
  minIdenticalValues?: number;
  maxReportsPerValue?: number;
  minCommonPoints?: number;
  minCorrelation?: number;
  maxSpreadRatio?: number;
  roundOffFactor?: number;
}

const DEFAULTS: Required<SimilarityOptions> = {
  significantFigures: 10,
  minIdenticalValues: 5,
  maxReportsPerValue: 50,
  minCommonPoints: 10,
  minCorrelation: 0.999,
  maxSpreadRatio: 1.1,
  roundOffFactor: 10,
};

interface Prepared {
  index: number;
  valueKeys: Set<string>;
  valueCount: number;
  /** distance key (µa0) → residual */
  residualByDistance: Map<number, number>;
  /** distance keys in order, joined: reports with the same grid share it */
  gridKey: string;
  /** centred residuals divided by their norm (for the same-grid dot product), or null when not usable */
  unitResiduals: Float64Array | null;
  spread: number;
  residualsUsable: boolean;
}

const distanceKey = (r: number) => Math.round(r * 1e6);
const formatSpread = (v: number) => v.toExponential(2);

function prepare(report: SimilarityReport, index: number, o: Required<SimilarityOptions>): Prepared {
  const n = Math.min(report.distanceBohr.length, report.energyHartree.length);
  const deviations = report.deviationsFromReference;
  const hasDeviations = deviations.length === n && n > 0;
  const precision = typedPrecision(report.energyHartree);
  const valueKeys = new Set<string>();
  const residualByDistance = new Map<number, number>();
  const keys: number[] = [];
  const residuals: number[] = [];
  for (let i = 0; i < n; i++) {
    const e = report.energyHartree[i];
    const r = report.distanceBohr[i];
    if (!Number.isFinite(e) || !Number.isFinite(r)) continue;
    const d = hasDeviations ? deviations[i] : Number.NaN;
    const explained = Number.isFinite(d) && Math.abs(d) <= precision.halfStepHartree[i] * (1 + 1e-6) + 1e-12 * Math.abs(e);
    if (e !== 0 && !explained) valueKeys.add(e.toPrecision(o.significantFigures));
    if (Number.isFinite(d)) {
      const k = distanceKey(r);
      if (!residualByDistance.has(k)) {
        residualByDistance.set(k, d);
        keys.push(k);
        residuals.push(d);
      }
    }
  }
  let mean = 0;
  for (const d of residuals) mean += d;
  mean /= Math.max(1, residuals.length);
  let sum = 0;
  for (const d of residuals) sum += (d - mean) ** 2;
  const norm = Math.sqrt(sum);
  const spread = residuals.length > 1 ? Math.sqrt(sum / residuals.length) : 0;
  const residualsUsable = residuals.length >= o.minCommonPoints && spread > Math.max(o.roundOffFactor * precision.typicalHalfStepHartree, 1e-10);
  return {
    index,
    valueKeys,
    valueCount: n,
    residualByDistance,
    gridKey: keys.join(','),
    unitResiduals: residualsUsable ? Float64Array.from(residuals, (d) => (d - mean) / norm) : null,
    spread,
    residualsUsable,
  };
}

/** Pearson correlation and spreads of two residual sets on their common distances. */
function compareResiduals(a: Prepared, b: Prepared): { correlation: number; spreadA: number; spreadB: number; common: number } {
  if (a.gridKey === b.gridKey && a.unitResiduals && b.unitResiduals) {
    let dot = 0;
    for (let i = 0; i < a.unitResiduals.length; i++) dot += a.unitResiduals[i] * b.unitResiduals[i];
    return { correlation: dot, spreadA: a.spread, spreadB: b.spread, common: a.unitResiduals.length };
  }
  const xs: number[] = [];
  const ys: number[] = [];
  for (const [k, x] of a.residualByDistance) {
    const y = b.residualByDistance.get(k);
    if (y !== undefined) { xs.push(x); ys.push(y); }
  }
  const m = xs.length;
  if (m < 2) return { correlation: 0, spreadA: 0, spreadB: 0, common: m };
  const mx = xs.reduce((s, v) => s + v, 0) / m;
  const my = ys.reduce((s, v) => s + v, 0) / m;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (let i = 0; i < m; i++) {
    sxx += (xs[i] - mx) ** 2;
    syy += (ys[i] - my) ** 2;
    sxy += (xs[i] - mx) * (ys[i] - my);
  }
  const correlation = sxx > 0 && syy > 0 ? sxy / Math.sqrt(sxx * syy) : 0;
  return { correlation, spreadA: Math.sqrt(sxx / m), spreadB: Math.sqrt(syy / m), common: m };
}

export function findSimilarReports(reports: readonly SimilarityReport[], options: SimilarityOptions = {}): SimilarityFlag[] {
  const o = { ...DEFAULTS, ...options };
  const prepared = reports.map((r, i) => prepare(r, i, o));
  const flags: SimilarityFlag[] = [];
  const pairKey = (i: number, j: number) => (i < j ? i * reports.length + j : j * reports.length + i);

  // 1. identical numbers: an inverted index from value key to the reports holding it
  const holders = new Map<string, number[]>();
  for (const p of prepared) {
    for (const key of p.valueKeys) {
      const list = holders.get(key);
      if (list) list.push(p.index);
      else holders.set(key, [p.index]);
    }
  }
  const shared = new Map<number, number>();
  for (const list of holders.values()) {
    if (list.length < 2 || list.length > o.maxReportsPerValue) continue;
    for (let x = 0; x < list.length; x++) {
      for (let y = x + 1; y < list.length; y++) {
        const i = list[x];
        const j = list[y];
        if (reports[i].studentKey === reports[j].studentKey) continue;
        const key = pairKey(i, j);
        shared.set(key, (shared.get(key) ?? 0) + 1);
      }
    }
  }
  const flaggedPairs = new Set<number>();
  for (const [key, count] of shared) {
    if (count < o.minIdenticalValues) continue;
    const i = Math.floor(key / reports.length);
    const j = key % reports.length;
    flaggedPairs.add(key);
    const smaller = Math.min(prepared[i].valueKeys.size, prepared[j].valueKeys.size);
    flags.push({
      reportId: reports[i].reportId,
      otherReportId: reports[j].reportId,
      kind: 'identical-numbers',
      score: Math.min(1, count / Math.max(1, smaller)),
      detail: `${count} energies are identical to ${o.significantFigures} significant figures (of ${prepared[i].valueCount} and ${prepared[j].valueCount} points).`,
    });
  }

  // 2. near-identical deviations from each report's own reference
  const usable = prepared.filter((p) => p.residualsUsable);
  for (let x = 0; x < usable.length; x++) {
    for (let y = x + 1; y < usable.length; y++) {
      const a = usable[x];
      const b = usable[y];
      if (reports[a.index].studentKey === reports[b.index].studentKey || flaggedPairs.has(pairKey(a.index, b.index))) continue;
      const ratio = a.spread > b.spread ? a.spread / b.spread : b.spread / a.spread;
      if (a.gridKey === b.gridKey && ratio > o.maxSpreadRatio) continue; // cheap rejection on a shared grid
      const c = compareResiduals(a, b);
      if (c.common < o.minCommonPoints || !(c.correlation > o.minCorrelation)) continue;
      const spreadRatio = Math.max(c.spreadA, c.spreadB) / Math.min(c.spreadA, c.spreadB);
      if (!(spreadRatio <= o.maxSpreadRatio)) continue;
      flags.push({
        reportId: reports[a.index].reportId,
        otherReportId: reports[b.index].reportId,
        kind: 'near-identical-deviations',
        score: c.correlation,
        detail:
          `The deviations from each report's own reference correlate ${c.correlation.toFixed(5)} over ${c.common} common distances, ` +
          `with spreads ${formatSpread(c.spreadA)} and ${formatSpread(c.spreadB)} Eh.`,
      });
    }
  }
  return flags.sort((p, q) => q.score - p.score || String(p.reportId).localeCompare(String(q.reportId)));
}
