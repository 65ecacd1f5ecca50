/**
 * The exercise specification: which model, how each student's variant is
 * drawn, the R grid, the marking scheme and the late rule. One zod schema
 * serves the authoring form, the API and the marking.
 */
import { z } from 'zod';
import { distanceUnits, energyUnits } from '../chemistry/units/convert';

export const distanceUnitSchema = z.enum(distanceUnits);
export const energyUnitSchema = z.enum(energyUnits);

/** A number that is the same for everyone, drawn from a range on a step, or drawn from a list. */
export const numberChoiceSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('fixed'), value: z.number().finite() }),
  z
    .object({ kind: z.literal('range'), min: z.number().finite(), max: z.number().finite(), step: z.number().positive() })
    .refine((r) => r.max >= r.min, { message: 'max must not be below min', path: ['max'] })
    .refine((r) => (r.max - r.min) / r.step <= 10_000, { message: 'the range has more than 10,000 steps', path: ['step'] }),
  z.object({ kind: z.literal('list'), values: z.array(z.number().finite()).min(1, 'give at least one value') }),
]);
export type NumberChoice = z.infer<typeof numberChoiceSchema>;

/** The R grid students compute on, in the unit the exercise asks for. */
export const gridSchema = z
  .object({
    unit: distanceUnitSchema,
    start: z.number().positive('the grid must start above zero'),
    end: z.number().positive(),
    step: z.number().positive(),
  })
  .refine((g) => g.end > g.start, { message: 'end must be above start', path: ['end'] })
  .refine((g) => (g.end - g.start) / g.step <= 5000, { message: 'the grid has more than 5,000 points', path: ['step'] });
export type Grid = z.infer<typeof gridSchema>;

const positiveChoice = numberChoiceSchema;

export const huckelSystemSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('chain'), n: z.number().int().min(2).max(40) }),
  z.object({ kind: z.literal('ring'), n: z.number().int().min(3).max(40) }),
  z.object({
    kind: z.literal('graph'),
    name: z.string().min(1).max(80),
    /** atoms and bonds as the engine's Hückel graph input */
    graph: z.unknown(),
  }),
]);
export type HuckelSystem = z.infer<typeof huckelSystemSchema>;

export const modelSpecSchema = z.discriminatedUnion('family', [
  z.object({
    family: z.literal('one-electron'),
    method: z.enum(['lcao', 'exact']),
    za: positiveChoice,
    zb: positiveChoice,
    zeta: z.union([positiveChoice, z.object({ kind: z.literal('optimized') })]),
    states: z.array(z.enum(['bonding', 'antibonding'])).min(1, 'choose at least one state'),
    grid: gridSchema,
  }),
  z.object({
    family: z.literal('two-electron'),
    method: z.enum(['mo', 'ci', 'vb']),
    zeta: z.union([positiveChoice, z.object({ kind: z.literal('optimized') })]),
    grid: gridSchema,
  }),
  z.object({
    family: z.literal('diatomic'),
    /** formulas with optional charge, e.g. "O2", "N2+", "CO", "O2-" */
    species: z.array(z.string().min(1).max(12)).min(1, 'give at least one species'),
    order: z.enum(['auto', 'mixed', 'unmixed']),
  }),
  z.object({
    family: z.literal('huckel'),
    systems: z.array(huckelSystemSchema).min(1, 'give at least one pi system'),
  }),
]);
export type ModelSpec = z.infer<typeof modelSpecSchema>;
export type ModelFamily = ModelSpec['family'];

/** How points are given between the full-marks tolerance and the zero-marks one. */
export const creditRuleSchema = z.enum(['linear', 'all-or-nothing']);

const toleranceCheck = <K extends string>(kind: K) =>
  z
    .object({
      kind: z.literal(kind),
      id: z.string().regex(/^[a-z0-9-]{1,40}$/, 'use lower-case letters, digits and dashes'),
      label: z.string().min(1).max(120),
      weight: z.number().min(0).max(1000),
      /** deviation up to which the check gets full points, in the check's unit */
      full: z.number().min(0),
      /** deviation from which it gets none */
      zero: z.number().positive(),
      credit: creditRuleSchema.default('linear'),
    })
    .refine((c) => c.zero > c.full, { message: 'the zero-points tolerance must be larger than the full-points one', path: ['zero'] });

const plainCheck = <K extends string>(kind: K) =>
  z.object({
    kind: z.literal(kind),
    id: z.string().regex(/^[a-z0-9-]{1,40}$/, 'use lower-case letters, digits and dashes'),
    label: z.string().min(1).max(120),
    weight: z.number().min(0).max(1000),
  });

/**
 * The checks a lecturer can put in a marking scheme. Units of `full`/`zero`:
 * curve checks in hartree, equilibrium distance in bohr, well depth in eV,
 * wavenumber in cm⁻¹, Hückel energies in units of |β|.
 */
