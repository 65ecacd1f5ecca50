import { describe, expect, it } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import {
  angularBasisSize,
  angularLegendreMatrix,
  angularSeparationConstant,
  exactCurve,
  exactDissociationLimit,
  exactOneElectronEnergy,
  largestEigenvalueBanded,
  radialContinuedFraction,
  radialContinuedFractionTerms,
  type AngularParity,
  type SymmetricBanded,
} from '@shared/chemistry/exact';
import { lcaoEnergies, lcaoEnergiesUnequalExponents, lcaoOptimizedZeta } from '@shared/chemistry/lcao';
import { findRootBrent, minimizeBrent } from '@shared/chemistry/numeric';
import { HARTREE_EV } from '@shared/chemistry/units';

const exact = (za: number, zb: number, distanceBohr: number, state: 'sigma-g' | 'sigma-u' = 'sigma-g') =>
  exactOneElectronEnergy({ za, zb, distanceBohr, state });

function denseFromBanded({ diagonal, upper1, upper2 }: SymmetricBanded): Matrix {
  const n = diagonal.length;
  const m = Matrix.zeros(n, n);
  for (let i = 0; i < n; i++) {
    m.set(i, i, diagonal[i]);
    if (i < n - 1) { m.set(i, i + 1, upper1[i]); m.set(i + 1, i, upper1[i]); }
    if (i < n - 2) { m.set(i, i + 2, upper2[i]); m.set(i + 2, i, upper2[i]); }
  }
  return m;
}
const largestByLibrary = (m: SymmetricBanded): number => Math.max(...new EigenvalueDecomposition(denseFromBanded(m)).realEigenvalues);

describe('angular equation in a Legendre basis', () => {
  it('the banded largest-eigenvalue solver agrees with ml-matrix on the angular matrices', () => {
    const cases: [number, number, AngularParity][] = [
      [2.2, 0, 'even'], [1.33, 0, 'odd'], [40, 0, 'even'], [650, 0, 'odd'], [5.0, 2, 'all'], [120, -30, 'all'], [0.01, 0.3, 'all'],
    ];
    for (const [c2, p, parity] of cases) {
      const m = angularLegendreMatrix(c2, p, parity, angularBasisSize(c2, p, parity));
      const reference = largestByLibrary(m);
      expect(Math.abs(largestEigenvalueBanded(m) - reference)).toBeLessThan(1e-11 * (1 + Math.abs(reference)));
      // a warm start (nearby guess) gives the same answer
      expect(Math.abs(largestEigenvalueBanded(m, reference + 1e-4) - reference)).toBeLessThan(1e-11 * (1 + Math.abs(reference)));
    }
  });

  it('the banded solver finds the largest eigenvalue of random symmetric pentadiagonal matrices', () => {
    let seed = 12345;
    const random = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 2 - 1;
    for (let trial = 0; trial < 20; trial++) {
      const n = 3 + (trial % 9);
      const m: SymmetricBanded = {
        diagonal: Float64Array.from({ length: n }, () => 5 * random()),
        upper1: Float64Array.from({ length: n - 1 }, () => random()),
        upper2: Float64Array.from({ length: n - 2 }, () => random()),
      };
      const reference = largestByLibrary(m);
      expect(Math.abs(largestEigenvalueBanded(m) - reference)).toBeLessThan(1e-12 * (1 + Math.abs(reference)));
    }
  });

  it('gives A = l(l + 1) without the field, and A = −c²/3 − 2c⁴/135 + O(c⁶) for small c', () => {
    // Legendre's equation: eigenvalues l(l + 1) (Abramowitz & Stegun 8.1.1)
    expect(angularSeparationConstant({ c2: 0, p: 0, parity: 'even' })).toBeCloseTo(0, 14);
    expect(angularSeparationConstant({ c2: 0, p: 0, parity: 'odd' })).toBeCloseTo(2, 14);
    // second-order perturbation theory in c²μ² about P_0 (derived here: ⟨μ²⟩ = 1/3, |⟨P̄2|μ²|P̄0⟩|² = 4/45, gap 6)
    const c2 = 0.01;
    expect(Math.abs(angularSeparationConstant({ c2, p: 0, parity: 'even' }) - (-c2 / 3 - (2 * c2 * c2) / 135))).toBeLessThan(1e-8);
  });

  it('the default basis is converged: doubling it changes A by < 1e−12', () => {
    for (const [c2, p, parity] of [[2.2, 0, 'even'], [300, 0, 'odd'], [900, 20, 'all'], [16, -4, 'all']] as [number, number, AngularParity][]) {
      const a = angularSeparationConstant({ c2, p, parity });
      const big = angularSeparationConstant({ c2, p, parity, basisSize: 2 * angularBasisSize(c2, p, parity) });
      expect(Math.abs(a - big)).toBeLessThan(1e-12 * (1 + Math.abs(a)));
    }
  });

  it('rejects an odd-l coupling term in a single-parity basis', () => {
    expect(() => angularSeparationConstant({ c2: 1, p: 1, parity: 'even' })).toThrow(RangeError);
  });
});

