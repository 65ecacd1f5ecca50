/**
 * Exercises on the wire: the list of a course's exercises, one exercise with
 * its revisions, the answer key of every variant and one student's variant.
 *
 * The exercise itself is the ExerciseSpec of shared/exercises/spec.ts; this
 * file adds what the engine must accept before a spec may be saved
 * (`checkedExerciseSpecSchema`) and the answer key the lecturer reads
 * (`answerKeyOf`), so that the editor and the server say the same thing.
 */
import { z } from 'zod';
import { exerciseSpecSchema, huckelSystemSchema, type ExerciseSpec, type ModelSpec, type NumberChoice } from '../exercises/spec';
import { choiceValues, type Variant } from '../exercises/variants';
import type { Reference } from '../exercises/reference';
import { validateCurveParams } from '../chemistry/curves';
import { buildMoDiagram } from '../chemistry/diatomics';
import { parseHuckelGraph } from '../chemistry/huckel';
import { reducedMassMe } from '../chemistry/analysis';
import { BOHR_ANGSTROM } from '../chemistry/units';

export const exerciseStateSchema = z.enum(['draft', 'published', 'closed']);
export type ExerciseState = z.infer<typeof exerciseStateSchema>;

export const modelFamilySchema = z.enum(['one-electron', 'two-electron', 'diatomic', 'huckel']);

/* ---------- engine checks on a spec ---------- */

export interface SpecIssue {
  path: (string | number)[];
  message: string;
}

function choicePath(choice: NumberChoice, index: number): (string | number)[] {
  if (choice.kind === 'fixed') return ['value'];
  if (choice.kind === 'list') return ['values', index];
  return ['min'];
}

function positiveIssues(choice: NumberChoice, at: (string | number)[], what: string): SpecIssue[] {
  const values = choiceValues(choice);
  const bad = values.findIndex((v) => !(v > 0));
  return bad < 0 ? [] : [{ path: [...at, ...choicePath(choice, bad)], message: `${what} must be above zero (got ${values[bad]})` }];
}

/**
 * What the engine refuses in a spec that the plain schema lets through:
 * non-positive charges or exponents, the exact model's upper state for unequal
 * charges, unknown diatomic species, malformed Hückel graphs, unknown isotopes.
 * Paths are the same as the schema's (e.g. model.species.2).
 */
export function exerciseSpecEngineIssues(spec: Pick<ExerciseSpec, 'model' | 'scheme'>): SpecIssue[] {
  const issues: SpecIssue[] = [];
  const m: ModelSpec = spec.model;
  if (m.family === 'one-electron') {
    issues.push(...positiveIssues(m.za, ['model', 'za'], 'Za'), ...positiveIssues(m.zb, ['model', 'zb'], 'Zb'));
    if (m.zeta.kind !== 'optimized') issues.push(...positiveIssues(m.zeta, ['model', 'zeta'], 'ζ'));
    if (!issues.length) {
      const zeta = m.zeta.kind === 'optimized' ? ('opt' as const) : choiceValues(m.zeta)[0];
      outer: for (const za of choiceValues(m.za).slice(0, 200))
        for (const zb of choiceValues(m.zb).slice(0, 200))
          for (const state of m.states) {
            try {
              validateCurveParams({ model: m.method, za, zb, zeta, state });
            } catch (e) {
              issues.push({ path: ['model', 'states'], message: (e as Error).message });
              break outer;
            }
          }
    }
  } else if (m.family === 'two-electron') {
    if (m.zeta.kind !== 'optimized') issues.push(...positiveIssues(m.zeta, ['model', 'zeta'], 'ζ'));
  } else if (m.family === 'diatomic') {
    m.species.forEach((formula, i) => {
      try {
        buildMoDiagram({ formula, order: m.order });
      } catch (e) {
        issues.push({ path: ['model', 'species', i], message: (e as Error).message });
      }
    });
    const seen = new Set<string>();
    m.species.forEach((s, i) => {
      if (seen.has(s)) issues.push({ path: ['model', 'species', i], message: `${s} is listed twice` });
      seen.add(s);
    });
  } else {
    m.systems.forEach((system, i) => {
      if (system.kind !== 'graph') return;
      try {
        parseHuckelGraph(system.graph);
      } catch (e) {
        issues.push({ path: ['model', 'systems', i, 'graph'], message: (e as Error).message });
      }
    });
  }
  spec.scheme.checks.forEach((c, i) => {
    if (c.kind === 'vibrational-wavenumber' && c.isotopes) {
      try {
        reducedMassMe(c.isotopes);
      } catch (e) {
        issues.push({ path: ['scheme', 'checks', i, 'isotopes'], message: (e as Error).message });
      }
    }
  });
  return issues;
}

