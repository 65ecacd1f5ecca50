/**
 * ψ² of a minimal-LCAO bonding or antibonding orbital on a square grid in a
 * plane containing both nuclei (x along the bond, A at −R/2, B at +R/2; y
 * across it), for contour and heat-map plots.
 * Source: the orbital of lcaoOrbital (Pauling & Wilson 1935 ch. XII §42); density
 * ρ = |ψ|² (Born interpretation).
 */
import { assertPositive } from '@shared/chemistry/lcao/assert-positive';
import { lcaoOrbital } from './lcao-orbital';
import type { DensityPlane, DensityPlaneInput } from './types';

function axis(extent: number, n: number): number[] {
  // symmetric about 0 by construction, so an odd n puts a sample exactly on the midpoint
  return Array.from({ length: n }, (_, i) => (2 * i - (n - 1)) * (extent / (n - 1)));
}

export function orbitalDensityPlane({ extentBohr, nx, ny, ...orbitalInput }: DensityPlaneInput): DensityPlane {
  assertPositive('extentBohr', extentBohr);
  if (!Number.isInteger(nx) || nx < 2) throw new RangeError(`nx must be an integer ≥ 2, got ${nx}`);
  if (!Number.isInteger(ny) || ny < 2) throw new RangeError(`ny must be an integer ≥ 2, got ${ny}`);
  const orbital = lcaoOrbital(orbitalInput);
  const x = axis(extentBohr, nx);
  const y = axis(extentBohr, ny);
  const density = y.map((yj) =>
    x.map((xi) => {
      const psi = orbital.valueAt(xi, yj);
      return psi * psi;
    }),
  );
  return { x, y, density };
}
