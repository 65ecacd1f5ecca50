/**
 * Exercises: authoring (draft → published → closed), revisions, variants for
 * every student, answer keys. Rows from repo.ts become the wire shapes of
 * @shared/api/exercises here. Every state change runs in one transaction
 * with its audit entry; the exercise row is locked first so that two
 * requests on one exercise are served one after the other.
 */
import type { Knex } from 'knex';
import type { Request } from 'express';
import {
  answerKeyOf,
  type AnswerKey,
  type AnswerKeyResponse,
  type ExerciseMutationResponse,
  type ExerciseResponse,
  type ExercisesResponse,
  type ExerciseSummary,
  type PreviewResponse,
  type RevisionSummary,
  type StaffExercise,
  type VariantStudent,
} from '@shared/api/exercises';
import type { ExerciseSpec } from '@shared/exercises/spec';
import { allVariants, drawVariant, type Variant } from '@shared/exercises/variants';
import { computeReference, ENGINE_VERSION } from '@shared/exercises/reference';
import { zonedWallTimeToInstant } from '@shared/exercises/late';
import { assertCourseRole, type CourseRole } from '../../platform/access';
import { recordAudit } from '../../platform/audit';
import { conflict, forbidden, notFound } from '../../platform/errors';
import {
  activeEnrolments,
  assistantSectionIds,
  countActiveStudents,
  courseOf,
  enrolmentByStudentNumber,
  enrolmentsByIds,
  exercisesOfCourse,
  findExercise,
  findRevision,
  parseJson,
  reportCount,
  reportedCounts,
  revisionsOf,
  variantCounts,
  variantsOfRevision,
  type EnrolmentRow,
  type ExerciseRow,
  type RevisionRow,
} from './repo';
import { specOf, storeVariants, variantsForNewRevision } from './variants';

type Db = Knex | Knex.Transaction;
interface Caller {
  id: number;
  isAdmin: boolean;
}

/** Who may do what on one course's exercises, from the caller's course roles. */
export interface ExerciseAccess {
  staff: boolean;
  author: boolean;
  /** assistants (not lecturers, not admins) see only students of their sections */
  sectionScoped: boolean;
}

export function accessFrom(user: Caller, roles: Set<CourseRole>): ExerciseAccess {
  const lecturer = user.isAdmin || roles.has('lecturer');
  const staff = lecturer || roles.has('assistant');
  return { staff, author: lecturer, sectionScoped: !lecturer && roles.has('assistant') };
}

/** Loads an exercise and checks the caller's role in its course (404 first, then 403). */
export async function exerciseFor(db: Knex, req: Request, id: number, allowed: CourseRole[]) {
  const exercise = await findExercise(db, id);
  if (!exercise) throw notFound(`No exercise ${id}.`);
  const roles = await assertCourseRole(db, req, exercise.course_id, allowed);
  return { exercise, access: accessFrom(req.user!, roles) };
}

export function requireAuthor(access: ExerciseAccess) {
  if (!access.author) throw forbidden('Only the lecturers of this course can author its exercises.');
}

const iso = (d: Date | string | null): string | null => (d === null ? null : (d instanceof Date ? d : new Date(d)).toISOString());
const isoNN = (d: Date | string) => iso(d)!;
const dueAtOf = (spec: Pick<ExerciseSpec, 'dueLocal' | 'timeZone'>) => zonedWallTimeToInstant(spec.dueLocal, spec.timeZone).toISOString();

const specFields: (keyof ExerciseSpec)[] = ['title', 'instructionsMarkdown', 'model', 'variantSeed', 'dueLocal', 'timeZone', 'late', 'allowedFileTypes', 'writeUp', 'automaticMarks', 'scheme'];

/** Top-level spec fields that differ between two specs. */
export function changedFields(before: ExerciseSpec, after: ExerciseSpec): string[] {
  return specFields.filter((k) => JSON.stringify(before[k]) !== JSON.stringify(after[k]));
}

function revisionSummaries(rows: RevisionRow[]): RevisionSummary[] {
  const specs = rows.map((r) => specOf(r.spec_json));
  return rows.map((r, i) => ({
    id: r.id,
    revisionNo: r.revision_no,
    createdAt: isoNN(r.created_at),
    createdBy: { id: r.created_by, displayName: r.created_by_name },
    publishedAt: iso(r.published_at),
    engineVersion: r.engine_version,
    changed: i === 0 ? [] : changedFields(specs[i - 1], specs[i]),
  }));
}

