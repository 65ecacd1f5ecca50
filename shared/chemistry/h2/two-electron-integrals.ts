/**
 * The four distinct two-electron integrals of H2 in a 1s Slater basis with
 * one exponent ζ (chemists' notation (ij|kl) = ∫∫ i(1)j(1) r12⁻¹ k(2)l(2)),
 * hartree. Formulas and their sources are in the modules named below
 * (science.md §3; Sugiura 1927 for the exchange integral).
 */
import { assertGeometry, type H2Geometry } from './types';
import { coulombIntegralOneCentre } from './coulomb-integral-one-centre';
import { coulombIntegralTwoCentre } from './coulomb-integral-two-centre';
import { hybridIntegral } from './hybrid-integral';
import { exchangeIntegral } from './exchange-integral';

export interface H2TwoElectronIntegrals {
  /** (aa|aa) = 5ζ/8 */
  coulombOneCentre: number;
  /** (aa|bb) */
  coulombTwoCentre: number;
  /** (aa|ab) */
  hybrid: number;
  /** (ab|ab) */
  exchange: number;
}

export function twoElectronIntegrals(geometry: H2Geometry): H2TwoElectronIntegrals {
  assertGeometry(geometry, 'twoElectronIntegrals');
  const { zeta, distanceBohr } = geometry;
  return {
    coulombOneCentre: coulombIntegralOneCentre(zeta),
    coulombTwoCentre: coulombIntegralTwoCentre(zeta, distanceBohr),
    hybrid: hybridIntegral(zeta, distanceBohr),
    exchange: exchangeIntegral(zeta, distanceBohr),
  };
}
