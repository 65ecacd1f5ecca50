/**
 * Electronic energy of the lower or upper root of the minimal-LCAO 2×2 problem,
 * allocation-free, for the inner loop of the ζ optimization. The same formulas
 * as lcaoMatrixElements (Slater 1963; Finkelstein & Horowitz 1928) and
 * generalizedEigenTwoByTwo (roots of the orthogonalized g/u problem:
 * (Hgg + Huu)/2 ∓ √(((Hgg − Huu)/2)² + Hgu²)). No input checks: callers validate.
 */
export function lcaoRootEnergy(za: number, zb: number, zeta: number, distanceBohr: number, upper: boolean): number {
  const w = zeta * distanceBohr;
  const ew = Math.exp(-w);
  const e2w = ew * ew;
  const s = ew * (1 + w + (w * w) / 3);
  const coulomb = (-Math.expm1(-2 * w) - w * e2w) / distanceBohr;
  const resonance = zeta * (1 + w) * ew;
  const kinetic = (zeta * zeta) / 2;
  const haa = kinetic - za * zeta - zb * coulomb;
  const hbb = kinetic - zb * zeta - za * coulomb;
  const hab = (-zeta * zeta * s) / 2 + zeta * resonance - (za + zb) * resonance;
  const hgg = (haa + hbb + 2 * hab) / (2 * (1 + s));
  const huu = (haa + hbb - 2 * hab) / (2 * (1 - s));
  const hgu = (haa - hbb) / (2 * Math.sqrt(1 - s * s));
  const mean = (hgg + huu) / 2;
  const half = Math.hypot((hgg - huu) / 2, hgu);
  return upper ? mean + half : mean - half;
}
