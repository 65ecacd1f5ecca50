/**
 * The variant's reference energy at the distances a student used.
 *
 * - A student distance that lies on the exercise's grid (within 1e−9 relative, i.e. the template's
 *   own R values after unit conversion) takes the reference value computed there: exact, free.
 * - Any other distance inside the grid's range is, by default, computed with the model itself
 *   (`curve(params, distances)` from shared/chemistry/curves): exact, but it costs what the model
 *   costs (0.002–0.2 ms a point). The result is kept per reference object and distance list.
 * - With `mode: 'interpolate'` such a distance is interpolated instead from the grid values with
 *   the cubic through the four nearest grid points (Lagrange form; error bound
 *   |E''''|·(9/16)h⁴/4! for grid step h — Abramowitz & Stegun 25.2.14/25.2.15).
 * - Distances outside the grid's range get NaN: they are outside the common range and not compared.
 *
 * Per-reference data (sorted grid, values by state, computed off-grid energies) lives in a WeakMap
 * keyed by the Reference object, so marking many reports of one variant prepares it once.
 */
import { curve, type CurveState } from '@shared/chemistry/curves';
import type { CurveReference } from '@shared/exercises/reference';
import type { ReferenceEvaluation } from './types';

interface ReferenceCache {
  /** ascending grid distances, bohr */
  gridBohr: Float64Array;
  /** reference energies per state, in the order of gridBohr */
  energies: Map<CurveState, Float64Array>;
  /** off-grid energies computed with the model: "state|R1,R2,…" → energies (least recently used dropped) */
  computed: Map<string, Float64Array>;
  /** anything else a caller wants to keep per reference (analysis, classification) */
  memo: Map<string, unknown>;
  /** where each distance of a given distance array falls: grid index, OFF_GRID or OUT_OF_RANGE */
  placements: WeakMap<object, Int32Array>;
}

const OFF_GRID = -1;
const OUT_OF_RANGE = -2;

const caches = new WeakMap<CurveReference, ReferenceCache>();
const COMPUTED_LIMIT = 64;
const ON_GRID_RELATIVE = 1e-9;

export function referenceCache(reference: CurveReference): ReferenceCache {
  let cache = caches.get(reference);
  if (cache) return cache;
  const n = reference.grid.bohr.length;
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => reference.grid.bohr[a] - reference.grid.bohr[b]);
  const gridBohr = Float64Array.from(order, (i) => reference.grid.bohr[i]);
  const energies = new Map<CurveState, Float64Array>();
  for (const c of reference.curves) energies.set(c.state, Float64Array.from(order, (i) => c.energyHartree[i]));
  cache = { gridBohr, energies, computed: new Map(), memo: new Map(), placements: new WeakMap() };
  caches.set(reference, cache);
  return cache;
}

/** Keeps one value per reference object and key (computed on first use). */
export function memoize<T>(reference: CurveReference, key: string, compute: () => T): T {
  const memo = referenceCache(reference).memo;
  if (memo.has(key)) return memo.get(key) as T;
  const value = compute();
  memo.set(key, value);
  return value;
}

/** The distance range the reference covers, bohr. */
export function referenceRangeBohr(reference: CurveReference): [number, number] {
  const g = referenceCache(reference).gridBohr;
  return g.length === 0 ? [Number.NaN, Number.NaN] : [g[0], g[g.length - 1]];
}

