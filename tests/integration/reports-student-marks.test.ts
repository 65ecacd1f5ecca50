/**
 * What a student sees of the automatic mark, by the exercise's
 * `automaticMarks` setting: at once by default (checks with points and
 * feedback, total, late penalty, overlay plot — no human adjustments before
 * the return), nothing before the return with 'on-return', and a spec stored
 * before the setting existed reads as 'at-once'. Staff always see the mark.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ExerciseReports, ReadPreview, ReportDetail, UploadResult } from '@shared/api/reports';
import type { ExerciseMutationResponse } from '@shared/api/exercises';
import { startAppContext, type AppContext } from '../support/app-context';
import { sessionClients } from '../support/session-clients';
import { createPublishedExercise, curveReferenceOf, curveSpec, fillTemplate, referenceCsv, seedCourse, uploadForm, variantOf, type SeededCourse } from './reports-fixtures';

let ctx: AppContext;
let seed: SeededCourse;
const atOnceSpec = curveSpec(); // the default setting
const onReturnSpec = curveSpec({ automaticMarks: 'on-return' });
let atOnceExercise: number;
let onReturnExercise: number;
let lateExercise: number;
let legacyExercise: number;

beforeAll(async () => {
  ctx = await startAppContext();
  seed = await seedCourse(ctx.db.knex, ctx.issuer);
  const k = ctx.db.knex;
  ({ exerciseId: atOnceExercise } = await createPublishedExercise(k, seed.courseId, seed.users.lec1, atOnceSpec));
  ({ exerciseId: onReturnExercise } = await createPublishedExercise(k, seed.courseId, seed.users.lec1, onReturnSpec));
  // due 2026-03-02 17:00 London, 10 % per started day, capped at 50 % (the fixture's late rule)
  ({ exerciseId: lateExercise } = await createPublishedExercise(k, seed.courseId, seed.users.lec1, curveSpec({ dueLocal: '2026-03-02T17:00' })));
  // a revision stored before the setting existed: its spec JSON has no automaticMarks key
  const { exerciseId, revisionId } = await createPublishedExercise(k, seed.courseId, seed.users.lec1, atOnceSpec);
  legacyExercise = exerciseId;
  const { automaticMarks: _dropped, ...legacySpec } = atOnceSpec;
  await k('exercise_revisions').where({ id: revisionId }).update({ spec_json: JSON.stringify(legacySpec) });
});

afterAll(async () => {
  await ctx?.close();
});

const { as, post, get } = sessionClients(() => ctx);

const stu1Reference = (spec = atOnceSpec) => curveReferenceOf(spec, variantOf(spec, seed.studentNumbers.stu1));
const bohrHartree = { distanceColumn: 'A', energyColumns: ['B', 'C'], distanceUnit: 'bohr', energyUnit: 'hartree' };

/** Reads the file back, then uploads it with the choice that was read (what the upload page does on "Confirm"). */
async function readAndUpload(login: string, exerciseId: number, name: string, bytes: Buffer | string) {
  const preview = await post<ReadPreview>(login, `/exercises/${exerciseId}/reports/read`, uploadForm({ name, bytes }));
  expect(preview.status).toBe(200);
  const choice = { ...preview.body.choice, distanceUnit: preview.body.units!.distance, energyUnit: preview.body.units!.energy };
  const r = await post<UploadResult>(login, `/exercises/${exerciseId}/reports`, uploadForm({ name, bytes }, { choice }));
  expect(r.status).toBe(201);
  return { preview: preview.body, upload: r.body };
}

