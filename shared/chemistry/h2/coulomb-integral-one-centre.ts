/**
 * One-centre Coulomb repulsion of two electrons in the same 1s Slater
 * orbital, (aa|aa) = 5ζ/8 hartree (Slater, Quantum Theory of Atomic
 * Structure, vol. 1, 1960; the He-atom variational integral; science.md §3).
 */
export function coulombIntegralOneCentre(zeta: number): number {
  return (5 * zeta) / 8;
}
