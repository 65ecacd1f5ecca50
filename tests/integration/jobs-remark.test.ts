/**
 * Re-marking after a published exercise is edited: the exercises module
 * queues 'remark-exercise'; a worker claims it and dies half-way; another
 * worker takes the job over when the lease has run out and finishes it,
 * marking every report once for the new revision; adjustments are kept;
 * progress is readable by the course's staff.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { JobProgress, ReportDetail, UploadResult } from '@shared/api/reports';
import type { ExerciseSpec } from '@shared/exercises/spec';
import { claimJob, createJobWorker, getJob } from '@server/platform/jobs';
import { remarkReport, reportJobHandlers } from '@server/modules/reports/jobs';
import { startAppContext, type AppContext } from '../support/app-context';
import { CookieClient } from '../support/cookie-client';
import { createPublishedExercise, curveReferenceOf, curveSpec, referenceCsv, seedCourse, uploadForm, variantOf, type SeededCourse } from './reports-fixtures';

let ctx: AppContext;
let seed: SeededCourse;
let exerciseId: number;
let firstRevisionId: number;
const spec = curveSpec();
const choice = { distanceColumn: 'A', energyColumns: ['B', 'C'], distanceUnit: 'bohr', energyUnit: 'hartree' };
const reportIds: number[] = [];

beforeAll(async () => {
  ctx = await startAppContext();
  seed = await seedCourse(ctx.db.knex, ctx.issuer);
  ({ exerciseId, revisionId: firstRevisionId } = await createPublishedExercise(ctx.db.knex, seed.courseId, seed.users.lec1, spec));
  const lec = await ctx.signIn('lec1');
  const token = await ctx.csrf(lec);
  // 12 reports: six versions each of two students, with different noise
  for (let v = 0; v < 6; v++) {
    for (const who of ['stu1', 'stu2'] as const) {
      const csv = referenceCsv(curveReferenceOf(spec, variantOf(spec, seed.studentNumbers[who])), { noiseHartree: v * 5e-4, seed: v + 1 });
      const r = await lec.json<UploadResult>(`${ctx.baseUrl}/api/v1/exercises/${exerciseId}/reports?enrolmentId=${seed.enrolments[who]}`, {
        method: 'POST',
        headers: { 'x-csrf-token': token },
        body: uploadForm({ name: `${who}-v${v + 1}.csv`, bytes: csv }, { choice }),
      });
      expect(r.status).toBe(201);
      reportIds.push(r.body.report.id);
    }
  }
});

/** a worker for re-marking only (the uploads also queued a similarity job, not under test here) */
const remarkOnly = () => ({ 'remark-exercise': reportJobHandlers()['remark-exercise'] });

afterAll(async () => {
  await ctx?.close();
});

async function marksFor(revisionId: number) {
  return ctx.db.knex('marks').where({ revision_id: revisionId }).orderBy('id').select('id', 'report_id', 'max_points', 'points');
}

