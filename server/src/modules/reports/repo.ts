/**
 * Rows of reports, stored_files, marks and adjustments (and the exercise,
 * revision, enrolment and extension rows the reports module reads). No wire
 * shapes here: service.ts makes those.
 */
import type { Knex } from 'knex';
import type { VariantRow } from '../exercises/repo';

type Db = Knex | Knex.Transaction;

/** JSON columns come back as text on MariaDB; one reader for every module. */
export { parseJson } from '../exercises/repo';

export interface ExerciseWithRevisionRow {
  id: number;
  course_id: number;
  state: 'draft' | 'published' | 'closed';
  current_revision_id: number | null;
  revision_id: number | null;
  revision_no: number | null;
  spec_json: unknown;
  published_at: Date | null;
}

export function findExerciseWithRevision(db: Db, exerciseId: number): Promise<ExerciseWithRevisionRow | undefined> {
  return db('exercises as e')
    .leftJoin('exercise_revisions as r', 'r.id', 'e.current_revision_id')
    .where('e.id', exerciseId)
    .first('e.id', 'e.course_id', 'e.state', 'e.current_revision_id', 'r.id as revision_id', 'r.revision_no', 'r.spec_json', 'r.published_at');
}

export interface RevisionRow {
  id: number;
  exercise_id: number;
  revision_no: number;
  spec_json: unknown;
}

export function findRevision(db: Db, revisionId: number): Promise<RevisionRow | undefined> {
  return db('exercise_revisions').where({ id: revisionId }).first('id', 'exercise_id', 'revision_no', 'spec_json');
}

export interface EnrolmentRow {
  id: number;
  course_id: number;
  user_id: number;
  student_number: string;
  status: 'active' | 'withdrawn';
  section_id: number | null;
  display_name: string;
}

/** Columns of an EnrolmentRow, from `enrolments as en` joined with `users as u`. */
export const enrolmentColumns = (db: Db) => [
  'en.id',
  'en.course_id',
  'en.user_id',
  'en.student_number',
  'en.status',
  'en.section_id',
  db.raw("COALESCE(NULLIF(TRIM(CONCAT_WS(' ', en.given_name, en.family_name)), ''), u.display_name) as display_name"),
];

export function findEnrolment(db: Db, enrolmentId: number): Promise<EnrolmentRow | undefined> {
  return db('enrolments as en').join('users as u', 'u.id', 'en.user_id').where('en.id', enrolmentId).first(enrolmentColumns(db));
}

export function enrolmentOfUser(db: Db, courseId: number, userId: number): Promise<EnrolmentRow | undefined> {
  return db('enrolments as en')
    .join('users as u', 'u.id', 'en.user_id')
    .where({ 'en.course_id': courseId, 'en.user_id': userId, 'en.status': 'active' })
    .first(enrolmentColumns(db));
}

export function enrolmentsByIds(db: Db, ids: number[]): Promise<EnrolmentRow[]> {
  if (!ids.length) return Promise.resolve([]);
  return db('enrolments as en').join('users as u', 'u.id', 'en.user_id').whereIn('en.id', ids).select(enrolmentColumns(db));
}

/** Section ids an assistant is assigned to within a course. */
export async function assistantSectionIds(db: Db, courseId: number, userId: number): Promise<Set<number>> {
  const rows = await db('section_assistants as sa').join('sections as s', 's.id', 'sa.section_id').where({ 's.course_id': courseId, 'sa.user_id': userId }).select('s.id');
  return new Set(rows.map((r) => r.id as number));
}

/** The student's extension on an exercise in minutes: the newest grant counts (0 without one). */
export async function extensionMinutes(db: Db, exerciseId: number, enrolmentId: number): Promise<number> {
  const row = await db('extensions').where({ exercise_id: exerciseId, enrolment_id: enrolmentId }).orderBy('id', 'desc').first('extra_minutes');
  return row ? Number(row.extra_minutes) : 0;
}

export async function extensionsOfExercise(db: Db, exerciseId: number): Promise<Map<number, number>> {
  const rows = await db('extensions').where({ exercise_id: exerciseId }).orderBy('id').select('enrolment_id', 'extra_minutes');
  const out = new Map<number, number>();
  for (const r of rows) out.set(r.enrolment_id, Number(r.extra_minutes));
  return out;
}

/** A variants row, as the exercises module stores it. */
export type { VariantRow };

export function findVariantById(db: Db, id: number): Promise<VariantRow | undefined> {
  return db('variants').where({ id }).first('id', 'revision_id', 'enrolment_id', 'variant_key', 'variant_json', 'template_token');
}