/* ---------- reading ---------- */

export async function listExercises(db: Knex, courseId: number, access: ExerciseAccess): Promise<ExercisesResponse> {
  const rows = await exercisesOfCourse(db, courseId, access.staff ? ['draft', 'published', 'closed'] : ['published', 'closed']);
  const [students, variants, reported] = access.staff
    ? await Promise.all([countActiveStudents(db, courseId), variantCounts(db, rows.map((r) => r.current_revision_id!)), reportedCounts(db, rows.map((r) => r.id))])
    : [0, new Map(), new Map()];
  let timeZone: string | null = null;
  const exercises: ExerciseSummary[] = rows.map((r) => {
    const spec = specOf(r.spec_json);
    timeZone = spec.timeZone;
    const v = variants.get(r.current_revision_id!);
    return {
      id: r.id,
      courseId: r.course_id,
      title: spec.title,
      family: spec.model.family,
      state: r.state,
      dueLocal: spec.dueLocal,
      timeZone: spec.timeZone,
      dueAt: dueAtOf(spec),
      revisionNo: r.revision_no,
      publishedAt: iso(r.published_at),
      updatedAt: isoNN(r.updated_at),
      counts: access.staff
        ? { students, withVariant: v?.withVariant ?? 0, distinctVariants: v?.distinct ?? 0, reported: reported.get(r.id) ?? 0, checks: spec.scheme.checks.length }
        : null,
    };
  });
  return { exercises, canAuthor: access.author, timeZone };
}

export async function staffExercise(db: Db, exercise: ExerciseRow, access: ExerciseAccess): Promise<StaffExercise> {
  const [course, revisionRows, students, reported] = await Promise.all([
    courseOf(db, exercise.course_id),
    revisionsOf(db, exercise.id),
    countActiveStudents(db, exercise.course_id),
    reportedCounts(db, [exercise.id]),
  ]);
  const revisions = revisionSummaries(revisionRows);
  const currentRow = revisionRows.find((r) => r.id === exercise.current_revision_id) ?? revisionRows[revisionRows.length - 1];
  const spec = specOf(currentRow.spec_json);
  const v = (await variantCounts(db, [currentRow.id])).get(currentRow.id);
  return {
    view: 'staff',
    id: exercise.id,
    course: course!,
    state: exercise.state,
    spec,
    dueAt: dueAtOf(spec),
    revision: revisions.find((r) => r.id === currentRow.id)!,
    revisions,
    counts: { students, withVariant: v?.withVariant ?? 0, distinctVariants: v?.distinct ?? 0, reported: reported.get(exercise.id) ?? 0, checks: spec.scheme.checks.length },
    permissions: { author: access.author },
    createdAt: isoNN(exercise.created_at),
    updatedAt: isoNN(exercise.updated_at),
  };
}

export async function exerciseView(db: Knex, exercise: ExerciseRow, access: ExerciseAccess): Promise<ExerciseResponse> {
  if (access.staff) return staffExercise(db, exercise, access);
  // students: only what they hand in against, and never a draft
  if (exercise.state === 'draft') throw notFound(`No exercise ${exercise.id}.`);
  const [course, revision] = await Promise.all([courseOf(db, exercise.course_id), findRevision(db, exercise.current_revision_id!)]);
  const spec = specOf(revision!.spec_json);
  return {
    view: 'student',
    id: exercise.id,
    course: course!,
    state: exercise.state,
    title: spec.title,
    instructionsMarkdown: spec.instructionsMarkdown,
    family: spec.model.family,
    dueLocal: spec.dueLocal,
    timeZone: spec.timeZone,
    dueAt: dueAtOf(spec),
    late: spec.late,
    allowedFileTypes: spec.allowedFileTypes,
    writeUp: spec.writeUp,
  };
}

/* ---------- authoring ---------- */

async function lockExercise(trx: Knex.Transaction, id: number): Promise<ExerciseRow> {
  const row = await findExercise(trx, id, true);
  if (!row) throw notFound(`No exercise ${id}.`);
  return row;
}

