/**
 * Entire exponential integral Ein(x) = ∫_0^x (1 − e^(−t))/t dt, real x
 * (NIST DLMF 6.2.3: Ein(x) = Σ_{k≥1} (−1)^(k−1) x^k/(k·k!) = E1(x) + ln x + γ
 * for x > 0, DLMF 6.2.7; and Ein(−x) = γ + ln x − Ei(x) for x > 0, A&S 5.1.10).
 *
 * Ein is what remains of E1 (or Ei) once the logarithm and γ are taken out;
 * formulas in which the logarithms cancel (two-centre integrals at short
 * distance) need it without that cancellation.
 * Power series for −40 ≤ x ≤ 2; outside, the relations above (no
 * cancellation there: all terms have the same sign). Accuracy about 1e−15
 * relative.
 */
import { EULER_GAMMA } from './euler-gamma';
import { einPowerSeries } from './ein-power-series';
import { exponentialIntegralE1 } from './exponential-integral-e1';
import { exponentialIntegralEi } from './exponential-integral-ei';

export function exponentialIntegralEin(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x > 2) return EULER_GAMMA + Math.log(x) + exponentialIntegralE1(x);
  if (x < -40) return EULER_GAMMA + Math.log(-x) - exponentialIntegralEi(-x);
  return einPowerSeries(x);
}
