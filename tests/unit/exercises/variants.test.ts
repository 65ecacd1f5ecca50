import { describe, expect, it } from 'vitest';
import { allVariants, choiceValues, drawVariant, fnv1a32, gridValues, mulberry32 } from '@shared/exercises/variants';
import { exerciseSpecSchema, type ModelSpec } from '@shared/exercises/spec';

const oneElectron: ModelSpec = {
  family: 'one-electron',
  method: 'lcao',
  za: { kind: 'range', min: 1, max: 3, step: 0.5 },
  zb: { kind: 'fixed', value: 1 },
  zeta: { kind: 'list', values: [1, 1.1, 1.2] },
  states: ['bonding', 'antibonding'],
  grid: { unit: 'bohr', start: 0.5, end: 10, step: 0.1 },
};

describe('variant draws', () => {
  it('FNV-1a matches its published test vectors', () => {
    expect(fnv1a32('')).toBe(0x811c9dc5); // FNV offset basis (draft-eastlake-fnv)
    expect(fnv1a32('a')).toBe(0xe40c292c); // draft-eastlake-fnv test vector for "a"
    expect(fnv1a32('foobar')).toBe(0xbf9cf968); // draft-eastlake-fnv test vector for "foobar"
  });

  it('mulberry32 gives values in [0, 1) and repeats for the same seed', () => {
    const a = mulberry32(42);
    const b = mulberry32(42);
    const xs = Array.from({ length: 1000 }, () => a());
    expect(xs.every((x) => x >= 0 && x < 1)).toBe(true);
    expect(Array.from({ length: 1000 }, () => b())).toEqual(xs);
  });

  it('is reproducible from the seed and differs between students', () => {
    const v1 = drawVariant(oneElectron, 'autumn-week-3', '2400101');
    const v2 = drawVariant(oneElectron, 'autumn-week-3', '2400101');
    expect(v2).toEqual(v1);
    const keys = new Set(Array.from({ length: 60 }, (_, i) => drawVariant(oneElectron, 'autumn-week-3', String(2400101 + i)).key));
    expect(keys.size).toBeGreaterThan(8); // 15 variants exist; 60 students spread over most of them
    const otherSeed = Array.from({ length: 60 }, (_, i) => drawVariant(oneElectron, 'other-seed', String(2400101 + i)).key);
    const sameSeed = Array.from({ length: 60 }, (_, i) => drawVariant(oneElectron, 'autumn-week-3', String(2400101 + i)).key);
    expect(otherSeed).not.toEqual(sameSeed);
  });

  it('draws only values the rule allows, and every value turns up', () => {
    const seen = new Set<number>();
    for (let i = 0; i < 400; i++) {
      const v = drawVariant(oneElectron, 's', `k${i}`);
      if (v.family !== 'one-electron') throw new Error('family');
      expect([1, 1.5, 2, 2.5, 3]).toContain(v.za);
      expect(v.zb).toBe(1);
      expect([1, 1.1, 1.2]).toContain(v.zeta);
      seen.add(v.za);
    }
    expect(seen.size).toBe(5);
  });

  it('lists every variant for the answer key', () => {
    expect(allVariants(oneElectron)).toHaveLength(5 * 1 * 3);
    expect(allVariants({ family: 'diatomic', species: ['N2', 'O2', 'O2+'], order: 'auto' }).map((v) => v.key)).toEqual(['species=N2', 'species=O2', 'species=O2+']);
  });

  it('range and grid values avoid floating-point drift', () => {
    expect(choiceValues({ kind: 'range', min: 0.9, max: 1.3, step: 0.1 })).toEqual([0.9, 1, 1.1, 1.2, 1.3]);
    const g = gridValues({ start: 0.5, end: 10, step: 0.05 });
    expect(g).toHaveLength(191);
    expect(g[g.length - 1]).toBe(10);
  });
});

describe('exercise spec validation', () => {
  const base = {
    title: 'The one-electron bond',
    model: oneElectron,
    variantSeed: 'x',
    dueLocal: '2026-10-16T17:00',
    timeZone: 'Europe/London',
    late: { graceMinutes: 10, penaltyPerDayPercent: 10, capPercent: 50 },
    scheme: { checks: [{ kind: 'equilibrium-distance', id: 're', label: 'Re', weight: 2, full: 0.02, zero: 0.2 }] },
  };
  it('accepts a sound spec and fills defaults', () => {
    const spec = exerciseSpecSchema.parse(base);
    expect(spec.allowedFileTypes).toEqual(['csv', 'tsv', 'xlsx']);
    expect(spec.scheme.checks[0]).toMatchObject({ credit: 'linear' });
  });
  it('refuses a check that does not fit the model, naming where', () => {
    const r = exerciseSpecSchema.safeParse({ ...base, scheme: { checks: [{ kind: 'term-symbol', id: 't', label: 'Term', weight: 1 }] } });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path).toEqual(['scheme', 'checks', 0, 'kind']);
  });
  it('refuses an unknown time zone and a zero tolerance below the full one', () => {
    expect(exerciseSpecSchema.safeParse({ ...base, timeZone: 'Mars/Olympus' }).success).toBe(false);
    const r = exerciseSpecSchema.safeParse({ ...base, scheme: { checks: [{ kind: 'equilibrium-distance', id: 're', label: 'Re', weight: 2, full: 0.2, zero: 0.1 }] } });
    expect(r.success).toBe(false);
  });
});
