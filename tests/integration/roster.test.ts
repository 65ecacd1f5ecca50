/**
 * Roster import, re-import and single-student changes over HTTP against
 * MariaDB: messy files give row-level errors and import nothing; a clean file
 * is applied in one transaction; re-import updates without duplicates and
 * reports (never removes) missing students; roles and scope on every route.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RosterApplyResult, RosterEntry, RosterImportRecord, RosterMapping, RosterPreview } from '@shared/api/roster';
import { startAppContext, type AppContext } from '../support/app-context';
import { CookieClient } from '../support/cookie-client';
import { seedPeople, seedTwoCourses } from '../support/seed-people';

let ctx: AppContext;
const ids: Record<string, number> = {};
const clients = new Map<string, CookieClient>();
const fixture = (name: string) => readFileSync(new URL(`../fixtures/rosters/${name}`, import.meta.url));

async function as(login: string): Promise<CookieClient> {
  if (!clients.has(login)) clients.set(login, await ctx.signIn(login));
  return clients.get(login)!;
}

type Answer<T> = { status: number; body: T & { error?: { code: string; message: string; details?: { problems: string[]; rows: { rowNumber: number; message: string }[] } } } };

async function call<T = unknown>(login: string | null, method: string, path: string, body?: unknown): Promise<Answer<T>> {
  const client = login ? await as(login) : new CookieClient();
  const headers: Record<string, string> = {};
  if (method !== 'GET' && login) headers['x-csrf-token'] = await ctx.csrf(client);
  if (body !== undefined) headers['content-type'] = 'application/json';
  return client.json(`${ctx.baseUrl}/api/v1${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) }) as Promise<Answer<T>>;
}

/** multipart POST of a roster file (and text fields) to .../roster/{preview|apply} */
async function send<T>(login: string | null, step: 'preview' | 'apply', bytes: Buffer | Uint8Array, fileName: string, fields: Record<string, string> = {}, courseId = ids.c1): Promise<Answer<T>> {
  const client = login ? await as(login) : new CookieClient();
  const form = new FormData();
  form.set('file', new Blob([new Uint8Array(bytes)]), fileName);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  const headers: Record<string, string> = login ? { 'x-csrf-token': await ctx.csrf(client) } : {};
  return client.json(`${ctx.baseUrl}/api/v1/courses/${courseId}/roster/${step}`, { method: 'POST', headers, body: form }) as Promise<Answer<T>>;
}

const count = async (table: string, where: Record<string, unknown> = {}) => Number((await ctx.db.knex(table).where(where).count({ n: '*' }).first())!.n);
const snapshot = async () => ({ enrolments: await count('enrolments'), users: await count('users'), imports: await count('roster_imports') });
const sha = (b: Buffer | Uint8Array) => createHash('sha256').update(b).digest('hex');
const STANDARD: RosterMapping = { studentNumber: 0, familyName: 1, givenName: 2, email: 3, section: 4 };

beforeAll(async () => {
  ctx = await startAppContext();
  const k = ctx.db.knex;
  const people = await seedPeople(k, ctx.issuer, ['adm', 'lec1', 'lec2', 'ta1', 'stu1']);
  Object.assign(ids, people, await seedTwoCourses(k, people));
  [ids.c3] = await k('courses').insert({ term_id: ids.term, code: 'TST 303', title: 'Sixty students' });
  await k('course_staff').insert({ course_id: ids.c3, user_id: ids.lec1, role: 'lecturer' });
  [ids.labA] = await k('sections').insert({ course_id: ids.c1, name: 'Lab A', weekday: 2, starts_at: '09:00', ends_at: '12:00', capacity: 3 });
  [ids.labB] = await k('sections').insert({ course_id: ids.c1, name: 'Lab B', weekday: 4, starts_at: '14:00', ends_at: '17:00' });
  await k('section_assistants').insert({ section_id: ids.labA, user_id: ids.ta1 });
  for (let s = 1; s <= 3; s++) await k('sections').insert({ course_id: ids.c3, name: `Group ${s}` });
});

afterAll(async () => {
  await ctx?.close();
});

