/**
 * Reports: reading an upload back to the student before anything is stored,
 * storing a confirmed upload as a new version with its automatic mark in one
 * transaction, and turning rows into the wire shapes of shared/api/reports.
 */
import type { Knex } from 'knex';
import type {
  Adjustment,
  CheckResult as WireCheck,
  ExerciseForStudent,
  ExerciseReports,
  LateStatus,
  MarkView,
  PointSeries,
  ReadColumn,
  ReadPreview,
  ReportChoice,
  ReportDetail,
  ReportSummary,
  UploadResult,
} from '@shared/api/reports';
import { exerciseSpecSchema, type ExerciseSpec } from '@shared/exercises/spec';
import { latePenalty } from '@shared/exercises/late';
import type { Variant } from '@shared/exercises/variants';
import { distanceFromBohr, energyFromHartree, type DistanceUnit, type EnergyUnit } from '@shared/chemistry/units';
import { readReport, readReportWithChoice, type ColumnInfo, type ReadResult, type ReadSuccess, type TemplateInfo, type UnitSource } from '@shared/marking/read';
import { detectFileType } from '@shared/marking/read/detect-file-type';
import type { MarkableReading, ReportAnswers } from '@shared/marking/score';
import { answersFromTemplateInfo, readAnswerFile } from '@shared/marking/answers';
import { recordAudit } from '../../platform/audit';
import { HttpError, conflict, forbidden, notFound } from '../../platform/errors';
import { enqueueOnce } from '../../platform/jobs';
import { ensureVariant } from '../exercises/variants';
import { courseAccess, staffMayActFor, targetEnrolment, type Caller, type CourseAccess } from './access';
import { dueAtOf, markWithReference, referenceFor, storedChecks } from './marking';
import {
  currentAdjustments,
  currentMarks,
  extensionMinutes,
  findEnrolment,
  findExerciseWithRevision,
  findReport,
  findVariantById,
  insertMark,
  insertReport,
  insertStoredFile,
  nextVersionNo,
  parseJson,
  reportsOfStudent,
  variantByTemplateToken,
  type AdjustmentRow,
  type EnrolmentRow,
  type ExerciseWithRevisionRow,
  type MarkRow,
  type ReportRow,
} from './repo';
import { checkWriteup, type ReceivedFile, type UploadLimits } from './uploads';

export const SIMILARITY_JOB = 'similarity-exercise';

/* ------------------------------------------------------------------ */
/* the exercise and the student an upload is for                       */
/* ------------------------------------------------------------------ */

export interface UploadTarget {
  exercise: ExerciseWithRevisionRow & { revision_id: number };
  spec: ExerciseSpec;
  access: CourseAccess;
  enrolment: EnrolmentRow;
  onBehalf: boolean;
}

function specOf(specJson: unknown): ExerciseSpec {
  return exerciseSpecSchema.parse(parseJson(specJson));
}

/**
 * Loads the exercise and the student, checking role and scope: students for
 * themselves on published exercises of their course; assistants for their
 * sections; lecturers and admins for anyone in the course.
 */
export async function resolveTarget(db: Knex, caller: Caller | undefined, exerciseId: number, enrolmentId: number | undefined, forUpload: boolean): Promise<UploadTarget> {
  const exercise = await findExerciseWithRevision(db, exerciseId);
  if (!exercise) throw notFound(`Exercise ${exerciseId} does not exist.`);
  const access = await courseAccess(db, caller, exercise.course_id);
  if (!access.isStaff && !caller!.isAdmin && !access.ownEnrolment) throw forbidden('You are not on this course.');
  if (!access.isStaff && exercise.state === 'draft') throw notFound(`Exercise ${exerciseId} does not exist.`);
  const { enrolment, onBehalf } = await targetEnrolment(db, access, exercise.course_id, enrolmentId);
  if (enrolment.status !== 'active') throw conflict('This student has withdrawn from the course; no new reports can be uploaded for them.');
  if (exercise.revision_id === null || exercise.state === 'draft' || !exercise.published_at) {
    if (forUpload) throw conflict('This exercise is not published yet: reports can be uploaded once it is.');
  }
  if (forUpload && exercise.state === 'closed' && !onBehalf) {
    throw conflict('This exercise is closed for uploads; ask your assistant if you need to hand in a new version.');
  }
  if (exercise.revision_id === null) throw notFound(`Exercise ${exerciseId} has no revision yet.`);
  return { exercise: exercise as UploadTarget['exercise'], spec: specOf(exercise.spec_json), access, enrolment, onBehalf };
}

