/**
 * Equilibrium of a curve model found on the model itself, not on a grid:
 * a coarse scan on a geometric grid of R (0.05 … 40 bohr, 90 points) picks the
 * lowest point; Brent's minimization (Brent, Algorithms for Minimization without
 * Derivatives, 1973, ch. 5) then runs on the bracket formed by its two neighbours,
 * evaluating the model at each trial R (with ζ re-optimized there for 'opt').
 * De = dissociationLimit(p) − E(Re), converted with CODATA 2018 (HARTREE_EV).
 * Returns null for a repulsive curve: the lowest scanned point is an end of the
 * grid, or the minimum does not lie at least 1e−9 Eh below the dissociation limit.
 */
import { minimizeBrent } from '@shared/chemistry/numeric';
import { HARTREE_EV } from '@shared/chemistry/units';
import { curve } from './curve';
import { curvePointUnchecked } from './curve-point';
import { dissociationLimit } from './dissociation-limit';
import type { CurveMinimumResult, CurveModelParams } from './types';
import { validateCurveParams } from './validate-curve-params';

const SCAN_FROM_BOHR = 0.05;
const SCAN_TO_BOHR = 40;
const SCAN_POINTS = 90;
const DISTANCE_TOLERANCE_BOHR = 1e-8;
/** a well shallower than this is rounding noise at the asymptote, not a bound state */
const MIN_WELL_DEPTH_HARTREE = 1e-9;

/** The coarse scan grid (geometric, ascending). */
export function minimumScanGrid(): number[] {
  const ratio = Math.pow(SCAN_TO_BOHR / SCAN_FROM_BOHR, 1 / (SCAN_POINTS - 1));
  return Array.from({ length: SCAN_POINTS }, (_, k) => SCAN_FROM_BOHR * Math.pow(ratio, k));
}

export function curveMinimum(p: CurveModelParams): CurveMinimumResult | null {
  validateCurveParams(p);
  const grid = minimumScanGrid();
  const scan = curve(p, grid);
  let lowest = 0;
  for (let i = 1; i < grid.length; i++) if (scan.energyHartree[i] < scan.energyHartree[lowest]) lowest = i;
  if (lowest === 0 || lowest === grid.length - 1) return null;

  const optimized = p.model !== 'exact' && p.zeta === 'opt';
  let zetaGuess = scan.zeta?.[lowest];
  const energyAt = (distanceBohr: number): number => {
    const point = curvePointUnchecked(p, distanceBohr, zetaGuess);
    if (optimized && point.zeta !== undefined) zetaGuess = point.zeta;
    return point.energyHartree;
  };
  const found = minimizeBrent(energyAt, grid[lowest - 1], grid[lowest + 1], DISTANCE_TOLERANCE_BOHR);
  const atMinimum = curvePointUnchecked(p, found.x, zetaGuess);
  const limitHartree = dissociationLimit(p);
  const deHartree = limitHartree - atMinimum.energyHartree;
  if (!(deHartree > MIN_WELL_DEPTH_HARTREE)) return null;

  const result: CurveMinimumResult = {
    reBohr: found.x,
    energyHartree: atMinimum.energyHartree,
    deHartree,
    deEv: deHartree * HARTREE_EV,
  };
  if (p.model !== 'exact') result.zeta = p.zeta === 'opt' ? atMinimum.zeta : p.zeta;
  return result;
}
