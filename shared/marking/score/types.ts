/**
 * Shapes of the scoring: what markReport takes (a reading of the student's data file, typed
 * answers, the exercise's scheme and late rule, the variant's Reference) and what it returns.
 */
import type { DistanceUnit, EnergyUnit } from '@shared/chemistry/units';
import type { CheckKind, LatePolicy, MarkingScheme } from '@shared/exercises/spec';
import type { Reference } from '@shared/exercises/reference';
import type { LateOutcome } from '@shared/exercises/late';

/**
 * The part of the report reader's success result that scoring uses. `readReport`'s
 * `ReadSuccess` fits it as it is; tests and the command line may build one by hand.
 */
export interface MarkableReading {
  points: {
    /** distances in bohr */
    distance: ArrayLike<number>;
    /** energies in hartree, one array per column key, aligned with `distance` */
    energies: Record<string, ArrayLike<number>>;
  };
  /** the units the file was written in (messages speak in these) */
  units: { distance: DistanceUnit; energy: EnergyUnit };
  /** 'relative': energies measured from the dissociation limit (the limit is added back) */
  convention: 'total' | 'relative';
  /** column descriptions: the header words name the curve (bonding / antibonding) */
  table?: {
    columns: readonly {
      key: string;
      letter?: string;
      header?: string | null;
      role?: string;
      curve?: 'bonding' | 'antibonding' | null;
    }[];
  };
  /** energy columns in the order the reader chose them (letters) */
  choice?: { energyColumns?: readonly string[] };
}

/** Typed answers by check id or check kind ("term-symbol": "3Σg-"). */
export type ReportAnswers = Record<string, string | number | null | undefined>;

/** How the reference is evaluated at student distances that are not on the exercise's grid. */
export type ReferenceEvaluation = 'exact' | 'interpolate';

export interface MarkReportInput {
  /** the exercise's spec, or just its marking scheme and late rule */
  spec: { scheme: MarkingScheme; late?: LatePolicy };
  /** the variant's Reference (computeReference); reuse one object for many reports (its analysis is cached) */
  reference: Reference;
  /** the reader's result for the data file; null/absent when the report has answers only */
  reading?: MarkableReading | null;
  answers?: ReportAnswers | null;
  submittedAt?: Date;
  dueAt?: Date;
  extensionMinutes?: number;
  /**
   * 'exact' (default): student distances off the reference grid are computed with the model itself
   * (shared/chemistry/curves); 'interpolate': cubic interpolation of the reference grid (no model
   * evaluation at all; error ≈ h⁴·E''''/43 for a grid step h — see CONTEXT.md).
   */
  referenceEvaluation?: ReferenceEvaluation;
}

export interface CheckResult {
  id: string;
  kind: CheckKind;
  label: string;
  /** points given, rounded to 0.01 */
  points: number;
  /** the check's weight */
  max: number;
  /** one sentence: what was expected, what was found (in the student's units), the points */
  message: string;
  /** expected value in `unit` (a number, or text for answers); null when there is none */
  expected: number | string | null;
  /** found value in `unit`; null when nothing could be found */
  found: number | string | null;
  /** the display unit of expected/found ("Å", "eV", "cm⁻¹", "|β|"), null for unitless answers */
  unit: string | null;
  /** deviation in the check's own unit (hartree, bohr, eV, cm⁻¹, |β|), null when not numeric */
  deviation: number | null;
  /** false when the check could not be evaluated (missing column, unreadable answer, …) */
  evaluated: boolean;
}

/** What the student's curve says, for the overlay plot, the command line and the similarity flags. */
export interface CurveSummary {
  /** the reference state this column was paired with */
  state: 'bonding' | 'antibonding';
  /** the column key in the reading */
  column: string;
  /** points inside the reference grid's range, ascending R (bohr) */
  distanceBohr: number[];
  /** the student's energies as read (hartree; relative values stay relative) */
  energyHartree: number[];
  /** student total energy − reference, hartree, at the same points */
  deviationHartree: number[];
  /** RMS of deviationHartree (no shift removed), hartree; null without compared points */
  rmsdHartree: number | null;
  reBohr: number | null;
  deEv: number | null;
  harmonicWavenumberCm1: number | null;
}

export interface MarkResult {
  checks: CheckResult[];
  /** sum of the checks' points, rounded to 0.01 */
  points: number;
  /** sum of the weights */
  max: number;
  latePenaltyPercent: number;
  late: LateOutcome | null;
  /** points less the late penalty, rounded to 0.01 */
  total: number;
  /** engine version of the reference (ENGINE_VERSION) */
  engineVersion: string;
  /** version of these scoring rules (MARKING_VERSION) */
  markingVersion: string;
  /** the first curve of the reference as the student gave it (curve exercises with a reading), else null */
  curve: CurveSummary | null;
  /** all curves paired with a reference state */
  curves: CurveSummary[];
  /** notes for the marker (column pairing, skipped points) — not feedback sentences */
  notes: string[];
}
