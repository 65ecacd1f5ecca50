/**
 * Least-squares polynomial through a contiguous run of curve points, and the
 * lowest interior stationary point of that polynomial.
 *
 * Method: linear least squares solved by Householder QR of the design matrix
 * (Golub & Van Loan, Matrix Computations, 4th ed., §5.3), via ml-matrix's
 * QrDecomposition, never by forming the normal equations. The abscissa is
 * centred and scaled, t = (R − centre)/scale with |t| ≤ 1 on the window, so the
 * Vandermonde columns stay well conditioned; energies are taken relative to a
 * reference so the constant term carries no large offset.
 * Variances of quantities derived from the fit use (AᵀA)⁻¹ = R⁻¹R⁻ᵀ from
 * the same factorization (ordinary least-squares covariance σ²(AᵀA)⁻¹).
 * The stationary point is found by bracketing sign changes of p′(t) on a fine
 * sample of the window and refining each with Brent's root finder
 * (shared/chemistry/numeric), keeping the lowest p with p″ > 0.
 */
import { Matrix, QrDecomposition } from 'ml-matrix';
import { findRootBrent } from '../numeric';

export interface LocalPolynomial {
  /** coefficients c_j of p(t) = Σ c_j t^j, t = (R − centreBohr)/scaleBohr, energies relative to referenceHartree */
  coefficients: Float64Array;
  centreBohr: number;
  scaleBohr: number;
  referenceHartree: number;
  /** upper-triangular QR factor R of the design matrix, row-major (degree+1)², for covariances */
  upperTriangular: Float64Array;
}

/** Least-squares polynomial of `degree` through points from..to (inclusive). Null if the system is rank deficient. */
export function fitLocalPolynomial(
  distanceBohr: Float64Array,
  energyHartree: Float64Array,
  from: number,
  to: number,
  degree: number,
  referenceHartree: number,
): LocalPolynomial | null {
  const rows = to - from + 1;
  const columns = degree + 1;
  if (rows < columns) return null;
  const centreBohr = 0.5 * (distanceBohr[from] + distanceBohr[to]);
  const scaleBohr = 0.5 * (distanceBohr[to] - distanceBohr[from]);
  if (!(scaleBohr > 0)) return null;
  const design = new Matrix(rows, columns);
  const rhs = new Matrix(rows, 1);
  for (let i = 0; i < rows; i++) {
    const t = (distanceBohr[from + i] - centreBohr) / scaleBohr;
    let power = 1;
    for (let j = 0; j < columns; j++) {
      design.set(i, j, power);
      power *= t;
    }
    rhs.set(i, 0, energyHartree[from + i] - referenceHartree);
  }
  const qr = new QrDecomposition(design);
  if (!qr.isFullRank()) return null;
  const solution = qr.solve(rhs);
  const coefficients = new Float64Array(columns);
  for (let j = 0; j < columns; j++) coefficients[j] = solution.get(j, 0);
  const r = qr.upperTriangularMatrix;
  const upperTriangular = new Float64Array(columns * columns);
  for (let i = 0; i < columns; i++) for (let j = i; j < columns; j++) upperTriangular[i * columns + j] = r.get(i, j);
  return { coefficients, centreBohr, scaleBohr, referenceHartree, upperTriangular };
}

/**
 * gᵀ(AᵀA)⁻¹g for a gradient g of a derived quantity with respect to the
 * coefficients: solve Rᵀz = g by forward substitution, return |z|². Multiply
 * by σ² for the variance. `g` is overwritten with z.
 */
export function covarianceQuadraticForm(fit: LocalPolynomial, g: Float64Array): number {
  const n = fit.coefficients.length;
  const r = fit.upperTriangular;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    let v = g[i];
    for (let k = 0; k < i; k++) v -= r[k * n + i] * g[k];
    v /= r[i * n + i];
    g[i] = v;
    sum += v * v;
  }
  return sum;
}

/** p(t), p′(t), p″(t) by Horner's scheme; written into `out` (length 3) to avoid allocation. */
export function evaluatePolynomial(coefficients: Float64Array, t: number, out: Float64Array): Float64Array {
  let p = 0;
  let dp = 0;
  let d2p = 0;
  for (let j = coefficients.length - 1; j >= 0; j--) {
    d2p = d2p * t + 2 * dp;
    dp = dp * t + p;
    p = p * t + coefficients[j];
  }
  out[0] = p;
  out[1] = dp;
  out[2] = d2p;
  return out;
}

const SAMPLES = 48;

/**
 * Lowest local minimum of p on [tLow, tHigh] with p″ > 0, strictly inside the
 * interval. Returns t, or NaN when there is none.
 */
export function lowestInteriorMinimum(coefficients: Float64Array, tLow: number, tHigh: number): number {
  const scratch = new Float64Array(3);
  const derivative = (t: number) => evaluatePolynomial(coefficients, t, scratch)[1];
  let best = Number.NaN;
  let bestValue = Number.POSITIVE_INFINITY;
  const step = (tHigh - tLow) / SAMPLES;
  let tPrev = tLow;
  let dPrev = derivative(tPrev);
  for (let k = 1; k <= SAMPLES; k++) {
    const t = k === SAMPLES ? tHigh : tLow + k * step;
    const d = derivative(t);
    if (dPrev < 0 && d >= 0) {
      const root = d === 0 ? t : findRootBrent(derivative, tPrev, t, 1e-15);
      evaluatePolynomial(coefficients, root, scratch);
      if (scratch[2] > 0 && scratch[0] < bestValue && root > tLow && root < tHigh) {
        bestValue = scratch[0];
        best = root;
      }
    }
    tPrev = t;
    dPrev = d;
  }
  return best;
}