describe("automaticMarks 'at-once' (the default)", () => {
  let csvReportId: number;

  it('the spec default is at-once', () => {
    expect(atOnceSpec.automaticMarks).toBe('at-once');
  });

  it('a student uploads a filled template and a CSV in Å and eV, and sees full marks for both', async () => {
    const { client } = await as('stu1');
    const template = await fetch(`${ctx.baseUrl}/api/v1/exercises/${atOnceExercise}/template`, { headers: { cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ') } });
    expect(template.status).toBe(200);
    const filled = await fillTemplate(Buffer.from(await template.arrayBuffer()), stu1Reference());
    const fromTemplate = await readAndUpload('stu1', atOnceExercise, 'my-template.xlsx', filled);
    expect(fromTemplate.preview.units?.distanceSource).toBe('template');
    const templateMark = fromTemplate.upload.report.mark!;
    expect(templateMark).not.toBeNull();
    // the template holds the reference energies to 10 significant figures: every check gets full points
    expect(templateMark.total).toBe(templateMark.max);
    expect(templateMark.checks.map((c) => c.id)).toEqual(['curve-rms', 're', 'de', 'antibonding-repulsive']);

    // the reference in Å and eV, units named in the header (6 decimals in Å, 8 in eV)
    const csv = referenceCsv(stu1Reference(), { distanceUnit: 'angstrom', energyUnit: 'ev' });
    const fromCsv = await readAndUpload('stu1', atOnceExercise, 'curve-angstrom-ev.csv', csv);
    expect(fromCsv.preview.units).toMatchObject({ distance: 'angstrom', energy: 'ev', distanceSource: 'header', energySource: 'header' });
    const mark = fromCsv.upload.report.mark!;
    expect(fromCsv.upload.report).toMatchObject({ versionNo: 2, state: 'submitted', onBehalf: false });
    expect(mark.total).toBe(mark.max);
    expect(mark.latePenaltyPercent).toBe(0);
    expect(mark.adjustments).toEqual([]);
    for (const c of mark.checks) {
      expect(c.points).toBe(c.max);
      expect(c.message.length).toBeGreaterThan(20);
    }
    csvReportId = fromCsv.upload.report.id;
  });

  it('the versions list and the report detail give the student the mark and the overlay, in their units', async () => {
    const list = await get<ExerciseReports>('stu1', `/exercises/${atOnceExercise}/reports`);
    expect(list.status).toBe(200);
    expect(list.body.exercise.automaticMarks).toBe('at-once');
    expect(list.body.reports.map((r) => r.versionNo)).toEqual([2, 1]);
    expect(list.body.reports.every((r) => r.mark !== null && r.mark.total === r.mark.max)).toBe(true);

    const detail = await get<ReportDetail>('stu1', `/reports/${csvReportId}`);
    expect(detail.status).toBe(200);
    expect(detail.body.report.state).toBe('submitted');
    expect(detail.body.report.mark?.checks).toHaveLength(4);
    const overlay = detail.body.overlay!;
    expect(overlay).toMatchObject({ distanceUnit: 'angstrom', energyUnit: 'ev', convention: 'total' });
    expect(overlay.reference.map((s) => s.key)).toEqual(['bonding', 'antibonding']);
    expect(overlay.student).toHaveLength(2);
    // 0.8 bohr = 0.4233418 Å (CODATA 2018 bohr radius 0.529177210903 Å)
    expect(overlay.commonRange![0]).toBeCloseTo(0.8 * 0.529177210903, 5);
  });

  it('a human adjustment stays with the staff until the report is returned', async () => {
    await ctx.db.knex('adjustments').insert({ report_id: csvReportId, check_id: 'de', points: 1, reason: 'Well depth taken from the wrong row.', adjusted_by: seed.users.ta1 });
    const staff = await get<ReportDetail>('ta1', `/reports/${csvReportId}`);
    expect(staff.body.report.mark!.adjustments).toHaveLength(1);
    expect(staff.body.report.mark!.adjustedTotal).toBeLessThan(staff.body.report.mark!.total);

    const student = await get<ReportDetail>('stu1', `/reports/${csvReportId}`);
    const mark = student.body.report.mark!;
    expect(mark.adjustments).toEqual([]);
    expect(mark.adjustedPoints).toBe(mark.points);
    expect(mark.adjustedTotal).toBe(mark.total);

    await ctx.db.knex('reports').where({ id: csvReportId }).update({ state: 'returned', returned_at: new Date() });
    const returned = await get<ReportDetail>('stu1', `/reports/${csvReportId}`);
    expect(returned.body.report.mark!.adjustments).toEqual([expect.objectContaining({ checkId: 'de', points: 1 })]);
    expect(returned.body.report.mark!.adjustedTotal).toBe(staff.body.report.mark!.adjustedTotal);
  });

  it('a late upload shows the student the late penalty with the mark', async () => {
    const lateSpec = curveSpec({ dueLocal: '2026-03-02T17:00' });
    const csv = referenceCsv(stu1Reference(lateSpec));
    const r = await post<UploadResult>('stu1', `/exercises/${lateExercise}/reports`, uploadForm({ name: 'late.csv', bytes: csv }, { choice: bohrHartree }));
    expect(r.status).toBe(201);
    expect(r.body.report.late.late).toBe(true);
    const mark = r.body.report.mark!;
    expect(mark.latePenaltyPercent).toBe(50); // capped at 50 % (the exercise's late rule); the upload is months after the due date
    expect(mark.points).toBe(mark.max);
    expect(mark.total).toBeCloseTo(mark.max / 2, 2);
  });

  it('a spec stored before the setting existed reads as at-once: the student sees the mark', async () => {
    const stored = await ctx.db.knex('exercises as e').join('exercise_revisions as r', 'r.id', 'e.current_revision_id').where('e.id', legacyExercise).first('r.spec_json');
    expect(JSON.parse(typeof stored.spec_json === 'string' ? stored.spec_json : JSON.stringify(stored.spec_json))).not.toHaveProperty('automaticMarks');
    const r = await post<UploadResult>('stu1', `/exercises/${legacyExercise}/reports`, uploadForm({ name: 'c.csv', bytes: referenceCsv(stu1Reference()) }, { choice: bohrHartree }));
    expect(r.status).toBe(201);
    expect(r.body.report.mark?.total).toBe(r.body.report.mark?.max);
    const list = await get<ExerciseReports>('stu1', `/exercises/${legacyExercise}/reports`);
    expect(list.body.exercise.automaticMarks).toBe('at-once');
    expect(list.body.reports[0].mark).not.toBeNull();
  });
});

describe("automaticMarks 'on-return'", () => {
  let reportId: number;

  it('the student gets no mark and no overlay before the return; staff see the mark', async () => {
    const r = await post<UploadResult>('stu1', `/exercises/${onReturnExercise}/reports`, uploadForm({ name: 'c.csv', bytes: referenceCsv(stu1Reference(onReturnSpec)) }, { choice: bohrHartree }));
    expect(r.status).toBe(201);
    expect(r.body.report.mark).toBeNull();
    reportId = r.body.report.id;
    // the mark exists all the same
    expect(await ctx.db.knex('marks').where({ report_id: reportId })).toHaveLength(1);

    const list = await get<ExerciseReports>('stu1', `/exercises/${onReturnExercise}/reports`);
    expect(list.body.exercise.automaticMarks).toBe('on-return');
    expect(list.body.reports.map((v) => v.mark)).toEqual([null]);
    const detail = await get<ReportDetail>('stu1', `/reports/${reportId}`);
    expect(detail.body.report.mark).toBeNull();
    expect(detail.body.overlay).toBeNull();

    const staff = await get<ReportDetail>('ta1', `/reports/${reportId}`);
    expect(staff.body.report.mark?.total).toBe(staff.body.report.mark?.max);
    expect(staff.body.overlay).not.toBeNull();
  });

  it('once returned, the student sees the mark and the overlay', async () => {
    await ctx.db.knex('reports').where({ id: reportId }).update({ state: 'returned', returned_at: new Date() });
    const detail = await get<ReportDetail>('stu1', `/reports/${reportId}`);
    expect(detail.body.report.mark?.checks).toHaveLength(4);
    expect(detail.body.overlay?.reference).toHaveLength(2);
  });
});

describe('the lecturer changes the setting', () => {
  it('saving only automaticMarks is a change (a new revision), after which marks are held back', async () => {
    const { client, token } = await as('lec1');
    const put = (body: unknown) =>
      client.json<ExerciseMutationResponse>(`${ctx.baseUrl}/api/v1/exercises/${atOnceExercise}`, { method: 'PUT', headers: { 'content-type': 'application/json', 'x-csrf-token': token }, body: JSON.stringify(body) });
    const held = { ...atOnceSpec, automaticMarks: 'on-return' };
    // a published exercise asks for the re-marking confirmation first: the change was seen
    expect((await put(held)).status).toBe(409);
    const saved = await put({ ...held, remark: true });
    expect(saved.status).toBe(200);
    expect(saved.body.unchanged).toBeUndefined();
    expect(saved.body.exercise.spec.automaticMarks).toBe('on-return');
    expect(saved.body.remarkJobId).toEqual(expect.any(Number));

    const list = await get<ExerciseReports>('stu1', `/exercises/${atOnceExercise}/reports`);
    expect(list.body.exercise.automaticMarks).toBe('on-return');
    // version 2 was returned above (it keeps its mark); version 1 is held back again
    expect(list.body.reports.map((v) => [v.versionNo, v.mark !== null])).toEqual([
      [2, true],
      [1, false],
    ]);
  });
});
