/**
 * Rows of exercises, exercise_revisions, variants and the enrolments they are
 * drawn for. No wire shapes here (service.ts makes those).
 */
import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export interface ExerciseRow {
  id: number;
  course_id: number;
  state: 'draft' | 'published' | 'closed';
  current_revision_id: number | null;
  created_by: number;
  created_at: Date;
  updated_at: Date;
}

export interface RevisionRow {
  id: number;
  exercise_id: number;
  revision_no: number;
  spec_json: unknown;
  engine_version: string;
  created_by: number;
  created_by_name: string;
  created_at: Date;
  published_at: Date | null;
}

export interface VariantRow {
  id: number;
  revision_id: number;
  enrolment_id: number;
  variant_key: string;
  variant_json: unknown;
  template_token: string;
}

export interface EnrolmentRow {
  id: number;
  course_id: number;
  student_number: string;
  status: 'active' | 'withdrawn';
  name: string;
  section: string | null;
  section_id: number | null;
}

/** mysql2 gives JSON columns back parsed on MariaDB only sometimes (JSON is LONGTEXT there). */
export function parseJson<T>(value: unknown): T {
  if (typeof value === 'string') return JSON.parse(value) as T;
  if (Buffer.isBuffer(value)) return JSON.parse(value.toString('utf8')) as T;
  return value as T;
}

export function findExercise(db: Db, id: number, forUpdate = false): Promise<ExerciseRow | undefined> {
  const q = db('exercises').where({ id }).first();
  return (forUpdate ? q.forUpdate() : q) as Promise<ExerciseRow | undefined>;
}

export function courseOf(db: Db, courseId: number): Promise<{ id: number; code: string; title: string } | undefined> {
  return db('courses').where({ id: courseId }).first('id', 'code', 'title');
}

const revisionColumns = ['r.id', 'r.exercise_id', 'r.revision_no', 'r.spec_json', 'r.engine_version', 'r.created_by', 'u.display_name as created_by_name', 'r.created_at', 'r.published_at'];

export function revisionsOf(db: Db, exerciseId: number): Promise<RevisionRow[]> {
  return db('exercise_revisions as r').join('users as u', 'u.id', 'r.created_by').where('r.exercise_id', exerciseId).orderBy('r.revision_no').select(revisionColumns);
}

export function findRevision(db: Db, revisionId: number): Promise<RevisionRow | undefined> {
  return db('exercise_revisions as r').join('users as u', 'u.id', 'r.created_by').where('r.id', revisionId).first(revisionColumns);
}

/** The current revision of every exercise of a course (oldest exercise first), filtered by state. */
export function exercisesOfCourse(db: Db, courseId: number, states: ExerciseRow['state'][]) {
  return db('exercises as e')
    .join('exercise_revisions as r', 'r.id', 'e.current_revision_id')
    .where('e.course_id', courseId)
    .whereIn('e.state', states)
    .orderBy('e.id')
    .select('e.id', 'e.course_id', 'e.state', 'e.current_revision_id', 'e.updated_at', 'r.revision_no', 'r.spec_json', 'r.published_at') as Promise<
    (Pick<ExerciseRow, 'id' | 'course_id' | 'state' | 'current_revision_id' | 'updated_at'> & Pick<RevisionRow, 'revision_no' | 'spec_json' | 'published_at'>)[]
  >;
}

export async function countActiveStudents(db: Db, courseId: number): Promise<number> {
  const row = await db('enrolments').where({ course_id: courseId, status: 'active' }).count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

/** Per revision: how many students hold a variant, and how many distinct variants there are. */
export async function variantCounts(db: Db, revisionIds: number[]): Promise<Map<number, { withVariant: number; distinct: number }>> {
  const out = new Map<number, { withVariant: number; distinct: number }>();
  if (!revisionIds.length) return out;
  const rows = (await db('variants')
    .whereIn('revision_id', revisionIds)
    .groupBy('revision_id')
    .select('revision_id', db.raw('COUNT(*) as n'), db.raw('COUNT(DISTINCT variant_key) as d'))) as unknown as { revision_id: number; n: number | string; d: number | string }[];
  for (const r of rows) out.set(r.revision_id, { withVariant: Number(r.n), distinct: Number(r.d) });
  return out;
}

/** Per exercise: how many students have uploaded at least one report. */
export async function reportedCounts(db: Db, exerciseIds: number[]): Promise<Map<number, number>> {
  const out = new Map<number, number>();
  if (!exerciseIds.length) return out;
  const rows = (await db('reports')
    .whereIn('exercise_id', exerciseIds)
    .groupBy('exercise_id')
    .select('exercise_id', db.raw('COUNT(DISTINCT enrolment_id) as n'))) as unknown as { exercise_id: number; n: number | string }[];
  for (const r of rows) out.set(r.exercise_id, Number(r.n));
  return out;
}

export async function reportCount(db: Db, exerciseId: number): Promise<number> {
  const row = await db('reports').where({ exercise_id: exerciseId }).count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

const enrolmentColumns = (db: Db) => [
  'en.id',
  'en.course_id',
  'en.student_number',
  'en.status',
  'en.section_id',
  's.name as section',
  db.raw("COALESCE(NULLIF(TRIM(CONCAT_WS(' ', en.given_name, en.family_name)), ''), u.display_name) as name"),
];

function enrolmentQuery(db: Db) {
  return db('enrolments as en').join('users as u', 'u.id', 'en.user_id').leftJoin('sections as s', 's.id', 'en.section_id');
}

export function activeEnrolments(db: Db, courseId: number): Promise<EnrolmentRow[]> {
  return enrolmentQuery(db).where({ 'en.course_id': courseId, 'en.status': 'active' }).orderBy('en.id').select(enrolmentColumns(db));
}

export function enrolmentsByIds(db: Db, ids: number[]): Promise<EnrolmentRow[]> {
  if (!ids.length) return Promise.resolve([]);
  return enrolmentQuery(db).whereIn('en.id', ids).orderBy('en.id').select(enrolmentColumns(db));
}

export function findEnrolment(db: Db, id: number): Promise<EnrolmentRow | undefined> {
  return enrolmentQuery(db).where('en.id', id).first(enrolmentColumns(db));
}

export function enrolmentByStudentNumber(db: Db, courseId: number, studentNumber: string): Promise<EnrolmentRow | undefined> {
  return enrolmentQuery(db).where({ 'en.course_id': courseId, 'en.student_number': studentNumber }).first(enrolmentColumns(db));
}

/** Section ids an assistant is assigned to within a course. */
export async function assistantSectionIds(db: Db, courseId: number, userId: number): Promise<Set<number>> {
  const rows = await db('section_assistants as sa').join('sections as s', 's.id', 'sa.section_id').where({ 's.course_id': courseId, 'sa.user_id': userId }).select('s.id');
  return new Set(rows.map((r) => r.id as number));
}

export function variantsOfRevision(db: Db, revisionId: number): Promise<VariantRow[]> {
  return db('variants').where({ revision_id: revisionId }).orderBy('id').select('id', 'revision_id', 'enrolment_id', 'variant_key', 'variant_json', 'template_token');
}

export function findVariant(db: Db, revisionId: number, enrolmentId: number): Promise<VariantRow | undefined> {
  return db('variants').where({ revision_id: revisionId, enrolment_id: enrolmentId }).first('id', 'revision_id', 'enrolment_id', 'variant_key', 'variant_json', 'template_token');
}
