import { z } from 'zod';
import { emailSchema } from './courses';

/* ---------- the roster ---------- */

export const enrolmentStatusSchema = z.enum(['active', 'withdrawn']);
export type EnrolmentStatus = z.infer<typeof enrolmentStatusSchema>;

/** One student on a course's roster. */
export const rosterEntrySchema = z.object({
  enrolmentId: z.number().int(),
  userId: z.number().int(),
  studentNumber: z.string(),
  familyName: z.string().nullable(),
  givenName: z.string().nullable(),
  email: z.string().nullable(),
  section: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  status: enrolmentStatusSchema,
  withdrawnAt: z.string().nullable(),
  /** false while the person is only known from the roster (has never signed in) */
  signedIn: z.boolean(),
});
export type RosterEntry = z.infer<typeof rosterEntrySchema>;

/**
 * GET /api/v1/courses/:courseId/roster → { entries, readOnly }: lecturers and
 * admins see everyone; assistants see the students of their sections, read-only.
 */
export const rosterResponseSchema = z.object({ entries: z.array(rosterEntrySchema), readOnly: z.boolean() });

export const studentNumberSchema = z
  .string()
  .trim()
  .min(1, 'A student number is required.')
  .max(32, 'A student number has at most 32 characters.')
  .regex(/^[A-Za-z0-9][A-Za-z0-9\-/]*$/, 'A student number uses letters, digits, hyphens and slashes.');
const personName = z.string().trim().min(1).max(120);

/** POST /api/v1/courses/:courseId/roster/students (lecturers, admins) → 201 RosterEntry. */
export const addStudentBodySchema = z.object({
  studentNumber: studentNumberSchema,
  familyName: personName,
  givenName: personName,
  email: emailSchema,
  sectionId: z.number().int().positive().nullable().default(null),
});
export type AddStudentBody = z.input<typeof addStudentBodySchema>;

/** PATCH /api/v1/courses/:courseId/roster/:enrolmentId { sectionId } (lecturers, admins) → RosterEntry: move between sections. */
export const moveStudentBodySchema = z.object({ sectionId: z.number().int().positive().nullable() });
export type MoveStudentBody = z.infer<typeof moveStudentBodySchema>;
/**
 * POST .../roster/:enrolmentId/withdraw and .../reinstate (lecturers, admins) → RosterEntry.
 * Withdrawing keeps the enrolment and everything attached to it; it only sets the status.
 */

/* ---------- import ---------- */

/** The roster fields a file's columns can be mapped to. */
export const ROSTER_FIELDS = ['studentNumber', 'familyName', 'givenName', 'email', 'section'] as const;
export type RosterField = (typeof ROSTER_FIELDS)[number];
export const ROSTER_FIELD_LABEL: Record<RosterField, string> = {
  studentNumber: 'Student number',
  familyName: 'Family name',
  givenName: 'Given name',
  email: 'E-mail',
  section: 'Section',
};
export const REQUIRED_ROSTER_FIELDS: readonly RosterField[] = ['studentNumber', 'familyName', 'givenName', 'email'];

/** Which column (0-based index into the file's columns) holds each field; null = not in the file. */
export const rosterMappingSchema = z.object({
  studentNumber: z.number().int().min(0).nullable(),
  familyName: z.number().int().min(0).nullable(),
  givenName: z.number().int().min(0).nullable(),
  email: z.number().int().min(0).nullable(),
  section: z.number().int().min(0).nullable(),
});
export type RosterMapping = z.infer<typeof rosterMappingSchema>;

export const detectedColumnSchema = z.object({
  index: z.number().int(),
  /** the spreadsheet letter: A, B, … AA */
  letter: z.string(),
  header: z.string(),
  /** the first few non-empty values, as read */
  samples: z.array(z.string()),
});
export type DetectedColumn = z.infer<typeof detectedColumnSchema>;

export const rowStatusSchema = z.enum(['new', 'changed', 'unchanged', 'error']);
export type RowStatus = z.infer<typeof rowStatusSchema>;

