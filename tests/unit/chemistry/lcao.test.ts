import { describe, expect, it } from 'vitest';
import {
  coulombIntegral,
  generalizedEigenTwoByTwo,
  lcaoCurve,
  lcaoDissociationLimit,
  lcaoEnergies,
  lcaoHomonuclearEnergies,
  lcaoMatrixElements,
  lcaoOptimizedZeta,
  lcaoTextbookEnergies,
  overlapIntegral,
  resonanceIntegral,
} from '@shared/chemistry/lcao';
import { minimizeBrent } from '@shared/chemistry/numeric';
import { HARTREE_EV } from '@shared/chemistry/units';

const grid = (from: number, to: number, n: number): number[] =>
  Array.from({ length: n }, (_, i) => from + ((to - from) * i) / (n - 1));

describe('two-centre integrals over 1s Slater orbitals', () => {
  it('S, J and K at R = 2 a0, ζ = 1', () => {
    expect(overlapIntegral(2, 1)).toBeCloseTo(0.586453, 6); // science.md §1: S = 0.586453 (computed)
    // closed forms evaluated by hand: J = (1 − 3e^−4)/2, K = 3e^−2 (computed (regression))
    expect(coulombIntegral(2, 1)).toBeCloseTo((1 - 3 * Math.exp(-4)) / 2, 15);
    expect(resonanceIntegral(2, 1)).toBeCloseTo(3 * Math.exp(-2), 15);
  });

  it('the general-ζ forms reduce to the ζ = 1 textbook forms', () => {
    for (const r of grid(0.05, 25, 60)) {
      const textbook = lcaoTextbookEnergies(r);
      expect(overlapIntegral(r, 1)).toBeCloseTo(textbook.overlap, 14);
      expect(coulombIntegral(r, 1)).toBeCloseTo(textbook.coulomb, 13);
      expect(resonanceIntegral(r, 1)).toBeCloseTo(textbook.resonance, 14);
    }
  });

  it('scale with ζ as exact 1s Slater integrals must: S(R, ζ) = S(ζR, 1), J(R, ζ) = ζ·J(ζR, 1), K(R, ζ) = ζ·K(ζR, 1)', () => {
    for (const zeta of [0.4, 1.238, 2.7]) {
      for (const r of [0.3, 1.7, 4.2]) {
        expect(overlapIntegral(r, zeta)).toBeCloseTo(overlapIntegral(zeta * r, 1), 14);
        expect(coulombIntegral(r, zeta)).toBeCloseTo(zeta * coulombIntegral(zeta * r, 1), 13);
        expect(resonanceIntegral(r, zeta)).toBeCloseTo(zeta * resonanceIntegral(zeta * r, 1), 13);
      }
    }
  });

  it('J tends to 1/R at large R and to ζ (the one-centre ⟨1/r⟩) as R → 0', () => {
    expect(coulombIntegral(40, 1)).toBeCloseTo(1 / 40, 14);
    expect(coulombIntegral(1e-5, 1.5)).toBeCloseTo(1.5, 4);
  });

  it('rejects non-physical input', () => {
    expect(() => overlapIntegral(0, 1)).toThrow(RangeError);
    expect(() => coulombIntegral(2, -1)).toThrow(RangeError);
    expect(() => lcaoEnergies({ za: 1, zb: 1, zeta: 1, distanceBohr: Number.NaN })).toThrow(RangeError);
    expect(() => lcaoOptimizedZeta({ za: 1, zb: 1, distanceBohr: 2, state: 'sideways' as never })).toThrow(RangeError);
  });
});

