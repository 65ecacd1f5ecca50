/**
 * The roster of a course: reading it (scoped for assistants), the two-step
 * import (preview writes nothing; apply writes everything in one transaction
 * or nothing), manual add, move between sections, withdraw and reinstate.
 *
 * Students who are not yet Bondmark users get a users row without an
 * identity (oidc_issuer/oidc_subject NULL); their first sign-in attaches the
 * identity by e-mail (session/service.ts, recordSignIn).
 */
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import type {
  AddStudentBody,
  MissingStudent,
  RosterApplyResult,
  RosterEntry,
  RosterImportRecord,
  RosterMapping,
  RosterPreview,
} from '@shared/api/roster';
import { addStudentBodySchema } from '@shared/api/roster';
import { recordAudit } from '../../platform/audit';
import { badRequest, conflict, notFound } from '../../platform/errors';
import { emailsInFile, planImport, type ImportPlan, type PlannedRow } from './import-plan';
import { readRosterFile, type SheetTable } from './read-file';
import { accountsByEmail, enrolmentsOf, importsOf, sectionRefs, toExisting, type EnrolmentRow } from './repo';

const iso = (d: Date | string | null) => (d == null ? null : new Date(d).toISOString());
const tidy = (s: string) => s.replace(/\s+/g, ' ').trim();

function entryOf(r: EnrolmentRow): RosterEntry {
  return {
    enrolmentId: r.id,
    userId: r.user_id,
    studentNumber: r.student_number,
    familyName: r.family_name,
    givenName: r.given_name,
    email: r.email ?? r.user_email,
    section: r.section_id ? { id: r.section_id, name: r.section_name ?? '' } : null,
    status: r.status,
    withdrawnAt: iso(r.withdrawn_at),
    signedIn: r.oidc_subject !== null,
  };
}

export async function rosterEntries(db: Knex, courseId: number, sectionIds?: number[]): Promise<RosterEntry[]> {
  return (await enrolmentsOf(db, courseId, { sectionIds })).map(entryOf);
}

async function entryById(db: Knex, courseId: number, enrolmentId: number): Promise<RosterEntry> {
  const [row] = await enrolmentsOf(db, courseId, { ids: [enrolmentId] });
  if (!row) throw notFound(`There is no enrolment ${enrolmentId} on this course's roster.`);
  return entryOf(row);
}

/* ---------- import ---------- */

export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
}

const sha256 = (buf: Buffer) => createHash('sha256').update(buf).digest('hex');

async function planFor(db: Knex | Knex.Transaction, courseId: number, table: SheetTable, mapping: RosterMapping | undefined): Promise<ImportPlan> {
  const [existing, sections, accounts, staff] = await Promise.all([
    enrolmentsOf(db, courseId),
    sectionRefs(db, courseId),
    accountsByEmail(db, emailsInFile(table, mapping)),
    db('course_staff').where({ course_id: courseId }).select('user_id'),
  ]);
  return planImport(table, mapping, {
    existing: existing.map(toExisting),
    sections,
    accountsByEmail: accounts,
    staffUserIds: new Set(staff.map((s) => s.user_id as number)),
  });
}

/** The file name as shown in messages: no path, no control characters, at most 255 characters. */
export function cleanFileName(name: string): string {
  const base = (name || 'roster').split(/[\\/]/).pop()!.replace(/[\u0000-\u001f\u007f]/g, '').trim();
  return (base || 'roster').slice(0, 255);
}

export async function previewImport(db: Knex, courseId: number, file: UploadedFile, mapping: RosterMapping | undefined): Promise<RosterPreview> {
  const fileName = cleanFileName(file.originalname);
  const table = await readRosterFile(file.buffer, fileName);
  const plan = await planFor(db, courseId, table, mapping);
  return {
    fileName,
    sha256: sha256(file.buffer),
    format: table.format,
    sheetName: table.sheetName,
    delimiter: table.delimiter,
    headerRowNumber: plan.headerRowNumber,
    columns: plan.columns,
    suggestedMapping: plan.suggestedMapping,
    mapping: plan.mapping,
    problems: plan.problems,
    warnings: plan.warnings,
    rows: plan.rows,
    missing: plan.missing,
    summary: plan.summary,
    canApply: plan.canApply,
  };
}

async function createStudent(trx: Knex.Transaction, courseId: number, row: PlannedRow): Promise<number> {
  let userId = row.account?.id;
  if (!userId) {
    [userId] = await trx('users').insert({
      oidc_issuer: null,
      oidc_subject: null,
      email: row.email,
      display_name: `${row.givenName} ${row.familyName}`.slice(0, 200),
    });
  }
  const [id] = await trx('enrolments').insert({
    course_id: courseId,
    user_id: userId,
    student_number: row.studentNumber,
    family_name: row.familyName,
    given_name: row.givenName,
    email: row.email,
    section_id: row.sectionId ?? null,
    status: 'active',
  });
  return id;
}

