/**
 * Lab sections: list (scoped for assistants), create, edit (including who
 * teaches it), archive and restore. Every change in one transaction, audited.
 */
import type { Knex } from 'knex';
import type { CreateSectionBody, Section, UpdateSectionBody } from '@shared/api/sections';
import { createSectionBodySchema } from '@shared/api/sections';
import { recordAudit } from '../../platform/audit';
import { badRequest, conflict, notFound } from '../../platform/errors';
import { activeCounts, assistantsOf, courseAssistantIds, sectionById, sectionsOf, type SectionRow } from './repo';

const tidy = (s: string) => s.replace(/\s+/g, ' ').trim();

async function toWire(db: Knex | Knex.Transaction, rows: SectionRow[]): Promise<Section[]> {
  const ids = rows.map((r) => r.id);
  const [assistants, counts] = await Promise.all([assistantsOf(db, ids), activeCounts(db, ids)]);
  return rows.map((r) => ({
    id: r.id,
    courseId: r.course_id,
    name: r.name,
    weekday: r.weekday,
    startsAt: r.starts_at,
    endsAt: r.ends_at,
    room: r.room,
    capacity: r.capacity,
    archived: Boolean(r.archived),
    assistants: assistants.filter((a) => a.section_id === r.id).map((a) => ({ userId: a.user_id, displayName: a.display_name, email: a.email })),
    studentCount: counts.get(r.id) ?? 0,
  }));
}

/** All sections (managers) or only `onlyIds` (an assistant's own). */
export async function listSections(db: Knex, courseId: number, onlyIds?: number[]): Promise<Section[]> {
  return toWire(db, await sectionsOf(db, courseId, onlyIds));
}

export async function sectionWire(db: Knex, courseId: number, sectionId: number): Promise<Section> {
  const row = await sectionById(db, courseId, sectionId);
  if (!row) throw notFound(`There is no section ${sectionId} in this course.`);
  return (await toWire(db, [row]))[0];
}

async function assertAssistants(trx: Knex.Transaction, courseId: number, ids: number[]) {
  const unique = [...new Set(ids)];
  const ok = await courseAssistantIds(trx, courseId, unique);
  const strangers = unique.filter((id) => !ok.has(id));
  if (strangers.length) {
    throw badRequest(`Only assistants of this course can teach its sections; person ${strangers.join(', ')} is not one. Add them to the teaching team first.`, [
      { location: 'body', path: 'assistantIds', message: 'Not an assistant of this course.' },
    ]);
  }
  return unique;
}

async function nameFree(trx: Knex.Transaction, courseId: number, name: string, exceptId?: number) {
  const q = trx('sections').where({ course_id: courseId, name });
  if (exceptId) q.whereNot('id', exceptId);
  if (await q.first('id')) throw conflict(`This course already has a section named "${name}".`, [{ location: 'body', path: 'name', message: 'Already used in this course.' }]);
}

export async function createSection(db: Knex, actorId: number, courseId: number, input: CreateSectionBody): Promise<number> {
  const body = createSectionBodySchema.parse(input);
  return db.transaction(async (trx) => {
    const name = tidy(body.name);
    await nameFree(trx, courseId, name);
    const assistants = await assertAssistants(trx, courseId, body.assistantIds);
    const [id] = await trx('sections').insert({
      course_id: courseId,
      name,
      weekday: body.weekday,
      starts_at: body.startsAt,
      ends_at: body.endsAt,
      room: body.room ? tidy(body.room) : null,
      capacity: body.capacity,
    });
    if (assistants.length) await trx('section_assistants').insert(assistants.map((user_id) => ({ section_id: id, user_id })));
    await recordAudit(trx, { actorId, action: 'section.created', entityType: 'section', entityId: id, after: { courseId, ...body, name, assistantIds: assistants } });
    return id;
  });
}

export async function updateSection(db: Knex, actorId: number, courseId: number, sectionId: number, body: UpdateSectionBody): Promise<void> {
  await db.transaction(async (trx) => {
    const row = await trx('sections').where({ course_id: courseId, id: sectionId }).forUpdate().first();
    if (!row) throw notFound(`There is no section ${sectionId} in this course.`);
    const startsAt = body.startsAt !== undefined ? body.startsAt : row.starts_at;
    const endsAt = body.endsAt !== undefined ? body.endsAt : row.ends_at;
    if (startsAt && endsAt && endsAt <= startsAt) throw badRequest(`The section must end after it starts (${startsAt}–${endsAt}).`, [{ location: 'body', path: 'endsAt', message: 'Ends before it starts.' }]);
    const changes: Record<string, unknown> = {};
    if (body.name !== undefined) {
      changes.name = tidy(body.name);
      await nameFree(trx, courseId, changes.name as string, sectionId);
    }
    if (body.weekday !== undefined) changes.weekday = body.weekday;
    if (body.startsAt !== undefined) changes.starts_at = body.startsAt;
    if (body.endsAt !== undefined) changes.ends_at = body.endsAt;
    if (body.room !== undefined) changes.room = body.room ? tidy(body.room) : null;
    if (body.capacity !== undefined) changes.capacity = body.capacity;
    const before: Record<string, unknown> = Object.fromEntries(Object.keys(changes).map((k) => [k, row[k]]));
    if (Object.keys(changes).length) await trx('sections').where({ id: sectionId }).update({ ...changes, updated_at: new Date() });
    if (body.assistantIds !== undefined) {
      const assistants = await assertAssistants(trx, courseId, body.assistantIds);
      const current = (await trx('section_assistants').where({ section_id: sectionId }).select('user_id')).map((r) => r.user_id as number);
      before.assistantIds = current;
      changes.assistantIds = assistants;
      const gone = current.filter((id) => !assistants.includes(id));
      const added = assistants.filter((id) => !current.includes(id));
      if (gone.length) await trx('section_assistants').where({ section_id: sectionId }).whereIn('user_id', gone).delete();
      if (added.length) await trx('section_assistants').insert(added.map((user_id) => ({ section_id: sectionId, user_id })));
    }
    await recordAudit(trx, { actorId, action: 'section.updated', entityType: 'section', entityId: sectionId, before, after: changes });
  });
}

/** Archiving needs the section empty of active students: move them first. */
export async function setSectionArchived(db: Knex, actorId: number, courseId: number, sectionId: number, archived: boolean): Promise<void> {
  await db.transaction(async (trx) => {
    const row = await trx('sections').where({ course_id: courseId, id: sectionId }).forUpdate().first();
    if (!row) throw notFound(`There is no section ${sectionId} in this course.`);
    if (Boolean(row.archived) === archived) return;
    if (archived) {
      const active = await trx('enrolments').where({ section_id: sectionId, status: 'active' }).count({ n: '*' }).first();
      const n = Number(active?.n ?? 0);
      if (n > 0) throw conflict(`Section "${row.name}" still has ${n} active ${n === 1 ? 'student' : 'students'}; move them to another section before archiving it.`);
    }
    await trx('sections').where({ id: sectionId }).update({ archived, updated_at: new Date() });
    await recordAudit(trx, { actorId, action: archived ? 'section.archived' : 'section.restored', entityType: 'section', entityId: sectionId, before: { archived: !archived }, after: { archived } });
  });
}