export async function createExercise(db: Knex, user: Caller, courseId: number, spec: ExerciseSpec): Promise<ExerciseMutationResponse> {
  return db.transaction(async (trx) => {
    const [exerciseId] = await trx('exercises').insert({ course_id: courseId, state: 'draft', created_by: user.id });
    const [revisionId] = await trx('exercise_revisions').insert({
      exercise_id: exerciseId,
      revision_no: 1,
      spec_json: JSON.stringify(spec),
      engine_version: ENGINE_VERSION,
      created_by: user.id,
    });
    await trx('exercises').where({ id: exerciseId }).update({ current_revision_id: revisionId });
    await recordAudit(trx, { actorId: user.id, action: 'exercise.created', entityType: 'exercise', entityId: exerciseId, after: { courseId, title: spec.title, family: spec.model.family, revisionNo: 1 } });
    const row = (await findExercise(trx, exerciseId))!;
    return { exercise: await staffExercise(trx, row, { staff: true, author: true, sectionScoped: false }) };
  });
}

/** Variants for every active student of the course (and whoever held one before), for a revision. */
async function drawForRevision(trx: Knex.Transaction, exercise: ExerciseRow, revisionId: number, spec: ExerciseSpec, previous: { id: number; spec: ExerciseSpec } | null): Promise<number> {
  const active = await activeEnrolments(trx, exercise.course_id);
  const enrolments: { id: number; student_number: string }[] = [...active];
  if (previous) {
    const holders = (await trx('variants').where({ revision_id: previous.id }).pluck('enrolment_id')) as number[];
    const activeIds = new Set(active.map((e) => e.id));
    const others = holders.filter((id) => !activeIds.has(id));
    if (others.length) enrolments.push(...(await enrolmentsByIds(trx, others)));
  }
  const items = await variantsForNewRevision(trx, { spec, previousSpec: previous?.spec ?? null, previousRevisionId: previous?.id ?? null, enrolments });
  return storeVariants(trx, revisionId, items);
}

export async function updateExercise(db: Knex, user: Caller, id: number, spec: ExerciseSpec, remark: boolean): Promise<ExerciseMutationResponse> {
  return db.transaction(async (trx) => {
    const exercise = await lockExercise(trx, id);
    const current = (await findRevision(trx, exercise.current_revision_id!))!;
    const currentSpec = specOf(current.spec_json);
    const changed = changedFields(currentSpec, spec);
    const access = { staff: true, author: true, sectionScoped: false };
    if (!changed.length) return { exercise: await staffExercise(trx, exercise, access), unchanged: true };

    if (exercise.state === 'draft') {
      await trx('exercise_revisions').where({ id: current.id }).update({ spec_json: JSON.stringify(spec), engine_version: ENGINE_VERSION });
      await trx('exercises').where({ id }).update({ updated_at: trx.fn.now() });
      await recordAudit(trx, { actorId: user.id, action: 'exercise.draft_updated', entityType: 'exercise', entityId: id, before: { title: currentSpec.title }, after: { title: spec.title, changed } });
      return { exercise: await staffExercise(trx, (await findExercise(trx, id))!, access) };
    }

    const nextRevisionNo = Number((await trx('exercise_revisions').where({ exercise_id: id }).max({ n: 'revision_no' }).first())?.n ?? 0) + 1;
    if (!remark) {
      const reports = await reportCount(trx, id);
      throw conflict(
        `This exercise is ${exercise.state}: saving creates revision ${nextRevisionNo}, published at once, and re-marks ${reports === 1 ? 'the 1 report' : `all ${reports} reports`} handed in so far. Confirm re-marking to save.`,
        { reason: 'remark-confirmation-required', nextRevisionNo, reportCount: reports },
      );
    }
    const [revisionId] = await trx('exercise_revisions').insert({
      exercise_id: id,
      revision_no: nextRevisionNo,
      spec_json: JSON.stringify(spec),
      engine_version: ENGINE_VERSION,
      created_by: user.id,
      published_at: trx.fn.now(),
    });
    const variantsDrawn = await drawForRevision(trx, exercise, revisionId, spec, { id: current.id, spec: currentSpec });
    await trx('exercises').where({ id }).update({ current_revision_id: revisionId, updated_at: trx.fn.now() });
    const [remarkJobId] = await trx('jobs').insert({ kind: 'remark-exercise', payload_json: JSON.stringify({ exerciseId: id, revisionId }) });
    await recordAudit(trx, {
      actorId: user.id,
      action: 'exercise.revised',
      entityType: 'exercise',
      entityId: id,
      before: { revisionNo: current.revision_no },
      after: { revisionNo: nextRevisionNo, changed, variantsDrawn, remarkJobId: Number(remarkJobId) },
    });
    return { exercise: await staffExercise(trx, (await findExercise(trx, id))!, access), variantsDrawn, remarkJobId: Number(remarkJobId) };
  });
}

