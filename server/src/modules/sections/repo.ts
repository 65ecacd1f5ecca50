import type { Knex } from 'knex';

export interface SectionRow {
  id: number;
  course_id: number;
  name: string;
  weekday: number | null;
  starts_at: string | null;
  ends_at: string | null;
  room: string | null;
  capacity: number | null;
  archived: boolean;
}

/** Sections of a course, optionally only the given ids, ordered by weekday, time and name. */
export function sectionsOf(db: Knex | Knex.Transaction, courseId: number, onlyIds?: number[]): Promise<SectionRow[]> {
  const q = db('sections')
    .where({ course_id: courseId })
    .select('id', 'course_id', 'name', 'weekday', 'starts_at', 'ends_at', 'room', 'capacity', 'archived')
    .orderByRaw('archived, weekday IS NULL, weekday, starts_at, name');
  if (onlyIds) q.whereIn('id', onlyIds.length ? onlyIds : [-1]);
  return q;
}

export function sectionById(db: Knex | Knex.Transaction, courseId: number, id: number): Promise<SectionRow | undefined> {
  return db('sections').where({ course_id: courseId, id }).first();
}

export async function assistantsOf(db: Knex | Knex.Transaction, sectionIds: number[]) {
  if (!sectionIds.length) return [];
  return db('section_assistants as sa')
    .join('users as u', 'u.id', 'sa.user_id')
    .whereIn('sa.section_id', sectionIds)
    .select('sa.section_id', 'u.id as user_id', 'u.display_name', 'u.email')
    .orderBy('u.display_name') as Promise<{ section_id: number; user_id: number; display_name: string; email: string }[]>;
}

export async function activeCounts(db: Knex | Knex.Transaction, sectionIds: number[]) {
  if (!sectionIds.length) return new Map<number, number>();
  const rows = (await db('enrolments').whereIn('section_id', sectionIds).andWhere('status', 'active').groupBy('section_id').select('section_id').count({ n: '*' })) as unknown as { section_id: number; n: number | string }[];
  return new Map(rows.map((r) => [r.section_id, Number(r.n)]));
}

/** User ids among `ids` that are assistants of the course. */
export async function courseAssistantIds(db: Knex | Knex.Transaction, courseId: number, ids: number[]): Promise<Set<number>> {
  if (!ids.length) return new Set();
  const rows = await db('course_staff').where({ course_id: courseId, role: 'assistant' }).whereIn('user_id', ids).select('user_id');
  return new Set(rows.map((r) => r.user_id as number));
}
