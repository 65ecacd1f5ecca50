/**
 * ψ² of a minimal-LCAO bonding or antibonding orbital sampled along the bond
 * axis (A at −R/2, B at +R/2), for plots: the charge build-up of σg between the
 * nuclei, the nodal plane of σu at the midpoint.
 * Source: the orbital of lcaoOrbital (Pauling & Wilson 1935 ch. XII §42); density
 * ρ = |ψ|² (Born interpretation).
 */
import { lcaoOrbital } from './lcao-orbital';
import type { DensityLine, DensityLineInput } from './types';

export function orbitalDensityLine({ from, to, points, ...orbitalInput }: DensityLineInput): DensityLine {
  if (!Number.isFinite(from) || !Number.isFinite(to) || from === to) throw new RangeError(`from and to must be finite and different, got ${from}, ${to}`);
  if (!Number.isInteger(points) || points < 2) throw new RangeError(`points must be an integer ≥ 2, got ${points}`);
  const orbital = lcaoOrbital(orbitalInput);
  const zBohr: number[] = new Array(points);
  const density: number[] = new Array(points);
  for (let i = 0; i < points; i++) {
    const z = i === points - 1 ? to : from + ((to - from) * i) / (points - 1);
    const psi = orbital.valueAt(z, 0);
    zBohr[i] = z;
    density[i] = psi * psi;
  }
  return { zBohr, density };
}