/** The ExerciseSpec schema plus the engine's own checks: what POST and PUT accept. */
export const checkedExerciseSpecSchema = exerciseSpecSchema.superRefine((spec, ctx) => {
  // the base schema's own issues come first; engine checks only run on a well-formed spec
  for (const issue of exerciseSpecEngineIssues(spec)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
});

/* ---------- variants ---------- */

const numberOrOptimized = z.union([z.number(), z.literal('optimized')]);
export const variantSchema = z.discriminatedUnion('family', [
  z.object({ family: z.literal('one-electron'), key: z.string(), za: z.number(), zb: z.number(), zeta: numberOrOptimized }),
  z.object({ family: z.literal('two-electron'), key: z.string(), zeta: numberOrOptimized }),
  z.object({ family: z.literal('diatomic'), key: z.string(), species: z.string() }),
  z.object({ family: z.literal('huckel'), key: z.string(), systemIndex: z.number().int(), system: huckelSystemSchema }),
]);

/* ---------- answer keys ---------- */

export const answerKeySchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('curve'),
    /** equilibrium distance of the bonding / ground curve on the model itself; null when it has no minimum */
    reBohr: z.number().nullable(),
    reAngstrom: z.number().nullable(),
    energyAtReHartree: z.number().nullable(),
    deHartree: z.number().nullable(),
    deEv: z.number().nullable(),
    harmonicWavenumberCm1: z.number().nullable(),
    /** the exponent at Re when ζ is optimized, else the fixed one */
    zetaAtRe: z.number().nullable(),
    dissociationLimitHartree: z.number(),
    /** only when the exercise includes the antibonding curve */
    antibondingRepulsive: z.boolean().nullable(),
  }),
  z.object({
    kind: z.literal('diagram'),
    species: z.string(),
    configuration: z.string(),
    bondOrder: z.number(),
    unpairedElectrons: z.number().int(),
    termSymbol: z.string(),
    magnetism: z.string(),
  }),
  z.object({
    kind: z.literal('huckel'),
    system: z.string(),
    /** x of E = α + xβ per orbital, lowest energy first */
    x: z.array(z.number()),
    piEnergyBeta: z.number(),
    delocalizationBeta: z.number(),
    homoLumoGapBeta: z.number().nullable(),
  }),
]);
export type AnswerKey = z.infer<typeof answerKeySchema>;

const tidy = (x: number) => (Math.abs(x) < 1e-12 ? 0 : x);

/** The numbers a lecturer checks a report against, taken from a computed Reference. */
export function answerKeyOf(reference: Reference): AnswerKey {
  if (reference.kind === 'curve') {
    const min = reference.minimum;
    const fixedZeta = typeof reference.params.zeta === 'number' ? reference.params.zeta : null;
    return {
      kind: 'curve',
      reBohr: min?.reBohr ?? null,
      reAngstrom: min ? min.reBohr * BOHR_ANGSTROM : null,
      energyAtReHartree: min?.energyHartree ?? null,
      deHartree: min?.deHartree ?? null,
      deEv: min?.deEv ?? null,
      harmonicWavenumberCm1: reference.harmonicWavenumberCm1,
      zetaAtRe: min?.zeta ?? fixedZeta,
      dissociationLimitHartree: reference.dissociationLimitHartree,
      antibondingRepulsive: reference.antibondingRepulsive,
    };
  }
  if (reference.kind === 'diagram') {
    return { kind: 'diagram', species: reference.species, ...reference.answers };
  }
  return {
    kind: 'huckel',
    system: reference.systemLabel,
    x: reference.answers.x.map(tidy),
    piEnergyBeta: tidy(reference.answers.piEnergyBeta),
    delocalizationBeta: tidy(reference.answers.delocalizationBeta),
    homoLumoGapBeta: reference.answers.homoLumoGapBeta === null ? null : tidy(reference.answers.homoLumoGapBeta),
  };
}

