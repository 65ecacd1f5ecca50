/**
 * A CurveReference for a curve model on any list of distances (the command line marks a file
 * against a model without an exercise: the grid is the file's own R values). Same content as
 * computeReference in shared/exercises/reference.ts: curves from shared/chemistry/curves, the
 * model's minimum (Brent over R), its dissociation limit, and ωe = √(k/μ) with k = d²E/dR² at Re by
 * a central difference, h = 1e−3 a0 (Herzberg, Spectra of Diatomic Molecules, 2nd ed., ch. III).
 */
import { harmonicWavenumber } from '@shared/chemistry/analysis';
import { curve, curveMinimum, curvePoint, dissociationLimit, type CurveModelParams, type CurveState } from '@shared/chemistry/curves';
import type { CurveReference } from '@shared/exercises/reference';
import { referenceReducedMassMe } from './context';

const labels: Record<CurveState, string> = { bonding: 'bonding', antibonding: 'antibonding' };

export function curveReferenceAt(
  params: Omit<CurveModelParams, 'state'>,
  states: CurveState[],
  distanceBohr: readonly number[],
  options: { isotopes?: [string, string] } = {},
): CurveReference {
  const bohr = [...new Set(distanceBohr.filter((r) => Number.isFinite(r) && r > 0))].sort((a, b) => a - b);
  const curves = states.map((state) => ({ state, label: labels[state], energyHartree: curve({ ...params, state }, bohr).energyHartree }));
  const first: CurveModelParams = { ...params, state: states.includes('bonding') ? 'bonding' : states[0] };
  const minimum = curveMinimum(first);
  const isotopes = options.isotopes ?? ['1H', '1H'];
  const reference: CurveReference = {
    kind: 'curve',
    model: params.model,
    params,
    grid: { unit: 'bohr', values: bohr, bohr },
    curves,
    minimum,
    dissociationLimitHartree: dissociationLimit(first),
    harmonicWavenumberCm1: null,
    isotopes,
    antibondingRepulsive: states.includes('antibonding') ? curveMinimum({ ...params, state: 'antibonding' }) === null : null,
  };
  if (minimum) {
    const h = 1e-3;
    const e = (r: number) => curvePoint(first, r).energyHartree;
    const k = (e(minimum.reBohr + h) - 2 * e(minimum.reBohr) + e(minimum.reBohr - h)) / (h * h);
    if (k > 0) reference.harmonicWavenumberCm1 = harmonicWavenumber({ curvatureHartreePerBohr2: k, reducedMassMe: referenceReducedMassMe(reference, isotopes) });
  }
  return reference;
}