/** The variant a template token belongs to, with the exercise of its revision. */
export function variantByTemplateToken(db: Db, token: string): Promise<(VariantRow & { exercise_id: number }) | undefined> {
  return db('variants as v')
    .join('exercise_revisions as r', 'r.id', 'v.revision_id')
    .where('v.template_token', token)
    .first('v.id', 'v.revision_id', 'v.enrolment_id', 'v.variant_key', 'v.variant_json', 'v.template_token', 'r.exercise_id');
}

export interface StoredFileInsert {
  sha256: string;
  sizeBytes: number;
  detectedType: string;
  fileName: string;
  content: Buffer;
  uploadedBy: number;
}

export async function insertStoredFile(trx: Db, f: StoredFileInsert): Promise<number> {
  const [id] = await trx('stored_files').insert({
    sha256: f.sha256,
    size_bytes: f.sizeBytes,
    detected_type: f.detectedType,
    file_name: f.fileName,
    content: f.content,
    uploaded_by: f.uploadedBy,
  });
  return Number(id);
}

/** The next version number of a student's report, locking the student's existing versions. */
export async function nextVersionNo(trx: Db, exerciseId: number, enrolmentId: number): Promise<number> {
  // Lock the enrolment row: two uploads of one student queue up here instead of colliding on the unique key.
  await trx('enrolments').where({ id: enrolmentId }).forUpdate().first('id');
  const row = await trx('reports').where({ exercise_id: exerciseId, enrolment_id: enrolmentId }).max({ v: 'version_no' }).first();
  return Number(row?.v ?? 0) + 1;
}

export interface ReportInsert {
  exerciseId: number;
  enrolmentId: number;
  variantId: number;
  versionNo: number;
  dataFileId: number;
  writeupFileId: number | null;
  reading: unknown;
  uploadedBy: number;
  uploadedAt: Date;
}

export async function insertReport(trx: Db, r: ReportInsert): Promise<number> {
  const [id] = await trx('reports').insert({
    exercise_id: r.exerciseId,
    enrolment_id: r.enrolmentId,
    variant_id: r.variantId,
    version_no: r.versionNo,
    data_file_id: r.dataFileId,
    writeup_file_id: r.writeupFileId,
    reading_json: JSON.stringify(r.reading),
    uploaded_by: r.uploadedBy,
    uploaded_at: r.uploadedAt,
  });
  return Number(id);
}

export interface MarkInsert {
  reportId: number;
  revisionId: number;
  engineVersion: string;
  points: number;
  max: number;
  latePenaltyPercent: number;
  total: number;
  checks: unknown;
}

export async function insertMark(trx: Db, m: MarkInsert): Promise<number> {
  const [id] = await trx('marks').insert({
    report_id: m.reportId,
    revision_id: m.revisionId,
    engine_version: m.engineVersion,
    points: round3(m.points),
    max_points: round3(m.max),
    late_penalty_percent: Math.round(m.latePenaltyPercent * 100) / 100,
    total: round3(m.total),
    checks_json: JSON.stringify(m.checks),
  });
  return Number(id);
}

const round3 = (x: number) => Math.round(x * 1000) / 1000;

export interface ReportRow {
  id: number;
  exercise_id: number;
  enrolment_id: number;
  variant_id: number;
  version_no: number;
  data_file_id: number;
  writeup_file_id: number | null;
  reading_json: unknown;
  uploaded_by: number;
  uploaded_by_name: string;
  uploaded_at: Date;
  state: 'submitted' | 'marked' | 'returned';
  returned_at: Date | null;
  data_sha256: string;
  data_size: number;
  data_type: string;
  data_name: string;
  writeup_sha256: string | null;
  writeup_size: number | null;
  writeup_type: string | null;
  writeup_name: string | null;
}

function reportQuery(db: Db) {
  return db('reports as r')
    .join('users as u', 'u.id', 'r.uploaded_by')
    .join('stored_files as d', 'd.id', 'r.data_file_id')
    .leftJoin('stored_files as w', 'w.id', 'r.writeup_file_id')
    .select(
      'r.id',
      'r.exercise_id',
      'r.enrolment_id',
      'r.variant_id',
      'r.version_no',
      'r.data_file_id',
      'r.writeup_file_id',
      'r.reading_json',
      'r.uploaded_by',
      'u.display_name as uploaded_by_name',
      'r.uploaded_at',
      'r.state',
      'r.returned_at',
      'd.sha256 as data_sha256',
      'd.size_bytes as data_size',
      'd.detected_type as data_type',
      'd.file_name as data_name',
      'w.sha256 as writeup_sha256',
      'w.size_bytes as writeup_size',
      'w.detected_type as writeup_type',
      'w.file_name as writeup_name',
    );
}

export function findReport(db: Db, reportId: number): Promise<ReportRow | undefined> {
  return reportQuery(db).where('r.id', reportId).first();
}