describe('who may import', () => {
  it('refuses preview and apply to assistants, students, other lecturers and anonymous callers, writing nothing', async () => {
    const before = await snapshot();
    const file = fixture('clean-comma.csv');
    for (const login of ['ta1', 'stu1', 'lec2']) {
      expect((await send(login, 'preview', file, 'roster.csv')).status, login).toBe(403);
      expect((await send(login, 'apply', file, 'roster.csv', { mapping: JSON.stringify(STANDARD) })).status, login).toBe(403);
    }
    expect((await send(null, 'apply', file, 'roster.csv', { mapping: JSON.stringify(STANDARD) })).status).toBe(401);
    expect(await snapshot()).toEqual(before);
  });

  it('checks the file by its content and its size', async () => {
    const pdf = await send('lec1', 'preview', Buffer.from('%PDF-1.7\n1 0 obj\n'), 'roster.csv');
    expect(pdf.status).toBe(415);
    expect(pdf.body.error!.message).toMatch(/PDF/);
    const xls = await send('lec1', 'preview', Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, 0, 0]), 'roster.xlsx');
    expect(xls.status).toBe(415);
    expect(xls.body.error!.message).toMatch(/\.xls/);
    const fakeZip = await send('lec1', 'preview', Buffer.from('PK\u0003\u0004 not really a workbook'), 'roster.xlsx');
    expect(fakeZip.status).toBe(415);
    const big = await send('lec1', 'preview', Buffer.alloc(5 * 1024 * 1024 + 10, 0x41), 'big.csv');
    expect(big.status).toBe(413);
    const none = await call('lec1', 'POST', `/courses/${ids.c1}/roster/preview`, { file: 'x' });
    expect(none.status).toBe(400);
    expect(none.body.error!.message).toMatch(/field "file"/);
  });
});

describe('a first import', () => {
  it('previews a clean file with a suggested mapping and writes nothing', async () => {
    const before = await snapshot();
    const r = await send<RosterPreview>('lec1', 'preview', fixture('clean-comma.csv'), 'clean-comma.csv');
    expect(r.status).toBe(200);
    expect(r.body.format).toBe('csv');
    expect(r.body.delimiter).toBe(',');
    expect(r.body.sha256).toBe(sha(fixture('clean-comma.csv')));
    expect(r.body.columns.map((c) => `${c.letter}:${c.header}`)).toEqual(['A:Student number', 'B:Family name', 'C:Given name', 'D:E-mail', 'E:Section']);
    expect(r.body.suggestedMapping).toEqual(STANDARD);
    expect(r.body.rows.map((x) => [x.rowNumber, x.status, x.section])).toEqual([
      [2, 'new', 'Lab A'],
      [3, 'new', 'Lab A'],
      [4, 'new', 'Lab B'],
      [5, 'new', null],
    ]);
    expect(r.body.summary).toEqual({ rows: 4, new: 4, changed: 0, unchanged: 0, error: 0, missing: 0 });
    expect(r.body.canApply).toBe(true);
    expect(await snapshot()).toEqual(before);
  });

  it('applies it in one go: users without an identity yet, enrolments, an import record with the SHA-256', async () => {
    const file = fixture('clean-comma.csv');
    const before = await snapshot();
    const r = await send<RosterApplyResult>('lec1', 'apply', file, 'clean-comma.csv', { mapping: JSON.stringify(STANDARD), sha256: sha(file) });
    expect(r.status).toBe(201);
    expect(r.body.summary).toMatchObject({ new: 4, changed: 0, unchanged: 0, error: 0 });
    expect(await snapshot()).toEqual({ enrolments: before.enrolments + 4, users: before.users + 4, imports: before.imports + 1 });
    const amara = await ctx.db.knex('users').where({ email: 'amara.okonkwo-reyes@students.example.org' }).first();
    expect(amara).toMatchObject({ oidc_issuer: null, oidc_subject: null, display_name: 'Amara Okonkwo-Reyes' });
    const enrolment = await ctx.db.knex('enrolments').where({ course_id: ids.c1, student_number: '2600101' }).first();
    expect(enrolment).toMatchObject({ user_id: amara.id, family_name: 'Okonkwo-Reyes', given_name: 'Amara', section_id: ids.labA, status: 'active' });
    const record = await ctx.db.knex('roster_imports').where({ id: r.body.importId }).first();
    expect(record).toMatchObject({ course_id: ids.c1, actor_id: ids.lec1, file_name: 'clean-comma.csv', sha256: sha(file) });
    expect(await count('audit_log', { action: 'roster.imported', entity_id: String(ids.c1) })).toBe(1);
    const history = await call<{ imports: RosterImportRecord[] }>('lec1', 'GET', `/courses/${ids.c1}/roster/imports`);
    expect(history.body.imports[0]).toMatchObject({ fileName: 'clean-comma.csv', actorName: 'Lena Lecturer', summary: { new: 4 } });
    expect((await call('ta1', 'GET', `/courses/${ids.c1}/roster/imports`)).status).toBe(403);
  });

  it('refuses to apply a file other than the previewed one', async () => {
    const before = await snapshot();
    const r = await send('lec1', 'apply', fixture('clean-comma.csv'), 'clean-comma.csv', { mapping: JSON.stringify(STANDARD), sha256: sha(Buffer.from('something else')) });
    expect(r.status).toBe(409);
    expect(await snapshot()).toEqual(before);
  });
});

