/**
 * Equilibrium distance, energy and curvature of a potential-energy curve from a
 * smooth local fit around its lowest points (not the lowest grid point).
 *
 * Method: local polynomial regression (Savitzky & Golay, Anal. Chem. 36 (1964)
 * 1627; on uneven grids as in Cleveland, J. Am. Stat. Assoc. 74 (1979) 829,
 * here unweighted): a least-squares quartic over a contiguous window grown
 * from the lowest point, always adding the lower of the two neighbouring
 * points so that the window follows the anharmonic well.
 * The window size is chosen by Lepski's method (Lepski, Mammen & Spokoiny,
 * Ann. Statist. 25 (1997) 929): nested windows of growing size are fitted in
 * turn, each with the standard errors of Re and E(Re) that the noise σ
 * (estimateNoise) implies (delta method on the least-squares covariance), and
 * the largest window is kept whose Re and E(Re) agree with those of every
 * smaller window within `consistencyFactor` of the smaller window's standard
 * error. The first window is the smallest one (at least 5 points) that rises
 * `minimumRiseFactor` × σ above the lowest point (or half the rough well
 * depth, whichever is less) on both sides — some point on each side of the
 * lowest point lies that high — so that it resolves the well at all, and so
 * that it stops growing at the end of the data at the latest. Clean data
 * so keeps the 5-point window (truncation error smallest); noisy data grows the
 * window until the quartic's bias would start to show. Growth compares the
 * mean of the next two points on each side, which keeps the choice of points
 * from favouring points that noise happened to push down. Re is the fitted polynomial's minimum, E(Re) its value and
 * k = d²E/dR² its second derivative there.
 * A quartic rather than a quadratic because the cubic anharmonicity of a real
 * well would otherwise shift Re by about 0.3·h² a0 over a half-width h; a
 * natural cubic spline was not chosen because it interpolates noise and its
 * second derivative converges only as h².
 *
 * Returns null when there is no interior minimum: the lowest point is the
 * first or last point, no fitted polynomial has a minimum inside its window,
 * or the well is not deeper than the noise tolerance (noise-tolerance.ts).
 * The well depth is the lower side (highest 3-point mean) minus E(Re), where
 * E(Re) is not taken below the lowest data point: a fit that dips below all
 * of its points cannot make a well deeper than the data show.
 */
import { estimateNoise } from './estimate-noise';
import {
  covarianceQuadraticForm,
  evaluatePolynomial,
  fitLocalPolynomial,
  lowestInteriorMinimum,
} from './fit-local-polynomial';
import { noiseToleranceHartree } from './noise-tolerance';
import { prepareCurve, requireUsablePoints, type CurveInput, type PreparedCurve } from './prepare-curve';

export interface FindMinimumOptions {
  /** noise σ of the energies; estimated from the data when omitted */
  noiseHartree?: number;
  /** a well shallower than this is treated as noise; default noiseToleranceHartree(σ) */
  depthToleranceHartree?: number;
  /** smallest fit window (default and least 5) */
  minimumWindowPoints?: number;
  /** Lepski consistency factor κ, in standard errors (default 4) */
  consistencyFactor?: number;
  /** the first window must rise this × σ above the lowest point, or half the well depth if less (default 150) */
  minimumRiseFactor?: number;
}

export interface CurveMinimum {
  reBohr: number;
  energyHartree: number;
  curvatureHartreePerBohr2: number;
  method: 'local-quartic-least-squares';
  /** points in the fit window */
  pointsUsed: number;
  /** points of the input skipped as missing or not finite */
  pointsSkipped: number;
  /** standard errors implied by the noise estimate (zero for noise-free data) */
  reStandardErrorBohr: number;
  energyStandardErrorHartree: number;
  curvatureStandardErrorHartreePerBohr2: number;
  /** depth of the well: lower of its two sides (maxima of 3-point means) minus E(Re), or minus the lowest data point if that is higher, Eh */
  wellDepthHartree: number;
  /** distance range of the fit window, a0 */
  windowBohr: [number, number];
  noiseHartree: number;
}