/** A student's versions of one exercise, newest first. */
export function reportsOfStudent(db: Db, exerciseId: number, enrolmentId: number): Promise<ReportRow[]> {
  return reportQuery(db).where({ 'r.exercise_id': exerciseId, 'r.enrolment_id': enrolmentId }).orderBy('r.version_no', 'desc');
}

export interface MarkRow {
  id: number;
  report_id: number;
  revision_id: number;
  revision_no: number;
  engine_version: string;
  points: number;
  max_points: number;
  late_penalty_percent: number;
  total: number;
  checks_json: unknown;
  created_at: Date;
}

/** The newest mark of each report (marks are append-only; the newest is current). */
export async function currentMarks(db: Db, reportIds: number[]): Promise<Map<number, MarkRow>> {
  const out = new Map<number, MarkRow>();
  if (!reportIds.length) return out;
  const rows = (await db('marks as m')
    .join('exercise_revisions as rv', 'rv.id', 'm.revision_id')
    .whereIn('m.id', db('marks').whereIn('report_id', reportIds).groupBy('report_id').max('id'))
    .select(
      'm.id',
      'm.report_id',
      'm.revision_id',
      'rv.revision_no',
      'm.engine_version',
      'm.points',
      'm.max_points',
      'm.late_penalty_percent',
      'm.total',
      'm.checks_json',
      'm.created_at',
    )) as MarkRow[];
  for (const r of rows) out.set(r.report_id, r);
  return out;
}

export interface AdjustmentRow {
  id: number;
  report_id: number;
  check_id: string;
  points: number;
  reason: string;
  adjusted_by: number;
  adjusted_by_name: string;
  created_at: Date;
}

/** The newest adjustment of each (report, check): the adjustments history is append-only. */
export async function currentAdjustments(db: Db, reportIds: number[]): Promise<Map<number, AdjustmentRow[]>> {
  const out = new Map<number, AdjustmentRow[]>();
  if (!reportIds.length) return out;
  const rows = (await db('adjustments as a')
    .join('users as u', 'u.id', 'a.adjusted_by')
    .whereIn('a.id', db('adjustments').whereIn('report_id', reportIds).groupBy('report_id', 'check_id').max('id'))
    .orderBy('a.id')
    .select('a.id', 'a.report_id', 'a.check_id', 'a.points', 'a.reason', 'a.adjusted_by', 'u.display_name as adjusted_by_name', 'a.created_at')) as AdjustmentRow[];
  for (const r of rows) {
    const list = out.get(r.report_id) ?? [];
    list.push(r);
    out.set(r.report_id, list);
  }
  return out;
}

export async function fileContent(db: Db, fileId: number): Promise<{ content: Buffer; file_name: string; detected_type: string; size_bytes: number } | undefined> {
  return db('stored_files').where({ id: fileId }).first('content', 'file_name', 'detected_type', 'size_bytes');
}

/**
 * Reports of an exercise whose newest mark is not for `revisionId` (or that
 * have none), oldest first: what a re-marking job still has to do.
 */
function needingMarkQuery(db: Db, exerciseId: number, revisionId: number) {
  return db('reports as r')
    .leftJoin(db('marks').select('report_id').max({ last_id: 'id' }).groupBy('report_id').as('lm'), 'lm.report_id', 'r.id')
    .leftJoin('marks as m', 'm.id', 'lm.last_id')
    .where('r.exercise_id', exerciseId)
    .andWhere((w) => w.whereNull('m.id').orWhereNot('m.revision_id', revisionId));
}

export function reportsNeedingMark(db: Db, exerciseId: number, revisionId: number, limit: number): Promise<{ id: number }[]> {
  return needingMarkQuery(db, exerciseId, revisionId).orderBy('r.id').limit(limit).select('r.id');
}

export async function countReportsNeedingMark(db: Db, exerciseId: number, revisionId: number): Promise<number> {
  const row = await needingMarkQuery(db, exerciseId, revisionId).count({ n: 'r.id' }).first();
  return Number(row?.n ?? 0);
}

export async function countReports(db: Db, exerciseId: number): Promise<number> {
  const row = await db('reports').where({ exercise_id: exerciseId }).count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

/** The newest mark's revision of one report, locking the report row (so two markers cannot both mark it). */
export async function lockReportMarkRevision(trx: Db, reportId: number): Promise<number | null> {
  await trx('reports').where({ id: reportId }).forUpdate().first('id');
  const row = await trx('marks').where({ report_id: reportId }).orderBy('id', 'desc').first('revision_id');
  return row ? Number(row.revision_id) : null;
}

/** The newest version of each student's report in an exercise (for similarity). */
export function latestReportsOfExercise(db: Db, exerciseId: number): Promise<ReportRow[]> {
  return reportQuery(db)
    .where('r.exercise_id', exerciseId)
    .whereIn('r.id', db('reports').where({ exercise_id: exerciseId }).groupBy('enrolment_id').max('id'))
    .orderBy('r.id');
}
