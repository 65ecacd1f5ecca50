/**
 * Storing each student's Variant of a revision. A variant is drawn once with
 * drawVariant(model, seed, studentNumber) and kept in `variants`, one row per
 * revision and enrolment, with a random template token. A new revision whose
 * variant rule is unchanged copies the previous rows' variants, so nobody's
 * variant moves.
 */
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { exerciseSpecSchema, type ExerciseSpec } from '@shared/exercises/spec';
import { drawVariant, type Variant } from '@shared/exercises/variants';
import { HttpError, notFound } from '../../platform/errors';
import { findEnrolment, findRevision, findVariant, parseJson, type VariantRow } from './repo';

type Db = Knex | Knex.Transaction;

/** 24 URL-safe random characters (144 bits). */
export function newTemplateToken(): string {
  return randomBytes(18).toString('base64url');
}

/**
 * What decides which variant a student gets: the seed and the drawn
 * parameters. Two specs with the same rule give every student the same variant.
 */
export function variantRuleOf(spec: ExerciseSpec): string {
  const m = spec.model;
  const rule =
    m.family === 'one-electron'
      ? { za: m.za, zb: m.zb, zeta: m.zeta }
      : m.family === 'two-electron'
        ? { zeta: m.zeta }
        : m.family === 'diatomic'
          ? { species: m.species }
          : { systems: m.systems };
  return JSON.stringify({ seed: spec.variantSeed, family: m.family, rule });
}

export function specOf(specJson: unknown): ExerciseSpec {
  return exerciseSpecSchema.parse(parseJson(specJson));
}

export interface StoredVariant {
  id: number;
  revisionId: number;
  enrolmentId: number;
  variantKey: string;
  variant: Variant;
  templateToken: string;
}

export function storedVariantOf(row: VariantRow): StoredVariant {
  return {
    id: row.id,
    revisionId: row.revision_id,
    enrolmentId: row.enrolment_id,
    variantKey: row.variant_key,
    variant: parseJson<Variant>(row.variant_json),
    templateToken: row.template_token,
  };
}

export interface VariantToStore {
  enrolmentId: number;
  variant: Variant;
}

/** Inserts variant rows (skipping enrolments that already have one for the revision); returns how many were added. */
export async function storeVariants(trx: Db, revisionId: number, items: VariantToStore[]): Promise<number> {
  const count = async () => Number((await trx('variants').where({ revision_id: revisionId }).count({ n: '*' }).first())?.n ?? 0);
  const before = await count();
  for (let i = 0; i < items.length; i += 200) {
    const rows = items.slice(i, i + 200).map((it) => ({
      revision_id: revisionId,
      enrolment_id: it.enrolmentId,
      variant_key: it.variant.key,
      variant_json: JSON.stringify(it.variant),
      template_token: newTemplateToken(),
    }));
    // INSERT IGNORE: a row another request stored meanwhile (same revision and enrolment) is kept as it is
    await trx('variants').insert(rows).onConflict().ignore();
  }
  return (await count()) - before;
}

/**
 * The variant of one enrolment for one revision of `exercise`, drawn and
 * stored when it does not exist yet (e.g. a student enrolled after
 * publication). Safe to call concurrently: the unique (revision, enrolment)
 * key keeps one row. Throws 404 when the revision is not the exercise's or
 * the enrolment is not in the exercise's course.
 */
export async function ensureVariant(trx: Db, exercise: { id: number; course_id?: number }, revisionId: number, enrolmentId: number): Promise<StoredVariant> {
  const existing = await findVariant(trx, revisionId, enrolmentId);
  if (existing) return storedVariantOf(existing);
  const revision = await findRevision(trx, revisionId);
  if (!revision || revision.exercise_id !== exercise.id) throw notFound(`Revision ${revisionId} is not a revision of exercise ${exercise.id}.`);
  const courseId = exercise.course_id ?? (await trx('exercises').where({ id: exercise.id }).first('course_id'))?.course_id;
  const enrolment = await findEnrolment(trx, enrolmentId);
  if (!enrolment || enrolment.course_id !== courseId) throw notFound(`Enrolment ${enrolmentId} is not in the course of exercise ${exercise.id}.`);
  const spec = specOf(revision.spec_json);
  await storeVariants(trx, revisionId, [{ enrolmentId, variant: drawVariant(spec.model, spec.variantSeed, enrolment.student_number) }]);
  const stored = await findVariant(trx, revisionId, enrolmentId);
  if (!stored) throw new HttpError(500, 'internal', `Could not store the variant of enrolment ${enrolmentId}.`);
  return storedVariantOf(stored);
}

/**
 * Variants of a new revision for the given enrolments: copied from the
 * previous revision where the rule is unchanged and the student had one,
 * otherwise drawn from the new spec.
 */
export async function variantsForNewRevision(
  trx: Db,
  args: { spec: ExerciseSpec; previousSpec: ExerciseSpec | null; previousRevisionId: number | null; enrolments: { id: number; student_number: string }[] },
): Promise<VariantToStore[]> {
  const sameRule = args.previousSpec !== null && variantRuleOf(args.previousSpec) === variantRuleOf(args.spec);
  const previous = new Map<number, Variant>();
  if (sameRule && args.previousRevisionId !== null) {
    const rows = await trx('variants').where({ revision_id: args.previousRevisionId }).select('enrolment_id', 'variant_json');
    for (const r of rows) previous.set(r.enrolment_id, parseJson<Variant>(r.variant_json));
  }
  return args.enrolments.map((e) => ({
    enrolmentId: e.id,
    variant: previous.get(e.id) ?? drawVariant(args.spec.model, args.spec.variantSeed, e.student_number),
  }));
}
