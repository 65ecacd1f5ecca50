/**
 * The demo's reports (seeds/demo-reports.ts, loaded by seedDemo): every state a
 * report can be in, late penalties, resubmissions, similarity flags, human
 * adjustments, and marks that are the marking's own (re-marking a stored
 * reading gives the stored mark).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { createTestDatabase, type TestDatabase } from '../support/database';
import { seedDemo } from '../../seeds/demo';
import { exerciseSpecSchema, type ExerciseSpec } from '@shared/exercises/spec';
import { latePenalty, zonedWallTimeToInstant } from '@shared/exercises/late';
import type { Variant } from '@shared/exercises/variants';
import { markWithReference } from '@server/modules/reports/marking';
import { markableOf, type StoredReading } from '@server/modules/reports/service';

let db: TestDatabase;
let seedMs = 0;
const json = <T,>(v: unknown): T => (typeof v === 'string' ? JSON.parse(v) : Buffer.isBuffer(v) ? JSON.parse(v.toString('utf8')) : v) as T;

interface Row {
  id: number;
  exercise_id: number;
  enrolment_id: number;
  version_no: number;
  state: 'submitted' | 'marked' | 'returned';
  returned_at: Date | null;
  uploaded_at: Date;
  uploaded_by: number;
  student_user: number;
  data_sha256: string;
  data_content: Buffer;
  writeup_file_id: number | null;
  reading_json: unknown;
  variant_json: unknown;
  exercise_state: string;
  current_revision_id: number;
  spec_json: unknown;
}

let reports: Row[] = [];
const specs = new Map<number, ExerciseSpec>();
/** every marks row of each report, oldest first */
const marksOf = new Map<number, { created_at: Date; revision_id: number; points: number; max_points: number; late_penalty_percent: number; total: number; checks: { id: string; points: number; max: number }[] }[]>();
const extensions = new Map<string, number>();

beforeAll(async () => {
  db = await createTestDatabase();
  const started = performance.now();
  await seedDemo(db.knex, 'http://127.0.0.1:1/demo-issuer');
  seedMs = performance.now() - started;
  const k = db.knex;
  reports = (await k('reports as r')
    .join('exercises as e', 'e.id', 'r.exercise_id')
    .join('exercise_revisions as rv', 'rv.id', 'e.current_revision_id')
    .join('enrolments as en', 'en.id', 'r.enrolment_id')
    .join('stored_files as d', 'd.id', 'r.data_file_id')
    .join('variants as v', 'v.id', 'r.variant_id')
    .orderBy('r.id')
    .select(
      'r.id',
      'r.exercise_id',
      'r.enrolment_id',
      'r.version_no',
      'r.state',
      'r.returned_at',
      'r.uploaded_at',
      'r.uploaded_by',
      'en.user_id as student_user',
      'd.sha256 as data_sha256',
      'd.content as data_content',
      'r.writeup_file_id',
      'r.reading_json',
      'v.variant_json',
      'e.state as exercise_state',
      'e.current_revision_id',
      'rv.spec_json',
    )) as Row[];
  for (const r of reports) if (!specs.has(r.exercise_id)) specs.set(r.exercise_id, exerciseSpecSchema.parse(json(r.spec_json)));
  for (const m of await k('marks').orderBy('id').select('report_id', 'created_at', 'revision_id', 'points', 'max_points', 'late_penalty_percent', 'total', 'checks_json')) {
    const list = marksOf.get(m.report_id) ?? [];
    list.push({ created_at: m.created_at, revision_id: m.revision_id, points: Number(m.points), max_points: Number(m.max_points), late_penalty_percent: Number(m.late_penalty_percent), total: Number(m.total), checks: json(m.checks_json) });
    marksOf.set(m.report_id, list);
  }
  for (const x of await k('extensions').orderBy('id').select('exercise_id', 'enrolment_id', 'extra_minutes')) extensions.set(`${x.exercise_id}|${x.enrolment_id}`, Number(x.extra_minutes));
}, 120_000);

afterAll(async () => {
  await db?.drop();
});

const newestOf = () => {
  const newest = new Map<string, Row>();
  for (const r of reports) {
    const key = `${r.exercise_id}|${r.enrolment_id}`;
    if ((newest.get(key)?.version_no ?? 0) < r.version_no) newest.set(key, r);
  }
  return [...newest.values()];
};