describe('minimal LCAO energies', () => {
  it('H2+ at R = 2 a0, ζ = 1', () => {
    const e = lcaoEnergies({ za: 1, zb: 1, zeta: 1, distanceBohr: 2 });
    expect(e.overlap).toBeCloseTo(0.586453, 6); // science.md §1 (computed)
    expect(e.bondingHartree).toBeCloseTo(-0.553771, 6); // science.md §1: E+ = −0.553771 Eh (computed)
    expect(e.antibondingHartree).toBeCloseTo(-0.160854, 6); // science.md §1: E− = −0.160854 Eh (computed)
    expect(e.nuclearRepulsionHartree).toBe(0.5);
    expect(e.bondingHartree - e.bondingElectronicHartree).toBeCloseTo(0.5, 15);
  });

  it('the general 2×2 solution, the homonuclear closed form and the textbook form agree', () => {
    for (const r of grid(0.2, 30, 80)) {
      const general = lcaoEnergies({ za: 1, zb: 1, zeta: 1, distanceBohr: r });
      const textbook = lcaoTextbookEnergies(r);
      const closed = lcaoHomonuclearEnergies({ z: 1, zeta: 1, distanceBohr: r });
      expect(Math.abs(general.bondingHartree - textbook.bondingHartree)).toBeLessThan(1e-13);
      expect(Math.abs(general.antibondingHartree - textbook.antibondingHartree)).toBeLessThan(1e-12);
      expect(Math.abs(general.bondingHartree - closed.bondingHartree)).toBeLessThan(1e-13);
      expect(Math.abs(general.antibondingHartree - closed.antibondingHartree)).toBeLessThan(1e-12);
    }
    for (const [z, zeta, r] of [[2, 1.7, 1.1], [3, 2.9, 0.6], [1, 0.8, 5]]) {
      const general = lcaoEnergies({ za: z, zb: z, zeta, distanceBohr: r });
      const closed = lcaoHomonuclearEnergies({ z, zeta, distanceBohr: r });
      expect(general.bondingHartree).toBeCloseTo(closed.bondingHartree, 12);
      expect(general.antibondingHartree).toBeCloseTo(closed.antibondingHartree, 12);
    }
  });

  it('heteronuclear roots satisfy det(H − E·S) = 0 and H·c = E·S·c with cᵀSc = 1', () => {
    for (const [za, zb, zeta, r] of [[2, 1, 1.6, 1.5], [1, 3, 2.1, 0.9], [1, 2, 1, 6]]) {
      const e = lcaoEnergies({ za, zb, zeta, distanceBohr: r });
      const m = lcaoMatrixElements({ za, zb, zeta, distanceBohr: r });
      for (const [energy, c] of [
        [e.bondingElectronicHartree, e.bonding],
        [e.antibondingElectronicHartree, e.antibonding],
      ] as const) {
        const det = (m.haa - energy) * (m.hbb - energy) - (m.hab - energy * m.overlap) ** 2;
        expect(Math.abs(det)).toBeLessThan(1e-12);
        const r1 = (m.haa - energy) * c.coefficientA + (m.hab - energy * m.overlap) * c.coefficientB;
        const r2 = (m.hab - energy * m.overlap) * c.coefficientA + (m.hbb - energy) * c.coefficientB;
        expect(Math.abs(r1) + Math.abs(r2)).toBeLessThan(1e-12);
        const norm = c.coefficientA ** 2 + c.coefficientB ** 2 + 2 * m.overlap * c.coefficientA * c.coefficientB;
        expect(norm).toBeCloseTo(1, 13);
      }
      // the lower root leans on the more highly charged nucleus, the upper one on the other;
      // the dominant coefficient is positive (sign convention). The minor coefficient of the lower
      // root may take either sign when ζ is far from the heavy atom's own exponent.
      const heavyOnA = za > zb;
      expect(Math.abs(e.bonding.coefficientA) > Math.abs(e.bonding.coefficientB)).toBe(heavyOnA);
      expect(Math.abs(e.antibonding.coefficientA) > Math.abs(e.antibonding.coefficientB)).toBe(!heavyOnA);
      expect(Math.max(e.bonding.coefficientA, e.bonding.coefficientB)).toBeGreaterThan(0.9);
      expect(e.antibonding.coefficientA * e.antibonding.coefficientB).toBeLessThan(0);
    }
  });

  it('the 2×2 solver stays accurate when the roots nearly coincide (large R)', () => {
    // S and Hab ~ e^−R: the exact splitting is 2(Hab − S·Haa)/(1 − S²)
    const m = lcaoMatrixElements({ za: 1, zb: 1, zeta: 1, distanceBohr: 30 });
    const { lower, upper } = generalizedEigenTwoByTwo({ aa: m.haa, bb: m.hbb, ab: m.hab }, { aa: 1, bb: 1, ab: m.overlap });
    const splitting = (2 * (m.haa * m.overlap - m.hab)) / (1 - m.overlap ** 2);
    expect(Math.abs((upper.energyHartree - lower.energyHartree) / splitting - 1)).toBeLessThan(1e-3);
    expect(lower.coefficientA).toBeCloseTo(1 / Math.sqrt(2 + 2 * m.overlap), 12);
    expect(upper.coefficientB).toBeCloseTo(-1 / Math.sqrt(2 - 2 * m.overlap), 12);
  });

  it('homonuclear coefficients are 1/√(2 ± 2S)', () => {
    const e = lcaoEnergies({ za: 1, zb: 1, zeta: 1.2, distanceBohr: 1.8 });
    expect(e.bonding.coefficientA).toBeCloseTo(1 / Math.sqrt(2 + 2 * e.overlap), 13);
    expect(e.bonding.coefficientB).toBeCloseTo(1 / Math.sqrt(2 + 2 * e.overlap), 13);
    expect(e.antibonding.coefficientA).toBeCloseTo(1 / Math.sqrt(2 - 2 * e.overlap), 13);
    expect(e.antibonding.coefficientB).toBeCloseTo(-1 / Math.sqrt(2 - 2 * e.overlap), 13);
  });

  it('swapping Za and Zb changes no energy and swaps the coefficients', () => {
    for (const r of [0.4, 1.3, 3.5, 9]) {
      const ab = lcaoEnergies({ za: 2, zb: 1, zeta: 1.4, distanceBohr: r });
      const ba = lcaoEnergies({ za: 1, zb: 2, zeta: 1.4, distanceBohr: r });
      expect(ba.bondingHartree).toBeCloseTo(ab.bondingHartree, 13);
      expect(ba.antibondingHartree).toBeCloseTo(ab.antibondingHartree, 13);
      expect(ba.haa).toBeCloseTo(ab.hbb, 14);
      expect(Math.abs(ba.bonding.coefficientA)).toBeCloseTo(Math.abs(ab.bonding.coefficientB), 12);
      const optAb = lcaoOptimizedZeta({ za: 2, zb: 1, distanceBohr: r, state: 'bonding' });
      const optBa = lcaoOptimizedZeta({ za: 1, zb: 2, distanceBohr: r, state: 'bonding' });
      expect(optBa.energyHartree).toBeCloseTo(optAb.energyHartree, 10);
    }
  });

  it('bonding lies below antibonding and 0 < S ≤ 1 at every distance', () => {
    for (const [za, zb, zeta] of [[1, 1, 1], [1, 1, 1.5], [2, 1, 1.3], [1, 3, 0.7]]) {
      for (const r of grid(0.05, 40, 200)) {
        const e = lcaoEnergies({ za, zb, zeta, distanceBohr: r });
        // beyond R ≈ 15 the splitting (~e^(−ζR)) drops below the rounding of E itself
        if (r < 15) expect(e.bondingHartree).toBeLessThan(e.antibondingHartree);
        else expect(e.bondingHartree).toBeLessThanOrEqual(e.antibondingHartree);
        expect(e.overlap).toBeGreaterThan(0);
        expect(e.overlap).toBeLessThanOrEqual(1);
      }
    }
  });

  it('dissociates to the separated-atom energies ζ²/2 − Zζ (−Z²/2 with ζ optimized)', () => {
    const h2plus = lcaoEnergies({ za: 1, zb: 1, zeta: 1, distanceBohr: 40 });
    // H atom 1s energy −½ Eh (exact hydrogen atom)
    expect(h2plus.bondingHartree).toBeCloseTo(-0.5, 12);
    expect(h2plus.antibondingHartree).toBeCloseTo(-0.5, 12);
    const limit = lcaoDissociationLimit({ za: 2, zb: 1, zeta: 1.3 });
    expect(limit.bondingHartree).toBeCloseTo(1.3 ** 2 / 2 - 2 * 1.3, 15);
    expect(limit.antibondingHartree).toBeCloseTo(1.3 ** 2 / 2 - 1.3, 15);
    // at R = 60 the overlap terms are ~e^(−ζR); what remains is the point-charge interaction of the
    // neutral-or-charged atom with the bare nucleus: (Za − 1)·Zb/R for the lower root (electron on A),
    // Za·(Zb − 1)/R for the upper one (electron on B)
    const far = lcaoEnergies({ za: 2, zb: 1, zeta: 1.3, distanceBohr: 60 });
    expect(far.bondingHartree).toBeCloseTo(limit.bondingHartree + (2 - 1) / 60, 12);
    expect(far.antibondingHartree).toBeCloseTo(limit.antibondingHartree, 12);
    const opt = lcaoOptimizedZeta({ za: 2, zb: 1, distanceBohr: 60, state: 'bonding' });
    expect(opt.energyHartree).toBeCloseTo(lcaoDissociationLimit({ za: 2, zb: 1, zeta: 'opt' }).bondingHartree + 1 / 60, 12);
    expect(opt.zeta).toBeCloseTo(2, 6);
  });

  it('energies are continuous and smooth in R (no jumps in the second difference)', () => {
    const h = 1e-3;
    for (const zeta of [1, 'opt'] as const) {
      for (const state of ['bonding', 'antibonding'] as const) {
        const rs = grid(0.3, 12, 2000);
        const curve = lcaoCurve({ za: 1, zb: 1, zeta, state, distancesBohr: rs.flatMap((r) => [r - h, r, r + h]) });
        for (let i = 0; i < rs.length; i++) {
          const [em, e0, ep] = curve.energyHartree.slice(3 * i, 3 * i + 3);
          // E'' ≤ ~ 2Z²/R³ + O(1) in this range, so h²·E'' stays below 1e-4
          expect(Math.abs(ep - 2 * e0 + em)).toBeLessThan(1e-4);
        }
      }
    }
  });
});

