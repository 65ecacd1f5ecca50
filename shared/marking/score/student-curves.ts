/**
 * Pairing the student's energy columns with the reference's curves, and the student's energies at
 * the points the reference covers.
 *
 * Pairing: a column whose header (or the reader's reading of it) names a curve — bonding, σg, E+,
 * ground, singlet, lower / antibonding, σu, σ*, E−, triplet, upper — is paired with that state.
 * The other columns are paired with the remaining states the way that gives the smaller RMS
 * deviation from the reference (so unlabelled or swapped columns are read as meant); with a tie,
 * in column order. Relative energies (reading.convention = 'relative') are turned into totals by
 * adding the model's dissociation limit before they are compared.
 */
import type { CurveState } from '@shared/chemistry/curves';
import type { CurveReference } from '@shared/exercises/reference';
import { referenceEnergiesAt } from './reference-values';
import type { MarkableReading, ReferenceEvaluation } from './types';

export interface StudentCurve {
  column: string;
  header: string;
  state: CurveState;
  pairedBy: 'header' | 'deviation' | 'order';
  /** usable points (finite, R > 0), ascending R */
  distanceBohr: Float64Array;
  /** energies as read, hartree */
  energyAsRead: Float64Array;
  /** total energies (relative + the model's limit when the convention is relative) */
  energyTotal: Float64Array;
  /** reference at the same distances, NaN outside the reference's range */
  referenceHartree: Float64Array;
  inRange: number;
  offGrid: number;
  failure: string | null;
}

export interface Pairing {
  curves: StudentCurve[];
  /** reference states with no column */
  missing: CurveState[];
  /** columns not paired with any state */
  unpaired: string[];
  notes: string[];
}

