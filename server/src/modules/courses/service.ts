/**
 * Courses and terms: rows → wire shapes, and the state changes (create, edit,
 * archive, teaching team), each in one transaction with its audit entry.
 */
import type { Knex } from 'knex';
import type { AddStaffBody, CourseDetail, CourseSummary, CreateCourseBody, CreateTermBody, StaffRole, Term, UpdateCourseBody } from '@shared/api/courses';
import { recordAudit } from '../../platform/audit';
import { badRequest, conflict, notFound } from '../../platform/errors';
import { courseById, lecturersOf, listTerms, myRoles, personByEmail, sectionCount, staffOf, studentCounts, visibleCourses, type CourseRow } from './repo';
import type { CourseAccess } from './scope';

const day = (d: Date | string) => (d instanceof Date ? d.toISOString().slice(0, 10) : String(d).slice(0, 10));
const rank: Record<string, number> = { lecturer: 0, assistant: 1, student: 2 };
const tidy = (s: string) => s.replace(/\s+/g, ' ').trim();

async function summarize(db: Knex, user: { id: number }, rows: CourseRow[]): Promise<CourseSummary[]> {
  const ids = rows.map((r) => r.id);
  const [lecturers, counts, roles] = await Promise.all([lecturersOf(db, ids), studentCounts(db, ids), myRoles(db, user.id, ids)]);
  return rows.map((r) => {
    const mine = roles.filter((x) => x.course_id === r.id).sort((a, b) => rank[a.role] - rank[b.role]);
    return {
      id: r.id,
      code: r.code,
      title: r.title,
      term: { id: r.term_id, name: r.term_name, startsOn: day(r.starts_on), endsOn: day(r.ends_on) },
      myRole: (mine[0]?.role as CourseSummary['myRole']) ?? null,
      lecturers: lecturers.filter((l) => l.course_id === r.id).map((l) => ({ id: l.id, displayName: l.display_name })),
      studentCount: Number(counts.find((c) => c.course_id === r.id)?.n ?? 0),
      archived: Boolean(r.archived),
    };
  });
}

export async function coursesFor(db: Knex, user: { id: number; isAdmin: boolean }): Promise<CourseSummary[]> {
  return summarize(db, user, await visibleCourses(db, user.id, user.isAdmin));
}

/** One course as the caller may see it: staff get the teaching team and their permissions; students the summary. */
export async function courseDetail(db: Knex, userId: number, access: CourseAccess): Promise<CourseDetail> {
  const course = (await courseById(db, access.course.id))!;
  const [summary] = await summarize(db, { id: userId }, [course]);
  const staffView = access.manages || access.roles.has('assistant');
  const [staff, sections] = staffView ? await Promise.all([staffOf(db, course.id), sectionCount(db, course.id)]) : [[], 0];
  const live = !course.archived;
  return {
    ...summary,
    staff: staff.map((s) => ({ userId: s.user_id, displayName: s.display_name, email: s.email, role: s.role })),
    sectionCount: sections,
    permissions: {
      editCourse: access.manages,
      manageSections: access.manages && live,
      manageRoster: access.manages && live,
      viewRoster: access.manages || access.roles.has('assistant'),
    },
  };
}

function termOf(r: { id: number; name: string; starts_on: Date | string; ends_on: Date | string }): Term {
  return { id: r.id, name: r.name, startsOn: day(r.starts_on), endsOn: day(r.ends_on) };
}

export async function terms(db: Knex): Promise<Term[]> {
  return (await listTerms(db)).map(termOf);
}

const isDuplicate = (e: unknown) => (e as { code?: string }).code === 'ER_DUP_ENTRY';

export async function createTerm(db: Knex, actorId: number, body: CreateTermBody): Promise<Term> {
  return db.transaction(async (trx) => {
    const name = tidy(body.name);
    if (await trx('terms').where({ name }).first('id')) throw conflict(`A term named "${name}" already exists.`);
    const [id] = await trx('terms').insert({ name, starts_on: body.startsOn, ends_on: body.endsOn });
    await recordAudit(trx, { actorId, action: 'term.created', entityType: 'term', entityId: id, after: { name, startsOn: body.startsOn, endsOn: body.endsOn } });
    return termOf((await trx('terms').where({ id }).first())!);
  });
}

async function termOr400(trx: Knex.Transaction, termId: number) {
  const term = await trx('terms').where({ id: termId }).first('id', 'name');
  if (!term) throw badRequest(`There is no term ${termId}; choose one from the term list.`, [{ location: 'body', path: 'termId', message: 'Unknown term.' }]);
  return term as { id: number; name: string };
}

async function codeFree(trx: Knex.Transaction, termId: number, code: string, termName: string, exceptId?: number) {
  const q = trx('courses').where({ term_id: termId, code });
  if (exceptId) q.whereNot('id', exceptId);
  if (await q.first('id')) throw conflict(`${code} already exists in ${termName}.`, [{ location: 'body', path: 'code', message: 'Already used in this term.' }]);
}

