/**
 * Exponential integral E1(x) = ∫_x^∞ e^(−t)/t dt for x > 0.
 *
 * Source: Abramowitz & Stegun (1964) 5.1.11, E1(x) = −γ − ln x − Σ_{k≥1} (−x)^k/(k·k!),
 * for 0 < x ≤ 1, and the continued fraction A&S 5.1.22 (Numerical Recipes,
 * 3rd ed., §6.3) for x > 1. Relative accuracy about 1e−15 over the whole range
 * (E1 has no zero on x > 0, so relative accuracy is meaningful everywhere).
 * Check values: A&S Table 5.1 (E1(1) = 0.2193839344).
 */
import { EULER_GAMMA } from './euler-gamma';
import { einPowerSeries } from './ein-power-series';
import { scaledE1ContinuedFraction } from './e1-continued-fraction';

export function exponentialIntegralE1(x: number): number {
  if (!(x > 0)) {
    if (x === 0) return Infinity;
    throw new RangeError(`exponentialIntegralE1: x must be > 0, got ${x}`);
  }
  if (x === Infinity) return 0;
  if (x <= 1) return -EULER_GAMMA - Math.log(x) + einPowerSeries(x);
  return Math.exp(-x) * scaledE1ContinuedFraction(x);
}
