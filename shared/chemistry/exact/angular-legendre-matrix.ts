/**
 * Matrix of the angular operator of the one-electron two-centre problem (m = 0),
 *   d/dμ[(1 − μ²) d/dμ] + p·μ + c²·μ²,   p = R(Zb − Za),
 * in orthonormal Legendre functions P̄_l = √((2l + 1)/2)·P_l. Its eigenvalues are −A.
 *   ⟨l| d/dμ(1 − μ²)d/dμ |l⟩ = −l(l + 1)
 *   ⟨l+1| μ |l⟩   = (l + 1)/√((2l + 1)(2l + 3))
 *   ⟨l| μ² |l⟩    = (2l² + 2l − 1)/((2l − 1)(2l + 3))
 *   ⟨l+2| μ² |l⟩  = (l + 1)(l + 2)/((2l + 3)√((2l + 1)(2l + 5)))
 * (from the recurrence (2l + 1)μP_l = (l + 1)P_{l+1} + l·P_{l−1} and ∫P_l² = 2/(2l + 1),
 * Abramowitz & Stegun 8.5.3 and 22.2.10). With p = 0 (Za = Zb) even and odd l decouple:
 * parity 'even'/'odd' keeps one of them and the matrix becomes tridiagonal in that subspace.
 * Equation: Bates, Ledsham & Stewart, Phil. Trans. R. Soc. A 246 (1953) 215.
 */
import type { AngularParity, SymmetricBanded } from './types';

export function angularLegendreMatrix(c2: number, p: number, parity: AngularParity, size: number): SymmetricBanded {
  const diagonal = new Float64Array(size);
  const upper1 = new Float64Array(Math.max(size - 1, 0));
  const upper2 = new Float64Array(Math.max(size - 2, 0));
  const step = parity === 'all' ? 1 : 2;
  const first = parity === 'odd' ? 1 : 0;
  for (let k = 0; k < size; k++) {
    const l = first + step * k;
    diagonal[k] = -l * (l + 1) + (c2 * (2 * l * l + 2 * l - 1)) / ((2 * l - 1) * (2 * l + 3));
    const muToNext = (l + 1) / Math.sqrt((2 * l + 1) * (2 * l + 3));
    const mu2ToNextButOne = ((l + 1) * (l + 2)) / ((2 * l + 3) * Math.sqrt((2 * l + 1) * (2 * l + 5)));
    if (parity === 'all') {
      if (k < size - 1) upper1[k] = p * muToNext;
      if (k < size - 2) upper2[k] = c2 * mu2ToNextButOne;
    } else if (k < size - 1) {
      upper1[k] = c2 * mu2ToNextButOne;
    }
  }
  return { diagonal, upper1, upper2 };
}
