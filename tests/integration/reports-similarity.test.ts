/**
 * Similarity flags on planted copies: a student who hands in another's file
 * (identical numbers), one who puts another's errors on their own reference
 * (near-identical deviations), and honest students with their own noise (no
 * flags). Flags come from the job each upload queues; they never change marks;
 * staff see them, assistants only for their sections, students not at all.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SimilarityFlag, UploadResult } from '@shared/api/reports';
import { createJobWorker, getJob } from '@server/platform/jobs';
import { reportJobHandlers } from '@server/modules/reports/jobs';
import { distanceFromBohr } from '@shared/chemistry/units';
import { startAppContext, type AppContext } from '../support/app-context';
import { CookieClient } from '../support/cookie-client';
import { createPublishedExercise, curveReferenceOf, curveSpec, noiseSource, seedCourse, uploadForm, variantOf, type SeededCourse } from './reports-fixtures';

let ctx: AppContext;
let seed: SeededCourse;
let exerciseId: number;
const spec = curveSpec();
const choice = { distanceColumn: 'A', energyColumns: ['B', 'C'], distanceUnit: 'bohr', energyUnit: 'hartree' };
/** enrolment ids by name; stu1 (section A) and stu2 (section B) come from seedCourse */
const students: Record<string, { enrolmentId: number; number: string }> = {};
const reportOf: Record<string, number> = {};

/** rows of a CSV: the reference energies of `number`'s variant plus `residual(i, k)` (hartree) */
function csvWith(number: string, residual: (i: number, k: number) => number): string {
  const reference = curveReferenceOf(spec, variantOf(spec, number));
  const lines = ['R / bohr,E(sigma g) / Eh,E(sigma u) / Eh'];
  reference.grid.bohr.forEach((r, i) => lines.push([distanceFromBohr(r, 'bohr').toFixed(4), ...reference.curves.map((c, k) => (c.energyHartree[i] + residual(i, k)).toFixed(8))].join(',')));
  return lines.join('\n') + '\n';
}

/** an honest student's own numbers: their reference with independent noise of 2e-4 Eh */
const honestNoise = (seedValue: number) => {
  const noise = noiseSource(seedValue);
  const values = new Map<string, number>();
  return (i: number, k: number) => {
    const key = `${i}|${k}`;
    if (!values.has(key)) values.set(key, 2e-4 * noise());
    return values.get(key)!;
  };
};

beforeAll(async () => {
  ctx = await startAppContext();
  const k = ctx.db.knex;
  seed = await seedCourse(k, ctx.issuer);
  ({ exerciseId } = await createPublishedExercise(k, seed.courseId, seed.users.lec1, spec));
  students.stu1 = { enrolmentId: seed.enrolments.stu1, number: seed.studentNumbers.stu1 };
  students.stu2 = { enrolmentId: seed.enrolments.stu2, number: seed.studentNumbers.stu2 };
  // three more students in section B; stu3 is given a student number whose variant differs from stu1's
  const stu1Variant = variantOf(spec, seed.studentNumbers.stu1).key;
  const otherVariantNumber = Array.from({ length: 50 }, (_, i) => `26000${String(i).padStart(2, '0')}`).find((n) => variantOf(spec, n).key !== stu1Variant)!;
  const numbers = { stu3: otherVariantNumber, stu4: '2700001', stu5: '2700002' };
  for (const [name, number] of Object.entries(numbers)) {
    const [userId] = await k('users').insert({ oidc_issuer: ctx.issuer, oidc_subject: `${name}-x`, email: `${name}@test.example`, display_name: `Student ${name}` });
    const [enrolmentId] = await k('enrolments').insert({ course_id: seed.courseId, user_id: userId, student_number: number, section_id: seed.sectionB });
    students[name] = { enrolmentId, number };
  }
});

afterAll(async () => {
  await ctx?.close();
});

async function upload(name: string, csv: string) {
  const lec = await ctx.signIn('lec1');
  const token = await ctx.csrf(lec);
  const r = await lec.json<UploadResult>(`${ctx.baseUrl}/api/v1/exercises/${exerciseId}/reports?enrolmentId=${students[name].enrolmentId}`, {
    method: 'POST',
    headers: { 'x-csrf-token': token },
    body: uploadForm({ name: `${name}.csv`, bytes: csv }, { choice }),
  });
  expect(r.status).toBe(201);
  reportOf[name] = r.body.report.id;
  return r.body;
}