/** Index of the last grid point ≤ r (−1 when r is below the grid). */
function lowerIndex(grid: Float64Array, r: number): number {
  let lo = -1;
  let hi = grid.length;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (grid[mid] <= r) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** Cubic through the four grid points nearest r (fewer when the grid is shorter). */
function interpolate(grid: Float64Array, values: Float64Array, r: number): number {
  const n = grid.length;
  if (n === 1) return values[0];
  const j = Math.max(0, lowerIndex(grid, r));
  const count = Math.min(4, n);
  const start = Math.max(0, Math.min(j - 1, n - count));
  let sum = 0;
  for (let a = start; a < start + count; a++) {
    let weight = 1;
    for (let b = start; b < start + count; b++) if (b !== a) weight *= (r - grid[b]) / (grid[a] - grid[b]);
    sum += weight * values[a];
  }
  return sum;
}

/**
 * Grid index of each distance (within 1e−9 relative), OFF_GRID inside the range, OUT_OF_RANGE
 * outside; kept per distance array object, so the columns of one report share the work. Ascending
 * distances (what pairColumns passes) are placed by one merge pass, others by bisection.
 */
function placementsOf(cache: ReferenceCache, distanceBohr: ArrayLike<number>): Int32Array {
  const key = typeof distanceBohr === 'object' ? (distanceBohr as object) : null;
  const known = key ? cache.placements.get(key) : undefined;
  if (known && known.length === distanceBohr.length) return known;
  const grid = cache.gridBohr;
  const n = distanceBohr.length;
  const placement = new Int32Array(n).fill(OUT_OF_RANGE);
  if (grid.length > 0) {
    const low = grid[0] * (1 - ON_GRID_RELATIVE);
    const high = grid[grid.length - 1] * (1 + ON_GRID_RELATIVE);
    let j = -1;
    let previous = Number.NEGATIVE_INFINITY;
    for (let i = 0; i < n; i++) {
      const r = distanceBohr[i];
      if (!(r >= low && r <= high)) continue;
      if (r >= previous) {
        while (j + 1 < grid.length && grid[j + 1] <= r) j++;
      } else {
        j = lowerIndex(grid, r);
      }
      previous = r;
      const tolerance = ON_GRID_RELATIVE * Math.max(1, r);
      if (j >= 0 && r - grid[j] <= tolerance) placement[i] = j;
      else if (j + 1 < grid.length && grid[j + 1] - r <= tolerance) placement[i] = j + 1;
      else placement[i] = OFF_GRID;
    }
  }
  if (key) cache.placements.set(key, placement);
  return placement;
}

export interface ReferenceAtDistances {
  /** reference energy at each given distance (hartree), NaN outside the grid's range or when it failed */
  energyHartree: Float64Array;
  /** distances inside the range */
  inRange: number;
  /** of those, how many were not grid points (computed or interpolated) */
  offGrid: number;
  /** why the model could not be evaluated, when it could not */
  failure: string | null;
}

/** Reference energies of one state at the given distances (bohr). The state must be one of reference.curves. */
export function referenceEnergiesAt(
  reference: CurveReference,
  state: CurveState,
  distanceBohr: ArrayLike<number>,
  mode: ReferenceEvaluation = 'exact',
): ReferenceAtDistances {
  const cache = referenceCache(reference);
  const grid = cache.gridBohr;
  const values = cache.energies.get(state);
  const n = distanceBohr.length;
  const out = new Float64Array(n).fill(Number.NaN);
  if (!values || grid.length === 0) return { energyHartree: out, inRange: 0, offGrid: 0, failure: `the reference has no ${state} curve` };
  const placement = placementsOf(cache, distanceBohr);
  const offIndex: number[] = [];
  let inRange = 0;
  for (let i = 0; i < n; i++) {
    const j = placement[i];
    if (j === OUT_OF_RANGE) continue;
    inRange++;
    if (j === OFF_GRID) offIndex.push(i);
    else out[i] = values[j];
  }
  let failure: string | null = null;
  if (offIndex.length > 0) {
    if (mode === 'interpolate') {
      for (const i of offIndex) out[i] = interpolate(grid, values, distanceBohr[i]);
    } else {
      const distances = offIndex.map((i) => distanceBohr[i]);
      const key = `${state}|${distances.join(',')}`;
      let energies = cache.computed.get(key);
      if (energies) {
        cache.computed.delete(key); // most recently used goes last
      } else {
        try {
          energies = Float64Array.from(curve({ ...reference.params, state }, distances).energyHartree);
        } catch (error) {
          failure = error instanceof Error ? error.message : String(error);
          energies = Float64Array.from(distances, (r) => interpolate(grid, values, r));
        }
      }
      cache.computed.set(key, energies);
      if (cache.computed.size > COMPUTED_LIMIT) cache.computed.delete(cache.computed.keys().next().value!);
      offIndex.forEach((i, k) => (out[i] = energies[k]));
    }
  }
  return { energyHartree: out, inRange, offGrid: offIndex.length, failure };
}
