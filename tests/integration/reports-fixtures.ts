/**
 * Builders shared by the report tests, the upload journey and the marking
 * benchmark: a course with sections, a published curve exercise, and data
 * files made from the variant's own Reference (so "exact" reports are exact
 * by construction; noise and shifts are added on purpose).
 */
import ExcelJS from 'exceljs';
import type { Knex } from 'knex';
import { computeReference, ENGINE_VERSION, type CurveReference } from '@shared/exercises/reference';
import { exerciseSpecSchema, type ExerciseSpec, type ExerciseSpecInput } from '@shared/exercises/spec';
import { drawVariant, type Variant } from '@shared/exercises/variants';
import { distanceFromBohr, energyFromHartree, type DistanceUnit, type EnergyUnit } from '@shared/chemistry/units';
import { defaultCurveScheme } from '@shared/marking/score';
import { seedPeople, seedTwoCourses, seedTwoSections } from '../support/seed-people';

export function curveSpec(overrides: Partial<ExerciseSpecInput> = {}): ExerciseSpec {
  return exerciseSpecSchema.parse({
    title: 'The one-electron bond',
    instructionsMarkdown: '',
    model: {
      family: 'one-electron',
      method: 'lcao',
      za: { kind: 'fixed', value: 1 },
      zb: { kind: 'fixed', value: 1 },
      zeta: { kind: 'list', values: [1, 1.1, 1.2, 1.3] },
      states: ['bonding', 'antibonding'],
      grid: { unit: 'bohr', start: 0.8, end: 8, step: 0.2 },
    },
    variantSeed: 'reports-test',
    dueLocal: '2035-06-01T17:00',
    timeZone: 'Europe/London',
    late: { graceMinutes: 0, penaltyPerDayPercent: 10, capPercent: 50 },
    allowedFileTypes: ['csv', 'tsv', 'xlsx'],
    writeUp: 'optional',
    scheme: defaultCurveScheme({ antibonding: true }),
    ...overrides,
  });
}

export interface SeededCourse {
  users: Record<'lec1' | 'lec2' | 'ta1' | 'stu1' | 'stu2' | 'nobody', number>;
  courseId: number;
  otherCourseId: number;
  sectionA: number;
  sectionB: number;
  enrolments: { stu1: number; stu2: number; nobodyElsewhere: number };
  studentNumbers: { stu1: string; stu2: string };
}

/**
 * Course TST 101 (lecturer lec1; assistant ta1 on section A) with stu1 in
 * section A and stu2 in section B; course TST 202 (lecturer lec2) where
 * `nobody` is a student.
 */
export async function seedCourse(k: Knex, issuer: string): Promise<SeededCourse> {
  const users = await seedPeople(k, issuer, ['lec1', 'lec2', 'ta1', 'stu1', 'stu2', 'nobody']);
  const { c1: courseId, c2: otherCourseId } = await seedTwoCourses(k, users);
  const { sectionA, sectionB } = await seedTwoSections(k, courseId, users.ta1);
  const studentNumbers = { stu1: '2400101', stu2: '2400102' };
  const [e1] = await k('enrolments').insert({ course_id: courseId, user_id: users.stu1, student_number: studentNumbers.stu1, section_id: sectionA });
  const [e2] = await k('enrolments').insert({ course_id: courseId, user_id: users.stu2, student_number: studentNumbers.stu2, section_id: sectionB });
  const [e3] = await k('enrolments').insert({ course_id: otherCourseId, user_id: users.nobody, student_number: '2400999' });
  return { users, courseId, otherCourseId, sectionA, sectionB, enrolments: { stu1: e1, stu2: e2, nobodyElsewhere: e3 }, studentNumbers };
}

