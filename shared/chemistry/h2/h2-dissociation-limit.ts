/**
 * What an H2 curve tends to as R → ∞, for each model at fixed ζ or with ζ
 * optimized, next to the energy of two separated H atoms in the same basis
 * (the reference for the dissociation energy De). Derivation (science.md §3,
 * Coulson & Fischer, Phil. Mag. 40 (1949) 386 for the MO failure):
 * - one H atom in a 1s orbital of exponent ζ: ζ²/2 − ζ (exact −1/2 at ζ = 1);
 *   two atoms: ζ² − 2ζ → −1 Eh at ζ = 1 and with ζ optimized.
 * - VB and CI ground state, and the triplet of every model: the
 *   wave function becomes two neutral atoms, limit ζ² − 2ζ (correct).
 * - MO ground state σg²: half covalent, half ionic (H⁺H⁻) at every R, so its
 *   limit is the average ζ² − 2ζ + (aa|aa)/2 = ζ² − 2ζ + 5ζ/16
 *   (−0.6875 Eh at ζ = 1, i.e. 8.50 eV above two atoms); with ζ optimized
 *   ζ = 27/32 and the limit is −(27/32)² = −0.7119140625 Eh. The MO model
 *   dissociates wrongly; its De is still measured against two atoms.
 */
import type { H2Method, H2State } from './types';

export interface H2DissociationLimitInput {
  method: H2Method;
  zeta: number | 'opt';
  state?: H2State;
}

export interface H2DissociationLimit {
  /** lim R→∞ of the model's total energy, hartree */
  methodLimitHartree: number;
  /** two H atoms in the same 1s basis (ζ² − 2ζ; −1 for ζ = 1 or optimized), hartree — the De reference */
  separatedAtomsHartree: number;
  /** whether the model's limit is the separated atoms */
  dissociatesCorrectly: boolean;
}

export function h2DissociationLimit({ method, zeta, state = 'ground' }: H2DissociationLimitInput): H2DissociationLimit {
  if (zeta !== 'opt' && !(Number.isFinite(zeta) && zeta > 0)) {
    throw new RangeError(`h2DissociationLimit: zeta must be a positive number or 'opt', got ${zeta}`);
  }
  const separatedAtomsHartree = zeta === 'opt' ? -1 : zeta * zeta - 2 * zeta;
  if (state === 'triplet' || method === 'vb' || method === 'ci') {
    return { methodLimitHartree: separatedAtomsHartree, separatedAtomsHartree, dissociatesCorrectly: true };
  }
  const methodLimitHartree = zeta === 'opt' ? -((27 / 32) ** 2) : zeta * zeta - 2 * zeta + (5 * zeta) / 16;
  return { methodLimitHartree, separatedAtomsHartree, dissociatesCorrectly: false };
}
