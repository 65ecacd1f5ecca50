/**
 * Who may upload for, and read the reports of, which student: the student
 * themselves; assistants for the students of their sections; lecturers of the
 * course and admins for everyone in it.
 */
import type { Knex } from 'knex';
import { rolesInCourse, type CourseRole } from '../../platform/access';
import { badRequest, forbidden, notFound, unauthenticated } from '../../platform/errors';
import { assistantSectionIds, enrolmentOfUser, findEnrolment, type EnrolmentRow } from './repo';

export interface Caller {
  id: number;
  isAdmin: boolean;
}

export interface CourseAccess {
  roles: Set<CourseRole>;
  /** lecturer of the course or admin: every student */
  allStudents: boolean;
  /** assistant: the students of these sections */
  sections: Set<number>;
  /** the caller's own enrolment in the course, if any */
  ownEnrolment: EnrolmentRow | undefined;
  isStaff: boolean;
}

export async function courseAccess(db: Knex, caller: Caller | undefined, courseId: number): Promise<CourseAccess> {
  if (!caller) throw unauthenticated();
  const roles = await rolesInCourse(db, caller.id, courseId);
  const allStudents = caller.isAdmin || roles.has('lecturer');
  const sections = roles.has('assistant') && !allStudents ? await assistantSectionIds(db, courseId, caller.id) : new Set<number>();
  const ownEnrolment = roles.has('student') ? await enrolmentOfUser(db, courseId, caller.id) : undefined;
  return { roles, allStudents, sections, ownEnrolment, isStaff: allStudents || roles.has('assistant') };
}

/** Staff who may act for this student (lecturers and admins: all; assistants: their sections). */
export function staffMayActFor(access: CourseAccess, enrolment: Pick<EnrolmentRow, 'section_id'>): boolean {
  if (access.allStudents) return true;
  return access.roles.has('assistant') && enrolment.section_id !== null && access.sections.has(enrolment.section_id);
}

/**
 * The student a request is about: `enrolmentId` when staff name one (checked
 * against their scope), otherwise the caller's own enrolment. 403 for anyone
 * else; 400 when staff name nobody.
 */
export async function targetEnrolment(
  db: Knex,
  access: CourseAccess,
  courseId: number,
  enrolmentId: number | undefined,
): Promise<{ enrolment: EnrolmentRow; onBehalf: boolean }> {
  if (enrolmentId === undefined) {
    if (access.ownEnrolment) return { enrolment: access.ownEnrolment, onBehalf: false };
    if (access.isStaff) throw badRequest('Say which student this is for: add ?enrolmentId= to the address.');
    throw forbidden('You are not enrolled on this course.');
  }
  if (access.ownEnrolment && access.ownEnrolment.id === enrolmentId) return { enrolment: access.ownEnrolment, onBehalf: false };
  if (!access.isStaff) throw forbidden('Students can only upload and see their own reports.');
  const enrolment = await findEnrolment(db, enrolmentId);
  if (!enrolment || enrolment.course_id !== courseId) throw notFound(`Enrolment ${enrolmentId} is not on this course.`);
  if (!staffMayActFor(access, enrolment)) throw forbidden('This student is not in one of your sections.');
  return { enrolment, onBehalf: true };
}
