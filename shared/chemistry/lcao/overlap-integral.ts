/**
 * Overlap of two normalized 1s Slater orbitals with the same exponent ζ on
 * centres a distance R apart: S = e^(−w)(1 + w + w²/3), w = ζR.
 * Source: Mulliken, Rieke, Orloff & Orloff, J. Chem. Phys. 17 (1949) 1248
 * (the 1s–1s entry of their overlap tables); also Slater, Quantum Theory of
 * Molecules and Solids, vol. 1 (1963).
 */
import { assertPositive } from './assert-positive';

export function overlapIntegral(distanceBohr: number, zeta: number): number {
  assertPositive('distanceBohr', distanceBohr);
  assertPositive('zeta', zeta);
  const w = zeta * distanceBohr;
  return Math.exp(-w) * (1 + w + (w * w) / 3);
}