/* ---------- list ---------- */

export const exerciseCountsSchema = z.object({
  /** active students of the course */
  students: z.number().int(),
  /** students holding a variant of the current revision */
  withVariant: z.number().int(),
  distinctVariants: z.number().int(),
  /** students who uploaded at least one report */
  reported: z.number().int(),
  checks: z.number().int(),
});

/**
 * GET /api/v1/courses/:courseId/exercises → { exercises, canAuthor, timeZone }.
 * Staff of the course (and admins) see every state with counts; students of
 * the course see published and closed exercises only, with `counts: null`.
 */
export const exerciseSummarySchema = z.object({
  id: z.number().int(),
  courseId: z.number().int(),
  title: z.string(),
  family: modelFamilySchema,
  state: exerciseStateSchema,
  /** wall-clock due time in `timeZone`, YYYY-MM-DDTHH:MM */
  dueLocal: z.string(),
  timeZone: z.string(),
  /** the due instant (ISO 8601, UTC) */
  dueAt: z.string(),
  revisionNo: z.number().int(),
  /** when the current revision was published (null for a draft) */
  publishedAt: z.string().nullable(),
  updatedAt: z.string(),
  counts: exerciseCountsSchema.nullable(),
});
export type ExerciseSummary = z.infer<typeof exerciseSummarySchema>;
export const exercisesResponseSchema = z.object({
  exercises: z.array(exerciseSummarySchema),
  /** may the caller create exercises in this course (lecturers, admins) */
  canAuthor: z.boolean(),
  /** the time zone of the course's latest exercise, a default for a new one (null when none) */
  timeZone: z.string().nullable(),
});
export type ExercisesResponse = z.infer<typeof exercisesResponseSchema>;

/* ---------- one exercise ---------- */

