/**
 * Personal templates and the student's exercise list: the XLSX round trip
 * (generate through the API, read back with exceljs, identify student,
 * exercise and variant from the hidden sheet), role and scope on every route,
 * the section ZIP, and GET /my/exercises.
 */
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exerciseSpecSchema, type ExerciseSpecInput } from '@shared/exercises/spec';
import { gridValues, type Variant } from '@shared/exercises/variants';
import { computeReference } from '@shared/exercises/reference';
import { zonedWallTimeToInstant } from '@shared/exercises/late';
import type { MyExercisesResponse } from '@shared/api/templates';
import { startAppContext, type AppContext } from '../support/app-context';
import { CookieClient } from '../support/cookie-client';

let ctx: AppContext;
const ids = {} as Record<string, number>;

const XLSX_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

const late = { graceMinutes: 15, penaltyPerDayPercent: 10, capPercent: 50 };
const scheme: ExerciseSpecInput['scheme'] = { checks: [{ kind: 'curve-rms', id: 'rms', label: 'Curve RMS', weight: 1, full: 0.001, zero: 0.01 }] };

/** a wall-clock time `days` from now, in UTC, as YYYY-MM-DDTHH:MM */
const utcLocal = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 16);

const curveSpec: ExerciseSpecInput = {
  title: 'The one-electron bond',
  model: {
    family: 'one-electron',
    method: 'lcao',
    za: { kind: 'fixed', value: 1 },
    zb: { kind: 'list', values: [1, 2] },
    zeta: { kind: 'list', values: [1, 1.2] },
    states: ['bonding', 'antibonding'],
    grid: { unit: 'angstrom', start: 0.5, end: 3, step: 0.25 },
  },
  variantSeed: 'templates-test',
  dueLocal: '2027-10-16T17:00',
  timeZone: 'Europe/London',
  late,
  scheme,
};

const diatomicSpec: ExerciseSpecInput = {
  title: 'MO diagrams',
  model: { family: 'diatomic', species: ['O2', 'N2', 'F2'], order: 'auto' },
  variantSeed: 'mo',
  dueLocal: utcLocal(-2),
  timeZone: 'UTC',
  late,
  scheme: {
    checks: [
      { kind: 'configuration', id: 'conf', label: 'Configuration', weight: 1 },
      { kind: 'bond-order', id: 'bo', label: 'Bond order', weight: 1 },
      { kind: 'unpaired-electrons', id: 'up', label: 'Unpaired', weight: 1 },
      { kind: 'term-symbol', id: 'ts', label: 'Term symbol', weight: 1 },
    ],
  },
};

const huckelSpec: ExerciseSpecInput = {
  title: 'Pi systems',
  model: { family: 'huckel', systems: [{ kind: 'chain', n: 6 }] },
  variantSeed: 'pi',
  dueLocal: utcLocal(-20),
  timeZone: 'America/New_York',
  late: { graceMinutes: 0, penaltyPerDayPercent: 10, capPercent: 100 },
  scheme: { checks: [{ kind: 'huckel-energies', id: 'he', label: 'Hückel energies', weight: 1, full: 0.01, zero: 0.1 }] },
};

async function addExercise(courseId: number, spec: ExerciseSpecInput, state: 'draft' | 'published' | 'closed'): Promise<number> {
  const k = ctx.db.knex;
  const parsed = exerciseSpecSchema.parse(spec);
  const [exerciseId] = await k('exercises').insert({ course_id: courseId, state, created_by: ids.lec1 });
  const [revisionId] = await k('exercise_revisions').insert({
    exercise_id: exerciseId,
    revision_no: 1,
    spec_json: JSON.stringify(parsed),
    engine_version: 'test',
    created_by: ids.lec1,
    published_at: state === 'draft' ? null : new Date(),
  });
  await k('exercises').where({ id: exerciseId }).update({ current_revision_id: revisionId });
  ids[`rev${exerciseId}`] = revisionId;
  return exerciseId;
}

