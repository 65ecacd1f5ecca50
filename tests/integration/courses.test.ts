/**
 * Terms, courses, teaching teams and sections over HTTP against MariaDB:
 * every route with its roles and scope, and that refused requests leave
 * nothing behind.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startAppContext, type AppContext } from '../support/app-context';
import { CookieClient } from '../support/cookie-client';
import { seedPeople, seedTwoCourses } from '../support/seed-people';
import type { CourseDetail, Term } from '@shared/api/courses';
import type { Section } from '@shared/api/sections';

let ctx: AppContext;
const ids: Record<string, number> = {};
const clients = new Map<string, CookieClient>();

async function as(login: string): Promise<CookieClient> {
  if (!clients.has(login)) clients.set(login, await ctx.signIn(login));
  return clients.get(login)!;
}

type Answer<T> = { status: number; body: T & { error?: { code: string; message: string; details?: unknown } } };

async function call<T = unknown>(login: string | null, method: string, path: string, body?: unknown): Promise<Answer<T>> {
  const client = login ? await as(login) : new CookieClient();
  const headers: Record<string, string> = {};
  if (method !== 'GET' && login) headers['x-csrf-token'] = await ctx.csrf(client);
  if (body !== undefined) headers['content-type'] = 'application/json';
  return client.json(`${ctx.baseUrl}/api/v1${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) }) as Promise<Answer<T>>;
}

const count = async (table: string, where: Record<string, unknown> = {}) => Number((await ctx.db.knex(table).where(where).count({ n: '*' }).first())!.n);

beforeAll(async () => {
  ctx = await startAppContext();
  const k = ctx.db.knex;
  const people = await seedPeople(k, ctx.issuer, ['adm', 'lec1', 'lec2', 'ta1', 'stu1', 'stu2', 'nobody']);
  Object.assign(ids, people, await seedTwoCourses(k, people));
  await k('enrolments').insert({ course_id: ids.c1, user_id: ids.stu1, student_number: '1000001' });
});

afterAll(async () => {
  await ctx?.close();
});

describe('terms', () => {
  it('lists terms for admins and lecturers only', async () => {
    for (const login of ['adm', 'lec1']) {
      const r = await call<{ terms: Term[] }>(login, 'GET', '/terms');
      expect(r.status).toBe(200);
      expect(r.body.terms.map((t) => t.name)).toContain('Test term');
      expect(r.body.terms[0]).toMatchObject({ startsOn: '2026-09-01', endsOn: '2026-12-20' });
    }
    for (const login of ['ta1', 'stu1', 'nobody']) expect((await call(login, 'GET', '/terms')).status).toBe(403);
    expect((await call(null, 'GET', '/terms')).status).toBe(401);
  });

  it('lets only admins create a term, with its dates in order and a unique name', async () => {
    const before = await count('terms');
    expect((await call('lec1', 'POST', '/terms', { name: 'Spring 2027', startsOn: '2027-01-11', endsOn: '2027-05-07' })).status).toBe(403);
    expect((await call('stu1', 'POST', '/terms', { name: 'Spring 2027', startsOn: '2027-01-11', endsOn: '2027-05-07' })).status).toBe(403);
    expect(await count('terms')).toBe(before);

    const backwards = await call('adm', 'POST', '/terms', { name: 'Backwards', startsOn: '2027-05-07', endsOn: '2027-01-11' });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error!.details).toEqual([expect.objectContaining({ location: 'body', path: 'endsOn' })]);

    const made = await call<Term>('adm', 'POST', '/terms', { name: '  Spring   2027 ', startsOn: '2027-01-11', endsOn: '2027-05-07' });
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({ name: 'Spring 2027', startsOn: '2027-01-11', endsOn: '2027-05-07' });
    ids.term2 = made.body.id;
    expect((await call('adm', 'POST', '/terms', { name: 'Spring 2027', startsOn: '2027-01-11', endsOn: '2027-05-07' })).status).toBe(409);
    expect(await count('terms')).toBe(before + 1);
    expect(await count('audit_log', { action: 'term.created' })).toBe(1);
  });
});

describe('courses', () => {
  it('lets a lecturer create a course and makes them its lecturer', async () => {
    const r = await call<CourseDetail>('lec1', 'POST', '/courses', { code: 'CHM 2xx', title: '  Bonds  in practice ', termId: ids.term });
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ code: 'CHM 2xx', title: 'Bonds in practice', myRole: 'lecturer', archived: false });
    expect(r.body.staff).toEqual([expect.objectContaining({ userId: ids.lec1, role: 'lecturer' })]);
    expect(r.body.permissions).toEqual({ editCourse: true, manageSections: true, manageRoster: true, viewRoster: true });
    ids.c3 = r.body.id;
    const audit = await ctx.db.knex('audit_log').where({ action: 'course.created', entity_id: String(ids.c3) });
    expect(audit).toHaveLength(1);
  });

  it('refuses course creation to assistants, students and people without a role, leaving nothing behind', async () => {
    const before = await count('courses');
    for (const login of ['ta1', 'stu1', 'nobody']) {
      const r = await call(login, 'POST', '/courses', { code: 'X 1', title: 'Nope', termId: ids.term });
      expect(r.status, login).toBe(403);
    }
    expect((await call(null, 'POST', '/courses', { code: 'X 1', title: 'Nope', termId: ids.term })).status).toBe(401);
    expect(await count('courses')).toBe(before);
  });

  it('refuses a duplicate code in the same term and an unknown term', async () => {
    const dup = await call('lec1', 'POST', '/courses', { code: 'TST 101', title: 'Again', termId: ids.term });
    expect(dup.status).toBe(409);
    expect(dup.body.error!.message).toMatch(/TST 101 already exists in Test term/);
    const badTerm = await call('lec1', 'POST', '/courses', { code: 'TST 999', title: 'Nowhere', termId: 999999 });
    expect(badTerm.status).toBe(400);
    expect((await call('lec1', 'POST', '/courses', { code: '', title: 'No code', termId: ids.term })).status).toBe(400);
  });

  it('lets an admin name the lecturers of a new course', async () => {
    const r = await call<CourseDetail>('adm', 'POST', '/courses', { code: 'TST 303', title: 'Named', termId: ids.term2, lecturerEmails: ['LEC2@test.example'] });
    expect(r.status).toBe(201);
    expect(r.body.staff.map((s) => [s.userId, s.role])).toEqual([[ids.lec2, 'lecturer']]);
    const unknown = await call('adm', 'POST', '/courses', { code: 'TST 304', title: 'Unknown', termId: ids.term2, lecturerEmails: ['ghost@test.example'] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error!.message).toMatch(/ghost@test\.example/);
  });

  it('shows a course to its staff, its students (summary only) and admins; no one else', async () => {
    const lec = await call<CourseDetail>('lec1', 'GET', `/courses/${ids.c1}`);
    expect(lec.status).toBe(200);
    expect(lec.body.staff.map((s) => s.role).sort()).toEqual(['assistant', 'lecturer']);
    const ta = await call<CourseDetail>('ta1', 'GET', `/courses/${ids.c1}`);
    expect(ta.status).toBe(200);
    expect(ta.body.permissions).toEqual({ editCourse: false, manageSections: false, manageRoster: false, viewRoster: true });
    const stu = await call<CourseDetail>('stu1', 'GET', `/courses/${ids.c1}`);
    expect(stu.status).toBe(200);
    expect(stu.body.staff).toEqual([]);
    expect(stu.body.permissions).toEqual({ editCourse: false, manageSections: false, manageRoster: false, viewRoster: false });
    const adm = await call<CourseDetail>('adm', 'GET', `/courses/${ids.c2}`);
    expect(adm.status).toBe(200);
    expect(adm.body.myRole).toBeNull();
    expect(adm.body.permissions.editCourse).toBe(true);
    expect((await call('lec1', 'GET', `/courses/${ids.c2}`)).status).toBe(403);
    expect((await call('stu2', 'GET', `/courses/${ids.c1}`)).status).toBe(403);
    expect((await call(null, 'GET', `/courses/${ids.c1}`)).status).toBe(401);
    expect((await call('adm', 'GET', '/courses/999999')).status).toBe(404);
    expect((await call('adm', 'GET', '/courses/abc')).status).toBe(400);
  });

  it('lets the course lecturer edit it; another lecturer, an assistant or a student cannot', async () => {
    const ok = await call<CourseDetail>('lec1', 'PATCH', `/courses/${ids.c1}`, { title: 'Test course one, revised' });
    expect(ok.status).toBe(200);
    expect(ok.body.title).toBe('Test course one, revised');
    for (const login of ['lec2', 'ta1', 'stu1']) {
      const r = await call(login, 'PATCH', `/courses/${ids.c1}`, { title: `Taken over by ${login}` });
      expect(r.status, login).toBe(403);
    }
    const row = await ctx.db.knex('courses').where({ id: ids.c1 }).first();
    expect(row.title).toBe('Test course one, revised');
    expect((await call('lec1', 'PATCH', `/courses/${ids.c1}`, { code: 'TST 202' })).status).toBe(409);
    expect((await call('lec1', 'PATCH', `/courses/${ids.c1}`, {})).status).toBe(400);
    const moved = await call<CourseDetail>('adm', 'PATCH', `/courses/${ids.c3}`, { termId: ids.term2 });
    expect(moved.body.term.name).toBe('Spring 2027');
  });

  it('archives and restores a course (lecturer or admin only) and freezes its sections while archived', async () => {
    expect((await call('ta1', 'POST', `/courses/${ids.c1}/archive`)).status).toBe(403);
    expect((await call('lec1', 'POST', `/courses/${ids.c2}/archive`)).status).toBe(403);
    const archived = await call<CourseDetail>('lec2', 'POST', `/courses/${ids.c2}/archive`);
    expect(archived.status).toBe(200);
    expect(archived.body.archived).toBe(true);
    expect(archived.body.permissions.manageSections).toBe(false);
    const frozen = await call('lec2', 'POST', `/courses/${ids.c2}/sections`, { name: 'Lab X' });
    expect(frozen.status).toBe(409);
    expect(await count('sections', { course_id: ids.c2 })).toBe(0);
    const restored = await call<CourseDetail>('adm', 'POST', `/courses/${ids.c2}/restore`);
    expect(restored.body.archived).toBe(false);
    expect(await count('audit_log', { action: 'course.archived', entity_id: String(ids.c2) })).toBe(1);
    expect(await count('audit_log', { action: 'course.restored', entity_id: String(ids.c2) })).toBe(1);
  });
});

describe('teaching team', () => {
  it('adds a person with an account by e-mail, in one role only, and not a student of the course', async () => {
    const added = await call<CourseDetail>('lec1', 'POST', `/courses/${ids.c1}/staff`, { email: 'Nobody@Test.example', role: 'assistant' });
    expect(added.status).toBe(201);
    expect(added.body.staff.find((s) => s.userId === ids.nobody)?.role).toBe('assistant');
    expect((await call('lec1', 'POST', `/courses/${ids.c1}/staff`, { email: 'nobody@test.example', role: 'lecturer' })).status).toBe(409);
    const unknown = await call('lec1', 'POST', `/courses/${ids.c1}/staff`, { email: 'ghost@test.example', role: 'assistant' });
    expect(unknown.status).toBe(404);
    expect(unknown.body.error!.message).toMatch(/ghost@test\.example/);
    expect((await call('lec1', 'POST', `/courses/${ids.c1}/staff`, { email: 'stu1@test.example', role: 'assistant' })).status).toBe(409);
    expect((await call('ta1', 'POST', `/courses/${ids.c1}/staff`, { email: 'stu2@test.example', role: 'assistant' })).status).toBe(403);
    expect((await call('lec2', 'POST', `/courses/${ids.c1}/staff`, { email: 'stu2@test.example', role: 'assistant' })).status).toBe(403);
    expect(await count('course_staff', { course_id: ids.c1, user_id: ids.stu2 })).toBe(0);
  });

  it('never removes the last lecturer', async () => {
    const r = await call('lec1', 'DELETE', `/courses/${ids.c1}/staff/${ids.lec1}/lecturer`);
    expect(r.status).toBe(409);
    expect(await count('course_staff', { course_id: ids.c1, user_id: ids.lec1, role: 'lecturer' })).toBe(1);
  });
});

describe('sections', () => {
  const base = () => `/courses/${ids.c1}/sections`;

  it('lets the lecturer create sections with weekday, times, room, capacity and course assistants', async () => {
    const a = await call<Section>('lec1', 'POST', base(), { name: 'Lab A', weekday: 2, startsAt: '09:00', endsAt: '12:00', room: 'C-204', capacity: 24, assistantIds: [ids.ta1] });
    expect(a.status).toBe(201);
    expect(a.body).toMatchObject({ name: 'Lab A', weekday: 2, startsAt: '09:00', endsAt: '12:00', room: 'C-204', capacity: 24, archived: false, studentCount: 0 });
    expect(a.body.assistants.map((x) => x.userId)).toEqual([ids.ta1]);
    ids.labA = a.body.id;
    const b = await call<Section>('lec1', 'POST', base(), { name: 'Lab B', weekday: 4, startsAt: '14:00', endsAt: '17:00', room: 'C-204', capacity: 24, assistantIds: [ids.nobody] });
    expect(b.status).toBe(201);
    ids.labB = b.body.id;
  });

  it('checks names, times and that assistants belong to the course', async () => {
    const before = await count('sections');
    expect((await call('lec1', 'POST', base(), { name: 'lab a' })).status).toBe(409); // the collation ignores case
    const late = await call('lec1', 'POST', base(), { name: 'Lab C', startsAt: '12:00', endsAt: '09:00' });
    expect(late.status).toBe(400);
    expect((await call('lec1', 'POST', base(), { name: 'Lab C', startsAt: '9am' })).status).toBe(400);
    expect((await call('lec1', 'POST', base(), { name: 'Lab C', weekday: 8 })).status).toBe(400);
    const stranger = await call('lec1', 'POST', base(), { name: 'Lab C', assistantIds: [ids.stu1] });
    expect(stranger.status).toBe(400);
    expect(stranger.body.error!.message).toMatch(/not one/);
    const patchLate = await call('lec1', 'PATCH', `${base()}/${ids.labA}`, { endsAt: '08:00' });
    expect(patchLate.status).toBe(400);
    expect(await count('sections')).toBe(before);
  });

  it('refuses section changes to assistants, students, other lecturers and strangers', async () => {
    const before = await ctx.db.knex('sections').where({ id: ids.labA }).first();
    const sectionsBefore = await count('sections');
    for (const login of ['ta1', 'stu1', 'lec2', 'nobody']) {
      expect((await call(login, 'POST', base(), { name: `By ${login}` })).status, login).toBe(403);
      expect((await call(login, 'PATCH', `${base()}/${ids.labA}`, { room: 'Basement' })).status, login).toBe(403);
      expect((await call(login, 'POST', `${base()}/${ids.labA}/archive`)).status, login).toBe(403);
    }
    expect(await count('sections')).toBe(sectionsBefore);
    expect(await ctx.db.knex('sections').where({ id: ids.labA }).first()).toEqual(before);
  });

  it('shows lecturers every section and assistants only their own; students nothing', async () => {
    const lec = await call<{ sections: Section[] }>('lec1', 'GET', base());
    expect(lec.body.sections.map((s) => s.name)).toEqual(['Lab A', 'Lab B']);
    const ta = await call<{ sections: Section[] }>('ta1', 'GET', base());
    expect(ta.status).toBe(200);
    expect(ta.body.sections.map((s) => s.name)).toEqual(['Lab A']);
    const other = await call<{ sections: Section[] }>('nobody', 'GET', base());
    expect(other.body.sections.map((s) => s.name)).toEqual(['Lab B']);
    expect((await call('stu1', 'GET', base())).status).toBe(403);
    expect((await call('lec2', 'GET', base())).status).toBe(403);
    expect((await call(null, 'GET', base())).status).toBe(401);
  });

  it('edits a section and its assistants', async () => {
    const r = await call<Section>('lec1', 'PATCH', `${base()}/${ids.labA}`, { room: 'C-210', capacity: 20, assistantIds: [ids.ta1, ids.nobody] });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ room: 'C-210', capacity: 20 });
    expect(r.body.assistants.map((x) => x.userId).sort()).toEqual([ids.ta1, ids.nobody].sort());
    const audit = await ctx.db.knex('audit_log').where({ action: 'section.updated', entity_id: String(ids.labA) }).first();
    expect(typeof audit.before_json === 'string' ? JSON.parse(audit.before_json) : audit.before_json).toMatchObject({ room: 'C-204', capacity: 24, assistantIds: [ids.ta1] });
    expect((await call('lec1', 'PATCH', `${base()}/999999`, { room: 'X' })).status).toBe(404);
    // a section of another course is not reachable through this one
    const [foreign] = await ctx.db.knex('sections').insert({ course_id: ids.c2, name: 'Elsewhere' });
    expect((await call('lec1', 'PATCH', `${base()}/${foreign}`, { room: 'X' })).status).toBe(404);
  });

  it('archives a section only when no active student is in it, and restores it', async () => {
    await ctx.db.knex('enrolments').where({ course_id: ids.c1, user_id: ids.stu1 }).update({ section_id: ids.labB });
    const busy = await call('lec1', 'POST', `${base()}/${ids.labB}/archive`);
    expect(busy.status).toBe(409);
    expect(busy.body.error!.message).toMatch(/1 active student/);
    await ctx.db.knex('enrolments').where({ course_id: ids.c1, user_id: ids.stu1 }).update({ section_id: ids.labA });
    const archived = await call<Section>('lec1', 'POST', `${base()}/${ids.labB}/archive`);
    expect(archived.status).toBe(200);
    expect(archived.body.archived).toBe(true);
    const restored = await call<Section>('adm', 'POST', `${base()}/${ids.labB}/restore`);
    expect(restored.body.archived).toBe(false);
  });

  it('removing an assistant from the team also takes them off its sections', async () => {
    const r = await call<CourseDetail>('lec1', 'DELETE', `/courses/${ids.c1}/staff/${ids.nobody}/assistant`);
    expect(r.status).toBe(200);
    expect(r.body.staff.some((s) => s.userId === ids.nobody)).toBe(false);
    expect(await count('section_assistants', { user_id: ids.nobody })).toBe(0);
    expect((await call('nobody', 'GET', base())).status).toBe(403);
  });
});