const DEGREE = 4;
const MIN_WINDOW = DEGREE + 1;
const DEFAULT_CONSISTENCY_FACTOR = 4;
const DEFAULT_MINIMUM_RISE_FACTOR = 150;
const MAX_CANDIDATES = 64;

/** Highest energy on one side of the minimum, each point averaged with its same-side neighbours. */
function sideLevel(y: Float64Array, from: number, to: number): number {
  let level = Number.NEGATIVE_INFINITY;
  for (let j = from; j <= to; j++) {
    let sum = y[j];
    let count = 1;
    if (j > from) { sum += y[j - 1]; count++; }
    if (j < to) { sum += y[j + 1]; count++; }
    const mean = sum / count;
    if (mean > level) level = mean;
  }
  return level;
}

interface WindowFit {
  lo: number;
  hi: number;
  reBohr: number;
  energyHartree: number;
  curvature: number;
  seRe: number;
  seEnergy: number;
  seCurvature: number;
}

const scratch = new Float64Array(3);
const gradient = new Float64Array(16);

function fitWindow(x: Float64Array, y: Float64Array, lo: number, hi: number, reference: number, noise: number, degree: number): WindowFit | null {
  const fit = fitLocalPolynomial(x, y, lo, hi, degree, reference);
  if (!fit) return null;
  const c = fit.coefficients;
  const t = lowestInteriorMinimum(c, -1, 1);
  if (Number.isNaN(t)) return null;
  evaluatePolynomial(c, t, scratch);
  const p = scratch[0];
  const d2 = scratch[2];
  if (!(d2 > 0)) return null;
  const s = fit.scaleBohr;
  const g = gradient.subarray(0, degree + 1);
  // third derivative of p at t*
  let d3 = 0;
  for (let j = degree; j >= 3; j--) d3 = d3 * t + j * (j - 1) * (j - 2) * c[j];
  // E = p(t*): ∂/∂c_j = t^j (p′ = 0 there, so δt* does not enter)
  for (let j = 0; j <= degree; j++) g[j] = t ** j;
  const varEnergy = covarianceQuadraticForm(fit, g);
  // Re = centre + s·t*, δt* = −δp′(t*)/p″(t*), ∂p′(t*)/∂c_j = j t^(j−1)
  for (let j = 0; j <= degree; j++) g[j] = j === 0 ? 0 : j * t ** (j - 1);
  const varSlope = covarianceQuadraticForm(fit, g);
  // k = p″(t*)/s²: δp″ = Σ j(j−1)t^(j−2) δc_j + p‴·δt*
  const ratio = d3 / d2;
  for (let j = 0; j <= degree; j++) {
    const second = j < 2 ? 0 : j * (j - 1) * t ** (j - 2);
    const first = j === 0 ? 0 : j * t ** (j - 1);
    g[j] = second - ratio * first;
  }
  const varCurvature = covarianceQuadraticForm(fit, g);
  return {
    lo,
    hi,
    reBohr: fit.centreBohr + t * s,
    energyHartree: reference + p,
    curvature: d2 / (s * s),
    seRe: (noise * s * Math.sqrt(varSlope)) / d2,
    seEnergy: noise * Math.sqrt(varEnergy),
    seCurvature: (noise * Math.sqrt(varCurvature)) / (s * s),
  };
}