/** A published exercise with one revision (rows written directly; the exercises module is not under test here). */
export async function createPublishedExercise(k: Knex, courseId: number, createdBy: number, spec: ExerciseSpec): Promise<{ exerciseId: number; revisionId: number }> {
  const [exerciseId] = await k('exercises').insert({ course_id: courseId, state: 'published', created_by: createdBy });
  const [revisionId] = await k('exercise_revisions').insert({
    exercise_id: exerciseId,
    revision_no: 1,
    spec_json: JSON.stringify(spec),
    engine_version: ENGINE_VERSION,
    created_by: createdBy,
    published_at: new Date(),
  });
  await k('exercises').where({ id: exerciseId }).update({ current_revision_id: revisionId });
  return { exerciseId, revisionId };
}

/** A new published revision of an exercise that becomes current (what an edit with re-marking does). */
export async function addRevision(k: Knex, exerciseId: number, createdBy: number, spec: ExerciseSpec): Promise<number> {
  const last = await k('exercise_revisions').where({ exercise_id: exerciseId }).max({ n: 'revision_no' }).first();
  const [revisionId] = await k('exercise_revisions').insert({
    exercise_id: exerciseId,
    revision_no: Number(last?.n ?? 0) + 1,
    spec_json: JSON.stringify(spec),
    engine_version: ENGINE_VERSION,
    created_by: createdBy,
    published_at: new Date(),
  });
  await k('exercises').where({ id: exerciseId }).update({ current_revision_id: revisionId });
  return revisionId;
}

export function variantOf(spec: ExerciseSpec, studentNumber: string): Variant {
  return drawVariant(spec.model, spec.variantSeed, studentNumber);
}

export function curveReferenceOf(spec: ExerciseSpec, variant: Variant): CurveReference {
  const reference = computeReference(spec.model, variant);
  if (reference.kind !== 'curve') throw new Error('not a curve exercise');
  return reference;
}

export interface CsvOptions {
  distanceUnit?: DistanceUnit;
  energyUnit?: EnergyUnit;
  /** write unit names in the header (default true) */
  unitsInHeader?: boolean;
  /** uniform noise of this amplitude in hartree, from a seeded generator */
  noiseHartree?: number;
  seed?: number;
  /** distances to use instead of the exercise grid (bohr); the reference is then the model itself */
  decimals?: number;
}

/** Seeded uniform numbers in [−1, 1] (mulberry32, public domain). */
export function noiseSource(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (((t ^ (t >>> 14)) >>> 0) / 4294967296) * 2 - 1;
  };
}

const unitHeader: Record<string, string> = { bohr: 'bohr', angstrom: 'Å', pm: 'pm', hartree: 'Eh', ev: 'eV', 'kj/mol': 'kJ/mol', 'kcal/mol': 'kcal/mol', 'cm-1': 'cm-1' };

/** A CSV of the variant's reference curves (bonding, and antibonding when present). */
export function referenceCsv(reference: CurveReference, options: CsvOptions = {}): string {
  const du = options.distanceUnit ?? 'bohr';
  const eu = options.energyUnit ?? 'hartree';
  const withUnits = options.unitsInHeader ?? true;
  const noise = noiseSource(options.seed ?? 1);
  const decimals = options.decimals ?? 8;
  const names = reference.curves.map((c) => (c.state === 'bonding' ? 'E(sigma g)' : 'E(sigma u)'));
  const header = [withUnits ? `R / ${unitHeader[du]}` : 'R', ...names.map((n) => (withUnits ? `${n} / ${unitHeader[eu]}` : n))].join(',');
  const lines = [header];
  reference.grid.bohr.forEach((r, i) => {
    const cells = [distanceFromBohr(r, du).toFixed(6)];
    for (const c of reference.curves) {
      const e = c.energyHartree[i] + (options.noiseHartree ? options.noiseHartree * noise() : 0);
      cells.push(energyFromHartree(e, eu).toFixed(decimals));
    }
    lines.push(cells.join(','));
  });
  return lines.join('\n') + '\n';
}

