import { describe, expect, it } from 'vitest';
import { computeReference } from '@shared/exercises/reference';
import { drawVariant } from '@shared/exercises/variants';
import type { ModelSpec } from '@shared/exercises/spec';

describe('references of variants', () => {
  it('one-electron LCAO, ζ = 1: minimum from the model, antibonding repulsive, grid in Å converted', () => {
    const model: ModelSpec = {
      family: 'one-electron',
      method: 'lcao',
      za: { kind: 'fixed', value: 1 },
      zb: { kind: 'fixed', value: 1 },
      zeta: { kind: 'fixed', value: 1 },
      states: ['bonding', 'antibonding'],
      grid: { unit: 'angstrom', start: 0.3, end: 5, step: 0.05 },
    };
    const ref = computeReference(model, drawVariant(model, 'seed', 'student'));
    if (ref.kind !== 'curve') throw new Error('kind');
    expect(ref.curves.map((c) => c.state)).toEqual(['bonding', 'antibonding']);
    expect(ref.grid.values).toHaveLength(95);
    expect(ref.grid.bohr[0]).toBeCloseTo(0.3 / 0.529177210903, 12); // CODATA 2018 bohr
    expect(ref.minimum!.reBohr).toBeCloseTo(2.493, 3); // classic LCAO result, Pauling & Wilson 1935 (from memory); science.md
    expect(ref.minimum!.deEv).toBeCloseTo(1.764, 3); // same source
    expect(ref.antibondingRepulsive).toBe(true);
    // every grid energy lies above the minimum, and the bonding curve is below the antibonding one
    const [b, a] = ref.curves;
    b.energyHartree.forEach((e, i) => {
      expect(e).toBeGreaterThanOrEqual(ref.minimum!.energyHartree - 1e-12);
      expect(e).toBeLessThan(a.energyHartree[i]);
    });
    expect(ref.harmonicWavenumberCm1).toBeGreaterThan(1000);
  });

  it('H2 simple MO with ζ = 1 reproduces Re = 1.603 a0 and De = 2.70 eV', () => {
    const model: ModelSpec = { family: 'two-electron', method: 'mo', zeta: { kind: 'fixed', value: 1 }, grid: { unit: 'bohr', start: 0.5, end: 8, step: 0.1 } };
    const ref = computeReference(model, drawVariant(model, 's', 'k'));
    if (ref.kind !== 'curve') throw new Error('kind');
    expect(ref.minimum!.reBohr).toBeCloseTo(1.603, 3); // Levine, Quantum Chemistry, ch. 13 (from memory); science.md
    expect(ref.minimum!.deEv).toBeCloseTo(2.70, 2); // same source
  });

  it('diatomic: O2 answer key', () => {
    const model: ModelSpec = { family: 'diatomic', species: ['O2'], order: 'auto' };
    const ref = computeReference(model, drawVariant(model, 's', 'k'));
    if (ref.kind !== 'diagram') throw new Error('kind');
    expect(ref.answers).toMatchObject({ bondOrder: 2, unpairedElectrons: 2, termSymbol: '³Σg⁻', magnetism: 'paramagnetic' }); // Huber & Herzberg 1979 (from memory)
  });

  it('Hückel: benzene answer key', () => {
    const model: ModelSpec = { family: 'huckel', systems: [{ kind: 'ring', n: 6 }] };
    const ref = computeReference(model, drawVariant(model, 's', 'k'));
    if (ref.kind !== 'huckel') throw new Error('kind');
    expect(ref.answers.x.map((x) => Math.round(x * 1e9) / 1e9)).toEqual([2, 1, 1, -1, -1, -2]); // closed form 2cos(2πk/6)
    expect(ref.answers.delocalizationBeta).toBeCloseTo(2, 9); // benzene delocalization 2β (science.md §5)
  });
});
