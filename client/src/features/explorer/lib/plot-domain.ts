/**
 * Axis ranges for potential-energy curves. Curves rise steeply at short R
 * (the nuclear repulsion grows as 1/R), so an automatic range would squash
 * the well into a line; we show from just below the lowest point to a little
 * above the long-distance end, letting the steep wall leave the frame.
 */

export interface DomainSeries {
  x: readonly number[];
  y: readonly number[];
}

/**
 * [lower, upper] of the y axis for curves, in the series' own unit: from just
 * under the lowest point up to `headroom` well depths above the lowest
 * long-distance end (so that an antibonding curve shows over a good stretch),
 * and at least up to the highest long-distance end; never above the data.
 */
export function curveEnergyDomain(series: readonly DomainSeries[], headroom = 2): [number, number] {
  let lowest = Infinity;
  let highest = -Infinity;
  let tailLowest = Infinity;
  let tailHighest = -Infinity;
  for (const s of series) {
    let lastX = -Infinity;
    let lastY = NaN;
    s.y.forEach((y, i) => {
      if (!Number.isFinite(y) || !Number.isFinite(s.x[i])) return;
      lowest = Math.min(lowest, y);
      highest = Math.max(highest, y);
      if (s.x[i] > lastX) {
        lastX = s.x[i];
        lastY = y;
      }
    });
    if (Number.isFinite(lastY)) {
      tailHighest = Math.max(tailHighest, lastY);
      tailLowest = Math.min(tailLowest, lastY);
    }
  }
  if (!Number.isFinite(lowest)) return [0, 1];
  let upper = highest;
  if (Number.isFinite(tailLowest) && tailLowest > lowest) upper = Math.min(highest, Math.max(tailHighest, tailLowest + headroom * (tailLowest - lowest)));
  if (!(upper > lowest)) upper = lowest + Math.max(Math.abs(lowest) * 0.05, 1e-6);
  const pad = (upper - lowest) * 0.05;
  return [lowest - pad, upper + pad];
}

/** [min, max] over all finite values, padded a little (for positive quantities like S or ψ², from 0 when all are ≥ 0). */
export function plainDomain(series: readonly DomainSeries[], fromZero = true): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const s of series) for (const y of s.y) if (Number.isFinite(y)) (lo = Math.min(lo, y)), (hi = Math.max(hi, y));
  if (!Number.isFinite(lo)) return [0, 1];
  if (fromZero && lo >= 0) lo = 0;
  if (hi === lo) return [lo - 1, hi + 1];
  const pad = (hi - lo) * 0.04;
  return [fromZero && lo === 0 ? 0 : lo - pad, hi + pad];
}

/** [min, max] of x over all series. */
export function xExtent(series: readonly DomainSeries[]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const s of series) for (const x of s.x) if (Number.isFinite(x)) (lo = Math.min(lo, x)), (hi = Math.max(hi, x));
  return Number.isFinite(lo) ? [lo, hi] : [0, 1];
}

/**
 * About `count` round tick values covering [lo, hi] (steps of 1, 2, 2.5 or 5 × 10ⁿ),
 * the usual "nice numbers" rule (Heckbert, Graphics Gems, 1990).
 */
export function niceTicks(lo: number, hi: number, count = 6): number[] {
  if (!(hi > lo) || !Number.isFinite(lo) || !Number.isFinite(hi)) return [lo];
  const raw = (hi - lo) / Math.max(1, count);
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const first = Math.ceil(lo / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let t = first; t <= hi + step * 1e-9; t += step) ticks.push(Number(t.toPrecision(12)));
  return ticks;
}
