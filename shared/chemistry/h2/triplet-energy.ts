/**
 * Electronic energy of the lowest triplet of H2, ³Σu⁺ with configuration
 * σg¹σu¹ — the repulsive ("antibonding") state that two ground-state H atoms
 * also form (Slater, Quantum Theory of Molecules and Solids, vol. 1, 1963,
 * ch. 3; Szabo & Ostlund, Modern Quantum Chemistry, 1982, §2.3.8 for the
 * open-shell triplet energy):
 *   E = hg + hu + Jgu − Kgu
 * In the minimal basis this is the only ³Σu⁺ function, so MO, CI and VB give
 * the same triplet (it equals the Heitler–London triplet).
 */
import type { H2MolecularOrbitalIntegrals } from './molecular-orbital-integrals';

export function tripletElectronicEnergy({ hg, hu, jgu, kgu }: H2MolecularOrbitalIntegrals): number {
  return hg + hu + jgu - kgu;
}
