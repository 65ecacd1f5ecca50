/**
 * Potential-energy curve of H2 for one model on a grid of distances, at a
 * fixed exponent ζ or with ζ optimized at every point ('opt'); in the second
 * case the optimum of the previous point seeds the next (see
 * h2-optimized-zeta.ts). Points come back in the order given.
 */
import type { H2Method, H2State } from './types';
import { h2Energy } from './h2-energy';
import { h2OptimizedZeta } from './h2-optimized-zeta';

export interface H2CurveInput {
  method: H2Method;
  zeta: number | 'opt';
  distancesBohr: readonly number[];
  state?: H2State;
}

export interface H2CurvePoint {
  distanceBohr: number;
  zeta: number;
  totalHartree: number;
  electronicHartree: number;
}

export function h2Curve({ method, zeta, distancesBohr, state = 'ground' }: H2CurveInput): H2CurvePoint[] {
  const points: H2CurvePoint[] = [];
  let previousZeta: number | undefined;
  for (const distanceBohr of distancesBohr) {
    if (zeta === 'opt') {
      const best = h2OptimizedZeta({ method, distanceBohr, state, zetaGuess: previousZeta });
      previousZeta = best.zeta;
      points.push({ distanceBohr, ...best });
    } else {
      points.push({ distanceBohr, zeta, ...h2Energy({ method, zeta, distanceBohr, state }) });
    }
  }
  return points;
}