/* ------------------------------------------------------------------ */
/* reading an upload                                                    */
/* ------------------------------------------------------------------ */

const curveFamilies = new Set(['one-electron', 'two-electron']);

export interface ReadUpload {
  data: ReceivedFile;
  writeup: ReceivedFile | null;
  detected: { kind: string; description: string };
  reading: ReadSuccess | null;
  /** template answers (answer cells) by name */
  answers: ReportAnswers | null;
  template: TemplateInfo | null;
}

function refusal(result: Extract<ReadResult, { ok: false }>, field: 'data' | 'choice'): HttpError {
  const e = result.error;
  const columns = result.table ? result.table.columns.map(wireColumn) : undefined;
  return new HttpError(422, 'bad_request', e.message, {
    field,
    reader: { code: e.code, ...(e.sheet ? { sheet: e.sheet } : {}), ...(e.row !== undefined ? { row: e.row } : {}), ...(e.column ? { column: e.column } : {}), ...(e.expected ? { expected: e.expected } : {}) },
    ...(columns ? { columns } : {}),
  });
}

function answersOf(template: TemplateInfo | undefined): ReportAnswers | null {
  const out = answersFromTemplateInfo(template);
  return Object.keys(out).length ? out : null;
}

const startsWith = (bytes: Uint8Array, magic: number[]) => magic.every((b, i) => bytes[i] === b);

/**
 * The file's type by content. Containers (zip, OLE2) and PDFs are told by their
 * magic bytes and examined by detectFileType; anything else is text for the
 * reader to decode (once — it says what it found) or refuse.
 */
function sniffContainer(bytes: Uint8Array, fileName: string): { kind: string; description: string } {
  const head = bytes.subarray(0, 1024);
  const container = startsWith(bytes, [0x50, 0x4b]) || startsWith(bytes, [0xd0, 0xcf, 0x11, 0xe0]) || Buffer.from(head).includes('%PDF-');
  if (container || bytes.length === 0) {
    const d = detectFileType(bytes, fileName);
    return { kind: d.kind, description: d.description };
  }
  return { kind: 'text', description: 'text' };
}

/** Reads the data file (and checks the write-up) without storing anything; refusals are 422 with the reader's place. */
export async function readUpload(spec: ExerciseSpec, data: ReceivedFile, writeup: ReceivedFile | null, choice: ReportChoice | undefined): Promise<ReadUpload> {
  if (writeup) checkWriteup(writeup);
  if (spec.writeUp === 'none' && writeup) throw new HttpError(422, 'bad_request', 'This exercise takes no write-up: upload the data file only.', { field: 'writeup', reader: { code: 'writeup_not_taken' } });
  const bytes = new Uint8Array(data.bytes.buffer, data.bytes.byteOffset, data.bytes.byteLength);
  const detected = sniffContainer(bytes, data.fileName);
  const kindAllowed = detected.kind === 'xlsx' ? spec.allowedFileTypes.includes('xlsx') : detected.kind === 'text' ? spec.allowedFileTypes.some((t) => t === 'csv' || t === 'tsv') : true;
  if (!kindAllowed) {
    throw new HttpError(422, 'bad_request', `"${data.fileName}" is ${detected.description}; this exercise takes ${spec.allowedFileTypes.map((t) => t.toUpperCase()).join(', ')} files.`, {
      field: 'data',
      reader: { code: 'type_not_allowed', expected: spec.allowedFileTypes.join(', ') },
    });
  }
  const result = choice
    ? await readReportWithChoice(bytes, {
        fileName: data.fileName,
        ...(choice.sheet ? { sheet: choice.sheet } : {}),
        distanceColumn: choice.distanceColumn.toUpperCase(),
        energyColumns: choice.energyColumns.map((c) => c.toUpperCase()),
        distanceUnit: choice.distanceUnit,
        energyUnit: choice.energyUnit,
        ...(choice.convention ? { convention: choice.convention } : {}),
      })
    : await readReport(bytes, { fileName: data.fileName });
  if (result.ok) {
    if (result.table.kind === 'csv') detected.description = `text (${result.table.encoding ? result.table.encoding.toUpperCase() : 'UTF-8'})`;
    return { data, writeup, detected, reading: result, answers: answersOf(result.template), template: result.template ?? null };
  }
  // An answers-only exercise (MO diagram, Hückel) is handed in as a template with answer cells, or a
  // two-column question,answer file: no curve to read.
  if (!curveFamilies.has(spec.model.family) && ['no_numeric_data', 'too_few_points', 'too_few_columns', 'not_a_number', 'bad_choice'].includes(result.error.code)) {
    let answers = answersOf(result.template);
    if (!answers) {
      const file = await readAnswerFile(bytes);
      if (Object.keys(file.answers).length) answers = file.answers;
    }
    if (answers) return { data, writeup, detected, reading: null, answers, template: result.template ?? null };
  }
  throw refusal(result, choice && result.error.code === 'bad_choice' ? 'choice' : 'data');
}

