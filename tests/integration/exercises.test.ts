import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startAppContext, type AppContext } from '../support/app-context';
import { CookieClient } from '../support/cookie-client';
import { seedPeople, seedTwoCourses, seedTwoSections } from '../support/seed-people';
import { drawVariant, type Variant } from '@shared/exercises/variants';
import type { ExerciseSpecInput } from '@shared/exercises/spec';
import type { AnswerKeyResponse, ExerciseMutationResponse, ExercisesResponse, PreviewResponse, StaffExercise, StudentExercise } from '@shared/api/exercises';
import { ensureVariant } from '@server/modules/exercises/variants';
import { answerKeyLimits } from '@server/modules/exercises/service';

let ctx: AppContext;
let k: AppContext['db']['knex'];
const ids = { c1: 0, c2: 0, secA: 0, secB: 0, stu1Enrol: 0, stu2Enrol: 0, withdrawn: 0, lec1: 0 };
/** active students of course 1 (stu1 plus roster people who never signed in) */
const c1Numbers = ['1000001', '1000002', '1000003', '1000004', '1000005', '1000006', '1000007', '1000008'];
const clients = new Map<string, CookieClient>();

async function as(login: string): Promise<CookieClient> {
  if (!clients.has(login)) clients.set(login, await ctx.signIn(login));
  return clients.get(login)!;
}

