/**
 * A potential-energy curve of one model on a list of distances (in the order given).
 * Fast paths: the homonuclear fixed-ζ LCAO curve uses the closed form
 * E± = (Haa ± Hab)/(1 ± S) + Z²/R written out for a whole grid (homonuclear-lcao-curve.ts;
 * Pauling & Wilson 1935, ch. XII §42 — the 2×2 problem reduces to it exactly when Za = Zb); other LCAO
 * curves go through lcaoCurve, H2 curves through h2Curve (optimized ζ warm-started
 * from the previous point), exact curves through exactCurve (energy and separation
 * constant warm-started from the previous points; Bates, Ledsham & Stewart 1953).
 */
import { exactCurve } from '@shared/chemistry/exact';
import { h2Curve } from '@shared/chemistry/h2';
import { lcaoCurve } from '@shared/chemistry/lcao';
import { homonuclearLcaoCurve } from './homonuclear-lcao-curve';
import { exactStateOf, h2MethodOf, h2StateOf } from './model-mapping';
import type { CurveModelParams, CurveResult } from './types';
import { validateCurveParams, validateDistance } from './validate-curve-params';

export function curve(p: CurveModelParams, distancesBohr: readonly number[]): CurveResult {
  validateCurveParams(p);
  if (!Array.isArray(distancesBohr)) throw new RangeError('distances must be an array of numbers (bohr).');
  for (let i = 0; i < distancesBohr.length; i++) {
    const r = distancesBohr[i];
    if (!(typeof r === 'number' && r > 0 && r < Infinity)) validateDistance(r, `R[${i}]`); // throws, naming the point
  }
  const { model, za, zb, zeta, state } = p;

  if (model === 'exact') {
    const c = exactCurve({ za, zb, state: exactStateOf(state), distancesBohr });
    return { distanceBohr: c.distanceBohr, energyHartree: c.totalHartree, electronicHartree: c.electronicHartree };
  }

  if (model === 'lcao') {
    if (zeta !== 'opt' && za === zb) return homonuclearLcaoCurve(za, zeta, state === 'bonding', distancesBohr);
    return lcaoCurve({ za, zb, zeta, state, distancesBohr });
  }

  const points = h2Curve({ method: h2MethodOf(model), zeta, state: h2StateOf(state), distancesBohr });
  const n = points.length;
  const out: CurveResult = { distanceBohr: new Array(n), energyHartree: new Array(n), electronicHartree: new Array(n) };
  const zetas: number[] | undefined = zeta === 'opt' ? new Array(n) : undefined;
  for (let i = 0; i < n; i++) {
    out.distanceBohr[i] = points[i].distanceBohr;
    out.energyHartree[i] = points[i].totalHartree;
    out.electronicHartree[i] = points[i].electronicHartree;
    if (zetas) zetas[i] = points[i].zeta;
  }
  if (zetas) out.zeta = zetas;
  return out;
}