/**
 * A personal template must be this student's, for this exercise: its student
 * number and token must match the student's variant. Another student's
 * template is refused (422) with a message saying so.
 */
export async function checkTemplate(db: Knex, template: TemplateInfo | null, exerciseId: number, enrolment: EnrolmentRow, onBehalf: boolean): Promise<string[]> {
  if (!template) return [];
  const warnings: string[] = [];
  const refuse = (code: string, message: string) => new HttpError(422, 'bad_request', message, { field: 'data', reader: { code } });
  if (template.exerciseId && template.exerciseId !== String(exerciseId)) {
    throw refuse('template_other_exercise', `This file is a personal template for another exercise (exercise ${template.exerciseId}), not this one. Download the template of this exercise and copy your numbers into it.`);
  }
  const owner = template.templateToken ? await variantByTemplateToken(db, template.templateToken) : undefined;
  const whose = onBehalf ? `${enrolment.display_name}'s` : 'your';
  if ((template.studentNumber && template.studentNumber !== enrolment.student_number) || (owner && owner.enrolment_id !== enrolment.id)) {
    throw refuse(
      'template_other_student',
      `This file is the personal template of another student, not ${whose} own (student number ${enrolment.student_number}). Each student hands in the template made for them: download ${whose} template and enter ${onBehalf ? 'their' : 'your'} own numbers.`,
    );
  }
  if (!owner || owner.exercise_id !== exerciseId) {
    throw refuse('template_unknown', `The template's token does not belong to ${whose} template of this exercise; it may have been edited. Download a fresh template and copy the numbers into it.`);
  }
  return warnings;
}

/* ------------------------------------------------------------------ */
/* wire shapes                                                          */
/* ------------------------------------------------------------------ */

function wireColumn(c: ColumnInfo): ReadColumn {
  return {
    letter: c.letter,
    header: c.header,
    key: c.key,
    role: c.role,
    curve: c.curve,
    headerUnit: c.headerUnit,
    numericCount: c.numericCount,
  };
}

const MAX_PLOT_POINTS = 1000;

function thin<T>(items: T[], max = MAX_PLOT_POINTS): T[] {
  if (items.length <= max) return items;
  const step = items.length / max;
  return Array.from({ length: max }, (_, i) => items[Math.floor(i * step)]);
}

/** The student's points in the units they wrote them in (relative energies stay relative). */
function studentSeries(reading: { points: { distance: ArrayLike<number>; energies: Record<string, ArrayLike<number>> }; units: { distance: DistanceUnit; energy: EnergyUnit } }, columns: { key: string; header: string | null; letter: string }[], range?: [number, number]): PointSeries[] {
  const d = Array.from(reading.points.distance);
  return Object.entries(reading.points.energies).map(([key, energies]) => {
    const column = columns.find((c) => c.key === key);
    const e = Array.from(energies);
    const pairs: [number, number][] = [];
    for (let i = 0; i < d.length; i++) {
      if (range && (d[i] < range[0] - 1e-12 || d[i] > range[1] + 1e-12)) continue;
      pairs.push([distanceFromBohr(d[i], reading.units.distance), energyFromHartree(e[i], reading.units.energy)]);
    }
    return { key, label: column?.header ?? (column ? `column ${column.letter}` : key), points: thin(pairs) };
  });
}

