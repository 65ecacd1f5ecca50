import { describe, expect, it } from 'vitest';
import {
  curve,
  curveMinimum,
  curvePoint,
  describeCurveModel,
  dissociationLimit,
  validateCurveParams,
  type CurveModelParams,
} from '@shared/chemistry/curves';
import { exactCurve, exactOneElectronEnergy } from '@shared/chemistry/exact';
import { h2Curve, h2Energy, h2Equilibrium, h2OptimizedZeta } from '@shared/chemistry/h2';
import { lcaoCurve, lcaoEnergies, lcaoOptimizedZeta, lcaoTextbookEnergies } from '@shared/chemistry/lcao';

const params = (p: Partial<CurveModelParams> & Pick<CurveModelParams, 'model'>): CurveModelParams => ({
  za: 1,
  zb: 1,
  zeta: 1,
  state: 'bonding',
  ...p,
});
const grid = (from: number, to: number, count: number) => Array.from({ length: count }, (_, i) => from + (i * (to - from)) / (count - 1));

describe('curves: agreement with each model’s own functions', () => {
  it('lcao, fixed ζ: point equals lcaoEnergies for both roots, homo- and heteronuclear', () => {
    for (const [za, zb, zeta, r] of [[1, 1, 1, 2], [1, 2, 1.3, 1.7], [2, 2, 0.8, 0.9]]) {
      const e = lcaoEnergies({ za, zb, zeta, distanceBohr: r });
      const bonding = curvePoint(params({ model: 'lcao', za, zb, zeta }), r);
      const antibonding = curvePoint(params({ model: 'lcao', za, zb, zeta, state: 'antibonding' }), r);
      expect(bonding.energyHartree).toBe(e.bondingHartree);
      expect(bonding.electronicHartree).toBe(e.bondingElectronicHartree);
      expect(antibonding.energyHartree).toBe(e.antibondingHartree);
      expect(bonding.zeta).toBeUndefined();
    }
  });

  it('lcao, fixed ζ curve (homonuclear closed-form path) equals lcaoCurve (general 2×2 path)', () => {
    // bonding root: to rounding (1e−14 relative) from 0.05 to 135 bohr
    const wide = Array.from({ length: 400 }, (_, k) => 0.05 * Math.pow(1.02, k));
    // antibonding root: (Haa − Hab)/(1 − S) is 0/0 as w = ζR → 0 in both paths, so compare from w ≈ 0.3 on
    const moderate = grid(0.3, 12, 60);
    for (const z of [1, 3]) {
      for (const zeta of [0.5, 1.2, 2.5]) {
        for (const [state, rs, tolerance] of [['bonding', wide, 1e-14], ['antibonding', moderate, 1e-13]] as const) {
          const ours = curve(params({ model: 'lcao', za: z, zb: z, zeta, state }), rs);
          const theirs = lcaoCurve({ za: z, zb: z, zeta, state, distancesBohr: rs });
          expect(ours.distanceBohr).toEqual(rs);
          ours.energyHartree.forEach((e, i) => expect(Math.abs(e - theirs.energyHartree[i])).toBeLessThan(tolerance * Math.max(1, Math.abs(e))));
          ours.electronicHartree.forEach((e, i) => expect(Math.abs(e - theirs.electronicHartree[i])).toBeLessThan(tolerance * Math.max(1, Math.abs(e))));
          expect(ours.zeta).toBeUndefined();
        }
      }
    }
  });

  it('lcao, optimized ζ: point and curve agree with lcaoOptimizedZeta / lcaoCurve', () => {
    const p = params({ model: 'lcao', za: 1, zb: 2, zeta: 'opt' });
    const point = curvePoint(p, 1.5);
    const ref = lcaoOptimizedZeta({ za: 1, zb: 2, distanceBohr: 1.5, state: 'bonding' });
    expect(point.energyHartree).toBeCloseTo(ref.energyHartree, 12);
    expect(point.zeta).toBeCloseTo(ref.zeta, 6);
    const rs = grid(0.8, 6, 30);
    const ours = curve(p, rs);
    const theirs = lcaoCurve({ za: 1, zb: 2, zeta: 'opt', state: 'bonding', distancesBohr: rs });
    expect(ours.energyHartree).toEqual(theirs.energyHartree);
    expect(ours.zeta).toEqual(theirs.zeta);
  });

  it('exact: point and curve agree with exactOneElectronEnergy / exactCurve, σg and σu', () => {
    for (const state of ['bonding', 'antibonding'] as const) {
      const p = params({ model: 'exact', state });
      const e = exactOneElectronEnergy({ za: 1, zb: 1, distanceBohr: 2, state: state === 'bonding' ? 'sigma-g' : 'sigma-u' });
      const point = curvePoint(p, 2);
      expect(point.energyHartree).toBeCloseTo(e.totalHartree, 12);
      expect(point.electronicHartree).toBeCloseTo(e.electronicHartree, 12);
      expect(point.zeta).toBeUndefined();
      const rs = grid(1, 5, 9);
      const ours = curve(p, rs);
      const theirs = exactCurve({ za: 1, zb: 1, state: state === 'bonding' ? 'sigma-g' : 'sigma-u', distancesBohr: rs });
      expect(ours.energyHartree).toEqual(theirs.totalHartree);
      expect(ours.electronicHartree).toEqual(theirs.electronicHartree);
    }
  });

  it('h2: bonding is the ground state, antibonding the triplet, for every method (fixed and optimized ζ)', () => {
    const methods = { 'h2-mo': 'mo', 'h2-ci': 'ci', 'h2-vb': 'vb' } as const;
    for (const [model, method] of Object.entries(methods) as Array<[keyof typeof methods, (typeof methods)[keyof typeof methods]]>) {
      const ground = h2Energy({ method, zeta: 1, distanceBohr: 1.4 });
      expect(curvePoint(params({ model }), 1.4).energyHartree).toBe(ground.totalHartree);
      const triplet = h2Energy({ method, zeta: 1, distanceBohr: 1.4, state: 'triplet' });
      expect(curvePoint(params({ model, state: 'antibonding' }), 1.4).energyHartree).toBe(triplet.totalHartree);
      const best = h2OptimizedZeta({ method, distanceBohr: 1.4 });
      const opt = curvePoint(params({ model, zeta: 'opt' }), 1.4);
      expect(opt.energyHartree).toBeCloseTo(best.totalHartree, 12);
      expect(opt.zeta).toBeCloseTo(best.zeta, 6);
      const rs = grid(0.7, 4, 12);
      const ours = curve(params({ model, zeta: 'opt' }), rs);
      const theirs = h2Curve({ method, zeta: 'opt', distancesBohr: rs });
      expect(ours.energyHartree).toEqual(theirs.map((x) => x.totalHartree));
      expect(ours.zeta).toEqual(theirs.map((x) => x.zeta));
    }
  });

  it('curveMinimum of the h2 models agrees with h2Equilibrium (Brent over R on the model)', () => {
    for (const [model, method] of [['h2-mo', 'mo'], ['h2-vb', 'vb'], ['h2-ci', 'ci']] as const) {
      for (const zeta of [1, 'opt'] as const) {
        const ours = curveMinimum(params({ model, zeta }))!;
        const theirs = h2Equilibrium({ method, zeta });
        expect(ours.reBohr).toBeCloseTo(theirs.distanceBohr, 6);
        expect(ours.energyHartree).toBeCloseTo(theirs.totalHartree, 11);
        expect(ours.deHartree).toBeCloseTo(theirs.dissociationEnergyHartree, 11);
        expect(ours.zeta).toBeCloseTo(theirs.zeta, 5);
      }
    }
  });

  it('dissociation limits: one-electron → −Z²/2 of the larger charge (ζ optimized / exact), ζ²/2 − Zζ (fixed); H2 → two atoms', () => {
    expect(dissociationLimit(params({ model: 'lcao', zeta: 1 }))).toBe(-0.5); // ζ²/2 − ζ at ζ = 1 (hydrogen 1s, exact)
    expect(dissociationLimit(params({ model: 'lcao', zeta: 0.8 }))).toBeCloseTo(0.32 - 0.8, 15); // ζ²/2 − Zζ, Levine ch. 7 (variation method)
    expect(dissociationLimit(params({ model: 'lcao', za: 1, zb: 2, zeta: 'opt' }))).toBe(-2); // He+ 1s, −Z²/2
    expect(dissociationLimit(params({ model: 'lcao', za: 1, zb: 2, zeta: 'opt', state: 'antibonding' }))).toBe(-0.5); // H 1s
    expect(dissociationLimit(params({ model: 'exact', za: 3, zb: 1 }))).toBe(-4.5); // Li2+ 1s, −Z²/2
    expect(dissociationLimit(params({ model: 'exact', state: 'antibonding' }))).toBe(-0.5); // H(1s) + H+
    expect(dissociationLimit(params({ model: 'h2-mo' }))).toBe(-1); // two H atoms (De convention, Levine ch. 13)
    expect(dissociationLimit(params({ model: 'h2-vb', zeta: 1.2 }))).toBeCloseTo(1.44 - 2.4, 15); // ζ² − 2ζ, same basis
  });
});

