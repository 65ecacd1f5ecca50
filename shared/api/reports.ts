/**
 * Reports on the wire: what the upload page is shown before confirming
 * ("what was read"), the confirmed choice it sends back, a student's versions,
 * a report's detail with its checks and overlay plot, similarity flags and
 * job progress.
 *
 * Routes (all under /api/v1; POSTs are multipart/form-data with the CSRF header):
 *   POST /exercises/:exerciseId/reports/read   fields: data (file, required), writeup (PDF, optional),
 *                                              choice (JSON ReportChoice, optional) [?enrolmentId= for staff]
 *                                              → ReadPreview; stores nothing
 *   POST /exercises/:exerciseId/reports        same fields, choice required → 201 UploadResult
 *   GET  /exercises/:exerciseId/reports        [?enrolmentId= for staff] → ExerciseReports (a student's versions)
 *   GET  /exercises/:exerciseId/similarity-flags  (staff) → SimilarityFlags
 *   GET  /reports/:reportId                    → ReportDetail (staff; the student who owns it: the automatic mark
 *                                              at once when the exercise's automaticMarks is 'at-once', everything once returned)
 *   GET  /reports/:reportId/data-file          → the data file as uploaded (staff; the owner)
 *   GET  /reports/:reportId/writeup            → the PDF write-up (staff; the owner)
 *   GET  /jobs/:jobId                          (staff of the job's course) → JobProgress
 */
import { z } from 'zod';
import { distanceUnits, energyUnits } from '../chemistry/units/convert';

export const reportDistanceUnitSchema = z.enum(distanceUnits);
export const reportEnergyUnitSchema = z.enum(energyUnits);
export const energyConventionSchema = z.enum(['total', 'relative']);

/** The column and unit choice the student confirms (or corrects) before the upload is stored. */
export const reportChoiceSchema = z.object({
  sheet: z.string().max(200).nullable().optional(),
  /** column letter, e.g. "A" */
  distanceColumn: z.string().regex(/^[A-Za-z]{1,3}$/, 'Expected a column letter such as "A".'),
  energyColumns: z.array(z.string().regex(/^[A-Za-z]{1,3}$/, 'Expected a column letter such as "B".')).min(1, 'Choose at least one energy column.').max(20),
  distanceUnit: reportDistanceUnitSchema,
  energyUnit: reportEnergyUnitSchema,
  convention: energyConventionSchema.optional(),
});
export type ReportChoice = z.infer<typeof reportChoiceSchema>;

export const storedFileSchema = z.object({
  fileName: z.string(),
  sizeBytes: z.number().int(),
  /** decided from the content: csv/tsv text, xlsx, pdf */
  detectedType: z.string(),
});
export type StoredFileInfo = z.infer<typeof storedFileSchema>;

export const readColumnSchema = z.object({
  letter: z.string(),
  header: z.string().nullable(),
  key: z.string(),
  role: z.enum(['distance', 'energy', 'other', 'text', 'empty']),
  curve: z.enum(['bonding', 'antibonding']).nullable(),
  /** unit named in the header, if any */
  headerUnit: z.string().nullable(),
  numericCount: z.number().int(),
});
export type ReadColumn = z.infer<typeof readColumnSchema>;

export const unitSourceSchema = z.enum(['header', 'magnitude', 'template', 'user']);

export const answersSchema = z.record(z.string(), z.union([z.string(), z.number(), z.null()]).optional());

/** One curve of points as read, in the units the student chose (for the preview plot). */
export const pointSeriesSchema = z.object({
  key: z.string(),
  label: z.string(),
  /** [distance, energy] pairs */
  points: z.array(z.tuple([z.number(), z.number()])),
});
export type PointSeries = z.infer<typeof pointSeriesSchema>;

/** POST …/reports/read → what was read, before anything is stored. */
export const readPreviewSchema = z.object({
  dataFile: storedFileSchema.extend({ description: z.string() }),
  writeup: storedFileSchema.nullable(),
  table: z.object({
    kind: z.enum(['csv', 'xlsx']),
    sheet: z.string().nullable(),
    headerRow: z.number().int().nullable(),
    rows: z.number().int(),
    columns: z.array(readColumnSchema),
    /** the first table rows as shown in the file */
    preview: z.array(z.object({ rowNumber: z.number().int(), cells: z.array(z.string()) })),
  })
    /** null when the file holds answers only (MO diagram and Hückel exercises) */
    .nullable(),
  choice: z.object({ sheet: z.string().nullable(), distanceColumn: z.string(), energyColumns: z.array(z.string()) }).nullable(),
  units: z.object({ distance: reportDistanceUnitSchema, energy: reportEnergyUnitSchema, distanceSource: unitSourceSchema, energySource: unitSourceSchema }).nullable(),
  convention: energyConventionSchema.nullable(),
  warnings: z.array(z.string()),
  pointCount: z.number().int(),
  /** the student's points in the chosen units (at most 1,000 per curve), for the preview plot */
  series: z.array(pointSeriesSchema),
  /** set when the file is a personal template (the token is never echoed) */
  template: z.object({ exerciseId: z.string(), variantKey: z.string(), studentNumber: z.string() }).nullable(),
  /** answers read from the template's answer cells, by name */
  answers: answersSchema.nullable(),
  /** the student this upload is for */
  enrolment: z.object({ id: z.number().int(), studentNumber: z.string(), displayName: z.string() }),
});
export type ReadPreview = z.infer<typeof readPreviewSchema>;