beforeAll(async () => {
  ctx = await startAppContext();
  const k = ctx.db.knex;
  const user = async (login: string, name: string) =>
    (await k('users').insert({ oidc_issuer: ctx.issuer, oidc_subject: login, email: `${login}@test.example`, display_name: name }))[0];
  for (const [login, name] of [
    ['lec1', 'Lena Lecturer'],
    ['lec2', 'Leo Otherlecturer'],
    ['ta1', 'Tariq Assistant'],
    ['stu1', 'Stella Student'],
    ['stu2', 'Sam Student'],
    ['nobody', 'Noor Norole'],
    ['x3', 'Xavier Third'],
    ['x4', 'Wanda Withdrawn'],
  ]) {
    ids[login] = await user(login, name);
  }
  const [term] = await k('terms').insert({ name: 'Autumn 2027', starts_on: '2027-09-01', ends_on: '2027-12-20' });
  ids.c1 = (await k('courses').insert({ term_id: term, code: 'CHEM 2140', title: 'Bonding lab' }))[0];
  ids.c2 = (await k('courses').insert({ term_id: term, code: 'CHEM 3150', title: 'Other lab' }))[0];
  await k('course_staff').insert([
    { course_id: ids.c1, user_id: ids.lec1, role: 'lecturer' },
    { course_id: ids.c1, user_id: ids.ta1, role: 'assistant' },
    { course_id: ids.c2, user_id: ids.lec2, role: 'lecturer' },
  ]);
  ids.s1 = (await k('sections').insert({ course_id: ids.c1, name: 'Monday A' }))[0];
  ids.s2 = (await k('sections').insert({ course_id: ids.c1, name: 'Tuesday B' }))[0];
  ids.s3 = (await k('sections').insert({ course_id: ids.c1, name: 'Empty C' }))[0];
  ids.s9 = (await k('sections').insert({ course_id: ids.c2, name: 'Other M' }))[0];
  await k('section_assistants').insert({ section_id: ids.s1, user_id: ids.ta1 });
  const enrol = async (key: string, courseId: number, userId: number, number: string, sectionId: number, given: string, family: string, status: 'active' | 'withdrawn' = 'active') => {
    ids[key] = (await k('enrolments').insert({ course_id: courseId, user_id: userId, student_number: number, section_id: sectionId, given_name: given, family_name: family, status }))[0];
  };
  await enrol('e1', ids.c1, ids.stu1, '2400101', ids.s1, 'Stella', 'Starling');
  await enrol('e2', ids.c1, ids.stu2, '2400102', ids.s2, 'Sam', 'Sparrow');
  await enrol('e3', ids.c1, ids.x3, '2400103', ids.s1, 'Xavier', 'Third');
  await enrol('e4', ids.c1, ids.x4, '2400104', ids.s1, 'Wanda', 'Withdrawn', 'withdrawn');
  await enrol('e9', ids.c2, ids.nobody, '2400999', ids.s9, 'Noor', 'Elsewhere');

  ids.exCurve = await addExercise(ids.c1, curveSpec, 'published');
  ids.exDiatomic = await addExercise(ids.c1, diatomicSpec, 'published');
  ids.exHuckel = await addExercise(ids.c1, huckelSpec, 'published');
  ids.exDraft = await addExercise(ids.c1, { ...curveSpec, title: 'Not yet' }, 'draft');
  ids.exClosed = await addExercise(ids.c1, { ...curveSpec, title: 'Long gone', dueLocal: utcLocal(-60), timeZone: 'UTC' }, 'closed');
  ids.exOther = await addExercise(ids.c2, { ...curveSpec, title: 'Other course exercise' }, 'published');
  // Stella has two extra days on the MO exercise
  await k('extensions').insert({ exercise_id: ids.exDiatomic, enrolment_id: ids.e1, extra_minutes: 2 * 1440, reason: 'illness', granted_by: ids.lec1 });
});

afterAll(async () => {
  await ctx?.close();
});

