/**
 * Classifies a potential-energy curve as bound, repulsive or unclear.
 *
 * - bound: findMinimum finds an interior minimum whose well is deeper than the
 *   tolerance below both sides of the curve;
 * - repulsive: no such minimum, and the energy decreases monotonically with R
 *   within the tolerance, and falls by more than the tolerance overall;
 * - unclear: anything else (rises with R, or wobbles by more than the noise
 *   without a clear well).
 * Monotonicity test: each energy is smoothed with its two neighbours (3-point
 * mean, 2-point at the ends) and a violation is a point whose smoothed energy
 * lies more than the tolerance above the lowest smoothed energy before it (a
 * running-minimum test, so a slow steady rise counts as well as a jump).
 * Tolerance: `toleranceHartree`, default 6σ + 1e−10 Eh with σ from
 * estimateNoise (noise-tolerance.ts; a k-sigma rule, common practice).
 */
import { estimateNoise } from './estimate-noise';
import { findMinimum, type CurveMinimum } from './find-minimum';
import { noiseToleranceHartree } from './noise-tolerance';
import { prepareCurve, requireUsablePoints, type CurveInput } from './prepare-curve';

export type CurveKind = 'bound' | 'repulsive' | 'unclear';

export interface ClassifyCurveOptions {
  /** noise σ of the energies; estimated from the data when omitted */
  noiseHartree?: number;
  /** energy differences up to this are treated as noise; default noiseToleranceHartree(σ) */
  toleranceHartree?: number;
}

export interface CurveClassification {
  kind: CurveKind;
  monotonicDecreasing: boolean;
  /** points whose smoothed energy lies more than the tolerance above the lowest smoothed energy before them */
  violations: number;
  message: string;
  toleranceHartree: number;
  noiseHartree: number;
  /** the minimum behind a 'bound' verdict, else null */
  minimum: CurveMinimum | null;
  pointsUsed: number;
  pointsSkipped: number;
}

const format = (v: number) => v.toPrecision(3);

export function classifyCurve(input: CurveInput, options: ClassifyCurveOptions = {}): CurveClassification {
  const curve = prepareCurve(input);
  requireUsablePoints(curve);
  const y = curve.energyHartree;
  const n = curve.count;
  const noise = options.noiseHartree ?? estimateNoise(curve);
  const tolerance = options.toleranceHartree ?? noiseToleranceHartree(noise);

  let violations = 0;
  let runningMinimum = Number.POSITIVE_INFINITY;
  for (let j = 0; j < n; j++) {
    const smoothed =
      j === 0 ? 0.5 * (y[0] + y[1]) : j === n - 1 ? 0.5 * (y[n - 2] + y[n - 1]) : (y[j - 1] + y[j] + y[j + 1]) / 3;
    if (smoothed - runningMinimum > tolerance) violations++;
    if (smoothed < runningMinimum) runningMinimum = smoothed;
  }
  const monotonicDecreasing = violations === 0;
  const minimum = findMinimum(curve, { noiseHartree: noise, depthToleranceHartree: tolerance });
  const common = {
    monotonicDecreasing,
    violations,
    toleranceHartree: tolerance,
    noiseHartree: noise,
    pointsUsed: n,
    pointsSkipped: curve.pointsSkipped,
  };
  if (minimum) {
    return {
      ...common,
      kind: 'bound',
      minimum,
      message:
        `Bound: minimum near R = ${format(minimum.reBohr)} a0, ${format(minimum.wellDepthHartree)} Eh below the lower side ` +
        `of the curve (noise tolerance ${format(tolerance)} Eh).`,
    };
  }
  const drop = y[0] - y[n - 1];
  if (monotonicDecreasing && drop > tolerance) {
    return {
      ...common,
      kind: 'repulsive',
      minimum: null,
      message: `Repulsive: energy falls by ${format(drop)} Eh and never rises by more than ${format(tolerance)} Eh with R.`,
    };
  }
  let lowest = 0;
  for (let i = 1; i < n; i++) if (y[i] < y[lowest]) lowest = i;
  const message =
    lowest === 0
      ? `Unclear: the energy is lowest at the shortest distance and rises with R; no minimum inside the curve.`
      : `Unclear: no interior minimum deeper than ${format(tolerance)} Eh, but ${violations} point${violations === 1 ? '' : 's'} ` +
        `rise above the lowest energy before them by more than that.`;
  return { ...common, kind: 'unclear', minimum: null, message };
}
