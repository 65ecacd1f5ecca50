import { z } from 'zod';

/** ISO 8601 weekday numbers, 1 = Monday … 7 = Sunday. */
export const WEEKDAY_NAMES = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'] as const;

const clock = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Expected a time as HH:MM (24-hour clock).');

export const sectionAssistantSchema = z.object({ userId: z.number().int(), displayName: z.string(), email: z.string() });

/** One lab section of a course. */
export const sectionSchema = z.object({
  id: z.number().int(),
  courseId: z.number().int(),
  name: z.string(),
  weekday: z.number().int().min(1).max(7).nullable(),
  startsAt: z.string().nullable(),
  endsAt: z.string().nullable(),
  room: z.string().nullable(),
  capacity: z.number().int().nullable(),
  archived: z.boolean(),
  assistants: z.array(sectionAssistantSchema),
  /** active students placed in this section */
  studentCount: z.number().int(),
});
export type Section = z.infer<typeof sectionSchema>;

/**
 * GET /api/v1/courses/:courseId/sections → { sections }: lecturers and admins
 * see every section (archived ones too), assistants only those they are assigned to.
 */
export const sectionsResponseSchema = z.object({ sections: z.array(sectionSchema) });

const sectionFields = z.object({
  name: z.string().trim().min(1, 'Give the section a name.').max(80),
  weekday: z.number().int().min(1).max(7).nullable(),
  startsAt: clock.nullable(),
  endsAt: clock.nullable(),
  room: z.string().trim().max(80).nullable(),
  capacity: z.number().int().min(1, 'Capacity is at least 1.').max(2000).nullable(),
  /** user ids of the course's assistants who teach this section */
  assistantIds: z.array(z.number().int().positive()).max(20),
});

const timesInOrder = (b: { startsAt?: string | null; endsAt?: string | null }) => !b.startsAt || !b.endsAt || b.endsAt > b.startsAt;
const timeOrder = { path: ['endsAt'], message: 'The section must end after it starts.' };

/** POST /api/v1/courses/:courseId/sections (lecturers, admins) → 201 Section. */
export const createSectionBodySchema = sectionFields
  .extend({
    weekday: sectionFields.shape.weekday.default(null),
    startsAt: sectionFields.shape.startsAt.default(null),
    endsAt: sectionFields.shape.endsAt.default(null),
    room: sectionFields.shape.room.default(null),
    capacity: sectionFields.shape.capacity.default(null),
    assistantIds: sectionFields.shape.assistantIds.default([]),
  })
  .refine(timesInOrder, timeOrder);
export type CreateSectionBody = z.input<typeof createSectionBodySchema>;

/**
 * PATCH /api/v1/courses/:courseId/sections/:sectionId (lecturers, admins) → Section.
 * Archive and restore: POST .../archive, .../restore (archiving needs the section empty of active students).
 */
export const updateSectionBodySchema = sectionFields
  .partial()
  .refine((b) => Object.keys(b).length > 0, 'Send at least one field.')
  .refine(timesInOrder, timeOrder);
export type UpdateSectionBody = z.infer<typeof updateSectionBodySchema>;