describe('curves: science.md check values through the interface', () => {
  it('H2+ LCAO ζ = 1 at R = 2 a0: E+ = −0.553771, E− = −0.160854 Eh', () => {
    const bonding = curvePoint(params({ model: 'lcao' }), 2);
    const antibonding = curvePoint(params({ model: 'lcao', state: 'antibonding' }), 2);
    expect(bonding.energyHartree).toBeCloseTo(-0.553771, 6); // science.md §1 (computed)
    expect(antibonding.energyHartree).toBeCloseTo(-0.160854, 6); // science.md §1 (computed)
    const rs = grid(0.5, 10, 40);
    const c = curve(params({ model: 'lcao' }), rs);
    c.energyHartree.forEach((e, i) => expect(e).toBeCloseTo(lcaoTextbookEnergies(rs[i]).bondingHartree, 13)); // textbook form, Pauling & Wilson 1935 §42
  });

  it('H2+ LCAO ζ = 1: Re = 2.493 a0, E(Re) = −0.56483 Eh, De = 1.764 eV', () => {
    const m = curveMinimum(params({ model: 'lcao' }))!;
    expect(m.reBohr).toBeCloseTo(2.493, 3); // science.md §1: Pauling & Wilson 1935 (from memory); computed
    expect(m.energyHartree).toBeCloseTo(-0.56483, 5); // science.md §1 (from memory); computed
    expect(m.deEv).toBeCloseTo(1.764, 3); // science.md §1 (from memory); computed
    expect(m.zeta).toBe(1);
  });

  it('H2+ LCAO ζ optimized: Re = 2.003 a0, ζ = 1.238, E(Re) = −0.58651 Eh, De = 2.354 eV', () => {
    const m = curveMinimum(params({ model: 'lcao', zeta: 'opt' }))!;
    expect(m.reBohr).toBeCloseTo(2.003, 3); // science.md §1: Finkelstein & Horowitz 1928 (from memory); computed
    expect(m.zeta).toBeCloseTo(1.238, 3); // science.md §1 (from memory)
    expect(m.energyHartree).toBeCloseTo(-0.58651, 5); // science.md §1 (from memory); computed
    expect(m.deEv).toBeCloseTo(2.354, 3); // science.md §1 (from memory); computed
  });

  it('H2+ exact: E_el(2 a0) = −1.1026342144949 Eh; Re = 1.997 a0, E(Re) = −0.60263 Eh, De = 2.793 eV', () => {
    const point = curvePoint(params({ model: 'exact' }), 2);
    expect(Math.abs(point.electronicHartree - -1.1026342144949)).toBeLessThan(1e-9); // science.md §2: Bates, Ledsham & Stewart 1953 (from memory)
    expect(point.energyHartree - point.electronicHartree).toBeCloseTo(0.5, 14); // Za·Zb/R
    const m = curveMinimum(params({ model: 'exact' }))!;
    expect(m.reBohr).toBeCloseTo(1.997, 3); // science.md §1 table: Bates, Ledsham & Stewart 1953 (from memory)
    expect(m.energyHartree).toBeCloseTo(-0.60263, 5); // same source (from memory)
    expect(m.deEv).toBeCloseTo(2.793, 3); // same source (from memory)
    expect(m.zeta).toBeUndefined();
  });

  it('exact 2pσu of H2+ has only its shallow long-range well near R ≈ 12.5 a0', () => {
    const m = curveMinimum(params({ model: 'exact', state: 'antibonding' }))!;
    // the polarization well of 2pσu: Re ≈ 12.55 a0, depth ≈ 6e−5 Eh (Peek, J. Chem. Phys. 43 (1965) 3004; from memory)
    expect(m.reBohr).toBeGreaterThan(12.3);
    expect(m.reBohr).toBeLessThan(12.8);
    expect(m.deHartree).toBeGreaterThan(4e-5);
    expect(m.deHartree).toBeLessThan(8e-5);
  });

  it('H2 ζ = 1: MO Re = 1.603 a0, De = 2.70 eV; VB Re = 1.643 a0, De = 3.16 eV', () => {
    const mo = curveMinimum(params({ model: 'h2-mo' }))!;
    expect(mo.reBohr).toBeCloseTo(1.603, 3); // science.md §3: Levine, Quantum Chemistry, ch. 13 (from memory)
    expect(mo.deEv).toBeCloseTo(2.7, 2); // science.md §3: Levine ch. 13 (from memory)
    const vb = curveMinimum(params({ model: 'h2-vb' }))!;
    expect(vb.reBohr).toBeCloseTo(1.643, 3); // science.md §3: Levine ch. 13 (from memory)
    expect(vb.deEv).toBeCloseTo(3.16, 2); // science.md §3: Levine ch. 13 (from memory)
  });

  it('repulsive curves have no minimum: LCAO σu, H2 triplet, exact HeH2+ lowest state', () => {
    expect(curveMinimum(params({ model: 'lcao', state: 'antibonding' }))).toBeNull();
    expect(curveMinimum(params({ model: 'h2-vb', state: 'antibonding' }))).toBeNull();
    expect(curveMinimum(params({ model: 'exact', za: 2, zb: 1 }))).toBeNull(); // HeH2+ ground state is repulsive (Bates & Carson 1956; from memory)
  });
});

