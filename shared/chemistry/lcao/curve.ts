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
    let lastMiss = Number.NaN; // |optimal − predicted ζ| at the previous point
    for (let i = 0; i < distanceBohr.length; i++) {
      let zetaGuess: number | undefined;
      let zetaWindow: number | undefined;
      if (i >= 1) {
        zetaGuess = zetas[i - 1];
        const dr = distanceBohr[i] - distanceBohr[i - 1];
        const drPrev = i >= 2 ? distanceBohr[i - 1] - distanceBohr[i - 2] : 0;
        if (drPrev !== 0) zetaGuess += ((zetas[i - 1] - zetas[i - 2]) / drPrev) * dr; // linear extrapolation
        // the next miss is about as large as the last one when the step is alike
        if (Number.isFinite(lastMiss) && drPrev !== 0 && Math.abs(dr) <= 2 * Math.abs(drPrev)) zetaWindow = 4 * lastMiss + 1e-6;
      }
      const point = lcaoOptimizedZeta({ za, zb, distanceBohr: distanceBohr[i], state, zetaGuess, zetaWindow });
      energyHartree[i] = point.energyHartree;
      electronicHartree[i] = point.electronicHartree;
      zetas[i] = point.zeta;
      lastMiss = zetaGuess === undefined || i < 2 ? Number.NaN : Math.abs(point.zeta - zetaGuess);
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