describe('minima of the minimal-LCAO H2+ curves', () => {
  it('ζ = 1: Re = 2.493 a0, E = −0.56483 Eh, De = 1.764 eV', () => {
    const min = minimizeBrent((r) => lcaoEnergies({ za: 1, zb: 1, zeta: 1, distanceBohr: r }).bondingHartree, 1, 4, 1e-10);
    const limit = lcaoDissociationLimit({ za: 1, zb: 1, zeta: 1 }).bondingHartree;
    expect(limit).toBe(-0.5);
    // classic LCAO result (e.g. Pauling & Wilson 1935; from memory); computed — science.md §1 table
    expect(Math.abs(min.x - 2.493)).toBeLessThan(5e-4);
    expect(Math.abs(min.fx - -0.56483)).toBeLessThan(5e-6); // same source
    expect(Math.abs((limit - min.fx) * HARTREE_EV - 1.764)).toBeLessThan(5e-4); // same source
  });

  it('ζ optimized: Re = 2.003 a0 (ζ = 1.238), E = −0.58651 Eh, De = 2.354 eV', () => {
    const energy = (r: number): number => lcaoOptimizedZeta({ za: 1, zb: 1, distanceBohr: r, state: 'bonding' }).energyHartree;
    const min = minimizeBrent(energy, 1, 4, 1e-10);
    const atMin = lcaoOptimizedZeta({ za: 1, zb: 1, distanceBohr: min.x, state: 'bonding' });
    const limit = lcaoDissociationLimit({ za: 1, zb: 1, zeta: 'opt' }).bondingHartree;
    // Finkelstein & Horowitz, Z. Phys. 48 (1928) 118 (from memory); computed — science.md §1 table
    expect(Math.abs(min.x - 2.003)).toBeLessThan(5e-4);
    expect(Math.abs(atMin.zeta - 1.238)).toBeLessThan(5e-4); // same source
    expect(Math.abs(min.fx - -0.58651)).toBeLessThan(5e-6); // same source
    expect(Math.abs((limit - min.fx) * HARTREE_EV - 2.354)).toBeLessThan(5e-4); // same source
  });

  it('the optimized exponent is a true minimum and never above the ζ = 1 energy (variational)', () => {
    for (const [za, zb] of [[1, 1], [2, 1]]) for (const r of grid(0.2, 15, 40)) {
      for (const state of ['bonding', 'antibonding'] as const) {
        const opt = lcaoOptimizedZeta({ za, zb, distanceBohr: r, state });
        const energyAt = (zeta: number) => {
          const e = lcaoEnergies({ za, zb, zeta, distanceBohr: r });
          return state === 'bonding' ? e.bondingHartree : e.antibondingHartree;
        };
        expect(opt.energyHartree).toBeCloseTo(energyAt(opt.zeta), 13); // two algebraically equal root formulas
        expect(opt.energyHartree).toBeLessThanOrEqual(energyAt(1) + 1e-14);
        expect(opt.energyHartree).toBeLessThanOrEqual(energyAt(opt.zeta * 1.01) + 1e-14);
        expect(opt.energyHartree).toBeLessThanOrEqual(energyAt(opt.zeta * 0.99) + 1e-14);
      }
    }
    // united-atom end: the bonding exponent tends to Za + Zb (He+ 1s has ζ = 2)
    expect(lcaoOptimizedZeta({ za: 1, zb: 1, distanceBohr: 0.01, state: 'bonding' }).zeta).toBeGreaterThan(1.99);
  });

  it('the warm-started curve equals independent cold-started optimizations, in any order of distances', () => {
    const rs = [...grid(0.4, 10, 300), 3.3, 0.5, 8, 1.1].reverse();
    for (const state of ['bonding', 'antibonding'] as const) {
      const curve = lcaoCurve({ za: 1, zb: 2, zeta: 'opt', state, distancesBohr: rs });
      expect(curve.zeta).toHaveLength(rs.length);
      for (let i = 0; i < rs.length; i += 7) {
        const cold = lcaoOptimizedZeta({ za: 1, zb: 2, distanceBohr: rs[i], state });
        expect(curve.energyHartree[i]).toBeCloseTo(cold.energyHartree, 11);
        expect(curve.zeta![i]).toBeCloseTo(cold.zeta, 6);
      }
    }
    const fixed = lcaoCurve({ za: 1, zb: 1, zeta: 1, state: 'antibonding', distancesBohr: [2] });
    expect(fixed.zeta).toBeUndefined();
    expect(fixed.energyHartree[0]).toBeCloseTo(-0.160854, 6); // science.md §1 (computed)
  });
});
