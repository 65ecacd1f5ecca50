/**
 * Power series of the entire exponential integral
 *   Ein(x) = ∫_0^x (1 − e^(−t))/t dt = Σ_{k≥1} (−1)^(k−1) x^k / (k · k!)
 * (NIST DLMF 6.2.3 and 6.6.4; Abramowitz & Stegun 5.1.11 rearranged).
 *
 * Private helper of the exponential-integral modules. Summed term by term
 * until the next term no longer changes the sum. For x ≥ 0 the series
 * alternates; it is used there only for x ≤ 2, where the largest term is 1
 * and no more than a few units of rounding are lost. For x < 0 every term has
 * the same sign and there is no cancellation at all.
 */
export function einPowerSeries(x: number): number {
  if (x === 0) return 0;
  let power = x; // (−1)^(k−1) x^k / k!  at k = 1
  let sum = x;
  for (let k = 2; k < 500; k++) {
    power *= -x / k;
    const term = power / k;
    const next = sum + term;
    if (next === sum) return sum;
    sum = next;
  }
  return sum;
}
