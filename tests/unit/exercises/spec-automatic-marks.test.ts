/**
 * The exercise spec's `automaticMarks` setting: 'at-once' by default, so that
 * specs written before the setting existed (stored revisions, the demo
 * exercises) stay valid and read as 'at-once'; 'on-return' is kept; any
 * other value is refused with the field's path.
 */
import { describe, expect, it } from 'vitest';
import { checkedExerciseSpecSchema } from '@shared/api/exercises';
import { exerciseSpecSchema, type ExerciseSpecInput } from '@shared/exercises/spec';
import { defaultCurveScheme } from '@shared/marking/score';
import { demoExercises } from '../../../seeds/demo-exercises';

const withoutSetting: ExerciseSpecInput = {
  title: 'A spec written before the setting existed',
  model: {
    family: 'one-electron',
    method: 'lcao',
    za: { kind: 'fixed', value: 1 },
    zb: { kind: 'fixed', value: 1 },
    zeta: { kind: 'fixed', value: 1.24 },
    states: ['bonding'],
    grid: { unit: 'bohr', start: 0.8, end: 8, step: 0.2 },
  },
  variantSeed: 'old-spec',
  dueLocal: '2026-10-09T17:00',
  late: { graceMinutes: 0, penaltyPerDayPercent: 10, capPercent: 50 },
  scheme: defaultCurveScheme(),
};

describe('automaticMarks', () => {
  it('a spec without the setting is valid and reads as at-once', () => {
    expect('automaticMarks' in withoutSetting).toBe(false);
    const parsed = exerciseSpecSchema.parse(withoutSetting);
    expect(parsed.automaticMarks).toBe('at-once');
    // a stored revision's JSON (as the server reads it back) gives the same
    expect(exerciseSpecSchema.parse(JSON.parse(JSON.stringify(withoutSetting))).automaticMarks).toBe('at-once');
  });

  it('on-return is kept; any other value is refused at its path', () => {
    expect(exerciseSpecSchema.parse({ ...withoutSetting, automaticMarks: 'on-return' }).automaticMarks).toBe('on-return');
    const bad = exerciseSpecSchema.safeParse({ ...withoutSetting, automaticMarks: 'sometimes' });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues.map((i) => i.path.join('.'))).toEqual(['automaticMarks']);
  });

  it('every demo exercise still validates, with the default', () => {
    expect(demoExercises.length).toBeGreaterThan(0);
    for (const demo of demoExercises) {
      const parsed = checkedExerciseSpecSchema.safeParse(demo.spec);
      expect(parsed.success, `${demo.spec.title}: ${parsed.success ? '' : parsed.error.message}`).toBe(true);
      expect(parsed.data!.automaticMarks).toBe(demo.spec.automaticMarks ?? 'at-once');
    }
  });
});
