/**
 * Bonding and antibonding energies with unequal exponents ζa ≠ ζb: matrix
 * elements by prolate spheroidal quadrature, then the 2×2 generalized problem
 * det(H − E·S) = 0, plus Za·Zb/R.
 * Source: as lcaoMatrixElementsQuadrature and lcaoEnergies (linear variation
 * method, Pauling & Wilson 1935 ch. XII §42).
 */
import { lcaoEnergiesFromMatrixElements } from './energies';
import { lcaoMatrixElementsQuadrature, type UnequalExponentsInput } from './matrix-elements-quadrature';
import type { LcaoEnergies } from './types';

export function lcaoEnergiesUnequalExponents(input: UnequalExponentsInput): LcaoEnergies {
  const elements = lcaoMatrixElementsQuadrature(input);
  return lcaoEnergiesFromMatrixElements(elements, (input.za * input.zb) / input.distanceBohr);
}
