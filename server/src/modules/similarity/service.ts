/**
 * Similarity over an exercise: the newest version of each student's report is
 * compared with every other student's (shared/marking/similarity) and new flags
 * are stored, unique per pair and kind. A flag goes to a person; it never
 * changes a mark.
 *
 * Each report's curve and its deviations from its own reference come from the
 * marking (markReport(...).curve) against the exercise's current revision and
 * the report's own variant, recomputed here from the stored reading (references
 * are cached per variant, so this costs about a millisecond a report).
 */
import type { Knex } from 'knex';
import { exerciseSpecSchema } from '@shared/exercises/spec';
import type { Variant } from '@shared/exercises/variants';
import { findSimilarReports, type SimilarityReport } from '@shared/marking/similarity';
import { markWithReference } from '../reports/marking';
import { findExerciseWithRevision, findVariantById, latestReportsOfExercise, parseJson } from '../reports/repo';
import { markableOf, type StoredReading } from '../reports/service';
import { insertNewFlags } from './repo';

const curveFamilies = new Set(['one-electron', 'two-electron']);

export interface SimilarityRun {
  compared: number;
  flagsFound: number;
  flagsAdded: number;
}

export async function runSimilarity(db: Knex, exerciseId: number, onProgress?: (done: number, total: number) => Promise<void>): Promise<SimilarityRun> {
  const exercise = await findExerciseWithRevision(db, exerciseId);
  if (!exercise || exercise.revision_id === null) return { compared: 0, flagsFound: 0, flagsAdded: 0 };
  const spec = exerciseSpecSchema.parse(parseJson(exercise.spec_json));
  // answers-only exercises: equal answers are what correct reports have in common
  if (!curveFamilies.has(spec.model.family)) return { compared: 0, flagsFound: 0, flagsAdded: 0 };
  const rows = await latestReportsOfExercise(db, exerciseId);
  const variants = new Map<number, Variant>();
  const inputs: SimilarityReport[] = [];
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i];
    let variant = variants.get(row.variant_id);
    if (!variant) {
      variant = parseJson<Variant>((await findVariantById(db, row.variant_id))!.variant_json);
      variants.set(row.variant_id, variant);
    }
    const stored = parseJson<StoredReading>(row.reading_json);
    const reading = markableOf(stored);
    if (!reading || variant.family !== spec.model.family) continue;
    const mark = markWithReference({ revisionId: exercise.revision_id, spec, variant, reading, answers: null, submittedAt: new Date(row.uploaded_at), extensionMinutes: 0 });
    if (!mark.curve) continue;
    inputs.push({
      reportId: row.id,
      studentKey: String(row.enrolment_id),
      distanceBohr: mark.curve.distanceBohr,
      energyHartree: mark.curve.energyHartree,
      deviationsFromReference: mark.curve.deviationHartree,
    });
    if (onProgress && i % 50 === 49) await onProgress(i + 1, rows.length + 1);
  }
  const flags = findSimilarReports(inputs);
  const flagsAdded = await db.transaction((trx) =>
    insertNewFlags(
      trx,
      flags.map((f) => ({ exerciseId, reportId: Number(f.reportId), otherReportId: Number(f.otherReportId), kind: f.kind, score: f.score, detail: f.detail })),
    ),
  );
  return { compared: inputs.length, flagsFound: flags.length, flagsAdded };
}
