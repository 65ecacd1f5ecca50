import { describe, expect, it } from 'vitest';
import {
  EULER_GAMMA,
  exponentialIntegralE1,
  exponentialIntegralEi,
  exponentialIntegralEin,
  scaledExponentialIntegralE1,
} from '@shared/chemistry/special';
import { integratePanels } from '@shared/chemistry/numeric';

function relativeError(value: number, reference: number): number {
  return Math.abs(value - reference) / Math.abs(reference);
}

/** E1(x) = e^(−x) ∫_0^∞ e^(−x u)/(1 + u) du (A&S 5.1.4 shifted), by Gauss–Legendre panels. */
function e1ByQuadrature(x: number): number {
  const upper = 60 / x;
  return Math.exp(-x) * integratePanels((u) => Math.exp(-x * u) / (1 + u), 0, upper, 240, 32);
}

describe("Euler's constant", () => {
  it('is 0.5772156649015329', () => {
    // A&S 6.1.3 / DLMF 5.2.3: γ = 0.57721 56649 01532 86060…
    expect(EULER_GAMMA).toBe(0.5772156649015329);
  });
});

describe('exponentialIntegralE1', () => {
  it('matches Abramowitz & Stegun Table 5.1 to 10 digits', () => {
    expect(exponentialIntegralE1(0.5)).toBeCloseTo(0.5597735948, 10); // A&S Table 5.1
    expect(exponentialIntegralE1(1)).toBeCloseTo(0.2193839344, 10); // A&S Table 5.1
    expect(exponentialIntegralE1(2)).toBeCloseTo(0.0489005107, 10); // A&S Table 5.1
  });

  it('matches quadrature of its defining integral to 1e−13 relative on both branches', () => {
    for (const x of [0.1, 0.3, 0.5, 0.9, 0.999999, 1, 1.000001, 1.5, 2, 3.7, 5, 10, 25, 60]) {
      expect(relativeError(exponentialIntegralE1(x), e1ByQuadrature(x))).toBeLessThan(1e-13);
    }
  });

  it('is continuous across the switch from series to continued fraction at x = 1', () => {
    const below = exponentialIntegralE1(1 - 1e-12);
    const above = exponentialIntegralE1(1 + 1e-12);
    // the slope is −e^(−1) ≈ −0.37, so the two sides differ by about 7e−13
    expect(relativeError(below, above)).toBeLessThan(1e-11);
  });

  it('follows −γ − ln x at small x and e^(−x)/x · (1 − 1/x + 2/x²) at large x', () => {
    const x = 1e-9;
    expect(relativeError(exponentialIntegralE1(x), -EULER_GAMMA - Math.log(x) + x)).toBeLessThan(1e-15); // A&S 5.1.11
    const y = 200;
    const asymptotic = (Math.exp(-y) / y) * (1 - 1 / y + 2 / y ** 2 - 6 / y ** 3 + 24 / y ** 4); // A&S 5.1.51
    expect(relativeError(exponentialIntegralE1(y), asymptotic)).toBeLessThan(1e-9);
  });

  it('rejects x ≤ 0', () => {
    expect(() => exponentialIntegralE1(-1)).toThrow(RangeError);
    expect(exponentialIntegralE1(0)).toBe(Infinity);
  });
});

describe('scaledExponentialIntegralE1', () => {
  it('equals e^x E1(x) and stays finite where E1 underflows', () => {
    for (const x of [0.2, 1, 3, 30]) {
      expect(relativeError(scaledExponentialIntegralE1(x), Math.exp(x) * exponentialIntegralE1(x))).toBeLessThan(2e-15);
    }
    // x e^x E1(x) → 1 as x → ∞ (A&S 5.1.51): 1 − 1/x + 2/x² − 6/x³ + …
    const x = 1e4;
    expect(x * scaledExponentialIntegralE1(x)).toBeCloseTo(1 - 1 / x + 2 / x ** 2 - 6 / x ** 3, 14);
    expect(Number.isFinite(scaledExponentialIntegralE1(1e6))).toBe(true);
    expect(exponentialIntegralE1(1e6)).toBe(0);
  });
});

describe('exponentialIntegralEi', () => {
  it('gives Ei(−x) = −E1(x)', () => {
    for (const x of [0.25, 1, 4.5, 12]) expect(exponentialIntegralEi(-x)).toBe(-exponentialIntegralE1(x));
  });

  it('matches Abramowitz & Stegun Table 5.1 for positive x', () => {
    expect(exponentialIntegralEi(1)).toBeCloseTo(1.8951178164, 10); // A&S Table 5.1
    expect(exponentialIntegralEi(2)).toBeCloseTo(4.9542343560, 10); // A&S Table 5.1
  });

  it('matches γ + ln x + ∫_0^x (e^t − 1)/t dt by quadrature (A&S 5.1.10) to 1e−13 relative', () => {
    for (const x of [0.05, 0.8, 3, 10, 39.5, 40.5, 60]) {
      const integral = integratePanels((t) => Math.expm1(t) / t, 0, x, 60, 32);
      const reference = EULER_GAMMA + Math.log(x) + integral;
      expect(relativeError(exponentialIntegralEi(x), reference)).toBeLessThan(1e-13);
    }
  });

  it('vanishes at x₀ = 0.37250 74107 81366 6', () => {
    // zero of Ei: DLMF 6.13 (x₀ = 0.37250 74107 81366 63446 …)
    expect(Math.abs(exponentialIntegralEi(0.3725074107813666))).toBeLessThan(1e-15);
  });
});

describe('exponentialIntegralEin', () => {
  it('matches ∫_0^x (1 − e^(−t))/t dt by quadrature (DLMF 6.2.3) on every branch', () => {
    for (const x of [-60, -41, -39, -5, -0.3, 1e-6, 0.3, 1.9, 2.1, 7, 30]) {
      const reference = integratePanels((t) => -Math.expm1(-t) / t, 0, x, 60, 32);
      expect(relativeError(exponentialIntegralEin(x), reference)).toBeLessThan(1e-13);
    }
    expect(exponentialIntegralEin(0)).toBe(0);
  });

  it('equals E1(x) + ln x + γ without the cancellation of that sum at small x', () => {
    expect(relativeError(exponentialIntegralEin(3), exponentialIntegralE1(3) + Math.log(3) + EULER_GAMMA)).toBeLessThan(1e-15);
    // at x = 1e−7 the sum E1 + ln x + γ has lost 9 digits; the series has not: Ein(x) = x − x²/4 + …
    const x = 1e-7;
    expect(relativeError(exponentialIntegralEin(x), x - x * x / 4)).toBeLessThan(1e-15);
  });
});