describe('radial continued fraction (Jaffé)', () => {
  it('vanishes at the exact energy and separation constant, and changes sign across it', () => {
    const r = 2;
    const point = exact(1, 1, r);
    const c = Math.sqrt((-point.electronicHartree * r * r) / 2);
    expect(Math.abs(radialContinuedFraction({ c, a: 2 * r, separationConstant: point.separationConstant }))).toBeLessThan(1e-12);
    // A is the angular constant at that c
    expect(angularSeparationConstant({ c2: c * c, p: 0, parity: 'even' })).toBeCloseTo(point.separationConstant, 12);
    // residual as a function of A: shifting A moves it off zero
    expect(Math.abs(radialContinuedFraction({ c, a: 2 * r, separationConstant: point.separationConstant + 1e-3 }))).toBeGreaterThan(1e-4);
  });

  it('the default number of levels is converged (four times as many change nothing)', () => {
    for (const c of [0.05, 0.4, 1.5, 6, 25]) {
      const a = 2 * c * 1.3; // σ = 0.3
      const A = -c * c * 0.4;
      const base = radialContinuedFraction({ c, a, separationConstant: A });
      const long = radialContinuedFraction({ c, a, separationConstant: A, terms: 4 * radialContinuedFractionTerms(c) });
      expect(Math.abs(base - long)).toBeLessThan(1e-13 * (1 + Math.abs(base)));
    }
  });
});

