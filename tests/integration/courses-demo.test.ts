/** The demo's courses: three lab sections with times, rooms, capacities and assistants; every student placed. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase, type TestDatabase } from '../support/database';
import { seedDemo } from '../../seeds/demo';

let db: TestDatabase;

beforeAll(async () => {
  db = await createTestDatabase();
  await seedDemo(db.knex, 'http://127.0.0.1:1/demo-issuer');
});

afterAll(async () => {
  await db?.drop();
});

describe('demo sections', () => {
  it('has two sections in CHEM 2140 and one in CHEM 3310, each taught by a demo assistant', async () => {
    const rows = await db
      .knex('sections as s')
      .join('courses as c', 'c.id', 's.course_id')
      .join('section_assistants as sa', 'sa.section_id', 's.id')
      .join('users as u', 'u.id', 'sa.user_id')
      .select('c.code', 's.name', 's.weekday', 's.starts_at', 's.ends_at', 's.room', 's.capacity', 'u.oidc_subject as assistant')
      .orderBy(['c.code', 's.name']);
    expect(rows.map((r) => [r.code, r.name, r.assistant])).toEqual([
      ['CHEM 2140', 'Lab A', 'assistant'],
      ['CHEM 2140', 'Lab B', 'a.boateng'],
      ['CHEM 3310', 'Lab M', 'l.ferrante'],
    ]);
    for (const r of rows) {
      expect(r.weekday).toBeGreaterThanOrEqual(1);
      expect(r.ends_at > r.starts_at).toBe(true);
      expect(r.room).toBeTruthy();
      expect(r.capacity).toBe(24);
    }
    // every section assistant is an assistant of the course
    const strays = await db
      .knex('section_assistants as sa')
      .join('sections as s', 's.id', 'sa.section_id')
      .leftJoin('course_staff as cs', function () {
        this.on('cs.course_id', 's.course_id').andOn('cs.user_id', 'sa.user_id').andOn('cs.role', db.knex.raw('?', ['assistant']));
      })
      .whereNull('cs.user_id')
      .select('sa.user_id');
    expect(strays).toEqual([]);
  });

  it('places every demo student in a section of their course, within capacity, with the roster details filled in', async () => {
    const unplaced = await db.knex('enrolments').whereNull('section_id').orWhereNull('family_name').orWhereNull('email').count({ n: '*' }).first();
    expect(Number(unplaced!.n)).toBe(0);
    const wrongCourse = await db.knex('enrolments as e').join('sections as s', 's.id', 'e.section_id').whereRaw('s.course_id <> e.course_id').count({ n: '*' }).first();
    expect(Number(wrongCourse!.n)).toBe(0);
    const load = (await db.knex('enrolments as e').join('sections as s', 's.id', 'e.section_id').groupBy('s.name').select('s.name').count({ n: '*' }).orderBy('s.name')) as unknown as { name: string; n: number }[];
    // 41 in CHEM 2140 (the demo student and 40 more) split 21/20; 21 in CHEM 3310
    expect(load.map((l) => [l.name, Number(l.n)])).toEqual([
      ['Lab A', 21],
      ['Lab B', 20],
      ['Lab M', 21],
    ]);
    const demoStudent = await db.knex('enrolments as e').join('users as u', 'u.id', 'e.user_id').join('sections as s', 's.id', 'e.section_id').where('u.oidc_subject', 'student').select('s.name');
    expect(demoStudent.map((r) => r.name).sort()).toEqual(['Lab A', 'Lab M']);
  });
});
