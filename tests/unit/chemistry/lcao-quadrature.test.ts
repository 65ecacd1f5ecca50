import { describe, expect, it } from 'vitest';
import {
  coulombIntegral,
  lcaoEnergies,
  lcaoEnergiesUnequalExponents,
  lcaoMatrixElements,
  lcaoMatrixElementsQuadrature,
  overlapIntegral,
  resonanceIntegral,
} from '@shared/chemistry/lcao';
import { integrate, integratePanels } from '@shared/chemistry/numeric';

/**
 * Independent 3-D quadrature in bipolar coordinates (r_a, r_b, φ) for an integrand with axial
 * symmetry: dV = (2π/R)·r_a·r_b dr_a dr_b over |r_a − R| ≤ r_b ≤ r_a + R
 * (elementary change of variables from spherical coordinates about A with
 * r_b² = r_a² + R² − 2 r_a R cos θ, so sin θ dθ = r_b dr_b/(r_a R)).
 */
function bipolarIntegral(f: (ra: number, rb: number) => number, distanceBohr: number, decay: number): number {
  const r = distanceBohr;
  const inner = (ra: number): number =>
    integratePanels((rb) => ra * rb * f(ra, rb), Math.abs(ra - r), ra + r, 4, 24);
  const tail = r + 60 / decay;
  return ((2 * Math.PI) / r) * (integratePanels(inner, 0, r, 4, 24) + integratePanels(inner, r, tail, 12, 24));
}

const slater = (zeta: number) => (rr: number): number => Math.sqrt(zeta ** 3 / Math.PI) * Math.exp(-zeta * rr);

