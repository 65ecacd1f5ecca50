/**
 * Closed form for equal nuclear charges Z (homonuclear), one exponent ζ:
 *   E± = (Haa ± Hab)/(1 ± S) + Z²/R   (+ bonding σg, − antibonding σu).
 * Source: Pauling & Wilson, Introduction to Quantum Mechanics (1935) ch. XII §42;
 * Finkelstein & Horowitz, Z. Phys. 48 (1928) 118.
 */
import { assertPositive } from './assert-positive';
import { lcaoMatrixElements } from './matrix-elements';

export function lcaoHomonuclearEnergies({ z, zeta, distanceBohr }: { z: number; zeta: number; distanceBohr: number }): {
  bondingHartree: number;
  antibondingHartree: number;
} {
  assertPositive('z', z);
  const { overlap, haa, hab } = lcaoMatrixElements({ za: z, zb: z, zeta, distanceBohr });
  const repulsion = (z * z) / distanceBohr;
  return {
    bondingHartree: (haa + hab) / (1 + overlap) + repulsion,
    antibondingHartree: (haa - hab) / (1 - overlap) + repulsion,
  };
}
