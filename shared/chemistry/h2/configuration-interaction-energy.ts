/**
 * Electronic energy of H2 with configuration interaction between the two
 * closed-shell ¹Σg⁺ determinants σg² and σu² (lowest root of the 2×2 problem;
 * S. Weinbaum, J. Chem. Phys. 1 (1933) 593 wrote the same space as covalent +
 * ionic; Szabo & Ostlund, Modern Quantum Chemistry, 1982, §4.1 for the
 * determinant form):
 *   H11 = 2hg + Jgg,  H22 = 2hu + Juu,  H12 = ⟨σg²|H|σu²⟩ = Kgu
 *   E = (H11 + H22)/2 − √[((H22 − H11)/2)² + H12²]
 * Written as H11 − H12²/(Δ + √(Δ² + H12²)), Δ = (H22 − H11)/2 > 0, which
 * avoids the cancellation of the textbook form when H12 is small.
 */
import type { H2MolecularOrbitalIntegrals } from './molecular-orbital-integrals';

export interface ConfigurationInteractionResult {
  electronicHartree: number;
  /** coefficient of σg² in the normalized lowest root (positive) */
  sigmaGSquared: number;
  /** coefficient of σu² (negative, since (σgσu|σgσu) > 0: the admixture removes the ionic excess of σg²) */
  sigmaUSquared: number;
}

export function configurationInteractionElectronicEnergy(
  integrals: H2MolecularOrbitalIntegrals,
): ConfigurationInteractionResult {
  const { hg, hu, jgg, juu, kgu } = integrals;
  const h11 = 2 * hg + jgg;
  const h22 = 2 * hu + juu;
  const h12 = kgu;
  const half = (h22 - h11) / 2;
  const root = Math.sqrt(half * half + h12 * h12);
  // lowest eigenvalue, written so that nothing cancels when half > 0
  const lowering = half >= 0 ? (h12 * h12) / (half + root) : root - half;
  const electronicHartree = h11 - lowering;
  // eigenvector (cg, cu) from the second row: H12·cg + (H22 − E)·cu = 0, with H22 − E ≥ 0
  const cg = h22 - electronicHartree;
  const cu = -h12;
  const norm = Math.hypot(cg, cu);
  if (norm === 0) return { electronicHartree, sigmaGSquared: 1, sigmaUSquared: 0 };
  return { electronicHartree, sigmaGSquared: cg / norm, sigmaUSquared: cu / norm };
}
