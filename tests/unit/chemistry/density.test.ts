import { describe, expect, it } from 'vitest';
import { lcaoOrbital, orbitalDensityLine, orbitalDensityPlane } from '@shared/chemistry/density';
import { overlapIntegral } from '@shared/chemistry/lcao';
import { integratePanels } from '@shared/chemistry/numeric';

/**
 * ∫ f dV for an axially symmetric f(z, ρ) with A at z = −R/2 and B at +R/2, in prolate spheroidal
 * coordinates: z = (R/2)λμ, ρ = (R/2)√((λ² − 1)(1 − μ²)), dV = 2π(R³/8)(λ² − μ²) dλ dμ
 * (Morse & Feshbach 1953, ch. 5). Written here independently of the engine's own quadrature.
 */
function volumeIntegral(f: (z: number, rho: number) => number, distanceBohr: number, decay: number): number {
  const h = distanceBohr / 2;
  const lambdaMax = 1 + 80 / (decay * distanceBohr);
  const overMu = (lambda: number) =>
    integratePanels(
      (mu) => f(h * lambda * mu, h * Math.sqrt(Math.max(0, (lambda * lambda - 1) * (1 - mu * mu)))) * (lambda * lambda - mu * mu),
      -1, 1, 4, 24,
    );
  return 2 * Math.PI * h * h * h * integratePanels(overMu, 1, lambdaMax, 16, 24);
}

const atomDensity = (zeta: number, r: number) => (zeta ** 3 / Math.PI) * Math.exp(-2 * zeta * r);