describe('exact one-electron two-centre energies', () => {
  it('H2+ 1sσg at R = 2 a0: E_el = −1.1026342144949 Eh', () => {
    const e = exact(1, 1, 2);
    // widely quoted, Bates, Ledsham & Stewart 1953 and later (from memory) — science.md §2
    expect(Math.abs(e.electronicHartree - -1.1026342144949)).toBeLessThan(1e-11);
    expect(e.totalHartree).toBeCloseTo(e.electronicHartree + 0.5, 15);
  });

  it('other H2+ values: 1sσg at R = 1 a0 and 2pσu at R = 2 a0', () => {
    expect(Math.abs(exact(1, 1, 1).electronicHartree - -1.4517863)).toBeLessThan(1e-7); // from memory (Bates et al. 1953 tables)
    expect(Math.abs(exact(1, 1, 2, 'sigma-u').electronicHartree - -0.6675344)).toBeLessThan(1e-7); // from memory (same tables)
  });

  it('H2+ minimum: Re = 1.997 a0, E(Re) = −0.60263 Eh, De = 2.793 eV', () => {
    const min = minimizeBrent((r) => exact(1, 1, r).totalHartree, 1.5, 2.5, 1e-9);
    const limit = exactDissociationLimit({ za: 1, zb: 1 });
    expect(limit).toBe(-0.5); // hydrogen atom ground state, exact
    // Bates, Ledsham & Stewart, Phil. Trans. R. Soc. A 246 (1953) 215 (from memory) — science.md §1 table
    expect(Math.abs(min.x - 1.997)).toBeLessThan(5e-4);
    expect(Math.abs(min.fx - -0.60263)).toBeLessThan(5e-6); // same source
    expect(Math.abs((limit - min.fx) * HARTREE_EV - 2.793)).toBeLessThan(5e-4); // same source
  });

  it('is converged: a residual built from twice the basis and twice the fraction has its zero at the same energy', () => {
    const cases: [number, number, number, 'sigma-g' | 'sigma-u'][] = [
      [1, 1, 0.05, 'sigma-g'], [1, 1, 2, 'sigma-g'], [1, 1, 7, 'sigma-u'], [1, 1, 40, 'sigma-g'],
      [2, 1, 1.5, 'sigma-g'], [1, 3, 12, 'sigma-g'], [2, 2, 0.8, 'sigma-u'],
    ];
    for (const [za, zb, r, state] of cases) {
      const e = exact(za, zb, r, state).electronicHartree;
      const parity: AngularParity = za !== zb ? 'all' : state === 'sigma-g' ? 'even' : 'odd';
      const p = parity === 'all' ? r * (zb - za) : 0;
      const residual = (energy: number): number => {
        const c2 = (-energy * r * r) / 2;
        const c = Math.sqrt(c2);
        const separationConstant = angularSeparationConstant({ c2, p, parity, basisSize: 2 * angularBasisSize(c2, p, parity) + 4 });
        return radialContinuedFraction({ c, a: r * (za + zb), separationConstant, terms: 2 * radialContinuedFractionTerms(c) + 50 });
      };
      const reference = findRootBrent(residual, e - 1e-6, e + 1e-6, 1e-15);
      expect(Math.abs(e - reference)).toBeLessThan(1e-11 * Math.max(1, Math.abs(e)));
    }
  });

  it('lies below every minimal-LCAO variational energy (σg, σu and heteronuclear)', () => {
    for (const r of [0.3, 0.8, 1.5, 2, 3, 5, 8, 12]) {
      const g = exact(1, 1, r).totalHartree;
      const u = exact(1, 1, r, 'sigma-u').totalHartree;
      const fixed = lcaoEnergies({ za: 1, zb: 1, zeta: 1, distanceBohr: r });
      expect(g).toBeLessThan(lcaoOptimizedZeta({ za: 1, zb: 1, distanceBohr: r, state: 'bonding' }).energyHartree);
      expect(g).toBeLessThan(fixed.bondingHartree);
      expect(u).toBeLessThan(lcaoOptimizedZeta({ za: 1, zb: 1, distanceBohr: r, state: 'antibonding' }).energyHartree);
      expect(u).toBeLessThan(fixed.antibondingHartree);
      expect(g).toBeLessThan(u);
      const het = exact(2, 1, r).totalHartree;
      expect(het).toBeLessThan(lcaoOptimizedZeta({ za: 2, zb: 1, distanceBohr: r, state: 'bonding' }).energyHartree);
      expect(het).toBeLessThan(lcaoEnergiesUnequalExponents({ za: 2, zb: 1, zetaA: 2, zetaB: 1, distanceBohr: r }).bondingHartree);
    }
  });

  it('is unchanged when Za and Zb are swapped', () => {
    for (const r of [0.4, 2.5, 9]) {
      expect(exact(1, 3, r).electronicHartree).toBeCloseTo(exact(3, 1, r).electronicHartree, 11);
      expect(exact(1, 3, r).separationConstant).toBeCloseTo(exact(3, 1, r).separationConstant, 9);
    }
  });

  it('united-atom limit: E_el → −(Za + Zb)²/2 + (8/3)R² for H2+ (He+ 1s), and 2pσu → −½ Eh', () => {
    // first-order perturbation theory about He+ 1s (derived here: each proton at R/2 from the centre
    // shifts the energy by ρ(0)·2π(R/2)²/3 with ρ(0) = 8/π); next order is O(R³)
    for (const r of [0.002, 0.005, 0.01]) {
      const e = exact(1, 1, r).electronicHartree;
      expect(Math.abs((e + 2) / (r * r) - 8 / 3)).toBeLessThan(8 * r);
    }
    // He+ 2p: −Z²/8 = −½ Eh (hydrogen-like energy, exact)
    expect(Math.abs(exact(1, 1, 0.05, 'sigma-u').electronicHartree + 0.5)).toBeLessThan(1e-3);
    expect(Math.abs(exact(1, 1, 0.01, 'sigma-u').electronicHartree + 0.5)).toBeLessThan(1e-4);
    // heteronuclear: Li2+ 1s, −(1 + 2)²/2 = −4.5 Eh (hydrogen-like, exact)
    expect(Math.abs(exact(1, 2, 0.01).electronicHartree + 4.5)).toBeLessThan(2e-3);
  });

  it('separated-atom limit with the charge-induced dipole: E → −Z²/2 − α/(2R⁴)', () => {
    // hydrogen polarizability α = 9/2 a0³ (exact; e.g. Bethe & Salpeter 1957, from memory): −9/(4R⁴)
    for (const state of ['sigma-g', 'sigma-u'] as const) {
      const r = 30;
      const shift = exact(1, 1, r, state).totalHartree - exactDissociationLimit({ za: 1, zb: 1 });
      expect(Math.abs(shift / (-9 / (4 * r ** 4)) - 1)).toBeLessThan(0.01);
    }
    // HeH2+ lowest state at R = 40: He+ 1s (−2 Eh) + charge (2 − 1)·1/R − α(He+)/(2R⁴), α = 9/(2Z⁴) (from memory)
    const r = 40;
    const expected = -2 + 1 / r - 9 / (2 * 16) / (2 * r ** 4);
    expect(Math.abs(exact(2, 1, r).totalHartree - expected)).toBeLessThan(1e-9);
    expect(exactDissociationLimit({ za: 2, zb: 1 })).toBe(-2);
  });

  it('the σg–σu splitting at large R follows (4/e)·R·e^(−R)', () => {
    // leading asymptotic exchange splitting of H2+ (Holstein; Herring, Rev. Mod. Phys. 34 (1962) 631; from memory),
    // next order is a relative +1/(2R)
    for (const r of [15, 20]) {
      const split = exact(1, 1, r, 'sigma-u').electronicHartree - exact(1, 1, r).electronicHartree;
      expect(Math.abs(split / (4 * r * Math.exp(-r - 1)) - 1)).toBeLessThan(0.03);
    }
  });

  it('2pσu has a shallow van der Waals minimum near R ≈ 12.5 a0', () => {
    const min = minimizeBrent((r) => exact(1, 1, r, 'sigma-u').totalHartree, 10, 15, 1e-6);
    // position near 12.5 a0 from memory; depth 6.08e-5 Eh computed (regression)
    expect(Math.abs(min.x - 12.55)).toBeLessThan(0.1);
    expect(Math.abs(min.fx - -0.5 - -6.079e-5)).toBeLessThan(1e-8);
  });

  it('the warm-started curve equals single-point solutions, for unsorted distances too', () => {
    const rs = [0.3, 0.31, 0.33, 0.4, 1, 1.01, 1.02, 1.5, 2, 3.7, 3.6, 3.5, 12, 0.5, 25, 24.9, 24.8];
    for (const [za, zb, state] of [[1, 1, 'sigma-g'], [1, 1, 'sigma-u'], [2, 1, 'sigma-g']] as const) {
      const curve = exactCurve({ za, zb, state, distancesBohr: rs });
      rs.forEach((r, i) => {
        const single = exact(za, zb, r, state);
        expect(Math.abs(curve.electronicHartree[i] - single.electronicHartree)).toBeLessThan(1e-11);
        expect(curve.totalHartree[i]).toBeCloseTo(single.totalHartree, 11);
        expect(curve.separationConstant[i]).toBeCloseTo(single.separationConstant, 8);
      });
    }
  });

  it('a fine curve is smooth (second differences bounded) from 0.2 to 20 a0', () => {
    const h = 0.01;
    const rs = Array.from({ length: 1980 }, (_, i) => 0.2 + h * i);
    for (const state of ['sigma-g', 'sigma-u'] as const) {
      const e = exactCurve({ za: 1, zb: 1, state, distancesBohr: rs }).totalHartree;
      for (let i = 1; i < rs.length - 1; i++) {
        // E'' is dominated by the repulsion's 2/R³ at short range and is O(1) elsewhere
        expect(Math.abs(e[i + 1] - 2 * e[i] + e[i - 1])).toBeLessThan(h * h * (3 / rs[i] ** 3 + 1));
      }
    }
  });

  it('rejects σu for unequal charges and non-physical input with RangeError', () => {
    expect(() => exact(2, 1, 2, 'sigma-u')).toThrow(/Za ≠ Zb/);
    expect(() => exact(2, 1, 2, 'sigma-u')).toThrow(RangeError);
    expect(() => exact(1, 1, 0)).toThrow(RangeError);
    expect(() => exact(1, -1, 2)).toThrow(RangeError);
    expect(() => exactOneElectronEnergy({ za: 1, zb: 1, distanceBohr: 2, state: 'pi-u' as never })).toThrow(RangeError);
  });
});
