/**
 * Who may have which template, and the files themselves: one student's XLSX,
 * a section's ZIP, and the student's own list of published exercises.
 */
import JSZip from 'jszip';
import type { Knex } from 'knex';
import type { MyExercise, MyExercisesResponse, ExerciseWindow } from '@shared/api/templates';
import type { ExerciseSpec } from '@shared/exercises/spec';
import { latePenalty, zonedWallTimeToInstant } from '@shared/exercises/late';
import { rolesInCourse, type SessionUser } from '../../platform/access';
import { badRequest, conflict, forbidden, notFound } from '../../platform/errors';
import { ensureVariant, specOf } from '../exercises/variants';
import {
  activeEnrolmentsOfSection,
  enrolmentById,
  exerciseForTemplate,
  extensionMinutes,
  isAssistantOfSection,
  myPublishedExercises,
  ownEnrolment,
  sectionById,
  type EnrolmentForTemplate,
  type ExerciseForTemplate,
} from './repo';
import { lateRuleSummary, variantSummary } from './variant-text';
import { buildTemplate, type BuiltTemplate } from './workbook';

export const XLSX_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

/** A file name part: letters, digits, dot, dash and underscore only ("CHEM 2140" → "CHEM2140"). */
export function fileNamePart(text: string): string {
  return text.normalize('NFC').replace(/[^\p{L}\p{N}._-]+/gu, '').replace(/^\.+/, '') || 'x';
}

export function templateFileName(courseCode: string, exerciseId: number, studentNumber: string): string {
  return `${fileNamePart(courseCode)}-ex${exerciseId}-${fileNamePart(studentNumber)}.xlsx`;
}

