/**
 * Total and electronic energy of H2 in the minimal 1s basis (exponent ζ on
 * both protons) for one wave-function model and state (science.md §3):
 * - `mo`  simple MO, σg² (Coulson 1938)            — molecular-orbital-energy.ts
 * - `ci`  σg² and σu² mixed, lowest root (Weinbaum 1933) — configuration-interaction-energy.ts
 * - `vb`  Heitler–London 1927                       — valence-bond-energy.ts
 * - state `triplet`: ³Σu⁺ σgσu (triplet-energy.ts); identical for all three
 *   models in this basis.
 * Total = electronic + 1/R (nuclear repulsion of two protons), hartree.
 */
import { assertGeometry, type H2Energy, type H2Geometry, type H2Method, type H2State } from './types';
import { h2OneElectronIntegrals } from './one-electron-integrals';
import { twoElectronIntegrals } from './two-electron-integrals';
import { molecularOrbitalIntegrals } from './molecular-orbital-integrals';
import { molecularOrbitalElectronicEnergy } from './molecular-orbital-energy';
import { configurationInteractionElectronicEnergy } from './configuration-interaction-energy';
import { valenceBondElectronicEnergy } from './valence-bond-energy';
import { tripletElectronicEnergy } from './triplet-energy';

export interface H2EnergyInput extends H2Geometry {
  method: H2Method;
  /** default `ground` */
  state?: H2State;
}

export function h2Energy(input: H2EnergyInput): H2Energy {
  assertGeometry(input, 'h2Energy');
  const { method, zeta, distanceBohr, state = 'ground' } = input;
  const one = h2OneElectronIntegrals({ zeta, distanceBohr });
  const two = twoElectronIntegrals({ zeta, distanceBohr });
  let electronicHartree: number;
  if (state === 'triplet') {
    electronicHartree = tripletElectronicEnergy(molecularOrbitalIntegrals(one, two));
  } else if (method === 'vb') {
    electronicHartree = valenceBondElectronicEnergy(one, two);
  } else if (method === 'mo') {
    electronicHartree = molecularOrbitalElectronicEnergy(molecularOrbitalIntegrals(one, two));
  } else if (method === 'ci') {
    electronicHartree = configurationInteractionElectronicEnergy(molecularOrbitalIntegrals(one, two)).electronicHartree;
  } else {
    throw new RangeError(`h2Energy: unknown method ${String(method)}`);
  }
  return { electronicHartree, totalHartree: electronicHartree + 1 / distanceBohr };
}
