/**
 * Orbital exponent ζ that minimizes the H2 energy of a model at one
 * distance — the variational "scaled" minimal basis (S. C. Wang, Phys. Rev.
 * 31 (1928) 579 for Heitler–London; C. A. Coulson, Proc. Camb. Phil. Soc. 34
 * (1938) 204 for the MO function; Weinbaum 1933 for the mixed function).
 * One-dimensional Brent minimization (numeric/minimize.ts) over ζ, first in a
 * narrow bracket around `zetaGuess` when one is given (warm start along a
 * curve), else — or when the minimum lands on the edge of that bracket — over
 * the wide bracket [0.2, 4].
 */
import { minimizeBrent } from '../numeric';
import type { H2Method, H2State } from './types';
import { h2Energy } from './h2-energy';

export interface H2OptimizedZetaInput {
  method: H2Method;
  distanceBohr: number;
  state?: H2State;
  /** a nearby optimum (e.g. at the previous grid point) to start from */
  zetaGuess?: number;
}

export interface H2OptimizedZeta {
  zeta: number;
  totalHartree: number;
  electronicHartree: number;
}

const WIDE_BRACKET: [number, number] = [0.2, 4];
const WARM_HALF_WIDTH = 0.05;
const ZETA_TOLERANCE = 1e-8;

export function h2OptimizedZeta({ method, distanceBohr, state = 'ground', zetaGuess }: H2OptimizedZetaInput): H2OptimizedZeta {
  const energyAt = (zeta: number) => h2Energy({ method, zeta, distanceBohr, state }).electronicHartree;
  let zeta: number | undefined;
  if (zetaGuess !== undefined && Number.isFinite(zetaGuess) && zetaGuess > WIDE_BRACKET[0] && zetaGuess < WIDE_BRACKET[1]) {
    const low = Math.max(WIDE_BRACKET[0], zetaGuess - WARM_HALF_WIDTH);
    const high = Math.min(WIDE_BRACKET[1], zetaGuess + WARM_HALF_WIDTH);
    const found = minimizeBrent(energyAt, low, high, ZETA_TOLERANCE).x;
    const edge = 1e3 * ZETA_TOLERANCE;
    if (found - low > edge && high - found > edge) zeta = found;
  }
  if (zeta === undefined) zeta = minimizeBrent(energyAt, WIDE_BRACKET[0], WIDE_BRACKET[1], ZETA_TOLERANCE).x;
  const { totalHartree, electronicHartree } = h2Energy({ method, zeta, distanceBohr, state });
  return { zeta, totalHartree, electronicHartree };
}
