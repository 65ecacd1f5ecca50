/**
 * Resonance (exchange) integral K = ⟨a| 1/r_a |b⟩ = ⟨a| 1/r_b |b⟩ for 1s
 * Slater orbitals with one exponent ζ at distance R:
 *   K = ζ(1 + w)e^(−w),  w = ζR.
 * With ζ = 1 this is the textbook K = (1 + R)e^(−R).
 * Source: Pauling & Wilson, Introduction to Quantum Mechanics (1935) ch. XII §42;
 * Slater, Quantum Theory of Molecules and Solids, vol. 1 (1963).
 */
import { assertPositive } from './assert-positive';

export function resonanceIntegral(distanceBohr: number, zeta: number): number {
  assertPositive('distanceBohr', distanceBohr);
  assertPositive('zeta', zeta);
  const w = zeta * distanceBohr;
  return zeta * (1 + w) * Math.exp(-w);
}