describe('messy files', () => {
  it('reads a BOM, semicolons, blank lines, extra spaces and mixed-case e-mail cleanly', async () => {
    const r = await send<RosterPreview>('lec1', 'preview', fixture('messy-bom-semicolons.csv'), 'messy.csv');
    expect(r.status).toBe(200);
    expect(r.body.delimiter).toBe(';');
    // no BOM left in the first header; the extra date column is detected but not mapped
    expect(r.body.columns.map((c) => c.header)).toEqual(['Matriculation No', 'Surname', 'First name', 'Email Address', 'Lab group', 'Date of birth']);
    expect(r.body.suggestedMapping).toEqual({ studentNumber: 0, familyName: 1, givenName: 2, email: 3, section: 4 });
    // blank lines are skipped but counted: rows 3, 4 and 6 of the file
    expect(r.body.rows.map((x) => x.rowNumber)).toEqual([3, 4, 6]);
    expect(r.body.rows.map((x) => x.status)).toEqual(['new', 'new', 'new']);
    expect(r.body.rows[0]).toMatchObject({ studentNumber: '2600201', familyName: 'Varga Kovacs', givenName: 'Petra', email: 'petra.varga@students.example.org', section: 'Lab A' });
    expect(r.body.rows[1]).toMatchObject({ givenName: 'Chidi Emeka', email: 'chidi.nwosu@students.example.org', section: 'Lab B' });
    expect(r.body.rows[2]).toMatchObject({ familyName: 'Abara; de la Cruz', section: null });
    expect(r.body.canApply).toBe(true);
  });

  it('reads a Windows-1252 export', async () => {
    const r = await send<RosterPreview>('lec1', 'preview', fixture('windows-1252-semicolons.csv'), 'old.csv');
    expect(r.status).toBe(200);
    expect(r.body.rows.map((x) => `${x.givenName} ${x.familyName}`)).toEqual(['Jörg Müller-Åberg', 'Léa François']);
  });

  it('gives row-level errors naming row and column, and an apply imports nothing', async () => {
    const file = fixture('row-errors.csv');
    const r = await send<RosterPreview>('lec1', 'preview', file, 'row-errors.csv');
    expect(r.status).toBe(200);
    expect(r.body.canApply).toBe(false);
    const byRow = Object.fromEntries(r.body.rows.map((x) => [x.rowNumber, x]));
    expect(byRow[2].status).toBe('new');
    expect(byRow[3].errors.map((e) => e.message)).toEqual([expect.stringMatching(/^Row 3, column "E-mail" \(D\): is empty/)]);
    expect(byRow[4].errors[0].message).toMatch(/^Row 4, column "Section" \(E\): there is no section "Lab Z" in this course \(sections: "Lab A", "Lab B"\)/);
    expect(byRow[5].errors[0].message).toBe('Row 5, column "Student number" (A): student number 2600301 is already on row 2 of this file; each student may appear once.');
    expect(byRow[6].errors[0]).toMatchObject({ field: 'familyName', letter: 'B', column: 'Family name' });
    expect(byRow[7].errors[0].message).toMatch(/^Row 7, column "E-mail" \(D\): "not-an-address" is not an e-mail address/);
    expect(r.body.summary).toMatchObject({ rows: 6, new: 1, error: 5 });

    const before = await snapshot();
    const refused = await send('lec1', 'apply', file, 'row-errors.csv', { mapping: JSON.stringify(STANDARD) });
    expect(refused.status).toBe(400);
    expect(refused.body.error!.message).toMatch(/^Nothing was imported from row-errors\.csv: 5 rows have errors, first: Row 3/);
    expect(refused.body.error!.details!.rows.map((x) => x.rowNumber)).toEqual([3, 4, 5, 6, 7]);
    expect(await snapshot()).toEqual(before);
    expect(await count('enrolments', { student_number: '2600301' })).toBe(0);
  });

  it('reports a missing required column and refuses the apply', async () => {
    const file = fixture('no-email-column.csv');
    const r = await send<RosterPreview>('lec1', 'preview', file, 'no-email.csv');
    expect(r.status).toBe(200);
    expect(r.body.suggestedMapping.email).toBeNull();
    expect(r.body.problems).toEqual([expect.stringMatching(/^No column is mapped to "E-mail", which every roster needs\. The file's columns are: A "Student number", B "Family name", C "Given name", D "Section"\.$/)]);
    expect(r.body.canApply).toBe(false);
    const before = await snapshot();
    const refused = await send('lec1', 'apply', file, 'no-email.csv', { mapping: JSON.stringify({ studentNumber: 0, familyName: 1, givenName: 2, email: null, section: 3 }) });
    expect(refused.status).toBe(400);
    expect(refused.body.error!.message).toMatch(/E-mail/);
    expect(await snapshot()).toEqual(before);
  });

  it('refuses a mapping that uses one column twice or points past the file', async () => {
    const twice = await send<RosterPreview>('lec1', 'preview', fixture('clean-comma.csv'), 'c.csv', { mapping: JSON.stringify({ ...STANDARD, givenName: 1 }) });
    expect(twice.body.problems).toEqual([expect.stringMatching(/mapped to both "Family name" and "Given name"/)]);
    const past = await send<RosterPreview>('lec1', 'preview', fixture('clean-comma.csv'), 'c.csv', { mapping: JSON.stringify({ ...STANDARD, section: 9 }) });
    expect(past.body.problems).toEqual([expect.stringMatching(/column J, but the file has 5 columns/)]);
    const garbage = await send('lec1', 'preview', fixture('clean-comma.csv'), 'c.csv', { mapping: '{not json' });
    expect(garbage.status).toBe(400);
  });

  it('flags Excel date cells in identity columns and reads dates elsewhere without fuss', async () => {
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet('Registrar export');
    ws.addRow(['Student number', 'Family name', 'Given name', 'E-mail', 'Section', 'Enrolled on']);
    ws.addRow([2600601, 'Oyelaran', 'Tomi', { text: 'tomi.oyelaran@students.example.org', hyperlink: 'mailto:tomi.oyelaran@students.example.org' }, 'Lab B', new Date(Date.UTC(2026, 8, 14))]);
    ws.addRow([new Date(Date.UTC(2026, 0, 2)), 'Castellane', 'Bruno', 'bruno.castellane@students.example.org', 'Lab B', new Date(Date.UTC(2026, 8, 14))]);
    ws.addRow([]);
    ws.addRow(['2600603', { richText: [{ text: 'Nakagawa' }, { text: '-Brandt' }] }, 'Emi', 'emi.nb@students.example.org', { formula: '"Lab "&"B"', result: 'Lab B' }, null]);
    ws.getCell('A3').numFmt = 'yyyy-mm-dd';
    const file = Buffer.from(await wb.xlsx.writeBuffer());
    const r = await send<RosterPreview>('lec1', 'preview', file, 'export.xlsx');
    expect(r.status).toBe(200);
    expect(r.body.format).toBe('xlsx');
    expect(r.body.sheetName).toBe('Registrar export');
    expect(r.body.columns[5].samples).toEqual(['2026-09-14', '2026-09-14']);
    expect(r.body.rows.map((x) => [x.rowNumber, x.status])).toEqual([
      [2, 'new'],
      [3, 'error'],
      [5, 'new'],
    ]);
    expect(r.body.rows[0]).toMatchObject({ studentNumber: '2600601', email: 'tomi.oyelaran@students.example.org' });
    expect(r.body.rows[1].errors[0].message).toMatch(/^Row 3, column "Student number" \(A\): holds the date 2026-01-02, not a student number/);
    expect(r.body.rows[2]).toMatchObject({ familyName: 'Nakagawa-Brandt', section: 'Lab B' });
    const before = await snapshot();
    expect((await send('lec1', 'apply', file, 'export.xlsx', { mapping: JSON.stringify(STANDARD) })).status).toBe(400);
    expect(await snapshot()).toEqual(before);
  });
});

describe('re-import', () => {
  it('updates changed rows, adds new ones without duplicates and reports missing students without removing them', async () => {
    // a lecturer moves Tove by hand; the registrar's new file moves Dariush, renames Amara,
    // adds Kofi, lists an existing account (stu1) and drops Thandiwe
    const tove = await ctx.db.knex('enrolments').where({ course_id: ids.c1, student_number: '2600102' }).first();
    const csv = [
      'Student number,Family name,Given name,E-mail,Section',
      '2600101,Okonkwo Reyes,Amara,amara.okonkwo-reyes@students.example.org,Lab A',
      '2600102,Lindgren,Tove,tove.lindgren@students.example.org,Lab A',
      '2600103,Farrokhzad,Dariush,dariush.farrokhzad@students.example.org,Lab A',
      '2600105,Asante,Kofi,kofi.asante@students.example.org,Lab B',
      '1000001,Student,Stella,STU1@test.example,Lab B',
    ].join('\n');
    const file = Buffer.from(csv);
    const preview = await send<RosterPreview>('lec1', 'preview', file, 'week2.csv');
    expect(preview.status).toBe(200);
    const status = Object.fromEntries(preview.body.rows.map((x) => [x.studentNumber, x.status]));
    expect(status).toEqual({ '2600101': 'changed', '2600102': 'unchanged', '2600103': 'changed', '2600105': 'new', '1000001': 'new' });
    const amara = preview.body.rows.find((x) => x.studentNumber === '2600101')!;
    expect(amara.changes).toEqual([{ field: 'familyName', from: 'Okonkwo-Reyes', to: 'Okonkwo Reyes' }]);
    expect(preview.body.rows.find((x) => x.studentNumber === '2600103')!.changes).toEqual([{ field: 'section', from: 'Lab B', to: 'Lab A' }]);
    expect(preview.body.rows.find((x) => x.studentNumber === '1000001')!.notes).toEqual(['Will be linked to the existing account of Stella Student.']);
    expect(preview.body.missing.map((m) => m.studentNumber)).toEqual(['2600104']);
    // Lab A (capacity 3) would hold Amara, Tove, Dariush: at capacity, no warning
    expect(preview.body.warnings).toEqual([]);

    const before = await snapshot();
    const applied = await send<RosterApplyResult>('lec1', 'apply', file, 'week2.csv', { mapping: JSON.stringify(STANDARD), sha256: preview.body.sha256 });
    expect(applied.status).toBe(201);
    expect(applied.body.summary).toEqual({ rows: 5, new: 2, changed: 2, unchanged: 1, error: 0, missing: 1 });
    expect(applied.body.missing.map((m) => m.studentNumber)).toEqual(['2600104']);
    // two enrolments more, one user more (stu1 already had an account)
    expect(await snapshot()).toEqual({ enrolments: before.enrolments + 2, users: before.users + 1, imports: before.imports + 1 });
    expect(await count('enrolments', { course_id: ids.c1, student_number: '2600101' })).toBe(1);
    expect((await ctx.db.knex('enrolments').where({ course_id: ids.c1, student_number: '2600101' }).first()).family_name).toBe('Okonkwo Reyes');
    expect((await ctx.db.knex('enrolments').where({ course_id: ids.c1, student_number: '2600103' }).first()).section_id).toBe(ids.labA);
    expect((await ctx.db.knex('enrolments').where({ course_id: ids.c1, student_number: '1000001' }).first()).user_id).toBe(ids.stu1);
    expect((await ctx.db.knex('enrolments').where({ id: tove.id }).first()).updated_at).toEqual(tove.updated_at);
    // the missing student is still there, still active
    expect(await ctx.db.knex('enrolments').where({ course_id: ids.c1, student_number: '2600104' }).first()).toMatchObject({ status: 'active' });

    // the same file again changes nothing
    const again = await send<RosterApplyResult>('lec1', 'apply', file, 'week2.csv', { mapping: JSON.stringify(STANDARD) });
    expect(again.body.summary).toMatchObject({ new: 0, changed: 0, unchanged: 5, missing: 1 });
    expect(await count('enrolments')).toBe(before.enrolments + 2);
  });

  it('refuses an e-mail that belongs to another student on the roster, and warns about full sections', async () => {
    const csv = [
      'Student number,Family name,Given name,E-mail,Section',
      '2600106,Impostor,Ima,tove.lindgren@students.example.org,Lab A',
      '2600107,Quartey,Efua,efua.quartey@students.example.org,Lab A',
    ].join('\n');
    const r = await send<RosterPreview>('lec1', 'preview', Buffer.from(csv), 'x.csv');
    expect(r.body.rows[0].errors[0].message).toBe('Row 2, column "E-mail" (D): tove.lindgren@students.example.org belongs to student number 2600102, already on this course\'s roster.');
    expect(r.body.warnings).toEqual(['Section "Lab A" would have 4 active students; its capacity is 3.']);
    const staff = await send<RosterPreview>('lec1', 'preview', Buffer.from('Student number,Family name,Given name,E-mail\n9,Assistant,Tariq,ta1@test.example\n'), 'y.csv');
    expect(staff.body.rows[0].errors[0].message).toMatch(/who teaches this course/);
  });
});

describe('one transaction', () => {
  it('leaves nothing behind when the database fails on the last row of an apply', async () => {
    // a trigger that refuses one student number: the rows before it were already written inside the transaction
    await ctx.db.knex.raw(`CREATE TRIGGER refuse_one_enrolment BEFORE INSERT ON enrolments FOR EACH ROW
      IF NEW.student_number = '2699999' THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'refused by the test'; END IF`);
    try {
      const csv = ['Student number,Family name,Given name,E-mail', '2699997,Mensah,Ama,ama.mensah@students.example.org', '2699998,Rossi,Dario,dario.rossi@students.example.org', '2699999,Tanaka,Yui,yui.tanaka@students.example.org'].join('\n');
      const before = await snapshot();
      const audits = await count('audit_log', { action: 'roster.imported' });
      const r = await send('lec1', 'apply', Buffer.from(csv), 'fails-late.csv', { mapping: JSON.stringify({ ...STANDARD, section: null }) });
      expect(r.status).toBe(500);
      expect(await snapshot()).toEqual(before);
      expect(await count('audit_log', { action: 'roster.imported' })).toBe(audits);
      expect(await count('users', { email: 'ama.mensah@students.example.org' })).toBe(0);
    } finally {
      await ctx.db.knex.raw('DROP TRIGGER IF EXISTS refuse_one_enrolment');
    }
  });
});

describe('a 60-student XLSX roster', () => {
  it('imports all sixty in one transaction, placed in three groups', async () => {
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet('Students');
    ws.addRow(['ID', 'Surname', 'Forename', 'University e-mail', 'Lab group']);
    const given = ['Aino', 'Bastian', 'Chiara', 'Dmitri', 'Elif', 'Farid', 'Greta', 'Hamza', 'Ines', 'Jonas'];
    const family = ['Ashby', 'Brandt', 'Costa', 'Dahl', 'Eze', 'Fujita'];
    for (let i = 0; i < 60; i++) {
      const g = given[i % 10];
      const f = family[Math.floor(i / 10)];
      ws.addRow([2700000 + i, f, g, `${g}.${f}.${i}@students.example.org`.toLowerCase(), `Group ${(i % 3) + 1}`]);
    }
    const file = Buffer.from(await wb.xlsx.writeBuffer());
    const preview = await send<RosterPreview>('lec1', 'preview', file, 'sixty.xlsx', {}, ids.c3);
    expect(preview.status).toBe(200);
    expect(preview.body.suggestedMapping).toEqual({ studentNumber: 0, familyName: 1, givenName: 2, email: 3, section: 4 });
    expect(preview.body.summary).toEqual({ rows: 60, new: 60, changed: 0, unchanged: 0, error: 0, missing: 0 });
    const before = await count('enrolments', { course_id: ids.c3 });
    const applied = await send<RosterApplyResult>('lec1', 'apply', file, 'sixty.xlsx', { mapping: JSON.stringify(preview.body.suggestedMapping) }, ids.c3);
    expect(applied.status).toBe(201);
    expect(before).toBe(0);
    expect(await count('enrolments', { course_id: ids.c3 })).toBe(60);
    const perGroup = await ctx.db.knex('enrolments as e').join('sections as s', 's.id', 'e.section_id').where('e.course_id', ids.c3).groupBy('s.name').select('s.name').count({ n: '*' }).orderBy('s.name');
    expect((perGroup as unknown as { name: string; n: number }[]).map((g) => [g.name, Number(g.n)])).toEqual([
      ['Group 1', 20],
      ['Group 2', 20],
      ['Group 3', 20],
    ]);
    expect((await ctx.db.knex('enrolments').where({ course_id: ids.c3, student_number: '2700059' }).first()).given_name).toBe('Jonas');
  });
});

describe('the roster, one student at a time', () => {
  const path = () => `/courses/${ids.c1}/roster`;

  it('shows lecturers everyone and assistants only their sections, read-only; students nothing', async () => {
    const lec = await call<{ entries: RosterEntry[]; readOnly: boolean }>('lec1', 'GET', path());
    expect(lec.status).toBe(200);
    expect(lec.body.readOnly).toBe(false);
    expect(lec.body.entries).toHaveLength(6);
    const stella = lec.body.entries.find((e) => e.studentNumber === '1000001')!;
    expect(stella).toMatchObject({ signedIn: true, section: { id: ids.labB, name: 'Lab B' } });
    expect(lec.body.entries.find((e) => e.studentNumber === '2600101')!.signedIn).toBe(false);
    const ta = await call<{ entries: RosterEntry[]; readOnly: boolean }>('ta1', 'GET', path());
    expect(ta.status).toBe(200);
    expect(ta.body.readOnly).toBe(true);
    expect(ta.body.entries.map((e) => e.section?.name)).toEqual(['Lab A', 'Lab A', 'Lab A']);
    expect((await call('stu1', 'GET', path())).status).toBe(403);
    expect((await call('lec2', 'GET', path())).status).toBe(403);
    expect((await call(null, 'GET', path())).status).toBe(401);
  });

  it('adds one student by hand, refusing duplicates', async () => {
    const r = await call<RosterEntry>('lec1', 'POST', `${path()}/students`, { studentNumber: '2600199', familyName: ' Okafor ', givenName: 'Nneka', email: 'Nneka.Okafor@students.example.org', sectionId: ids.labB });
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ studentNumber: '2600199', familyName: 'Okafor', email: 'nneka.okafor@students.example.org', section: { id: ids.labB }, status: 'active', signedIn: false });
    ids.nneka = r.body.enrolmentId;
    expect((await call('lec1', 'POST', `${path()}/students`, { studentNumber: '2600199', familyName: 'X', givenName: 'Y', email: 'y@students.example.org' })).status).toBe(409);
    expect((await call('lec1', 'POST', `${path()}/students`, { studentNumber: '2600198', familyName: 'X', givenName: 'Y', email: 'nneka.okafor@students.example.org' })).status).toBe(409);
    expect((await call('lec1', 'POST', `${path()}/students`, { studentNumber: '2600198', familyName: 'X', givenName: 'Y', email: 'ta1@test.example' })).status).toBe(409);
    const before = await snapshot();
    expect((await call('ta1', 'POST', `${path()}/students`, { studentNumber: '2600197', familyName: 'X', givenName: 'Y', email: 'z@students.example.org' })).status).toBe(403);
    expect(await snapshot()).toEqual(before);
  });

  it('moves a student between sections', async () => {
    const r = await call<RosterEntry>('lec1', 'PATCH', `${path()}/${ids.nneka}`, { sectionId: ids.labA });
    expect(r.status).toBe(200);
    expect(r.body.section).toEqual({ id: ids.labA, name: 'Lab A' });
    expect((await call('ta1', 'PATCH', `${path()}/${ids.nneka}`, { sectionId: ids.labB })).status).toBe(403);
    const [foreign] = await ctx.db.knex('sections').insert({ course_id: ids.c2, name: 'Not yours' });
    expect((await call('lec1', 'PATCH', `${path()}/${ids.nneka}`, { sectionId: foreign })).status).toBe(400);
    const unplaced = await call<RosterEntry>('lec1', 'PATCH', `${path()}/${ids.nneka}`, { sectionId: null });
    expect(unplaced.body.section).toBeNull();
    expect(await count('audit_log', { action: 'roster.student_moved', entity_id: String(ids.nneka) })).toBe(2);
  });

  it('withdraws a student keeping the enrolment, and reinstates them', async () => {
    expect((await call('ta1', 'POST', `${path()}/${ids.nneka}/withdraw`)).status).toBe(403);
    expect((await call('stu1', 'POST', `${path()}/${ids.nneka}/withdraw`)).status).toBe(403);
    const r = await call<RosterEntry>('lec1', 'POST', `${path()}/${ids.nneka}/withdraw`);
    expect(r.status).toBe(200);
    expect(r.body.status).toBe('withdrawn');
    expect(r.body.withdrawnAt).not.toBeNull();
    const row = await ctx.db.knex('enrolments').where({ id: ids.nneka }).first();
    expect(row).toMatchObject({ status: 'withdrawn', student_number: '2600199', family_name: 'Okafor' });
    // a re-import that lists her again updates details but does not re-enrol her
    const preview = await send<RosterPreview>('lec1', 'preview', Buffer.from('Student number,Family name,Given name,E-mail\n2600199,Okafor,Nneka,nneka.okafor@students.example.org\n'), 'n.csv');
    expect(preview.body.rows[0].status).toBe('unchanged');
    expect(preview.body.rows[0].notes[0]).toMatch(/does not enrol the student again/);
    const back = await call<RosterEntry>('lec1', 'POST', `${path()}/${ids.nneka}/reinstate`);
    expect(back.body).toMatchObject({ status: 'active', withdrawnAt: null });
    expect((await call('lec1', 'POST', `${path()}/999999/withdraw`)).status).toBe(404);
  });
});

describe('first sign-in of a student known from the roster', () => {
  it('attaches the identity to the roster-made account by e-mail instead of making a second one', async () => {
    // stu2 has never signed in; the roster lists them by e-mail
    const added = await call<RosterEntry>('lec1', 'POST', `/courses/${ids.c1}/roster/students`, { studentNumber: '2600200', familyName: 'Student', givenName: 'Sam', email: 'STU2@test.example', sectionId: ids.labA });
    expect(added.status).toBe(201);
    const placeholder = await ctx.db.knex('users').where({ id: added.body.userId }).first();
    expect(placeholder).toMatchObject({ oidc_issuer: null, oidc_subject: null, email: 'stu2@test.example' });
    const users = await count('users');

    const client = await ctx.signIn('stu2');
    const me = await client.json<{ id: number; roles: string[]; courses: { courseId: number; role: string }[] }>(`${ctx.baseUrl}/api/v1/me`);
    expect(me.body.id).toBe(added.body.userId);
    expect(me.body.roles).toEqual(['student']);
    expect(me.body.courses).toEqual([expect.objectContaining({ courseId: ids.c1, role: 'student' })]);
    expect(await count('users')).toBe(users);
    const linked = await ctx.db.knex('users').where({ id: added.body.userId }).first();
    expect(linked).toMatchObject({ oidc_issuer: ctx.issuer, oidc_subject: 'stu2', display_name: 'Sam Student' });
    expect(linked.last_sign_in_at).not.toBeNull();
    expect(await count('audit_log', { action: 'user.linked_on_first_sign_in', entity_id: String(added.body.userId) })).toBe(1);
    // the roster now shows the student as signed in; students still see nothing of it
    const roster = await call<{ entries: RosterEntry[] }>('lec1', 'GET', `/courses/${ids.c1}/roster`);
    expect(roster.body.entries.find((e) => e.studentNumber === '2600200')!.signedIn).toBe(true);
    const own = await client.json(`${ctx.baseUrl}/api/v1/courses/${ids.c1}/roster`);
    expect(own.status).toBe(403);
  });
});

describe('archived courses', () => {
  it('freeze imports and roster changes', async () => {
    await ctx.db.knex('courses').where({ id: ids.c1 }).update({ archived: true });
    const before = await snapshot();
    expect((await send('lec1', 'apply', fixture('clean-comma.csv'), 'c.csv', { mapping: JSON.stringify(STANDARD) })).status).toBe(409);
    expect((await call('lec1', 'POST', `/courses/${ids.c1}/roster/${ids.nneka}/withdraw`)).status).toBe(409);
    const view = await call<{ readOnly: boolean }>('lec1', 'GET', `/courses/${ids.c1}/roster`);
    expect(view.body.readOnly).toBe(true);
    expect(await snapshot()).toEqual(before);
    await ctx.db.knex('courses').where({ id: ids.c1 }).update({ archived: false });
  });
});
