/**
 * Exponent ζ optimized variationally at one distance, separately for the lower
 * (bonding) or upper (antibonding) root: min over ζ of E(ζ) by Brent's method.
 * For the lower root this is the Finkelstein–Horowitz model; for the homonuclear
 * upper root the trial function has u symmetry, so the minimum is an upper bound
 * to the lowest σu energy.
 * Source: Finkelstein & Horowitz, Z. Phys. 48 (1928) 118; minimizer: Brent,
 * Algorithms for Minimization without Derivatives (1973), ch. 5.
 *
 * Speed: with `zetaGuess` (e.g. the previous point of a curve) the search runs on
 * [0.85, 1.15]·zetaGuess and falls back to the full bracket when the minimum lands
 * on an edge of that window.
 */
import { minimizeBrent } from '@shared/chemistry/numeric';
import { assertPositive } from './assert-positive';
import { generalizedEigenTwoByTwo } from './generalized-eigen-two-by-two';
import { lcaoMatrixElements } from './matrix-elements';
import type { LcaoState } from './types';

export interface OptimizedZetaInput {
  za: number;
  zb: number;
  distanceBohr: number;
  state: LcaoState;
  /** optional starting point (warm start); any positive exponent */
  zetaGuess?: number;
}

export interface OptimizedZeta {
  zeta: number;
  /** total energy (electronic + Za·Zb/R) at the optimal ζ */
  energyHartree: number;
  electronicHartree: number;
}

const ZETA_TOLERANCE = 1e-8;
const WINDOW = 0.15;

/** The full search bracket for ζ: from well below any useful exponent to above the united-atom value Za + Zb. */
export function zetaSearchBracket(za: number, zb: number): [number, number] {
  return [0.02, 2 * (za + zb) + 1];
}

export function lcaoOptimizedZeta({ za, zb, distanceBohr, state, zetaGuess }: OptimizedZetaInput): OptimizedZeta {
  assertPositive('za', za);
  assertPositive('zb', zb);
  assertPositive('distanceBohr', distanceBohr);
  if (state !== 'bonding' && state !== 'antibonding') throw new RangeError(`state must be 'bonding' or 'antibonding', got ${state}`);
  const upper = state === 'antibonding';
  const electronic = (zeta: number): number => {
    const m = lcaoMatrixElements({ za, zb, zeta, distanceBohr });
    const roots = generalizedEigenTwoByTwo({ aa: m.haa, bb: m.hbb, ab: m.hab }, { aa: 1, bb: 1, ab: m.overlap });
    return upper ? roots.upper.energyHartree : roots.lower.energyHartree;
  };
  const [low, high] = zetaSearchBracket(za, zb);
  let best: { x: number; fx: number } | undefined;
  if (zetaGuess !== undefined && Number.isFinite(zetaGuess) && zetaGuess > 0) {
    const a = Math.max(low, zetaGuess * (1 - WINDOW));
    const b = Math.min(high, zetaGuess * (1 + WINDOW));
    const local = minimizeBrent(electronic, a, b, ZETA_TOLERANCE);
    const margin = 1e-4 * (b - a);
    const onEdge = (local.x - a < margin && a > low) || (b - local.x < margin && b < high);
    if (!onEdge) best = local;
  }
  best ??= minimizeBrent(electronic, low, high, ZETA_TOLERANCE);
  const repulsion = (za * zb) / distanceBohr;
  return { zeta: best.x, energyHartree: best.fx + repulsion, electronicHartree: best.fx };
}
