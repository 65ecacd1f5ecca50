/**
 * Dissociation limit of a bound curve estimated from its long-distance tail,
 * for data that comes without a model limit (an uploaded curve).
 *
 * Method: the mean energy of the last points (the last tenth of the curve, at
 * least 3 and at most 10 points, all beyond the lowest point). Whether the curve
 * has flattened is judged from the least-squares straight line through those
 * points (ordinary least squares, e.g. Press et al., Numerical Recipes, 3rd ed.,
 * §15.2): the energy change the line makes across the tail must not exceed
 * `flatToleranceHartree`, unless it is within 3 of its own standard errors of
 * zero (then noise alone can explain it). A curve that is still rising at its
 * last point gives a limit, and so a De, that is too low by at least that change.
 */
import { estimateNoise } from './estimate-noise';
import { prepareCurve, requireUsablePoints, type CurveInput } from './prepare-curve';

export interface AsymptoteOptions {
  /** largest energy change across the tail still called flat (default 1e−4 Eh, about 2.7 meV) */
  flatToleranceHartree?: number;
  /** noise σ of the energies; estimated from the data when omitted */
  noiseHartree?: number;
}

export interface AsymptoteEstimate {
  limitHartree: number;
  flattened: boolean;
  /** tail points averaged */
  pointsUsed: number;
  pointsSkipped: number;
  /** energy change of the fitted tail line from its first to its last point, Eh (positive: still rising) */
  tailChangeHartree: number;
  tailSlopeHartreePerBohr: number;
  /** distance range of the tail, a0 */
  tailBohr: [number, number];
  flatToleranceHartree: number;
}

export const DEFAULT_FLAT_TOLERANCE_HARTREE = 1e-4;

export function estimateAsymptote(input: CurveInput, options: AsymptoteOptions = {}): AsymptoteEstimate {
  const curve = prepareCurve(input);
  requireUsablePoints(curve);
  const x = curve.distanceBohr;
  const y = curve.energyHartree;
  const n = curve.count;
  const flatTolerance = options.flatToleranceHartree ?? DEFAULT_FLAT_TOLERANCE_HARTREE;
  let lowest = 0;
  for (let i = 1; i < n; i++) if (y[i] < y[lowest]) lowest = i;
  const wanted = Math.min(10, Math.max(3, Math.ceil(n / 10)));
  const available = Math.max(1, n - 1 - lowest);
  const m = Math.min(wanted, available);
  const from = n - m;

  let meanX = 0;
  let meanY = 0;
  for (let i = from; i < n; i++) { meanX += x[i]; meanY += y[i]; }
  meanX /= m;
  meanY /= m;
  let sxx = 0;
  let sxy = 0;
  for (let i = from; i < n; i++) {
    const dx = x[i] - meanX;
    sxx += dx * dx;
    sxy += dx * (y[i] - meanY);
  }
  const slope = m >= 2 && sxx > 0 ? sxy / sxx : 0;
  const span = x[n - 1] - x[from];
  const change = slope * span;
  let flattened: boolean;
  if (m < 3) {
    flattened = false; // too few points beyond the minimum to judge
  } else {
    const noise = options.noiseHartree ?? estimateNoise(curve);
    const changeStandardError = (noise * span) / Math.sqrt(sxx);
    flattened = Math.abs(change) <= Math.max(flatTolerance, 3 * changeStandardError);
  }
  return {
    limitHartree: meanY,
    flattened,
    pointsUsed: m,
    pointsSkipped: curve.pointsSkipped,
    tailChangeHartree: change,
    tailSlopeHartreePerBohr: slope,
    tailBohr: [x[from], x[n - 1]],
    flatToleranceHartree: flatTolerance,
  };
}
