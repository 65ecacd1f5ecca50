/**
 * Geometry of the Hückel level diagram (pure): one row per degenerate set at
 * E = α + xβ. β is negative, so a larger x is a lower energy and sits lower in
 * the diagram. Rows closer than the label height are pushed apart, keeping
 * their order.
 */
import type { HuckelResult } from '@shared/chemistry/huckel';
import type { Spin } from '@shared/chemistry/diatomics';
import { barsAround, hundFill, spreadPositions, type Bar } from './mo-layout';

export interface LaidHuckelSet {
  x: number;
  /** orbital indices of the set */
  indices: number[];
  electrons: number;
  y: number;
  bars: Bar[];
  spins: Spin[][];
  character: 'bonding' | 'nonbonding' | 'antibonding';
  homo: boolean;
  lumo: boolean;
}

export interface HuckelLayout {
  width: number;
  height: number;
  centre: number;
  top: number;
  bottom: number;
  /** y of E = α (x = 0), when inside the drawn range */
  alphaY: number;
  sets: LaidHuckelSet[];
}

export const HUCKEL_GEOMETRY = { width: 440, top: 30, minHeight: 240, gap: 24, bar: 46, barGap: 10, centre: 200, footer: 40 } as const;

/** "α + 1.618β", "α − 0.618β", "α" — an orbital energy in units of α and β. */
export function formatAlphaBeta(x: number, decimals = 3): string {
  if (Math.abs(x) < 10 ** -(decimals + 1)) return 'α';
  const magnitude = Math.abs(x).toFixed(decimals).replace(/\.?0+$/, '');
  const coefficient = magnitude === '1' ? '' : magnitude;
  return `α ${x > 0 ? '+' : '\u2212'} ${coefficient}β`;
}

export function layoutHuckel(result: HuckelResult): HuckelLayout {
  const g = HUCKEL_GEOMETRY;
  const sets = result.degenerateSets.map((s) => {
    const electrons = s.indices.reduce((a, i) => a + result.orbitals[i].occupancy, 0);
    const first = result.orbitals[s.indices[0]];
    return {
      x: s.x,
      indices: s.indices,
      electrons: Math.round(electrons * 1000) / 1000,
      character: first.character,
      homo: result.homoIndex !== null && s.indices.includes(result.homoIndex),
      lumo: result.lumoIndex !== null && s.indices.includes(result.lumoIndex),
    };
  });
  const height = Math.max(g.minHeight, (sets.length + 1) * g.gap);
  const top = g.top;
  const bottom = top + height;
  const xs = sets.map((s) => s.x);
  const hi = Math.max(...xs, 0);
  const lo = Math.min(...xs, 0);
  const span = hi - lo || 1;
  const yOf = (x: number) => top + g.gap / 2 + ((x - lo) / span) * (height - g.gap);
  // lowest energy = largest x = largest y; spread from there upwards
  const order = sets.map((_, k) => k).sort((a, b) => sets[b].x - sets[a].x);
  const ys = spreadPositions(
    sets.map((s) => yOf(s.x)),
    order,
    g.gap,
    top,
    bottom,
  );
  const laid: LaidHuckelSet[] = sets.map((s, k) => {
    const count = s.indices.length;
    return { ...s, y: ys[k], bars: barsAround(g.centre, count, count > 2 ? 34 : g.bar, g.barGap), spins: hundFill(s.electrons, count) };
  });
  return { width: g.width, height: bottom + g.footer, centre: g.centre, top, bottom, alphaY: yOf(0), sets: laid };
}