describe('curves: properties', () => {
  it('swapping Za and Zb changes nothing (lcao fixed and optimized ζ, exact lowest state)', () => {
    const cases: Array<Partial<CurveModelParams> & Pick<CurveModelParams, 'model'>> = [
      { model: 'lcao', zeta: 1.1 },
      { model: 'lcao', zeta: 1.1, state: 'antibonding' },
      { model: 'lcao', zeta: 'opt' },
      { model: 'exact' },
    ];
    for (const c of cases) {
      for (const r of [0.7, 2, 5]) {
        const ab = curvePoint(params({ ...c, za: 1, zb: 2 }), r);
        const ba = curvePoint(params({ ...c, za: 2, zb: 1 }), r);
        expect(Math.abs(ab.energyHartree - ba.energyHartree)).toBeLessThan(1e-10);
      }
      expect(dissociationLimit(params({ ...c, za: 1, zb: 3 }))).toBe(dissociationLimit(params({ ...c, za: 3, zb: 1 })));
    }
  });

  it('bonding lies below antibonding, and the exact σg lies below LCAO (variational bound)', () => {
    for (const model of ['lcao', 'exact', 'h2-mo', 'h2-ci', 'h2-vb'] as const) {
      // the simple-MO ground state crosses the triplet at R ≈ 3.14 a0 (its ionic half; Coulson & Fischer 1949)
      const rs = model === 'h2-mo' ? grid(0.5, 3, 11) : grid(0.5, 8, 16);
      const low = curve(params({ model }), rs);
      const high = curve(params({ model, state: 'antibonding' }), rs);
      low.energyHartree.forEach((e, i) => expect(e).toBeLessThan(high.energyHartree[i]));
    }
    const rs = grid(0.5, 8, 16);
    const exact = curve(params({ model: 'exact' }), rs);
    const lcao = curve(params({ model: 'lcao', zeta: 'opt' }), rs);
    exact.energyHartree.forEach((e, i) => expect(e).toBeLessThan(lcao.energyHartree[i]));
  });

  it('describes the model in a short label', () => {
    expect(describeCurveModel(params({ model: 'lcao', zeta: 'opt' }))).toBe('LCAO, Za = 1, Zb = 1, ζ optimized, bonding (σg)');
    expect(describeCurveModel(params({ model: 'exact', state: 'antibonding' }))).toBe('exact one-electron, Za = 1, Zb = 1, σu (2pσu)');
    expect(describeCurveModel(params({ model: 'h2-vb', state: 'antibonding' }))).toBe('H2 valence bond (Heitler–London), ζ = 1, triplet (³Σu⁺)');
    expect(describeCurveModel(params({ model: 'lcao', za: 1, zb: 2 }))).toBe('LCAO, Za = 1, Zb = 2, ζ = 1, bonding');
  });
});

