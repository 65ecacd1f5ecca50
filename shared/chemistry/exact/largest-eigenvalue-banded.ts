/**
 * Largest eigenvalue θ of a real symmetric matrix with bandwidth ≤ 2.
 * σ > θ exactly when σI − M is positive definite, i.e. when every pivot of its
 * LDLᵀ (banded Cholesky) factorization is positive. The factorization here runs
 * from the last row up, so its final pivot d(σ) = det(σI − M)/det(σI − M′), M′ the
 * trailing block without row and column 0, is continuous and increasing for σ
 * above the largest eigenvalue of M′ with its only zero at θ (Cauchy
 * interlacing). When the top eigenvector is dominated by the first basis
 * function (here: P_0 or P_1) that block's eigenvalues lie well below θ and d(σ)
 * is nearly linear near θ, so Brent's method needs only a few steps.
 * Source: Golub & Van Loan, Matrix Computations, 4th ed., §4.3 (band LDLᵀ) and
 * §8.4 (interlacing, Sturm-type counts); Brent (1973) for the root.
 */
import { findRootBrent } from '@shared/chemistry/numeric';
import type { SymmetricBanded } from './types';

/** final pivot of the bottom-up LDLᵀ of σI − M, or −1e300 when an earlier pivot is not positive */
function finalPivot({ diagonal, upper1, upper2 }: SymmetricBanded, sigma: number): number {
  const n = diagonal.length;
  // row k of the reversed matrix is row n − 1 − k of M; carry pivots d(k−1), d(k−2) and L(k−1, k−2)
  let d1 = 0;
  let d2 = 0;
  let l1Prev = 0;
  for (let k = 0; k < n; k++) {
    const i = n - 1 - k;
    const b2 = k >= 2 ? -upper2[i] : 0; // (σI − M)(i, i+2)
    const b1 = k >= 1 ? -upper1[i] : 0; // (σI − M)(i, i+1)
    const lk2 = k >= 2 ? b2 / d2 : 0;
    const lk1 = k >= 1 ? (b1 - lk2 * l1Prev * d2) / d1 : 0;
    const d = sigma - diagonal[i] - lk1 * lk1 * d1 - lk2 * lk2 * d2;
    if (k === n - 1) return d;
    if (!(d > 0)) return -1e300;
    d2 = d1;
    d1 = d;
    l1Prev = lk1;
  }
  return -1e300;
}

export function largestEigenvalueBanded(matrix: SymmetricBanded, guess?: number): number {
  const { diagonal, upper1, upper2 } = matrix;
  const n = diagonal.length;
  if (n === 0) throw new RangeError('largestEigenvalueBanded: empty matrix');
  if (n === 1) return diagonal[0];
  const g = (sigma: number) => finalPivot(matrix, sigma);
  let scale = 1;
  for (let i = 0; i < n; i++) scale = Math.max(scale, 1 + Math.abs(diagonal[i]));
  const tol = 4 * Number.EPSILON * scale;
  if (guess !== undefined && Number.isFinite(guess)) {
    const delta = 1e-3 * (1 + Math.abs(guess));
    const lo = guess - delta;
    const hi = guess + delta;
    if (g(lo) < 0 && g(hi) > 0) return findRootBrent(g, lo, hi, tol);
  }
  // Rayleigh quotient of each unit vector gives θ ≥ max diagonal; Gershgorin gives θ ≤ max row bound
  let lo = -Infinity;
  let hi = -Infinity;
  for (let i = 0; i < n; i++) {
    const radius =
      (i >= 1 ? Math.abs(upper1[i - 1]) : 0) +
      (i < n - 1 ? Math.abs(upper1[i]) : 0) +
      (i >= 2 ? Math.abs(upper2[i - 2]) : 0) +
      (i < n - 2 ? Math.abs(upper2[i]) : 0);
    lo = Math.max(lo, diagonal[i]);
    hi = Math.max(hi, diagonal[i] + radius);
  }
  hi += tol + 1e-12 * Math.abs(hi);
  if (g(lo) >= 0) return lo;
  return findRootBrent(g, lo, hi, tol);
}
