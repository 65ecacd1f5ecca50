/**
 * Report uploads through the API against MariaDB: what was read, storing a
 * confirmed upload with its mark, versions that never overwrite, every
 * refusal leaving nothing behind, templates of other students, role and
 * scope, late status from the due date.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ENGINE_VERSION } from '@shared/exercises/reference';
import type { ExerciseReports, ReadPreview, ReportDetail, UploadResult } from '@shared/api/reports';
import { startAppContext, type AppContext } from '../support/app-context';
import { CookieClient } from '../support/cookie-client';
import { sessionClients } from '../support/session-clients';
import {
  createPublishedExercise,
  curveReferenceOf,
  curveSpec,
  fillAnswers,
  fillTemplate,
  minimalPdf,
  referenceCsv,
  seedCourse,
  uploadForm,
  uploadRowCounts,
  variantOf,
  type SeededCourse,
} from './reports-fixtures';

let ctx: AppContext;
let seed: SeededCourse;
let exerciseId: number;
let revisionId: number;
let lateExerciseId: number;
// marks held back until the return, so that what students see before and after it is tested here
// (the default, marks at once, is tested in reports-student-marks.test.ts)
const spec = curveSpec({ automaticMarks: 'on-return' });
const fixture = (name: string) => readFileSync(new URL(`../fixtures/reports/${name}`, import.meta.url));

type ErrorBody = { error: { code: string; message: string; details?: { field?: string; reader?: { code: string; row?: number; column?: string; sheet?: string } } } };

beforeAll(async () => {
  ctx = await startAppContext();
  seed = await seedCourse(ctx.db.knex, ctx.issuer);
  ({ exerciseId, revisionId } = await createPublishedExercise(ctx.db.knex, seed.courseId, seed.users.lec1, spec));
  // due in the past: 2026-03-02 17:00 London, 10 % per started day, capped at 50 %
  ({ exerciseId: lateExerciseId } = await createPublishedExercise(ctx.db.knex, seed.courseId, seed.users.lec1, curveSpec({ dueLocal: '2026-03-02T17:00' })));
});

afterAll(async () => {
  await ctx?.close();
});

const { as, post, get } = sessionClients(() => ctx);

function stu1Csv(options: Parameters<typeof referenceCsv>[1] = {}) {
  return referenceCsv(curveReferenceOf(spec, variantOf(spec, seed.studentNumbers.stu1)), options);
}
const bohrHartreeChoice = { distanceColumn: 'A', energyColumns: ['B', 'C'], distanceUnit: 'bohr', energyUnit: 'hartree' };

describe('reading an upload back before it is stored', () => {
  it('answers what was read (columns, units, convention, points) and stores nothing', async () => {
    const before = await uploadRowCounts(ctx.db.knex);
    const r = await post<ReadPreview>('stu1', `/exercises/${exerciseId}/reports/read`, uploadForm({ name: 'curve.csv', bytes: stu1Csv() }, { writeup: { name: 'write-up.pdf', bytes: minimalPdf } }));
    expect(r.status).toBe(200);
    expect(r.body.dataFile).toMatchObject({ fileName: 'curve.csv', detectedType: 'text' });
    expect(r.body.writeup).toMatchObject({ fileName: 'write-up.pdf', detectedType: 'pdf' });
    expect(r.body.choice).toMatchObject({ distanceColumn: 'A', energyColumns: ['B', 'C'] });
    expect(r.body.units).toMatchObject({ distance: 'bohr', energy: 'hartree', distanceSource: 'header', energySource: 'header' });
    expect(r.body.convention).toBe('total');
    expect(r.body.pointCount).toBe(37); // 0.8 … 8.0 bohr step 0.2
    expect(r.body.series).toHaveLength(2);
    expect(r.body.series[0].points[0][0]).toBeCloseTo(0.8, 9);
    expect(r.body.table?.columns.map((c) => c.role)).toEqual(['distance', 'energy', 'energy']);
    expect(r.body.enrolment).toMatchObject({ id: seed.enrolments.stu1, studentNumber: seed.studentNumbers.stu1 });
    expect(await uploadRowCounts(ctx.db.knex)).toEqual(before);
  });

  it('re-reads with the student\'s correction of a unit guess', async () => {
    // header without units and distances in ångström: the magnitudes suggest a unit, the student says Å and eV
    const csv = stu1Csv({ distanceUnit: 'angstrom', energyUnit: 'ev', unitsInHeader: false });
    const guessed = await post<ReadPreview>('stu1', `/exercises/${exerciseId}/reports/read`, uploadForm({ name: 'no-units.csv', bytes: csv }));
    expect(guessed.status).toBe(200);
    expect(guessed.body.units?.distanceSource).toBe('magnitude');
    const corrected = await post<ReadPreview>(
      'stu1',
      `/exercises/${exerciseId}/reports/read`,
      uploadForm({ name: 'no-units.csv', bytes: csv }, { choice: { distanceColumn: 'A', energyColumns: ['B', 'C'], distanceUnit: 'angstrom', energyUnit: 'ev' } }),
    );
    expect(corrected.status).toBe(200);
    expect(corrected.body.units).toMatchObject({ distance: 'angstrom', energy: 'ev', distanceSource: 'user', energySource: 'user' });
    // the preview speaks in the chosen units: 0.8 bohr = 0.42334 Å (CODATA 2018 bohr radius 0.529177210903 Å)
    expect(corrected.body.series[0].points[0][0]).toBeCloseTo(0.8 * 0.529177210903, 5);
  });
});

describe('storing an upload', () => {
  let first: UploadResult;

  it('stores the files, a new report version and its mark in one go (staff see the mark at once)', async () => {
    const csv = stu1Csv();
    const before = await uploadRowCounts(ctx.db.knex);
    const r = await post<UploadResult>('lec1', `/exercises/${exerciseId}/reports?enrolmentId=${seed.enrolments.stu1}`, uploadForm({ name: 'curve.csv', bytes: csv }, { writeup: { name: 'write-up.pdf', bytes: minimalPdf }, choice: bohrHartreeChoice }));
    expect(r.status).toBe(201);
    first = r.body;
    expect(r.body.report).toMatchObject({ versionNo: 1, state: 'submitted', onBehalf: true, enrolmentId: seed.enrolments.stu1, units: { distance: 'bohr', energy: 'hartree' }, pointCount: 37 });
    expect(r.body.report.dataFile).toEqual({ fileName: 'curve.csv', sizeBytes: Buffer.byteLength(csv), detectedType: 'text', sha256: createHash('sha256').update(csv).digest('hex') });
    expect(r.body.report.writeup).toMatchObject({ fileName: 'write-up.pdf', detectedType: 'pdf' });
    const mark = r.body.report.mark!;
    expect(mark).toMatchObject({ revisionId, engineVersion: ENGINE_VERSION, latePenaltyPercent: 0 });
    // the file is the reference itself (8 decimals in Eh): every check gets full points
    expect(mark.points).toBe(mark.max);
    expect(mark.checks.map((c) => c.id)).toEqual(['curve-rms', 're', 'de', 'antibonding-repulsive']);
    expect(mark.checks.every((c) => c.message.length > 20)).toBe(true);

    const after = await uploadRowCounts(ctx.db.knex);
    expect(after.stored_files - before.stored_files).toBe(2);
    expect(after.reports - before.reports).toBe(1);
    expect(after.marks - before.marks).toBe(1);
    const stored = await ctx.db.knex('stored_files').where({ id: (await ctx.db.knex('reports').where({ id: r.body.report.id }).first()).data_file_id }).first();
    expect(Buffer.from(stored.content).toString('utf8')).toBe(csv);
    const markRow = await ctx.db.knex('marks').where({ report_id: r.body.report.id }).first();
    expect(markRow).toMatchObject({ revision_id: revisionId, engine_version: ENGINE_VERSION });
    const audit = await ctx.db.knex('audit_log').where({ action: 'report.uploaded', entity_id: String(r.body.report.id) });
    expect(audit).toHaveLength(1);
    expect(await ctx.db.knex('jobs').where({ id: r.body.similarityJobId }).first()).toMatchObject({ kind: 'similarity-exercise', state: 'queued' });
  });

  it('a student\'s upload answers the report as submitted, without marks until it is returned (automaticMarks on-return)', async () => {
    const r = await post<UploadResult>('stu1', `/exercises/${exerciseId}/reports`, uploadForm({ name: 'curve-v2.csv', bytes: stu1Csv({ noiseHartree: 2e-4, seed: 3 }) }, { choice: bohrHartreeChoice }));
    expect(r.status).toBe(201);
    expect(r.body.report).toMatchObject({ versionNo: 2, state: 'submitted', onBehalf: false, mark: null });
    // the mark exists all the same
    expect(await ctx.db.knex('marks').where({ report_id: r.body.report.id })).toHaveLength(1);
  });

  it('every upload is a new version: earlier versions stay as they were', async () => {
    const v1Before = await ctx.db.knex('reports').where({ id: first.report.id }).first();
    const r = await post<UploadResult>('stu1', `/exercises/${exerciseId}/reports`, uploadForm({ name: 'curve.csv', bytes: stu1Csv() }, { choice: bohrHartreeChoice }));
    expect(r.status).toBe(201);
    expect(r.body.report.versionNo).toBe(3);
    const v1After = await ctx.db.knex('reports').where({ id: first.report.id }).first();
    expect(v1After).toEqual(v1Before);
    const list = await get<ExerciseReports>('stu1', `/exercises/${exerciseId}/reports`);
    expect(list.status).toBe(200);
    expect(list.body.reports.map((v) => v.versionNo)).toEqual([3, 2, 1]);
    expect(list.body.reports.every((v) => v.mark === null)).toBe(true);
    expect(list.body.exercise).toMatchObject({ id: exerciseId, title: spec.title, dueLocal: '2035-06-01T17:00', acceptingUploads: true });
    // two files with the same bytes are two stored files (never shared, never overwritten)
    const ids = await ctx.db.knex('reports').where({ exercise_id: exerciseId, enrolment_id: seed.enrolments.stu1 }).pluck('data_file_id');
    expect(new Set(ids).size).toBe(3);
  });

  it('marks and the overlay reach the student once the report is returned', async () => {
    const detailBefore = await get<ReportDetail>('stu1', `/reports/${first.report.id}`);
    expect(detailBefore.status).toBe(200);
    expect(detailBefore.body.report.mark).toBeNull();
    expect(detailBefore.body.overlay).toBeNull();
    await ctx.db.knex('reports').where({ id: first.report.id }).update({ state: 'returned', returned_at: new Date() });
    const detail = await get<ReportDetail>('stu1', `/reports/${first.report.id}`);
    expect(detail.body.report.mark?.checks).toHaveLength(4);
    const overlay = detail.body.overlay!;
    expect(overlay).toMatchObject({ distanceUnit: 'bohr', energyUnit: 'hartree', convention: 'total' });
    expect(overlay.commonRange![0]).toBeCloseTo(0.8, 9);
    expect(overlay.commonRange![1]).toBeCloseTo(8, 9);
    expect(overlay.student.map((s) => s.points.length)).toEqual([37, 37]);
    expect(overlay.reference.map((s) => s.key)).toEqual(['bonding', 'antibonding']);
    // the file was the reference rounded to 1e-8 Eh
    overlay.reference[0].points.forEach(([, e], i) => expect(Math.abs(e - overlay.student[0].points[i][1])).toBeLessThan(1e-8));
    const list = await get<ExerciseReports>('stu1', `/exercises/${exerciseId}/reports`);
    expect(list.body.reports.find((v) => v.id === first.report.id)?.mark?.total).toBe(list.body.reports.find((v) => v.id === first.report.id)?.mark?.max);
    expect(list.body.reports.filter((v) => v.mark !== null)).toHaveLength(1);
  });

  it('staff read a report\'s detail and download its files; others cannot', async () => {
    const detail = await get<ReportDetail>('ta1', `/reports/${first.report.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.reading.choice).toMatchObject({ distanceColumn: 'A', energyColumns: ['B', 'C'] });
    expect(detail.body.student).toMatchObject({ enrolmentId: seed.enrolments.stu1, studentNumber: seed.studentNumbers.stu1 });
    expect(detail.body.versions.map((v) => v.versionNo)).toEqual([3, 2, 1]);
    const { client } = await as('lec1');
    const file = await client.request(`${ctx.baseUrl}/api/v1/reports/${first.report.id}/data-file`);
    expect(file.status).toBe(200);
    expect(file.headers.get('content-disposition')).toContain('curve.csv');
    expect(file.body).toBe(stu1Csv());
    const pdf = await client.request(`${ctx.baseUrl}/api/v1/reports/${first.report.id}/writeup`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect((await get('stu2', `/reports/${first.report.id}`)).status).toBe(403);
    expect((await get('lec2', `/reports/${first.report.id}/data-file`)).status).toBe(403);
    expect((await new CookieClient().json(`${ctx.baseUrl}/api/v1/reports/${first.report.id}`)).status).toBe(401);
  });
});

describe('refusals store nothing', () => {
  const cases: { name: string; file: () => Buffer | string; fileName: string; reader: string; row?: number; column?: string; message: RegExp }[] = [
    { name: 'an empty file', file: () => fixture('empty.csv'), fileName: 'empty.csv', reader: 'empty_file', message: /empty|no bytes/i },
    { name: 'fewer than five points', file: () => fixture('too-few-points.csv'), fileName: 'too-few-points.csv', reader: 'too_few_points', message: /five|5/ },
    { name: 'text in a numeric cell', file: () => fixture('text-in-cell.csv'), fileName: 'text-in-cell.csv', reader: 'not_a_number', row: 5, column: 'B', message: /row 5/i },
    { name: 'NaN in a numeric cell', file: () => fixture('nan-in-cell.csv'), fileName: 'nan-in-cell.csv', reader: 'not_a_number', row: 4, column: 'B', message: /row 4/i },
    { name: 'a duplicate distance', file: () => fixture('duplicate-distance.csv'), fileName: 'duplicate-distance.csv', reader: 'duplicate_distance', row: 5, column: 'A', message: /rows 3 and 5/i },
    { name: 'a non-positive distance', file: () => fixture('nonpositive-distance.csv'), fileName: 'nonpositive-distance.csv', reader: 'nonpositive_distance', row: 2, column: 'A', message: /row 2/i },
    { name: 'a macro workbook', file: () => fixture('macro.xlsm'), fileName: 'results.xlsx', reader: 'macro_workbook', message: /macro/i },
    { name: 'an encrypted workbook', file: () => fixture('encrypted.xlsx'), fileName: 'results.xlsx', reader: 'encrypted_workbook', message: /password|encrypt/i },
    { name: 'a PDF in the data slot', file: () => minimalPdf, fileName: 'curve.csv', reader: 'pdf_file', message: /PDF/ },
    { name: 'a date in a numeric cell', file: () => fixture('date-in-cell.xlsx'), fileName: 'dates.xlsx', reader: 'date_in_numeric_cell', row: 5, column: 'A', message: /date/i },
  ];

  it.each(cases)('$name → 422 with the reader\'s place, and no rows written', async (c) => {
    for (const path of [`/exercises/${exerciseId}/reports/read`, `/exercises/${exerciseId}/reports`]) {
      const before = await uploadRowCounts(ctx.db.knex);
      const choice = { distanceColumn: 'A', energyColumns: ['B'], distanceUnit: 'bohr', energyUnit: 'hartree' };
      const r = await post<ErrorBody>('stu1', path, uploadForm({ name: c.fileName, bytes: c.file() }, { choice: path.endsWith('/read') ? undefined : choice }));
      expect(r.status).toBe(422);
      expect(r.body.error.message).toMatch(c.message);
      expect(r.body.error.details?.field).toBe('data');
      expect(r.body.error.details?.reader?.code).toBe(c.reader);
      if (c.row !== undefined) expect(r.body.error.details?.reader?.row).toBe(c.row);
      if (c.column !== undefined) expect(r.body.error.details?.reader?.column).toBe(c.column);
      expect(await uploadRowCounts(ctx.db.knex)).toEqual(before);
    }
  });

  it('a write-up that is not a PDF by its content is refused, whatever its name', async () => {
    const before = await uploadRowCounts(ctx.db.knex);
    const r = await post<ErrorBody>('stu1', `/exercises/${exerciseId}/reports`, uploadForm({ name: 'curve.csv', bytes: stu1Csv() }, { writeup: { name: 'write-up.pdf', bytes: 'just text pretending to be a PDF' }, choice: bohrHartreeChoice }));
    expect(r.status).toBe(422);
    expect(r.body.error.message).toMatch(/is not a PDF/);
    expect(r.body.error.details?.field).toBe('writeup');
    expect(await uploadRowCounts(ctx.db.knex)).toEqual(before);
  });

  it('a data file over the size limit is refused with 413', async () => {
    const before = await uploadRowCounts(ctx.db.knex);
    const big = 'R,E\n' + '1.0,-0.5\n'.repeat(Math.ceil((5 * 1024 * 1024) / 9) + 10);
    const r = await post<ErrorBody>('stu1', `/exercises/${exerciseId}/reports`, uploadForm({ name: 'big.csv', bytes: big }, { choice: bohrHartreeChoice }));
    expect(r.status).toBe(413);
    expect(r.body.error.message).toMatch(/limit of 5 MB/);
    expect(await uploadRowCounts(ctx.db.knex)).toEqual(before);
  });

  it('a missing data file, a missing choice and a choice of a column that is not there are refused', async () => {
    const before = await uploadRowCounts(ctx.db.knex);
    const none = await post<ErrorBody>('stu1', `/exercises/${exerciseId}/reports`, uploadForm(null, { choice: bohrHartreeChoice }));
    expect(none.status).toBe(400);
    expect(none.body.error.message).toMatch(/field "data"/);
    const noChoice = await post<ErrorBody>('stu1', `/exercises/${exerciseId}/reports`, uploadForm({ name: 'c.csv', bytes: stu1Csv() }));
    expect(noChoice.status).toBe(400);
    expect(noChoice.body.error.message).toMatch(/choice/);
    const badChoice = await post<ErrorBody>('stu1', `/exercises/${exerciseId}/reports`, uploadForm({ name: 'c.csv', bytes: stu1Csv() }, { choice: { ...bohrHartreeChoice, energyColumns: ['F'] } }));
    expect(badChoice.status).toBe(422);
    expect(badChoice.body.error.details?.field).toBe('choice');
    expect(await uploadRowCounts(ctx.db.knex)).toEqual(before);
  });

  it('no CSRF token: 403, nothing stored', async () => {
    const before = await uploadRowCounts(ctx.db.knex);
    const { client } = await as('stu1');
    const r = await client.json<ErrorBody>(`${ctx.baseUrl}/api/v1/exercises/${exerciseId}/reports`, { method: 'POST', body: uploadForm({ name: 'c.csv', bytes: stu1Csv() }, { choice: bohrHartreeChoice }) });
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('csrf_failed');
    expect(await uploadRowCounts(ctx.db.knex)).toEqual(before);
  });
});

describe('personal templates', () => {
  async function templateOf(login: string, enrolmentId?: number): Promise<Buffer> {
    const { client } = await as(login);
    const res = await fetch(`${ctx.baseUrl}/api/v1/exercises/${exerciseId}/template${enrolmentId ? `?enrolmentId=${enrolmentId}` : ''}`, {
      headers: { cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
    });
    expect(res.status).toBe(200);
    return Buffer.from(await res.arrayBuffer());
  }

  it('a filled personal template is read from its hidden sheet and marked', async () => {
    const filled = await fillTemplate(await templateOf('stu1'), curveReferenceOf(spec, variantOf(spec, seed.studentNumbers.stu1)));
    const preview = await post<ReadPreview>('stu1', `/exercises/${exerciseId}/reports/read`, uploadForm({ name: 'my-template.xlsx', bytes: filled }));
    expect(preview.status).toBe(200);
    expect(preview.body.template).toMatchObject({ exerciseId: String(exerciseId), studentNumber: seed.studentNumbers.stu1 });
    expect(preview.body.units?.distanceSource).toBe('template');
    const r = await post<UploadResult>('lec1', `/exercises/${exerciseId}/reports?enrolmentId=${seed.enrolments.stu1}`, uploadForm({ name: 'my-template.xlsx', bytes: filled }, { choice: { ...preview.body.choice, distanceUnit: preview.body.units!.distance, energyUnit: preview.body.units!.energy } }));
    expect(r.status).toBe(201);
    expect(r.body.report.dataFile.detectedType).toBe('xlsx');
    expect(r.body.report.mark!.total).toBe(r.body.report.mark!.max);
  });

  it('another student\'s template is refused with a clear message, and nothing is stored', async () => {
    const stu2Template = await fillTemplate(await templateOf('stu2'), curveReferenceOf(spec, variantOf(spec, seed.studentNumbers.stu2)));
    const before = await uploadRowCounts(ctx.db.knex);
    for (const path of [`/exercises/${exerciseId}/reports/read`, `/exercises/${exerciseId}/reports`]) {
      const r = await post<ErrorBody>('stu1', path, uploadForm({ name: 'borrowed.xlsx', bytes: stu2Template }, { choice: path.endsWith('/read') ? undefined : bohrHartreeChoice }));
      expect(r.status).toBe(422);
      expect(r.body.error.message).toMatch(/personal template of another student/);
      expect(r.body.error.details?.reader?.code).toBe('template_other_student');
    }
    // staff uploading it for the wrong student are told the same
    const wrong = await post<ErrorBody>('lec1', `/exercises/${exerciseId}/reports?enrolmentId=${seed.enrolments.stu1}`, uploadForm({ name: 'borrowed.xlsx', bytes: stu2Template }, { choice: bohrHartreeChoice }));
    expect(wrong.status).toBe(422);
    expect(await uploadRowCounts(ctx.db.knex)).toEqual(before);
  });
});

describe('answers-only exercises', () => {
  it('an MO-diagram exercise is handed in as a template with answers, and marked', async () => {
    const diatomic = curveSpec({
      title: 'MO diagram of a diatomic',
      model: { family: 'diatomic', species: ['O2'], order: 'auto' },
      scheme: {
        checks: [
          { kind: 'bond-order', id: 'bond-order', label: 'Bond order', weight: 1 },
          { kind: 'unpaired-electrons', id: 'unpaired', label: 'Unpaired electrons', weight: 1 },
          { kind: 'term-symbol', id: 'term', label: 'Ground term', weight: 2 },
        ],
      },
    });
    const { exerciseId: moExercise } = await createPublishedExercise(ctx.db.knex, seed.courseId, seed.users.lec1, diatomic);
    const { client } = await as('stu1');
    const res = await fetch(`${ctx.baseUrl}/api/v1/exercises/${moExercise}/template`, { headers: { cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ') } });
    expect(res.status).toBe(200);
    // O2: bond order 2, two unpaired electrons, ground term ³Σg⁻ (from memory; standard textbook MO result), typed in a usual notation
    const filled = await fillAnswers(Buffer.from(await res.arrayBuffer()), { 'bond-order': 2, 'unpaired-electrons': 2, 'term-symbol': '3Sigma_g-' });
    const preview = await post<ReadPreview>('stu1', `/exercises/${moExercise}/reports/read`, uploadForm({ name: 'o2.xlsx', bytes: filled }));
    expect(preview.status).toBe(200);
    expect(preview.body.table).toBeNull();
    expect(preview.body.answers).toMatchObject({ 'bond-order': 2, 'unpaired-electrons': 2, 'term-symbol': '3Sigma_g-' });
    const r = await post<UploadResult>('lec1', `/exercises/${moExercise}/reports?enrolmentId=${seed.enrolments.stu1}`, uploadForm({ name: 'o2.xlsx', bytes: filled }, { choice: bohrHartreeChoice }));
    expect(r.status).toBe(201);
    expect(r.body.report.units).toBeNull();
    expect(r.body.report.mark!.checks.map((c) => [c.id, c.points])).toEqual([
      ['bond-order', 1],
      ['unpaired', 1],
      ['term', 2],
    ]);
  });
});

describe('role and scope', () => {
  const csv = () => stu1Csv();

  it('401 without a session', async () => {
    const r = await new CookieClient().json(`${ctx.baseUrl}/api/v1/exercises/${exerciseId}/reports`, { method: 'POST', body: uploadForm({ name: 'c.csv', bytes: csv() }) });
    expect(r.status).toBe(401);
    expect((await new CookieClient().json(`${ctx.baseUrl}/api/v1/exercises/${exerciseId}/reports`)).status).toBe(401);
  });

  it('a student of another course gets 403 and stores nothing', async () => {
    const before = await uploadRowCounts(ctx.db.knex);
    const r = await post<ErrorBody>('nobody', `/exercises/${exerciseId}/reports`, uploadForm({ name: 'c.csv', bytes: csv() }, { choice: bohrHartreeChoice }));
    expect(r.status).toBe(403);
    expect((await post('nobody', `/exercises/${exerciseId}/reports/read`, uploadForm({ name: 'c.csv', bytes: csv() }))).status).toBe(403);
    expect((await get('nobody', `/exercises/${exerciseId}/reports`)).status).toBe(403);
    expect(await uploadRowCounts(ctx.db.knex)).toEqual(before);
  });

  it('a student cannot upload for, or list the reports of, another student', async () => {
    const r = await post<ErrorBody>('stu1', `/exercises/${exerciseId}/reports?enrolmentId=${seed.enrolments.stu2}`, uploadForm({ name: 'c.csv', bytes: csv() }, { choice: bohrHartreeChoice }));
    expect(r.status).toBe(403);
    expect((await get('stu1', `/exercises/${exerciseId}/reports?enrolmentId=${seed.enrolments.stu2}`)).status).toBe(403);
  });

  it('an assistant uploads for students of their sections only', async () => {
    const before = await uploadRowCounts(ctx.db.knex);
    const outside = await post<ErrorBody>('ta1', `/exercises/${exerciseId}/reports?enrolmentId=${seed.enrolments.stu2}`, uploadForm({ name: 'c.csv', bytes: csv() }, { choice: bohrHartreeChoice }));
    expect(outside.status).toBe(403);
    expect(outside.body.error.message).toMatch(/not in one of your sections/);
    expect((await get('ta1', `/exercises/${exerciseId}/reports?enrolmentId=${seed.enrolments.stu2}`)).status).toBe(403);
    expect(await uploadRowCounts(ctx.db.knex)).toEqual(before);
    const inside = await post<UploadResult>('ta1', `/exercises/${exerciseId}/reports?enrolmentId=${seed.enrolments.stu1}`, uploadForm({ name: 'c.csv', bytes: csv() }, { choice: bohrHartreeChoice }));
    expect(inside.status).toBe(201);
    expect(inside.body.report.onBehalf).toBe(true);
    expect(inside.body.report.uploadedBy.displayName).toBe('Tariq Assistant');
  });

  it('a lecturer of another course gets 403; staff must name the student', async () => {
    expect((await post('lec2', `/exercises/${exerciseId}/reports?enrolmentId=${seed.enrolments.stu1}`, uploadForm({ name: 'c.csv', bytes: csv() }, { choice: bohrHartreeChoice }))).status).toBe(403);
    const unnamed = await post<ErrorBody>('lec1', `/exercises/${exerciseId}/reports`, uploadForm({ name: 'c.csv', bytes: csv() }, { choice: bohrHartreeChoice }));
    expect(unnamed.status).toBe(400);
    expect(unnamed.body.error.message).toMatch(/enrolmentId/);
  });

  it('drafts are invisible to students; unknown exercises are 404', async () => {
    const [draftId] = await ctx.db.knex('exercises').insert({ course_id: seed.courseId, state: 'draft', created_by: seed.users.lec1 });
    expect((await post('stu1', `/exercises/${draftId}/reports`, uploadForm({ name: 'c.csv', bytes: csv() }, { choice: bohrHartreeChoice }))).status).toBe(404);
    expect((await post('stu1', `/exercises/999999/reports`, uploadForm({ name: 'c.csv', bytes: csv() }, { choice: bohrHartreeChoice }))).status).toBe(404);
  });
});

describe('late status', () => {
  it('comes from the due date in the exercise\'s time zone, and an extension moves it', async () => {
    const lateSpec = curveSpec({ dueLocal: '2026-03-02T17:00' });
    const body = referenceCsv(curveReferenceOf(lateSpec, variantOf(lateSpec, seed.studentNumbers.stu1)));
    const r = await post<UploadResult>('lec1', `/exercises/${lateExerciseId}/reports?enrolmentId=${seed.enrolments.stu1}`, uploadForm({ name: 'late.csv', bytes: body }, { choice: bohrHartreeChoice }));
    expect(r.status).toBe(201);
    const late = r.body.report.late;
    expect(late.late).toBe(true);
    // 2026-03-02 17:00 in London is 17:00 UTC (GMT, before the change to BST on 29 March; IANA tz database)
    expect(late.effectiveDueAt).toBe('2026-03-02T17:00:00.000Z');
    expect(late.daysLate).toBeGreaterThan(5);
    expect(late.penaltyPercent).toBe(50); // capped at 50 % (the exercise's late rule)
    expect(r.body.report.mark).toMatchObject({ latePenaltyPercent: 50 });
    expect(r.body.report.mark!.total).toBeCloseTo(r.body.report.mark!.points / 2, 2);

    // an extension of a year makes the same upload on time
    await ctx.db.knex('extensions').insert({ exercise_id: lateExerciseId, enrolment_id: seed.enrolments.stu1, extra_minutes: 365 * 24 * 60, reason: 'medical', granted_by: seed.users.lec1 });
    const again = await post<UploadResult>('lec1', `/exercises/${lateExerciseId}/reports?enrolmentId=${seed.enrolments.stu1}`, uploadForm({ name: 'late.csv', bytes: body }, { choice: bohrHartreeChoice }));
    expect(again.body.report.late).toMatchObject({ late: false, penaltyPercent: 0, effectiveDueAt: '2027-03-02T17:00:00.000Z' });
    expect(again.body.report.mark).toMatchObject({ latePenaltyPercent: 0 });
  });
});
