/**
 * Course scope for the courses, sections and roster modules: who may do what
 * to which course, decided from the database on every request.
 */
import type { Request } from 'express';
import type { Knex } from 'knex';
import { assertCourseRole, type CourseRole } from '../../platform/access';
import { conflict, forbidden, notFound, unauthenticated } from '../../platform/errors';
import { courseById, type CourseRow } from './repo';

export interface CourseAccess {
  course: CourseRow;
  roles: Set<CourseRole>;
  isAdmin: boolean;
  /** lecturers and admins manage the course; assistants and students only read parts of it */
  manages: boolean;
}

/** 401/403 unless the caller is admin or holds one of `allowed`; then 404 if the course does not exist. */
export async function courseAccess(db: Knex, req: Request, courseId: number, allowed: CourseRole[]): Promise<CourseAccess> {
  const roles = await assertCourseRole(db, req, courseId, allowed);
  const course = await courseById(db, courseId);
  if (!course) throw notFound(`There is no course ${courseId}.`);
  const isAdmin = Boolean(req.user!.isAdmin);
  return { course, roles, isAdmin, manages: isAdmin || roles.has('lecturer') };
}

/** Lecturers of the course and admins only. */
export const managerAccess = (db: Knex, req: Request, courseId: number) => courseAccess(db, req, courseId, ['lecturer']);

/** Sections and rosters of an archived course are frozen until it is restored. */
export function assertNotArchived(course: CourseRow): void {
  if (course.archived) throw conflict(`${course.code} is archived; restore it before changing its sections or roster.`);
}

/** The sections of a course an assistant is assigned to. */
export async function assistantSectionIds(db: Knex | Knex.Transaction, userId: number, courseId: number): Promise<number[]> {
  const rows = await db('section_assistants as sa').join('sections as s', 's.id', 'sa.section_id').where({ 'sa.user_id': userId, 's.course_id': courseId }).select('s.id');
  return rows.map((r) => r.id as number);
}

/** Admins, and people who are lecturer on at least one course, may create courses and read the term list. */
export async function assertMayCreateCourses(db: Knex, req: Request): Promise<void> {
  if (!req.user) throw unauthenticated();
  if (req.user.isAdmin) return;
  const lecturing = await db('course_staff').where({ user_id: req.user.id, role: 'lecturer' }).first('course_id');
  if (!lecturing) throw forbidden('Only lecturers and department admins can do this.');
}
