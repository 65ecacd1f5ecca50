/**
 * Role and scope checks. Every route states who may call it; the server
 * decides from the database, never from what the client says.
 */
import type { Request, RequestHandler } from 'express';
import type { Knex } from 'knex';
import { forbidden, unauthenticated } from './errors';

export interface SessionUser {
  id: number;
  isAdmin: boolean;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface User extends SessionUser {}
  }
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(unauthenticated());
  next();
};

export const requireAdmin: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(unauthenticated());
  if (!req.user.isAdmin) return next(forbidden('Only department admins can do this.'));
  next();
};

export type CourseRole = 'lecturer' | 'assistant' | 'student';

/** The caller's roles in one course (admins get none here: they pass by site role). */
export async function rolesInCourse(db: Knex, userId: number, courseId: number): Promise<Set<CourseRole>> {
  const [staff, enrolled] = await Promise.all([
    db('course_staff').where({ course_id: courseId, user_id: userId }).select('role'),
    db('enrolments').where({ course_id: courseId, user_id: userId, status: 'active' }).first('id'),
  ]);
  const roles = new Set<CourseRole>(staff.map((r) => r.role as CourseRole));
  if (enrolled) roles.add('student');
  return roles;
}

/** 401 without a session; 403 unless the caller is admin or holds one of `allowed` in the course. */
export async function assertCourseRole(db: Knex, req: Request, courseId: number, allowed: CourseRole[]): Promise<Set<CourseRole>> {
  if (!req.user) throw unauthenticated();
  const roles = await rolesInCourse(db, req.user.id, courseId);
  if (req.user.isAdmin) return roles;
  if (!allowed.some((r) => roles.has(r))) throw forbidden('You do not have this role in this course.');
  return roles;
}
