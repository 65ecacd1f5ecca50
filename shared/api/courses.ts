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