export const revisionSummarySchema = z.object({
  id: z.number().int(),
  revisionNo: z.number().int(),
  createdAt: z.string(),
  createdBy: z.object({ id: z.number().int(), displayName: z.string() }),
  publishedAt: z.string().nullable(),
  engineVersion: z.string(),
  /** top-level spec fields that differ from the revision before (empty for the first) */
  changed: z.array(z.string()),
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;

const courseRef = z.object({ id: z.number().int(), code: z.string(), title: z.string() });

/**
 * GET /api/v1/exercises/:id. Staff of the course get `view: 'staff'` with the
 * whole spec and every revision; students of the course get `view: 'student'`
 * with what they need to hand in (published and closed exercises only).
 */
export const staffExerciseSchema = z.object({
  view: z.literal('staff'),
  id: z.number().int(),
  course: courseRef,
  state: exerciseStateSchema,
  spec: exerciseSpecSchema,
  dueAt: z.string(),
  revision: revisionSummarySchema,
  revisions: z.array(revisionSummarySchema),
  counts: exerciseCountsSchema,
  permissions: z.object({ author: z.boolean() }),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type StaffExercise = z.infer<typeof staffExerciseSchema>;

export const studentExerciseSchema = z.object({
  view: z.literal('student'),
  id: z.number().int(),
  course: courseRef,
  state: exerciseStateSchema,
  title: z.string(),
  instructionsMarkdown: z.string(),
  family: modelFamilySchema,
  dueLocal: z.string(),
  timeZone: z.string(),
  dueAt: z.string(),
  late: exerciseSpecSchema.shape.late,
  allowedFileTypes: z.array(z.string()),
  writeUp: z.enum(['none', 'optional', 'required']),
});
export type StudentExercise = z.infer<typeof studentExerciseSchema>;
export const exerciseResponseSchema = z.discriminatedUnion('view', [staffExerciseSchema, studentExerciseSchema]);
export type ExerciseResponse = z.infer<typeof exerciseResponseSchema>;

/* ---------- changes ---------- */

/**
 * POST /api/v1/courses/:courseId/exercises (lecturers of the course, admins):
 * body = ExerciseSpec → 201 { exercise } (a draft, revision 1).
 *
 * PUT /api/v1/exercises/:id: body = ExerciseSpec plus optional `remark`.
 * A draft is changed in place. A published or closed exercise gets a new
 * revision, published at once, only with `remark: true` (the re-marking job is
 * queued in the same transaction); without it the answer is 409 `conflict`
 * with details { reason: 'remark-confirmation-required', nextRevisionNo, reportCount }.
 * An unchanged spec changes nothing (`unchanged: true`).
 *
 * POST /api/v1/exercises/:id/publish: draft → published (variants drawn for
 * every active student), or closed → published again (variants for students
 * enrolled since). POST /api/v1/exercises/:id/close: published → closed.
 */
export const updateExerciseBodySchema = checkedExerciseSpecSchema.and(z.object({ remark: z.boolean().optional() }));
export type UpdateExerciseBody = z.input<typeof updateExerciseBodySchema>;

export const exerciseMutationResponseSchema = z.object({
  exercise: staffExerciseSchema,
  /** variants stored by this request */
  variantsDrawn: z.number().int().optional(),
  /** the queued re-marking job (jobs.id) */
  remarkJobId: z.number().int().optional(),
  unchanged: z.boolean().optional(),
});
export type ExerciseMutationResponse = z.infer<typeof exerciseMutationResponseSchema>;

export const remarkConfirmationDetailsSchema = z.object({
  reason: z.literal('remark-confirmation-required'),
  nextRevisionNo: z.number().int(),
  reportCount: z.number().int(),
});

/* ---------- answer key and preview ---------- */

export const variantStudentSchema = z.object({
  enrolmentId: z.number().int(),
  studentNumber: z.string(),
  name: z.string(),
  section: z.string().nullable(),
});
export type VariantStudent = z.infer<typeof variantStudentSchema>;

/**
 * GET /api/v1/exercises/:id/answer-key[?revision=N] (staff of the course,
 * admins): every variant the rules can produce plus any stored one, with its
 * answer key and the students who hold it (assistants: only students of
 * their own sections). `error` when the engine cannot compute a variant.
 */
export const answerKeyResponseSchema = z.object({
  exerciseId: z.number().int(),
  revisionId: z.number().int(),
  revisionNo: z.number().int(),
  engineVersion: z.string(),
  variants: z.array(
    z.object({
      key: z.string(),
      variant: variantSchema,
      answers: answerKeySchema.nullable(),
      error: z.string().nullable(),
      students: z.array(variantStudentSchema),
    }),
  ),
  /** true when the rules allow more variants than listed (cap 500) */
  truncated: z.boolean(),
  /** false when some answer keys were left for a later request (3 s budget per request; held variants first) */
  complete: z.boolean(),
});
export type AnswerKeyResponse = z.infer<typeof answerKeyResponseSchema>;

/**
 * GET /api/v1/exercises/:id/preview?studentNumber=… (staff; assistants only
 * for their sections' students): that student's variant of the current
 * revision — the stored one, or drawn now (not stored) for a draft.
 */
export const previewQuerySchema = z.object({ studentNumber: z.string().trim().min(1, 'give a student number').max(32) });
export const previewResponseSchema = z.object({
  student: variantStudentSchema,
  revisionId: z.number().int(),
  revisionNo: z.number().int(),
  variant: variantSchema,
  stored: z.boolean(),
  answers: answerKeySchema.nullable(),
  error: z.string().nullable(),
});
export type PreviewResponse = z.infer<typeof previewResponseSchema>;

export type { Variant };