/** Content-Disposition with an ASCII fallback and the RFC 5987 / RFC 6266 UTF-8 form. */
export function attachmentDisposition(fileName: string): string {
  const ascii = fileName.normalize('NFKD').replace(/[^\x20-\x7e]/g, '').replace(/["\\]/g, '') || 'download';
  const encoded = encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

interface Published {
  exercise: ExerciseForTemplate & { revision_id: number };
  spec: ExerciseSpec;
}

const isPublished = (e: ExerciseForTemplate) => (e.state === 'published' || e.state === 'closed') && e.revision_id !== null && e.published_at !== null;

function publishedOrRefuse(exercise: ExerciseForTemplate, asStudent: boolean): Published {
  if (!isPublished(exercise)) {
    if (asStudent) throw notFound(`There is no exercise ${exercise.id}.`);
    throw conflict(`Exercise ${exercise.id} is not published yet; templates exist once it is.`);
  }
  return { exercise: exercise as Published['exercise'], spec: specOf(exercise.spec_json) };
}

async function buildFor(db: Knex, published: Published, enrolment: EnrolmentForTemplate, variant: Awaited<ReturnType<typeof ensureVariant>>): Promise<BuiltTemplate> {
  const { exercise, spec } = published;
  return buildTemplate({
    course: { code: exercise.course_code, title: exercise.course_title },
    exercise: {
      id: exercise.id,
      revisionId: exercise.revision_id,
      spec,
      dueAt: zonedWallTimeToInstant(spec.dueLocal, spec.timeZone),
      extensionMinutes: await extensionMinutes(db, exercise.id, enrolment.id),
    },
    student: { number: enrolment.student_number, name: enrolment.display_name },
    variant: { key: variant.variantKey, templateToken: variant.templateToken, value: variant.variant },
    generatedAt: new Date(),
  });
}

/**
 * One student's template. Without `enrolmentId` the caller is the student
 * (an active enrolment in the exercise's course). With it: the student
 * themself, admins and lecturers of the course, and assistants of the
 * student's section. Nothing is stored before the caller has passed.
 */
export async function studentTemplate(db: Knex, user: SessionUser, exerciseId: number, enrolmentId?: number): Promise<{ fileName: string; buffer: Buffer }> {
  const exercise = await exerciseForTemplate(db, exerciseId);
  if (!exercise) throw notFound(`There is no exercise ${exerciseId}.`);
  const own = await ownEnrolment(db, user.id, exercise.course_id);
  const asSelf = enrolmentId === undefined || (own !== undefined && own.id === enrolmentId);

  let enrolment: EnrolmentForTemplate;
  let published: Published;
  if (asSelf) {
    if (!own || own.status !== 'active') {
      const roles = await rolesInCourse(db, user.id, exercise.course_id);
      if (user.isAdmin || roles.has('lecturer') || roles.has('assistant')) {
        throw badRequest('Name the student whose template you want: add ?enrolmentId= to the address.');
      }
      throw forbidden('You are not a student of the course of this exercise.');
    }
    enrolment = own;
    published = publishedOrRefuse(exercise, true);
  } else {
    const roles = await rolesInCourse(db, user.id, exercise.course_id);
    const target = await enrolmentById(db, enrolmentId!);
    const manages = user.isAdmin || roles.has('lecturer');
    const assists = roles.has('assistant') && target !== undefined && target.course_id === exercise.course_id && target.section_id !== null && (await isAssistantOfSection(db, user.id, target.section_id));
    if (!manages && !assists) {
      throw forbidden(roles.has('assistant') ? 'Assistants can download the templates of the students of their own sections only.' : "You cannot download another student's template.");
    }
    if (!target || target.course_id !== exercise.course_id) throw notFound(`Enrolment ${enrolmentId} is not in the course of exercise ${exerciseId}.`);
    if (target.status !== 'active') throw conflict(`Student ${target.student_number} has withdrawn from the course; withdrawn students get no template.`);
    enrolment = target;
    published = publishedOrRefuse(exercise, false);
  }
  const variant = await db.transaction((trx) => ensureVariant(trx, { id: exercise.id, course_id: exercise.course_id }, published.exercise.revision_id, enrolment.id));
  const built = await buildFor(db, published, enrolment, variant);
  return { fileName: templateFileName(exercise.course_code, exercise.id, enrolment.student_number), buffer: built.buffer };
}

/**
 * Every active student's template of one section as one ZIP (lecturers of
 * the course and admins). Entries are stored uncompressed: an XLSX is a zip
 * already.
 */
export async function sectionTemplatesZip(db: Knex, user: SessionUser, exerciseId: number, sectionId: number): Promise<{ fileName: string; buffer: Buffer; count: number }> {
  const exercise = await exerciseForTemplate(db, exerciseId);
  if (!exercise) throw notFound(`There is no exercise ${exerciseId}.`);
  const roles = await rolesInCourse(db, user.id, exercise.course_id);
  if (!user.isAdmin && !roles.has('lecturer')) throw forbidden("Only the course's lecturers and department admins can download a section's templates.");
  const section = await sectionById(db, sectionId);
  if (!section || section.course_id !== exercise.course_id) throw notFound(`Section ${sectionId} is not a section of the course of exercise ${exerciseId}.`);
  const published = publishedOrRefuse(exercise, false);
  const students = await activeEnrolmentsOfSection(db, sectionId);
  if (students.length === 0) throw conflict(`Section "${section.name}" has no active students, so there are no templates to download.`);

  const variants = await db.transaction(async (trx) => {
    const out = [];
    for (const s of students) out.push(await ensureVariant(trx, { id: exercise.id, course_id: exercise.course_id }, published.exercise.revision_id, s.id));
    return out;
  });
  const zip = new JSZip();
  for (let i = 0; i < students.length; i++) {
    const built = await buildFor(db, published, students[i], variants[i]);
    zip.file(templateFileName(exercise.course_code, exercise.id, students[i].student_number), built.buffer, { compression: 'STORE', date: new Date() });
  }
  const buffer = await zip.generateAsync({ type: 'nodebuffer', compression: 'STORE', platform: 'UNIX' });
  return {
    fileName: `${fileNamePart(exercise.course_code)}-ex${exercise.id}-${fileNamePart(section.name)}-templates.zip`,
    buffer,
    count: students.length,
  };
}

/** Open before the student's own due moment (plus grace); late while a late upload still earns marks; closed after that or once the exercise is closed. */
export function exerciseWindow(args: { state: 'published' | 'closed'; dueAt: Date; extensionMinutes: number; late: ExerciseSpec['late']; now: Date }): { window: ExerciseWindow; penaltyNowPercent: number } {
  const outcome = latePenalty({ submittedAt: args.now, dueAt: args.dueAt, extensionMinutes: args.extensionMinutes, policy: args.late });
  if (args.state === 'closed') return { window: 'closed', penaltyNowPercent: outcome.penaltyPercent };
  if (outcome.onTime) return { window: 'open', penaltyNowPercent: 0 };
  if (outcome.penaltyPercent >= 100) return { window: 'closed', penaltyNowPercent: outcome.penaltyPercent };
  return { window: 'late', penaltyNowPercent: outcome.penaltyPercent };
}

/** The caller's published exercises across the courses they are actively enrolled on. */
export async function myExercises(db: Knex, user: SessionUser, now = new Date()): Promise<MyExercisesResponse> {
  const rows = await myPublishedExercises(db, user.id);
  // a student enrolled after publication has no variant yet: draw and keep it now
  const variants = await db.transaction(async (trx) => {
    const out = [];
    for (const row of rows) out.push(await ensureVariant(trx, { id: row.exercise_id, course_id: row.course_id }, row.revision_id, row.enrolment_id));
    return out;
  });
  const exercises: MyExercise[] = [];
  for (const [i, row] of rows.entries()) {
    const spec = specOf(row.spec_json);
    const variant = variants[i];
    const dueAt = zonedWallTimeToInstant(spec.dueLocal, spec.timeZone);
    const extension = Number(row.extension_minutes ?? 0);
    const { window, penaltyNowPercent } = exerciseWindow({ state: row.state, dueAt, extensionMinutes: extension, late: spec.late, now });
    exercises.push({
      exerciseId: row.exercise_id,
      title: spec.title,
      course: { id: row.course_id, code: row.course_code, title: row.course_title },
      family: spec.model.family,
      dueAt: dueAt.toISOString(),
      dueLocal: spec.dueLocal,
      timeZone: spec.timeZone,
      extensionMinutes: extension,
      effectiveDueAt: new Date(dueAt.getTime() + extension * 60_000).toISOString(),
      late: { ...spec.late, summary: lateRuleSummary(spec.late) },
      window,
      penaltyNowPercent,
      variant: variantSummary(variant.variant),
      templateUrl: `/api/v1/exercises/${row.exercise_id}/template`,
    });
  }
  // still open or late first, soonest due first; closed ones after, most recent first
  const closed = (e: MyExercise) => (e.window === 'closed' ? 1 : 0);
  exercises.sort(
    (a, b) => closed(a) - closed(b) || (closed(a) ? b.effectiveDueAt.localeCompare(a.effectiveDueAt) : a.effectiveDueAt.localeCompare(b.effectiveDueAt)) || a.exerciseId - b.exerciseId,
  );
  return { now: now.toISOString(), exercises };
}
