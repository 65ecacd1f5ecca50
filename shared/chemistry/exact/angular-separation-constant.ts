/**
 * Separation constant A of the angular equation (m = 0)
 *   d/dμ[(1 − μ²)M′] + [A + p·μ + c²μ²]M = 0,  p = R(Zb − Za),  c² = −E_el·R²/2,
 * for the nodeless angular function of the chosen Legendre parity: A = −θ, θ the
 * largest eigenvalue of the operator's matrix in orthonormal Legendre functions.
 * Basis size grows with c and |p| (the expansion coefficients fall off once
 * l ≳ c); 16 + ⌈1.1c + 0.3|p|⌉ Legendre functions keep A to ~1e−13 for the
 * distances and charges of interest (checked against a basis twice as large in
 * the tests). Low-order check: A = −c²/3 − 2c⁴/135 + O(c⁶) for p = 0, even l
 * (second-order perturbation theory in c²).
 * Source: Bates, Ledsham & Stewart, Phil. Trans. R. Soc. A 246 (1953) 215;
 * Hylleraas, Z. Phys. 71 (1931) 739 (Legendre expansion of the angular function).
 */
import { angularLegendreMatrix } from './angular-legendre-matrix';
import { largestEigenvalueBanded } from './largest-eigenvalue-banded';
import type { AngularParity } from './types';

export interface AngularInput {
  /** c² = −E_el·R²/2 (> 0 for bound states) */
  c2: number;
  /** p = R(Zb − Za); must be 0 unless parity is 'all' */
  p: number;
  parity: AngularParity;
  /** number of Legendre functions (in the chosen parity); default from c and p */
  basisSize?: number;
  /** a nearby value of A (warm start) */
  guess?: number;
}

/** number of Legendre functions P_0 … P_(n−1) needed for ~1e−13 in A */
export function angularBasisSize(c2: number, p: number, parity: AngularParity): number {
  const full = 16 + Math.ceil(1.1 * Math.sqrt(Math.max(c2, 0)) + 0.3 * Math.abs(p));
  return parity === 'all' ? full : Math.ceil(full / 2);
}

export function angularSeparationConstant({ c2, p, parity, basisSize, guess }: AngularInput): number {
  if (parity !== 'all' && p !== 0) throw new RangeError('angularSeparationConstant: p ≠ 0 couples even and odd l; use parity "all"');
  const size = basisSize ?? angularBasisSize(c2, p, parity);
  const matrix = angularLegendreMatrix(c2, p, parity, size);
  return -largestEigenvalueBanded(matrix, guess === undefined ? undefined : -guess);
}
