/**
 * One-electron integrals of H2 (both nuclear charges 1) over 1s Slater
 * orbitals a, b with one exponent ζ, w = ζR (formulas of science.md §1 with
 * Za = Zb = 1; C. A. Coulson, Trans. Faraday Soc. 33 (1937) 1479; Slater,
 * Quantum Theory of Molecules and Solids, vol. 1 (1963), appendix 3):
 *   S   = e^(−w)(1 + w + w²/3)
 *   Haa = ζ²/2 − ζ − (1/R)[1 − (1 + w)e^(−2w)]
 *   Hab = −ζ²S/2 + ζ²(1 + w)e^(−w) − 2ζ(1 + w)e^(−w)
 * with h = −½∇² − 1/ra − 1/rb. Private to h2/ (the one-electron LCAO model
 * has its own, more general, version).
 *
 * Cancellation guard: 1 − (1 + w)e^(−2w) is written −expm1(−2w) − w·e^(−2w),
 * two terms of size ~2w and ~w, so at most one bit is lost at any w.
 */
import { assertGeometry, type H2Geometry } from './types';

export interface H2OneElectronIntegrals {
  /** overlap ⟨a|b⟩ */
  overlap: number;
  /** ⟨a|h|a⟩, hartree */
  haa: number;
  /** ⟨a|h|b⟩, hartree */
  hab: number;
}

export function h2OneElectronIntegrals(geometry: H2Geometry): H2OneElectronIntegrals {
  assertGeometry(geometry, 'h2OneElectronIntegrals');
  const { zeta, distanceBohr } = geometry;
  const w = zeta * distanceBohr;
  const expW = Math.exp(-w);
  const exp2W = expW * expW;
  const overlap = expW * (1 + w + (w * w) / 3);
  const screened = (-Math.expm1(-2 * w) - w * exp2W) / distanceBohr;
  const haa = (zeta * zeta) / 2 - zeta - screened;
  const hab = (-zeta * zeta * overlap) / 2 + zeta * zeta * (1 + w) * expW - 2 * zeta * (1 + w) * expW;
  return { overlap, haa, hab };
}