/** The creator becomes a lecturer, except an admin who names the lecturers by e-mail. */
export async function createCourse(db: Knex, actor: { id: number; isAdmin: boolean }, body: CreateCourseBody): Promise<number> {
  return db.transaction(async (trx) => {
    const term = await termOr400(trx, body.termId);
    const code = tidy(body.code);
    await codeFree(trx, term.id, code, term.name);
    const lecturerIds = new Set<number>();
    for (const email of body.lecturerEmails ?? []) {
      const person = await personByEmail(trx, email);
      if (!person) throw badRequest(`No one with the e-mail ${email} has a Bondmark account. They appear once they sign in, or once a roster lists them.`, [{ location: 'body', path: 'lecturerEmails', message: `Unknown e-mail ${email}.` }]);
      lecturerIds.add(person.id);
    }
    if (!actor.isAdmin || lecturerIds.size === 0) lecturerIds.add(actor.id);
    let id: number;
    try {
      [id] = await trx('courses').insert({ term_id: term.id, code, title: tidy(body.title) });
    } catch (e) {
      if (isDuplicate(e)) throw conflict(`${code} already exists in ${term.name}.`);
      throw e;
    }
    await trx('course_staff').insert([...lecturerIds].map((user_id) => ({ course_id: id, user_id, role: 'lecturer' })));
    await recordAudit(trx, { actorId: actor.id, action: 'course.created', entityType: 'course', entityId: id, after: { code, title: tidy(body.title), termId: term.id, lecturerIds: [...lecturerIds] } });
    return id;
  });
}

export async function updateCourse(db: Knex, actorId: number, course: CourseRow, body: UpdateCourseBody): Promise<void> {
  await db.transaction(async (trx) => {
    const before = { code: course.code, title: course.title, termId: course.term_id };
    const after = { code: body.code !== undefined ? tidy(body.code) : course.code, title: body.title !== undefined ? tidy(body.title) : course.title, termId: body.termId ?? course.term_id };
    const term = await termOr400(trx, after.termId);
    await codeFree(trx, term.id, after.code, term.name, course.id);
    await trx('courses').where({ id: course.id }).update({ code: after.code, title: after.title, term_id: after.termId, updated_at: new Date() });
    await recordAudit(trx, { actorId, action: 'course.updated', entityType: 'course', entityId: course.id, before, after });
  });
}

export async function setArchived(db: Knex, actorId: number, course: CourseRow, archived: boolean): Promise<void> {
  if (Boolean(course.archived) === archived) return;
  await db.transaction(async (trx) => {
    await trx('courses').where({ id: course.id }).update({ archived, updated_at: new Date() });
    await recordAudit(trx, { actorId, action: archived ? 'course.archived' : 'course.restored', entityType: 'course', entityId: course.id, before: { archived: !archived }, after: { archived } });
  });
}

export async function addStaff(db: Knex, actorId: number, course: CourseRow, body: AddStaffBody): Promise<void> {
  await db.transaction(async (trx) => {
    const person = await personByEmail(trx, body.email);
    if (!person) throw notFound(`No one with the e-mail ${body.email} has a Bondmark account yet. They appear once they sign in for the first time.`);
    const current = await trx('course_staff').where({ course_id: course.id, user_id: person.id }).select('role');
    if (current.length) throw conflict(`${person.display_name} is already ${current[0].role === 'lecturer' ? 'a lecturer' : 'an assistant'} of ${course.code}.`);
    const enrolled = await trx('enrolments').where({ course_id: course.id, user_id: person.id, status: 'active' }).first('student_number');
    if (enrolled) throw conflict(`${person.display_name} is a student of ${course.code} (student number ${enrolled.student_number}); withdraw them from the roster first.`);
    await trx('course_staff').insert({ course_id: course.id, user_id: person.id, role: body.role });
    await recordAudit(trx, { actorId, action: 'course.staff_added', entityType: 'course', entityId: course.id, after: { userId: person.id, role: body.role } });
  });
}

export async function removeStaff(db: Knex, actorId: number, course: CourseRow, userId: number, role: StaffRole): Promise<void> {
  await db.transaction(async (trx) => {
    // lock the team so that two removals cannot both leave "one other lecturer"
    const team = await trx('course_staff').where({ course_id: course.id }).forUpdate().select('user_id', 'role');
    if (!team.some((t) => t.user_id === userId && t.role === role)) throw notFound(`That person is not ${role === 'lecturer' ? 'a lecturer' : 'an assistant'} of ${course.code}.`);
    if (role === 'lecturer' && team.filter((t) => t.role === 'lecturer').length === 1) {
      throw conflict(`${course.code} needs at least one lecturer; add another before removing this one.`);
    }
    await trx('course_staff').where({ course_id: course.id, user_id: userId, role }).delete();
    let sections: number[] = [];
    if (role === 'assistant') {
      const rows = await trx('section_assistants as sa').join('sections as s', 's.id', 'sa.section_id').where({ 's.course_id': course.id, 'sa.user_id': userId }).select('s.id');
      sections = rows.map((r) => r.id);
      if (sections.length) await trx('section_assistants').where('user_id', userId).whereIn('section_id', sections).delete();
    }
    await recordAudit(trx, { actorId, action: 'course.staff_removed', entityType: 'course', entityId: course.id, before: { userId, role, sectionIds: sections } });
  });
}
