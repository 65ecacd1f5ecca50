/**
 * Automatic marking of one report: the exercise revision's spec and the
 * student's variant give the Reference (computed once per revision and
 * variant and kept in a small in-process cache — it is a pure function of
 * both, so a second server simply computes its own); the reading and the
 * template's answers are scored by shared/marking/score.
 */
import type { ExerciseSpec } from '@shared/exercises/spec';
import { computeReference, ENGINE_VERSION, type Reference } from '@shared/exercises/reference';
import type { Variant } from '@shared/exercises/variants';
import { zonedWallTimeToInstant } from '@shared/exercises/late';
import { markReport, type MarkResult, type MarkableReading, type ReportAnswers } from '@shared/marking/score';

const CACHE_LIMIT = 256;
const references = new Map<string, Reference>();

/** The isotopes a wavenumber check names, else the engine's default. */
function isotopesOf(spec: ExerciseSpec): [string, string] | undefined {
  for (const c of spec.scheme.checks) {
    if (c.kind === 'vibrational-wavenumber' && 'isotopes' in c && c.isotopes) return c.isotopes as [string, string];
  }
  return undefined;
}

/** The Reference of a variant under a revision (cached by revision, variant and engine version). */
export function referenceFor(revisionId: number, spec: ExerciseSpec, variant: Variant): Reference {
  const isotopes = isotopesOf(spec);
  const key = `${revisionId}|${ENGINE_VERSION}|${variant.key}|${isotopes?.join('-') ?? ''}`;
  const hit = references.get(key);
  if (hit) {
    // keep recently used entries at the end (Map keeps insertion order)
    references.delete(key);
    references.set(key, hit);
    return hit;
  }
  const reference = computeReference(spec.model, variant, isotopes ? { isotopes } : {});
  references.set(key, reference);
  if (references.size > CACHE_LIMIT) references.delete(references.keys().next().value!);
  return reference;
}

const dueMoments = new Map<string, number>();

/** The due instant of a spec (wall-clock time in its zone), remembered: Intl time-zone lookups are slow. */
export function dueAtOf(spec: Pick<ExerciseSpec, 'dueLocal' | 'timeZone'>): Date {
  const key = `${spec.dueLocal}|${spec.timeZone}`;
  let ms = dueMoments.get(key);
  if (ms === undefined) {
    ms = zonedWallTimeToInstant(spec.dueLocal, spec.timeZone).getTime();
    if (dueMoments.size > 1000) dueMoments.clear();
    dueMoments.set(key, ms);
  }
  return new Date(ms);
}

export interface MarkInputs {
  revisionId: number;
  spec: ExerciseSpec;
  variant: Variant;
  reading: MarkableReading | null;
  answers?: ReportAnswers | null;
  submittedAt: Date;
  extensionMinutes: number;
}

export function markWithReference(input: MarkInputs): MarkResult {
  const reference = referenceFor(input.revisionId, input.spec, input.variant);
  return markReport({
    spec: input.spec,
    reference,
    reading: input.reading,
    answers: input.answers ?? null,
    submittedAt: input.submittedAt,
    dueAt: dueAtOf(input.spec),
    extensionMinutes: input.extensionMinutes,
  });
}

/** What a marks row keeps of each check (checks_json). */
export function storedChecks(result: MarkResult) {
  return result.checks.map((c) => ({
    id: c.id,
    kind: c.kind,
    label: c.label,
    points: c.points,
    max: c.max,
    message: c.message,
    expected: c.expected,
    found: c.found,
    unit: c.unit,
    deviation: c.deviation,
    evaluated: c.evaluated,
  }));
}