/** A refusal of the reader: the error's details (HTTP 422, code "bad_request"). */
export const readRefusalDetailsSchema = z.object({
  reader: z.object({
    code: z.string(),
    sheet: z.string().optional(),
    row: z.number().int().optional(),
    column: z.string().optional(),
    expected: z.string().optional(),
  }),
  /** which upload field was refused */
  field: z.enum(['data', 'writeup', 'choice']),
  /** the columns found before the refusal, so that another choice can be offered */
  columns: z.array(readColumnSchema).optional(),
});
export type ReadRefusalDetails = z.infer<typeof readRefusalDetailsSchema>;

export const checkResultSchema = z.object({
  id: z.string(),
  kind: z.string(),
  label: z.string(),
  points: z.number(),
  max: z.number(),
  /** one sentence of feedback: what was expected and what was found */
  message: z.string(),
  expected: z.unknown().optional(),
  found: z.unknown().optional(),
  unit: z.string().nullable().optional(),
});
export type CheckResult = z.infer<typeof checkResultSchema>;

export const adjustmentSchema = z.object({
  id: z.number().int(),
  checkId: z.string(),
  points: z.number(),
  reason: z.string(),
  adjustedBy: z.object({ id: z.number().int(), displayName: z.string() }),
  createdAt: z.string(),
});
export type Adjustment = z.infer<typeof adjustmentSchema>;

/** The current automatic mark of a report, with the human adjustments kept beside it. */
export const markViewSchema = z.object({
  id: z.number().int(),
  revisionId: z.number().int(),
  revisionNo: z.number().int(),
  engineVersion: z.string(),
  points: z.number(),
  max: z.number(),
  latePenaltyPercent: z.number(),
  total: z.number(),
  createdAt: z.string(),
  checks: z.array(checkResultSchema),
  /** the newest adjustment of each adjusted check (the history is append-only) */
  adjustments: z.array(adjustmentSchema),
  /** points after adjustments (each adjusted check's points replaced), before and after the late penalty */
  adjustedPoints: z.number(),
  adjustedTotal: z.number(),
});
export type MarkView = z.infer<typeof markViewSchema>;

export const lateStatusSchema = z.object({
  late: z.boolean(),
  minutesLate: z.number().int(),
  daysLate: z.number().int(),
  penaltyPercent: z.number(),
  /** due moment plus the student's extension (ISO) */
  effectiveDueAt: z.string(),
});
export type LateStatus = z.infer<typeof lateStatusSchema>;

export const reportStateSchema = z.enum(['submitted', 'marked', 'returned']);

export const reportSummarySchema = z.object({
  id: z.number().int(),
  exerciseId: z.number().int(),
  enrolmentId: z.number().int(),
  versionNo: z.number().int(),
  state: reportStateSchema,
  uploadedAt: z.string(),
  returnedAt: z.string().nullable(),
  uploadedBy: z.object({ id: z.number().int(), displayName: z.string() }),
  /** uploaded by someone other than the student */
  onBehalf: z.boolean(),
  dataFile: storedFileSchema.extend({ sha256: z.string() }),
  writeup: storedFileSchema.extend({ sha256: z.string() }).nullable(),
  units: z.object({ distance: reportDistanceUnitSchema, energy: reportEnergyUnitSchema }).nullable(),
  convention: energyConventionSchema,
  pointCount: z.number().int(),
  warnings: z.array(z.string()),
  late: lateStatusSchema,
  /**
   * Staff: the mark with its adjustments. The student: before the return, the automatic mark
   * without adjustments when the exercise's `automaticMarks` is 'at-once' and null when it is
   * 'on-return'; once returned, the mark with its adjustments.
   */
  mark: markViewSchema.nullable(),
});
export type ReportSummary = z.infer<typeof reportSummarySchema>;