describe('demo reports', () => {
  it('covers every published and closed exercise with most of its students, and stays small', async () => {
    const exercises = await db.knex('exercises').whereIn('state', ['published', 'closed']).select('id', 'course_id');
    expect(exercises.length).toBe(5);
    for (const e of exercises) {
      const active = Number((await db.knex('enrolments').where({ course_id: e.course_id, status: 'active' }).count({ n: '*' }).first())!.n);
      const handedIn = new Set(reports.filter((r) => r.exercise_id === e.id).map((r) => r.enrolment_id)).size;
      expect(handedIn / active, `exercise ${e.id}`).toBeGreaterThan(0.75);
      expect(handedIn, `exercise ${e.id}`).toBeLessThan(active);
    }
    const drafts = await db.knex('reports as r').join('exercises as e', 'e.id', 'r.exercise_id').where('e.state', 'draft').count({ n: '*' }).first();
    expect(Number(drafts!.n)).toBe(0);
    expect(reports.length).toBeGreaterThan(100);
    expect(reports.length).toBeLessThan(400); // a few hundred at most, so the demo loads in seconds
    // the demo student account has reports in both courses
    const demo = await db.knex('users').where({ oidc_subject: 'student' }).first('id');
    expect(new Set(reports.filter((r) => r.student_user === demo.id).map((r) => r.exercise_id)).size).toBe(5);
    console.info(`seedDemo with reports: ${Math.round(seedMs)} ms for ${reports.length} reports`);
  });

  it('has reports in every state; returned ones carry their return moment, the others none', () => {
    const states = new Set(reports.map((r) => r.state));
    expect(states).toEqual(new Set(['submitted', 'marked', 'returned']));
    for (const r of reports) {
      if (r.state === 'returned') {
        expect(r.returned_at, `report ${r.id}`).not.toBeNull();
        expect(new Date(r.returned_at!).getTime()).toBeGreaterThan(new Date(r.uploaded_at).getTime());
      } else expect(r.returned_at, `report ${r.id}`).toBeNull();
    }
    // only a student's newest version is reviewed or returned
    const newest = new Set(newestOf().map((r) => r.id));
    for (const r of reports) if (!newest.has(r.id)) expect(r.state, `report ${r.id}`).toBe('submitted');
  });

  it('marks every report against its exercise current revision, within 0..max, with the late penalty of its upload moment', () => {
    let late = 0;
    let onTimeAfterDue = 0;
    for (const r of reports) {
      const marks = marksOf.get(r.id) ?? [];
      expect(marks.length, `report ${r.id}`).toBeGreaterThan(0);
      const mark = marks[marks.length - 1];
      expect(mark.revision_id, `report ${r.id}`).toBe(r.current_revision_id);
      // made at the upload moment, as an upload marks at once
      expect(Math.abs(new Date(mark.created_at).getTime() - new Date(r.uploaded_at).getTime())).toBeLessThan(1000);
      expect(mark.max_points).toBeGreaterThan(0);
      expect(mark.points).toBeGreaterThanOrEqual(0);
      expect(mark.points).toBeLessThanOrEqual(mark.max_points);
      expect(mark.total).toBeGreaterThanOrEqual(0);
      expect(mark.total).toBeLessThanOrEqual(mark.points);
      for (const c of mark.checks) {
        expect(c.points).toBeGreaterThanOrEqual(0);
        expect(c.points).toBeLessThanOrEqual(c.max);
      }
      // the penalty is the late rule applied to the stored upload moment (and any extension)
      const spec = specs.get(r.exercise_id)!;
      const dueAt = zonedWallTimeToInstant(spec.dueLocal, spec.timeZone);
      const extension = extensions.get(`${r.exercise_id}|${r.enrolment_id}`) ?? 0;
      const outcome = latePenalty({ submittedAt: new Date(r.uploaded_at), dueAt, extensionMinutes: extension, policy: spec.late });
      expect(mark.late_penalty_percent, `report ${r.id}`).toBeCloseTo(outcome.penaltyPercent, 2);
      expect(mark.total).toBeCloseTo(Math.round(mark.points * (1 - outcome.penaltyPercent / 100) * 100) / 100, 1);
      if (outcome.penaltyPercent > 0) late++;
      if (new Date(r.uploaded_at).getTime() > dueAt.getTime() && outcome.onTime) onTimeAfterDue++;
    }
    expect(late).toBeGreaterThanOrEqual(5);
    // after the due moment but inside the grace period or an extension: no penalty
    expect(onTimeAfterDue).toBeGreaterThanOrEqual(2);
  });

  it('stores marks the marking itself gives: re-marking the stored reading reproduces each mark', () => {
    for (const r of reports) {
      const spec = specs.get(r.exercise_id)!;
      const stored = json<StoredReading>(r.reading_json);
      const result = markWithReference({
        revisionId: r.current_revision_id,
        spec,
        variant: json<Variant>(r.variant_json),
        reading: markableOf(stored),
        answers: stored.answers,
        submittedAt: new Date(r.uploaded_at),
        extensionMinutes: extensions.get(`${r.exercise_id}|${r.enrolment_id}`) ?? 0,
      });
      const mark = marksOf.get(r.id)!.at(-1)!;
      expect(mark.points, `report ${r.id}`).toBeCloseTo(result.points, 2);
      expect(mark.total, `report ${r.id}`).toBeCloseTo(result.total, 2);
      // and the stored data file is the one its digest names
      expect(createHash('sha256').update(r.data_content).digest('hex')).toBe(r.data_sha256);
    }
  });

  it('spreads the marks: good, middling and poor reports in every exercise', () => {
    for (const [exerciseId, spec] of specs) {
      const fractions = newestOf()
        .filter((r) => r.exercise_id === exerciseId)
        .map((r) => {
          const m = marksOf.get(r.id)!.at(-1)!;
          return m.points / m.max_points;
        });
      const automaticShare = spec.scheme.checks.filter((c) => c.kind !== 'manual').reduce((s, c) => s + c.weight, 0) / spec.scheme.checks.reduce((s, c) => s + c.weight, 0);
      expect(Math.max(...fractions), spec.title).toBeGreaterThan(0.9 * automaticShare);
      expect(Math.min(...fractions), spec.title).toBeLessThan(0.7 * automaticShare);
      expect(new Set(fractions.map((f) => f.toFixed(3))).size, spec.title).toBeGreaterThanOrEqual(4);
    }
  });

  it('has resubmissions: versions 1 and 2 of one student, the second uploaded later', () => {
    const byStudent = new Map<string, Row[]>();
    for (const r of reports) byStudent.set(`${r.exercise_id}|${r.enrolment_id}`, [...(byStudent.get(`${r.exercise_id}|${r.enrolment_id}`) ?? []), r]);
    const resubmitted = [...byStudent.values()].filter((list) => list.length > 1);
    expect(resubmitted.length).toBeGreaterThanOrEqual(3);
    for (const list of resubmitted) {
      const sorted = [...list].sort((a, b) => a.version_no - b.version_no);
      expect(sorted.map((r) => r.version_no)).toEqual([1, 2]);
      expect(new Date(sorted[1].uploaded_at).getTime()).toBeGreaterThan(new Date(sorted[0].uploaded_at).getTime());
      expect(sorted[1].data_sha256).not.toBe(sorted[0].data_sha256);
    }
  });

  it('flags copied numbers between two students, and uploads on behalf are by staff', async () => {
    const flags = await db.knex('similarity_flags').select('exercise_id', 'report_id', 'other_report_id', 'kind', 'score', 'detail');
    expect(flags.length).toBeGreaterThanOrEqual(1);
    const byId = new Map(reports.map((r) => [r.id, r]));
    const identical = flags.filter((f) => f.kind === 'identical-numbers');
    expect(identical.length).toBeGreaterThanOrEqual(1);
    for (const f of flags) {
      const a = byId.get(f.report_id)!;
      const b = byId.get(f.other_report_id)!;
      expect(a.exercise_id).toBe(f.exercise_id);
      expect(b.exercise_id).toBe(f.exercise_id);
      expect(a.enrolment_id).not.toBe(b.enrolment_id);
    }
    // a copy handed in as it is: the same bytes under two students
    expect(identical.some((f) => byId.get(f.report_id)!.data_sha256 === byId.get(f.other_report_id)!.data_sha256)).toBe(true);
    const staffUploads = reports.filter((r) => r.uploaded_by !== r.student_user);
    expect(staffUploads.length).toBeGreaterThanOrEqual(1);
  });

  it('has human adjustments with a reason, by course staff, within each check maximum', async () => {
    const rows = await db.knex('adjustments as a').join('reports as r', 'r.id', 'a.report_id').join('exercises as e', 'e.id', 'r.exercise_id').select('a.report_id', 'a.check_id', 'a.points', 'a.reason', 'a.adjusted_by', 'e.course_id', 'r.state');
    expect(rows.length).toBeGreaterThanOrEqual(2);
    for (const a of rows) {
      expect(a.reason.trim().length).toBeGreaterThan(10);
      expect(a.state).not.toBe('submitted');
      const check = marksOf.get(a.report_id)!.at(-1)!.checks.find((c) => c.id === a.check_id);
      expect(check, `${a.report_id} ${a.check_id}`).toBeDefined();
      expect(Number(a.points)).toBeGreaterThanOrEqual(0);
      expect(Number(a.points)).toBeLessThanOrEqual(check!.max);
      const staff = await db.knex('course_staff').where({ course_id: a.course_id, user_id: a.adjusted_by }).first();
      expect(staff, `adjusted by ${a.adjusted_by}`).toBeDefined();
    }
    // at least one changes an automatic check (not only hand-marked ones)
    const manualIds = new Set([...specs.values()].flatMap((s) => s.scheme.checks.filter((c) => c.kind === 'manual').map((c) => c.id)));
    expect(rows.some((a) => !manualIds.has(a.check_id))).toBe(true);
  });
});
