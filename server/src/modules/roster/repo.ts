import type { Knex } from 'knex';
import type { ExistingEnrolment, SectionRef } from './import-plan';

export interface EnrolmentRow {
  id: number;
  user_id: number;
  student_number: string;
  family_name: string | null;
  given_name: string | null;
  email: string | null;
  user_email: string;
  display_name: string;
  oidc_subject: string | null;
  section_id: number | null;
  section_name: string | null;
  status: 'active' | 'withdrawn';
  withdrawn_at: Date | null;
}

/** Enrolments of a course with their account and section; optionally only those in `sectionIds`. */
export function enrolmentsOf(db: Knex | Knex.Transaction, courseId: number, options: { sectionIds?: number[]; ids?: number[] } = {}): Promise<EnrolmentRow[]> {
  const q = db('enrolments as e')
    .join('users as u', 'u.id', 'e.user_id')
    .leftJoin('sections as s', 's.id', 'e.section_id')
    .where('e.course_id', courseId)
    .select(
      'e.id',
      'e.user_id',
      'e.student_number',
      'e.family_name',
      'e.given_name',
      'e.email',
      'u.email as user_email',
      'u.display_name',
      'u.oidc_subject',
      'e.section_id',
      's.name as section_name',
      'e.status',
      'e.withdrawn_at',
    )
    .orderBy([{ column: 'e.family_name' }, { column: 'e.given_name' }, { column: 'e.student_number' }]);
  if (options.sectionIds) q.whereIn('e.section_id', options.sectionIds.length ? options.sectionIds : [-1]);
  if (options.ids) q.whereIn('e.id', options.ids.length ? options.ids : [-1]);
  return q;
}

export function toExisting(r: EnrolmentRow): ExistingEnrolment {
  return {
    id: r.id,
    userId: r.user_id,
    studentNumber: r.student_number,
    familyName: r.family_name,
    givenName: r.given_name,
    email: r.email,
    userEmail: r.user_email,
    sectionId: r.section_id,
    status: r.status,
  };
}

export async function sectionRefs(db: Knex | Knex.Transaction, courseId: number): Promise<SectionRef[]> {
  const rows = await db('sections').where({ course_id: courseId }).select('id', 'name', 'archived', 'capacity');
  return rows.map((r) => ({ id: r.id, name: r.name, archived: Boolean(r.archived), capacity: r.capacity }));
}

/** Active accounts with these e-mails (signed-in accounts win over roster-only ones). */
export async function accountsByEmail(db: Knex | Knex.Transaction, emails: string[]): Promise<Map<string, { id: number; displayName: string }>> {
  const out = new Map<string, { id: number; displayName: string }>();
  for (let i = 0; i < emails.length; i += 500) {
    const rows = await db('users')
      .whereIn('email', emails.slice(i, i + 500))
      .andWhere('active', true)
      .orderByRaw('oidc_subject IS NULL DESC')
      .orderBy('id', 'desc')
      .select('id', 'email', 'display_name');
    // later rows overwrite earlier ones: the last wins, i.e. signed-in first, then the oldest
    for (const r of rows) out.set(String(r.email).toLowerCase(), { id: r.id, displayName: r.display_name });
  }
  return out;
}

export function importsOf(db: Knex, courseId: number) {
  return db('roster_imports as i')
    .leftJoin('users as u', 'u.id', 'i.actor_id')
    .where('i.course_id', courseId)
    .select('i.id', 'i.file_name', 'i.sha256', 'u.display_name as actor_name', 'i.created_at', 'i.summary_json')
    .orderBy('i.id', 'desc')
    .limit(100);
}
