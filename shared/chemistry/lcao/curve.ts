/**
 * A potential-energy curve of the minimal-LCAO one-electron bond on a list of
 * distances, with a fixed exponent or with ζ optimized at every point
 * (warm-started from the neighbouring point's ζ).
 * Source: as lcaoEnergies and lcaoOptimizedZeta (Pauling & Wilson 1935 ch. XII §42;
 * Finkelstein & Horowitz, Z. Phys. 48 (1928) 118).
 */
import { assertPositive } from './assert-positive';
import { lcaoEnergies } from './energies';
import { lcaoOptimizedZeta } from './optimized-zeta';
import type { LcaoState } from './types';

export interface LcaoCurveInput {
  za: number;
  zb: number;
  /** a fixed exponent, or 'opt' to optimize ζ at every distance */
  zeta: number | 'opt';
  state: LcaoState;
  distancesBohr: readonly number[];
}

export interface LcaoCurve {
  distanceBohr: number[];
  /** total energies, electronic + Za·Zb/R */
  energyHartree: number[];
  electronicHartree: number[];
  /** the optimal exponent at each distance (only when zeta = 'opt') */
  zeta?: number[];
}

export function lcaoCurve({ za, zb, zeta, state, distancesBohr }: LcaoCurveInput): LcaoCurve {
  if (state !== 'bonding' && state !== 'antibonding') throw new RangeError(`state must be 'bonding' or 'antibonding', got ${state}`);
  const distanceBohr = [...distancesBohr];
  const energyHartree: number[] = new Array(distanceBohr.length);
  const electronicHartree: number[] = new Array(distanceBohr.length);
  if (zeta === 'opt') {
    const zetas: number[] = new Array(distanceBohr.length);
    let guess: number | undefined;
    for (let i = 0; i < distanceBohr.length; i++) {
      const point = lcaoOptimizedZeta({ za, zb, distanceBohr: distanceBohr[i], state, zetaGuess: guess });
      energyHartree[i] = point.energyHartree;
      electronicHartree[i] = point.electronicHartree;
      zetas[i] = point.zeta;
      guess = point.zeta;
    }
    return { distanceBohr, energyHartree, electronicHartree, zeta: zetas };
  }
  assertPositive('zeta', zeta);
  for (let i = 0; i < distanceBohr.length; i++) {
    const e = lcaoEnergies({ za, zb, zeta, distanceBohr: distanceBohr[i] });
    energyHartree[i] = state === 'bonding' ? e.bondingHartree : e.antibondingHartree;
    electronicHartree[i] = state === 'bonding' ? e.bondingElectronicHartree : e.antibondingElectronicHartree;
  }
  return { distanceBohr, energyHartree, electronicHartree };
}