export async function publishExercise(db: Knex, user: Caller, id: number): Promise<ExerciseMutationResponse> {
  return db.transaction(async (trx) => {
    const exercise = await lockExercise(trx, id);
    if (exercise.state === 'published') throw conflict('This exercise is already published.', { state: exercise.state });
    const revision = (await findRevision(trx, exercise.current_revision_id!))!;
    const spec = specOf(revision.spec_json);
    if (exercise.state === 'draft') {
      await trx('exercise_revisions').where({ id: revision.id }).update({ published_at: trx.fn.now(), engine_version: ENGINE_VERSION });
    }
    // draft: everyone's first draw; closed → published: only students enrolled since
    const variantsDrawn = await drawForRevision(trx, exercise, revision.id, spec, null);
    await trx('exercises').where({ id }).update({ state: 'published', updated_at: trx.fn.now() });
    await recordAudit(trx, {
      actorId: user.id,
      action: exercise.state === 'draft' ? 'exercise.published' : 'exercise.reopened',
      entityType: 'exercise',
      entityId: id,
      before: { state: exercise.state },
      after: { state: 'published', revisionNo: revision.revision_no, variantsDrawn },
    });
    return { exercise: await staffExercise(trx, (await findExercise(trx, id))!, { staff: true, author: true, sectionScoped: false }), variantsDrawn };
  });
}

export async function closeExercise(db: Knex, user: Caller, id: number): Promise<ExerciseMutationResponse> {
  return db.transaction(async (trx) => {
    const exercise = await lockExercise(trx, id);
    if (exercise.state !== 'published') throw conflict(`Only a published exercise can be closed; this one is ${exercise.state}.`, { state: exercise.state });
    await trx('exercises').where({ id }).update({ state: 'closed', updated_at: trx.fn.now() });
    await recordAudit(trx, { actorId: user.id, action: 'exercise.closed', entityType: 'exercise', entityId: id, before: { state: 'published' }, after: { state: 'closed' } });
    return { exercise: await staffExercise(trx, (await findExercise(trx, id))!, { staff: true, author: true, sectionScoped: false }) };
  });
}

/* ---------- answer key and preview ---------- */

/**
 * Answer keys are pure functions of (model, variant, engine version), so a
 * small per-process memo saves recomputing them on every page view. It is a
 * cache only: any server recomputes what it lacks.
 */
const answerMemo = new Map<string, { answers: AnswerKey | null; error: string | null }>();
const ANSWER_MEMO_MAX = 5000;

const memoKeyOf = (spec: ExerciseSpec, variant: Variant) => `${ENGINE_VERSION}|${JSON.stringify(spec.model)}|${JSON.stringify(variant)}`;

function memoizedAnswers(spec: ExerciseSpec, variant: Variant) {
  return answerMemo.get(memoKeyOf(spec, variant));
}

function computeAnswers(spec: ExerciseSpec, variant: Variant): { answers: AnswerKey | null; error: string | null } {
  const memoKey = memoKeyOf(spec, variant);
  const hit = answerMemo.get(memoKey);
  if (hit) return hit;
  let out: { answers: AnswerKey | null; error: string | null };
  try {
    out = { answers: answerKeyOf(computeReference(spec.model, variant)), error: null };
  } catch (e) {
    out = { answers: null, error: (e as Error).message };
  }
  if (answerMemo.size >= ANSWER_MEMO_MAX) answerMemo.delete(answerMemo.keys().next().value!);
  answerMemo.set(memoKey, out);
  return out;
}

const studentOf = (e: EnrolmentRow): VariantStudent => ({ enrolmentId: e.id, studentNumber: e.student_number, name: e.name, section: e.section });

