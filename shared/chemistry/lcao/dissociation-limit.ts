/**
 * Energies of the minimal-LCAO model at infinite separation (nuclear repulsion
 * and Hab vanish, S → 0): the roots tend to the atomic energies ζ²/2 − Zζ of
 * a 1s Slater orbital on each centre (lower root on the larger charge). With ζ
 * optimized each becomes the hydrogen-like −Z²/2 (at ζ = Z).
 * Source: the energy of a normalized 1s Slater function in a −Z/r field,
 * ⟨T⟩ − Z⟨1/r⟩ = ζ²/2 − Zζ (e.g. Levine, Quantum Chemistry, variation method for hydrogen-like atoms).
 */
import { assertPositive } from './assert-positive';

export function lcaoDissociationLimit({ za, zb, zeta }: { za: number; zb: number; zeta: number | 'opt' }): {
  bondingHartree: number;
  antibondingHartree: number;
} {
  assertPositive('za', za);
  assertPositive('zb', zb);
  const atom = (z: number): number => {
    if (zeta === 'opt') return (-z * z) / 2;
    assertPositive('zeta', zeta);
    return (zeta * zeta) / 2 - z * zeta;
  };
  const ea = atom(za);
  const eb = atom(zb);
  return { bondingHartree: Math.min(ea, eb), antibondingHartree: Math.max(ea, eb) };
}
