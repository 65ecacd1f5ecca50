/**
 * The matching condition of the separated problem as a function of the
 * electronic energy: with c² = −E·R²/2, take A from the angular eigenproblem and
 * return the radial continued-fraction residual at that A. Its zero is a bound
 * state. Below the ground-state zero the residual is negative down to the
 * united-atom energy; it is positive from that zero up to its first pole, so any
 * variational upper bound lying below the first excited state brackets the
 * root from above.
 * Source: Bates, Ledsham & Stewart, Phil. Trans. R. Soc. A 246 (1953) 215.
 */
import { angularSeparationConstant } from './angular-separation-constant';
import { radialContinuedFraction } from './radial-continued-fraction';
import type { AngularParity } from './types';

export interface SeparationResidual {
  (electronicHartree: number): number;
  /** separation constant A at the last energy evaluated */
  lastSeparationConstant: () => number;
}

export function separationResidual(za: number, zb: number, distanceBohr: number, parity: AngularParity, guessA?: number): SeparationResidual {
  const r = distanceBohr;
  const p = parity === 'all' ? r * (zb - za) : 0;
  const a = r * (za + zb);
  let lastA = guessA;
  const f = ((electronicHartree: number): number => {
    const c2 = (-electronicHartree * r * r) / 2;
    if (!(c2 > 0)) return Number.POSITIVE_INFINITY; // E ≥ 0 is not a bound state: treat as "above"
    const separationConstant = angularSeparationConstant({ c2, p, parity, guess: lastA });
    lastA = separationConstant;
    return radialContinuedFraction({ c: Math.sqrt(c2), a, separationConstant });
  }) as SeparationResidual;
  f.lastSeparationConstant = () => lastA ?? Number.NaN;
  return f;
}
