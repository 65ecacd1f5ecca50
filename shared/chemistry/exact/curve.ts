/**
 * Exact one-electron two-centre energies on a list of distances, each point
 * warm-started from its neighbours (energy extrapolated linearly, separation
 * constant reused) and falling back to the variational bracket when the warm
 * bracket does not hold.
 * Source: as exactOneElectronEnergy (Bates, Ledsham & Stewart 1953).
 */
import { solveExactEnergy } from './one-electron-energy';
import type { ExactState } from './types';

export interface ExactCurveInput {
  za: number;
  zb: number;
  state?: ExactState;
  distancesBohr: readonly number[];
}

export interface ExactCurve {
  distanceBohr: number[];
  electronicHartree: number[];
  totalHartree: number[];
  separationConstant: number[];
}

export function exactCurve({ za, zb, state = 'sigma-g', distancesBohr }: ExactCurveInput): ExactCurve {
  const distanceBohr = [...distancesBohr];
  const n = distanceBohr.length;
  const out: ExactCurve = {
    distanceBohr,
    electronicHartree: new Array(n),
    totalHartree: new Array(n),
    separationConstant: new Array(n),
  };
  let lastMiss = Number.NaN; // |actual − predicted| at the previous point
  for (let i = 0; i < n; i++) {
    let warm: { electronicHartree: number; separationConstant: number; step?: number } | undefined;
    let predicted = Number.NaN;
    if (i >= 1) {
      const r0 = distanceBohr[i - 1];
      const e0 = out.electronicHartree[i - 1];
      const dr = distanceBohr[i] - r0;
      let slope = 0;
      if (i >= 2 && distanceBohr[i - 2] !== r0) slope = (e0 - out.electronicHartree[i - 2]) / (r0 - distanceBohr[i - 2]);
      predicted = e0 + slope * dr;
      // linear extrapolation misses by ~E''·dr²/2: scale the last miss, or the step itself when unknown
      const halfWidth = Number.isFinite(lastMiss) && i >= 3 ? 3 * lastMiss + 1e-9 : Math.abs(slope * dr) + 0.05 * Math.abs(dr);
      warm = { electronicHartree: predicted, separationConstant: out.separationConstant[i - 1], step: halfWidth };
    }
    const point = solveExactEnergy({ za, zb, distanceBohr: distanceBohr[i], state }, warm);
    out.electronicHartree[i] = point.electronicHartree;
    out.totalHartree[i] = point.totalHartree;
    out.separationConstant[i] = point.separationConstant;
    lastMiss = Number.isFinite(predicted) ? Math.abs(point.electronicHartree - predicted) : Number.NaN;
  }
  return out;
}
