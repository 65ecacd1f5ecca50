/**
 * The energy a curve model is measured against for De (R → ∞, hartree):
 * - lcao: the separated-atom energies of the same basis, ζ²/2 − Zζ on each centre
 *   (−Z²/2 with ζ optimized); lower root → the larger charge (lcaoDissociationLimit).
 * - exact: hydrogen-like −Z²/2 of the larger charge, for σg and σu alike (exactDissociationLimit).
 * - h2-*: two H atoms in the same 1s basis, ζ² − 2ζ (−1 Eh for ζ = 1 or optimized),
 *   for the ground state and the triplet. The simple-MO curve itself tends to a higher
 *   limit (its σg² keeps an ionic half, Coulson & Fischer, Phil. Mag. 40 (1949) 386),
 *   but its De is still measured against two atoms, the usual convention that gives
 *   the textbook 2.70 eV (Levine, Quantum Chemistry, ch. 13); see h2DissociationLimit.
 */
import { exactDissociationLimit } from '@shared/chemistry/exact';
import { h2DissociationLimit } from '@shared/chemistry/h2';
import { lcaoDissociationLimit } from '@shared/chemistry/lcao';
import { h2MethodOf, h2StateOf } from './model-mapping';
import type { CurveModelParams } from './types';
import { validateCurveParams } from './validate-curve-params';

export function dissociationLimit(p: CurveModelParams): number {
  validateCurveParams(p);
  const { model, za, zb, zeta, state } = p;
  if (model === 'exact') return exactDissociationLimit({ za, zb });
  if (model === 'lcao') {
    const limit = lcaoDissociationLimit({ za, zb, zeta });
    return state === 'bonding' ? limit.bondingHartree : limit.antibondingHartree;
  }
  return h2DissociationLimit({ method: h2MethodOf(model), zeta, state: h2StateOf(state) }).separatedAtomsHartree;
}