describe('minimal-LCAO orbital densities', () => {
  it('orbitals are normalized: ∫ψ² dV = 1 by quadrature (homonuclear, heteronuclear, optimized ζ)', () => {
    const cases = [
      { za: 1, zb: 1, zeta: 1, distanceBohr: 2 },
      { za: 1, zb: 1, zeta: 'opt' as const, distanceBohr: 2 },
      { za: 2, zb: 1, zeta: 1.5, distanceBohr: 1.4 },
      { za: 1, zb: 3, zeta: 'opt' as const, distanceBohr: 3 },
    ];
    for (const c of cases) {
      for (const state of ['bonding', 'antibonding'] as const) {
        const orbital = lcaoOrbital({ ...c, state });
        const norm = volumeIntegral((z, rho) => orbital.valueAt(z, rho) ** 2, c.distanceBohr, 2 * orbital.zeta);
        expect(Math.abs(norm - 1)).toBeLessThan(1e-9);
      }
    }
  });

  it('homonuclear coefficients are 1/√(2 ± 2S)', () => {
    const s = overlapIntegral(2, 1);
    const bonding = lcaoOrbital({ za: 1, zb: 1, zeta: 1, distanceBohr: 2, state: 'bonding' });
    const antibonding = lcaoOrbital({ za: 1, zb: 1, zeta: 1, distanceBohr: 2, state: 'antibonding' });
    expect(bonding.coefficientA).toBeCloseTo(1 / Math.sqrt(2 + 2 * s), 14);
    expect(bonding.coefficientB).toBeCloseTo(1 / Math.sqrt(2 + 2 * s), 14);
    expect(antibonding.coefficientA).toBeCloseTo(1 / Math.sqrt(2 - 2 * s), 14);
    expect(antibonding.coefficientB).toBeCloseTo(-1 / Math.sqrt(2 - 2 * s), 14);
    expect(bonding.energyHartree).toBeCloseTo(-0.553771, 6); // science.md §1: E+ at R = 2 a0, ζ = 1 (computed)
  });

  it('σu has its nodal plane at the midpoint: zero density on the whole plane x = 0', () => {
    const input = { za: 1, zb: 1, zeta: 1.2, distanceBohr: 2, state: 'antibonding' as const };
    const line = orbitalDensityLine({ ...input, from: -4, to: 4, points: 201 });
    const mid = line.zBohr.indexOf(0);
    expect(mid).toBe(100);
    const peak = Math.max(...line.density);
    expect(line.density[mid]).toBeLessThan(1e-25 * peak);
    expect(line.density[mid + 5]).toBeGreaterThan(1e-3 * peak); // only the plane itself is a node
    const plane = orbitalDensityPlane({ ...input, extentBohr: 4, nx: 41, ny: 31 });
    const column = plane.x.indexOf(0);
    expect(column).toBe(20);
    for (const row of plane.density) expect(row[column]).toBeLessThan(1e-25 * peak);
    // the bonding orbital has no node there
    const bonding = orbitalDensityLine({ ...input, state: 'bonding', from: -4, to: 4, points: 201 });
    expect(bonding.density[mid]).toBeGreaterThan(0.1 * Math.max(...bonding.density));
  });

  it('σg builds up charge between the nuclei: ψ²(midpoint) exceeds half the sum of the atomic densities', () => {
    for (const [zeta, r] of [[1, 2], ['opt', 2], [1, 2.5], [1, 4]] as const) {
      const orbital = lcaoOrbital({ za: 1, zb: 1, zeta, distanceBohr: r, state: 'bonding' });
      const line = orbitalDensityLine({ za: 1, zb: 1, zeta, distanceBohr: r, state: 'bonding', from: -1, to: 1, points: 3 });
      const atoms = (atomDensity(orbital.zeta, r / 2) + atomDensity(orbital.zeta, r / 2)) / 2;
      expect(line.density[1]).toBeGreaterThan(atoms);
      // and the antibonding orbital depletes it (to zero at the midpoint)
      const anti = orbitalDensityLine({ za: 1, zb: 1, zeta: orbital.zeta, distanceBohr: r, state: 'antibonding', from: -1, to: 1, points: 3 });
      expect(anti.density[1]).toBeLessThan(atoms);
    }
    // ζ = 1, R = 2: ψ²(mid) = 2e^(−2)/(π(1 + S)) vs e^(−2)/π for the atoms (closed form, computed)
    const s = overlapIntegral(2, 1);
    const mid = orbitalDensityLine({ za: 1, zb: 1, zeta: 1, distanceBohr: 2, state: 'bonding', from: 0, to: 1, points: 2 }).density[0];
    expect(mid).toBeCloseTo((2 * Math.exp(-2)) / (Math.PI * (1 + s)), 14);
  });

  it('homonuclear densities are symmetric in x → −x and y → −y; the plane matches the line on the axis', () => {
    const input = { za: 1, zb: 1, zeta: 1, distanceBohr: 2.5, state: 'bonding' as const };
    const plane = orbitalDensityPlane({ ...input, extentBohr: 5, nx: 51, ny: 40 });
    const nx = plane.x.length;
    const ny = plane.y.length;
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        expect(plane.density[j][i]).toBeCloseTo(plane.density[j][nx - 1 - i], 15);
        expect(plane.density[j][i]).toBeCloseTo(plane.density[ny - 1 - j][i], 15);
      }
    }
    expect(plane.x[0]).toBe(-5);
    expect(plane.x[nx - 1]).toBe(5);
    const line = orbitalDensityLine({ ...input, from: -5, to: 5, points: 51 });
    // y has an even count, so the axis is not sampled: compare with an odd grid instead
    const odd = orbitalDensityPlane({ ...input, extentBohr: 5, nx: 51, ny: 11 });
    line.density.forEach((d, i) => expect(odd.density[5][i]).toBeCloseTo(d, 15));
    // density peaks at the nuclei (cusps at x = ±R/2)
    const atNucleus = lcaoOrbital(input).valueAt(1.25, 0) ** 2;
    expect(Math.max(...line.density)).toBeLessThanOrEqual(atNucleus);
  });

  it('heteronuclear: the bonding density gathers on the larger charge; the antibonding node moves off the midpoint', () => {
    const input = { za: 2, zb: 1, zeta: 1.6, distanceBohr: 1.5 };
    const bonding = lcaoOrbital({ ...input, state: 'bonding' });
    expect(bonding.valueAt(-0.75, 0) ** 2).toBeGreaterThan(bonding.valueAt(0.75, 0) ** 2); // A (Z = 2) at −R/2
    const anti = lcaoOrbital({ ...input, state: 'antibonding' });
    // ψ changes sign between the nuclei but not at the midpoint
    expect(anti.valueAt(-0.75, 0) * anti.valueAt(0.75, 0)).toBeLessThan(0);
    expect(Math.abs(anti.valueAt(0, 0))).toBeGreaterThan(1e-3);
  });

  it('rejects bad grids and states', () => {
    const base = { za: 1, zb: 1, zeta: 1, distanceBohr: 2, state: 'bonding' as const };
    expect(() => orbitalDensityLine({ ...base, from: 0, to: 1, points: 1 })).toThrow(RangeError);
    expect(() => orbitalDensityLine({ ...base, from: 1, to: 1, points: 5 })).toThrow(RangeError);
    expect(() => orbitalDensityPlane({ ...base, extentBohr: 0, nx: 5, ny: 5 })).toThrow(RangeError);
    expect(() => orbitalDensityPlane({ ...base, extentBohr: 3, nx: 5.5, ny: 5 })).toThrow(RangeError);
    expect(() => lcaoOrbital({ ...base, state: 'nonbonding' as never })).toThrow(RangeError);
    expect(() => lcaoOrbital({ ...base, zeta: -1 })).toThrow(RangeError);
  });
});
