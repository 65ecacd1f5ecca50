/**
 * Units from magnitudes when no header, template or user names them, and the energy convention
 * (total or relative). The rules are heuristics for the one- and two-electron bonds Bondmark
 * sets (H2+, H2 and their variants); every guess is reported as a warning. See CONTEXT.md.
 *
 * Physical anchors (common practice / textbook values, from memory):
 * - every model dissociates to at least one hydrogen-like atom, E ≤ −0.5 Eh (H 1s = −½ Eh), so a
 *   total energy at the largest distance lies at or below about −0.5 Eh;
 * - well depths of these bonds are 0.06–0.18 Eh (H2+ LCAO 1.76 eV … H2 exact 4.75 eV);
 * - equilibrium distances are 1.4–2.5 bohr = 0.74–1.32 Å.
 */
import {
  energyToHartree,
  energyUnits,
  type DistanceUnit,
  type EnergyUnit,
} from '@shared/chemistry/units';
import type { EnergyConvention } from './types';

/** a total energy at the largest distance is below this; a relative one above (Eh) */
export const CONVENTION_THRESHOLD_HARTREE = -0.25;
/** typical well depth for scoring unit candidates (Eh) */
const TYPICAL_DEPTH_HARTREE = 0.1;
/** plausible well depth range (Eh) */
const DEPTH_RANGE_HARTREE: [number, number] = [0.005, 0.6];

export interface CurveShape {
  /** value at the largest distance */
  last: number;
  min: number;
  max: number;
  /** index of the minimum, and whether it lies inside the grid (a well) */
  minIndex: number;
  interior: boolean;
  /** depth of the well measured from the last point (0 without a well) */
  depth: number;
}

/** values must be ordered by ascending distance */
export function curveShape(values: number[]): CurveShape {
  let min = Infinity;
  let max = -Infinity;
  let minIndex = 0;
  values.forEach((v, i) => {
    if (v < min) {
      min = v;
      minIndex = i;
    }
    if (v > max) max = v;
  });
  const last = values[values.length - 1];
  const interior = minIndex > 0 && minIndex < values.length - 1;
  return { last, min, max, minIndex, interior, depth: interior ? last - min : 0 };
}

/**
 * Convention rule: relative when the energy at the largest distance, in hartree, is above
 * −0.25 Eh (halfway between 0 and the −0.5 Eh that any total energy of these models reaches
 * there); total otherwise.
 */
export function conventionOf(lastHartree: number): EnergyConvention {
  return lastHartree > CONVENTION_THRESHOLD_HARTREE ? 'relative' : 'total';
}

/** the column whose curve has the deepest well (else the first): it decides units and convention */
export function mainCurveIndex(columns: number[][]): number {
  let best = 0;
  let bestDepth = -Infinity;
  columns.forEach((values, i) => {
    const shape = curveShape(values);
    if (shape.interior && shape.depth > bestDepth) {
      best = i;
      bestDepth = shape.depth;
    }
  });
  return best;
}

export interface EnergyGuess {
  unit: EnergyUnit;
  /** false when no unit gave plausible numbers (the default hartree was taken) */
  plausible: boolean;
}

/**
 * Energy unit from magnitudes: each unit is tried on the main curve; readings whose well depth or
 * dissociation value are impossible for these bonds are dropped (total: last value between −50
 * and −0.25 Eh; relative: minimum above −0.6 Eh, last point no further below zero than half the
 * well, repulsive wall under 20 Eh); of the rest, the one whose well depth is nearest (on a log
 * scale) to 0.1 Eh wins; without a well, the one whose last value is nearest −0.75 Eh (total)
 * or whose span is nearest 0.5 Eh (relative).
 */
export function guessEnergyUnit(values: number[]): EnergyGuess {
  let best: { unit: EnergyUnit; score: number } | null = null;
  for (const unit of energyUnits) {
    const shape = curveShape(values.map((v) => energyToHartree(v, unit)));
    const depthOk = !shape.interior || (shape.depth >= DEPTH_RANGE_HARTREE[0] && shape.depth <= DEPTH_RANGE_HARTREE[1]);
    let score: number;
    if (conventionOf(shape.last) === 'total') {
      if (!(shape.last >= -50) || !depthOk) continue;
      score = shape.interior ? Math.abs(Math.log(shape.depth / TYPICAL_DEPTH_HARTREE)) : Math.abs(Math.log(-shape.last / 0.75));
    } else {
      const approachesZero = shape.last >= -0.5 * Math.abs(shape.min) - 0.02;
      if (!(shape.min >= -0.6) || !approachesZero || !depthOk || shape.max > 20) continue;
      const span = shape.max - shape.min;
      score = shape.interior ? Math.abs(Math.log(shape.depth / TYPICAL_DEPTH_HARTREE)) : span > 0 ? Math.abs(Math.log(span / 0.5)) : 10;
    }
    if (!best || score < best.score) best = { unit, score };
  }
  return best ? { unit: best.unit, plausible: true } : { unit: 'hartree', plausible: false };
}

