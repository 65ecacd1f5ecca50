/**
 * e^x · E1(x) for x > 1 by the continued fraction
 *   E1(x) = e^(−x) · 1/(x + 1 − 1²/(x + 3 − 2²/(x + 5 − …)))
 * evaluated with the modified Lentz method (Press, Teukolsky, Vetterling &
 * Flannery, Numerical Recipes, 3rd ed., 2007, §6.3, routine `expint` with
 * n = 1; the fraction is A&S 5.1.22 in its even form).
 *
 * Private helper: returns the scaled value so that callers can multiply by
 * e^(−x) only when they want to (no underflow for large x).
 */
const TINY = 1e-300;
const EPSILON = 1e-16;

export function scaledE1ContinuedFraction(x: number): number {
  let b = x + 1;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 1000; i++) {
    const a = -i * i;
    b += 2;
    d = 1 / (a * d + b);
    c = b + a / c;
    const delta = c * d;
    h *= delta;
    if (Math.abs(delta - 1) < EPSILON) return h;
  }
  return h;
}
