/**
 * Exponent ζ optimized variationally at one distance, separately for the lower
 * (bonding) or upper (antibonding) root: min over ζ of E(ζ) by Brent's method.
 * For the lower root this is the Finkelstein–Horowitz model; for the homonuclear
 * upper root the trial function has u symmetry, so the minimum is an upper bound
 * to the lowest σu energy.
 * Source: Finkelstein & Horowitz, Z. Phys. 48 (1928) 118; minimizer: Brent,
 * Algorithms for Minimization without Derivatives (1973), ch. 5.
 *
 * Speed: with `zetaGuess` (e.g. extrapolated from the previous points of a curve)
 * the search runs on zetaGuess ± zetaWindow (default ±8 %), widens to ±8 % and then
 * to the full bracket whenever the minimum lands on an edge of the window.
 */
import { minimizeBrent } from '@shared/chemistry/numeric';
import { assertPositive } from './assert-positive';
import { lcaoRootEnergy } from './root-energy';
import type { LcaoState } from './types';

export interface OptimizedZetaInput {
  za: number;
  zb: number;
  distanceBohr: number;
  state: LcaoState;
  /** optional starting point (warm start); any positive exponent */
  zetaGuess?: number;
  /** half-width of the first search window around zetaGuess (default 8 % of it) */
  zetaWindow?: number;
}

export interface OptimizedZeta {
  zeta: number;
  /** total energy (electronic + Za·Zb/R) at the optimal ζ */
  energyHartree: number;
  electronicHartree: number;
}

const ZETA_TOLERANCE = 1e-8;
const WINDOW = 0.08;

/** The full search bracket for ζ: from well below any useful exponent to above the united-atom value Za + Zb. */
export function zetaSearchBracket(za: number, zb: number): [number, number] {
  return [0.02, 2 * (za + zb) + 1];
}

export function lcaoOptimizedZeta({ za, zb, distanceBohr, state, zetaGuess, zetaWindow }: OptimizedZetaInput): OptimizedZeta {
  assertPositive('za', za);
  assertPositive('zb', zb);
  assertPositive('distanceBohr', distanceBohr);
  if (state !== 'bonding' && state !== 'antibonding') throw new RangeError(`state must be 'bonding' or 'antibonding', got ${state}`);
  const upper = state === 'antibonding';
  const electronic = (zeta: number): number => lcaoRootEnergy(za, zb, zeta, distanceBohr, upper);
  const [low, high] = zetaSearchBracket(za, zb);
  let best: { x: number; fx: number } | undefined;
  if (zetaGuess !== undefined && Number.isFinite(zetaGuess) && zetaGuess > 0) {
    const windows = [WINDOW * zetaGuess];
    if (zetaWindow !== undefined && zetaWindow > 0 && zetaWindow < windows[0]) windows.unshift(zetaWindow);
    for (const half of windows) {
      const a = Math.max(low, zetaGuess - half);
      const b = Math.min(high, zetaGuess + half);
      const local = minimizeBrent(electronic, a, b, ZETA_TOLERANCE);
      const margin = 1e-4 * (b - a);
      const onEdge = (local.x - a < margin && a > low) || (b - local.x < margin && b < high);
      if (!onEdge) {
        best = local;
        break;
      }
    }
  }
  best ??= minimizeBrent(electronic, low, high, ZETA_TOLERANCE);
  const repulsion = (za * zb) / distanceBohr;
  return { zeta: best.x, energyHartree: best.fx + repulsion, electronicHartree: best.fx };
}