export interface StoredReading {
  fileName: string;
  detected: { kind: string; description: string };
  table: { kind: 'csv' | 'xlsx'; sheet: string | null; headerRow: number | null; rows: number; columns: ReadColumn[] } | null;
  choice: { sheet: string | null; distanceColumn: string; energyColumns: string[] } | null;
  units: { distance: DistanceUnit; energy: EnergyUnit; distanceSource: UnitSource; energySource: UnitSource } | null;
  convention: 'total' | 'relative';
  warnings: string[];
  template: { exerciseId: string; variantKey: string; studentNumber: string } | null;
  answers: ReportAnswers | null;
  /** bohr and hartree, as scored */
  points: { distance: number[]; energies: Record<string, number[]>; rowNumbers: number[] } | null;
}

/** What a reports row stores of a reading; `extraWarnings` follow the reader's own warnings. */
export function storedReadingOf(read: ReadUpload, extraWarnings: string[] = []): StoredReading {
  const r = read.reading;
  return {
    fileName: read.data.fileName,
    detected: read.detected,
    table: r ? { kind: r.table.kind, sheet: r.table.sheet, headerRow: r.table.headerRow, rows: r.table.rows, columns: r.table.columns.map(wireColumn) } : null,
    choice: r ? { sheet: r.choice.sheet, distanceColumn: r.choice.distanceColumn, energyColumns: [...r.choice.energyColumns] } : null,
    units: r ? { distance: r.units.distance, energy: r.units.energy, distanceSource: r.units.distanceSource, energySource: r.units.energySource } : null,
    convention: r?.convention ?? 'total',
    warnings: [...(r?.warnings ?? []), ...extraWarnings],
    template: read.template ? { exerciseId: read.template.exerciseId, variantKey: read.template.variantKey, studentNumber: read.template.studentNumber } : null,
    answers: read.answers,
    points: r
      ? {
          distance: Array.from(r.points.distance),
          energies: Object.fromEntries(Object.entries(r.points.energies).map(([k, v]) => [k, Array.from(v)])),
          rowNumbers: Array.from(r.points.rowNumbers),
        }
      : null,
  };
}

/** The reading as the scorer takes it, from what a reports row stores. */
export function markableOf(stored: StoredReading): MarkableReading | null {
  if (!stored.points || !stored.units) return null;
  return {
    points: stored.points,
    units: { distance: stored.units.distance, energy: stored.units.energy },
    convention: stored.convention,
    table: stored.table ? { columns: stored.table.columns } : undefined,
    choice: stored.choice ? { energyColumns: stored.choice.energyColumns } : undefined,
  };
}

export function previewOf(read: ReadUpload, target: UploadTarget, extraWarnings: string[]): ReadPreview {
  const r = read.reading;
  return {
    dataFile: { fileName: read.data.fileName, sizeBytes: read.data.sizeBytes, detectedType: read.detected.kind, description: read.detected.description },
    writeup: read.writeup ? { fileName: read.writeup.fileName, sizeBytes: read.writeup.sizeBytes, detectedType: 'pdf' } : null,
    table: r
      ? { kind: r.table.kind, sheet: r.table.sheet, headerRow: r.table.headerRow, rows: r.table.rows, columns: r.table.columns.map(wireColumn), preview: r.table.preview.slice(0, 6) }
      : null,
    choice: r ? { sheet: r.choice.sheet, distanceColumn: r.choice.distanceColumn, energyColumns: [...r.choice.energyColumns] } : null,
    units: r ? { distance: r.units.distance, energy: r.units.energy, distanceSource: r.units.distanceSource, energySource: r.units.energySource } : null,
    convention: r?.convention ?? null,
    warnings: [...(r?.warnings ?? []), ...extraWarnings],
    pointCount: r ? r.points.distance.length : 0,
    series: r ? studentSeries(r, r.table.columns) : [],
    template: read.template ? { exerciseId: read.template.exerciseId, variantKey: read.template.variantKey, studentNumber: read.template.studentNumber } : null,
    answers: read.answers,
    enrolment: { id: target.enrolment.id, studentNumber: target.enrolment.student_number, displayName: target.enrolment.display_name },
  };
}

/* ------------------------------------------------------------------ */
/* storing an upload                                                    */
/* ------------------------------------------------------------------ */