async function updateStudent(trx: Knex.Transaction, row: PlannedRow): Promise<void> {
  const e = row.existing!;
  const now = new Date();
  await trx('enrolments')
    .where({ id: e.id })
    .update({
      family_name: row.familyName,
      given_name: row.givenName,
      email: row.email,
      ...(row.sectionId !== undefined ? { section_id: row.sectionId } : {}),
      updated_at: now,
    });
  // a person known only from the roster takes the roster's e-mail and name (that is how sign-in finds them)
  await trx('users').where({ id: e.userId }).whereNull('oidc_subject').update({ email: row.email, display_name: `${row.givenName} ${row.familyName}`.slice(0, 200), updated_at: now });
}

/** Every row's problem, for the 400 answer of a refused apply. */
function refusal(plan: ImportPlan, fileName: string) {
  const rowErrors = plan.rows.flatMap((r) => r.errors.map((e) => ({ rowNumber: r.rowNumber, ...e })));
  const count = plan.summary.error;
  const why = plan.problems.length
    ? plan.problems[0]
    : `${count} ${count === 1 ? 'row has an error' : 'rows have errors'}, first: ${rowErrors[0]?.message ?? ''}`;
  return badRequest(`Nothing was imported from ${fileName}: ${why}`, { problems: plan.problems, rows: rowErrors.slice(0, 200) });
}

/**
 * Applies a file to the roster in one transaction: the course row is locked,
 * the plan is made again inside the transaction, and any error row refuses the
 * whole file. Students missing from the file are reported, never removed.
 */
export async function applyImport(
  db: Knex,
  actorId: number,
  courseId: number,
  file: UploadedFile,
  mapping: RosterMapping,
  expectedSha256: string | undefined,
): Promise<RosterApplyResult> {
  const fileName = cleanFileName(file.originalname);
  const digest = sha256(file.buffer);
  if (expectedSha256 && expectedSha256.toLowerCase() !== digest) {
    throw conflict(`${fileName} is not the file that was previewed (its SHA-256 differs). Preview it again before applying.`);
  }
  const table = await readRosterFile(file.buffer, fileName);
  return db.transaction(async (trx) => {
    await trx('courses').where({ id: courseId }).forUpdate().first('id');
    const plan = await planFor(trx, courseId, table, mapping);
    if (!plan.canApply) throw refusal(plan, fileName);
    const created: string[] = [];
    for (const row of plan.writes.create) {
      await createStudent(trx, courseId, row);
      created.push(row.studentNumber);
    }
    for (const row of plan.writes.update) await updateStudent(trx, row);
    const summary = plan.summary;
    const [importId] = await trx('roster_imports').insert({
      course_id: courseId,
      actor_id: actorId,
      file_name: fileName,
      sha256: digest,
      mapping_json: JSON.stringify(
        Object.fromEntries(Object.entries(mapping).map(([field, i]) => [field, i === null ? null : { index: i, letter: plan.columns[i]?.letter, header: plan.columns[i]?.header }])),
      ),
      summary_json: JSON.stringify({
        ...summary,
        format: table.format,
        sheetName: table.sheetName,
        newStudentNumbers: created,
        changedStudentNumbers: plan.writes.update.map((r) => r.studentNumber),
        missingStudentNumbers: plan.missing.map((m) => m.studentNumber),
      }),
    });
    await recordAudit(trx, {
      actorId,
      action: 'roster.imported',
      entityType: 'course',
      entityId: courseId,
      after: { importId, fileName, sha256: digest, ...summary },
    });
    return { importId, summary, missing: plan.missing };
  });
}

const parseJson = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);

export async function importHistory(db: Knex, courseId: number): Promise<RosterImportRecord[]> {
  const rows = await importsOf(db, courseId);
  return rows.map((r) => {
    const s = parseJson(r.summary_json) as RosterImportRecord['summary'];
    return {
      id: r.id,
      fileName: r.file_name,
      sha256: r.sha256,
      actorName: r.actor_name,
      createdAt: iso(r.created_at)!,
      summary: { rows: s.rows, new: s.new, changed: s.changed, unchanged: s.unchanged, error: s.error, missing: s.missing },
    };
  });
}

/* ---------- one student at a time ---------- */

