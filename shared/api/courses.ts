import { z } from 'zod';
import { courseRoleSchema } from './session';

/** GET /api/v1/courses → the courses the caller may see (admin: all; staff: theirs; student: enrolled). */
export const courseSummarySchema = z.object({
  id: z.number().int(),
  code: z.string(),
  title: z.string(),
  term: z.object({ id: z.number().int(), name: z.string(), startsOn: z.string(), endsOn: z.string() }),
  myRole: courseRoleSchema.nullable(),
  lecturers: z.array(z.object({ id: z.number().int(), displayName: z.string() })),
  studentCount: z.number().int(),
  archived: z.boolean(),
});
export type CourseSummary = z.infer<typeof courseSummarySchema>;
export const coursesResponseSchema = z.object({ courses: z.array(courseSummarySchema) });

/* ---------- terms ---------- */

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Expected a date as YYYY-MM-DD.');

/** GET /api/v1/terms (admins and lecturers) → { terms: Term[] }, newest first. */
export const termSchema = z.object({ id: z.number().int(), name: z.string(), startsOn: z.string(), endsOn: z.string() });
export type Term = z.infer<typeof termSchema>;
export const termsResponseSchema = z.object({ terms: z.array(termSchema) });

/** POST /api/v1/terms (admin only) → 201 Term. */
export const createTermBodySchema = z
  .object({
    name: z.string().trim().min(1, 'Give the term a name.').max(100),
    startsOn: isoDate,
    endsOn: isoDate,
  })
  .refine((t) => t.endsOn > t.startsOn, { path: ['endsOn'], message: 'The term must end after it starts.' });
export type CreateTermBody = z.infer<typeof createTermBodySchema>;

/* ---------- courses ---------- */

export const courseCodeSchema = z
  .string()
  .trim()
  .min(1, 'Give the course a code.')
  .max(32, 'A course code has at most 32 characters.')
  .regex(/^[\p{L}\p{N}][\p{L}\p{N} .\-/]*$/u, 'A course code uses letters, digits, spaces, dots, hyphens and slashes.');
export const courseTitleSchema = z.string().trim().min(1, 'Give the course a title.').max(200);
export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(320)
  .regex(/^[^\s@]+@[^\s@]+\.[^\s@]+$/, 'Expected an e-mail address like name@example.org.');

/**
 * POST /api/v1/courses (admins and lecturers) → 201 CourseDetail. The creator
 * becomes a lecturer of the course; an admin may name the lecturers instead
 * (`lecturerEmails`, people who already have an account).
 */
export const createCourseBodySchema = z.object({
  code: courseCodeSchema,
  title: courseTitleSchema,
  termId: z.number().int().positive(),
  lecturerEmails: z.array(emailSchema).max(10).optional(),
});
export type CreateCourseBody = z.infer<typeof createCourseBodySchema>;

/** PATCH /api/v1/courses/:courseId (lecturers of the course, admins) → CourseDetail. */
export const updateCourseBodySchema = z
  .object({ code: courseCodeSchema, title: courseTitleSchema, termId: z.number().int().positive() })
  .partial()
  .refine((b) => Object.keys(b).length > 0, 'Send at least one of code, title, termId.');
export type UpdateCourseBody = z.infer<typeof updateCourseBodySchema>;

export const staffRoleSchema = z.enum(['lecturer', 'assistant']);
export type StaffRole = z.infer<typeof staffRoleSchema>;

export const staffMemberSchema = z.object({
  userId: z.number().int(),
  displayName: z.string(),
  email: z.string(),
  role: staffRoleSchema,
});
export type StaffMember = z.infer<typeof staffMemberSchema>;

/**
 * GET /api/v1/courses/:courseId → CourseDetail (lecturers, assistants and
 * admins; students of the course get the summary with an empty `staff` list
 * and no permissions). Archiving: POST .../archive and .../restore.
 */
export const courseDetailSchema = courseSummarySchema.extend({
  staff: z.array(staffMemberSchema),
  sectionCount: z.number().int(),
  permissions: z.object({
    /** edit code/title/term, teaching team, archive */
    editCourse: z.boolean(),
    /** create, edit, archive sections */
    manageSections: z.boolean(),
    /** import, add, move, withdraw */
    manageRoster: z.boolean(),
    /** read the roster (assistants: the students of their sections) */
    viewRoster: z.boolean(),
  }),
});
export type CourseDetail = z.infer<typeof courseDetailSchema>;

/** POST /api/v1/courses/:courseId/staff { email, role } → CourseDetail; the person must already have an account. */
export const addStaffBodySchema = z.object({ email: emailSchema, role: staffRoleSchema });
export type AddStaffBody = z.infer<typeof addStaffBodySchema>;
/** DELETE /api/v1/courses/:courseId/staff/:userId/:role → CourseDetail; the last lecturer cannot be removed. */