/**
 * Stores the files and a new report version, marks it against the current
 * revision and queues the exercise's similarity run — all in one transaction,
 * so that a refusal or a failure anywhere leaves nothing behind.
 */
export async function storeUpload(db: Knex, caller: Caller, target: UploadTarget, read: ReadUpload, extraWarnings: string[]): Promise<UploadResult> {
  const submittedAt = new Date();
  const exercise = target.exercise;
  const stored = storedReadingOf(read, extraWarnings);
  // The student's variant of the current revision is drawn once and kept (as a template download
  // would); it is not part of the upload, so it is made before the upload's transaction.
  const [extension, uploader, variant] = await Promise.all([
    extensionMinutes(db, exercise.id, target.enrolment.id),
    db('users').where({ id: caller.id }).first('display_name'),
    ensureVariant(db, { id: exercise.id, course_id: exercise.course_id }, exercise.revision_id, target.enrolment.id),
  ]);
  if (read.template?.variantKey && read.template.variantKey !== variant.variantKey) {
    stored.warnings.push(`The template was made for variant ${read.template.variantKey}; the exercise now gives this student variant ${variant.variantKey}, which is what the report is marked against.`);
  }
  // Pure computation (the reference is cached per revision and variant): kept out of the transaction.
  const mark = markWithReference({
    revisionId: exercise.revision_id,
    spec: target.spec,
    variant: variant.variant,
    reading: markableOf(stored),
    answers: stored.answers,
    submittedAt,
    extensionMinutes: extension,
  });
  const checks = storedChecks(mark);

  const result = await db.transaction(async (trx) => {
    const dataFileId = await insertStoredFile(trx, {
      sha256: read.data.sha256,
      sizeBytes: read.data.sizeBytes,
      detectedType: read.detected.kind,
      fileName: read.data.fileName,
      content: read.data.bytes,
      uploadedBy: caller.id,
    });
    const writeupFileId = read.writeup
      ? await insertStoredFile(trx, { sha256: read.writeup.sha256, sizeBytes: read.writeup.sizeBytes, detectedType: 'pdf', fileName: read.writeup.fileName, content: read.writeup.bytes, uploadedBy: caller.id })
      : null;
    const versionNo = await nextVersionNo(trx, exercise.id, target.enrolment.id);
    const reportId = await insertReport(trx, {
      exerciseId: exercise.id,
      enrolmentId: target.enrolment.id,
      variantId: variant.id,
      versionNo,
      dataFileId,
      writeupFileId,
      reading: stored,
      uploadedBy: caller.id,
      uploadedAt: submittedAt,
    });
    const markId = await insertMark(trx, {
      reportId,
      revisionId: exercise.revision_id,
      engineVersion: mark.engineVersion,
      points: mark.points,
      max: mark.max,
      latePenaltyPercent: mark.latePenaltyPercent,
      total: mark.total,
      checks,
    });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'report.uploaded',
      entityType: 'report',
      entityId: reportId,
      after: {
        exerciseId: exercise.id,
        enrolmentId: target.enrolment.id,
        versionNo,
        onBehalf: target.onBehalf,
        dataSha256: read.data.sha256,
        writeupSha256: read.writeup?.sha256 ?? null,
        revisionId: exercise.revision_id,
        total: mark.total,
      },
    });
    const similarityJobId = await enqueueOnce(trx, SIMILARITY_JOB, 'exerciseId', { exerciseId: exercise.id, courseId: exercise.course_id });
    return { reportId, markId, versionNo, similarityJobId };
  });

  // The answer is made from what was just written (no second round of queries).
  const showMark = markVisibility(target.access.isStaff || Boolean(caller.isAdmin), target.spec, 'submitted') !== 'none';
  const markRow: MarkRow = {
    id: result.markId,
    report_id: result.reportId,
    revision_id: exercise.revision_id,
    revision_no: exercise.revision_no ?? 0,
    engine_version: mark.engineVersion,
    points: mark.points,
    max_points: mark.max,
    late_penalty_percent: mark.latePenaltyPercent,
    total: mark.total,
    checks_json: checks,
    created_at: submittedAt,
  };
  const report: ReportSummary = {
    id: result.reportId,
    exerciseId: exercise.id,
    enrolmentId: target.enrolment.id,
    versionNo: result.versionNo,
    state: 'submitted',
    uploadedAt: submittedAt.toISOString(),
    returnedAt: null,
    uploadedBy: { id: caller.id, displayName: uploader?.display_name ?? '' },
    onBehalf: target.enrolment.user_id !== caller.id,
    dataFile: { fileName: read.data.fileName, sizeBytes: read.data.sizeBytes, detectedType: read.detected.kind, sha256: read.data.sha256 },
    writeup: read.writeup ? { fileName: read.writeup.fileName, sizeBytes: read.writeup.sizeBytes, detectedType: 'pdf', sha256: read.writeup.sha256 } : null,
    units: stored.units ? { distance: stored.units.distance, energy: stored.units.energy } : null,
    convention: stored.convention,
    pointCount: stored.points?.distance.length ?? 0,
    warnings: stored.warnings,
    late: lateStatusOf(target.spec, submittedAt, extension),
    mark: showMark ? markViewOf(markRow, []) : null,
  };
  return { report, similarityJobId: result.similarityJobId };
}

