import type { Knex } from 'knex';

export interface UserRow {
  id: number;
  oidc_issuer: string;
  oidc_subject: string;
  email: string;
  display_name: string;
  active: boolean;
  last_sign_in_at: Date | null;
  created_at: Date;
}

export function findUserById(db: Knex, id: number): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ id }).first();
}

export function findUserBySubject(db: Knex | Knex.Transaction, issuer: string, subject: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ oidc_issuer: issuer, oidc_subject: subject }).first();
}

export async function siteRolesOf(db: Knex, userId: number): Promise<string[]> {
  const rows = await db('user_site_roles').where({ user_id: userId }).select('role');
  return rows.map((r) => r.role as string);
}

export interface CourseRoleRow {
  course_id: number;
  code: string;
  title: string;
  role: 'lecturer' | 'assistant' | 'student';
}

/** Every course the person teaches on (lecturer/assistant) or is actively enrolled in (student). */
export async function courseRolesOf(db: Knex, userId: number): Promise<CourseRoleRow[]> {
  const staff = db('course_staff as s')
    .join('courses as c', 'c.id', 's.course_id')
    .where('s.user_id', userId)
    .select('c.id as course_id', 'c.code', 'c.title', 's.role');
  const students = db('enrolments as e')
    .join('courses as c', 'c.id', 'e.course_id')
    .where({ 'e.user_id': userId, 'e.status': 'active' })
    .select('c.id as course_id', 'c.code', 'c.title', db.raw("'student' as role"));
  const rows = (await staff.unionAll(students)) as CourseRoleRow[];
  return rows.sort((a, b) => a.code.localeCompare(b.code) || a.role.localeCompare(b.role));
}
