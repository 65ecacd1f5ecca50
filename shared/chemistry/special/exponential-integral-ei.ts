/**
 * Exponential integral Ei(x) = −P.V.∫_{−x}^∞ e^(−t)/t dt for real x ≠ 0,
 * with Ei(−x) = −E1(x) for x > 0 (A&S 5.1.7).
 *
 * Source for x > 0: A&S 5.1.10, Ei(x) = γ + ln x + Σ_{k≥1} x^k/(k·k!), summed
 * while x ≤ 40 (all terms positive, no cancellation in the sum), and the
 * asymptotic series Ei(x) ~ (e^x/x) Σ_{k≥0} k!/x^k (A&S 5.1.51) for x > 40,
 * truncated at its smallest term, which there is below 1e−16 — the scheme of
 * Numerical Recipes, 3rd ed., §6.3 (routine `ei`).
 * Accuracy: about 1e−15 relative, except close to the zero of Ei at
 * x₀ = 0.3725074107813666 where it is about 1e−16 absolute.
 */
import { EULER_GAMMA } from './euler-gamma';
import { einPowerSeries } from './ein-power-series';
import { exponentialIntegralE1 } from './exponential-integral-e1';

const ASYMPTOTIC_FROM = 40;

export function exponentialIntegralEi(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x === 0) return -Infinity;
  if (x < 0) return -exponentialIntegralE1(-x);
  if (x <= ASYMPTOTIC_FROM) return EULER_GAMMA + Math.log(x) - einPowerSeries(-x);
  // asymptotic: (e^x/x)(1 + 1/x + 2/x² + …), stop at the smallest term
  let sum = 1;
  let term = 1;
  for (let k = 1; k < 100; k++) {
    const previous = term;
    term *= k / x;
    if (term > previous || term < 1e-17 * sum) break;
    sum += term;
  }
  return (Math.exp(x) / x) * sum;
}