/* ------------------------------------------------------------------ */
/* reading reports back                                                 */
/* ------------------------------------------------------------------ */

const iso = (d: Date | string) => (d instanceof Date ? d : new Date(d)).toISOString();
const round2 = (x: number) => Math.round(x * 100) / 100;

export function lateStatusOf(spec: ExerciseSpec, submittedAt: Date, extension: number): LateStatus {
  const dueAt = dueAtOf(spec);
  const outcome = latePenalty({ submittedAt, dueAt, extensionMinutes: extension, policy: spec.late });
  return {
    late: !outcome.onTime,
    minutesLate: outcome.minutesLate,
    daysLate: outcome.daysLate,
    penaltyPercent: outcome.penaltyPercent,
    effectiveDueAt: new Date(dueAt.getTime() + extension * 60_000).toISOString(),
  };
}

function markViewOf(mark: MarkRow, adjustments: AdjustmentRow[]): MarkView {
  const checks = parseJson<WireCheck[]>(mark.checks_json).map((c) => ({
    id: c.id,
    kind: c.kind,
    label: c.label,
    points: Number(c.points),
    max: Number(c.max),
    message: c.message,
    expected: c.expected ?? null,
    found: c.found ?? null,
    unit: c.unit ?? null,
  }));
  const wireAdjustments: Adjustment[] = adjustments.map((a) => ({
    id: a.id,
    checkId: a.check_id,
    points: Number(a.points),
    reason: a.reason,
    adjustedBy: { id: a.adjusted_by, displayName: a.adjusted_by_name },
    createdAt: iso(a.created_at),
  }));
  const byCheck = new Map(wireAdjustments.map((a) => [a.checkId, a.points]));
  const adjustedPoints = round2(checks.reduce((s, c) => s + (byCheck.get(c.id) ?? c.points), 0));
  const penalty = Number(mark.late_penalty_percent);
  return {
    id: mark.id,
    revisionId: mark.revision_id,
    revisionNo: mark.revision_no,
    engineVersion: mark.engine_version,
    points: Number(mark.points),
    max: Number(mark.max_points),
    latePenaltyPercent: penalty,
    total: Number(mark.total),
    createdAt: iso(mark.created_at),
    checks,
    adjustments: wireAdjustments,
    adjustedPoints,
    adjustedTotal: round2(adjustedPoints * (1 - penalty / 100)),
  };
}

export type MarkVisibility = 'full' | 'automatic' | 'none';

/**
 * How much of a report's mark the caller sees. Staff: all of it. The student
 * it belongs to: all of it once the report is returned; before that, the
 * automatic mark alone (checks, feedback, total, late penalty — no human
 * adjustments, which are work in progress until the return) when the
 * exercise's `automaticMarks` is 'at-once', and nothing when it is 'on-return'.
 */
export function markVisibility(staff: boolean, spec: Pick<ExerciseSpec, 'automaticMarks'>, state: ReportRow['state']): MarkVisibility {
  if (staff || state === 'returned') return 'full';
  return spec.automaticMarks === 'on-return' ? 'none' : 'automatic';
}

