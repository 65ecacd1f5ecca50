import { describe, expect, it } from 'vitest';
import { gaussLegendre, integrate, minimizeBrent, findRootBrent } from '@shared/chemistry/numeric';
import { convertEnergy, convertDistance } from '@shared/chemistry/units';

describe('numeric helpers', () => {
  it('Gauss–Legendre weights sum to 2 and integrate polynomials of degree 2n−1 exactly', () => {
    const { weights } = gaussLegendre(7);
    expect(weights.reduce((a, b) => a + b, 0)).toBeCloseTo(2, 14);
    // ∫_0^2 x^13 dx = 2^14/14 (exact for a 7-point rule)
    expect(integrate((x) => x ** 13, 0, 2, 7)).toBeCloseTo(16384 / 14, 9);
  });
  it('integrates e^-x on [0, 20] to 1 − e^-20', () => {
    expect(integrate((x) => Math.exp(-x), 0, 20, 48)).toBeCloseTo(1 - Math.exp(-20), 12);
  });
  it('Brent minimum of (x−1.3)^2 + 2 and root of cos x', () => {
    const m = minimizeBrent((x) => (x - 1.3) ** 2 + 2, 0, 5, 1e-10);
    // a minimum is located only to about √ε·|x| ≈ 1.5e-8 in double precision
    expect(m.x).toBeCloseTo(1.3, 7);
    expect(findRootBrent(Math.cos, 1, 2)).toBeCloseTo(Math.PI / 2, 12);
  });
});

describe('unit conversions (CODATA 2018)', () => {
  it('1 Eh in eV, kJ/mol, kcal/mol and cm⁻¹', () => {
    expect(convertEnergy(1, 'hartree', 'ev')).toBe(27.211386245988); // CODATA 2018
    expect(convertEnergy(1, 'hartree', 'kj/mol')).toBeCloseTo(2625.4996394799, 9); // CODATA 2018
    expect(convertEnergy(1, 'hartree', 'kcal/mol')).toBeCloseTo(627.5094740631, 9); // CODATA 2018
    expect(convertEnergy(1, 'hartree', 'cm-1')).toBeCloseTo(219474.6313632, 6); // CODATA 2018
    expect(convertEnergy(27.211386245988, 'ev', 'hartree')).toBeCloseTo(1, 14);
  });
  it('1 a0 in Å and pm, and back', () => {
    expect(convertDistance(1, 'bohr', 'angstrom')).toBe(0.529177210903); // CODATA 2018
    expect(convertDistance(74.14, 'pm', 'angstrom')).toBeCloseTo(0.7414, 12);
    expect(convertDistance(convertDistance(2.5, 'bohr', 'pm'), 'pm', 'bohr')).toBeCloseTo(2.5, 13);
  });
});