export const rowProblemSchema = z.object({
  field: z.enum(ROSTER_FIELDS).nullable(),
  /** header text and letter of the column, when the problem is in one cell */
  column: z.string().nullable(),
  letter: z.string().nullable(),
  /** the full sentence: "Row 5, column "E-mail" (D): …" */
  message: z.string(),
});
export type RowProblem = z.infer<typeof rowProblemSchema>;

export const previewRowSchema = z.object({
  /** 1-based, as the spreadsheet shows it, header row counted */
  rowNumber: z.number().int(),
  status: rowStatusSchema,
  studentNumber: z.string(),
  familyName: z.string(),
  givenName: z.string(),
  email: z.string(),
  section: z.string().nullable(),
  changes: z.array(z.object({ field: z.enum(ROSTER_FIELDS), from: z.string().nullable(), to: z.string().nullable() })),
  errors: z.array(rowProblemSchema),
  notes: z.array(z.string()),
});
export type PreviewRow = z.infer<typeof previewRowSchema>;

export const missingStudentSchema = z.object({
  enrolmentId: z.number().int(),
  studentNumber: z.string(),
  familyName: z.string().nullable(),
  givenName: z.string().nullable(),
  email: z.string().nullable(),
  section: z.string().nullable(),
  status: enrolmentStatusSchema,
});
export type MissingStudent = z.infer<typeof missingStudentSchema>;

export const importSummarySchema = z.object({
  rows: z.number().int(),
  new: z.number().int(),
  changed: z.number().int(),
  unchanged: z.number().int(),
  error: z.number().int(),
  /** active students on the roster but not in the file (reported, never removed) */
  missing: z.number().int(),
});
export type ImportSummary = z.infer<typeof importSummarySchema>;

/**
 * POST /api/v1/courses/:courseId/roster/preview (lecturers, admins), multipart:
 * `file` (CSV or XLSX, ≤ 5 MB) and optionally `mapping` (JSON RosterMapping;
 * without it the suggested mapping is used) → RosterPreview. Writes nothing.
 */
export const rosterPreviewSchema = z.object({
  fileName: z.string(),
  sha256: z.string(),
  format: z.enum(['csv', 'xlsx']),
  sheetName: z.string().nullable(),
  delimiter: z.string().nullable(),
  headerRowNumber: z.number().int(),
  columns: z.array(detectedColumnSchema),
  suggestedMapping: rosterMappingSchema,
  mapping: rosterMappingSchema,
  /** problems with the file or the mapping as a whole (a required column not mapped, …) */
  problems: z.array(z.string()),
  /** worth knowing, not blocking (a section over capacity, a withdrawn student listed again, …) */
  warnings: z.array(z.string()),
  rows: z.array(previewRowSchema),
  missing: z.array(missingStudentSchema),
  summary: importSummarySchema,
  /** true when nothing blocks an apply */
  canApply: z.boolean(),
});
export type RosterPreview = z.infer<typeof rosterPreviewSchema>;

/**
 * POST /api/v1/courses/:courseId/roster/apply (lecturers, admins), multipart:
 * the same `file`, the confirmed `mapping` (JSON) and optionally `sha256` (the
 * preview's; a different file is refused with 409) → 201 RosterApplyResult.
 * All rows in one transaction, or nothing when any row has an error (400,
 * details.rows lists the problems).
 */
export const rosterApplyResultSchema = z.object({
  importId: z.number().int(),
  summary: importSummarySchema,
  missing: z.array(missingStudentSchema),
});
export type RosterApplyResult = z.infer<typeof rosterApplyResultSchema>;

/** GET /api/v1/courses/:courseId/roster/imports (lecturers, admins) → { imports }, newest first. */
export const rosterImportRecordSchema = z.object({
  id: z.number().int(),
  fileName: z.string(),
  sha256: z.string(),
  actorName: z.string().nullable(),
  createdAt: z.string(),
  summary: importSummarySchema,
});
export type RosterImportRecord = z.infer<typeof rosterImportRecordSchema>;
export const rosterImportsResponseSchema = z.object({ imports: z.array(rosterImportRecordSchema) });

/** The largest roster file accepted, in bytes. */
export const ROSTER_FILE_MAX_BYTES = 5 * 1024 * 1024;