/** Report rows → summaries; for students (`staff` false) the mark as `markVisibility` allows. */
export async function summariesOf(db: Knex, rows: ReportRow[], spec: ExerciseSpec, options: { staff: boolean }): Promise<ReportSummary[]> {
  const ids = rows.map((r) => r.id);
  const [marks, adjustments] = await Promise.all([currentMarks(db, ids), currentAdjustments(db, ids)]);
  const extensions = new Map<number, number>();
  for (const r of rows) if (!extensions.has(r.enrolment_id)) extensions.set(r.enrolment_id, await extensionMinutes(db, r.exercise_id, r.enrolment_id));
  const enrolments = new Map<number, EnrolmentRow | undefined>();
  for (const r of rows) if (!enrolments.has(r.enrolment_id)) enrolments.set(r.enrolment_id, await findEnrolment(db, r.enrolment_id));
  return rows.map((r) => {
    const reading = parseJson<StoredReading>(r.reading_json);
    const mark = marks.get(r.id);
    const visibility = markVisibility(options.staff, spec, r.state);
    return {
      id: r.id,
      exerciseId: r.exercise_id,
      enrolmentId: r.enrolment_id,
      versionNo: r.version_no,
      state: r.state,
      uploadedAt: iso(r.uploaded_at),
      returnedAt: r.returned_at ? iso(r.returned_at) : null,
      uploadedBy: { id: r.uploaded_by, displayName: r.uploaded_by_name },
      onBehalf: enrolments.get(r.enrolment_id)?.user_id !== r.uploaded_by,
      dataFile: { fileName: r.data_name, sizeBytes: r.data_size, detectedType: r.data_type, sha256: r.data_sha256 },
      writeup: r.writeup_file_id ? { fileName: r.writeup_name!, sizeBytes: r.writeup_size!, detectedType: r.writeup_type!, sha256: r.writeup_sha256! } : null,
      units: reading.units ? { distance: reading.units.distance, energy: reading.units.energy } : null,
      convention: reading.convention,
      pointCount: reading.points?.distance.length ?? 0,
      warnings: reading.warnings,
      late: lateStatusOf(spec, new Date(r.uploaded_at), extensions.get(r.enrolment_id) ?? 0),
      mark: visibility !== 'none' && mark ? markViewOf(mark, visibility === 'full' ? (adjustments.get(r.id) ?? []) : []) : null,
    };
  });
}

export function exerciseForStudentOf(exercise: ExerciseWithRevisionRow, spec: ExerciseSpec, extension: number, limits: UploadLimits, onBehalf: boolean): ExerciseForStudent {
  const dueAt = dueAtOf(spec);
  return {
    id: exercise.id,
    courseId: exercise.course_id,
    title: spec.title,
    state: exercise.state,
    dueAt: dueAt.toISOString(),
    dueLocal: spec.dueLocal,
    timeZone: spec.timeZone,
    extensionMinutes: extension,
    effectiveDueAt: new Date(dueAt.getTime() + extension * 60_000).toISOString(),
    late: { graceMinutes: spec.late.graceMinutes, penaltyPerDayPercent: spec.late.penaltyPerDayPercent, capPercent: spec.late.capPercent },
    writeUp: spec.writeUp,
    automaticMarks: spec.automaticMarks,
    allowedFileTypes: spec.allowedFileTypes,
    acceptingUploads: exercise.state === 'published' || (exercise.state === 'closed' && onBehalf),
    limits,
  };
}

/** GET /exercises/:id/reports: one student's versions, newest first. */
export async function studentReports(db: Knex, caller: Caller, exerciseId: number, enrolmentId: number | undefined, limits: UploadLimits): Promise<ExerciseReports> {
  const target = await resolveTarget(db, caller, exerciseId, enrolmentId, false);
  const rows = await reportsOfStudent(db, exerciseId, target.enrolment.id);
  const extension = await extensionMinutes(db, exerciseId, target.enrolment.id);
  return {
    exercise: exerciseForStudentOf(target.exercise, target.spec, extension, limits, target.onBehalf),
    enrolment: { id: target.enrolment.id, studentNumber: target.enrolment.student_number, displayName: target.enrolment.display_name },
    reports: await summariesOf(db, rows, target.spec, { staff: target.access.isStaff }),
  };
}

