/**
 * Two-centre Coulomb integral (aa|bb) of 1s Slater orbitals with one
 * exponent ζ, w = ζR (Y. Sugiura, Z. Phys. 45 (1927) 484; C. C. J. Roothaan,
 * J. Chem. Phys. 19 (1951) 1445; science.md §3):
 *   (aa|bb) = (1/R)[1 − e^(−2w)(1 + 11w/8 + 3w²/4 + w³/6)]
 *
 * Cancellation guard for small w (the bracket tends to 5w/8): written
 * −expm1(−2w) − w·e^(−2w)(11/8 + 3w/4 + w²/6), two terms of size ~2w and
 * ~11w/8, so no more than two bits are lost at any w; the limit 5ζ/8 at
 * w → 0 is reached smoothly.
 */
export function coulombIntegralTwoCentre(zeta: number, distanceBohr: number): number {
  const w = zeta * distanceBohr;
  const bracket = -Math.expm1(-2 * w) - w * Math.exp(-2 * w) * (11 / 8 + (3 * w) / 4 + (w * w) / 6);
  return bracket / distanceBohr;
}
