/**
 * The rows most integration tests start from: the test accounts, and a term
 * with two courses and their teaching teams. Rows only (Knex); each test file
 * adds what is particular to it.
 */
import type { Knex } from 'knex';

/** The stand-in identity provider's test accounts and the names they are stored with. */
export const TEST_PEOPLE = {
  adm: 'Ada Admin',
  lec1: 'Lena Lecturer',
  lec2: 'Leo Otherlecturer',
  ta1: 'Tariq Assistant',
  stu1: 'Stella Student',
  stu2: 'Sam Student',
  nobody: 'Noor Norole',
} as const;

export type TestLogin = keyof typeof TEST_PEOPLE;

/** One users row per login, in the order given (e-mail `<login>@test.example`, signed in through `issuer`); ids by login. */
export async function seedPeople<L extends TestLogin>(k: Knex, issuer: string, logins: readonly L[]): Promise<Record<L, number>> {
  const ids = {} as Record<L, number>;
  for (const login of logins) {
    const [id] = await k('users').insert({ oidc_issuer: issuer, oidc_subject: login, email: `${login}@test.example`, display_name: TEST_PEOPLE[login] });
    ids[login] = id as number;
  }
  return ids;
}

/**
 * Term "Test term" (2026-09-01 to 2026-12-20) with TST 101 "Test course one"
 * (lecturer lec1, assistant ta1) and TST 202 "Test course two" (lecturer lec2).
 */
export async function seedTwoCourses(k: Knex, people: { lec1: number; lec2: number; ta1: number }): Promise<{ term: number; c1: number; c2: number }> {
  const [term] = await k('terms').insert({ name: 'Test term', starts_on: '2026-09-01', ends_on: '2026-12-20' });
  const [c1] = await k('courses').insert({ term_id: term, code: 'TST 101', title: 'Test course one' });
  const [c2] = await k('courses').insert({ term_id: term, code: 'TST 202', title: 'Test course two' });
  await k('course_staff').insert([
    { course_id: c1, user_id: people.lec1, role: 'lecturer' },
    { course_id: c1, user_id: people.ta1, role: 'assistant' },
    { course_id: c2, user_id: people.lec2, role: 'lecturer' },
  ]);
  return { term, c1, c2 };
}

/** Sections "Section A" (assistant `assistant`) and "Section B" of a course. */
export async function seedTwoSections(k: Knex, courseId: number, assistant: number): Promise<{ sectionA: number; sectionB: number }> {
  const [sectionA] = await k('sections').insert({ course_id: courseId, name: 'Section A' });
  const [sectionB] = await k('sections').insert({ course_id: courseId, name: 'Section B' });
  await k('section_assistants').insert({ section_id: sectionA, user_id: assistant });
  return { sectionA, sectionB };
}

/**
 * The small course browser journeys start from: lec1 lectures TST 410 "Bonding in practice"
 * (term Spring 2027) and stu1 is enrolled with student number 1000001.
 */
export async function seedLecturerAndStudentCourse(k: Knex, issuer: string): Promise<{ lec1: number; stu1: number; term: number; course: number }> {
  const { lec1, stu1 } = await seedPeople(k, issuer, ['lec1', 'stu1']);
  const [term] = await k('terms').insert({ name: 'Spring 2027', starts_on: '2027-01-11', ends_on: '2027-05-07' });
  const [course] = await k('courses').insert({ term_id: term, code: 'TST 410', title: 'Bonding in practice' });
  await k('course_staff').insert({ course_id: course, user_id: lec1, role: 'lecturer' });
  await k('enrolments').insert({ course_id: course, user_id: stu1, student_number: '1000001' });
  return { lec1, stu1, term, course };
}
