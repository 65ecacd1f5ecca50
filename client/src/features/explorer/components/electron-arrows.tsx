import type { Spin } from '@shared/chemistry/diatomics';

/**
 * Electrons on one level bar as half-arrows (harpoons): spin up on the left,
 * barb to the left; spin down on the right, barb to the right.
 */
export function ElectronArrows({ x1, x2, y, spins, color }: { x1: number; x2: number; y: number; spins: readonly Spin[]; color: string }) {
  const mid = (x1 + x2) / 2;
  const half = 8;
  const arrows = spins.map((spin, k) => {
    const x = spins.length === 1 ? mid : mid + (k === 0 ? -5 : 5);
    const d =
      spin === 'up'
        ? `M${x} ${y + half}V${y - half}l-4.5 6`
        : `M${x} ${y - half}V${y + half}l4.5 -6`;
    return <path key={k} d={d} fill="none" stroke={color} strokeWidth={1.6} strokeLinecap="round" strokeLinejoin="round" />;
  });
  return <g data-electrons={spins.length}>{arrows}</g>;
}
