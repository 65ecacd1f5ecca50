/**
 * Weights shown as percentages of the total, rounded to 0.1 % by the
 * largest-remainder (Hamilton) method so that the shown shares add up to
 * exactly 100 %.
 */
export function weightPercentages(weights: number[]): number[] {
  const clean = weights.map((w) => (Number.isFinite(w) && w > 0 ? w : 0));
  const total = clean.reduce((a, b) => a + b, 0);
  if (total <= 0) return clean.map(() => 0);
  const exact = clean.map((w) => (w / total) * 1000);
  const floors = exact.map(Math.floor);
  let left = 1000 - floors.reduce((a, b) => a + b, 0);
  const order = exact.map((x, i) => ({ i, r: x - Math.floor(x) })).sort((a, b) => b.r - a.r);
  for (const { i } of order) {
    if (left <= 0) break;
    floors[i] += 1;
    left -= 1;
  }
  return floors.map((f) => f / 10);
}
