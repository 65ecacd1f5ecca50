/**
 * The demo scenario, loaded by `npm start` into an empty database. Tests never
 * depend on it. Later features add their part of the scenario here.
 */
import type { Knex } from 'knex';
import { demoOtherStaff, demoRoleAccounts, demoStudents, type DemoPerson } from './demo-people';
import { seedDemoExercises } from './demo-exercises';
import { seedDemoReports } from './demo-reports';

export async function seedDemo(knex: Knex, issuer: string): Promise<void> {
  await knex.transaction(async (trx) => {
    const ids = new Map<string, number>();
    for (const p of [...demoRoleAccounts, ...demoOtherStaff, ...demoStudents]) {
      const [id] = await trx('users').insert({
        oidc_issuer: issuer,
        oidc_subject: p.login,
        email: p.email,
        display_name: `${p.givenName} ${p.familyName}`,
      });
      ids.set(p.login, id);
    }
    const id = (login: string) => ids.get(login)!;
    await trx('user_site_roles').insert({ user_id: id('admin'), role: 'admin' });

    const [termId] = await trx('terms').insert({ name: 'Autumn 2026', starts_on: '2026-09-14', ends_on: '2026-12-18' });
    const [physChem] = await trx('courses').insert({ term_id: termId, code: 'CHEM 2140', title: 'Computational Quantum Chemistry Laboratory' });
    const [moTheory] = await trx('courses').insert({ term_id: termId, code: 'CHEM 3310', title: 'Molecular Orbital Theory Laboratory' });

    await trx('course_staff').insert([
      { course_id: physChem, user_id: id('lecturer'), role: 'lecturer' },
      { course_id: physChem, user_id: id('assistant'), role: 'assistant' },
      { course_id: physChem, user_id: id('a.boateng'), role: 'assistant' },
      { course_id: moTheory, user_id: id('h.solvang'), role: 'lecturer' },
      { course_id: moTheory, user_id: id('lecturer'), role: 'lecturer' },
      { course_id: moTheory, user_id: id('l.ferrante'), role: 'assistant' },
    ]);

    // Lab sections: two for CHEM 2140 (the demo assistant teaches Lab A, where the demo student is), one for CHEM 3310.
    const section = async (courseId: number, name: string, weekday: number, startsAt: string, endsAt: string, room: string, assistant: string) => {
      const [sectionId] = await trx('sections').insert({ course_id: courseId, name, weekday, starts_at: startsAt, ends_at: endsAt, room, capacity: 24 });
      await trx('section_assistants').insert({ section_id: sectionId, user_id: id(assistant) });
      return sectionId as number;
    };
    const labA = await section(physChem, 'Lab A', 2, '09:00', '12:00', 'Hartree Building C-204', 'assistant');
    const labB = await section(physChem, 'Lab B', 4, '14:00', '17:00', 'Hartree Building C-204', 'a.boateng');
    const labM = await section(moTheory, 'Lab M', 3, '13:00', '16:00', 'Hartree Building C-118', 'l.ferrante');

    const enrol = (courseId: number, p: DemoPerson, sectionId: number) => ({
      course_id: courseId,
      user_id: id(p.login),
      student_number: p.login === 'student' ? '2400001' : p.login.slice(1),
      family_name: p.familyName,
      given_name: p.givenName,
      email: p.email,
      section_id: sectionId,
      status: 'active',
    });
    const rows = [enrol(physChem, demoRoleAccounts[3], labA)];
    demoStudents.slice(0, 40).forEach((p, i) => rows.push(enrol(physChem, p, i % 2 === 0 ? labA : labB)));
    demoStudents.slice(40).forEach((p) => rows.push(enrol(moTheory, p, labM)));
    rows.push(enrol(moTheory, demoRoleAccounts[3], labM));
    await trx('enrolments').insert(rows);

    // exercises of every model family, in every state, with variants for the enrolled students
    await seedDemoExercises(trx);
    // reports in every state: on time, late, resubmitted, flagged, being reviewed, returned
    await seedDemoReports(trx);

    await trx('audit_log').insert({ actor_id: null, action: 'demo.seeded', entity_type: 'site', entity_id: null, after_json: JSON.stringify({ people: ids.size }) });
  });
}
