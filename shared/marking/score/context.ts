/**
 * What the checks of one report share: the reference, the reading, the answers, and — computed once
 * on first use — the pairing of the student's columns with the reference curves and the curve
 * analysis of each paired column.
 */
import { analyseCurve, classifyCurve, prepareCurve, reducedMassMe, type CurveAnalysis, type CurveKind } from '@shared/chemistry/analysis';
import type { CurveState } from '@shared/chemistry/curves';
import type { CurveReference, Reference } from '@shared/exercises/reference';
import type { Check } from '@shared/exercises/spec';
import { memoize } from './reference-values';
import { pairColumns, type Pairing, type StudentCurve } from './student-curves';
import type { CheckResult, MarkableReading, ReferenceEvaluation, ReportAnswers } from './types';
import { formatPoints } from './format';
import { roundPoints } from './credit';

export interface StudentAnalysis {
  analysis: CurveAnalysis | null;
  /** why the curve could not be analysed */
  error: string | null;
}

export class MarkContext {
  private pairingValue: Pairing | null | undefined;
  private analyses = new Map<CurveState, StudentAnalysis>();

  constructor(
    readonly reference: Reference,
    readonly reading: MarkableReading | null,
    readonly answers: ReportAnswers,
    readonly mode: ReferenceEvaluation,
  ) {}

  get curveReference(): CurveReference | null {
    return this.reference.kind === 'curve' ? this.reference : null;
  }

  /** null for non-curve references or without a reading */
  pairing(): Pairing | null {
    if (this.pairingValue !== undefined) return this.pairingValue;
    const reference = this.curveReference;
    this.pairingValue = reference && this.reading ? pairColumns(this.reading, reference, this.mode) : null;
    return this.pairingValue;
  }

  curveFor(state: CurveState): StudentCurve | null {
    return this.pairing()?.curves.find((c) => c.state === state) ?? null;
  }

  /** The state whose minimum the reference describes (bonding when present). */
  primaryState(): CurveState | null {
    const reference = this.curveReference;
    if (!reference || reference.curves.length === 0) return null;
    return reference.curves.some((c) => c.state === 'bonding') ? 'bonding' : reference.curves[0].state;
  }

  /** Analysis of the student's column for `state`: against the model's limit (total energies) or the column's own tail (relative). */
  analysis(state: CurveState): StudentAnalysis {
    const cached = this.analyses.get(state);
    if (cached) return cached;
    const reference = this.curveReference;
    const curve = this.curveFor(state);
    let value: StudentAnalysis;
    if (!reference || !curve) {
      value = { analysis: null, error: `no ${state} column` };
    } else {
      try {
        const analysis = analyseCurve(
          prepareCurve({ distanceBohr: curve.distanceBohr, energyHartree: curve.energyAsRead }),
          {
            limitHartree: this.reading?.convention === 'relative' ? undefined : reference.dissociationLimitHartree,
            reducedMassMe: referenceReducedMassMe(reference, reference.isotopes),
          },
        );
        value = { analysis, error: null };
      } catch (error) {
        value = { analysis: null, error: error instanceof Error ? error.message : String(error) };
      }
    }
    this.analyses.set(state, value);
    return value;
  }

  answerFor(check: Check): string | number | null {
    const value = this.answers[check.id] ?? this.answers[check.kind];
    if (value === undefined || value === null) return null;
    if (typeof value === 'string' && value.trim() === '') return null;
    return value;
  }
}

/** One-electron systems are bare nuclei (nuclear masses); H2 has its electrons (atomic masses) — as in reference.ts. */
export function referenceReducedMassMe(reference: CurveReference, isotopes: readonly [string, string]): number {
  const nuclear = reference.model === 'lcao' || reference.model === 'exact';
  return reducedMassMe(isotopes, { masses: nuclear ? 'nuclear' : 'atomic' });
}

/** How the reference's own curve of `state` looks on its grid (bound / repulsive / unclear), kept per reference. */
export function referenceCurveKind(reference: CurveReference, state: CurveState): CurveKind | null {
  return memoize(reference, `kind:${state}`, () => {
    const c = reference.curves.find((x) => x.state === state);
    if (!c) return null;
    try {
      const classification = classifyCurve({ distanceBohr: reference.grid.bohr, energyHartree: c.energyHartree });
      return classification.kind === 'bound' && classification.monotonicDecreasing ? 'repulsive' : classification.kind;
    } catch {
      return null;
    }
  });
}

export interface Outcome {
  fraction: number;
  /** the sentence before ": x of y points." */
  text: string;
  expected: number | string | null;
  found: number | string | null;
  unit: string | null;
  deviation: number | null;
  evaluated: boolean;
}

export function checkResult(check: Check, outcome: Outcome): CheckResult {
  const max = check.weight;
  const points = roundPoints(Math.max(0, Math.min(1, outcome.fraction)) * max);
  return {
    id: check.id,
    kind: check.kind,
    label: check.label,
    points,
    max,
    message: `${outcome.text}: ${formatPoints(points, max)}.`,
    expected: outcome.expected,
    found: outcome.found,
    unit: outcome.unit,
    deviation: outcome.deviation,
    evaluated: outcome.evaluated,
  };
}

/** A zero outcome for a check that could not be evaluated. */
export function notEvaluated(text: string, expected: number | string | null = null, unit: string | null = null): Outcome {
  return { fraction: 0, text, expected, found: null, unit, deviation: null, evaluated: false };
}