describe('curves: errors for impossible input', () => {
  const bad: Array<[string, unknown, RegExp]> = [
    ['unknown model', { model: 'huckel', za: 1, zb: 1, zeta: 1, state: 'bonding' }, /unknown model 'huckel'/],
    ['unknown state', { model: 'lcao', za: 1, zb: 1, zeta: 1, state: 'excited' }, /unknown state/],
    ['negative charge', { model: 'lcao', za: -1, zb: 1, zeta: 1, state: 'bonding' }, /Za must be a finite number > 0/],
    ['zero exponent', { model: 'lcao', za: 1, zb: 1, zeta: 0, state: 'bonding' }, /zeta must be/],
    ['H2 with other charges', { model: 'h2-mo', za: 1, zb: 2, zeta: 1, state: 'bonding' }, /Za and Zb must both be 1/],
    ['exact σu for Za ≠ Zb', { model: 'exact', za: 1, zb: 2, zeta: 1, state: 'antibonding' }, /only the lowest state/],
  ];
  for (const [what, p, message] of bad) {
    it(`rejects ${what}`, () => {
      expect(() => validateCurveParams(p as CurveModelParams)).toThrow(RangeError);
      expect(() => curvePoint(p as CurveModelParams, 2)).toThrow(message);
      expect(() => curveMinimum(p as CurveModelParams)).toThrow(RangeError);
    });
  }
  it('rejects a distance ≤ 0 or not finite, naming the point', () => {
    expect(() => curvePoint(params({ model: 'lcao' }), -1)).toThrow(/R must be a finite distance > 0/);
    expect(() => curve(params({ model: 'exact' }), [1, 2, 0])).toThrow(/R\[2\] must be a finite distance > 0/);
    expect(() => curve(params({ model: 'h2-mo' }), [1, Number.NaN])).toThrow(RangeError);
  });
  it('the exact model ignores ζ', () => {
    expect(() => validateCurveParams(params({ model: 'exact', zeta: 0 }))).not.toThrow();
    expect(curvePoint(params({ model: 'exact', zeta: 0 }), 2).energyHartree).toBe(curvePoint(params({ model: 'exact', zeta: 'opt' }), 2).energyHartree);
  });
});