/** distance ranges per unit (brief: 0.3–20 bohr, 0.2–10 Å, 20–1000 pm; with a little slack) */
const DISTANCE_RANGES: Record<DistanceUnit, [number, number]> = {
  bohr: [0.25, 25],
  angstrom: [0.15, 12],
  pm: [15, 1200],
};
/** equilibrium distances of these bonds: above this in Å would be above 2.5 bohr; below in bohr, under 0.74 Å */
const MINIMUM_POSITION_SPLIT = 1.36;

export interface DistanceGuess {
  unit: DistanceUnit;
  /** how it was decided, for the warning */
  reason: string;
}

/**
 * Distance unit from magnitudes: the units whose usual range holds every distance; pm stands
 * alone. Between bohr and Å: a grid reaching beyond 5.5 is in bohr (Å grids stop near 5);
 * otherwise the position of the well of the main curve decides (below 1.36 → Å, as equilibrium
 * distances of these bonds are 0.74–1.32 Å and 1.4–2.5 bohr); then hartree energies suggest bohr;
 * else bohr.
 */
export function guessDistanceUnit(distances: number[], mainEnergies: number[], energyUnit: EnergyUnit | null): DistanceGuess {
  const [min, max] = extent(distances);
  const fits = (Object.keys(DISTANCE_RANGES) as DistanceUnit[]).filter(
    (u) => min >= DISTANCE_RANGES[u][0] && max <= DISTANCE_RANGES[u][1],
  );
  if (fits.length === 1) return { unit: fits[0], reason: `only ${fits[0] === 'pm' ? 'pm' : fits[0] === 'bohr' ? 'bohr' : 'Å'} fits the range` };
  if (fits.length === 0) {
    // nearest range on a log scale
    let best: DistanceUnit = 'bohr';
    let bestScore = Infinity;
    for (const u of Object.keys(DISTANCE_RANGES) as DistanceUnit[]) {
      const [lo, hi] = DISTANCE_RANGES[u];
      const score = Math.max(0, Math.log(lo / min)) + Math.max(0, Math.log(max / hi));
      if (score < bestScore) [best, bestScore] = [u, score];
    }
    return { unit: best, reason: 'the numbers fit no usual range, the nearest was taken' };
  }
  if (fits.includes('pm')) return { unit: 'pm', reason: 'the range fits pm' };
  if (max > 5.5) return { unit: 'bohr', reason: 'the grid reaches beyond 5.5' };
  const shape = curveShape(mainEnergies);
  if (shape.interior) {
    const position = wellPosition(distances, mainEnergies, shape.minIndex);
    return position < MINIMUM_POSITION_SPLIT
      ? { unit: 'angstrom', reason: `the well lies at ${round(position)}, a bond length in Å` }
      : { unit: 'bohr', reason: `the well lies at ${round(position)}, a bond length in bohr` };
  }
  if (energyUnit === 'hartree') return { unit: 'bohr', reason: 'the energies are in hartree' };
  return { unit: 'bohr', reason: 'bohr is the default' };
}

/** vertex of the parabola through the lowest point and its neighbours (distances ascending) */
function wellPosition(x: number[], y: number[], i: number): number {
  const [x0, x1, x2] = [x[i - 1], x[i], x[i + 1]];
  const [y0, y1, y2] = [y[i - 1], y[i], y[i + 1]];
  const denominator = (x0 - x1) * (x0 - x2) * (x1 - x2);
  const a = (x2 * (y1 - y0) + x1 * (y0 - y2) + x0 * (y2 - y1)) / denominator;
  const b = (x2 * x2 * (y0 - y1) + x1 * x1 * (y2 - y0) + x0 * x0 * (y1 - y2)) / denominator;
  const vertex = -b / (2 * a);
  return Number.isFinite(vertex) && vertex > x0 && vertex < x2 ? vertex : x1;
}

function round(v: number): string {
  return String(Math.round(v * 100) / 100);
}

/** [min, max] without spreading (arrays may hold 100 000 values) */
export function extent(values: number[]): [number, number] {
  let min = Infinity;
  let max = -Infinity;
  for (const v of values) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return [min, max];
}
