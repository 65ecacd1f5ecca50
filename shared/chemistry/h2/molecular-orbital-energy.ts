/**
 * Electronic energy of the simple MO wave function of H2, one closed-shell
 * determinant σg² (C. A. Coulson, Proc. Camb. Phil. Soc. 34 (1938) 204;
 * science.md §3):
 *   E = 2hg + Jgg = 2(Haa + Hab)/(1 + S)
 *       + [(aa|aa) + (aa|bb) + 4(aa|ab) + 2(ab|ab)] / [2(1 + S)²]
 */
import type { H2MolecularOrbitalIntegrals } from './molecular-orbital-integrals';

export function molecularOrbitalElectronicEnergy({ hg, jgg }: H2MolecularOrbitalIntegrals): number {
  return 2 * hg + jgg;
}
