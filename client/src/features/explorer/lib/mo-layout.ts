/**
 * Geometry of the MO correlation diagram (pure, so that it can be tested
 * without a browser): where each atomic and molecular level sits, its bars
 * (degenerate levels side by side), the electrons on each bar and the dashed
 * correlation lines. Energies come from the engine's qualitative sketch
 * (MoDiagram.energyEv): order and rough spacing only. Core (1s) levels lie
 * hundreds of eV below the valence levels, so they get their own band under
 * a break in the energy axis.
 */
import type { MoDiagram, MoLevel, Spin } from '@shared/chemistry/diatomics';

export interface Bar {
  x1: number;
  x2: number;
}

export interface LaidMoLevel {
  index: number;
  level: MoLevel;
  y: number;
  bars: Bar[];
  /** electrons per bar (up/down half-arrows) */
  spins: Spin[][];
  core: boolean;
}

export interface LaidAtomLevel {
  side: 'left' | 'right';
  element: string;
  orbital: string;
  energyEv: number;
  y: number;
  bars: Bar[];
  spins: Spin[][];
  core: boolean;
}

export interface CorrelationLine {
  levelIndex: number;
  side: 'left' | 'right';
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

export interface MoLayout {
  width: number;
  height: number;
  columns: { left: number; middle: number; right: number };
  valence: { top: number; bottom: number };
  /** the band of core levels under the axis break, or null when there is no core */
  coreBand: { top: number; bottom: number; breakY: number } | null;
  footerTop: number;
  levels: LaidMoLevel[];
  atomLevels: LaidAtomLevel[];
  lines: CorrelationLine[];
}

export const MO_GEOMETRY = {
  width: 640,
  headerHeight: 48,
  minValenceHeight: 320,
  /** smallest vertical distance between two levels of one column (room for half-arrows and labels) */
  levelGap: 22,
  coreGap: 16,
  coreBandHeight: 64,
  breakHeight: 26,
  footerHeight: 78,
  columns: { left: 118, middle: 320, right: 522 },
  moBar: 54,
  moPiBar: 40,
  moPiGap: 10,
  sBar: 38,
  pBar: 22,
  pGap: 6,
} as const;

/** Electrons in boxes of one degenerate set by Hund's rule: singly first (spin up), then paired. */
export function hundFill(electrons: number, boxes: number): Spin[][] {
  const out: Spin[][] = Array.from({ length: boxes }, () => []);
  const n = Math.max(0, Math.min(Math.round(electrons), 2 * boxes));
  for (let k = 0; k < n; k++) out[k % boxes].push(k < boxes ? 'up' : 'down');
  return out;
}

/** Bars of `count` equal segments centred on `centre`. */
export function barsAround(centre: number, count: number, width: number, gap: number): Bar[] {
  const total = count * width + (count - 1) * gap;
  const start = centre - total / 2;
  return Array.from({ length: count }, (_, i) => ({ x1: start + i * (width + gap), x2: start + i * (width + gap) + width }));
}

/**
 * Positions in one column: ideal y from energy, then pushed apart to at least
 * `gap` keeping the order (lowest energy lowest), kept inside [top, bottom].
 */
export function spreadPositions(ideal: readonly number[], order: readonly number[], gap: number, top: number, bottom: number): number[] {
  // order: indices sorted from lowest energy (largest y) to highest energy
  const y = [...ideal];
  for (let k = 1; k < order.length; k++) y[order[k]] = Math.min(y[order[k]], y[order[k - 1]] - gap);
  const last = order[order.length - 1];
  if (order.length > 0 && y[last] < top) {
    y[last] = top;
    for (let k = order.length - 2; k >= 0; k--) y[order[k]] = Math.max(y[order[k]], y[order[k + 1]] + gap);
  }
  if (order.length > 0 && y[order[0]] > bottom) {
    y[order[0]] = bottom;
    for (let k = 1; k < order.length; k++) y[order[k]] = Math.min(y[order[k]], y[order[k - 1]] - gap);
  }
  return y;
}

interface Item {
  energyEv: number;
  column: 'left' | 'middle' | 'right';
  core: boolean;
  y: number;
}

function placeBand(items: Item[], top: number, bottom: number, gap: number): void {
  if (items.length === 0) return;
  const energies = items.map((i) => i.energyEv);
  const hi = Math.max(...energies);
  const lo = Math.min(...energies);
  const span = hi - lo || 1;
  const inset = gap / 2;
  for (const item of items) item.y = hi === lo ? (top + bottom) / 2 : top + inset + ((hi - item.energyEv) / span) * (bottom - top - 2 * inset);
  for (const column of ['left', 'middle', 'right'] as const) {
    const members = items.filter((i) => i.column === column);
    const order = members.map((_, k) => k).sort((a, b) => members[a].energyEv - members[b].energyEv);
    const ys = spreadPositions(
      members.map((m) => m.y),
      order,
      gap,
      top,
      bottom,
    );
    members.forEach((m, k) => (m.y = ys[k]));
  }
}

export function layoutMoDiagram(diagram: MoDiagram): MoLayout {
  const g = MO_GEOMETRY;
  const { left: lx, middle: mx, right: rx } = g.columns;

  // an atomic level is core when every MO it feeds is a core level
  const feeds = (side: 'left' | 'right', orbital: string) =>
    diagram.levels.filter((l) => l.correlations.some((c) => c.side === side && c.orbital === orbital));
  const atomCore = (side: 'left' | 'right', orbital: string) => {
    const fed = feeds(side, orbital);
    return fed.length > 0 ? fed.every((l) => l.core) : orbital === '1s' && diagram.levels.some((l) => l.core);
  };

  const moItems: Item[] = diagram.levels.map((l) => ({ energyEv: l.energyEv, column: 'middle', core: l.core, y: 0 }));
  const atomSpecs = (['left', 'right'] as const).flatMap((side) =>
    diagram.atoms[side].levels.map((a) => ({ side, element: diagram.atoms[side].element, atom: a, item: { energyEv: a.energyEv, column: side, core: atomCore(side, a.orbital), y: 0 } as Item })),
  );
  const all = [...moItems, ...atomSpecs.map((s) => s.item)];
  const valenceItems = all.filter((i) => !i.core);
  const coreItems = all.filter((i) => i.core);

  const perColumn = Math.max(...(['left', 'middle', 'right'] as const).map((c) => valenceItems.filter((i) => i.column === c).length));
  const valenceHeight = Math.max(g.minValenceHeight, (perColumn + 1) * g.levelGap);
  const valenceTop = g.headerHeight + 14;
  const valenceBottom = valenceTop + valenceHeight;
  placeBand(valenceItems, valenceTop, valenceBottom, g.levelGap);

  let coreBand: MoLayout['coreBand'] = null;
  let footerTop = valenceBottom + 24;
  if (coreItems.length > 0) {
    const breakY = valenceBottom + g.breakHeight / 2 + 8;
    const top = valenceBottom + g.breakHeight + 8;
    const corePerColumn = Math.max(...(['left', 'middle', 'right'] as const).map((c) => coreItems.filter((i) => i.column === c).length));
    const bottom = top + Math.max(g.coreBandHeight, (corePerColumn + 1) * g.coreGap);
    placeBand(coreItems, top, bottom, g.coreGap);
    coreBand = { top, bottom, breakY };
    footerTop = bottom + 24;
  }

  const levels: LaidMoLevel[] = diagram.levels.map((level, index) => {
    const bars = level.degeneracy === 2 ? barsAround(mx, 2, g.moPiBar, g.moPiGap) : barsAround(mx, 1, g.moBar, 0);
    return { index, level, y: moItems[index].y, bars, spins: level.spins, core: level.core };
  });

  const atomLevels: LaidAtomLevel[] = atomSpecs.map(({ side, element, atom, item }) => {
    const centre = side === 'left' ? lx : rx;
    const bars = atom.degeneracy === 3 ? barsAround(centre, 3, g.pBar, g.pGap) : barsAround(centre, 1, g.sBar, 0);
    return { side, element, orbital: atom.orbital, energyEv: atom.energyEv, y: item.y, bars, spins: hundFill(atom.electrons, atom.degeneracy), core: item.core };
  });

  const lines: CorrelationLine[] = [];
  levels.forEach((l) => {
    for (const c of l.level.correlations) {
      const atom = atomLevels.find((a) => a.side === c.side && a.orbital === c.orbital);
      if (!atom) continue;
      const moEdge = c.side === 'left' ? l.bars[0].x1 : l.bars[l.bars.length - 1].x2;
      const atomEdge = c.side === 'left' ? atom.bars[atom.bars.length - 1].x2 : atom.bars[0].x1;
      lines.push({ levelIndex: l.index, side: c.side, x1: atomEdge, y1: atom.y, x2: moEdge, y2: l.y });
    }
  });

  return {
    width: g.width,
    height: footerTop + g.footerHeight,
    columns: { left: lx, middle: mx, right: rx },
    valence: { top: valenceTop, bottom: valenceBottom },
    coreBand,
    footerTop,
    levels,
    atomLevels,
    lines,
  };
}

/** "1πg*" -> { number: "1", symbol: "π", parity: "g", star: true }; heteronuclear "5σ" has no parity. */
export function splitMoLabel(label: string): { number: string; symbol: string; parity: string; star: boolean } {
  const m = /^(\d*)([σπδ])([gu]?)(\*?)$/.exec(label);
  if (!m) return { number: '', symbol: label, parity: '', star: false };
  return { number: m[1], symbol: m[2], parity: m[3], star: m[4] === '*' };
}
