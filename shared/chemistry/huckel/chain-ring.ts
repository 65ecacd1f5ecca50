/**
 * Linear polyenes and monocyclic annulenes of sp² carbons (all h = 0, k = 1).
 * Closed forms (C. A. Coulson, Proc. R. Soc. A 169 (1939) 413; also E. Hückel 1931):
 *   chain of N atoms: x_k = 2cos(kπ/(N + 1)), k = 1 … N
 *   ring of N atoms:  x_k = 2cos(2πk/N),      k = 0 … N − 1
 * Here they are computed through `huckelGraph` (the closed forms serve as tests).
 */
import { huckelGraph } from './huckel-graph';
import type { HuckelResult } from './types';

export interface PolyeneOptions {
  /** π charge (allyl cation: +1) */
  charge?: number;
  /** total π electrons instead of a charge */
  electrons?: number;
}

/** Hückel result of a linear chain of n carbons (n ≥ 1). */
export function huckelChain(n: number, options: PolyeneOptions = {}): HuckelResult {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`a chain needs a whole number of atoms ≥ 1, got ${n}`);
  return huckelGraph({
    name: `chain of ${n}`,
    atoms: Array.from({ length: n }, () => ({ type: 'C' })),
    bonds: Array.from({ length: n - 1 }, (_, i) => ({ from: i, to: i + 1 })),
    ...options,
  });
}

/** Hückel result of a ring of n carbons (n ≥ 3). */
export function huckelRing(n: number, options: PolyeneOptions = {}): HuckelResult {
  if (!Number.isInteger(n) || n < 3) throw new RangeError(`a ring needs a whole number of atoms ≥ 3, got ${n}`);
  return huckelGraph({
    name: `ring of ${n}`,
    atoms: Array.from({ length: n }, () => ({ type: 'C' })),
    bonds: Array.from({ length: n }, (_, i) => ({ from: i, to: (i + 1) % n })),
    ...options,
  });
}
