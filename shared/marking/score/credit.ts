/**
 * Partial credit of a tolerance check. Rule (ours, stated in the spec): 'linear' gives full points
 * up to the `full` tolerance, none from the `zero` tolerance, and a straight line in between;
 * 'all-or-nothing' gives full points up to `full` and none beyond. A deviation equal to a
 * tolerance counts as inside it; a relative slack of 1e−9 absorbs the round-off of unit
 * conversions (0.005 Å typed can arrive as 0.00499999… after conversion to bohr and back).
 */
export interface ToleranceRule {
  full: number;
  zero: number;
  credit?: 'linear' | 'all-or-nothing';
}

const SLACK = 1e-9;

/** Fraction of the points (0 … 1) for an absolute deviation; NaN or ∞ gives 0. */
export function creditFraction(deviation: number, rule: ToleranceRule): number {
  const d = Math.abs(deviation);
  if (!Number.isFinite(d)) return 0;
  if (d <= rule.full * (1 + SLACK) + 1e-300) return 1;
  if ((rule.credit ?? 'linear') === 'all-or-nothing') return 0;
  if (d >= rule.zero * (1 - SLACK)) return 0;
  return (rule.zero - d) / (rule.zero - rule.full);
}

/** Rounds points (or a total) to 0.01. */
export function roundPoints(value: number): number {
  const rounded = Math.round(value * 100 + (value >= 0 ? 1e-9 : -1e-9)) / 100;
  return Object.is(rounded, -0) ? 0 : rounded;
}