async function visibleTo(db: Db, user: Caller, access: ExerciseAccess, courseId: number): Promise<(e: EnrolmentRow) => boolean> {
  if (!access.sectionScoped) return () => true;
  const sections = await assistantSectionIds(db, courseId, user.id);
  return (e) => e.section_id !== null && sections.has(e.section_id);
}

const VARIANT_CAP = 500;
/** time one answer-key request may spend computing (tests lower it) */
export const answerKeyLimits = { budgetMs: 3000 };

export async function answerKey(db: Knex, user: Caller, exercise: ExerciseRow, access: ExerciseAccess, revisionNo?: number): Promise<AnswerKeyResponse> {
  const revisions = await revisionsOf(db, exercise.id);
  const revision = revisionNo === undefined ? revisions.find((r) => r.id === exercise.current_revision_id) : revisions.find((r) => r.revision_no === revisionNo);
  if (!revision) throw notFound(`Exercise ${exercise.id} has no revision ${revisionNo}.`);
  const spec = specOf(revision.spec_json);
  const stored = await variantsOfRevision(db, revision.id);
  const enrolments = new Map((await enrolmentsByIds(db, stored.map((s) => s.enrolment_id))).map((e) => [e.id, e]));
  const visible = await visibleTo(db, user, access, exercise.course_id);

  const possible = allVariants(spec.model, VARIANT_CAP + 1);
  const byKey = new Map<string, { variant: Variant; students: VariantStudent[] }>();
  for (const v of possible.slice(0, VARIANT_CAP)) byKey.set(v.key, { variant: v, students: [] });
  for (const s of stored) {
    const variant = parseJson<Variant>(s.variant_json);
    const entry = byKey.get(s.variant_key) ?? { variant, students: [] };
    byKey.set(s.variant_key, entry);
    const e = enrolments.get(s.enrolment_id);
    if (e && visible(e)) entry.students.push(studentOf(e));
  }
  // Variants held by students first; past the time budget the rest are left for the next request
  // (the memo keeps what was done), so one request never blocks the server for long.
  const entries = [...byKey.entries()];
  const order = entries.map((_, i) => i).sort((a, b) => Number(entries[b][1].students.length > 0) - Number(entries[a][1].students.length > 0) || a - b);
  const started = performance.now();
  const answers = new Map<number, { answers: AnswerKey | null; error: string | null }>();
  let fresh = 0;
  for (const i of order) {
    const memo = memoizedAnswers(spec, entries[i][1].variant);
    if (memo) {
      answers.set(i, memo);
      continue;
    }
    // every request computes at least one new key, so reloading always gets further
    if (fresh > 0 && performance.now() - started > answerKeyLimits.budgetMs) continue;
    answers.set(i, computeAnswers(spec, entries[i][1].variant));
    fresh += 1;
  }
  return {
    exerciseId: exercise.id,
    revisionId: revision.id,
    revisionNo: revision.revision_no,
    engineVersion: revision.engine_version,
    variants: entries.map(([key, { variant, students }], i) => ({
      key,
      variant,
      ...(answers.get(i) ?? { answers: null, error: 'not computed yet (time budget of one request); load the answer key again to continue' }),
      students: students.sort((a, b) => a.studentNumber.localeCompare(b.studentNumber)),
    })),
    truncated: possible.length > VARIANT_CAP,
    complete: answers.size === entries.length,
  };
}

export async function previewVariant(db: Knex, user: Caller, exercise: ExerciseRow, access: ExerciseAccess, studentNumber: string): Promise<PreviewResponse> {
  const enrolment = await enrolmentByStudentNumber(db, exercise.course_id, studentNumber);
  if (!enrolment) throw notFound(`No student with number ${studentNumber} in this course.`);
  if (!(await visibleTo(db, user, access, exercise.course_id))(enrolment)) throw forbidden(`Student ${studentNumber} is not in one of your sections.`);
  const revision = (await findRevision(db, exercise.current_revision_id!))!;
  const spec = specOf(revision.spec_json);
  const row = await db('variants').where({ revision_id: revision.id, enrolment_id: enrolment.id }).first('variant_json');
  const variant = row ? parseJson<Variant>(row.variant_json) : drawVariant(spec.model, spec.variantSeed, enrolment.student_number);
  return {
    student: studentOf(enrolment),
    revisionId: revision.id,
    revisionNo: revision.revision_no,
    variant,
    stored: Boolean(row),
    ...computeAnswers(spec, variant),
  };
}