async function activeSectionOr400(trx: Knex.Transaction, courseId: number, sectionId: number | null) {
  if (sectionId === null) return null;
  const section = await trx('sections').where({ course_id: courseId, id: sectionId }).first('id', 'name', 'archived');
  if (!section) throw badRequest(`There is no section ${sectionId} in this course.`, [{ location: 'body', path: 'sectionId', message: 'Unknown section.' }]);
  if (section.archived) throw conflict(`Section "${section.name}" is archived; choose another.`);
  return section as { id: number; name: string };
}

export async function addStudent(db: Knex, actorId: number, courseId: number, input: AddStudentBody): Promise<RosterEntry> {
  const body = addStudentBodySchema.parse(input);
  const id = await db.transaction(async (trx) => {
    await trx('courses').where({ id: courseId }).forUpdate().first('id');
    await activeSectionOr400(trx, courseId, body.sectionId);
    const same = await trx('enrolments').where({ course_id: courseId, student_number: body.studentNumber }).first('id');
    if (same) throw conflict(`Student number ${body.studentNumber} is already on this course's roster.`, [{ location: 'body', path: 'studentNumber', message: 'Already on the roster.' }]);
    const accounts = await accountsByEmail(trx, [body.email]);
    const account = accounts.get(body.email) ?? null;
    const taken = await trx('enrolments as e')
      .join('users as u', 'u.id', 'e.user_id')
      .where('e.course_id', courseId)
      .andWhere((w) => w.where('e.email', body.email).orWhere('u.email', body.email))
      .first('e.student_number');
    if (taken) throw conflict(`${body.email} belongs to student number ${taken.student_number}, already on this course's roster.`, [{ location: 'body', path: 'email', message: 'Already on the roster.' }]);
    if (account) {
      const staff = await trx('course_staff').where({ course_id: courseId, user_id: account.id }).first('role');
      if (staff) throw conflict(`${account.displayName} is ${staff.role === 'lecturer' ? 'a lecturer' : 'an assistant'} of this course and cannot also be a student of it.`);
    }
    const enrolmentId = await createStudent(trx, courseId, {
      rowNumber: 0,
      studentNumber: body.studentNumber,
      familyName: tidy(body.familyName),
      givenName: tidy(body.givenName),
      email: body.email,
      sectionId: body.sectionId,
      existing: null,
      account,
    });
    await recordAudit(trx, { actorId, action: 'roster.student_added', entityType: 'enrolment', entityId: enrolmentId, after: { courseId, studentNumber: body.studentNumber, sectionId: body.sectionId } });
    return enrolmentId;
  });
  return entryById(db, courseId, id);
}

async function lockedEnrolment(trx: Knex.Transaction, courseId: number, enrolmentId: number) {
  const row = await trx('enrolments').where({ course_id: courseId, id: enrolmentId }).forUpdate().first('id', 'section_id', 'status', 'student_number');
  if (!row) throw notFound(`There is no enrolment ${enrolmentId} on this course's roster.`);
  return row as { id: number; section_id: number | null; status: 'active' | 'withdrawn'; student_number: string };
}

export async function moveStudent(db: Knex, actorId: number, courseId: number, enrolmentId: number, sectionId: number | null): Promise<RosterEntry> {
  await db.transaction(async (trx) => {
    const row = await lockedEnrolment(trx, courseId, enrolmentId);
    await activeSectionOr400(trx, courseId, sectionId);
    if (row.section_id === sectionId) return;
    await trx('enrolments').where({ id: enrolmentId }).update({ section_id: sectionId, updated_at: new Date() });
    await recordAudit(trx, { actorId, action: 'roster.student_moved', entityType: 'enrolment', entityId: enrolmentId, before: { sectionId: row.section_id }, after: { sectionId } });
  });
  return entryById(db, courseId, enrolmentId);
}

/** Withdraw keeps the enrolment and all its reports and marks; it only sets the status (reinstate undoes it). */
export async function setWithdrawn(db: Knex, actorId: number, courseId: number, enrolmentId: number, withdrawn: boolean): Promise<RosterEntry> {
  await db.transaction(async (trx) => {
    const row = await lockedEnrolment(trx, courseId, enrolmentId);
    const status = withdrawn ? 'withdrawn' : 'active';
    if (row.status === status) return;
    const now = new Date();
    await trx('enrolments').where({ id: enrolmentId }).update({ status, withdrawn_at: withdrawn ? now : null, updated_at: now });
    await recordAudit(trx, { actorId, action: withdrawn ? 'roster.student_withdrawn' : 'roster.student_reinstated', entityType: 'enrolment', entityId: enrolmentId, before: { status: row.status }, after: { status } });
  });
  return entryById(db, courseId, enrolmentId);
}

export type { MissingStudent };
