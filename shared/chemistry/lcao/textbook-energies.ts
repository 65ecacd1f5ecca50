/**
 * The textbook H2+ result with unit exponent (ζ = 1, Za = Zb = 1):
 *   E± = E1s + 1/R − (J ± K)/(1 ± S),  E1s = −½ Eh,
 *   S = e^(−R)(1 + R + R²/3),  J = (1/R)[1 − (1 + R)e^(−2R)],  K = (1 + R)e^(−R).
 * Written out independently of the general-ζ functions so that the two can be
 * checked against each other.
 * Source: Pauling & Wilson, Introduction to Quantum Mechanics (1935) ch. XII §42;
 * Levine, Quantum Chemistry, ch. 13 (H2+ LCAO treatment).
 */
import { assertPositive } from './assert-positive';

export interface TextbookEnergies {
  bondingHartree: number;
  antibondingHartree: number;
  overlap: number;
  coulomb: number;
  resonance: number;
}

export function lcaoTextbookEnergies(distanceBohr: number): TextbookEnergies {
  assertPositive('distanceBohr', distanceBohr);
  const r = distanceBohr;
  const overlap = Math.exp(-r) * (1 + r + (r * r) / 3);
  const coulomb = (1 - (1 + r) * Math.exp(-2 * r)) / r;
  const resonance = (1 + r) * Math.exp(-r);
  const atom = -0.5;
  return {
    bondingHartree: atom + 1 / r - (coulomb + resonance) / (1 + overlap),
    antibondingHartree: atom + 1 / r - (coulomb - resonance) / (1 - overlap),
    overlap,
    coulomb,
    resonance,
  };
}
