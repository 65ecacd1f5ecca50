import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase, type TestDatabase } from '../support/database';
import { seedDemo } from '../../seeds/demo';
import { seedDemoExercises } from '../../seeds/demo-exercises';
import { exerciseSpecSchema } from '@shared/exercises/spec';
import { computeReference } from '@shared/exercises/reference';
import { allVariants, drawVariant, type Variant } from '@shared/exercises/variants';

let db: TestDatabase;
const json = <T,>(v: unknown): T => (typeof v === 'string' ? JSON.parse(v) : v) as T;

beforeAll(async () => {
  db = await createTestDatabase();
  await seedDemo(db.knex, 'http://127.0.0.1:1/demo-issuer');
  // seeds/demo.ts may already call seedDemoExercises; add them only when it does not
  const [{ n }] = await db.knex('exercises').count({ n: '*' });
  if (Number(n) === 0) await seedDemoExercises(db.knex);
});

afterAll(async () => {
  await db?.drop();
});

describe('demo exercises', () => {
  it('has every model family, every state, and a valid spec with a marking scheme in each', async () => {
    const rows = await db.knex('exercises as e').join('exercise_revisions as r', 'r.id', 'e.current_revision_id').join('courses as c', 'c.id', 'e.course_id').select('c.code', 'e.state', 'r.spec_json', 'r.published_at');
    const specs = rows.map((r) => ({ code: r.code as string, state: r.state as string, spec: exerciseSpecSchema.parse(json(r.spec_json)), publishedAt: r.published_at }));
    expect(new Set(specs.map((s) => s.spec.model.family))).toEqual(new Set(['one-electron', 'two-electron', 'diatomic', 'huckel']));
    expect(new Set(specs.map((s) => s.state))).toEqual(new Set(['draft', 'published', 'closed']));
    expect(new Set(specs.map((s) => s.code))).toEqual(new Set(['CHEM 2140', 'CHEM 3310']));
    for (const s of specs) {
      expect(s.spec.scheme.checks.length, s.spec.title).toBeGreaterThan(0);
      expect(s.publishedAt === null, s.spec.title).toBe(s.state === 'draft');
    }
    const diatomic = specs.find((s) => s.spec.model.family === 'diatomic')!.spec.model;
    expect(diatomic.family === 'diatomic' && diatomic.species).toEqual(['O2', 'N2', 'O2+', 'B2', 'C2', 'F2']);
  });

  it('every variant of every demo exercise has a reference', () => {
    return db.knex('exercise_revisions').select('spec_json').then((rows) => {
      for (const r of rows) {
        const spec = exerciseSpecSchema.parse(json(r.spec_json));
        for (const v of allVariants(spec.model)) expect(() => computeReference(spec.model, v), `${spec.title} ${v.key}`).not.toThrow();
      }
    });
  });

  it('published and closed exercises hold the seed-drawn variant of every active student of their course; drafts none', async () => {
    const exercises = await db.knex('exercises as e').join('exercise_revisions as r', 'r.id', 'e.current_revision_id').select('e.id', 'e.course_id', 'e.state', 'r.id as revision_id', 'r.spec_json');
    for (const ex of exercises) {
      const spec = exerciseSpecSchema.parse(json(ex.spec_json));
      const variants = await db.knex('variants as v').join('enrolments as en', 'en.id', 'v.enrolment_id').where('v.revision_id', ex.revision_id).select('en.student_number', 'v.variant_json');
      if (ex.state === 'draft') {
        expect(variants).toHaveLength(0);
        continue;
      }
      const active = await db.knex('enrolments').where({ course_id: ex.course_id, status: 'active' }).pluck('student_number');
      expect(variants.map((v) => v.student_number).sort(), spec.title).toEqual([...active].sort());
      for (const v of variants) expect(json<Variant>(v.variant_json)).toEqual(drawVariant(spec.model, spec.variantSeed, v.student_number));
    }
  });

  it('the demo student account gets a variant in each published exercise of both courses', async () => {
    const n = await db.knex('variants as v').join('enrolments as en', 'en.id', 'v.enrolment_id').where('en.student_number', '2400001').count({ n: '*' }).first();
    expect(Number(n?.n)).toBe(5);
  });
});