export const checkSchema = z.union([
  toleranceCheck('curve-rms').and(z.object({ removeShift: z.boolean().default(false) })),
  toleranceCheck('curve-max').and(z.object({ removeShift: z.boolean().default(false) })),
  toleranceCheck('equilibrium-distance'),
  toleranceCheck('well-depth'),
  toleranceCheck('vibrational-wavenumber').and(z.object({ isotopes: z.tuple([z.string(), z.string()]).optional() })),
  plainCheck('antibonding-repulsive'),
  plainCheck('configuration'),
  plainCheck('bond-order'),
  plainCheck('unpaired-electrons'),
  plainCheck('term-symbol'),
  toleranceCheck('huckel-energies'),
  plainCheck('manual').and(z.object({ description: z.string().max(2000).default('') })),
]);
export type Check = z.infer<typeof checkSchema>;
export type CheckKind = Check['kind'];

export const checkUnits: Record<CheckKind, string | null> = {
  'curve-rms': 'hartree',
  'curve-max': 'hartree',
  'equilibrium-distance': 'bohr',
  'well-depth': 'eV',
  'vibrational-wavenumber': 'cm-1',
  'antibonding-repulsive': null,
  configuration: null,
  'bond-order': null,
  'unpaired-electrons': null,
  'term-symbol': null,
  'huckel-energies': '|β|',
  manual: null,
};

/** Which checks make sense for which model family. */
export const checksByFamily: Record<ModelFamily, CheckKind[]> = {
  'one-electron': ['curve-rms', 'curve-max', 'equilibrium-distance', 'well-depth', 'vibrational-wavenumber', 'antibonding-repulsive', 'manual'],
  'two-electron': ['curve-rms', 'curve-max', 'equilibrium-distance', 'well-depth', 'vibrational-wavenumber', 'manual'],
  diatomic: ['configuration', 'bond-order', 'unpaired-electrons', 'term-symbol', 'manual'],
  huckel: ['huckel-energies', 'manual'],
};

export const markingSchemeSchema = z
  .object({ checks: z.array(checkSchema).min(1, 'a marking scheme needs at least one check') })
  .refine((s) => new Set(s.checks.map((c) => c.id)).size === s.checks.length, { message: 'check ids must be unique', path: ['checks'] })
  .refine((s) => s.checks.reduce((a, c) => a + c.weight, 0) > 0, { message: 'the weights must add up to more than zero', path: ['checks'] });
export type MarkingScheme = z.infer<typeof markingSchemeSchema>;

export const latePolicySchema = z.object({
  /** minutes after the due time that still count as on time */
  graceMinutes: z.number().int().min(0).max(7 * 24 * 60).default(0),
  /** percentage of the total taken off per started day late */
  penaltyPerDayPercent: z.number().min(0).max(100).default(10),
  /** the most that lateness can take off, in percent */
  capPercent: z.number().min(0).max(100).default(50),
});
export type LatePolicy = z.infer<typeof latePolicySchema>;

export const uploadFileTypes = ['csv', 'tsv', 'xlsx'] as const;

/**
 * When students see the automatic mark of a report: 'at-once' (on upload,
 * provisional until an assistant returns the report) or 'on-return' (held
 * back until the report is returned). Staff always see it.
 */
export const automaticMarksOptions = ['at-once', 'on-return'] as const;
export type AutomaticMarks = (typeof automaticMarksOptions)[number];

export const exerciseSpecSchema = z
  .object({
    title: z.string().min(1, 'give the exercise a title').max(200),
    instructionsMarkdown: z.string().max(20_000).default(''),
    model: modelSpecSchema,
    /** any text; the same seed and student give the same variant */
    variantSeed: z.string().min(1).max(100),
    /** ISO date-time of the due moment, e.g. 2026-10-16T17:00 read in `timeZone` */
    dueLocal: z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, 'use YYYY-MM-DDTHH:MM'),
    timeZone: z.string().min(1).default('Europe/London'),
    late: latePolicySchema,
    allowedFileTypes: z.array(z.enum(uploadFileTypes)).min(1).default(['csv', 'tsv', 'xlsx']),
    writeUp: z.enum(['none', 'optional', 'required']).default('optional'),
    /** specs stored before this setting existed read as 'at-once' */
    automaticMarks: z.enum(automaticMarksOptions).default('at-once'),
    scheme: markingSchemeSchema,
  })
  .superRefine((spec, ctx) => {
    const allowed = checksByFamily[spec.model.family];
    spec.scheme.checks.forEach((c, i) => {
      if (!allowed.includes(c.kind)) {
        ctx.addIssue({ code: 'custom', path: ['scheme', 'checks', i, 'kind'], message: `a ${c.kind} check does not apply to a ${spec.model.family} exercise` });
      }
    });
    if (!isValidTimeZone(spec.timeZone)) ctx.addIssue({ code: 'custom', path: ['timeZone'], message: `unknown time zone "${spec.timeZone}"` });
  });
export type ExerciseSpec = z.infer<typeof exerciseSpecSchema>;
export type ExerciseSpecInput = z.input<typeof exerciseSpecSchema>;

export function isValidTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}