/** Fills a downloaded personal template's Data sheet with the reference energies (as a student would). */
export async function fillTemplate(template: Uint8Array | Buffer, reference: CurveReference, options: { noiseHartree?: number; seed?: number } = {}): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(template as unknown as ArrayBuffer);
  const meta = workbook.getWorksheet('bondmark-meta');
  if (!meta) throw new Error('no bondmark-meta sheet in the template');
  const values = new Map<string, string>();
  meta.eachRow((row) => values.set(String(row.getCell(1).value), String(row.getCell(2).value)));
  const sheet = workbook.getWorksheet(values.get('dataSheet') ?? 'Data')!;
  const headerRow = Number(values.get('headerRow') ?? 5);
  const energyUnit = (values.get('energyUnit') ?? 'hartree') as EnergyUnit;
  const distanceUnit = (values.get('distanceUnit') ?? 'bohr') as DistanceUnit;
  const letters = (values.get('energyColumns') ?? 'B,C').split(',');
  const noise = noiseSource(options.seed ?? 7);
  for (let i = 0; i < reference.grid.bohr.length; i++) {
    const row = sheet.getRow(headerRow + 1 + i);
    const r = Number(row.getCell(1).value);
    if (!Number.isFinite(r) || Math.abs(r - distanceFromBohr(reference.grid.bohr[i], distanceUnit)) > 1e-6) throw new Error(`template row ${headerRow + 1 + i} holds R = ${r}, not the grid`);
    reference.curves.forEach((c, k) => {
      if (!letters[k]) return;
      const e = c.energyHartree[i] + (options.noiseHartree ? options.noiseHartree * noise() : 0);
      row.getCell(letters[k]).value = Number(energyFromHartree(e, energyUnit).toPrecision(10));
    });
  }
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

/** Types answers into a downloaded personal template's answer cells (named by its hidden sheet: answer:<kind> → cell). */
export async function fillAnswers(template: Uint8Array | Buffer, answers: Record<string, string | number>): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(template as unknown as ArrayBuffer);
  const meta = workbook.getWorksheet('bondmark-meta');
  if (!meta) throw new Error('no bondmark-meta sheet in the template');
  const cells = new Map<string, string>();
  let dataSheet = 'Data';
  meta.eachRow((row) => {
    const key = String(row.getCell(1).value);
    if (key.startsWith('answer:')) cells.set(key.slice(7), String(row.getCell(2).value));
    if (key === 'dataSheet') dataSheet = String(row.getCell(2).value);
  });
  for (const [name, value] of Object.entries(answers)) {
    const ref = cells.get(name);
    if (!ref) throw new Error(`the template has no answer cell for ${name} (it has ${[...cells.keys()].join(', ')})`);
    const [sheetName, address] = ref.includes('!') ? ref.split('!') : [dataSheet, ref];
    workbook.getWorksheet(sheetName.replace(/^'|'$/g, ''))!.getCell(address).value = value;
  }
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

export interface FormFile {
  name: string;
  bytes: Uint8Array | Buffer | string;
  type?: string;
}

/** A multipart body with `data`, optional `writeup` and optional `choice` (JSON). */
export function uploadForm(data: FormFile | null, extra: { writeup?: FormFile; choice?: unknown } = {}): FormData {
  const form = new FormData();
  const blob = (f: FormFile) => new Blob([typeof f.bytes === 'string' ? f.bytes : new Uint8Array(f.bytes)], { type: f.type ?? 'application/octet-stream' });
  if (data) form.append('data', blob(data), data.name);
  if (extra.writeup) form.append('writeup', blob(extra.writeup), extra.writeup.name);
  if (extra.choice !== undefined) form.append('choice', typeof extra.choice === 'string' ? extra.choice : JSON.stringify(extra.choice));
  return form;
}

export const minimalPdf = '%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n';

/** Rows in the tables an upload writes, to prove that a refusal stored nothing. */
export async function uploadRowCounts(k: Knex): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const table of ['stored_files', 'reports', 'marks', 'jobs', 'variants']) {
    const row = await k(table).count({ n: '*' }).first();
    out[table] = Number(row?.n ?? 0);
  }
  // sign-ins write audit rows of their own; count what reports write
  const audit = await k('audit_log').where('action', 'like', 'report.%').count({ n: '*' }).first();
  out.audit_log = Number(audit?.n ?? 0);
  return out;
}
