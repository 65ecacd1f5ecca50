/**
 * Speed path for the commonest curve of all: the one-electron minimal-LCAO curve
 * with equal charges Za = Zb = Z and one fixed exponent ζ, on a whole grid at once.
 * Same closed forms as shared/chemistry/lcao (w = ζR):
 *   S = e^(−w)(1 + w + w²/3),  J = (1/R)[1 − (1 + w)e^(−2w)],  K = ζ(1 + w)e^(−w)
 *   Haa = ζ²/2 − Zζ − Z·J,     Hab = −ζ²S/2 + (ζ − 2Z)·K
 *   E± = (Haa ± Hab)/(1 ± S) + Z²/R
 * Source: Pauling & Wilson, Introduction to Quantum Mechanics (1935), ch. XII §42;
 * Finkelstein & Horowitz, Z. Phys. 48 (1928) 118 (exponent ζ); Slater, Quantum Theory
 * of Molecules and Solids, vol. 1 (1963) (the integrals).
 * Written out here (one e^(−w) per point, e^(−2w) as its square, no per-point objects)
 * because the general path (lcaoMatrixElements + the 2×2 solver) costs several times
 * more per point; tests hold it to lcaoCurve within 1e−14 (relative) for the lower root and
 * 1e−13 for the upper root at ζR ≥ 0.3 (below that both paths lose digits in the 0/0 of
 * (Haa − Hab)/(1 − S)). As in lcaoCurve,
 * 'bonding' is the lower root (σu can lie lower for ζ far from Z).
 * Inputs are checked by the caller (Z, ζ, R finite and > 0).
 */
import type { CurveResult } from './types';

/** below this w, 1 − (1 + w)e^(−2w) is formed with expm1 to keep its digits */
const SMALL_W = 0.5;

export function homonuclearLcaoCurve(z: number, zeta: number, bonding: boolean, distancesBohr: readonly number[]): CurveResult {
  const n = distancesBohr.length;
  const distanceBohr: number[] = new Array(n);
  const energyHartree: number[] = new Array(n);
  const electronicHartree: number[] = new Array(n);
  const atomic = (zeta * zeta) / 2 - z * zeta;
  const halfZetaSquared = (zeta * zeta) / 2;
  const resonanceFactor = zeta * (zeta - 2 * z);
  const zz = z * z;
  for (let i = 0; i < n; i++) {
    const r = distancesBohr[i];
    const w = zeta * r;
    const e1 = Math.exp(-w);
    const e2 = e1 * e1;
    const overlap = e1 * (1 + w + (w * w) / 3);
    const oneMinus = w < SMALL_W ? -Math.expm1(-2 * w) - w * e2 : 1 - (1 + w) * e2;
    const haa = atomic - (z * oneMinus) / r;
    const hab = -halfZetaSquared * overlap + resonanceFactor * (1 + w) * e1;
    const gerade = (haa + hab) / (1 + overlap);
    const ungerade = (haa - hab) / (1 - overlap);
    const electronic = bonding ? (gerade < ungerade ? gerade : ungerade) : gerade < ungerade ? ungerade : gerade;
    distanceBohr[i] = r;
    electronicHartree[i] = electronic;
    energyHartree[i] = electronic + zz / r;
  }
  return { distanceBohr, energyHartree, electronicHartree };
}
