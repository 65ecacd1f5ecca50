/**
 * One-electron matrix elements of h = −½∇² − Za/r_a − Zb/r_b over normalized
 * 1s Slater orbitals (one exponent ζ on both centres), w = ζR:
 *   Haa = ζ²/2 − Za·ζ − Zb·J,      J = (1/R)[1 − (1 + w)e^(−2w)]
 *   Hbb = ζ²/2 − Zb·ζ − Za·J
 *   Hab = −ζ²S/2 + ζ·K − (Za + Zb)·K,   K = ζ(1 + w)e^(−w)
 * (the kinetic part uses −½∇²φ_b = (−ζ²/2 + ζ/r_b)φ_b).
 * Source: Finkelstein & Horowitz, Z. Phys. 48 (1928) 118 (scaled 1s basis);
 * Slater, Quantum Theory of Molecules and Solids, vol. 1 (1963), ch. 1.
 */
import { assertPositive } from './assert-positive';
import { coulombIntegral } from './coulomb-integral';
import { overlapIntegral } from './overlap-integral';
import { resonanceIntegral } from './resonance-integral';
import type { LcaoInput, LcaoMatrixElements } from './types';

export function lcaoMatrixElements({ za, zb, zeta, distanceBohr }: LcaoInput): LcaoMatrixElements {
  assertPositive('za', za);
  assertPositive('zb', zb);
  const overlap = overlapIntegral(distanceBohr, zeta);
  const coulomb = coulombIntegral(distanceBohr, zeta);
  const resonance = resonanceIntegral(distanceBohr, zeta);
  const kineticDiagonal = (zeta * zeta) / 2;
  return {
    overlap,
    haa: kineticDiagonal - za * zeta - zb * coulomb,
    hbb: kineticDiagonal - zb * zeta - za * coulomb,
    hab: (-zeta * zeta * overlap) / 2 + zeta * resonance - (za + zb) * resonance,
  };
}
