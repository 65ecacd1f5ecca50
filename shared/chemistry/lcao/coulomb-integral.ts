/**
 * Coulomb integral J = ⟨a| 1/r_b |a⟩: attraction of the 1s density on A
 * (exponent ζ) to a unit charge on B at distance R,
 *   J = (1/R)[1 − (1 + w)e^(−2w)],  w = ζR.
 * With ζ = 1 this is the textbook J = (1/R)[1 − (1 + R)e^(−2R)].
 * Source: Pauling & Wilson, Introduction to Quantum Mechanics (1935) ch. XII §42;
 * Slater, Quantum Theory of Molecules and Solids, vol. 1 (1963).
 */
import { assertPositive } from './assert-positive';

export function coulombIntegral(distanceBohr: number, zeta: number): number {
  assertPositive('distanceBohr', distanceBohr);
  assertPositive('zeta', zeta);
  const w = zeta * distanceBohr;
  // 1 − (1 + w)e^(−2w) loses digits for small w; expm1 keeps them.
  const oneMinus = -Math.expm1(-2 * w) - w * Math.exp(-2 * w);
  return oneMinus / distanceBohr;
}