async function flagsAs(login: string) {
  const client = await ctx.signIn(login);
  return client.json<{ flags: SimilarityFlag[] }>(`${ctx.baseUrl}/api/v1/exercises/${exerciseId}/similarity-flags`);
}

describe('similarity flags', () => {
  it('flags a copied file and copied errors, and none among honest noisy reports', async () => {
    const stu1Residual = honestNoise(11);
    const stu1Csv = csvWith(students.stu1.number, stu1Residual);
    await upload('stu1', stu1Csv);
    await upload('stu2', stu1Csv); // the same file handed in by another student
    const last = await upload('stu3', csvWith(students.stu3.number, stu1Residual)); // stu1's errors on stu3's own reference
    await upload('stu4', csvWith(students.stu4.number, honestNoise(44)));
    await upload('stu5', csvWith(students.stu5.number, honestNoise(55)));

    // the uploads queued one similarity job for the exercise; nothing is flagged before it runs
    expect(await ctx.db.knex('jobs').where({ kind: 'similarity-exercise', state: 'queued' })).toHaveLength(1);
    expect(await ctx.db.knex('similarity_flags').count({ n: '*' }).first()).toMatchObject({ n: 0 });
    const marksBefore = await ctx.db.knex('marks').orderBy('id').select('id', 'report_id', 'total');

    const worker = createJobWorker({ db: ctx.db.knex, handlers: reportJobHandlers() });
    await worker.drain();
    expect(await getJob(ctx.db.knex, last.similarityJobId!)).toMatchObject({ state: 'done' });

    const r = await flagsAs('lec1');
    expect(r.status).toBe(200);
    const pairs = r.body.flags.map((f) => [f.kind, [f.report.displayName, f.other.displayName].sort().join(' & ')]);
    expect(pairs).toEqual(
      expect.arrayContaining([
        ['identical-numbers', 'Sam Student & Stella Student'],
        ['near-identical-deviations', 'Stella Student & Student stu3'],
      ]),
    );
    expect(r.body.flags).toHaveLength(2);
    const identical = r.body.flags.find((f) => f.kind === 'identical-numbers')!;
    expect(identical.score).toBeCloseTo(1, 6);
    expect(identical.detail.length).toBeGreaterThan(10);
    const involved = new Set(r.body.flags.flatMap((f) => [f.report.enrolmentId, f.other.enrolmentId]));
    expect(involved.has(students.stu4.enrolmentId) || involved.has(students.stu5.enrolmentId)).toBe(false);

    // flags never change marks
    expect(await ctx.db.knex('marks').orderBy('id').select('id', 'report_id', 'total')).toEqual(marksBefore);
  });

  it('running again adds no duplicate flags', async () => {
    await upload('stu4', csvWith(students.stu4.number, honestNoise(45))); // a new honest version queues a new run
    const worker = createJobWorker({ db: ctx.db.knex, handlers: reportJobHandlers() });
    await worker.drain();
    expect((await flagsAs('lec1')).body.flags).toHaveLength(2);
    expect(await ctx.db.knex('similarity_flags').count({ n: '*' }).first()).toMatchObject({ n: 2 });
  });

  it('assistants see the flags of their sections; students and other courses see none', async () => {
    // ta1 assists section A, where only stu1 is: both flags involve stu1
    const ta = await flagsAs('ta1');
    expect(ta.status).toBe(200);
    expect(ta.body.flags).toHaveLength(2);
    // a flag between two section-B students only is hidden from ta1
    await ctx.db.knex('similarity_flags').insert({ exercise_id: exerciseId, report_id: reportOf.stu4, other_report_id: reportOf.stu5, kind: 'identical-numbers', score: 0.5, detail: 'planted for the scope test' });
    expect((await flagsAs('ta1')).body.flags).toHaveLength(2);
    expect((await flagsAs('lec1')).body.flags).toHaveLength(3);
    expect((await flagsAs('stu1')).status).toBe(403);
    expect((await flagsAs('lec2')).status).toBe(403);
    expect((await new CookieClient().json(`${ctx.baseUrl}/api/v1/exercises/${exerciseId}/similarity-flags`)).status).toBe(401);
  });
});