/** POST …/reports → 201 */
export const uploadResultSchema = z.object({
  report: reportSummarySchema,
  /** the similarity job queued for the exercise (its flags appear once it has run) */
  similarityJobId: z.number().int().nullable(),
});
export type UploadResult = z.infer<typeof uploadResultSchema>;

export const exerciseForStudentSchema = z.object({
  id: z.number().int(),
  courseId: z.number().int(),
  title: z.string(),
  state: z.enum(['draft', 'published', 'closed']),
  /** due moment (ISO instant) and how it was written (wall-clock time in the exercise's zone) */
  dueAt: z.string(),
  dueLocal: z.string(),
  timeZone: z.string(),
  extensionMinutes: z.number().int(),
  effectiveDueAt: z.string(),
  late: z.object({ graceMinutes: z.number(), penaltyPerDayPercent: z.number(), capPercent: z.number() }),
  writeUp: z.enum(['none', 'optional', 'required']),
  /** when students see the automatic mark: on upload ('at-once', provisional until returned) or once returned */
  automaticMarks: z.enum(['at-once', 'on-return']),
  allowedFileTypes: z.array(z.string()),
  /** students may upload now */
  acceptingUploads: z.boolean(),
  limits: z.object({ dataMaxBytes: z.number().int(), pdfMaxBytes: z.number().int() }),
});
export type ExerciseForStudent = z.infer<typeof exerciseForStudentSchema>;

/** GET /exercises/:exerciseId/reports → one student's versions, newest first. */
export const exerciseReportsSchema = z.object({
  exercise: exerciseForStudentSchema,
  enrolment: z.object({ id: z.number().int(), studentNumber: z.string(), displayName: z.string() }),
  reports: z.array(reportSummarySchema),
});
export type ExerciseReports = z.infer<typeof exerciseReportsSchema>;

/** Overlay plot data: the student's points and the reference on the common range, in the student's units. */
export const overlaySchema = z.object({
  distanceUnit: reportDistanceUnitSchema,
  energyUnit: reportEnergyUnitSchema,
  convention: energyConventionSchema,
  /** [from, to] in distanceUnit: where both the student's points and the reference exist */
  commonRange: z.tuple([z.number(), z.number()]).nullable(),
  student: z.array(pointSeriesSchema),
  reference: z.array(pointSeriesSchema),
});
export type Overlay = z.infer<typeof overlaySchema>;

/** GET /reports/:reportId */
export const reportDetailSchema = z.object({
  report: reportSummarySchema,
  exercise: z.object({ id: z.number().int(), courseId: z.number().int(), title: z.string() }),
  student: z.object({ enrolmentId: z.number().int(), studentNumber: z.string(), displayName: z.string() }),
  variantKey: z.string(),
  reading: z.object({
    choice: z.object({ sheet: z.string().nullable(), distanceColumn: z.string(), energyColumns: z.array(z.string()) }).nullable(),
    columns: z.array(readColumnSchema),
    unitSources: z.object({ distance: unitSourceSchema, energy: unitSourceSchema }).nullable(),
    answers: answersSchema.nullable(),
  }),
  /** null for a student while the mark is held back (see `mark`); null when the exercise has no curve */
  overlay: overlaySchema.nullable(),
  /** the other versions of the same student (ids and numbers, newest first) */
  versions: z.array(z.object({ id: z.number().int(), versionNo: z.number().int(), uploadedAt: z.string(), state: reportStateSchema })),
});
export type ReportDetail = z.infer<typeof reportDetailSchema>;

export const similarityFlagSchema = z.object({
  id: z.number().int(),
  kind: z.enum(['identical-numbers', 'near-identical-deviations']),
  score: z.number(),
  detail: z.string(),
  createdAt: z.string(),
  report: z.object({ id: z.number().int(), versionNo: z.number().int(), enrolmentId: z.number().int(), studentNumber: z.string(), displayName: z.string() }),
  other: z.object({ id: z.number().int(), versionNo: z.number().int(), enrolmentId: z.number().int(), studentNumber: z.string(), displayName: z.string() }),
  reviewed: z.object({ by: z.string(), at: z.string(), note: z.string().nullable() }).nullable(),
});
export type SimilarityFlag = z.infer<typeof similarityFlagSchema>;
export const similarityFlagsSchema = z.object({ flags: z.array(similarityFlagSchema) });

/** GET /jobs/:jobId */
export const jobProgressSchema = z.object({
  id: z.number().int(),
  kind: z.string(),
  state: z.enum(['queued', 'running', 'done', 'failed']),
  done: z.number().int(),
  total: z.number().int(),
  attempts: z.number().int(),
  error: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type JobProgress = z.infer<typeof jobProgressSchema>;