describe('prolate spheroidal quadrature of the one-electron matrix elements', () => {
  it('reproduces the closed forms when ζa = ζb (to 1e-10 Eh)', () => {
    const cases: [number, number, number, number][] = [
      [1, 1, 1, 2],
      [1, 1, 1.238, 2.003],
      [1, 1, 0.6, 0.05],
      [2, 1, 1.7, 1.4],
      [1, 3, 2.6, 9],
      [1, 1, 1, 35],
      [3, 3, 4, 12], // ζR = 48: steep e^(−2ζ r_a) in μ
    ];
    for (const [za, zb, zeta, r] of cases) {
      const closed = lcaoMatrixElements({ za, zb, zeta, distanceBohr: r });
      const quad = lcaoMatrixElementsQuadrature({ za, zb, zetaA: zeta, zetaB: zeta, distanceBohr: r });
      expect(Math.abs(quad.overlap - closed.overlap)).toBeLessThan(1e-10);
      expect(Math.abs(quad.haa - closed.haa)).toBeLessThan(1e-10);
      expect(Math.abs(quad.hbb - closed.hbb)).toBeLessThan(1e-10);
      expect(Math.abs(quad.hab - closed.hab)).toBeLessThan(1e-10);
      expect(Math.abs(quad.normA - 1)).toBeLessThan(1e-12);
      expect(Math.abs(quad.normB - 1)).toBeLessThan(1e-12);
      // J and K individually
      expect(Math.abs(quad.inverseDistanceB.aa - coulombIntegral(r, zeta))).toBeLessThan(1e-11);
      expect(Math.abs(quad.inverseDistanceA.bb - coulombIntegral(r, zeta))).toBeLessThan(1e-11);
      expect(Math.abs(quad.inverseDistanceA.ab - resonanceIntegral(r, zeta))).toBeLessThan(1e-11);
      expect(Math.abs(quad.inverseDistanceB.ab - resonanceIntegral(r, zeta))).toBeLessThan(1e-11);
      // one-centre ⟨1/r⟩ = ζ and ⟨T⟩ = ζ²/2 (hydrogen-like 1s)
      expect(Math.abs(quad.inverseDistanceA.aa - zeta)).toBeLessThan(1e-11);
      expect(Math.abs(quad.kinetic.aa - zeta ** 2 / 2)).toBeLessThan(1e-11);
      const energies = lcaoEnergiesUnequalExponents({ za, zb, zetaA: zeta, zetaB: zeta, distanceBohr: r });
      const reference = lcaoEnergies({ za, zb, zeta, distanceBohr: r });
      expect(Math.abs(energies.bondingHartree - reference.bondingHartree)).toBeLessThan(1e-10);
      expect(Math.abs(energies.antibondingHartree - reference.antibondingHartree)).toBeLessThan(1e-10);
    }
  });

  it('S, J and K (ζ = 1) agree with an independent bipolar-coordinate quadrature', () => {
    for (const r of [0.5, 2, 5]) {
      const phi = slater(1);
      const s = bipolarIntegral((ra, rb) => phi(ra) * phi(rb), r, 1);
      const j = bipolarIntegral((ra, rb) => (phi(ra) * phi(ra)) / rb, r, 2);
      const k = bipolarIntegral((ra, rb) => (phi(ra) * phi(rb)) / ra, r, 1);
      expect(Math.abs(s - overlapIntegral(r, 1))).toBeLessThan(1e-9);
      expect(Math.abs(j - coulombIntegral(r, 1))).toBeLessThan(1e-9);
      expect(Math.abs(k - resonanceIntegral(r, 1))).toBeLessThan(1e-9);
    }
  });

  it('unequal exponents agree with the independent bipolar quadrature, kinetic energy in its Laplacian form', () => {
    const [zetaA, zetaB, r] = [1.3, 0.8, 1.7];
    const [za, zb] = [2, 1];
    const quad = lcaoMatrixElementsQuadrature({ za, zb, zetaA, zetaB, distanceBohr: r });
    const pa = slater(zetaA);
    const pb = slater(zetaB);
    const s = bipolarIntegral((ra, rb) => pa(ra) * pb(rb), r, zetaB);
    const overA = bipolarIntegral((ra, rb) => (pa(ra) * pb(rb)) / ra, r, zetaB);
    const overB = bipolarIntegral((ra, rb) => (pa(ra) * pb(rb)) / rb, r, zetaB);
    // −½∇² e^(−ζ r) = (−ζ²/2 + ζ/r) e^(−ζ r)  (a different formula from the module's gradient form)
    const kinetic = (-zetaB * zetaB * s) / 2 + zetaB * overB;
    expect(Math.abs(quad.overlap - s)).toBeLessThan(1e-9);
    expect(Math.abs(quad.inverseDistanceA.ab - overA)).toBeLessThan(1e-9);
    expect(Math.abs(quad.inverseDistanceB.ab - overB)).toBeLessThan(1e-9);
    expect(Math.abs(quad.kinetic.ab - kinetic)).toBeLessThan(1e-9);
    // the same kinetic element from the other side: −½∇² acting on φa
    expect(Math.abs(quad.kinetic.ab - ((-zetaA * zetaA * s) / 2 + zetaA * overA))).toBeLessThan(1e-9);
    const coulombOnB = bipolarIntegral((ra, rb) => (pa(ra) * pa(ra)) / rb, r, 2 * zetaA);
    expect(Math.abs(quad.inverseDistanceB.aa - coulombOnB)).toBeLessThan(1e-9);
    expect(Math.abs(quad.haa - (zetaA ** 2 / 2 - za * zetaA - zb * coulombOnB))).toBeLessThan(1e-9);
    // a one-dimensional check of ⟨a|1/r_b|a⟩ by the shell theorem: 4π∫ρ(r)·r²/max(r, R) dr
    const shell = integrate((x) => 4 * Math.PI * pa(x) ** 2 * x * x / Math.max(x, r), 0, r, 40) +
      integratePanels((x) => 4 * Math.PI * pa(x) ** 2 * x * x / x, r, r + 40, 8, 32);
    expect(Math.abs(quad.inverseDistanceB.aa - shell)).toBeLessThan(1e-10);
  });

  it('swapping the two centres (charges and exponents together) changes no energy', () => {
    const ab = lcaoEnergiesUnequalExponents({ za: 2, zb: 1, zetaA: 1.9, zetaB: 1.1, distanceBohr: 1.6 });
    const ba = lcaoEnergiesUnequalExponents({ za: 1, zb: 2, zetaA: 1.1, zetaB: 1.9, distanceBohr: 1.6 });
    expect(ba.bondingHartree).toBeCloseTo(ab.bondingHartree, 12);
    expect(ba.antibondingHartree).toBeCloseTo(ab.antibondingHartree, 12);
  });

  it('with each exponent matched to its own nucleus, both roots dissociate to hydrogen-like atoms', () => {
    // HeH2+ at R = 30 a0 with ζa = Za = 2, ζb = Zb = 1: lower root He+ 1s (−2 Eh) plus the charge-charge
    // interaction (Za − 1)·Zb/R; upper root H 1s (−½ Eh) facing a bare He2+ (Za·(Zb − 1)/R = 0).
    // Hydrogen-like 1s energy −Z²/2 (exact); overlaps ~e^(−30) are negligible.
    const e = lcaoEnergiesUnequalExponents({ za: 2, zb: 1, zetaA: 2, zetaB: 1, distanceBohr: 30 });
    expect(e.bondingHartree).toBeCloseTo(-2 + 1 / 30, 10);
    expect(e.antibondingHartree).toBeCloseTo(-0.5, 10);
    // a single shared exponent cannot do both: its upper root stays well above −½ Eh
    const single = lcaoEnergies({ za: 2, zb: 1, zeta: 2, distanceBohr: 30 });
    expect(single.antibondingHartree).toBeGreaterThan(-0.1);
  });
});
