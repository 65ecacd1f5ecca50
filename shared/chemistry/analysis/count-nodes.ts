/**
 * Number of nodes of a sampled function (density or wavefunction along a line):
 * sign changes between successive values, ignoring values with |v| < tolerance
 * and non-finite values, so that round-off around a node (or on a nodal plane
 * sampled exactly) is not counted as extra nodes. Counting sign changes is the
 * discrete form of the node count of the Sturm–Liouville oscillation theorem
 * (e.g. Courant & Hilbert, Methods of Mathematical Physics I, ch. VI §6).
 */
export function countNodes(values: ArrayLike<number>, tolerance: number): number {
  if (!(tolerance >= 0)) throw new RangeError(`countNodes tolerance must be ≥ 0 (got ${tolerance}).`);
  let nodes = 0;
  let lastSign = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v) || Math.abs(v) < tolerance || v === 0) continue;
    const sign = v > 0 ? 1 : -1;
    if (lastSign !== 0 && sign !== lastSign) nodes++;
    lastSign = sign;
  }
  return nodes;
}
