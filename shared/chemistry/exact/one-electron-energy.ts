/**
 * Exact (clamped-nuclei, non-relativistic) energy of one electron in the field of
 * two nuclei Za, Zb at distance R: 1sσg, or 2pσu when Za = Zb; for Za ≠ Zb the
 * lowest state (1sσ). Separation in prolate spheroidal coordinates with
 * c² = −E_el·R²/2, m = 0; angular equation as a Legendre-basis eigenproblem,
 * radial equation by Jaffé's continued fraction, and E_el the zero of the
 * radial residual at the angular A (Brent's root finder).
 * Bracket: the minimal-LCAO energy with optimized ζ (bonding root for σg or the
 * lowest state, antibonding root for σu) is a variational upper bound; the root
 * lies just below it.
 * Accuracy: ~1e−12 Eh for 0.05 ≤ R ≤ 100 a0 and small charges (tests compare with
 * larger bases and longer fractions).
 * Source: Bates, Ledsham & Stewart, Phil. Trans. R. Soc. A 246 (1953) 215; Jaffé,
 * Z. Phys. 87 (1934) 535; Wilson, Proc. R. Soc. A 118 (1928) 617 (separation).
 */
import { findRootBrent } from '@shared/chemistry/numeric';
import { lcaoOptimizedZeta } from '@shared/chemistry/lcao';
import { assertPositive } from '@shared/chemistry/lcao/assert-positive';
import { separationResidual } from './separation-residual';
import type { AngularParity, ExactEnergy, ExactInput, ExactState } from './types';

const ROOT_TOLERANCE = 1e-14;

function parityOf(za: number, zb: number, state: ExactState): AngularParity {
  if (state !== 'sigma-g' && state !== 'sigma-u') throw new RangeError(`state must be 'sigma-g' or 'sigma-u', got ${state}`);
  if (za !== zb) {
    if (state === 'sigma-u') {
      throw new RangeError(
        `exactOneElectronEnergy: with Za ≠ Zb (${za}, ${zb}) there is no g/u symmetry; only the lowest state is available (state 'sigma-g')`,
      );
    }
    return 'all';
  }
  return state === 'sigma-g' ? 'even' : 'odd';
}

/** Internal solver with optional warm start (previous energy and separation constant). */
export function solveExactEnergy(
  { za, zb, distanceBohr, state = 'sigma-g' }: ExactInput,
  warm?: { electronicHartree: number; separationConstant: number; step?: number },
): ExactEnergy {
  assertPositive('za', za);
  assertPositive('zb', zb);
  assertPositive('distanceBohr', distanceBohr);
  const parity = parityOf(za, zb, state);
  const repulsion = (za * zb) / distanceBohr;
  const residual = separationResidual(za, zb, distanceBohr, parity, warm?.separationConstant);
  const finish = (electronicHartree: number): ExactEnergy => {
    // re-evaluate at the root so that A belongs to the returned energy
    residual(electronicHartree);
    return { electronicHartree, totalHartree: electronicHartree + repulsion, separationConstant: residual.lastSeparationConstant() };
  };

  if (warm) {
    // a small bracket around the predicted energy, widened a few times in the direction of the
    // sign (negative below the root, positive from the root up to the far-away first pole)
    let h = Math.max(1e-10, Math.abs(warm.step ?? 1e-3));
    let lo = warm.electronicHartree - h;
    let hi = warm.electronicHartree + h;
    let fLo = residual(lo);
    let fHi = residual(hi);
    for (let k = 0; k < 6 && !(fLo < 0 && fHi > 0) && hi < 0; k++) {
      h *= 4;
      if (fLo >= 0) {
        hi = lo;
        fHi = fLo;
        lo -= h;
        fLo = residual(lo);
      } else {
        lo = hi;
        fLo = fHi;
        hi += h;
        fHi = hi < 0 ? residual(hi) : Number.NaN;
      }
    }
    if (fLo < 0 && fHi > 0 && hi < 0) return finish(findRootBrent(residual, lo, hi, ROOT_TOLERANCE));
  }

  const bound = lcaoOptimizedZeta({ za, zb, distanceBohr, state: state === 'sigma-u' ? 'antibonding' : 'bonding' }).electronicHartree;
  // upper end: at or just above the variational bound (they meet at large R)
  let hi = bound;
  let margin = 1e-9 * (1 + Math.abs(bound));
  for (let i = 0; residual(hi) <= 0; i++) {
    if (i > 40 || hi + margin >= 0) throw new Error(`exactOneElectronEnergy: no bracket above the variational bound at R = ${distanceBohr}`);
    hi = bound + margin;
    margin *= 4;
  }
  // lower end: step down until the residual is negative (it is, all the way to the united atom)
  const unitedAtom = -((za + zb) ** 2) / 2;
  let step = 0.02 * (1 + Math.abs(bound));
  let lo = hi - step;
  while (residual(lo) >= 0) {
    if (lo <= unitedAtom - 1) throw new Error(`exactOneElectronEnergy: no bracket below the variational bound at R = ${distanceBohr}`);
    hi = lo;
    step *= 2;
    lo = Math.max(lo - step, unitedAtom - 1);
  }
  return finish(findRootBrent(residual, lo, hi, ROOT_TOLERANCE));
}

export function exactOneElectronEnergy(input: ExactInput): ExactEnergy {
  return solveExactEnergy(input);
}
