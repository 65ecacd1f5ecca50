/**
 * The re-marking job ('remark-exercise'): when a published exercise is edited
 * with re-marking, the exercises module enqueues
 *   enqueue(trx, 'remark-exercise', { exerciseId, revisionId, courseId }, reportCount)
 * and a worker re-marks every report of the exercise against that revision
 * (new marks rows; adjustments stay in their own table and are shown beside
 * the new automatic mark).
 *
 * Resumable: each batch takes only reports whose newest mark is not for the
 * job's revision, so a job taken over from a dead worker continues where it
 * stopped; each report is marked in its own transaction that locks the report
 * row and checks again, so no report is marked twice for one revision even
 * when two workers overlap.
 */
import type { Knex } from 'knex';
import { exerciseSpecSchema, type ExerciseSpec } from '@shared/exercises/spec';
import type { Variant } from '@shared/exercises/variants';
import { enqueue, type JobContext, type JobHandler } from '../../platform/jobs';
import { ensureVariant } from '../exercises/variants';
import { SIMILARITY_JOB, similarityJob } from '../similarity/jobs';
import { markWithReference, storedChecks } from './marking';
import {
  countReports,
  countReportsNeedingMark,
  extensionMinutes,
  findRevision,
  findVariantById,
  insertMark,
  lockReportMarkRevision,
  parseJson,
  reportsNeedingMark,
} from './repo';
import { markableOf, type StoredReading } from './service';

export const REMARK_JOB = 'remark-exercise';

export interface RemarkPayload {
  exerciseId: number;
  revisionId: number;
  courseId: number;
}

/** Queues the re-marking of an exercise against `revisionId` in the caller's transaction; returns the job id. */
export async function enqueueRemark(trx: Knex | Knex.Transaction, payload: RemarkPayload): Promise<number> {
  const total = await countReports(trx, payload.exerciseId);
  return enqueue(trx, REMARK_JOB, { ...payload }, total);
}

const BATCH = 25;

/** Marks one report against the revision unless its newest mark already is for it; true when a mark was added. */
export async function remarkReport(db: Knex, reportId: number, revisionId: number, spec: ExerciseSpec): Promise<boolean> {
  return db.transaction(async (trx) => {
    const latest = await lockReportMarkRevision(trx, reportId);
    if (latest === revisionId) return false;
    const report = await trx('reports').where({ id: reportId }).first('id', 'exercise_id', 'enrolment_id', 'variant_id', 'reading_json', 'uploaded_at');
    const stored = parseJson<StoredReading>(report.reading_json);
    let variant = parseJson<Variant>((await findVariantById(trx, report.variant_id))!.variant_json);
    if (variant.family !== spec.model.family) {
      // the exercise changed model family: the report is marked against the student's variant of the new revision
      const exercise = await trx('exercises').where({ id: report.exercise_id }).first('id', 'course_id');
      variant = (await ensureVariant(trx, exercise, revisionId, report.enrolment_id)).variant;
    }
    const mark = markWithReference({
      revisionId,
      spec,
      variant,
      reading: markableOf(stored),
      answers: stored.answers,
      submittedAt: new Date(report.uploaded_at),
      extensionMinutes: await extensionMinutes(trx, report.exercise_id, report.enrolment_id),
    });
    await insertMark(trx, {
      reportId,
      revisionId,
      engineVersion: mark.engineVersion,
      points: mark.points,
      max: mark.max,
      latePenaltyPercent: mark.latePenaltyPercent,
      total: mark.total,
      checks: storedChecks(mark),
    });
    return true;
  });
}

export async function remarkExercise(ctx: JobContext): Promise<void> {
  const { exerciseId, revisionId } = ctx.payload as unknown as RemarkPayload;
  const revision = await findRevision(ctx.db, revisionId);
  if (!revision || revision.exercise_id !== exerciseId) throw new Error(`revision ${revisionId} is not a revision of exercise ${exerciseId}`);
  const spec = exerciseSpecSchema.parse(parseJson(revision.spec_json));
  /** a newer revision has its own job: this one has nothing left to do */
  const superseded = async () => (await ctx.db('exercises').where({ id: exerciseId }).first('current_revision_id'))?.current_revision_id !== revisionId;
  const total = await countReports(ctx.db, exerciseId);
  let remaining = await countReportsNeedingMark(ctx.db, exerciseId, revisionId);
  await ctx.progress(total - remaining, total);
  for (;;) {
    if (ctx.stopping()) return;
    if (await superseded()) break;
    const batch = await reportsNeedingMark(ctx.db, exerciseId, revisionId, BATCH);
    if (batch.length === 0) break;
    for (const { id } of batch) await remarkReport(ctx.db, id, revisionId, spec);
    remaining = Math.max(0, remaining - batch.length);
    await ctx.progress(total - remaining, total);
  }
  await ctx.progress(total, total);
}

/** Every job kind of reports and similarity, for a worker (scripts/start.ts starts one in-process). */
export function reportJobHandlers(): Record<string, JobHandler> {
  return { [REMARK_JOB]: remarkExercise, [SIMILARITY_JOB]: similarityJob };
}
