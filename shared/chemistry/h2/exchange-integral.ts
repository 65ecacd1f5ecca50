/**
 * Exchange integral (ab|ab) of 1s Slater orbitals with one exponent ζ,
 * w = ζR (Y. Sugiura, Z. Phys. 45 (1927) 484; science.md §3):
 *   (ab|ab) = (ζ/5)[−e^(−2w)(−25/8 + 23w/4 + 3w² + w³/3)
 *             + (6/w)(S²(γ + ln w) − 2SS′·Ei(−2w) + S′²·Ei(−4w))]
 * with S = e^(−w)(1 + w + w²/3), S′ = e^(w)(1 − w + w²/3), γ Euler's constant.
 *
 * Two algebraically identical evaluations, chosen by w:
 * - w > 1 ("scaled"): with s = 1 + w + w²/3, s′ = 1 − w + w²/3 and
 *   ê(x) = e^x·E1(x), the whole expression is
 *   (ζ/5)e^(−2w)[25/8 − 23w/4 − 3w² − w³/3 + (6/w)(s²(γ + ln w) + 2ss′ê(2w) − s′²ê(4w))],
 *   free of overflow (S′ grows like e^w, Ei(−4w) falls like e^(−4w)).
 * - w ≤ 1 ("short range"): the logarithms and constants inside the second
 *   bracket cancel to O(w²) as w → 0. With Ein(x) = E1(x) + ln x + γ
 *   (DLMF 6.2.3), D = S − S′ and F = 2Ein(2w) − Ein(4w) the bracket is
 *   X = (γ + ln w)D² − 2ln2·S′D + S′[S′F + 2D·Ein(2w)],
 *   where D = −(8/3)Σ_{k≥2} k(k−1)w^(2k+1)/(2k+1)! (odd part of S, all
 *   terms one sign) and F = Σ_{n≥2} (−1)^n (4^n − 2^(n+1)) w^n/(n·n!) are
 *   summed as series, so the cancellation happens analytically.
 * Both branches agree to ~1e−15 at w = 1 (tested).
 */
import { EULER_GAMMA, exponentialIntegralEin, scaledExponentialIntegralE1 } from '../special';

const SHORT_RANGE_UP_TO = 1;

export function exchangeIntegral(zeta: number, distanceBohr: number): number {
  const w = zeta * distanceBohr;
  return w > SHORT_RANGE_UP_TO ? exchangeScaled(zeta, w) : exchangeShortRange(zeta, w);
}

function exchangeScaled(zeta: number, w: number): number {
  const s = 1 + w + (w * w) / 3;
  const sPrime = 1 - w + (w * w) / 3;
  const logarithmic =
    s * s * (EULER_GAMMA + Math.log(w)) +
    2 * s * sPrime * scaledExponentialIntegralE1(2 * w) -
    sPrime * sPrime * scaledExponentialIntegralE1(4 * w);
  const polynomial = 25 / 8 - (23 * w) / 4 - 3 * w * w - (w * w * w) / 3;
  return (zeta / 5) * Math.exp(-2 * w) * (polynomial + (6 / w) * logarithmic);
}

function exchangeShortRange(zeta: number, w: number): number {
  const overlap = Math.exp(-w) * (1 + w + (w * w) / 3);
  const overlapPrime = Math.exp(w) * (1 - w + (w * w) / 3);
  const difference = overlapDifferenceSeries(w);
  const ein2w = exponentialIntegralEin(2 * w);
  const combined = combinedEinSeries(w);
  const bracket =
    (EULER_GAMMA + Math.log(w)) * difference * difference -
    2 * Math.LN2 * overlapPrime * difference +
    overlapPrime * (overlapPrime * combined + 2 * difference * ein2w);
  const polynomial = 25 / 8 - (23 * w) / 4 - 3 * w * w - (w * w * w) / 3;
  return (zeta / 5) * (Math.exp(-2 * w) * polynomial + (6 / w) * bracket);
}

/** S − S′ = −(8/3) Σ_{k≥2} k(k−1) w^(2k+1)/(2k+1)!  (odd part of 2S; w ≤ 1). */
function overlapDifferenceSeries(w: number): number {
  const w2 = w * w;
  let power = (w2 * w2 * w) / 120; // w^5/5!
  let sum = 0;
  for (let k = 2; k < 60; k++) {
    const term = k * (k - 1) * power;
    const next = sum + term;
    if (next === sum) break;
    sum = next;
    power *= w2 / ((2 * k + 2) * (2 * k + 3));
  }
  return (-8 / 3) * sum;
}

/** 2Ein(2w) − Ein(4w) = Σ_{n≥2} (−1)^n (4^n − 2^(n+1)) w^n/(n·n!)  (w ≤ 1). */
function combinedEinSeries(w: number): number {
  let four = (16 * w * w) / 2; // (4w)^n/n! at n = 2
  let two = (4 * w * w) / 2; // (2w)^n/n! at n = 2
  let sum = 0;
  for (let n = 2; n < 200; n++) {
    const term = ((n % 2 === 0 ? 1 : -1) * (four - 2 * two)) / n;
    const next = sum + term;
    if (next === sum && n > 4) break;
    sum = next;
    four *= (4 * w) / (n + 1);
    two *= (2 * w) / (n + 1);
  }
  return sum;
}