/** GET with the client's session, keeping the body as bytes. */
async function download(client: CookieClient, path: string) {
  const headers: Record<string, string> = {};
  if (client.cookies.size) headers.cookie = [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  const res = await fetch(`${ctx.baseUrl}${path}`, { headers, redirect: 'manual' });
  const bytes = Buffer.from(await res.arrayBuffer());
  return { status: res.status, headers: res.headers, bytes, json: () => JSON.parse(bytes.toString('utf8')) };
}

async function workbookOf(bytes: Buffer) {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  return wb;
}

function metaOf(wb: ExcelJS.Workbook): Map<string, string> {
  const sheet = wb.getWorksheet('bondmark-meta')!;
  const meta = new Map<string, string>();
  sheet.eachRow((row) => meta.set(String(row.getCell(1).value), String(row.getCell(2).value)));
  return meta;
}

const variantRows = (enrolmentId: number) => ctx.db.knex('variants').where({ enrolment_id: enrolmentId });

describe('GET /exercises/:id/template — the round trip', () => {
  let bytes: Buffer;
  let headers: Headers;

  beforeAll(async () => {
    const stu1 = await ctx.signIn('stu1');
    const r = await download(stu1, `/api/v1/exercises/${ids.exCurve}/template`);
    expect(r.status).toBe(200);
    bytes = r.bytes;
    headers = r.headers;
  });

  it('answers an XLSX named after course, exercise and student, with its length and an RFC 5987 file name', () => {
    const name = `CHEM2140-ex${ids.exCurve}-2400101.xlsx`;
    expect(headers.get('content-type')).toBe(XLSX_TYPE);
    expect(headers.get('content-length')).toBe(String(bytes.length));
    expect(headers.get('content-disposition')).toBe(`attachment; filename="${name}"; filename*=UTF-8''${name}`);
    expect(headers.get('cache-control')).toBe('private, no-store');
    expect(bytes.subarray(0, 2).toString('latin1')).toBe('PK');
  });

  it('carries the student, the exercise and the variant on the About sheet', async () => {
    const wb = await workbookOf(bytes);
    expect(wb.worksheets.map((w) => w.name)).toEqual(['About', 'Data', 'bondmark-meta']);
    const about = wb.getWorksheet('About')!;
    expect(about.getCell('B4').value).toBe('CHEM 2140 · Bonding lab');
    expect(about.getCell('B5').value).toBe('The one-electron bond');
    expect(about.getCell('B6').value).toBe('Stella Starling'); // the roster's names
    expect(about.getCell('B7').value).toBe('2400101');
    // 2027-10-16 17:00 in London is BST (UTC+1) — IANA tz database
    expect(about.getCell('B8').value).toBe('Saturday, 16 October 2027, 17:00 (Europe/London)');
    expect(about.getCell('B9').value).toBe('none');
    expect(about.getCell('B10').value).toBe("10% off per started day late after 15 minutes' grace, at most 50%.");
    const stored = await variantRows(ids.e1).where({ revision_id: ids[`rev${ids.exCurve}`] }).first();
    const variant = (typeof stored.variant_json === 'string' ? JSON.parse(stored.variant_json) : stored.variant_json) as Extract<Variant, { family: 'one-electron' }>;
    const labels = new Map<string, unknown>();
    about.eachRow((row) => labels.set(String(row.getCell(1).value), row.getCell(2).value));
    expect(labels.get('Nuclear charge Za')).toBe(variant.za);
    expect(labels.get('Nuclear charge Zb')).toBe(variant.zb);
    expect(labels.get('Orbital exponent ζ')).toBe(variant.zeta);
    expect(labels.get('Units')).toBe('Distances in ångström (Å), energies in hartree (Eh).');
  });

  it('pre-fills the R grid in the exercise unit under labelled, empty energy columns', async () => {
    const wb = await workbookOf(bytes);
    const data = wb.getWorksheet('Data')!;
    expect(data.getRow(5).values).toEqual([undefined, 'R / Å', 'E bonding / Eh', 'E antibonding / Eh']);
    const grid = gridValues({ start: 0.5, end: 3, step: 0.25 });
    expect(grid).toHaveLength(11);
    grid.forEach((r, i) => {
      expect(data.getCell(6 + i, 1).value).toBe(r);
      expect(data.getCell(6 + i, 2).value).toBeNull();
      expect(data.getCell(6 + i, 3).value).toBeNull();
      expect(data.getCell(6 + i, 2).dataValidation).toMatchObject({ type: 'decimal' });
    });
    expect(data.getCell(6 + grid.length, 1).value).toBeNull();
  });

  it('hides the meta sheet and identifies student, exercise and variant from it', async () => {
    const wb = await workbookOf(bytes);
    expect(wb.getWorksheet('bondmark-meta')!.state).toBe('veryHidden');
    const meta = metaOf(wb);
    expect(Object.fromEntries([...meta].filter(([k]) => k !== 'templateToken' && k !== 'variantKey' && k !== 'generatedAt'))).toEqual({
      format: 'bondmark-template',
      version: '1',
      exerciseId: String(ids.exCurve),
      studentNumber: '2400101',
      dataSheet: 'Data',
      headerRow: '5',
      distanceUnit: 'angstrom',
      energyUnit: 'hartree',
      distanceColumn: 'A',
      energyColumns: 'B,C',
      energyConvention: 'total',
      pointCount: '11',
      family: 'one-electron',
      revisionId: String(ids[`rev${ids.exCurve}`]),
    });
    // the token alone leads back to the student, the exercise and the variant
    const found = await ctx.db
      .knex('variants as v')
      .join('enrolments as en', 'en.id', 'v.enrolment_id')
      .join('exercise_revisions as r', 'r.id', 'v.revision_id')
      .where('v.template_token', meta.get('templateToken')!)
      .first('en.student_number', 'r.exercise_id', 'v.variant_key');
    expect(found).toEqual({ student_number: '2400101', exercise_id: ids.exCurve, variant_key: meta.get('variantKey') });
  });

  it('holds no reference value anywhere', async () => {
    const wb = await workbookOf(bytes);
    const meta = metaOf(wb);
    const stored = await variantRows(ids.e1).where({ revision_id: ids[`rev${ids.exCurve}`] }).first();
    const variant = (typeof stored.variant_json === 'string' ? JSON.parse(stored.variant_json) : stored.variant_json) as Variant;
    const reference = computeReference(exerciseSpecSchema.parse(curveSpec).model, variant);
    if (reference.kind !== 'curve') throw new Error('expected a curve reference');
    // (Za ≠ Zb variants have no minimum: then the curves are the only secrets)
    const minimum = reference.minimum ? [reference.minimum.reBohr, reference.minimum.energyHartree, reference.minimum.deEv] : [];
    const secrets = [...reference.curves.flatMap((c) => c.energyHartree), ...minimum];
    const numbers: number[] = [];
    wb.eachSheet((ws) => ws.eachRow((row) => row.eachCell((cell) => typeof cell.value === 'number' && numbers.push(cell.value))));
    expect(numbers.length).toBeGreaterThan(11);
    for (const s of secrets) expect(numbers.some((n) => Math.abs(n - s) < 1e-6)).toBe(false);
    expect(meta.get('variantKey')).toBe(variant.key);
  });

  it('gives the same variant and token on a second download', async () => {
    const before = await variantRows(ids.e1);
    const stu1 = await ctx.signIn('stu1');
    const again = await download(stu1, `/api/v1/exercises/${ids.exCurve}/template?enrolmentId=${ids.e1}`);
    expect(again.status).toBe(200);
    expect(metaOf(await workbookOf(again.bytes)).get('templateToken')).toBe(metaOf(await workbookOf(bytes)).get('templateToken'));
    expect(await variantRows(ids.e1)).toHaveLength(before.length);
  });

  it('is recognised by the report reader once filled in, with its units', async () => {
    const { readReport } = await import('@shared/marking/read');
    const wb = await workbookOf(bytes);
    const data = wb.getWorksheet('Data')!;
    const meta = metaOf(wb);
    const variant = (await variantRows(ids.e1).where({ revision_id: ids[`rev${ids.exCurve}`] }).first()).variant_json;
    const reference = computeReference(exerciseSpecSchema.parse(curveSpec).model, typeof variant === 'string' ? JSON.parse(variant) : variant);
    if (reference.kind !== 'curve') throw new Error('expected a curve reference');
    reference.curves.forEach((c, j) => c.energyHartree.forEach((e, i) => (data.getCell(6 + i, 2 + j).value = e)));
    const filled = new Uint8Array(await wb.xlsx.writeBuffer());
    const read = await readReport(filled, { fileName: 'filled.xlsx' });
    if (!read.ok) throw new Error(`not read: ${read.error.message}`);
    expect(read.template).toMatchObject({ exerciseId: String(ids.exCurve), studentNumber: '2400101', templateToken: meta.get('templateToken'), version: 1 });
    expect(read.units).toMatchObject({ distance: 'angstrom', energy: 'hartree', distanceSource: 'template', energySource: 'template' });
    expect(read.choice).toEqual({ sheet: 'Data', distanceColumn: 'A', energyColumns: ['B', 'C'] });
    expect(read.convention).toBe('total');
    // distances come back in bohr: 0.5 Å / 0.529177210903 Å per bohr (CODATA 2018)
    expect(read.points.distance[0]).toBeCloseTo(0.5 / 0.529177210903, 9);
    expect(read.points.distance).toHaveLength(11);
  });
});

describe('answer cells of diatomic and Hückel templates', () => {
  it('names one answer cell per typed check on the Answers sheet', async () => {
    const stu1 = await ctx.signIn('stu1');
    const r = await download(stu1, `/api/v1/exercises/${ids.exDiatomic}/template`);
    expect(r.status).toBe(200);
    const wb = await workbookOf(r.bytes);
    expect(wb.worksheets.map((w) => w.name)).toEqual(['About', 'Answers', 'bondmark-meta']);
    const meta = metaOf(wb);
    expect([...meta].filter(([k]) => k.startsWith('answer:'))).toEqual([
      ['answer:configuration', 'Answers!B5'],
      ['answer:bond-order', 'Answers!B6'],
      ['answer:unpaired-electrons', 'Answers!B7'],
      ['answer:term-symbol', 'Answers!B8'],
    ]);
    const answers = wb.getWorksheet('Answers')!;
    expect(answers.getCell('A4').value).toBe('Question');
    expect(answers.getCell('A6').value).toBe('Bond order');
    expect(answers.getCell('A8').value).toBe('Ground term symbol');
    for (const row of [5, 6, 7, 8]) expect(answers.getCell(row, 2).value).toBeNull();
    // the two-day extension is on the cover sheet
    expect(String(wb.getWorksheet('About')!.getCell('B9').value)).toMatch(/^\+2 d: your own due moment is /);
  });

  it('asks for the x of every pi orbital of the student’s system in one answer cell', async () => {
    const stu1 = await ctx.signIn('stu1');
    const r = await download(stu1, `/api/v1/exercises/${ids.exHuckel}/template`);
    expect(r.status).toBe(200);
    const wb = await workbookOf(r.bytes);
    const meta = metaOf(wb);
    expect([...meta].filter(([k]) => k.startsWith('answer:'))).toEqual([
      ['answer:huckel-energies', 'Answers!B5'],
      ['answer:pi-energy', 'Answers!B6'],
      ['answer:delocalization-energy', 'Answers!B7'],
    ]);
    const answers = wb.getWorksheet('Answers')!;
    // hexatriene: six carbon p orbitals, six pi orbitals
    expect(answers.getCell('A5').value).toBe('Orbital energies: x for each of the 6 pi orbitals');
    expect(answers.getCell('B5').numFmt).toBe('@');
    const about = new Map<string, unknown>();
    wb.getWorksheet('About')!.eachRow((row) => about.set(String(row.getCell(1).value), row.getCell(2).value));
    expect(about.get('Pi system')).toBe('chain of 6');
    expect(about.get('Pi electrons')).toBe(6);
  });

  it('hands typed answers to the report reader by their check kind', async () => {
    const { readReport } = await import('@shared/marking/read');
    const stu1 = await ctx.signIn('stu1');
    const r = await download(stu1, `/api/v1/exercises/${ids.exHuckel}/template`);
    const wb = await workbookOf(r.bytes);
    // what a student types: x = 2cos(kπ/7), k = 1…6 (closed form for chains, science.md §5), to 3 decimals
    wb.getWorksheet('Answers')!.getCell('B5').value = '1.802, 1.247, 0.445, -0.445, -1.247, -1.802';
    // 2·(1.802 + 1.247 + 0.445), computed from the line above
    wb.getWorksheet('Answers')!.getCell('B6').value = 6.988;
    const read = await readReport(new Uint8Array(await wb.xlsx.writeBuffer()), { fileName: 'pi.xlsx' });
    expect(read.template?.studentNumber).toBe('2400101');
    expect(read.template?.answers['huckel-energies']).toEqual({ cell: 'Answers!B5', value: '1.802, 1.247, 0.445, -0.445, -1.247, -1.802' });
    expect(read.template?.answers['pi-energy']).toEqual({ cell: 'Answers!B6', value: 6.988 });
    expect(read.template?.answers['delocalization-energy']).toEqual({ cell: 'Answers!B7', value: null });
  });
});

describe('GET /exercises/:id/template — role and scope', () => {
  it('needs a session', async () => {
    const r = await download(new CookieClient(), `/api/v1/exercises/${ids.exCurve}/template`);
    expect(r.status).toBe(401);
  });

  it("refuses a student who asks for another student's template, and stores nothing for them", async () => {
    const stu1 = await ctx.signIn('stu1');
    const r = await download(stu1, `/api/v1/exercises/${ids.exCurve}/template?enrolmentId=${ids.e2}`);
    expect(r.status).toBe(403);
    expect(r.json().error.code).toBe('forbidden');
    expect(await variantRows(ids.e2)).toHaveLength(0);
  });

  it("refuses another course's student and another course's lecturer", async () => {
    const other = await ctx.signIn('nobody');
    expect((await download(other, `/api/v1/exercises/${ids.exCurve}/template`)).status).toBe(403);
    const lec2 = await ctx.signIn('lec2');
    expect((await download(lec2, `/api/v1/exercises/${ids.exCurve}/template?enrolmentId=${ids.e2}`)).status).toBe(403);
    expect(await variantRows(ids.e2)).toHaveLength(0);
  });

  it('limits an assistant to the students of their own sections', async () => {
    const ta1 = await ctx.signIn('ta1');
    const refused = await download(ta1, `/api/v1/exercises/${ids.exCurve}/template?enrolmentId=${ids.e2}`);
    expect(refused.status).toBe(403);
    expect(refused.json().error.message).toMatch(/own sections/);
    expect(await variantRows(ids.e2)).toHaveLength(0);
    const allowed = await download(ta1, `/api/v1/exercises/${ids.exCurve}/template?enrolmentId=${ids.e3}`);
    expect(allowed.status).toBe(200);
    expect(metaOf(await workbookOf(allowed.bytes)).get('studentNumber')).toBe('2400103');
  });

  it('lets the lecturer and an admin fetch any active student of the course', async () => {
    const lec1 = await ctx.signIn('lec1');
    const r = await download(lec1, `/api/v1/exercises/${ids.exCurve}/template?enrolmentId=${ids.e2}`);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-disposition')).toContain(`CHEM2140-ex${ids.exCurve}-2400102.xlsx`);
    const wb = await workbookOf(r.bytes);
    expect(wb.getWorksheet('About')!.getCell('B6').value).toBe('Sam Sparrow');
    expect(metaOf(wb).get('studentNumber')).toBe('2400102');
    const adm = await ctx.signIn('adm');
    expect((await download(adm, `/api/v1/exercises/${ids.exCurve}/template?enrolmentId=${ids.e2}`)).status).toBe(200);
  });

  it('asks staff to name the student', async () => {
    const lec1 = await ctx.signIn('lec1');
    const r = await download(lec1, `/api/v1/exercises/${ids.exCurve}/template`);
    expect(r.status).toBe(400);
    expect(r.json().error.message).toMatch(/enrolmentId/);
  });

  it('gives withdrawn students no template', async () => {
    const lec1 = await ctx.signIn('lec1');
    const r = await download(lec1, `/api/v1/exercises/${ids.exCurve}/template?enrolmentId=${ids.e4}`);
    expect(r.status).toBe(409);
    expect(await variantRows(ids.e4)).toHaveLength(0);
  });

  it('hides drafts from students and tells staff they are drafts', async () => {
    const stu1 = await ctx.signIn('stu1');
    expect((await download(stu1, `/api/v1/exercises/${ids.exDraft}/template`)).status).toBe(404);
    const lec1 = await ctx.signIn('lec1');
    expect((await download(lec1, `/api/v1/exercises/${ids.exDraft}/template?enrolmentId=${ids.e1}`)).status).toBe(409);
    expect(await ctx.db.knex('variants').where({ revision_id: ids[`rev${ids.exDraft}`] })).toHaveLength(0);
  });

  it('answers 404 for an unknown exercise or an enrolment of another course, 400 for a malformed id', async () => {
    const lec1 = await ctx.signIn('lec1');
    expect((await download(lec1, `/api/v1/exercises/999999/template`)).status).toBe(404);
    expect((await download(lec1, `/api/v1/exercises/${ids.exCurve}/template?enrolmentId=${ids.e9}`)).status).toBe(404);
    const bad = await download(lec1, `/api/v1/exercises/abc/template`);
    expect(bad.status).toBe(400);
    expect(bad.json().error.details[0]).toMatchObject({ location: 'params', path: 'exerciseId' });
  });
});

describe('GET /exercises/:id/sections/:sectionId/templates.zip', () => {
  const zipPath = () => `/api/v1/exercises/${ids.exCurve}/sections/${ids.s1}/templates.zip`;

  it('refuses assistants, students and other lecturers', async () => {
    for (const login of ['ta1', 'stu1', 'lec2', 'nobody']) {
      const client = await ctx.signIn(login);
      const r = await download(client, zipPath());
      expect(r.status, login).toBe(403);
    }
    expect((await download(new CookieClient(), zipPath())).status).toBe(401);
  });

  it('answers 404 for a section of another course and 409 for a section without active students', async () => {
    const lec1 = await ctx.signIn('lec1');
    expect((await download(lec1, `/api/v1/exercises/${ids.exCurve}/sections/${ids.s9}/templates.zip`)).status).toBe(404);
    const empty = await download(lec1, `/api/v1/exercises/${ids.exCurve}/sections/${ids.s3}/templates.zip`);
    expect(empty.status).toBe(409);
    expect((await download(lec1, `/api/v1/exercises/${ids.exDraft}/sections/${ids.s1}/templates.zip`)).status).toBe(409);
  });

  it('holds one template per active student of the section, none for the withdrawn one', async () => {
    const lec1 = await ctx.signIn('lec1');
    const r = await download(lec1, zipPath());
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toBe('application/zip');
    expect(r.headers.get('content-length')).toBe(String(r.bytes.length));
    expect(r.headers.get('content-disposition')).toContain(`CHEM2140-ex${ids.exCurve}-MondayA-templates.zip`);
    expect(r.headers.get('x-template-count')).toBe('2');
    const zip = await JSZip.loadAsync(r.bytes);
    const names = Object.keys(zip.files).sort();
    expect(names).toEqual([`CHEM2140-ex${ids.exCurve}-2400101.xlsx`, `CHEM2140-ex${ids.exCurve}-2400103.xlsx`]);
    for (const name of names) {
      const wb = await workbookOf(await zip.file(name)!.async('nodebuffer'));
      expect(name).toContain(metaOf(wb).get('studentNumber'));
    }
    expect(await variantRows(ids.e4)).toHaveLength(0);
    const admin = await ctx.signIn('adm');
    expect((await download(admin, zipPath())).status).toBe(200);
  });
});

describe('GET /my/exercises', () => {
  it('needs a session', async () => {
    expect((await download(new CookieClient(), '/api/v1/my/exercises')).status).toBe(401);
  });

  it("lists the student's published exercises with due moments, late rule, window and variant", async () => {
    const stu1 = await ctx.signIn('stu1');
    const r = await stu1.json<MyExercisesResponse>(`${ctx.baseUrl}/api/v1/my/exercises`);
    expect(r.status).toBe(200);
    const byId = new Map(r.body.exercises.map((e) => [e.exerciseId, e]));
    // not the draft, not the other course's exercise
    expect([...byId.keys()].sort((a, b) => a - b)).toEqual([ids.exCurve, ids.exDiatomic, ids.exHuckel, ids.exClosed].sort((a, b) => a - b));
    // open (due in 2027), late (due 2 days ago), closed by the 100% cap (20 days ago), closed by state
    expect(r.body.exercises.map((e) => e.exerciseId)).toEqual([ids.exDiatomic, ids.exCurve, ids.exHuckel, ids.exClosed]);

    const curve = byId.get(ids.exCurve)!;
    expect(curve).toMatchObject({
      title: 'The one-electron bond',
      course: { id: ids.c1, code: 'CHEM 2140', title: 'Bonding lab' },
      family: 'one-electron',
      dueLocal: '2027-10-16T17:00',
      timeZone: 'Europe/London',
      dueAt: '2027-10-16T16:00:00.000Z', // BST, UTC+1 (IANA tz database)
      extensionMinutes: 0,
      window: 'open',
      penaltyNowPercent: 0,
      late: { graceMinutes: 15, penaltyPerDayPercent: 10, capPercent: 50, summary: "10% off per started day late after 15 minutes' grace, at most 50%." },
      templateUrl: `/api/v1/exercises/${ids.exCurve}/template`,
    });
    const stored = await variantRows(ids.e1).where({ revision_id: ids[`rev${ids.exCurve}`] }).first();
    expect(curve.variant.key).toBe(stored.variant_key);
    expect(curve.variant.parameters.map((p) => p.name)).toEqual(['Za', 'Zb', 'ζ']);

    const mo = byId.get(ids.exDiatomic)!;
    expect(mo.extensionMinutes).toBe(2880);
    expect(mo.effectiveDueAt).toBe(new Date(zonedWallTimeToInstant(diatomicSpec.dueLocal, 'UTC').getTime() + 2880 * 60_000).toISOString());
    expect(mo.window).toBe('open'); // due two days ago, but two days' extension

    const pi = byId.get(ids.exHuckel)!;
    expect(pi.timeZone).toBe('America/New_York');
    expect(pi.window).toBe('closed');
    expect(pi.penaltyNowPercent).toBe(100);
    expect(pi.variant.text).toBe('chain of 6');
    expect(byId.get(ids.exClosed)!.window).toBe('closed');
    // no reference values cross the wire
    expect(JSON.stringify(r.body)).not.toMatch(/energy|termSymbol|bondOrder|configuration/i);
  });

  it('shows a late window while a late upload still earns marks', async () => {
    const k = ctx.db.knex;
    const late = await addExercise(ids.c1, { ...curveSpec, title: 'Late one', dueLocal: utcLocal(-2), timeZone: 'UTC' }, 'published');
    const stu1 = await ctx.signIn('stu1');
    const r = await stu1.json<MyExercisesResponse>(`${ctx.baseUrl}/api/v1/my/exercises`);
    const item = r.body.exercises.find((e) => e.exerciseId === late)!;
    expect(item.window).toBe('late');
    // two days and under a minute after the due moment, less 15 minutes' grace: two started days at 10% each
    expect(item.penaltyNowPercent).toBe(20);
    await k('exercises').where({ id: late }).update({ state: 'closed' });
  });

  it('lists only the courses the caller is a student of', async () => {
    for (const login of ['lec1', 'nobody']) {
      const client = await ctx.signIn(login);
      const r = await client.json<MyExercisesResponse>(`${ctx.baseUrl}/api/v1/my/exercises`);
      expect(r.status).toBe(200);
      if (login === 'lec1') expect(r.body.exercises).toEqual([]);
      else expect(r.body.exercises.map((e) => e.exerciseId)).toEqual([ids.exOther]);
    }
  });
});