/** A report the caller may see: staff in scope, or the student it belongs to. */
export async function reportForCaller(db: Knex, caller: Caller | undefined, reportId: number) {
  const row = await findReport(db, reportId);
  if (!row) throw notFound(`Report ${reportId} does not exist.`);
  const exercise = await findExerciseWithRevision(db, row.exercise_id);
  const enrolment = await findEnrolment(db, row.enrolment_id);
  if (!exercise || !enrolment) throw notFound(`Report ${reportId} does not exist.`);
  const access = await courseAccess(db, caller, exercise.course_id);
  const own = enrolment.user_id === caller!.id;
  const staff = access.isStaff && staffMayActFor(access, enrolment);
  if (!own && !staff) throw forbidden(access.isStaff ? 'This student is not in one of your sections.' : 'You can only see your own reports.');
  return { row, exercise, enrolment, access, staff };
}

/** Overlay: the student's points and the reference curves on their common range, in the student's units. */
export function overlayOf(stored: StoredReading, revisionId: number, spec: ExerciseSpec, variant: Variant): ReportDetail['overlay'] {
  if (!stored.points || !stored.units || !curveFamilies.has(spec.model.family)) return null;
  const reference = referenceFor(revisionId, spec, variant);
  if (reference.kind !== 'curve') return null;
  const units = stored.units;
  const d = stored.points.distance;
  const refD = reference.grid.bohr;
  const lo = Math.max(Math.min(...d), Math.min(...refD));
  const hi = Math.min(Math.max(...d), Math.max(...refD));
  const range: [number, number] | null = hi > lo ? [lo, hi] : null;
  const shift = stored.convention === 'relative' ? reference.dissociationLimitHartree : 0;
  const columns = stored.table?.columns ?? [];
  return {
    distanceUnit: units.distance,
    energyUnit: units.energy,
    convention: stored.convention,
    commonRange: range ? [distanceFromBohr(range[0], units.distance), distanceFromBohr(range[1], units.distance)] : null,
    student: range ? studentSeries({ points: stored.points, units }, columns, range) : [],
    reference: range
      ? reference.curves.map((c) => {
          const pairs: [number, number][] = [];
          for (let i = 0; i < refD.length; i++) {
            if (refD[i] < range[0] - 1e-12 || refD[i] > range[1] + 1e-12) continue;
            pairs.push([distanceFromBohr(refD[i], units.distance), energyFromHartree(c.energyHartree[i] - shift, units.energy)]);
          }
          return { key: c.state, label: c.label, points: thin(pairs) };
        })
      : [],
  };
}

/** GET /reports/:id */
export async function reportDetail(db: Knex, caller: Caller, reportId: number): Promise<ReportDetail> {
  const { row, exercise, enrolment, staff } = await reportForCaller(db, caller, reportId);
  const spec = specOf(exercise.spec_json);
  const [summary] = await summariesOf(db, [row], spec, { staff });
  const stored = parseJson<StoredReading>(row.reading_json);
  const variantRow = await findVariantById(db, row.variant_id);
  const variant = parseJson<Variant>(variantRow!.variant_json);
  const showResult = markVisibility(staff, spec, row.state) !== 'none';
  // the overlay is drawn against the revision of the current mark
  const revisionId = summary.mark?.revisionId ?? exercise.revision_id!;
  let overlaySpec = spec;
  if (revisionId !== exercise.revision_id) {
    const rev = await db('exercise_revisions').where({ id: revisionId }).first('spec_json');
    if (rev) overlaySpec = specOf(rev.spec_json);
  }
  let overlay: ReportDetail['overlay'] = null;
  if (showResult) {
    try {
      overlay = overlayOf(stored, revisionId, overlaySpec, variant);
    } catch {
      overlay = null; // a variant the current model cannot take (family changed): no plot
    }
  }
  const versions = await reportsOfStudent(db, row.exercise_id, row.enrolment_id);
  return {
    report: summary,
    exercise: { id: exercise.id, courseId: exercise.course_id, title: spec.title },
    student: { enrolmentId: enrolment.id, studentNumber: enrolment.student_number, displayName: enrolment.display_name },
    variantKey: variantRow!.variant_key,
    reading: {
      choice: stored.choice,
      columns: stored.table?.columns ?? [],
      unitSources: stored.units ? { distance: stored.units.distanceSource, energy: stored.units.energySource } : null,
      answers: stored.answers,
    },
    overlay,
    versions: versions.map((v) => ({ id: v.id, versionNo: v.version_no, uploadedAt: iso(v.uploaded_at), state: v.state })),
  };
}
