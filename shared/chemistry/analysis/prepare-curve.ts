/**
 * Turns raw curve data into the form every analysis function works on: finite
 * points only, sorted by distance, coincident distances merged.
 *
 * Method: plain data cleaning (no published formula). Points with a missing,
 * non-finite or non-positive distance, or a missing or non-finite energy, are
 * skipped and counted; points at exactly the same distance are replaced by one
 * point carrying their mean energy (a least-squares fit would weigh them the
 * same way) and counted as merged.
 */

/** Raw curve data as a caller supplies it: two parallel arrays, any order, holes allowed. */
export interface CurvePoints {
  distanceBohr: ArrayLike<number | null | undefined>;
  energyHartree: ArrayLike<number | null | undefined>;
}

/** Cleaned curve: finite, strictly increasing distances. Produced only by `prepareCurve`. */
export interface PreparedCurve {
  readonly kind: 'prepared-curve';
  readonly distanceBohr: Float64Array;
  readonly energyHartree: Float64Array;
  /** usable points after cleaning (length of both arrays) */
  readonly count: number;
  /** points dropped as missing, not finite, or at a non-positive distance */
  readonly pointsSkipped: number;
  /** points removed by merging coincident distances */
  readonly duplicatesMerged: number;
}

export type CurveInput = CurvePoints | PreparedCurve;

/** Fewest usable points any curve analysis accepts. */
export const MIN_USABLE_POINTS = 5;

function isPrepared(input: CurveInput): input is PreparedCurve {
  return (input as PreparedCurve).kind === 'prepared-curve';
}

export function prepareCurve(input: CurveInput): PreparedCurve {
  if (isPrepared(input)) return input;
  const { distanceBohr, energyHartree } = input;
  if (distanceBohr.length !== energyHartree.length) {
    throw new RangeError(
      `Curve arrays differ in length: ${distanceBohr.length} distances, ${energyHartree.length} energies.`,
    );
  }
  const total = distanceBohr.length;
  const x = new Float64Array(total);
  const y = new Float64Array(total);
  let usable = 0;
  let sorted = true;
  for (let i = 0; i < total; i++) {
    const r = distanceBohr[i];
    const e = energyHartree[i];
    if (typeof r !== 'number' || typeof e !== 'number' || !Number.isFinite(r) || !Number.isFinite(e) || r <= 0) continue;
    if (usable > 0 && r < x[usable - 1]) sorted = false;
    x[usable] = r;
    y[usable] = e;
    usable++;
  }
  const pointsSkipped = total - usable;
  let xs = x.subarray(0, usable);
  let ys = y.subarray(0, usable);
  if (!sorted) {
    const order = new Uint32Array(usable);
    for (let i = 0; i < usable; i++) order[i] = i;
    order.sort((a, b) => xs[a] - xs[b] || a - b);
    const xSorted = new Float64Array(usable);
    const ySorted = new Float64Array(usable);
    for (let i = 0; i < usable; i++) {
      xSorted[i] = xs[order[i]];
      ySorted[i] = ys[order[i]];
    }
    xs = xSorted;
    ys = ySorted;
  }
  // merge coincident distances (mean energy)
  let out = 0;
  for (let i = 0; i < usable; ) {
    let j = i + 1;
    let sum = ys[i];
    while (j < usable && xs[j] === xs[i]) sum += ys[j++];
    xs[out] = xs[i];
    ys[out] = sum / (j - i);
    out++;
    i = j;
  }
  return {
    kind: 'prepared-curve',
    distanceBohr: xs.slice(0, out),
    energyHartree: ys.slice(0, out),
    count: out,
    pointsSkipped,
    duplicatesMerged: usable - out,
  };
}

/** Throws a RangeError naming the usable count when a curve is too short to analyse. */
export function requireUsablePoints(curve: PreparedCurve, needed = MIN_USABLE_POINTS): void {
  if (curve.count < needed) {
    const dropped = curve.pointsSkipped + curve.duplicatesMerged;
    throw new RangeError(
      `Curve has ${curve.count} usable point${curve.count === 1 ? '' : 's'}` +
        (dropped > 0 ? ` (${curve.pointsSkipped} skipped as missing or not finite, ${curve.duplicatesMerged} merged as duplicates)` : '') +
        `; at least ${needed} are needed.`,
    );
  }
}
