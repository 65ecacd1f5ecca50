/**
 * Hybrid (one-centre/overlap) integral (aa|ab) of 1s Slater orbitals with
 * one exponent ζ, w = ζR (J. C. Slater, Quantum Theory of Molecules and
 * Solids, vol. 1, 1963, appendix 6; Coulson & Fischer; science.md §3):
 *   (aa|ab) = ζ[e^(−w)(w + 1/8 + 5/(16w)) − e^(−3w)(1/8 + 5/(16w))]
 *
 * Cancellation guard: written ζ e^(−w)[w − (1/8 + 5/(16w))·expm1(−2w)];
 * every term is then positive, so there is no cancellation at any w
 * (the limit at w → 0 is 5ζ/8).
 */
export function hybridIntegral(zeta: number, distanceBohr: number): number {
  const w = zeta * distanceBohr;
  return zeta * Math.exp(-w) * (w - (1 / 8 + 5 / (16 * w)) * Math.expm1(-2 * w));
}