/** The curve a header names, from its words (null when it names none). */
export function curveStateFromHeader(text: string | null | undefined): CurveState | null {
  if (!text) return null;
  const s = text.normalize('NFC');
  if (/anti|σ\s*[*∗]|σ\s*_?\s*\{?u\b|sigma\s*[_\s-]*\{?u(?![a-z])|triplet|upper|ungerade|\bE\s*_?\s*[({]?\s*[-−–]\s*[)}]?(?![a-z])|minus/i.test(s)) return 'antibonding';
  if (/bond|σ\s*_?\s*\{?g\b|sigma\s*[_\s-]*\{?g(?![a-z])|ground|singlet|lower|gerade|\bE\s*_?\s*[({]?\s*\+\s*[)}]?(?![a-z])|plus/i.test(s)) return 'bonding';
  return null;
}

interface Column {
  key: string;
  header: string;
  label: CurveState | null;
  distance: Float64Array;
  energy: Float64Array;
}

function columnsOf(reading: MarkableReading): Column[] {
  const energies = reading.points.energies;
  let keys = Object.keys(energies);
  const described = reading.table?.columns ?? [];
  const letters = reading.choice?.energyColumns;
  if (letters && letters.length > 0) {
    const ordered = letters.map((letter) => described.find((c) => c.letter === letter)?.key).filter((k): k is string => !!k && k in energies);
    keys = [...ordered, ...keys.filter((k) => !ordered.includes(k))];
  }
  const distance = reading.points.distance;
  // one distance array for every column whose points are all usable and ascending
  let shared: Float64Array | null = null;
  return keys.map((key) => {
    const info = described.find((c) => c.key === key);
    const header = info?.header ?? key;
    const e = energies[key];
    const n = Math.min(distance.length, e.length);
    // fast path: every point usable and already ascending (what the reader hands over)
    let clean = n === distance.length;
    for (let i = 0; i < n && clean; i++) {
      const r = distance[i];
      const y = e[i];
      clean = typeof r === 'number' && typeof y === 'number' && Number.isFinite(r) && Number.isFinite(y) && r > 0 && (i === 0 || r > distance[i - 1]);
    }
    let d: Float64Array;
    let en: Float64Array;
    if (clean) {
      shared ??= Float64Array.from(distance);
      d = shared;
      en = Float64Array.from(e);
    } else {
      const pairs: [number, number][] = [];
      for (let i = 0; i < n; i++) {
        const r = distance[i];
        const y = e[i];
        if (typeof r === 'number' && typeof y === 'number' && Number.isFinite(r) && Number.isFinite(y) && r > 0) pairs.push([r, y]);
      }
      pairs.sort((a, b) => a[0] - b[0]);
      d = Float64Array.from(pairs, (p) => p[0]);
      en = Float64Array.from(pairs, (p) => p[1]);
    }
    return {
      key,
      header,
      label: info?.curve ?? curveStateFromHeader(header) ?? curveStateFromHeader(key),
      distance: d,
      energy: en,
    };
  });
}

function build(column: Column, state: CurveState, pairedBy: StudentCurve['pairedBy'], reference: CurveReference, offset: number, mode: ReferenceEvaluation): StudentCurve {
  const at = referenceEnergiesAt(reference, state, column.distance, mode);
  return {
    column: column.key,
    header: column.header,
    state,
    pairedBy,
    distanceBohr: column.distance,
    energyAsRead: column.energy,
    energyTotal: offset === 0 ? column.energy : column.energy.map((e) => e + offset),
    referenceHartree: at.energyHartree,
    inRange: at.inRange,
    offGrid: at.offGrid,
    failure: at.failure,
  };
}

function rmsDeviation(curve: StudentCurve): number {
  let sum = 0;
  let count = 0;
  for (let i = 0; i < curve.energyTotal.length; i++) {
    const d = curve.energyTotal[i] - curve.referenceHartree[i];
    if (Number.isFinite(d)) { sum += d * d; count++; }
  }
  return count > 0 ? Math.sqrt(sum / count) : Number.POSITIVE_INFINITY;
}

function permutations<T>(items: T[], k: number): T[][] {
  if (k === 0) return [[]];
  const out: T[][] = [];
  items.forEach((item, i) => {
    for (const rest of permutations([...items.slice(0, i), ...items.slice(i + 1)], k - 1)) out.push([item, ...rest]);
  });
  return out;
}

export function pairColumns(reading: MarkableReading, reference: CurveReference, mode: ReferenceEvaluation = 'exact'): Pairing {
  const offset = reading.convention === 'relative' ? reference.dissociationLimitHartree : 0;
  const states = reference.curves.map((c) => c.state);
  const columns = columnsOf(reading);
  const curves: StudentCurve[] = [];
  const notes: string[] = [];
  const taken = new Set<CurveState>();
  const unlabelled: Column[] = [];
  const unpaired: string[] = [];
  for (const column of columns) {
    if (column.label && states.includes(column.label) && !taken.has(column.label)) {
      taken.add(column.label);
      curves.push(build(column, column.label, 'header', reference, offset, mode));
    } else if (column.label && !states.includes(column.label)) {
      unpaired.push(column.key);
      notes.push(`Column "${column.header}" names the ${column.label} curve, which this exercise does not ask for; it was not marked.`);
    } else {
      unlabelled.push(column);
    }
  }
  const remaining = states.filter((s) => !taken.has(s));
  const k = Math.min(remaining.length, unlabelled.length);
  if (k > 0) {
    // candidate curves for every (column, state) pair, built once
    const candidates = new Map<string, StudentCurve>();
    const candidate = (c: Column, s: CurveState) => {
      const key = `${c.key}\u0000${s}`;
      let built = candidates.get(key);
      if (!built) { built = build(c, s, 'deviation', reference, offset, mode); candidates.set(key, built); }
      return built;
    };
    const chosenColumns = unlabelled.length <= 4 ? unlabelled : unlabelled.slice(0, remaining.length);
    let best: { columns: Column[]; cost: number } | null = null;
    const inOrder = chosenColumns.slice(0, k);
    for (const perm of permutations(chosenColumns, k)) {
      let cost = 0;
      perm.forEach((c, i) => (cost += rmsDeviation(candidate(c, remaining[i]))));
      const isOrder = perm.every((c, i) => c === inOrder[i]);
      if (!best || cost < best.cost * (1 - 1e-12) || (isOrder && cost <= best.cost * (1 + 1e-12))) best = { columns: perm, cost };
    }
    best!.columns.forEach((c, i) => {
      const chosen = candidate(c, remaining[i]);
      const isOrder = c === inOrder[i];
      chosen.pairedBy = isOrder ? 'order' : 'deviation';
      if (!isOrder) notes.push(`Column "${c.header}" was read as the ${remaining[i]} curve: it lies closest to that reference curve.`);
      curves.push(chosen);
      taken.add(remaining[i]);
    });
    for (const c of unlabelled) if (!best!.columns.includes(c)) unpaired.push(c.key);
  }
  curves.sort((a, b) => states.indexOf(a.state) - states.indexOf(b.state));
  return { curves, missing: states.filter((s) => !taken.has(s)), unpaired, notes };
}
