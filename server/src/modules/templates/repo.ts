/**
 * Rows the templates module reads: an exercise with its current revision and
 * course, enrolments with the name to print, sections, extensions. No wire
 * shapes here (service.ts makes those). Variants are drawn and stored by the
 * exercises module (ensureVariant).
 */
import type { Knex } from 'knex';
import { enrolmentColumns, type EnrolmentRow } from '../reports/repo';

type Db = Knex | Knex.Transaction;

export interface ExerciseForTemplate {
  id: number;
  course_id: number;
  state: 'draft' | 'published' | 'closed';
  current_revision_id: number | null;
  course_code: string;
  course_title: string;
  revision_id: number | null;
  spec_json: unknown;
  published_at: Date | null;
}

/** The exercise, its course and its current revision (null columns when it has none). */
export function exerciseForTemplate(db: Db, exerciseId: number): Promise<ExerciseForTemplate | undefined> {
  return db('exercises as e')
    .join('courses as c', 'c.id', 'e.course_id')
    .leftJoin('exercise_revisions as r', 'r.id', 'e.current_revision_id')
    .where('e.id', exerciseId)
    .first(
      'e.id',
      'e.course_id',
      'e.state',
      'e.current_revision_id',
      'c.code as course_code',
      'c.title as course_title',
      'r.id as revision_id',
      'r.spec_json',
      'r.published_at',
    );
}

/**
 * An enrolment with the name to print (given and family name from the roster,
 * else the account's display name): the reports module's enrolment row.
 */
export type EnrolmentForTemplate = EnrolmentRow;

export { findEnrolment as enrolmentById, extensionMinutes } from '../reports/repo';

const enrolments = (db: Db) => db('enrolments as en').join('users as u', 'u.id', 'en.user_id');

/** The caller's own enrolment in a course (any status). */
export function ownEnrolment(db: Db, userId: number, courseId: number): Promise<EnrolmentForTemplate | undefined> {
  return enrolments(db).where({ 'en.user_id': userId, 'en.course_id': courseId }).first(enrolmentColumns(db));
}

/** Active students of a section, by student number. */
export function activeEnrolmentsOfSection(db: Db, sectionId: number): Promise<EnrolmentForTemplate[]> {
  return enrolments(db).where({ 'en.section_id': sectionId, 'en.status': 'active' }).orderBy('en.student_number').select(enrolmentColumns(db));
}

export function sectionById(db: Db, sectionId: number): Promise<{ id: number; course_id: number; name: string } | undefined> {
  return db('sections').where({ id: sectionId }).first('id', 'course_id', 'name');
}

export async function isAssistantOfSection(db: Db, userId: number, sectionId: number): Promise<boolean> {
  return Boolean(await db('section_assistants').where({ user_id: userId, section_id: sectionId }).first('section_id'));
}

export interface MyExerciseRow {
  exercise_id: number;
  state: 'published' | 'closed';
  course_id: number;
  course_code: string;
  course_title: string;
  revision_id: number;
  spec_json: unknown;
  enrolment_id: number;
  extension_minutes: number | null;
}

/**
 * Published (and closed) exercises of every course the person is actively
 * enrolled on, with the enrolment and its latest extension.
 */
export function myPublishedExercises(db: Db, userId: number): Promise<MyExerciseRow[]> {
  const latestExtension = db('extensions as x')
    .whereRaw('x.exercise_id = e.id')
    .andWhereRaw('x.enrolment_id = en.id')
    .orderBy('x.id', 'desc')
    .limit(1)
    .select('x.extra_minutes');
  return db('enrolments as en')
    .join('courses as c', 'c.id', 'en.course_id')
    .join('exercises as e', 'e.course_id', 'en.course_id')
    .join('exercise_revisions as r', 'r.id', 'e.current_revision_id')
    .where({ 'en.user_id': userId, 'en.status': 'active' })
    .whereIn('e.state', ['published', 'closed'])
    .whereNotNull('r.published_at')
    .orderBy('e.id')
    .select(
      'e.id as exercise_id',
      'e.state',
      'c.id as course_id',
      'c.code as course_code',
      'c.title as course_title',
      'r.id as revision_id',
      'r.spec_json',
      'en.id as enrolment_id',
      latestExtension.as('extension_minutes'),
    );
}