async function call<T = unknown>(login: string | null, method: string, path: string, body?: unknown) {
  const client = login ? await as(login) : new CookieClient();
  const headers: Record<string, string> = {};
  if (body !== undefined) headers['content-type'] = 'application/json';
  if (login && method !== 'GET') headers['x-csrf-token'] = await ctx.csrf(client);
  return client.json<T>(`${ctx.baseUrl}/api/v1${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
}

type ErrorBody = { error: { code: string; message: string; details?: { location: string; path: string; message: string }[] & Record<string, unknown> } };

const base = {
  dueLocal: '2026-10-16T17:00',
  timeZone: 'Europe/London',
  late: { graceMinutes: 10, penaltyPerDayPercent: 10, capPercent: 50 },
};

function oneElectronSpec(over: Partial<ExerciseSpecInput> = {}): ExerciseSpecInput {
  return {
    ...base,
    title: 'The one-electron bond (LCAO)',
    instructionsMarkdown: 'Compute **E(R)** for both states.',
    model: {
      family: 'one-electron',
      method: 'lcao',
      za: { kind: 'fixed', value: 1 },
      zb: { kind: 'fixed', value: 1 },
      zeta: { kind: 'list', values: [1, 1.1, 1.2, 1.3] },
      states: ['bonding', 'antibonding'],
      grid: { unit: 'bohr', start: 0.5, end: 8, step: 0.25 },
    },
    variantSeed: 'autumn-2026-one-electron',
    scheme: {
      checks: [
        { kind: 'curve-rms', id: 'rms', label: 'Curve RMS deviation', weight: 4, full: 0.001, zero: 0.01 },
        { kind: 'equilibrium-distance', id: 're', label: 'Equilibrium distance', weight: 3, full: 0.02, zero: 0.2 },
        { kind: 'antibonding-repulsive', id: 'rep', label: 'Antibonding curve repulsive', weight: 1 },
        { kind: 'manual', id: 'writeup', label: 'Write-up', weight: 2, description: 'Discussion of the nodal plane' },
      ],
    },
    ...over,
  } as ExerciseSpecInput;
}

function diatomicSpec(over: Partial<ExerciseSpecInput> = {}): ExerciseSpecInput {
  return {
    ...base,
    title: 'MO diagrams of second-row diatomics',
    model: { family: 'diatomic', species: ['O2', 'N2', 'O2+', 'B2', 'C2', 'F2'], order: 'auto' },
    variantSeed: 'diatomics-seed',
    scheme: {
      checks: [
        { kind: 'configuration', id: 'config', label: 'Configuration', weight: 2 },
        { kind: 'bond-order', id: 'bo', label: 'Bond order', weight: 1 },
        { kind: 'term-symbol', id: 'term', label: 'Ground term', weight: 1 },
      ],
    },
    ...over,
  } as ExerciseSpecInput;
}

async function count(table: string, where: Record<string, unknown> = {}) {
  const row = await k(table).where(where).count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

async function variantsOf(revisionId: number) {
  const rows = await k('variants as v').join('enrolments as e', 'e.id', 'v.enrolment_id').where('v.revision_id', revisionId).select('e.student_number', 'v.variant_key', 'v.variant_json', 'v.template_token', 'v.enrolment_id');
  return new Map(rows.map((r) => [r.student_number as string, { key: r.variant_key as string, variant: (typeof r.variant_json === 'string' ? JSON.parse(r.variant_json) : r.variant_json) as Variant, token: r.template_token as string, enrolmentId: r.enrolment_id as number }]));
}

async function createAs(login: string, courseId: number, spec: ExerciseSpecInput) {
  return call<ExerciseMutationResponse>(login, 'POST', `/courses/${courseId}/exercises`, spec);
}

beforeAll(async () => {
  ctx = await startAppContext();
  k = ctx.db.knex;
  const user = async (login: string | null, name: string, email: string) =>
    (await k('users').insert({ oidc_issuer: login ? ctx.issuer : null, oidc_subject: login, email, display_name: name }))[0] as number;
  const people = await seedPeople(k, ctx.issuer, ['lec1', 'lec2', 'ta1', 'stu1', 'stu2']);
  ids.lec1 = people.lec1;
  ({ c1: ids.c1, c2: ids.c2 } = await seedTwoCourses(k, people));
  ({ sectionA: ids.secA, sectionB: ids.secB } = await seedTwoSections(k, ids.c1, people.ta1));
  [ids.stu1Enrol] = await k('enrolments').insert({ course_id: ids.c1, user_id: people.stu1, student_number: c1Numbers[0], section_id: ids.secA });
  for (const [i, number] of c1Numbers.slice(1).entries()) {
    const u = await user(null, `Roster Person ${i}`, `r${number}@test.example`);
    await k('enrolments').insert({ course_id: ids.c1, user_id: u, student_number: number, section_id: i % 2 === 0 ? ids.secA : ids.secB, given_name: 'Roster', family_name: `Person ${i}` });
  }
  const gone = await user(null, 'Withdrawn Person', 'gone@test.example');
  [ids.withdrawn] = await k('enrolments').insert({ course_id: ids.c1, user_id: gone, student_number: '1000099', status: 'withdrawn' });
  [ids.stu2Enrol] = await k('enrolments').insert({ course_id: ids.c2, user_id: people.stu2, student_number: '2000001' });
});

afterAll(async () => {
  await ctx?.close();
});

describe('creating an exercise', () => {
  it('needs a session (401) and refuses everyone but the lecturers of the course and admins (403), leaving nothing behind', async () => {
    expect((await call(null, 'GET', `/courses/${ids.c1}/exercises`)).status).toBe(401);
    expect((await call(null, 'POST', `/courses/${ids.c1}/exercises`, oneElectronSpec())).status).toBe(401);
    for (const login of ['lec2', 'ta1', 'stu1', 'nobody']) {
      const r = await createAs(login, ids.c1, oneElectronSpec());
      expect(r.status, login).toBe(403);
      expect((r.body as unknown as ErrorBody).error.code).toBe('forbidden');
    }
    expect(await count('exercises')).toBe(0);
    expect(await count('exercise_revisions')).toBe(0);
  });

  it('a lecturer creates a draft with revision 1, recorded in the audit log', async () => {
    const r = await createAs('lec1', ids.c1, oneElectronSpec());
    expect(r.status).toBe(201);
    const ex = r.body.exercise;
    expect(ex).toMatchObject({ view: 'staff', state: 'draft', course: { id: ids.c1, code: 'TST 101' }, revision: { revisionNo: 1, publishedAt: null }, permissions: { author: true } });
    expect(ex.revisions).toHaveLength(1);
    // defaults of the schema are filled in and stored
    expect(ex.spec.allowedFileTypes).toEqual(['csv', 'tsv', 'xlsx']);
    expect(ex.spec.writeUp).toBe('optional');
    // 17:00 in London on 16 October 2026 is 16:00 UTC (British Summer Time until 25 October 2026; IANA tz database)
    expect(ex.dueAt).toBe('2026-10-16T16:00:00.000Z');
    const audit = await k('audit_log').where({ action: 'exercise.created', entity_id: String(ex.id) });
    expect(audit).toHaveLength(1);
    expect(await count('variants')).toBe(0);
  });

  it('an admin may create one in any course (404 for a course that does not exist)', async () => {
    const r = await createAs('adm', ids.c2, diatomicSpec({ title: 'Admin-made draft' }));
    expect(r.status).toBe(201);
    expect(r.body.exercise.course.id).toBe(ids.c2);
    expect((await createAs('adm', 987654, diatomicSpec())).status).toBe(404);
  });

  it('answers invalid specs with 400 and the path of every bad field, storing nothing', async () => {
    const before = await count('exercises');
    const bad = oneElectronSpec({
      title: '',
      dueLocal: '16/10/2026 17:00',
      timeZone: 'Mars/Olympus_Mons',
    });
    const m = bad.model as Extract<ExerciseSpecInput['model'], { family: 'one-electron' }>;
    m.grid = { unit: 'bohr', start: 2, end: 1, step: 0.1 };
    m.zeta = { kind: 'list', values: [1, -1.2] };
    (bad.scheme.checks as unknown[]).push({ kind: 'bond-order', id: 'bo', label: 'Bond order', weight: 1 });
    const r = await createAs('lec1', ids.c1, bad);
    expect(r.status).toBe(400);
    const err = (r.body as unknown as ErrorBody).error;
    expect(err.code).toBe('validation_failed');
    const paths = err.details!.map((d) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['title', 'dueLocal', 'timeZone', 'model.grid.end', 'scheme.checks.4.kind']));
    expect(err.details!.every((d) => d.location === 'body')).toBe(true);
    expect(err.message).toMatch(/^Invalid body\./);
    expect(await count('exercises')).toBe(before);
  });

  it('names the field the engine refuses: a negative exponent, an unknown species, the exact model’s upper state with unequal charges', async () => {
    const zeta = oneElectronSpec();
    (zeta.model as { zeta: unknown }).zeta = { kind: 'list', values: [1, -1.2] };
    const r1 = await createAs('lec1', ids.c1, zeta);
    expect(r1.status).toBe(400);
    expect((r1.body as unknown as ErrorBody).error.details![0]).toMatchObject({ path: 'model.zeta.values.1', message: expect.stringMatching(/above zero/) });

    const r2 = await createAs('lec1', ids.c1, diatomicSpec({ model: { family: 'diatomic', species: ['O2', 'Qq2'], order: 'auto' } }));
    expect(r2.status).toBe(400);
    expect((r2.body as unknown as ErrorBody).error.details![0]).toMatchObject({ path: 'model.species.1', message: expect.stringMatching(/Qq2/) });

    const exact = oneElectronSpec();
    Object.assign(exact.model, { method: 'exact', zb: { kind: 'list', values: [1, 2] }, zeta: { kind: 'fixed', value: 1 } });
    const r3 = await createAs('lec1', ids.c1, exact);
    expect(r3.status).toBe(400);
    expect((r3.body as unknown as ErrorBody).error.details![0]).toMatchObject({ path: 'model.states', message: expect.stringMatching(/g\/u symmetry/) });
  });
});

describe('the life of an exercise', () => {
  let exId = 0;
  let rev1 = 0;

  beforeAll(async () => {
    const r = await createAs('lec1', ids.c1, oneElectronSpec({ title: 'Lifecycle exercise' }));
    exId = r.body.exercise.id;
    rev1 = r.body.exercise.revision.id;
  });

  it('lists drafts to staff only; students of the course do not see them, others get 403', async () => {
    const lec = await call<ExercisesResponse>('lec1', 'GET', `/courses/${ids.c1}/exercises`);
    expect(lec.status).toBe(200);
    expect(lec.body.canAuthor).toBe(true);
    const mine = lec.body.exercises.find((e) => e.id === exId)!;
    expect(mine).toMatchObject({ state: 'draft', family: 'one-electron', revisionNo: 1, counts: { students: 8, withVariant: 0, checks: 4 } });
    const ta = await call<ExercisesResponse>('ta1', 'GET', `/courses/${ids.c1}/exercises`);
    expect(ta.status).toBe(200);
    expect(ta.body.canAuthor).toBe(false);
    expect(ta.body.exercises.map((e) => e.id)).toContain(exId);
    const stu = await call<ExercisesResponse>('stu1', 'GET', `/courses/${ids.c1}/exercises`);
    expect(stu.status).toBe(200);
    expect(stu.body.exercises).toEqual([]);
    expect((await call('stu2', 'GET', `/courses/${ids.c1}/exercises`)).status).toBe(403);
    expect((await call('lec2', 'GET', `/courses/${ids.c1}/exercises`)).status).toBe(403);
    expect((await call('nobody', 'GET', `/courses/${ids.c1}/exercises`)).status).toBe(403);
  });

  it('shows a draft to staff, hides it from its students (404) and refuses outsiders (403)', async () => {
    const ta = await call<StaffExercise>('ta1', 'GET', `/exercises/${exId}`);
    expect(ta.status).toBe(200);
    expect(ta.body).toMatchObject({ view: 'staff', permissions: { author: false } });
    expect((await call('stu1', 'GET', `/exercises/${exId}`)).status).toBe(404);
    expect((await call('stu2', 'GET', `/exercises/${exId}`)).status).toBe(403);
    expect((await call('lec2', 'GET', `/exercises/${exId}`)).status).toBe(403);
    expect((await call('lec1', 'GET', `/exercises/999999`)).status).toBe(404);
  });

  it('updates a draft in place; another course’s lecturer and an assistant cannot edit it', async () => {
    const spec = oneElectronSpec({ title: 'Lifecycle exercise, edited' });
    const denied1 = await call<ErrorBody>('lec2', 'PUT', `/exercises/${exId}`, spec);
    const denied2 = await call<ErrorBody>('ta1', 'PUT', `/exercises/${exId}`, spec);
    expect([denied1.status, denied2.status]).toEqual([403, 403]);
    expect((await call<StaffExercise>('lec1', 'GET', `/exercises/${exId}`)).body.spec.title).toBe('Lifecycle exercise');

    const r = await call<ExerciseMutationResponse>('lec1', 'PUT', `/exercises/${exId}`, spec);
    expect(r.status).toBe(200);
    expect(r.body.exercise.spec.title).toBe('Lifecycle exercise, edited');
    expect(r.body.exercise.revision.id).toBe(rev1);
    expect(await count('exercise_revisions', { exercise_id: exId })).toBe(1);
    expect(await count('jobs')).toBe(0);
  });

  it('previews a student’s variant before publication without storing it', async () => {
    const r = await call<PreviewResponse>('lec1', 'GET', `/exercises/${exId}/preview?studentNumber=1000003`);
    expect(r.status).toBe(200);
    const spec = (await call<StaffExercise>('lec1', 'GET', `/exercises/${exId}`)).body.spec;
    expect(r.body.stored).toBe(false);
    expect(r.body.variant).toEqual(drawVariant(spec.model, spec.variantSeed, '1000003'));
    expect(r.body.student).toMatchObject({ studentNumber: '1000003', name: 'Roster Person 1', section: 'Section B' });
    expect(r.body.answers?.kind).toBe('curve');
    expect(await count('variants')).toBe(0);
  });

  it('assistants cannot publish (403); a lecturer publishes and every active student gets a variant drawn from the seed', async () => {
    expect((await call('ta1', 'POST', `/exercises/${exId}/publish`)).status).toBe(403);
    expect((await call('lec2', 'POST', `/exercises/${exId}/publish`)).status).toBe(403);
    expect(await count('variants')).toBe(0);

    const r = await call<ExerciseMutationResponse>('lec1', 'POST', `/exercises/${exId}/publish`);
    expect(r.status).toBe(200);
    expect(r.body.exercise.state).toBe('published');
    expect(r.body.exercise.revision.publishedAt).not.toBeNull();
    expect(r.body.variantsDrawn).toBe(8);
    const spec = r.body.exercise.spec;
    const stored = await variantsOf(rev1);
    expect([...stored.keys()].sort()).toEqual(c1Numbers);
    for (const [number, v] of stored) {
      expect(v.variant).toEqual(drawVariant(spec.model, spec.variantSeed, number));
      expect(v.key).toBe(v.variant.key);
      expect(v.token).toMatch(/^[A-Za-z0-9_-]{24}$/);
    }
    expect(new Set([...stored.values()].map((v) => v.token)).size).toBe(8);
    // the withdrawn student gets none
    expect(await count('variants', { enrolment_id: ids.withdrawn })).toBe(0);
    expect(await k('audit_log').where({ action: 'exercise.published', entity_id: String(exId) })).toHaveLength(1);
    // published twice: refused, nothing new
    const again = await call<ErrorBody>('lec1', 'POST', `/exercises/${exId}/publish`);
    expect(again.status).toBe(409);
    expect(await count('variants')).toBe(8);
  });

  it('students of the course now see it, with the due date but without seed or scheme', async () => {
    const list = await call<ExercisesResponse>('stu1', 'GET', `/courses/${ids.c1}/exercises`);
    expect(list.body.exercises).toHaveLength(1);
    expect(list.body.exercises[0]).toMatchObject({ id: exId, state: 'published', dueLocal: '2026-10-16T17:00', timeZone: 'Europe/London', dueAt: '2026-10-16T16:00:00.000Z', counts: null });
    expect(list.body.canAuthor).toBe(false);
    const one = await call<StudentExercise>('stu1', 'GET', `/exercises/${exId}`);
    expect(one.status).toBe(200);
    expect(one.body.view).toBe('student');
    expect(one.body.instructionsMarkdown).toContain('**E(R)**');
    expect(JSON.stringify(one.body)).not.toContain('autumn-2026-one-electron');
    expect(one.body).not.toHaveProperty('spec');
    expect((await call('stu2', 'GET', `/exercises/${exId}`)).status).toBe(403);
  });

  it('the same seed and rules give every student the same variant in another exercise', async () => {
    const other = await createAs('lec1', ids.c1, oneElectronSpec({ title: 'Same rules, other exercise' }));
    const pub = await call<ExerciseMutationResponse>('lec1', 'POST', `/exercises/${other.body.exercise.id}/publish`);
    expect(pub.status).toBe(200);
    const a = await variantsOf(rev1);
    const b = await variantsOf(other.body.exercise.revision.id);
    for (const n of c1Numbers) expect(b.get(n)!.key).toBe(a.get(n)!.key);
    // and the draw does depend on the student: eight students over four exponents do not all get one value
    expect(new Set([...a.values()].map((v) => v.key)).size).toBeGreaterThan(1);
  });

  it('editing a published exercise without remark=true answers 409 and changes nothing', async () => {
    const before = { revisions: await count('exercise_revisions', { exercise_id: exId }), jobs: await count('jobs'), variants: await count('variants'), audit: await count('audit_log') };
    const spec = oneElectronSpec({ title: 'Lifecycle exercise, edited' });
    (spec.scheme.checks[1] as { zero: number }).zero = 0.3;
    const r = await call<ErrorBody>('lec1', 'PUT', `/exercises/${exId}`, spec);
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('conflict');
    expect(r.body.error.message).toMatch(/re-mark/i);
    expect(r.body.error.details).toMatchObject({ reason: 'remark-confirmation-required', nextRevisionNo: 2, reportCount: 0 });
    const explicitNo = await call<ErrorBody>('lec1', 'PUT', `/exercises/${exId}`, { ...spec, remark: false });
    expect(explicitNo.status).toBe(409);
    expect({ revisions: await count('exercise_revisions', { exercise_id: exId }), jobs: await count('jobs'), variants: await count('variants'), audit: await count('audit_log') }).toEqual(before);
    const now = (await call<StaffExercise>('lec1', 'GET', `/exercises/${exId}`)).body;
    expect((now.spec.scheme.checks[1] as { zero: number }).zero).toBe(0.2);
  });

  it('with remark=true it creates a published revision 2, copies every variant (rule unchanged) and queues the re-marking job', async () => {
    // plant a variant that the current rule would not draw: a copy must keep it, a redraw would not
    const planted = { family: 'one-electron', key: 'za=1;zb=1;zeta=1.25', za: 1, zb: 1, zeta: 1.25 };
    await k('variants').where({ revision_id: rev1, enrolment_id: ids.stu1Enrol }).update({ variant_key: planted.key, variant_json: JSON.stringify(planted) });
    const spec = oneElectronSpec({ title: 'Lifecycle exercise, edited' });
    (spec.scheme.checks[1] as { zero: number }).zero = 0.3;
    const r = await call<ExerciseMutationResponse>('lec1', 'PUT', `/exercises/${exId}`, { ...spec, remark: true });
    expect(r.status).toBe(200);
    const ex = r.body.exercise;
    expect(ex.state).toBe('published');
    expect(ex.revision).toMatchObject({ revisionNo: 2, changed: ['scheme'] });
    expect(ex.revision.publishedAt).not.toBeNull();
    expect(ex.revisions.map((x) => x.revisionNo)).toEqual([1, 2]);
    expect(r.body.variantsDrawn).toBe(8);

    const job = await k('jobs').where({ id: r.body.remarkJobId }).first();
    expect(job).toMatchObject({ kind: 'remark-exercise', state: 'queued' });
    expect(typeof job.payload_json === 'string' ? JSON.parse(job.payload_json) : job.payload_json).toEqual({ exerciseId: exId, revisionId: ex.revision.id });

    const old = await variantsOf(rev1);
    const now = await variantsOf(ex.revision.id);
    for (const n of c1Numbers) {
      expect(now.get(n)!.variant, n).toEqual(old.get(n)!.variant);
      expect(now.get(n)!.token).not.toBe(old.get(n)!.token);
    }
    expect(now.get('1000001')!.variant).toEqual(planted);
    expect(await k('audit_log').where({ action: 'exercise.revised', entity_id: String(exId) })).toHaveLength(1);
  });

  it('a new seed is a new rule: revision 3 redraws from it', async () => {
    const spec = oneElectronSpec({ title: 'Lifecycle exercise, edited', variantSeed: 'a-new-seed' });
    (spec.scheme.checks[1] as { zero: number }).zero = 0.3;
    const r = await call<ExerciseMutationResponse>('lec1', 'PUT', `/exercises/${exId}`, { ...spec, remark: true });
    expect(r.status).toBe(200);
    expect(r.body.exercise.revision).toMatchObject({ revisionNo: 3, changed: ['variantSeed'] });
    const now = await variantsOf(r.body.exercise.revision.id);
    const m = r.body.exercise.spec.model;
    for (const n of c1Numbers) expect(now.get(n)!.variant).toEqual(drawVariant(m, 'a-new-seed', n));
    expect(await count('jobs', { kind: 'remark-exercise' })).toBe(2);
  });

  it('an unchanged spec changes nothing, even on a published exercise', async () => {
    const current = (await call<StaffExercise>('lec1', 'GET', `/exercises/${exId}`)).body;
    const jobs = await count('jobs');
    const r = await call<ExerciseMutationResponse>('lec1', 'PUT', `/exercises/${exId}`, current.spec);
    expect(r.status).toBe(200);
    expect(r.body.unchanged).toBe(true);
    expect(r.body.exercise.revision.revisionNo).toBe(3);
    expect(await count('jobs')).toBe(jobs);
  });

  it('ensureVariant draws and stores the variant of a student enrolled after publication, once', async () => {
    const [u] = await k('users').insert({ email: 'late@test.example', display_name: 'Late Comer' });
    const [enrolmentId] = await k('enrolments').insert({ course_id: ids.c1, user_id: u, student_number: '1000050' });
    const exercise = await k('exercises').where({ id: exId }).first();
    const revision = await k('exercise_revisions').where({ id: exercise.current_revision_id }).first();
    const spec = typeof revision.spec_json === 'string' ? JSON.parse(revision.spec_json) : revision.spec_json;
    const first = await k.transaction((trx) => ensureVariant(trx, exercise, revision.id, enrolmentId));
    expect(first.variant).toEqual(drawVariant(spec.model, spec.variantSeed, '1000050'));
    expect(first.templateToken).toHaveLength(24);
    const second = await ensureVariant(k, { id: exId }, revision.id, enrolmentId);
    expect(second.id).toBe(first.id);
    expect(second.templateToken).toBe(first.templateToken);
    expect(await count('variants', { enrolment_id: enrolmentId })).toBe(1);
    // an enrolment of another course is refused
    await expect(ensureVariant(k, exercise, revision.id, ids.stu2Enrol)).rejects.toMatchObject({ status: 404 });
    await k('variants').where({ enrolment_id: enrolmentId }).delete();
    await k('enrolments').where({ id: enrolmentId }).update({ status: 'withdrawn' });
  });

  it('answer key: every variant with its numbers and students; assistants see only their sections; students are refused', async () => {
    const lec = await call<AnswerKeyResponse>('lec1', 'GET', `/exercises/${exId}/answer-key`);
    expect(lec.status).toBe(200);
    expect(lec.body.revisionNo).toBe(3);
    expect(lec.body.complete).toBe(true);
    expect(lec.body.variants.map((v) => v.key)).toEqual(['za=1;zb=1;zeta=1', 'za=1;zb=1;zeta=1.1', 'za=1;zb=1;zeta=1.2', 'za=1;zb=1;zeta=1.3']);
    const zeta1 = lec.body.variants[0].answers!;
    expect(zeta1.kind).toBe('curve');
    if (zeta1.kind === 'curve') {
      expect(zeta1.reBohr).toBeCloseTo(2.493, 3); // science.md §1, LCAO ζ = 1: Re = 2.493 a0 (Pauling & Wilson 1935; from memory)
      expect(zeta1.energyAtReHartree).toBeCloseTo(-0.56483, 5); // science.md §1, E(Re) = −0.56483 Eh
      expect(zeta1.deEv).toBeCloseTo(1.764, 3); // science.md §1, De = 1.764 eV
      expect(zeta1.antibondingRepulsive).toBe(true);
    }
    const allStudents = lec.body.variants.flatMap((v) => v.students.map((s) => s.studentNumber)).sort();
    expect(allStudents).toEqual(c1Numbers);

    const ta = await call<AnswerKeyResponse>('ta1', 'GET', `/exercises/${exId}/answer-key`);
    expect(ta.status).toBe(200);
    const taStudents = ta.body.variants.flatMap((v) => v.students);
    expect(taStudents.length).toBeGreaterThan(0);
    expect(taStudents.every((s) => s.section === 'Section A')).toBe(true);
    expect(taStudents.length).toBeLessThan(c1Numbers.length);

    const first = await call<AnswerKeyResponse>('lec1', 'GET', `/exercises/${exId}/answer-key?revision=1`);
    expect(first.body.revisionNo).toBe(1);
    // the planted variant of revision 1 is listed beside the four the rule draws
    expect(first.body.variants.map((v) => v.key)).toContain('za=1;zb=1;zeta=1.25');

    for (const login of ['stu1', 'stu2', 'lec2']) expect((await call(login, 'GET', `/exercises/${exId}/answer-key`)).status, login).toBe(403);
    expect((await call('lec1', 'GET', `/exercises/${exId}/answer-key?revision=9`)).status).toBe(404);
  });

  it('preview after publication gives the stored variant; scope and roles are checked', async () => {
    const r = await call<PreviewResponse>('lec1', 'GET', `/exercises/${exId}/preview?studentNumber=1000001`);
    expect(r.status).toBe(200);
    expect(r.body.stored).toBe(true);
    expect(r.body.revisionNo).toBe(3);
    const stored = await variantsOf(r.body.revisionId);
    expect(r.body.variant).toEqual(stored.get('1000001')!.variant);
    // 1000004 is in the assistant's section A; 1000003 is in section B
    expect((await call('ta1', 'GET', `/exercises/${exId}/preview?studentNumber=1000004`)).status).toBe(200);
    expect((await call('ta1', 'GET', `/exercises/${exId}/preview?studentNumber=1000003`)).status).toBe(403);
    expect((await call('lec1', 'GET', `/exercises/${exId}/preview?studentNumber=9999999`)).status).toBe(404);
    const missing = await call<ErrorBody>('lec1', 'GET', `/exercises/${exId}/preview`);
    expect(missing.status).toBe(400);
    expect(missing.body.error.details![0]).toMatchObject({ location: 'query', path: 'studentNumber' });
    expect((await call('stu1', 'GET', `/exercises/${exId}/preview?studentNumber=1000001`)).status).toBe(403);
  });

  it('closes (lecturers only), stays visible to students, and publishing again draws for students enrolled since', async () => {
    expect((await call('ta1', 'POST', `/exercises/${exId}/close`)).status).toBe(403);
    const r = await call<ExerciseMutationResponse>('lec1', 'POST', `/exercises/${exId}/close`);
    expect(r.status).toBe(200);
    expect(r.body.exercise.state).toBe('closed');
    expect((await call('lec1', 'POST', `/exercises/${exId}/close`)).status).toBe(409);
    const list = await call<ExercisesResponse>('stu1', 'GET', `/courses/${ids.c1}/exercises`);
    expect(list.body.exercises.find((e) => e.id === exId)?.state).toBe('closed');

    const [u] = await k('users').insert({ email: 'later@test.example', display_name: 'Later Comer' });
    await k('enrolments').insert({ course_id: ids.c1, user_id: u, student_number: '1000060' });
    const reopen = await call<ExerciseMutationResponse>('lec1', 'POST', `/exercises/${exId}/publish`);
    expect(reopen.status).toBe(200);
    expect(reopen.body.exercise.state).toBe('published');
    expect(reopen.body.variantsDrawn).toBe(1);
    expect(reopen.body.exercise.revision.revisionNo).toBe(3);
  });

  it('a draft cannot be closed', async () => {
    const draft = await createAs('lec1', ids.c1, diatomicSpec());
    const r = await call<ErrorBody>('lec1', 'POST', `/exercises/${draft.body.exercise.id}/close`);
    expect(r.status).toBe(409);
    expect((await k('exercises').where({ id: draft.body.exercise.id }).first()).state).toBe('draft');
  });
});

describe('answer keys of the other families', () => {
  it('diatomics: configuration, bond order, unpaired electrons and term symbol per species', async () => {
    const r = await createAs('lec1', ids.c1, diatomicSpec({ title: 'Diatomic key' }));
    const key = await call<AnswerKeyResponse>('lec1', 'GET', `/exercises/${r.body.exercise.id}/answer-key`);
    expect(key.status).toBe(200);
    const bySpecies = new Map(key.body.variants.map((v) => [v.key, v.answers]));
    // science.md §4 (Huber & Herzberg 1979; from memory): O2 ³Σg⁻ bond order 2; N2 ¹Σg⁺ 3; O2⁺ ²Πg 2.5; F2 ¹Σg⁺ 1; B2 ³Σg⁻; C2 ¹Σg⁺
    expect(bySpecies.get('species=O2')).toMatchObject({ kind: 'diagram', termSymbol: '³Σg⁻', bondOrder: 2, unpairedElectrons: 2 });
    expect(bySpecies.get('species=N2')).toMatchObject({ termSymbol: '¹Σg⁺', bondOrder: 3, unpairedElectrons: 0 });
    expect(bySpecies.get('species=O2+')).toMatchObject({ termSymbol: '²Πg', bondOrder: 2.5, unpairedElectrons: 1 });
    expect(bySpecies.get('species=F2')).toMatchObject({ termSymbol: '¹Σg⁺', bondOrder: 1 });
    expect(bySpecies.get('species=B2')).toMatchObject({ termSymbol: '³Σg⁻' });
    expect(bySpecies.get('species=C2')).toMatchObject({ termSymbol: '¹Σg⁺' });
    expect(key.body.variants.every((v) => v.students.length === 0)).toBe(true);
  });

  it('a request past its time budget returns what it computed, variants held by students first; asking again completes the key', async () => {
    const r = await createAs('lec1', ids.c1, oneElectronSpec({ title: 'Budget', variantSeed: 'budget-seed', model: { ...(oneElectronSpec().model as object), zeta: { kind: 'list', values: [1.01, 1.02, 1.03, 1.04, 1.05, 1.06] } } as ExerciseSpecInput['model'] }));
    const id = r.body.exercise.id;
    await call('lec1', 'POST', `/exercises/${id}/publish`);
    const held = new Set((await k('variants').where({ revision_id: r.body.exercise.revision.id }).distinct('variant_key')).map((x) => x.variant_key as string));
    const saved = answerKeyLimits.budgetMs;
    answerKeyLimits.budgetMs = 0;
    try {
      const first = await call<AnswerKeyResponse>('lec1', 'GET', `/exercises/${id}/answer-key`);
      expect(first.body.complete).toBe(false);
      const done = first.body.variants.filter((v) => v.answers);
      expect(done).toHaveLength(1);
      expect(held.has(done[0].key)).toBe(true);
      expect(first.body.variants.find((v) => !v.answers)!.error).toMatch(/not computed yet/);
      let last = first.body;
      for (let i = 0; i < 6 && !last.complete; i++) last = (await call<AnswerKeyResponse>('lec1', 'GET', `/exercises/${id}/answer-key`)).body;
      expect(last.complete).toBe(true);
      expect(last.variants.every((v) => v.answers?.kind === 'curve')).toBe(true);
    } finally {
      answerKeyLimits.budgetMs = saved;
    }
  });

  it('Hückel: x values per system', async () => {
    const spec: ExerciseSpecInput = {
      ...base,
      title: 'Hückel pi energies',
      model: { family: 'huckel', systems: [{ kind: 'chain', n: 4 }, { kind: 'ring', n: 6 }] },
      variantSeed: 'pi',
      scheme: { checks: [{ kind: 'huckel-energies', id: 'x', label: 'Orbital energies', weight: 1, full: 0.01, zero: 0.1 }] },
    };
    const r = await createAs('lec1', ids.c1, spec);
    expect(r.status).toBe(201);
    const key = await call<AnswerKeyResponse>('lec1', 'GET', `/exercises/${r.body.exercise.id}/answer-key`);
    const [butadiene, benzene] = key.body.variants.map((v) => v.answers!);
    if (butadiene.kind !== 'huckel' || benzene.kind !== 'huckel') throw new Error('expected Hückel answers');
    // science.md §5: butadiene x = ±1.618, ±0.618; benzene x = ±2, ±1 (twice), delocalization 2β (closed forms 2cos(kπ/(N+1)), 2cos(2πk/N))
    expect(butadiene.x.map((x) => +x.toFixed(3))).toEqual([1.618, 0.618, -0.618, -1.618]);
    expect(benzene.x.map((x) => +x.toFixed(6))).toEqual([2, 1, 1, -1, -1, -2]);
    expect(benzene.delocalizationBeta).toBeCloseTo(2, 9);
  });
});
