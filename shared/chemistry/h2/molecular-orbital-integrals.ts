/**
 * Integrals over the symmetry orbitals of H2 in the minimal 1s basis,
 *   σg = (a + b)/√(2(1 + S)),  σu = (a − b)/√(2(1 − S)),
 * obtained by expanding the orbitals in a, b (C. C. J. Roothaan, Rev. Mod.
 * Phys. 23 (1951) 69; A. Szabo & N. S. Ostlund, Modern Quantum Chemistry,
 * 1982, §3.5.2 for the same transformation in a Gaussian basis):
 *   hg  = (Haa + Hab)/(1 + S)          hu  = (Haa − Hab)/(1 − S)
 *   Jgg = [(aa|aa) + (aa|bb) + 4(aa|ab) + 2(ab|ab)] / [2(1 + S)²]
 *   Juu = [(aa|aa) + (aa|bb) − 4(aa|ab) + 2(ab|ab)] / [2(1 − S)²]
 *   Jgu = [(aa|aa) + (aa|bb) − 2(ab|ab)] / [2(1 − S²)]
 *   Kgu = [(aa|aa) − (aa|bb)] / [2(1 − S²)]
 * Note: σu quantities divide by 1 − S ≈ w²/6, so at very short range
 * (w ≲ 0.05) they lose about −2·log10(w²/6) digits; at R ≥ 0.3 bohr the loss
 * is below two digits of sixteen.
 */
import type { H2OneElectronIntegrals } from './one-electron-integrals';
import type { H2TwoElectronIntegrals } from './two-electron-integrals';

export interface H2MolecularOrbitalIntegrals {
  /** ⟨σg|h|σg⟩ */
  hg: number;
  /** ⟨σu|h|σu⟩ */
  hu: number;
  /** (σgσg|σgσg) */
  jgg: number;
  /** (σuσu|σuσu) */
  juu: number;
  /** (σgσg|σuσu) */
  jgu: number;
  /** (σgσu|σgσu) */
  kgu: number;
}

export function molecularOrbitalIntegrals(
  one: H2OneElectronIntegrals,
  two: H2TwoElectronIntegrals,
): H2MolecularOrbitalIntegrals {
  const { overlap: s, haa, hab } = one;
  const { coulombOneCentre: aaaa, coulombTwoCentre: aabb, hybrid: aaab, exchange: abab } = two;
  const plus = 1 + s;
  const minus = 1 - s;
  return {
    hg: (haa + hab) / plus,
    hu: (haa - hab) / minus,
    jgg: (aaaa + aabb + 4 * aaab + 2 * abab) / (2 * plus * plus),
    juu: (aaaa + aabb - 4 * aaab + 2 * abab) / (2 * minus * minus),
    jgu: (aaaa + aabb - 2 * abab) / (2 * plus * minus),
    kgu: (aaaa - aabb) / (2 * plus * minus),
  };
}