export function findMinimum(input: CurveInput, options: FindMinimumOptions = {}): CurveMinimum | null {
  const curve: PreparedCurve = prepareCurve(input);
  requireUsablePoints(curve);
  const x = curve.distanceBohr;
  const y = curve.energyHartree;
  const n = curve.count;
  const noise = options.noiseHartree ?? estimateNoise(curve);
  const depthTolerance = options.depthToleranceHartree ?? noiseToleranceHartree(noise);
  const kappa = options.consistencyFactor ?? DEFAULT_CONSISTENCY_FACTOR;
  let size = Math.min(n, Math.max(MIN_WINDOW, options.minimumWindowPoints ?? MIN_WINDOW));

  let lowest = 0;
  for (let i = 1; i < n; i++) if (y[i] < y[lowest]) lowest = i;
  if (lowest === 0 || lowest === n - 1) return null;
  const reference = y[lowest];

  // the first window must rise clearly above the noise, but stay inside the well
  const roughDepth = Math.min(sideLevel(y, 0, lowest - 1), sideLevel(y, lowest + 1, n - 1)) - reference;
  const minimumRise = Math.min((options.minimumRiseFactor ?? DEFAULT_MINIMUM_RISE_FACTOR) * noise, 0.5 * roughDepth);
  // highest point of the window on each side of the lowest point: the window has risen on a side once
  // any point there lies minimumRise above the lowest point (not only its end point, which at the end of
  // the data can no longer move — requiring the end point to rise let the window grow over the whole curve)
  let leftHighest = Number.NEGATIVE_INFINITY;
  let rightHighest = Number.NEGATIVE_INFINITY;
  const accepted: WindowFit[] = [];
  let lo = lowest;
  let hi = lowest;
  for (let candidate = 0; candidate < MAX_CANDIDATES; candidate++) {
    // grow the nested window to `size` points, on the lower side first (mean of its next two points);
    // the first window also grows until both sides have risen, which they do by the ends of the data at
    // the latest (each side's highest point lies at least roughDepth ≥ minimumRise above the lowest point)
    while (
      hi - lo + 1 < size ||
      (accepted.length === 0 && Math.min(leftHighest, rightHighest) - reference < minimumRise && hi - lo + 1 < n)
    ) {
      const left = lo > 0 ? (lo > 1 ? 0.5 * (y[lo - 1] + y[lo - 2]) : y[lo - 1]) : Number.POSITIVE_INFINITY;
      const right = hi < n - 1 ? (hi < n - 2 ? 0.5 * (y[hi + 1] + y[hi + 2]) : y[hi + 1]) : Number.POSITIVE_INFINITY;
      if (left <= right) {
        lo--;
        if (y[lo] > leftHighest) leftHighest = y[lo];
      } else {
        hi++;
        if (y[hi] > rightHighest) rightHighest = y[hi];
      }
    }
    size = hi - lo + 1;
    const fit = fitWindow(x, y, lo, hi, reference, noise, DEGREE);
    if (fit) {
      let consistent = true;
      for (const earlier of accepted) {
        if (
          Math.abs(fit.reBohr - earlier.reBohr) > kappa * earlier.seRe ||
          Math.abs(fit.energyHartree - earlier.energyHartree) > kappa * earlier.seEnergy
        ) {
          consistent = false;
          break;
        }
      }
      if (!consistent) break;
      accepted.push(fit);
    } else if (accepted.length > 0) {
      break;
    }
    if (size >= n) break;
    size = Math.min(n, Math.max(size + 2, Math.ceil(size * 1.15)));
  }
  const best = accepted[accepted.length - 1];
  if (!best) return null;

  // depth of the well against both sides of the whole curve (highest 3-point means on either side of
  // Re). The bottom is the fitted E(Re), but never lower than the lowest data point: a fit can dip below
  // every point it was fitted to (a quartic through five noisy points by several σ, a biased wide window
  // by far more), and such a dip is the fit's, not a well the data show.
  let split = 0;
  while (split < n && x[split] < best.reBohr) split++;
  if (split === 0 || split === n) return null;
  const bottom = Math.max(best.energyHartree, reference);
  const wellDepthHartree = Math.min(sideLevel(y, 0, split - 1), sideLevel(y, split, n - 1)) - bottom;
  if (!(wellDepthHartree > depthTolerance)) return null;

  return {
    reBohr: best.reBohr,
    energyHartree: best.energyHartree,
    curvatureHartreePerBohr2: best.curvature,
    method: 'local-quartic-least-squares',
    pointsUsed: best.hi - best.lo + 1,
    pointsSkipped: curve.pointsSkipped,
    reStandardErrorBohr: best.seRe,
    energyStandardErrorHartree: best.seEnergy,
    curvatureStandardErrorHartreePerBohr2: best.seCurvature,
    wellDepthHartree,
    windowBohr: [x[best.lo], x[best.hi]],
    noiseHartree: noise,
  };
}
