/**
 * Scaled exponential integral e^x · E1(x) for x > 0 (finite for every x;
 * tends to 1/x as x → ∞), for formulas that pair E1 with a growing
 * exponential and would otherwise overflow or underflow.
 *
 * Source: as exponentialIntegralE1 — A&S 5.1.11 for 0 < x ≤ 1 and the
 * continued fraction A&S 5.1.22 (Numerical Recipes, 3rd ed., §6.3) for x > 1.
 */
import { EULER_GAMMA } from './euler-gamma';
import { einPowerSeries } from './ein-power-series';
import { scaledE1ContinuedFraction } from './e1-continued-fraction';

export function scaledExponentialIntegralE1(x: number): number {
  if (!(x > 0)) {
    if (x === 0) return Infinity;
    throw new RangeError(`scaledExponentialIntegralE1: x must be > 0, got ${x}`);
  }
  if (x === Infinity) return 0;
  if (x <= 1) return Math.exp(x) * (-EULER_GAMMA - Math.log(x) + einPowerSeries(x));
  return scaledE1ContinuedFraction(x);
}
