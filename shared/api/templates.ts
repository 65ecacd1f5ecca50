/**
 * Personal templates and the student's exercise list: what crosses the wire.
 *
 * GET /api/v1/exercises/:exerciseId/template[?enrolmentId=]      → the personal XLSX (a file, not JSON)
 * GET /api/v1/exercises/:exerciseId/sections/:sectionId/templates.zip → every active student's XLSX of a section
 * GET /api/v1/my/exercises                                       → MyExercisesResponse
 */
import { z } from 'zod';

const id = z.coerce.number().int().positive();

export const templateParamsSchema = z.object({ exerciseId: id });
/** staff name the student whose template they want; students leave it out (or give their own) */
export const templateQuerySchema = z.object({ enrolmentId: id.optional() });
export const sectionTemplatesParamsSchema = z.object({ exerciseId: id, sectionId: id });

/** open: before the due moment (with the student's extension and the grace period); late: uploads still taken with a penalty; closed: no more uploads */
export const exerciseWindowSchema = z.enum(['open', 'late', 'closed']);
export type ExerciseWindow = z.infer<typeof exerciseWindowSchema>;

export const variantSummarySchema = z.object({
  /** the stored variant key, e.g. "za=1;zb=2;zeta=1.2" */
  key: z.string(),
  /** the parameters in words, e.g. "Za = 1, Zb = 2, ζ = 1.2" — never an answer */
  text: z.string(),
  /** the same parameters one by one, for a table */
  parameters: z.array(z.object({ name: z.string(), value: z.string() })),
});
export type VariantSummary = z.infer<typeof variantSummarySchema>;

export const myExerciseSchema = z.object({
  exerciseId: z.number().int(),
  title: z.string(),
  course: z.object({ id: z.number().int(), code: z.string(), title: z.string() }),
  /** the model family, e.g. "one-electron" */
  family: z.enum(['one-electron', 'two-electron', 'diatomic', 'huckel']),
  /** the due moment as an instant (ISO 8601, UTC) */
  dueAt: z.string(),
  /** the due moment as the lecturer wrote it, YYYY-MM-DDTHH:MM in `timeZone` */
  dueLocal: z.string(),
  timeZone: z.string(),
  /** the student's own extension, minutes after dueAt (0 when none) */
  extensionMinutes: z.number().int().min(0),
  /** dueAt plus the extension: the student's own due moment */
  effectiveDueAt: z.string(),
  late: z.object({
    graceMinutes: z.number(),
    penaltyPerDayPercent: z.number(),
    capPercent: z.number(),
    /** one sentence, e.g. "10% off per started day late after 15 minutes' grace, at most 50%." */
    summary: z.string(),
  }),
  window: exerciseWindowSchema,
  /** penalty an upload made now would get, in percent of the total */
  penaltyNowPercent: z.number(),
  variant: variantSummarySchema,
  /** GET this to download the personal template */
  templateUrl: z.string(),
});
export type MyExercise = z.infer<typeof myExerciseSchema>;

export const myExercisesResponseSchema = z.object({
  /** server time of the answer, so that "in 2 days" is measured from the same clock */
  now: z.string(),
  exercises: z.array(myExerciseSchema),
});
export type MyExercisesResponse = z.infer<typeof myExercisesResponseSchema>;