describe('re-marking job', () => {
  let jobId: number;
  let secondRevisionId: number;
  let spec2: ExerciseSpec;

  it('editing the published exercise with re-marking queues the job (exercises module)', async () => {
    // a scheme change: every weight doubled, so the new marks are out of 24 instead of 12
    spec2 = { ...spec, scheme: { checks: spec.scheme.checks.map((c) => ({ ...c, weight: c.weight * 2 })) } } as ExerciseSpec;
    const lec = await ctx.signIn('lec1');
    const token = await ctx.csrf(lec);
    const r = await lec.json<{ remarkJobId: number }>(`${ctx.baseUrl}/api/v1/exercises/${exerciseId}`, {
      method: 'PUT',
      headers: { 'content-type': 'application/json', 'x-csrf-token': token },
      body: JSON.stringify({ ...spec2, remark: true }),
    });
    expect(r.status).toBe(200);
    jobId = r.body.remarkJobId;
    secondRevisionId = (await ctx.db.knex('exercises').where({ id: exerciseId }).first()).current_revision_id;
    expect(secondRevisionId).not.toBe(firstRevisionId);
    expect(await getJob(ctx.db.knex, jobId)).toMatchObject({ kind: 'remark-exercise', state: 'queued', payload: { exerciseId, revisionId: secondRevisionId } });
  });

  it('an adjustment made before the re-marking is kept and shown beside the new mark', async () => {
    await ctx.db.knex('adjustments').insert({ report_id: reportIds[0], check_id: 'de', points: 1.5, reason: 'Well depth read from the wrong column; checked by hand.', adjusted_by: seed.users.ta1 });
  });

  it('survives a killed worker: another worker takes the job over and no report is marked twice for the revision', async () => {
    // worker A claims the job, marks five reports, and dies (its lease then runs out)
    const claimed = await claimJob(ctx.db.knex, ['remark-exercise'], 'worker-a', 60_000);
    expect(claimed?.id).toBe(jobId);
    const firstFive = reportIds.slice(0, 5);
    for (const id of firstFive) expect(await remarkReport(ctx.db.knex, id, secondRevisionId, spec2)).toBe(true);
    await ctx.db.knex('jobs').where({ id: jobId }).update({ progress_done: 5, progress_total: 12 });
    const markedByA = await marksFor(secondRevisionId);
    expect(markedByA.map((m) => m.report_id)).toEqual(firstFive);

    // while A's lease holds, nobody else takes the job
    const workerB = createJobWorker({ db: ctx.db.knex, workerId: 'worker-b', handlers: remarkOnly() });
    expect(await workerB.runOnce()).toBe('idle');
    const during = await ctx.signIn('lec1');
    const progress = await during.json<JobProgress>(`${ctx.baseUrl}/api/v1/jobs/${jobId}`);
    expect(progress.body).toMatchObject({ state: 'running', done: 5, total: 12 });

    // A is dead: its lease expires
    await ctx.db.knex('jobs').where({ id: jobId }).update({ lease_until: ctx.db.knex.raw('CURRENT_TIMESTAMP(3) - INTERVAL 1 SECOND') });
    expect(await workerB.runOnce()).toBe('done');

    const job = await getJob(ctx.db.knex, jobId);
    expect(job).toMatchObject({ state: 'done', claimedBy: 'worker-b', attempts: 2, progressDone: 12, progressTotal: 12, error: null });
    const marks = await marksFor(secondRevisionId);
    expect(marks).toHaveLength(12);
    expect(new Set(marks.map((m) => m.report_id))).toEqual(new Set(reportIds));
    // A's five marks are the ones that stay: B did not redo them
    expect(marks.slice(0, 5)).toEqual(markedByA);
    expect(marks.every((m) => Number(m.max_points) === 24)).toBe(true);
    // the first revision's marks are history, still there
    expect(await marksFor(firstRevisionId)).toHaveLength(12);
  });

  it('marking the same report for the same revision twice at once adds one mark', async () => {
    // already marked for revision 2: nothing to do
    expect(await remarkReport(ctx.db.knex, reportIds[3], secondRevisionId, spec2)).toBe(false);
    // two markers racing on one report for a further revision (not made current, so the rest is unaffected)
    const [thirdRevisionId] = await ctx.db.knex('exercise_revisions').insert({ exercise_id: exerciseId, revision_no: 3, spec_json: JSON.stringify(spec2), engine_version: 'test', created_by: seed.users.lec1, published_at: new Date() });
    const results = await Promise.all([remarkReport(ctx.db.knex, reportIds[3], thirdRevisionId, spec2), remarkReport(ctx.db.knex, reportIds[3], thirdRevisionId, spec2)]);
    expect(results.sort()).toEqual([false, true]);
    expect(await marksFor(thirdRevisionId)).toHaveLength(1);
  });

  it('the report shows the new automatic mark with the adjustment beside it', async () => {
    const lec = await ctx.signIn('lec1');
    const detail = await lec.json<ReportDetail>(`${ctx.baseUrl}/api/v1/reports/${reportIds[0]}`);
    const mark = detail.body.report.mark!;
    expect(mark.revisionId).toBe(secondRevisionId);
    expect(mark.revisionNo).toBe(2);
    expect(mark.max).toBe(24);
    expect(mark.adjustments).toEqual([expect.objectContaining({ checkId: 'de', points: 1.5, reason: expect.stringContaining('wrong column') })]);
    const de = mark.checks.find((c) => c.id === 'de')!;
    expect(mark.adjustedPoints).toBeCloseTo(mark.points - de.points + 1.5, 2);
  });

  it('job progress: staff of the course only', async () => {
    const ta = await ctx.signIn('ta1');
    const ok = await ta.json<JobProgress>(`${ctx.baseUrl}/api/v1/jobs/${jobId}`);
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ id: jobId, kind: 'remark-exercise', state: 'done', done: 12, total: 12 });
    expect((await (await ctx.signIn('stu1')).json(`${ctx.baseUrl}/api/v1/jobs/${jobId}`)).status).toBe(403);
    expect((await (await ctx.signIn('lec2')).json(`${ctx.baseUrl}/api/v1/jobs/${jobId}`)).status).toBe(403);
    expect((await new CookieClient().json(`${ctx.baseUrl}/api/v1/jobs/${jobId}`)).status).toBe(401);
    expect((await ta.json(`${ctx.baseUrl}/api/v1/jobs/999999`)).status).toBe(404);
  });

  it('a job for a revision that is no longer current stops without marking', async () => {
    const [staleJob] = await ctx.db.knex('jobs').insert({ kind: 'remark-exercise', payload_json: JSON.stringify({ exerciseId, revisionId: firstRevisionId }) });
    const worker = createJobWorker({ db: ctx.db.knex, handlers: remarkOnly() });
    const before = await ctx.db.knex('marks').count({ n: '*' }).first();
    expect(await worker.runOnce()).toBe('done');
    expect(await ctx.db.knex('marks').count({ n: '*' }).first()).toEqual(before);
    expect(await getJob(ctx.db.knex, Number(staleJob))).toMatchObject({ state: 'done' });
  });
});
