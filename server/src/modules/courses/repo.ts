import type { Knex } from 'knex';

export interface CourseRow {
  id: number;
  code: string;
  title: string;
  archived: boolean;
  term_id: number;
  term_name: string;
  starts_on: Date;
  ends_on: Date;
}

const courseColumns = ['c.id', 'c.code', 'c.title', 'c.archived', 't.id as term_id', 't.name as term_name', 't.starts_on', 't.ends_on'];

/** Courses visible to a person: all for admins; otherwise where they are staff or actively enrolled. */
export function visibleCourses(db: Knex, userId: number, isAdmin: boolean): Promise<CourseRow[]> {
  const q = db('courses as c')
    .join('terms as t', 't.id', 'c.term_id')
    .select(courseColumns)
    .orderBy([{ column: 't.starts_on', order: 'desc' }, { column: 'c.code' }]);
  if (!isAdmin) {
    q.where((w) =>
      w
        .whereIn('c.id', db('course_staff').where('user_id', userId).select('course_id'))
        .orWhereIn('c.id', db('enrolments').where({ user_id: userId, status: 'active' }).select('course_id')),
    );
  }
  return q;
}

export function courseById(db: Knex | Knex.Transaction, id: number): Promise<CourseRow | undefined> {
  return db('courses as c').join('terms as t', 't.id', 'c.term_id').where('c.id', id).first(courseColumns);
}

export async function lecturersOf(db: Knex, courseIds: number[]) {
  if (!courseIds.length) return [];
  return db('course_staff as s')
    .join('users as u', 'u.id', 's.user_id')
    .whereIn('s.course_id', courseIds)
    .andWhere('s.role', 'lecturer')
    .select('s.course_id', 'u.id', 'u.display_name')
    .orderBy('u.display_name');
}

export async function studentCounts(db: Knex, courseIds: number[]) {
  if (!courseIds.length) return [];
  const rows = await db('enrolments').whereIn('course_id', courseIds).andWhere('status', 'active').groupBy('course_id').select('course_id').count({ n: '*' });
  return rows as unknown as { course_id: number; n: number | string }[];
}

export async function myRoles(db: Knex, userId: number, courseIds: number[]) {
  if (!courseIds.length) return [];
  const staff = await db('course_staff').where('user_id', userId).whereIn('course_id', courseIds).select('course_id', 'role');
  const students = await db('enrolments').where({ user_id: userId, status: 'active' }).whereIn('course_id', courseIds).select('course_id');
  return [...staff, ...students.map((s) => ({ course_id: s.course_id, role: 'student' }))] as { course_id: number; role: string }[];
}

export interface StaffRow {
  user_id: number;
  display_name: string;
  email: string;
  role: 'lecturer' | 'assistant';
}

export function staffOf(db: Knex | Knex.Transaction, courseId: number): Promise<StaffRow[]> {
  return db('course_staff as s')
    .join('users as u', 'u.id', 's.user_id')
    .where('s.course_id', courseId)
    .select('s.user_id', 'u.display_name', 'u.email', 's.role')
    .orderBy([{ column: 's.role', order: 'desc' }, { column: 'u.display_name' }]);
}

export async function sectionCount(db: Knex, courseId: number): Promise<number> {
  const row = await db('sections').where({ course_id: courseId, archived: false }).count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

/** An active account by e-mail (case-insensitive by the column's collation); signed-in accounts first. */
export function personByEmail(db: Knex | Knex.Transaction, email: string) {
  return db('users')
    .where({ email, active: true })
    .orderByRaw('oidc_subject IS NULL')
    .orderBy('id')
    .first('id', 'display_name', 'email');
}

export function listTerms(db: Knex) {
  return db('terms').select('id', 'name', 'starts_on', 'ends_on').orderBy('starts_on', 'desc');
}
