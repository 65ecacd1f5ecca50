/**
 * Energy of one curve model at one distance, through the model's own functions:
 * lcao — lcaoEnergies / lcaoOptimizedZeta (Pauling & Wilson 1935 ch. XII §42;
 * Finkelstein & Horowitz, Z. Phys. 48 (1928) 118); exact — exactOneElectronEnergy
 * (Bates, Ledsham & Stewart, Phil. Trans. R. Soc. A 246 (1953) 215); h2-* —
 * h2Energy / h2OptimizedZeta (Coulson 1938, Weinbaum 1933, Heitler & London 1927).
 * `zetaGuess` warm-starts an optimized exponent (e.g. from a neighbouring distance).
 */
import { exactOneElectronEnergy } from '@shared/chemistry/exact';
import { h2Energy, h2OptimizedZeta } from '@shared/chemistry/h2';
import { lcaoEnergies, lcaoOptimizedZeta } from '@shared/chemistry/lcao';
import { exactStateOf, h2MethodOf, h2StateOf } from './model-mapping';
import type { CurveModelParams, CurvePointResult } from './types';
import { validateCurveParams, validateDistance } from './validate-curve-params';

export function curvePoint(p: CurveModelParams, distanceBohr: number, options: { zetaGuess?: number } = {}): CurvePointResult {
  validateCurveParams(p);
  validateDistance(distanceBohr);
  return curvePointUnchecked(p, distanceBohr, options.zetaGuess);
}

/** Internal: same as curvePoint without the input checks (callers have validated). */
export function curvePointUnchecked(p: CurveModelParams, distanceBohr: number, zetaGuess?: number): CurvePointResult {
  const { model, za, zb, zeta, state } = p;
  if (model === 'exact') {
    const e = exactOneElectronEnergy({ za, zb, distanceBohr, state: exactStateOf(state) });
    return { energyHartree: e.totalHartree, electronicHartree: e.electronicHartree };
  }
  if (model === 'lcao') {
    if (zeta === 'opt') {
      const best = lcaoOptimizedZeta({ za, zb, distanceBohr, state, zetaGuess });
      return { energyHartree: best.energyHartree, electronicHartree: best.electronicHartree, zeta: best.zeta };
    }
    const e = lcaoEnergies({ za, zb, zeta, distanceBohr });
    return state === 'bonding'
      ? { energyHartree: e.bondingHartree, electronicHartree: e.bondingElectronicHartree }
      : { energyHartree: e.antibondingHartree, electronicHartree: e.antibondingElectronicHartree };
  }
  const method = h2MethodOf(model);
  const h2State = h2StateOf(state);
  if (zeta === 'opt') {
    const best = h2OptimizedZeta({ method, distanceBohr, state: h2State, zetaGuess });
    return { energyHartree: best.totalHartree, electronicHartree: best.electronicHartree, zeta: best.zeta };
  }
  const e = h2Energy({ method, zeta, distanceBohr, state: h2State });
  return { energyHartree: e.totalHartree, electronicHartree: e.electronicHartree };
}
